using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Data;

namespace Foldwise.Learners.Tests;

/// <summary>
/// ML.NET fits started from a slot's own thread run on a pool thread, where a wait for FastTree's hand-offs to the
/// pool can run them in place. What that saves shows only on a busy machine (bench/Foldwise.Bench.Families --busy);
/// these pin where the fit runs, that it predicts the same, and that the pool's minimum is given back. Alone in their
/// collection, since the minimum is process-wide.
/// </summary>
[Collection(PoolMinimumCollection.Name)]
public sealed class PoolThreadFitsTests
{
    [Fact]
    public void A_fit_from_a_thread_outside_the_pool_runs_on_a_pool_thread_and_gives_the_minimum_back()
    {
        // Given the pool's minimum before
        ThreadPool.GetMinThreads(out int before, out _);
        int during = 0;

        // When a fit runs from a thread of its own
        bool onPool = OnOwnThread(() => PoolThreadFits.Run(() =>
        {
            ThreadPool.GetMinThreads(out during, out _);
            return Thread.CurrentThread.IsThreadPoolThread;
        }));

        // Then it ran on a pool thread, the minimum was one higher while it ran, and is back after
        ThreadPool.GetMinThreads(out int after, out _);
        Assert.True(onPool);
        Assert.Equal(before + 1, during);
        Assert.Equal(before, after);
    }

    [Fact]
    public void A_FastTree_fit_from_a_slot_thread_trains_on_a_pool_thread_and_predicts_as_a_bare_fit_does()
    {
        // Given a FastTree job and its bare fit from a thread of its own
        var data = TinyTables.Data();
        var job = TinyTables.Job(data, FamilyNames.FastTree, budget: 40);
        var bare = OnOwnThread(() => BareFit(job));

        // When the fit path trains it from a thread of its own
        bool trainedOnPool = false;
        var fitted = OnOwnThread(() => FoldFitter.Fit(FamilyNames.FastTree, job, (ml, rows) =>
        {
            trainedOnPool = Thread.CurrentThread.IsThreadPoolThread;
            return ml.Regression.Trainers.FastTree(FastTreeLearner.Options(job)).Fit(rows);
        }, CancellationToken.None).Validation);

        // Then the training ran on a pool thread and predicts what the bare fit does
        Assert.True(trainedOnPool);
        Assert.Equal(bare, fitted);
    }

    private static double[] BareFit(FoldJob job)
    {
        // As the fit path does: the centred target, FastTree on the fold's training rows, the mean added back.
        var ml = new MLContext(job.Seed);
        double mean = FoldFitter.TrainingMean(job);
        var inputs = job.Features.For(FamilyDescriptors.Get(FamilyNames.FastTree).Input, job.TrainRows);
        var rows = SparseViews.Rows(ml, inputs.Train, job.TrainRows, Array.ConvertAll(job.Data.Target, y => y - mean));
        var model = ml.Regression.Trainers.FastTree(FastTreeLearner.Options(job)).Fit(rows);
        var held = SparseViews.Rows(ml, inputs.Train, job.ValidationRows, labels: null);
        return [.. model.Transform(held).GetColumn<float>("Score").Select(s => s + mean)];
    }

    private static T OnOwnThread<T>(Func<T> work)
    {
        T result = default!;
        Exception? failure = null;
        var thread = new Thread(() =>
        {
            try
            {
                result = work();
            }
            catch (Exception e) when (e is not OutOfMemoryException)
            {
                failure = e;
            }
        });
        thread.Start();
        thread.Join();
        return failure is null ? result : throw new InvalidOperationException("the work failed on its own thread", failure);
    }
}

/// <summary>Tests that read the pool's minimum thread count run with no other test at the same time.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class PoolMinimumCollection
{
    public const string Name = "pool minimum";
}
