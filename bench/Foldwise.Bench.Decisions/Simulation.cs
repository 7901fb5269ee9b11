using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;

namespace Foldwise.Bench.Decisions;

/// <summary>A stand-in coordinator: one step asks for a plan while a slot is free, else finishes the oldest running trial.</summary>
internal sealed class Simulation(ISchedule schedule, int seed)
{
    private static readonly DateTimeOffset Epoch = new(2026, 1, 1, 0, 0, 0, TimeSpan.Zero);
    private readonly Queue<TrialRecord> _running = new();
    private readonly Random _noise = new(seed);

    public ISchedule Schedule { get; } = schedule;

    public List<TrialRecord> Journal { get; } = [];

    public int Created { get; private set; }

    public int Promotions { get; private set; }

    public int Modelled { get; private set; }

    public int Randoms { get; private set; }

    public Dictionary<int, int> TrialsPerBudget { get; } = [];

    /// <summary>The same search carried on by another schedule that has seen this journal.</summary>
    public Simulation Continue(ISchedule next)
    {
        var copy = new Simulation(next, seed + 1) { Created = Created };
        foreach (var trial in _running)
        {
            copy._running.Enqueue(trial);
        }

        return copy;
    }

    /// <summary>One decision: the next plan and its records, plus one running trial finishing.</summary>
    public void Step(int slots)
    {
        if (_running.Count < slots && Schedule.NextPlan() is { } plan)
        {
            var trial = new TrialRecord
            {
                Id = ++Created,
                Family = plan.Family,
                Parameters = plan.Parameters,
                Budget = plan.Budget,
                Rung = plan.Rung,
                ParentId = plan.ParentId,
                Proposer = plan.Proposer,
                Created = Epoch.AddSeconds(Created),
            };
            Save(trial);
            var running = trial with { State = TrialState.Running, Attempt = 1, Started = trial.Created };
            Save(running);
            _running.Enqueue(running);
            Count(plan);
        }

        if (_running.Count >= slots)
        {
            var done = _running.Dequeue();
            Save(done with { State = TrialState.Done, Score = Score(done), Finished = done.Created.AddMinutes(5) });
        }
    }

    private void Save(TrialRecord trial)
    {
        Journal.Add(trial);
        Schedule.Observe(trial);
    }

    private void Count(TrialPlan plan)
    {
        TrialsPerBudget[plan.Budget] = TrialsPerBudget.GetValueOrDefault(plan.Budget) + 1;
        switch (plan.Proposer)
        {
            case Promotion.ProposerName: Promotions++; break;
            case TpeProposer.ProposerName: Modelled++; break;
            default: Randoms++; break;
        }
    }

    /// <summary>A smooth RMSLE-like bowl over the parameters that improves with budget, plus a little noise.</summary>
    private double Score(TrialRecord trial)
    {
        var p = trial.Parameters;
        double lr = Math.Log(p["learning_rate"] / 0.05);
        double leaves = (p["leaves"] - 40) / 60;
        double rows = (p["min_leaf_rows"] - 20) / 50;
        double cols = p["feature_fraction"] - 0.4;
        double shape = (lr * lr * 0.05) + (leaves * leaves * 0.03) + (rows * rows * 0.02) + (cols * cols * 0.04) + (0.01 * (1 - p["row_fraction"]));
        return 0.45 + shape + (0.3 / Math.Sqrt(trial.Budget / 25.0)) + (0.01 * _noise.NextDouble());
    }
}
