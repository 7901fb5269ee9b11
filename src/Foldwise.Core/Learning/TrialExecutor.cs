using System.Collections.Immutable;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Learning;

/// <summary>
/// Runs one trial: encodes each fold's inputs from its training rows, fits every fold of the plan, pools the out-of-fold predictions and
/// averages the fold models' test predictions (DESIGN: test prediction = mean over fold models). A family that trains
/// round by round (<see cref="IRoundLearner"/>) trains all folds a round at a time and keeps the best round count of
/// their pooled held-out score (<see cref="RoundStopping"/>); the others fit each fold whole. Given a worker's
/// <see cref="ScreenedFits"/>, a trial screened on some folds leaves its fold models there, and its promotion to every
/// fold continues them (<see cref="TrialOutcome.RoundsContinued"/>) with the same result as training them again.
/// </summary>
public sealed class TrialExecutor
{
    private readonly IFoldLearner learner;
    private readonly RoundStopping? stopping;
    private readonly ScreenedFits? screens;

    /// <summary>Stops round-by-round families by <see cref="RoundStopping.Default"/>.</summary>
    public TrialExecutor(IFoldLearner learner)
        : this(learner, RoundStopping.Default)
    {
    }

    /// <param name="stopping">Null: every family trains its whole budget and keeps it.</param>
    public TrialExecutor(IFoldLearner learner, RoundStopping? stopping)
        : this(learner, stopping, screens: null)
    {
    }

    /// <param name="screens">Where screened trials' fold models are kept for their promotions (a worker's, shared by its slots); null keeps none.</param>
    public TrialExecutor(IFoldLearner learner, RoundStopping? stopping, ScreenedFits? screens)
    {
        ArgumentNullException.ThrowIfNull(learner);
        this.learner = learner;
        this.stopping = stopping;
        this.screens = screens;
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
    /// <param name="lineage">The trial and its parent, for the <see cref="ScreenedFits"/> given at construction; null keeps and continues nothing.</param>
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
        int? folds = null,
        TrialLineage? lineage = null)
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
            ? RunByRounds(rounds, stopping, data, scored, parameters, budget, seed, threads, foldDone, advanced, predictsTest, ScreeningOf(data, parameters, budget, seed, threads, lineage), cancellation)
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

    /// <summary>Whether this run keeps its folds for a promotion, or continues its parent's: null when neither can apply.</summary>
    private Screening? ScreeningOf(TrialData data, ParameterSet parameters, int budget, int seed, int threads, TrialLineage? lineage) =>
        screens is null || lineage is not { } line
            ? null
            : new Screening(screens, line, new ScreenedFits.FitKey(data, learner.Family, parameters, budget, seed, threads));

