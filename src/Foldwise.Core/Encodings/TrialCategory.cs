namespace Foldwise.Core.Encodings;

/// <summary>
/// One kept category column as trials read it: training and test rows coded against the training table's levels
/// (test levels training never saw are <see cref="Unseen"/>), and the encoding chosen for it.
/// </summary>
public sealed record TrialCategory(string Name, int LevelCount, int[] Train, int[] Test, CategoryEncodingKind Kind)
{
    /// <summary>The code of a test level that the training table does not have.</summary>
    public const int Unseen = -2;
}
