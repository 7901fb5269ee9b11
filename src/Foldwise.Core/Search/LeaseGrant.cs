namespace Foldwise.Core.Search;

/// <summary>The coordinator's answer to a slot: a leased trial with its seed and expiry, or why there is none.</summary>
public sealed record LeaseGrant(LeaseKind Kind, TrialRecord? Trial = null, int Seed = 0)
{
    public static LeaseGrant Wait { get; } = new(LeaseKind.Wait);

    public static LeaseGrant Finished { get; } = new(LeaseKind.Finished);
}
