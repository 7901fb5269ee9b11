using System.Collections.Concurrent;

namespace Foldwise.Cluster.Coordination;

/// <summary>The searches this coordinator process runs, by id; grains look their session up here.</summary>
public sealed class SessionRegistry
{
    private readonly ConcurrentDictionary<string, CoordinatorSession> sessions = new();

    public void Add(CoordinatorSession session)
    {
        if (!sessions.TryAdd(session.SearchId, session))
        {
            throw new InvalidOperationException($"search {session.SearchId} is already running on this coordinator");
        }
    }

    public void Remove(string searchId) => sessions.TryRemove(searchId, out _);

    public CoordinatorSession Get(string searchId) =>
        sessions.TryGetValue(searchId, out var session)
            ? session
            : throw new InvalidOperationException($"search {searchId} is not running on this coordinator");

    public IReadOnlyList<CoordinatorSession> All => [.. sessions.Values];
}
