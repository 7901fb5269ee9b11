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
        var definition = new SearchDefinition
        {
            Name = "bench",
            Data = new DataSource("-", "-", "id", "y"),
            Seed = seed,
            Families = [new FamilySearch(options.Family, DefaultSpaces.For(options.Family))],
            Schedule = new ScheduleOptions(kind, proposer, options.FirstRung, options.FullBudget, options.Eta, options.RateExponent, kind == ScheduleKind.Asha ? options.Brackets : 1),
            Budget = new SearchBudget(trials, null),
        };
        var coordinator = new SearchCoordinator(definition, ScheduleFactory.Create(definition, new TpeOptions(Joint: options.JointTpe, Ladder: options.Ladder)), new NoJournal(), TimeProvider.System);
        var executor = new TrialExecutor(LearnerCatalog.BuiltIn.Get(options.Family));
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
            var outcome = executor.Run(data, grant.Run!, trial.Budget, grant.Seed, options.Threads, CancellationToken.None);
            coordinator.Complete(trial.Id, trial.Attempt, outcome.Score, outcome.FoldScores);
            compute += (double)trial.Budget * data.Train.RowCount;
            best = Math.Min(best, outcome.Score);
            rows.Add(new TraceRow(trial.Id, trial.Rung, trial.Budget, trial.Proposer, compute, outcome.Score, best, clock.Elapsed.TotalSeconds, trial.Parameters.Describe()));
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
