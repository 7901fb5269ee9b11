using System.Collections.Concurrent;
using Foldwise.Core.Events;

namespace Foldwise.Testing.Fakes;

/// <summary>An event sink for tests: keeps every event in order and calls <c>onEvent</c> on the reporting thread.</summary>
public sealed class SyncEvents(Action<SearchEvent>? onEvent = null) : IProgress<SearchEvent>
{
    private readonly ConcurrentQueue<SearchEvent> seen = new();

    public IReadOnlyList<SearchEvent> Seen => [.. seen];

    public IReadOnlyList<T> OfType<T>()
        where T : SearchEvent => [.. seen.OfType<T>()];

    public void Report(SearchEvent value)
    {
        seen.Enqueue(value);
        onEvent?.Invoke(value);
    }
}
