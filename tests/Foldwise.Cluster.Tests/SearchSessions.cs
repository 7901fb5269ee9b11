using System.Collections.Immutable;
using System.Diagnostics;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Folds;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.DependencyInjection;

namespace Foldwise.Cluster.Tests;

/// <summary>Starts a small counting search on a <see cref="TwoSiloCluster"/>'s coordinator, with chosen lease rules.</summary>
internal static class SearchSessions
{
    public static (FeatureTable Train, FeatureTable Test) Tables(int trainRows = 30, int testRows = 10) => (Table("train", trainRows, withTarget: true), Table("test", testRows, withTarget: false));

    public static CoordinatorSession Start(
        TwoSiloCluster cluster, string name, (FeatureTable Train, FeatureTable Test) tables, int trials, MemoryRecorder recorder, CoordinatorOptions? leases = null, IProgress<SearchEvent>? events = null, ActivityContext search = default)
    {
        var shelf = cluster.Coordinator.GetRequiredService<DatasetShelf>();
        string trainHash = Shelve(shelf, tables.Train);
        string testHash = Shelve(shelf, tables.Test);
        var folds = new FoldPlan(3, 1, [.. Enumerable.Range(0, tables.Train.RowCount).Select(r => r % 3)]);
        var definition = new SearchDefinition
        {
            Name = name,
            Data = new DataSource("train.csv", "test.csv", "id", "y"),
            Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm)],
            Budget = new SearchBudget(trials, null),
        };
        var coordinator = new SearchCoordinator(definition, new CountingSchedule(), recorder, TimeProvider.System, leases);
        var manifest = new SearchManifest($"{name}-{Guid.NewGuid():N}", trainHash, testHash, 3, 1, [.. folds.FoldOfRow], "Rmsle", []);
        var session = new CoordinatorSession(manifest, coordinator, recorder, events, search);
        cluster.Coordinator.GetRequiredService<SessionRegistry>().Add(session);
        return session;
    }

    /// <summary>
    /// Encodes a table into a file of its own in the temp folder and serves it from the shelf; a file per call, so
    /// a search starting on the same tables never rewrites a file the shelf is serving.
    /// </summary>
    private static string Shelve(DatasetShelf shelf, FeatureTable table)
    {
        string hash = TableHash.Of(table);
        string path = Path.Combine(Path.GetTempPath(), "foldwise-cluster-tests-" + Guid.NewGuid().ToString("N") + ".fwt");
        using (var file = File.Create(path))
        {
            TableCodec.Encode(table, file);
        }

        shelf.Put(hash, path);
        return hash;
    }

    /// <summary>
    /// Runs small searches on the tables, at most 10, until the worker silo has run a trial of one, and returns the
    /// last: on a loaded machine the coordinator's own slot can finish a whole search while the worker is still
    /// waiting out a start-up retry. Callers assert on the returned recorder.
    /// </summary>
    public static async Task<(CoordinatorSession Session, MemoryRecorder Recorder)> RunUntilTheWorkerTakesPartAsync(
        TwoSiloCluster cluster, string name, (FeatureTable Train, FeatureTable Test) tables)
    {
        for (int attempt = 1; ; attempt++)
        {
            var recorder = new MemoryRecorder();
            var session = Start(cluster, $"{name}-{attempt}", tables, trials: 6, recorder);
            await session.Finished.WaitAsync(TimeSpan.FromSeconds(60));
            cluster.Coordinator.GetRequiredService<SessionRegistry>().Remove(session.SearchId);
            if (attempt == 10 || recorder.Latest().Any(t => t.Worker == "worker"))
            {
                return (session, recorder);
            }
        }
    }

    private static FeatureTable Table(string name, int rows, bool withTarget)
    {
        int[] present = [.. Enumerable.Range(0, rows).Where(r => r % 2 == 0)];
        var column = new SparseColumn([.. present], [.. present.Select(r => (float)r)]);
        return new FeatureTable(
            name,
            [.. Enumerable.Range(0, rows).Select(r => $"{name}{r}")],
            ["f1"],
            [column],
            withTarget ? [.. Enumerable.Range(0, rows).Select(r => (double)r)] : ImmutableArray<double>.Empty);
    }
}
