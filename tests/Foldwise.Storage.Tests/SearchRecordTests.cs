using Foldwise.Core.Blending;
using Foldwise.Core.Definition;
using Foldwise.Core.Encodings;
using Foldwise.Core.Folds;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Storage.Writer;

namespace Foldwise.Storage.Tests;

public sealed class SearchRecordTests : IDisposable
{
    private readonly TempDirectory _dir = new();

    public void Dispose() => _dir.Dispose();

    /// <summary>A definition with no option at its default, a fixed value of each kind, a choice, and text beyond ASCII.</summary>
    private static readonly SearchDefinition EveryOptionSet = new()
    {
        Name = "fracht é ✓",
        Data = new DataSource("/data/zug é/train.csv", "/data/test.csv", "shipper id", "spend, q1"),
        Metric = MetricKind.Mae,
        Folds = 7,
        Seed = -3,
        Screening = new ScreeningOptions(MinNonZero: 9),
        Families =
        [
            new FamilySearch("fasttree", new ParameterSpace([ParameterRange.Whole("leaves", 31, 31), ParameterRange.Log("learning_rate", 1e-05, 0.3)])),
            new FamilySearch("lightgbm", new ParameterSpace([ParameterRange.Fixed("l2", 0.1), ParameterRange.Linear("row_fraction", 0.5, 1), ParameterRange.OneOf("style", "a", "b \"c\"")]))
            {
                FewLevels = CategoryEncodingKind.Indicators,
            },
        ],
        Schedule = new ScheduleOptions(ScheduleKind.Hyperband, ProposerKind.Random, FirstRung: 7, FullBudget: 300, Eta: 4, RateScaling: 0.25, Brackets: 2),
        Budget = new SearchBudget(Trials: null, Hours: 2.5),
        Blend = new BlendOptions(BlendMode.NonNegative, Pool: 5),
    };

    private static SearchHeader Header(int rows) => new()
    {
        SearchId = "freight-q1",
        Definition = EveryOptionSet,
        Folds = new FoldPlan(5, 42, [.. Enumerable.Range(0, rows).Select(r => (r * 7) % 5)]),
        TrainHash = "sha256:0a1b",
        TestHash = "sha256:ffee",
        TrainIds = [.. Enumerable.Range(0, rows).Select(r => $"S{r:D5}")],
        TestIds = [.. Enumerable.Range(0, rows * 10).Select(r => $"T{r:D6}")],
        TrainTarget = [.. SampleTrials.Vector(rows, 9)],
        Created = SampleTrials.Epoch,
        SpentSeconds = 12.5,
        Finished = false,
    };

    private static void AssertSameHeader(SearchHeader expected, SearchHeader? actual)
    {
        Assert.NotNull(actual);
        Assert.Equal(expected.SearchId, actual.SearchId);
        Assert.Equal(expected.Definition, actual.Definition, DefinitionComparer.Instance);
        Assert.Equal(expected.Folds.FoldCount, actual.Folds.FoldCount);
        Assert.Equal(expected.Folds.Seed, actual.Folds.Seed);
        Assert.Equal(expected.Folds.FoldOfRow.ToArray(), actual.Folds.FoldOfRow.ToArray());
        Assert.Equal(expected.TrainHash, actual.TrainHash);
        Assert.Equal(expected.TestHash, actual.TestHash);
        Assert.Equal(expected.TrainIds.ToArray(), actual.TrainIds.ToArray());
        Assert.Equal(expected.TestIds.ToArray(), actual.TestIds.ToArray());
        Same.Bits([.. expected.TrainTarget], [.. actual.TrainTarget]);
        Assert.Equal(expected.Created, actual.Created);
        Assert.Equal(expected.Created.Offset, actual.Created.Offset);
        Assert.Equal(expected.SpentSeconds, actual.SpentSeconds);
        Assert.Equal(expected.Finished, actual.Finished);
    }

    [Fact]
    public void Round_trips_the_search_header_with_its_fold_plan_ids_and_target()
    {
        var header = Header(rows: 4_500);
        using var store = SearchStore.Create(_dir.StorePath);

        store.SaveHeader(header);

        AssertSameHeader(header, store.LoadHeader());
    }

    [Fact]
    public void A_schedule_that_screens_on_folds_keeps_its_screen_and_one_stored_before_screens_has_none()
    {
        // Given an ASHA schedule screening on 1 fold, stored, and the same document without the field (as older stores)
        var screening = EveryOptionSet with { Schedule = new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Tpe, 20, 180, 5, 0.5, 1, ScreenFolds: 1) };
        var document = DefinitionDocuments.ToDocument(screening);
        var read = DefinitionDocuments.FromDocument(document);
        document["schedule"].AsDocument.Remove("screenFolds");
        var older = DefinitionDocuments.FromDocument(document);

