using System.Collections.Immutable;
using Foldwise.Core.Data;

namespace Foldwise.Core.Screening;

/// <summary>
/// The training and test tables as trials see them: the test table aligned to the training features by name,
/// then both cut to the columns screening kept on the training rows.
/// </summary>
/// <param name="ExtraTestColumns">Test columns the training table does not have, dropped during alignment.</param>
public sealed record ScreenedTables(
    FeatureTable Train,
    FeatureTable Test,
    ScreeningReport Report,
    ImmutableArray<string> ExtraTestColumns)
{
    public static ScreenedTables Prepare(FeatureTable train, FeatureTable test, ScreeningOptions options)
    {
        var aligned = TableAlignment.AlignTest(train, test);
        var report = ColumnScreen.Screen(train, options);
        return new ScreenedTables(
            ColumnScreen.Apply(report, train),
            ColumnScreen.Apply(report, aligned.Table),
            report,
            aligned.ExtraColumns);
    }
}
