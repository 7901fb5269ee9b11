using System.Collections.Concurrent;
using System.Diagnostics;
using System.Runtime.ExceptionServices;
using Foldwise.Core.Learning;
using Foldwise.Core.Search;

namespace Foldwise.Tuning;

/// <summary>
/// Predicts the new rows with every kept member's fold models. Each fold's inputs are prepared once for each form of
/// few-level category columns the members' families read (a fold's inputs are the same for every trial of it,
/// <see cref="TrialData.InputsFor(int, Core.Encodings.CategoryEncodingKind)"/>); the (fold, member) predictions are handed out fold by fold to up to
/// <c>threads</c> threads, so only the folds being scored hold their encoded rows; each member's fold predictions
/// are then averaged in fold order, so the result is the same, bit for bit, at any thread count.
/// </summary>
internal static class KeptFoldScoring
{
    /// <summary>Each member's prediction of the new rows (on the fitting scale), and where the threads spent their time.</summary>
    public static (double[][] Members, KeptScoringWork Work) Predict(TrialData data, IReadOnlyList<KeptScorer> scorers, int threads)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(threads, 1);
        var folds = data.Folds;
        int foldCount = folds.FoldCount;
        int members = scorers.Count;
        int items = foldCount * members;
        var predictions = new double[members][][];
        for (int m = 0; m < members; m++)
        {
            predictions[m] = new double[foldCount][];
        }

        // A fold's inputs (one set per form of few-level columns) are encoded by the first thread that needs them and
        // dropped once its last member is scored.
        var forms = scorers.Select(s => s.FewLevels).Distinct().ToArray();
        var encodings = new Lazy<FoldInputs>[]?[foldCount];
        var left = new int[foldCount];
        long encodeTicks = 0;
        long predictTicks = 0;
        for (int f = 0; f < foldCount; f++)
        {
            int fold = f;
            left[f] = members;
            encodings[f] = [.. forms.Select(form => new Lazy<FoldInputs>(() =>
            {
                long start = Stopwatch.GetTimestamp();
                var inputs = data.InputsFor(fold, form);
                Interlocked.Add(ref encodeTicks, Stopwatch.GetTimestamp() - start);
                return inputs;
            }))];
        }

        // LightGBM keeps one thread count per process: every prediction here uses the same one.
        int threadsEach = Math.Max(1, threads / items);
        var options = new ParallelOptions { MaxDegreeOfParallelism = Math.Min(threads, items) };
        try
        {
            Parallel.ForEach(Partitioner.Create(Enumerable.Range(0, items), EnumerablePartitionerOptions.NoBuffering), options, item =>
            {
                int f = item / members;
                int m = item % members;
                var scorer = scorers[m];
                var inputs = encodings[f]![Array.IndexOf(forms, scorer.FewLevels)].Value;
                long start = Stopwatch.GetTimestamp();
                var job = new FoldJob(data, f, folds.TrainRows(f), folds.ValidationRows(f), scorer.Fit.Run, scorer.Fit.Budget, SearchSeeds.Fold(scorer.Fit.Seed, f), threadsEach, inputs);
                predictions[m][f] = scorer.Keeper.PredictKept(job, scorer.Models[f]);
                Interlocked.Add(ref predictTicks, Stopwatch.GetTimestamp() - start);
                if (Interlocked.Decrement(ref left[f]) == 0)
                {
                    encodings[f] = null;
                }
            });
        }
        catch (AggregateException e) when (e.InnerExceptions.Count > 0)
        {
            // The first failure as it was thrown (an input error names its file), not wrapped.
            ExceptionDispatchInfo.Capture(e.InnerExceptions[0]).Throw();
            throw;
        }

        var work = new KeptScoringWork(Stopwatch.GetElapsedTime(0, encodeTicks), Stopwatch.GetElapsedTime(0, predictTicks), options.MaxDegreeOfParallelism, foldCount, members);
        return ([.. predictions.Select(Mean)], work);
    }

    /// <summary>The same sum, in the same order, as the search's own test prediction (TrialExecutor).</summary>
    private static double[] Mean(double[][] byFold)
    {
        var mean = new double[byFold[0].Length];
        foreach (var prediction in byFold)
        {
            for (int i = 0; i < mean.Length; i++)
            {
                mean[i] += prediction[i] / byFold.Length;
            }
        }

        return mean;
    }
}
