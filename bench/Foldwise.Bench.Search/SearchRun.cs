using System.Diagnostics;
using Foldwise.Core.Definition;
using Foldwise.Core.Learning;
using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Learners;

/// <summary>One search through the real coordinator and schedule, one slot, fits in this process.</summary>
internal static class SearchRun
{
    public static List<TraceRow> Run(TrialData data, BenchArgs options, ScheduleKind kind, ProposerKind proposer, int trials, int seed, double stopBelow, double computeCap)
    {
        // Racing over folds (--screen folds): rungs count folds, every trial trains the full rounds at its drawn rate.
        bool byFolds = options.ByFolds && kind is ScheduleKind.Asha or ScheduleKind.Hyperband;
        int foldCount = data.Folds.FoldCount;
        var schedule = new ScheduleOptions(kind, proposer, options.FirstRung, options.FullBudget, options.Eta, options.RateExponent,
            kind == ScheduleKind.Asha ? options.Brackets : 1, byFolds ? options.FirstFolds : 0);
        var definition = new SearchDefinition
        {
            Name = "bench",
            Data = new DataSource("-", "-", "id", "y"),
            Seed = seed,
            Folds = foldCount,
            Families = [new FamilySearch(options.Family, DefaultSpaces.For(options.Family))],
            Schedule = schedule,
            Budget = new SearchBudget(trials, null),
        };
        var coordinator = new SearchCoordinator(definition, ScheduleFactory.Create(definition, new TpeOptions(Joint: options.JointTpe, Ladder: options.Ladder, GoodFromTop: options.GoodFromTop)), new NoJournal(), TimeProvider.System);
        // As a worker does: a promotion of a candidate screened on some folds continues the screen's fold models.
        using var screens = new ScreenedFits();
        var executor = new TrialExecutor(LearnerCatalog.BuiltIn.Get(options.Family), options.Stopping, screens);
        var rows = new List<TraceRow>();
        double compute = 0, best = double.PositiveInfinity;
        while (true)
        {
            var grant = coordinator.Lease("bench", "0");
            if (grant.Kind != LeaseKind.Granted)
            {
                break;
            }

            var trial = grant.Trial!;
            var clock = Stopwatch.StartNew();
            var outcome = executor.Run(data, grant.Run!, trial.Budget, grant.Seed, options.Threads, CancellationToken.None, predictsTest: grant.PredictsTest, folds: trial.AllFolds ? null : trial.Folds, lineage: new TrialLineage(trial.Id, trial.ParentId));
            coordinator.Complete(trial.Id, trial.Attempt, outcome.Score, outcome.FoldScores, outcome.BestRound);

            // Compute is what was trained: rounds × rows, fewer rounds when the trial stopped early, a share of the
            // folds when racing, less the fold-rounds a promotion took over from its screen. A racing trial on some
            // folds is scored on their rows only, so it sets no best.
            int foldsRun = trial.AllFolds ? foldCount : trial.Folds;
            compute += (((double)outcome.RoundsTrained * foldsRun) - outcome.RoundsContinued) * data.Train.RowCount / foldCount;
            if (trial.AllFolds)
            {
                best = Math.Min(best, outcome.Score);
            }

            // When racing, a trace's budget column counts the folds trained (as the fold-screen rungs do).
            rows.Add(new TraceRow(trial.Id, trial.Rung, byFolds ? (trial.AllFolds ? foldCount : trial.Folds) : trial.Budget, trial.Proposer, compute, outcome.Score, best, clock.Elapsed.TotalSeconds, trial.Parameters.Describe(),
                $"{outcome.RoundsTrained}/{outcome.BestRound?.ToString(System.Globalization.CultureInfo.InvariantCulture) ?? "-"}"));
            if (best <= stopBelow || compute >= computeCap)
            {
                break;
            }
        }

        return rows;
    }

    private sealed class NoJournal : ITrialJournal
    {
        public void Save(TrialRecord trial)
        {
        }
    }
}
