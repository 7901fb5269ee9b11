using Foldwise.Learners.Native;

namespace Foldwise.Learners.Tests;

public sealed class ThreadCountGateTests
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(60);

    [Fact]
    public async Task Lets_work_of_the_same_thread_count_overlap_and_holds_back_another_count_until_it_is_done()
    {
        // Given single-threaded work inside the gate
        var first = ThreadCountGate.Enter(1);

        // When more single-threaded work and two-threaded work ask to enter
        var same = Task.Run(() => ThreadCountGate.Enter(1).Dispose());
        var other = Task.Run(() => ThreadCountGate.Enter(2).Dispose());

        // Then the same count enters while the first is inside, the other only once the first work has left
        await same.WaitAsync(Patience);
        await Task.WhenAny(other, Task.Delay(TimeSpan.FromMilliseconds(200)));
        Assert.False(other.IsCompleted);
        first.Dispose();
        await other.WaitAsync(Patience);
    }
}
