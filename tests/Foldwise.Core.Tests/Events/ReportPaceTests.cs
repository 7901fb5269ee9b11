using Foldwise.Core.Events;
using Microsoft.Extensions.Time.Testing;

namespace Foldwise.Core.Tests.Events;

public sealed class ReportPaceTests
{
    private readonly FakeTimeProvider time = new(new DateTimeOffset(2026, 12, 5, 9, 0, 0, TimeSpan.Zero));

    [Fact]
    public void Work_is_due_to_report_once_a_second_after_its_first_two_seconds()
    {
        // Given a pace asked every 250 ms for 4 s
        var pace = new ReportPace(time);
        var due = new List<double>();
        for (int i = 0; i <= 16; i++)
        {
            if (pace.Due(out var elapsed))
            {
                due.Add(elapsed.TotalSeconds);
            }

            time.Advance(TimeSpan.FromMilliseconds(250));
        }

        // Then it was due at 2, 3 and 4 s
        Assert.Equal([2.0, 3.0, 4.0], due);
    }
}