    private static TrialOutcome RunByRounds(
        IRoundLearner learner, RoundStopping stopping, TrialData data, ScoredRows scored, ParameterSet parameters, int budget, int seed, int threads,
        Action<int>? foldDone, Action<int, int>? advanced, bool predictsTest, Screening? screening, CancellationToken cancellation)
    {
        bool screen = scored.FoldCount < data.Folds.FoldCount;
        var continued = !screen && screening?.Lineage.ParentId is int parent ? screening.Value.Screens.Take(parent, screening.Value.Key) : null;
        var runs = new List<FoldRun>(scored.FoldCount);
        bool kept = false;
        try
        {
            for (int f = 0; f < scored.FoldCount; f++)
            {
                cancellation.ThrowIfCancellationRequested();
                if (continued is not null && f < continued.Count)
                {
                    runs.Add(FoldRun.Continuing(continued[f], predictsTest));
                }
                else
                {
                    var job = Job(learner.Family, data, f, parameters, budget, seed, threads, predictsTest);
                    runs.Add(FoldRun.Starting(learner.Start(job, cancellation), job, record: screen && screening is not null));
                }

                advanced?.Invoke(f + 1, 0);
            }

            // All folds advance together, so the pooled held-out score exists after every round.
            var oof = new double[data.Train.RowCount];
            double best = double.PositiveInfinity;
            int bestRound = 0, round = 0;
            while (round < budget)
            {
                cancellation.ThrowIfCancellationRequested();
                bool grew = false;
                foreach (var run in runs)
                {
                    grew |= run.Advance(round + 1);
                }

                if (!grew)
                {
                    break;
                }

                round++;
                advanced?.Invoke(runs.Count, round);
                foreach (var run in runs)
                {
                    Place(run.HeldOut, run.Job, oof);
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
            for (int f = 0; f < runs.Count; f++)
            {
                cancellation.ThrowIfCancellationRequested();
                pooled.Add(learner.Family, runs[f].Job, runs[f].Fit.Predict(Math.Min(bestRound, runs[f].Fit.Rounds), predictsTest));
                foldDone?.Invoke(f);
            }

            var outcome = pooled.Outcome(bestRound, round) with { RoundsContinued = runs.Sum(r => r.Replayed) };
            if (screen && screening is { } keep)
            {
                keep.Screens.Keep(keep.Lineage.TrialId, keep.Key, [.. runs.Select(r => r.Kept())]);
                kept = true;
            }

            return outcome;
        }
        finally
        {
            if (!kept)
            {
                foreach (var run in runs)
                {
                    run.Fit.Dispose();
                }
            }

            // Kept folds this run did not take over (it was cancelled first, or the screen had more folds than it runs).
            foreach (var fold in continued?.Skip(runs.Count(r => r.Continues)) ?? [])
            {
                fold.Fit.Dispose();
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

    private readonly record struct Screening(ScreenedFits Screens, TrialLineage Lineage, ScreenedFits.FitKey Key);

    /// <summary>
    /// One fold of a trial trained round by round: a new model, or one a screen kept, whose rounds already trained are
    /// replayed from its recorded held-out predictions before it trains further.
    /// </summary>
    private sealed class FoldRun
    {
        private readonly IReadOnlyList<double[]> earlier;
        private readonly List<double[]>? recorded;

        private FoldRun(IRoundFit fit, FoldJob job, IReadOnlyList<double[]> earlier, List<double[]>? recorded)
        {
            Fit = fit;
            Job = job;
            this.earlier = earlier;
            this.recorded = recorded;
            HeldOut = new double[job.ValidationRows.Length];
            if (earlier.Count == 0)
            {
                // A model that cannot grow at round 1 predicts what it starts from, as every fold did before.
                fit.HeldOutPredictions(HeldOut);
            }
        }

        public IRoundFit Fit { get; }

        public FoldJob Job { get; }

        /// <summary>The held-out rows' predictions after the last round advanced to.</summary>
        public double[] HeldOut { get; }

        /// <summary>Rounds taken from the screen instead of trained.</summary>
        public int Replayed { get; private set; }

        /// <summary>True for a fold a screen kept, taken over by this run.</summary>
        public bool Continues { get; private init; }

        /// <param name="record">Keep each round's held-out predictions, for a promotion that continues this fold.</param>
        public static FoldRun Starting(IRoundFit fit, FoldJob job, bool record) => new(fit, job, [], record ? [] : null);

        public static FoldRun Continuing(ScreenedFold kept, bool predictsTest) =>
            new(kept.Fit, kept.Job with { PredictsTest = predictsTest }, kept.HeldOutByRound, recorded: null) { Continues = true };

        /// <summary>Brings the fold to <paramref name="round"/>; false when it could not grow (it stays as it was, as a new model would).</summary>
        public bool Advance(int round)
        {
            if (round <= earlier.Count)
            {
                earlier[round - 1].CopyTo(HeldOut, 0);
                Replayed++;
                return true;
            }

            if (!Fit.TrainRound())
            {
                return false;
            }

            Fit.HeldOutPredictions(HeldOut);
            recorded?.Add((double[])HeldOut.Clone());
            return true;
        }

        public ScreenedFold Kept() => new(Fit, Job, recorded ?? throw new InvalidOperationException("this fold recorded no rounds"));
    }
}