        // Then the screen comes back, and the older store's schedule counts rounds
        Assert.Equal(screening.Schedule, read.Schedule);
        Assert.Equal(0, older.Schedule.ScreenFolds);
    }

    [Fact]
    public void A_family_stored_before_its_few_level_form_was_kept_reads_indicator_columns()
    {
        // Given a stored definition whose lightgbm family has no few-level form (as every store written before LightGBM's own category splits)
        var document = DefinitionDocuments.ToDocument(EveryOptionSet);
        foreach (var family in document["families"].AsArray)
        {
            family.AsDocument.Remove("fewLevels");
        }

        // When it is read back
        var read = DefinitionDocuments.FromDocument(document);

        // Then lightgbm reads indicator columns, the form its kept models were fitted on, and fasttree keeps its only form
        Assert.Equal(CategoryEncodingKind.Indicators, read.Families.Single(f => f.Family == "lightgbm").FewLevelsForm);
        Assert.Equal(CategoryEncodingKind.Indicators, read.Families.Single(f => f.Family == "fasttree").FewLevelsForm);
        Assert.Equal(CategoryEncodingKind.LevelCodes, DefinitionDocuments.FromDocument(DefinitionDocuments.ToDocument(EveryOptionSet with
        {
            Families = [new FamilySearch("lightgbm", EveryOptionSet.Families[1].Space)],
        })).Families[0].FewLevelsForm);
    }

    [Fact]
    public void Round_trips_a_header_of_an_empty_table()
    {
        var header = Header(rows: 0);
        using var store = SearchStore.Create(_dir.StorePath);

        store.SaveHeader(header);

        AssertSameHeader(header, store.LoadHeader());
    }

    [Fact]
    public void Has_no_header_screening_or_blend_before_they_are_saved()
    {
        using var store = SearchStore.Create(_dir.StorePath);

        Assert.Null(store.LoadHeader());
        Assert.Null(store.LoadScreening());
        Assert.Null(store.LoadBlend());
    }

    [Fact]
    public void Updates_the_spent_time_and_finished_flag_and_keeps_the_rest_of_the_header()
    {
        var header = Header(rows: 30);
        using var store = SearchStore.Create(_dir.StorePath);
        store.SaveHeader(header);

        store.UpdateSpent(3_600.25, finished: true);

        AssertSameHeader(header with { SpentSeconds = 3_600.25, Finished = true }, store.LoadHeader());
    }

    [Fact]
    public void Saving_the_header_again_replaces_it_with_its_progress()
    {
        using var store = SearchStore.Create(_dir.StorePath);
        store.SaveHeader(Header(rows: 30));
        store.UpdateSpent(100, finished: true);

        var second = Header(rows: 10) with { SearchId = "freight-q2", SpentSeconds = 1, Finished = false };
        store.SaveHeader(second);

        AssertSameHeader(second, store.LoadHeader());
    }

    [Fact]
    public void Round_trips_the_screening_report_with_every_reason()
    {
        var report = new ScreeningReport(
            ColumnsRead: 5_000,
            Kept: ["lane_001", "lane_002"],
            Dropped:
            [
                new DroppedColumn("lane_003", DropReason.Constant),
                new DroppedColumn("lane_004", DropReason.Duplicate, SameAs: "lane_001"),
                new DroppedColumn("lane_005", DropReason.TooFewNonZero),
            ]);
        using var store = SearchStore.Create(_dir.StorePath);

        store.SaveScreening(report);

        var loaded = store.LoadScreening()!;
        Assert.Equal(5_000, loaded.ColumnsRead);
        Assert.Equal(report.Kept.ToArray(), loaded.Kept.ToArray());
        Assert.Equal(report.Dropped.ToArray(), loaded.Dropped.ToArray());
    }

    [Fact]
    public void Round_trips_a_screening_report_that_kept_and_dropped_nothing()
    {
        using var store = SearchStore.Create(_dir.StorePath);

        store.SaveScreening(new ScreeningReport(0, [], []));

        var loaded = store.LoadScreening()!;
        Assert.Equal(0, loaded.ColumnsRead);
        Assert.Empty(loaded.Kept);
        Assert.Empty(loaded.Dropped);
    }

    [Fact]
    public void Round_trips_the_blend_and_a_later_save_replaces_it()
    {
        var first = new BlendSummary(BlendMode.Greedy, [], 0.5, 0.6, [], 1, 0.7);
        var blend = new BlendSummary(
            BlendMode.NonNegative,
            [new BlendMember(4, "lightgbm", 0.75), new BlendMember(9, "fasttree", 0.25), new BlendMember(11, "fasttree", 0)],
            InSampleScore: 0.4012,
            NestedScore: 0.4105,
            NestedFoldScores: [0.40, 0.41, 0.42, 0.405, 0.4175],
            BestSingleTrialId: 4,
            BestSingleScore: 0.4150);
        using var store = SearchStore.Create(_dir.StorePath);
        store.SaveBlend(first);

        store.SaveBlend(blend);

        var loaded = store.LoadBlend()!;
        Assert.Equal(blend.Members.ToArray(), loaded.Members.ToArray());
        Assert.Equal(blend.NestedFoldScores.ToArray(), loaded.NestedFoldScores.ToArray());
        Assert.Equal(blend with { Members = loaded.Members, NestedFoldScores = loaded.NestedFoldScores }, loaded);
    }
}
