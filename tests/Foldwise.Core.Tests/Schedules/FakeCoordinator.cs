using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Schedules;

/// <summary>
/// Plays the coordinator's part for schedule tests: turns plans into trials with ids counting from 1, tells the
/// schedule every creation and state change in order, and keeps that journal so it can be replayed.
/// </summary>
internal sealed class FakeCoordinator(ISchedule schedule)
{
    private static readonly DateTimeOffset Epoch = new(2026, 1, 1, 0, 0, 0, TimeSpan.Zero);
    private readonly Dictionary<int, TrialRecord> _trials = [];

    public ISchedule Schedule { get; } = schedule;

    public List<TrialRecord> Journal { get; } = [];

    public TrialRecord this[int id] => _trials[id];

    public IEnumerable<TrialRecord> Trials => _trials.Values;

    /// <summary>Asks for a plan and, when there is one, creates it as a queued trial and starts it.</summary>
    public TrialRecord? CreateNext()
    {
        var plan = Schedule.NextPlan();
        if (plan is null)
        {
            return null;
        }

        var trial = plan.ToTrial(_trials.Count + 1, Epoch.AddMinutes(_trials.Count));
        Save(trial);
        Save(trial with { State = TrialState.Running, Attempt = 1 });
        return _trials[trial.Id];
    }

    /// <summary>Takes over a trial from an earlier session's journal without telling the schedule again.</summary>
    public void Adopt(TrialRecord trial) => _trials[trial.Id] = trial;

    public void Finish(int id, double score) => Save(_trials[id] with { State = TrialState.Done, Score = score });

    public void Fail(int id) => Save(_trials[id] with { State = TrialState.Failed, FailureReason = "test failure" });

    /// <summary>A lost lease: back to the queue, then leased again.</summary>
    public void Requeue(int id)
    {
        Save(_trials[id] with { State = TrialState.Queued, LostAttempts = ["1: lease expired on w1/0"] });
        Save(_trials[id] with { State = TrialState.Running, Attempt = 2 });
    }

    private void Save(TrialRecord trial)
    {
        _trials[trial.Id] = trial;
        Journal.Add(trial);
        Schedule.Observe(trial);
    }

    public static SearchDefinition Definition(ScheduleOptions schedule, int seed, params FamilySearch[] families) => new()
    {
        Name = "test",
        Data = new DataSource("/data/train.csv", "/data/test.csv", "id", "y"),
        Families = [.. families],
        Schedule = schedule,
        Budget = new SearchBudget(Trials: 1000, Hours: null),
        Seed = seed,
    };

    public static FamilySearch Family(string name) => new(name, new ParameterSpace(
        [ParameterRange.Linear("x", 0, 1), ParameterRange.Whole("k", 1, 20), ParameterRange.OneOf("c", "a", "b", "c")]));

    /// <summary>A smooth synthetic score that improves with budget and has its best near x = 0.3, k = 12, c = b.</summary>
    public static double Score(TrialRecord trial)
    {
        double x = trial.Parameters["x"], k = trial.Parameters["k"], c = trial.Parameters["c"];
        double shape = ((x - 0.3) * (x - 0.3)) + (0.002 * (k - 12) * (k - 12)) + (c == 1 ? 0 : 0.05);
        return shape + (1.0 / Math.Sqrt(trial.Budget)) + (trial.Family == "second" ? 0.01 : 0);
    }

    public static ImmutableArray<FamilySearch> Families(params string[] names) => [.. names.Select(Family)];
}
