using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Schedules;

/// <summary>
/// Runs a whole search (schedule, proposer, promotions) one trial at a time on a function of parameters and budget, as the
/// search bench does on the demo table, with compute counted as budget units. Compares a schedule against random search at
/// the full budget the way the bench does: the share of random search's compute the schedule needed to reach its best.
/// </summary>
internal static class MultiFidelityRuns
{
    // The scheduled search draws from seed + 1000: with the same seed its random start-up candidates would be random
    // search's own first draws, and every seed whose best came early would be matched at the floor (shared draws took
    // the medians below from 25.0 % to 13.2 % on Branin and hid 9 of 41 misses of ASHA with random candidates).
    private const int DrawOffset = 1000;

    /// <summary>The best score after each trial and the compute spent by then, in trial order.</summary>
    public static List<(double Compute, double Best)> Run(
        ScheduleOptions options, ParameterSpace space, Func<ParameterSet, int, double> f, int trials, int seed, TpeOptions? tpe = null,
        double stopBelow = double.NegativeInfinity)
    {
        var definition = FakeCoordinator.Definition(options, seed, new FamilySearch("f", space));
        var coordinator = new FakeCoordinator(ScheduleFactory.Create(definition, tpe));
        var trace = new List<(double, double)>(trials);
        double compute = 0, best = double.PositiveInfinity;
        for (int i = 0; i < trials && best > stopBelow; i++)
        {
            var trial = coordinator.CreateNext() ?? throw new InvalidOperationException("the schedule ran out of plans");
            double score = f(trial.Parameters, trial.Budget);
            coordinator.Finish(trial.Id, score);
            compute += trial.Budget;
            best = Math.Min(best, score);
            trace.Add((compute, best));
        }

        return trace;
    }

    /// <summary>
    /// Per seed, the share of the compute of <paramref name="randomTrials"/> random full-budget trials that the search
    /// <paramref name="options"/> describes needed to reach their best (infinity when it did not within that compute);
    /// sorted, so the middle one is the median.
    /// </summary>
    public static double[] ComputeShares(
        ScheduleOptions options, ParameterSpace space, Func<ParameterSet, int, double> f, int randomTrials, int seeds, TpeOptions? tpe = null)
    {
        var shares = new double[seeds];
        for (int seed = 1; seed <= seeds; seed++)
        {
            var random = Run(options with { Kind = ScheduleKind.Full, Proposer = ProposerKind.Random }, space, f, randomTrials, seed);
            double target = random[^1].Best, cap = random[^1].Compute;
            var asha = Run(options, space, f, 100_000, seed + DrawOffset, tpe, stopBelow: target);
            int reached = asha.FindIndex(s => s.Best <= target);
            shares[seed - 1] = reached < 0 || asha[reached].Compute > cap ? double.PositiveInfinity : asha[reached].Compute / cap;
        }

        return [.. shares.Order()];
    }
}
