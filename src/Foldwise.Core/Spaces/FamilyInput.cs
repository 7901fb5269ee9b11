namespace Foldwise.Core.Spaces;

/// <summary>The inputs a family reads from each fold.</summary>
public enum FamilyInput
{
    /// <summary>The fold's features as they are, a missing cell as NaN (LightGBM treats NaN as missing).</summary>
    RawWithMissing,

    /// <summary>Missing cells filled with the fold's training medians, plus a 0/1 "was missing" column each (<see cref="Learning.FoldInputs.Imputed"/>).</summary>
    Imputed,

    /// <summary>Imputed, then log1p of skewed non-negative columns and standardisation, learnt from the fold's training rows.</summary>
    Scaled,
}
