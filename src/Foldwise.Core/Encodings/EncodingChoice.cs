using Foldwise.Core.Data;

namespace Foldwise.Core.Encodings;

/// <summary>
/// The one place that chooses a category column's encoding, from its level counts over all training rows (no target
/// is read, so choosing before the folds leaks nothing); every fold then fits that encoding on its own training rows.
/// </summary>
public static class EncodingChoice
{
    public static CategoryEncodingKind For(CategoryColumn column, EncodingOptions options)
    {
        ArgumentNullException.ThrowIfNull(column);
        ArgumentNullException.ThrowIfNull(options);
        var (counts, missing) = LevelCounts.Of(column.Codes.AsSpan(), column.Levels.Length, rows: null);
        return LevelCounts.Slots(counts, missing, options.MinLevelCount) <= options.IndicatorCap
            ? CategoryEncodingKind.Indicators
            : CategoryEncodingKind.TargetMean;
    }

    /// <summary>Levels seen at least <see cref="EncodingOptions.MinLevelCount"/> times over all training rows.</summary>
    public static int LevelsKept(CategoryColumn column, EncodingOptions options)
    {
        ArgumentNullException.ThrowIfNull(column);
        ArgumentNullException.ThrowIfNull(options);
        var (counts, _) = LevelCounts.Of(column.Codes.AsSpan(), column.Levels.Length, rows: null);
        return LevelCounts.Kept(counts, options.MinLevelCount);
    }
}
