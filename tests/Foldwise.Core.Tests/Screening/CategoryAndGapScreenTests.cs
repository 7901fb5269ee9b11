using Foldwise.Core.Encodings;
using Foldwise.Core.Screening;
using Foldwise.Testing;

namespace Foldwise.Core.Tests.Screening;

public sealed class CategoryAndGapScreenTests
{
    private static readonly ScreeningOptions Options = new(MinNonZero: 2);

    [Fact]
    public void Drops_an_all_missing_column_and_reports_it()
    {
        var train = TinyTables.FromColumns([("gone", [float.NaN, float.NaN, float.NaN]), ("ok", [1, 2, 3])]);

        var report = ColumnScreen.Screen(train, Options);

        Assert.Equal([new DroppedColumn("gone", DropReason.AllMissing)], report.Dropped.ToArray());
    }

    [Fact]
    public void Counts_only_non_missing_cells_toward_the_minimum()
    {
        // Given a column with one number and two gaps, under a minimum of two non-zero cells
        var train = TinyTables.FromColumns([("thin", [5, float.NaN, float.NaN, 0]), ("ok", [1, 2, 3, 4])]);

        var report = ColumnScreen.Screen(train, Options);

        Assert.Equal(DropReason.TooFewNonZero, Assert.Single(report.Dropped).Reason);
    }

    [Fact]
    public void Reports_the_share_missing_of_each_kept_column_with_gaps()
    {
        var train = TinyTables.FromColumns([("gappy", [5, float.NaN, 7, 8]), ("ok", [1, 2, 3, 4])]);

        var report = ColumnScreen.Screen(train, Options);

        Assert.Equal([new ColumnGap("gappy", 0.25)], report.Gaps.ToArray());
    }

    [Fact]
    public void Drops_a_nearly_unique_text_column_and_keeps_an_ordinary_one_with_its_levels_and_encoding()
    {
        var rows = Enumerable.Range(0, 30).ToArray();
        var table = TinyTables.FromColumns([("ok", [.. rows.Select(r => (float)r + 1)])]);
        table = TinyTables.WithCategory(table, "note", [.. rows.Select(r => $"text {r}")]);
        table = TinyTables.WithCategory(table, "colour", [.. rows.Select(r => r % 7 == 0 ? null : r % 2 == 0 ? "red" : "blue")]);

        var report = ColumnScreen.Screen(table, Options);

        Assert.Equal([new DroppedColumn("note", DropReason.NearlyUnique)], report.Dropped.ToArray());
        var colour = Assert.Single(report.Categories);
        Assert.Equal(("colour", 2, 2, CategoryEncodingKind.Indicators, 5 / 30.0), (colour.Name, colour.Levels, colour.LevelsKept, colour.Encoding, colour.MissingShare));
        Assert.Equal(["colour"], ColumnScreen.Apply(report, table).CategoryNames.ToArray());
    }

    [Fact]
    public void Counts_test_levels_that_training_never_saw()
    {
        var train = TinyTables.WithCategory(TinyTables.FromColumns([("ok", [1, 2, 3])]), "c", "a", "b", "a");
        var test = TinyTables.WithCategory(TinyTables.FromColumns([("ok", [1, 2, 3, 4])]), "c", "a", "new", "newer", "new");

        var report = TestLevelCount.Add(ColumnScreen.Screen(train, Options), train, test);

        var note = Assert.Single(report.Categories);
        Assert.Equal((2, 3), (note.NewTestLevels, note.NewTestRows));
        Assert.Contains("the test table has 2 new levels in 3 rows", ColumnNotes.Category(note, []), StringComparison.Ordinal);
    }

    [Fact]
    public void Names_which_families_read_a_few_level_column_as_level_codes_and_which_as_indicators()
    {
        // Given a few-level column, and a search of LightGBM reading level codes and FastTree (indicators only)
        var note = new CategoryNote("colour", Levels: 3, LevelsKept: 3, CategoryEncodingKind.Indicators, MissingShare: 0);
        var families = Foldwise.Core.Definition.DefinitionDefaults.BuiltInFamilies;
        var both = new[] { families[0] with { FewLevels = CategoryEncodingKind.LevelCodes }, families[1] };

        // When the summary line is written for both families, and for LightGBM told to read indicators
        string mixed = ColumnNotes.Category(note, both);
        string alike = ColumnNotes.Category(note, [both[0] with { FewLevels = CategoryEncodingKind.Indicators }, both[1]]);

        // Then the first names each family's form, the second names one form for all
        Assert.Contains("lightgbm: one column of level codes, grouped by LightGBM's own category splits; fasttree: one indicator column per kept level", mixed, StringComparison.Ordinal);
        Assert.EndsWith("; one indicator column per kept level", alike, StringComparison.Ordinal);
    }
}
