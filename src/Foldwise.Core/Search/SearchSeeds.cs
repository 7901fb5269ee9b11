namespace Foldwise.Core.Search;

/// <summary>
/// Every random stream of a search, derived from the definition's one seed here and nowhere else:
/// <list type="bullet">
/// <item>the fold plan draws from <see cref="FoldPlan"/>, the seed itself;</item>
/// <item>a family's n-th new candidate draws from <see cref="Proposal"/>, SplitMix64 over (seed, family index, n);</item>
/// <item>a trial fits with <see cref="Trial"/> of its first candidate (a promotion grows the same trees longer),
/// and fold f of it with <see cref="Fold"/>;</item>
/// <item>the inner folds of fold f's category encodings draw from <see cref="Encoding"/>, the same for every trial.</item>
/// </list>
/// Each is a function of facts the store keeps (never of a generator that advanced earlier), so a resumed search,
/// which only replays records, draws exactly what the original would have. <c>SameResultsTests</c> pins the values.
/// </summary>
public readonly record struct SearchSeeds(int Seed)
{
    /// <summary>The seed of the stratified fold plan.</summary>
    public int FoldPlan => Seed;

    /// <summary>The random stream of a family's <paramref name="candidateOrdinal"/>-th new candidate.</summary>
    public Random Proposal(int familyIndex, int candidateOrdinal) => new(Mix(Seed, familyIndex, candidateOrdinal));

    /// <summary>The fit seed of a trial whose first candidate (itself, or the root of its promotions) has id <paramref name="rootTrialId"/>.</summary>
    public int Trial(int rootTrialId) => unchecked((Seed * 100_003) + (rootTrialId * 7919));

    /// <summary>The fit seed of fold <paramref name="fold"/> of a trial leased with <paramref name="trialSeed"/>: workers know only the latter.</summary>
    public static int Fold(int trialSeed, int fold) => unchecked(trialSeed + (1000 * fold));

    /// <summary>The seed of the inner folds that encode fold <paramref name="fold"/>'s training rows, from the fold plan's seed: trials share it.</summary>
    public static int Encoding(int foldPlanSeed, int fold) => Fold(foldPlanSeed, fold);

    /// <summary>SplitMix64's finaliser (Steele, Lea &amp; Flood, OOPSLA 2014) chained over the three numbers, folded to an int.</summary>
    private static int Mix(int searchSeed, int familyIndex, int candidateOrdinal)
    {
        ulong z = Finalise((ulong)(uint)searchSeed);
        z = Finalise(z ^ (uint)familyIndex);
        z = Finalise(z ^ (uint)candidateOrdinal);
        return (int)(z & 0x7FFFFFFF);
    }

    private static ulong Finalise(ulong z)
    {
        z += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }
}
