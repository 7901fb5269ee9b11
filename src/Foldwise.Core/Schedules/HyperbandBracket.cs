using System.Collections.Immutable;

namespace Foldwise.Core.Schedules;

/// <summary>One bracket of successive halving: <see cref="S"/> is its number of halvings, its rungs go from the most trials at the smallest budget to the fewest at FullBudget.</summary>
public sealed record HyperbandBracket(int S, ImmutableArray<HyperbandRung> Rungs)
{
    /// <summary>Total rounds the bracket trains when each trial starts from scratch.</summary>
    public long Rounds => Rungs.Sum(r => (long)r.Budget * r.Count);

    /// <summary>Brackets are equal when their rungs are, rung by rung.</summary>
    public bool Equals(HyperbandBracket? other) => other is not null && S == other.S && Rungs.SequenceEqual(other.Rungs);

    public override int GetHashCode() => HashCode.Combine(S, Rungs.Length, Rungs.IsEmpty ? null : Rungs[0]);
}
