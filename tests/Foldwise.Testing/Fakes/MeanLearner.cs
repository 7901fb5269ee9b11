using Foldwise.Core.Learning;
using Foldwise.Core.Search;

namespace Foldwise.Testing.Fakes;

/// <summary>
/// A learner that predicts the training rows' mean target plus the parameter <c>x</c> — instant and exact, so
/// cluster tests check the plumbing, not the statistics. It can be told to be slow, or to fail.
/// </summary>
public sealed class MeanLearner(string family) : IFoldLearner, ILearnerCatalog
{
    private int fits;

    public string Family => family;

    public TimeSpan Delay { get; set; }

    public int Fits => Volatile.Read(ref fits);

    public IReadOnlyList<string> Families => [family];

    /// <summary>When set, every fit throws this (a broken machine); the worker's self-test then refuses the family.</summary>
    public Exception? Broken { get; set; }

    public IFoldLearner Get(string family) => family == Family ? this : throw new ArgumentException($"unknown family '{family}'", nameof(family));

    public FoldPrediction Fit(FoldJob job, CancellationToken cancellation)
    {
        if (Broken is { } broken)
        {
            throw broken;
        }

        Interlocked.Increment(ref fits);
        if (Delay > TimeSpan.Zero)
        {
            Task.Delay(Delay, cancellation).GetAwaiter().GetResult();
        }

        double mean = job.TrainRows.Average(r => job.Data.Target[r]) + job.Parameters.Get("x", 0) / 100;
        return new FoldPrediction(
            Enumerable.Repeat(mean, job.ValidationRows.Length).ToArray(),
            Enumerable.Repeat(mean, job.Data.Test.RowCount).ToArray());
    }
}
