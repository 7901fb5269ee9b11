using Foldwise.Core.Search;

namespace Foldwise.Storage.Tests;

/// <summary>
/// Field-by-field equality for records holding <see cref="System.Collections.Immutable.ImmutableArray{T}"/>
/// (whose own equality compares array references) and times (whose equality ignores the offset).
/// </summary>
internal static class Same
{
    public static void Trial(TrialRecord expected, TrialRecord? actual)
    {
        Assert.NotNull(actual);
        Assert.Equal(expected.FoldScores.ToArray(), actual.FoldScores.ToArray());
        Assert.Equal(expected.LostAttempts.ToArray(), actual.LostAttempts.ToArray());
        Assert.Equal(expected.Created.Offset, actual.Created.Offset);
        Assert.Equal(expected.Finished?.Offset, actual.Finished?.Offset);
        Assert.Equal(expected with { FoldScores = actual.FoldScores, LostAttempts = actual.LostAttempts }, actual);
    }

    public static void Bits(double[] expected, double[] actual)
    {
        Assert.Equal(expected.Length, actual.Length);
        for (int i = 0; i < expected.Length; i++)
        {
            if (BitConverter.DoubleToInt64Bits(expected[i]) != BitConverter.DoubleToInt64Bits(actual[i]))
            {
                Assert.Fail($"Element {i} differs: {expected[i]:R} saved, {actual[i]:R} loaded.");
            }
        }
    }
}
