using System.Security.Cryptography;
using Foldwise.Core.Search;

namespace Foldwise.Tuning.Tests;

/// <summary>
/// Pins what the search computes for one definition and seed, so a change of structure (the use case's move out of
/// the command line, the one seed scheme) cannot change trials, scores or predictions unseen.
/// </summary>
[Collection(QuickDemoCollection.Name)]
public sealed class SameResultsTests(QuickDemoRun run)
{
    /// <summary>
    /// Trial id, family, rounds, parent (0: none), out-of-fold score, drawn learning rate: the history that
    /// <c>foldwise run</c> wrote for <see cref="QuickDemo"/> with one slot of one thread once the demo table took its
    /// present shape (800 × 400 at ~94 % zeros, region, sector and signing channel as text with some blank, 3,200 test
    /// rows; LightGBM through its C API). The drawn rates are those
    /// of every earlier pin (the proposals do not depend on the table); the scores and trial 6's parent moved with the table.
    /// Since LightGBM reads few-level category columns as level codes (its own category splits), every LightGBM score
    /// moved (all lower) and the FastTree scores, rates and parents stayed.
    /// </summary>
    private static readonly (int Id, string Family, int Budget, int Parent, double Score, double LearningRate)[] Pinned =
    [
        (1, "lightgbm", 10, 0, 0.9903792641285726, 0.03825174661111661),
        (2, "fasttree", 10, 0, 0.9227230223934788, 0.05612945601891969),
        (3, "lightgbm", 10, 0, 0.9256432877923599, 0.07480987760228971),
        (4, "fasttree", 10, 0, 1.0417428696841935, 0.010227135786265504),
        (5, "lightgbm", 10, 0, 1.0072971503117834, 0.06541328683329678),
        (6, "lightgbm", 30, 3, 0.866014327819857, 0.07480987760228971),
        (7, "fasttree", 10, 0, 0.8151794427766207, 0.27747637099356154),
        (8, "fasttree", 30, 7, 0.7966543148388304, 0.27747637099356154),
        (9, "lightgbm", 10, 0, 0.8451911741465229, 0.13586422086456487),
        (10, "lightgbm", 30, 9, 0.8010032063269218, 0.13586422086456487),
    ];

    /// <summary>SHA-256 of that run's predictions.csv after its header line (the rows: id, prediction; '\n' line ends).</summary>
    private const string PinnedPredictions = "ebf5d08cac2564e3daba51f188c56cf8f71d71d6a635aa858364ec005512864f";

    [Fact]
    public void The_quick_demo_search_gives_the_trials_scores_and_predictions_it_gave_before()
    {
        // Given the quick demo's tables and a small search over them, run by the use case with one slot of one thread
        // Then every trial, score and prediction is the one pinned
        Assert.Equal(SearchEnding.Blended, run.Result.Ending);
        Assert.Equal(
            Pinned,
            run.Trials.Select(t => (t.Id, t.Family, t.Budget, t.ParentId ?? 0, t.Score!.Value, t.Parameters.Values["learning_rate"])).ToArray());
        var rows = File.ReadAllLines(run.Result.PredictionFile).Skip(1).Select(line => line + "\n");
        Assert.Equal(PinnedPredictions, Convert.ToHexStringLower(SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(string.Concat(rows)))));
    }
}
