namespace Foldwise.Core.Schedules;

/// <summary>One rung of a Hyperband bracket: <see cref="Count"/> trials (n_i) at <see cref="Budget"/> rounds (r_i).</summary>
public sealed record HyperbandRung(int Budget, int Count);
