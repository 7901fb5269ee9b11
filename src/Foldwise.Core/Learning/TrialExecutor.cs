using System.Collections.Immutable;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Learning;

/// <summary>
/// Runs one trial: encodes each fold's inputs from its training rows, fits every fold of the plan, pools the out-of-fold predictions and
/// averages the fold models' test predictions (DESIGN: test prediction = mean over fold models). A family that trains
/// round by round (<see cref="IRoundLearner"/>) trains all folds a round at a time and keeps the best round count of
/// their pooled held-out score (<see cref="RoundStopping"/>); the others fit each fold whole.
/// </summary>
public sealed class TrialExecutor
{
    private readonly IFoldLearner learner;
    private readonly RoundStopping? stopping;

    /// <summary>Stops round-by-round families by <see cref="RoundStopping.Default"/>.</summary>
    public TrialExecutor(IFoldLearner learner)
        : this(learner, RoundStopping.Default)
    {
    }

    /// <param name="stopping">Null: every family trains its whole budget and keeps it.</param>
    public TrialExecutor(IFoldLearner learner, RoundStopping? stopping)
    {
        ArgumentNullException.ThrowIfNull(learner);
        this.learner = learner;
        this.stopping = stopping;
    }

    /// <param name="foldDone">Told each fold (0-based) as its predictions are pooled.</param>
    /// <param name="predictsTest">False: the test table is not predicted and the outcome's test vector is empty.</param>
    /// <param name="advanced">
    /// For a family that trains round by round, told (folds prepared, rounds trained on every fold) as each fold's rows
    /// are prepared, with 0 rounds, and after each round.
    /// </param>
    /// <param name="folds">
    /// Null: every fold of the plan. Otherwise only the plan's first <paramref name="folds"/> folds train, and the score
    /// covers their held-out rows alone, so trials screened on the same folds are compared on the same rows (racing
    /// over folds); the out-of-fold vector is zero on the other folds' rows.
    /// </param>
    public TrialOutcome Run(
        TrialData data,
        ParameterSet parameters,
        int budget,
        int seed,
        int threads,
        CancellationToken cancellation,
        Action<int>? foldDone = null,
        bool predictsTest = true,
        Action<int, int>? advanced = null,
        int? folds = null)
    {
        var plan = data.Folds;
        if (plan.RowCount != data.Train.RowCount)
        {
            throw new InvalidOperationException($"fold plan covers {plan.RowCount} rows but the table has {data.Train.RowCount}");
        }

        if (folds is < 1 || folds > plan.FoldCount)
        {
            throw new ArgumentOutOfRangeException(nameof(folds), folds, $"must be 1 to the plan's {plan.FoldCount} folds");
        }

        var scored = ScoredRows.Of(data, folds ?? plan.FoldCount);
        return learner is IRoundLearner rounds && stopping is not null
            ? RunByRounds(rounds, stopping, data, scored, parameters, budget, seed, threads, foldDone, advanced, predictsTest, cancellation)
            : RunWhole(data, scored, parameters, budget, seed, threads, foldDone, predictsTest, cancellation);
    }

    private static FoldJob Job(string family, TrialData data, int fold, ParameterSet parameters, int budget, int seed, int threads, bool predictsTest)
    {
        var trainRows = data.Folds.TrainRows(fold);
        int foldSeed = SearchSeeds.Fold(seed, fold);
        return new FoldJob(data, fold, trainRows, data.Folds.ValidationRows(fold), parameters, budget, foldSeed, threads, data.InputsFor(fold, family), predictsTest);
    }

    private TrialOutcome RunWhole(
        TrialData data, ScoredRows scored, ParameterSet parameters, int budget, int seed, int threads, Action<int>? foldDone, bool predictsTest, CancellationToken cancellation)
    {
        var pooled = new Pooled(data, scored, predictsTest);
        for (int f = 0; f < scored.FoldCount; f++)
        {
            cancellation.ThrowIfCancellationRequested();
            var job = Job(learner.Family, data, f, parameters, budget, seed, threads, predictsTest);
            pooled.Add(learner.Family, job, learner.Fit(job, cancellation));
            foldDone?.Invoke(f);
        }

        return pooled.Outcome(bestRound: null, budget);
    }

