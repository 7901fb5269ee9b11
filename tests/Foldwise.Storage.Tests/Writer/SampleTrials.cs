using System.Collections.Immutable;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Storage.Writer;

/// <summary>Repeatable trial records and vectors, shared by the tests and the child process that writes them.</summary>
public static class SampleTrials
{
    /// <summary>A fixed instant with an offset and sub-millisecond ticks, so a lossy time mapping shows.</summary>
    public static readonly DateTimeOffset Epoch = new DateTimeOffset(2025, 3, 1, 9, 30, 0, TimeSpan.FromHours(2)).AddTicks(1_234_567);

    /// <summary>A done trial with every optional field set.</summary>
    public static TrialRecord Done(int id) => new()
    {
        Id = id,
        Family = id % 2 == 0 ? "lightgbm" : "fasttree",
        Parameters = ParameterSet.Of(new Dictionary<string, double>
        {
            ["learning_rate"] = 0.05 + (id * 1e-3),
            ["leaves"] = 31,
            ["min_child_samples"] = 20,
            ["feature_fraction"] = 0.1 + (1.0 / 3.0),
        }),
        Budget = 100 * id,
        Rung = 2,
        ParentId = id > 1 ? id - 1 : null,
        Proposer = "tpe",
        Bracket = 1,
        Folds = 2,
        State = TrialState.Done,
        Attempt = 2,
        Failures = 1,
        Worker = "w2",
        Slot = "w2/0",
        LeaseExpires = Epoch.AddMinutes(id + 5),
        Created = Epoch.AddMinutes(id),
        Started = Epoch.AddMinutes(id + 1),
        Finished = Epoch.AddMinutes(id + 2).AddTicks(7),
        Score = 0.4 + (id * 1e-4),
        FoldScores = [0.41, 0.39, 0.40 + (id * 1e-4), 0.42, 0.38],
        BestRound = (100 * id) - 3,
        RoundsContinued = 2 * id,
        FailureReason = null,
        LostAttempts = [$"1: lease expired on w1/{id}"],
    };

    /// <summary>A fresh queued trial: every optional field null or empty.</summary>
    public static TrialRecord Queued(int id) => new()
    {
        Id = id,
        Family = "fasttree",
        Parameters = ParameterSet.Empty,
        Budget = 50,
        Proposer = "random",
        Created = Epoch,
    };

    /// <summary>Seeded pseudo-random doubles, including values whose last bit a text round trip would lose.</summary>
    public static double[] Vector(int length, int seed)
    {
        var random = new Random(seed);
        var values = new double[length];
        for (int i = 0; i < length; i++)
        {
            values[i] = Math.Exp(random.NextDouble() * 10) / 3.0;
        }

        return values;
    }
}
