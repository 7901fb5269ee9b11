using Foldwise.Core.Spaces;

namespace Foldwise.Core.Search;

/// <summary>The coordinator's answer to a slot: a leased trial with its seed and expiry, or why there is none.</summary>
/// <param name="Run">The parameters the slot trains with: the trial's own, with a short rung's learning rate (see <see cref="Schedules.ShortRungRate"/>).</param>
/// <param name="Reason">Why a quarantined worker gets no work.</param>
public sealed record LeaseGrant(LeaseKind Kind, TrialRecord? Trial = null, int Seed = 0, ParameterSet? Run = null, string? Reason = null)
{
    public static LeaseGrant Wait { get; } = new(LeaseKind.Wait);

    public static LeaseGrant Finished { get; } = new(LeaseKind.Finished);
}
