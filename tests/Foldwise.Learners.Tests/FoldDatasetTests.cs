using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Foldwise.Learners.Native;

namespace Foldwise.Learners.Tests;

/// <summary>Every trial of a fold trains on the same binned rows, and trains exactly as on rows binned afresh.</summary>
public sealed class FoldDatasetTests
{
    [Fact]
    public void Lends_one_binned_fold_to_every_trial_of_that_fold()
    {
        // Given two trials of fold 0 with different rates and row samples, one of fold 1, and one of fold 0 with a larger smallest leaf
        var data = TinyTables.Data(rows: 300, testRows: 50);
        var first = TinyTables.Job(data, FamilyNames.LightGbm, seed: 1);
        var parameters = TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.6).Values.SetItem("learning_rate", 0.3);
        var second = TinyTables.Job(data, FamilyNames.LightGbm, new ParameterSet(parameters), seed: 2);
        var otherFold = first with { Fold = 1, TrainRows = data.Folds.TrainRows(1), ValidationRows = data.Folds.ValidationRows(1) };
        var otherLeaf = first with { Parameters = new ParameterSet(parameters.SetItem("min_leaf_rows", 40)) };

        // When each borrows its fold's Datasets
        var (a, aHeld) = FoldDatasets.Borrow(first, NativeFoldRows.From(first));
        var (b, bHeld) = FoldDatasets.Borrow(second, NativeFoldRows.From(second));
        var (c, cHeld) = FoldDatasets.Borrow(otherFold, NativeFoldRows.From(otherFold));
        var (d, dHeld) = FoldDatasets.Borrow(otherLeaf, NativeFoldRows.From(otherLeaf));
        using var disposeAll = new Disposer(a, aHeld, b, bHeld, c, cHeld, d, dHeld);

        // Then the two trials of fold 0 share one native Dataset each for training and held-out rows; fold 1 has its
        // own, and so has the larger leaf (LightGBM drops the features that cannot split under it while binning)
        Assert.Equal(a.Handle.DangerousGetHandle(), b.Handle.DangerousGetHandle());
        Assert.Equal(aHeld.Handle.DangerousGetHandle(), bHeld.Handle.DangerousGetHandle());
        Assert.NotEqual(a.Handle.DangerousGetHandle(), c.Handle.DangerousGetHandle());
        Assert.NotEqual(a.Handle.DangerousGetHandle(), d.Handle.DangerousGetHandle());
    }

    [Fact]
    public void Bins_its_own_rows_for_a_job_whose_rows_are_not_its_plan_fold()
    {
        // Given a job of fold 0 and one that trains on only part of fold 0's training rows
        var data = TinyTables.Data(rows: 300, testRows: 50);
        var planned = TinyTables.Job(data, FamilyNames.LightGbm);
        var partial = planned with { TrainRows = planned.TrainRows[..100] };

        // When both borrow Datasets
        var (a, aHeld) = FoldDatasets.Borrow(planned, NativeFoldRows.From(planned));
        var (b, bHeld) = FoldDatasets.Borrow(partial, NativeFoldRows.From(partial));
        using var disposeAll = new Disposer(a, aHeld, b, bHeld);

        // Then the partial job's rows are binned apart
        Assert.NotEqual(a.Handle.DangerousGetHandle(), b.Handle.DangerousGetHandle());
        Assert.Equal(100, b.RowCount);
    }

    [Fact]
    public void A_trial_on_reused_rows_predicts_what_it_predicts_on_rows_binned_afresh()
    {
        // Given a fold already binned by one trial, and a second trial that samples rows and features
        var data = TinyTables.Data(rows: 300, testRows: 50);
        var learner = new LightGbmLearner();
        learner.Fit(TinyTables.Job(data, FamilyNames.LightGbm, seed: 1), CancellationToken.None);
        var parameters = new ParameterSet(TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.7).Values.SetItem("feature_fraction", 0.6));
        var second = TinyTables.Job(data, FamilyNames.LightGbm, parameters, seed: 2);

        // When it trains on the reused rows, and on a copy of the table (another search's, binned afresh)
        var reused = learner.Fit(second, CancellationToken.None);
        var fresh = learner.Fit(second with { Data = data with { } }, CancellationToken.None);

        // Then its predictions are the same to the bit
        Assert.Equal(fresh.Validation, reused.Validation);
        Assert.Equal(fresh.Test, reused.Test);
    }

    [Fact]
    public void A_model_keeps_training_after_its_fold_is_dropped_from_the_kept_folds()
    {
        // Given a model started on a fold
        var data = TinyTables.Data(rows: 300, testRows: 50);
        var job = TinyTables.Job(data, FamilyNames.LightGbm, budget: 10);
        using var model = LightGbmFoldModel.Start(job, scoreEachRound: false, CancellationToken.None);
        double[] before = model.HeldOutPredictions();

        // When the kept folds may take almost nothing, and other tables' folds are binned, so this fold is dropped
        long capacity = FoldDatasets.CapacityBytes;
        FoldDatasets.CapacityBytes = 1;
        try
        {
            for (int i = 0; i < 3; i++)
            {
                var other = TinyTables.Job(data with { }, FamilyNames.LightGbm);
                var (train, held) = FoldDatasets.Borrow(other, NativeFoldRows.From(other));
                train.Dispose();
                held.Dispose();
            }
        }
        finally
        {
            FoldDatasets.CapacityBytes = capacity;
        }

        // Then the model still trains on its rows and predicts
        model.Continue(10, CancellationToken.None);
        Assert.Equal(10, model.Rounds);
        Assert.NotEqual(before, model.HeldOutPredictions());
        Assert.All(model.Predict().Test, p => Assert.True(double.IsFinite(p)));
    }

    private sealed class Disposer(params IDisposable[] items) : IDisposable
    {
        public void Dispose()
        {
            foreach (var item in items)
            {
                item.Dispose();
            }
        }
    }
}
