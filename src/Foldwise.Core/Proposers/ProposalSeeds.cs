namespace Foldwise.Core.Proposers;

/// <summary>
/// The random stream of one proposal, derived from the search seed, the family and how many new candidates that
/// family already has. Deriving it from observed facts (not from a generator that advanced in earlier calls)
/// makes a resumed search, which only replays records, propose exactly what the original would have.
/// </summary>
public static class ProposalSeeds
{
    public static Random For(int searchSeed, int familyIndex, int candidateOrdinal) =>
        new(Mix(searchSeed, familyIndex, candidateOrdinal));

    /// <summary>SplitMix64's finaliser (Steele, Lea &amp; Flood, OOPSLA 2014) chained over the three numbers, folded to an int.</summary>
    public static int Mix(int searchSeed, int familyIndex, int candidateOrdinal)
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