    private static TrialOutcome RunByRounds(
        IRoundLearner learner, RoundStopping stopping, TrialData data, ScoredRows scored, ParameterSet parameters, int budget, int seed, int threads,
        Action<int>? foldDone, Action<int, int>? advanced, bool predictsTest, CancellationToken cancellation)
    {
        var fits = new List<IRoundFit>(scored.FoldCount);
        try
        {
            var jobs = new List<FoldJob>(scored.FoldCount);
            for (int f = 0; f < scored.FoldCount; f++)
            {
                cancellation.ThrowIfCancellationRequested();
                jobs.Add(Job(learner.Family, data, f, parameters, budget, seed, threads, predictsTest));
                fits.Add(learner.Start(jobs[f], cancellation));
                advanced?.Invoke(f + 1, 0);
            }

            // All folds advance together, so the pooled held-out score exists after every round.
            var oof = new double[data.Train.RowCount];
            var heldOut = jobs.Select(j => new double[j.ValidationRows.Length]).ToList();
            double best = double.PositiveInfinity;
            int bestRound = 0, round = 0;
            while (round < budget)
            {
                cancellation.ThrowIfCancellationRequested();
                bool grew = false;
                foreach (var fit in fits)
                {
                    grew |= fit.TrainRound();
                }

                if (!grew)
                {
                    break;
                }

                round++;
                advanced?.Invoke(fits.Count, round);
                for (int f = 0; f < fits.Count; f++)
                {
                    fits[f].HeldOutPredictions(heldOut[f]);
                    Place(heldOut[f], jobs[f], oof);
                }

                double score = scored.Score(oof);
                if (RoundStopping.Improves(score, best))
                {
                    (best, bestRound) = (score, round);
                }

                if (stopping.Stops(round, bestRound, budget))
                {
                    break;
                }
            }

            var pooled = new Pooled(data, scored, predictsTest);
            for (int f = 0; f < fits.Count; f++)
            {
                cancellation.ThrowIfCancellationRequested();
                pooled.Add(learner.Family, jobs[f], fits[f].Predict(Math.Min(bestRound, fits[f].Rounds), predictsTest));
                foldDone?.Invoke(f);
            }

            return pooled.Outcome(bestRound, round);
        }
        finally
        {
            foreach (var fit in fits)
            {
                fit.Dispose();
            }
        }
    }

    private static void Place(double[] heldOut, FoldJob job, double[] oof)
    {
        for (int i = 0; i < heldOut.Length; i++)
        {
            oof[job.ValidationRows[i]] = heldOut[i];
        }
    }

    /// <summary>The folds' predictions gathered into the out-of-fold vector, the fold scores and the mean test prediction.</summary>
    private sealed class Pooled(TrialData data, ScoredRows scored, bool predictsTest)
    {
        private readonly double[] oof = new double[data.Train.RowCount];
        private readonly double[] test = new double[predictsTest ? data.Test.RowCount : 0];
        private readonly ImmutableArray<double>.Builder foldScores = ImmutableArray.CreateBuilder<double>(scored.FoldCount);

        public void Add(string family, FoldJob job, FoldPrediction prediction)
        {
            var validation = job.ValidationRows;
            if (prediction.Validation.Length != validation.Length || prediction.Test.Length != test.Length)
            {
                throw new InvalidOperationException($"{family} returned {prediction.Validation.Length} held-out and {prediction.Test.Length} test predictions; expected {validation.Length} and {test.Length}");
            }

            var actual = new double[validation.Length];
            for (int i = 0; i < validation.Length; i++)
            {
                oof[validation[i]] = prediction.Validation[i];
                actual[i] = data.Target[validation[i]];
            }

            for (int i = 0; i < test.Length; i++)
            {
                test[i] += prediction.Test[i] / scored.FoldCount;
            }

            foldScores.Add(data.Metric.Score(actual, prediction.Validation));
        }

        public TrialOutcome Outcome(int? bestRound, int roundsTrained) =>
            new(scored.Score(oof), foldScores.MoveToImmutable(), oof, test, bestRound, roundsTrained);
    }
}
