using Foldwise.Core.Events;
using Microsoft.Extensions.Time.Testing;

namespace Foldwise.Core.Tests.Events;

public sealed class ProgressPacerTests
{
    private readonly FakeTimeProvider time = new(new DateTimeOffset(2026, 12, 5, 9, 0, 0, TimeSpan.Zero));
    private readonly List<StepProgress> reports = [];

    [Fact]
    public void Says_nothing_for_a_step_that_ends_within_its_first_two_seconds()
    {
        // Given a pacer ticked many times during the first 1.9 s
        var pacer = new ProgressPacer(PreparationStep.Reading, "train.csv", reports.Add, time);
        for (int i = 0; i < 19; i++)
        {
            pacer.Tick(i, 100);
            time.Advance(TimeSpan.FromMilliseconds(100));
        }

        // Then nothing was reported
        Assert.Empty(reports);
    }

    [Fact]
    public void Reports_a_long_step_at_most_once_a_second_with_where_it_is()
    {
        // Given a pacer ticked every 100 ms for 5 s
        var pacer = new ProgressPacer(PreparationStep.Screening, "train.csv", reports.Add, time);
        for (int i = 0; i <= 50; i++)
        {
            pacer.Tick(i, 50);
            time.Advance(TimeSpan.FromMilliseconds(100));
        }

        // Then it reported at 2, 3, 4 and 5 s, each with the count it was ticked with
        Assert.Equal([2.0, 3.0, 4.0, 5.0], reports.Select(r => r.Elapsed.TotalSeconds).ToArray());
        Assert.Equal([20L, 30L, 40L, 50L], reports.Select(r => r.Done).ToArray());
        Assert.All(reports, r => Assert.Equal((PreparationStep.Screening, "train.csv", 50L), (r.Step, r.Subject, r.Total)));
        Assert.Equal(0.4, reports[0].Fraction, 12);
    }
}
