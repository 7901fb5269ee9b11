using System.Collections.Immutable;
using Foldwise.Core.Blending;
using Foldwise.Core.Definition;
using Foldwise.Core.Folds;
using Foldwise.Core.Screening;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Storage;

namespace Foldwise.Cli.Tests.Inspection;

/// <summary>
/// A hand-written store with one trial in every situation a lead asks about: done, promoted, retried after a
/// lost lease, failed, running, queued; vectors for the blend members; a blend; a screening report.
/// Twelve training rows, three folds, times on a fixed clock.
/// </summary>
public sealed class InspectedStore : IDisposable
{
    public static readonly DateTimeOffset T0 = new(2025, 3, 4, 9, 0, 0, TimeSpan.Zero);

    public InspectedStore(bool finished = false)
    {
        Directory.CreateDirectory(Folder);
        using var store = SearchStore.Create(Path);
        var target = Enumerable.Range(0, 12).Select(i => 10.0 + (i * 5)).ToImmutableArray();
        store.SaveHeader(new SearchHeader
        {
            SearchId = "inspect-1",
            Definition = DefinitionIn(Folder),
            Folds = new FoldPlan(3, 1, [.. Enumerable.Range(0, 12).Select(i => i % 3)]),
            TrainHash = "aa",
            TestHash = "bb",
            TrainIds = [.. Enumerable.Range(0, 12).Select(i => $"r{i}")],
            TestIds = ["t0", "t1"],
            TrainTarget = target,
            Created = T0,
            SpentSeconds = 1800,
            Finished = finished,
        });
        foreach (var trial in Trials)
        {
            store.Save(trial);
        }

        var logTarget = target.Select(y => Math.Log(1 + y)).ToArray();
        store.SaveVectors(1, [.. logTarget.Select(v => v + 0.2)], [3.0, 3.1]);
        store.SaveVectors(3, [.. logTarget.Select(v => v - 0.1)], [3.2, 3.3]);
        store.SaveVectors(2, [.. logTarget.Select(v => v + 0.3)], [3.0, 3.0]);
        store.SaveScreening(new ScreeningReport(5, ["f1", "f2", "f3"], [new DroppedColumn("f4", DropReason.Constant), new DroppedColumn("f5", DropReason.Duplicate, "f1")]));
        store.SaveBlend(new BlendSummary(BlendMode.Simplex, [new BlendMember(3, "lightgbm", 0.7), new BlendMember(2, "fasttree", 0.3), new BlendMember(1, "lightgbm", 0)], 0.09, 0.1, [0.08, 0.1, 0.12], 3, 0.1));
    }

    public string Folder { get; } = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "foldwise-inspect-tests", Guid.NewGuid().ToString("N"));

    public string Path => System.IO.Path.Combine(Folder, "search.db");

    public static IReadOnlyList<TrialRecord> Trials { get; } =
    [
        Trial(1, "lightgbm", 5, TrialState.Done, 0.5, [0.45, 0.5, 0.55], worker: "w1", slot: "0", startMinute: 0, seconds: 30) with { Parameters = Lgbm(0.05, 31) },
        Trial(2, "fasttree", 5, TrialState.Done, 0.6, [0.58, 0.6, 0.62], worker: "w1", slot: "1", startMinute: 0, seconds: 20),
        Trial(3, "lightgbm", 15, TrialState.Done, 0.4, [0.3, 0.4, 0.5], worker: "w2", slot: "0", startMinute: 2, seconds: 90) with
        {
            Parameters = Lgbm(0.05, 31), Rung = 1, ParentId = 1, Proposer = "promotion", Attempt = 2, Failures = 1, LostAttempts = ["1: lease expired on w2/0"],
        },
        Trial(4, "fasttree", 5, TrialState.Failed, null, [], worker: "w1", slot: "1", startMinute: 1, seconds: 5) with
        {
            Attempt = 3, Failures = 3, FailureReason = "InvalidOperationException: fold 2 returned no predictions",
        },
        Trial(5, "lightgbm", 5, TrialState.Running, null, [], worker: "w2", slot: "1", startMinute: 5, seconds: null) with { Parameters = Lgbm(0.2, 100) },
        Trial(6, "fasttree", 5, TrialState.Queued, null, [], worker: null, slot: null, startMinute: null, seconds: null),
    ];

    // The definition as the store keeps it; data paths need not exist to read it back.
    private static SearchDefinition DefinitionIn(string folder) => new()
    {
        Name = "inspect-test",
        Data = new DataSource(System.IO.Path.Combine(folder, "train.csv"), System.IO.Path.Combine(folder, "test.csv"), "id", "y"),
        Folds = 3,
        Families = [.. FamilyNames.Default.Select(f => new FamilySearch(f, DefaultSpaces.For(f)))],
        Schedule = new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Random, FirstRung: 5, FullBudget: 15, Eta: 3),
        Budget = new SearchBudget(Trials: 10, Hours: 1),
    };

    public void Dispose()
    {
        try
        {
            Directory.Delete(Folder, recursive: true);
        }
        catch (IOException)
        {
            // Best effort: a temp folder.
        }
    }

    private static ParameterSet Lgbm(double learningRate, int leaves) => ParameterSet.Of(new Dictionary<string, double>
    {
        ["learning_rate"] = learningRate, ["leaves"] = leaves, ["min_leaf_rows"] = 20, ["feature_fraction"] = 0.8, ["row_fraction"] = 0.9, ["l2"] = 0.01,
    });

    private static TrialRecord Trial(int id, string family, int budget, TrialState state, double? score, double[] folds, string? worker, string? slot, int? startMinute, int? seconds)
    {
        DateTimeOffset? started = startMinute is { } m ? T0.AddMinutes(m) : null;
        return new TrialRecord
        {
            Id = id,
            Family = family,
            Parameters = ParameterSet.Of(new Dictionary<string, double>
            {
                ["learning_rate"] = 0.01 * id, ["leaves"] = 8 + id, ["min_leaf_rows"] = 10, ["feature_fraction"] = 0.1 * id, ["row_fraction"] = 0.7,
            }),
            Budget = budget,
            Proposer = "random",
            State = state,
            Attempt = state == TrialState.Queued ? 0 : 1,
            Worker = worker,
            Slot = slot,
            Created = T0,
            Started = started,
            Finished = seconds is { } s ? started!.Value.AddSeconds(s) : null,
            Score = score,
            FoldScores = [.. folds],
        };
    }
}
