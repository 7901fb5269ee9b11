using Foldwise.Core.Spaces;
using Microsoft.ML.Trainers.LightGbm;

namespace Foldwise.Learners.Tests;

public sealed class CatalogAndOptionTests
{
    [Fact]
    public void Has_a_learner_for_every_built_in_family()
    {
        Assert.Equal(FamilyNames.All.Order(), LearnerCatalog.BuiltIn.Families.Order());
        Assert.All(FamilyNames.All, f => Assert.Equal(f, LearnerCatalog.BuiltIn.Get(f).Family));
    }

    [Fact]
    public void Names_the_known_families_when_asked_for_an_unknown_one()
    {
        var error = Assert.Throws<ArgumentException>(() => LearnerCatalog.BuiltIn.Get("nearest"));

        Assert.Contains("'nearest'", error.Message);
        Assert.Contains(FamilyNames.LightGbm, error.Message);
    }

    [Fact]
    public void Maps_exactly_the_parameters_of_each_default_space()
    {
        Assert.Equal(DefaultSpaces.LightGbm.Ranges.Select(r => r.Name).Order(), Native.LightGbmParameters.Table.Names.Order());
        Assert.Equal(DefaultSpaces.FastTree.Ranges.Select(r => r.Name).Order(), FastTreeLearner.Table.Names.Order());
        Assert.Equal(DefaultSpaces.Forest.Ranges.Select(r => r.Name).Order(), ForestLearner.Table.Names.Order());
        Assert.Equal(DefaultSpaces.Gam.Ranges.Select(r => r.Name).Order(), GamLearner.Table.Names.Order());
        Assert.Equal(DefaultSpaces.Linear.Ranges.Select(r => r.Name).Order(), LinearLearner.Table.Names.Order());
    }

    [Fact]
    public void Sets_forest_options_with_a_fresh_row_sample_for_every_tree()
    {
        var job = TinyTables.Job(TinyTables.Data(), FamilyNames.Forest, TinyTables.Parameters(FamilyNames.Forest, rowFraction: 0.6), seed: 9, threads: 2, budget: 70);

        var options = ForestLearner.Options(job);

        Assert.Equal((70, 1, 0.6, 8, 5, 2, 9), (options.NumberOfTrees, options.BaggingSize, options.BaggingExampleFraction, options.NumberOfLeaves, options.MinimumExampleCountPerLeaf, options.NumberOfThreads, options.Seed));
    }

    [Fact]
    public void Sets_gam_options_from_the_job_without_pruning()
    {
        var job = TinyTables.Job(TinyTables.Data(), FamilyNames.Gam, seed: 9, threads: 2, budget: 300);

        var options = GamLearner.Options(job);

        Assert.Equal((300, 0.1, 5, 64, 2, 9), (options.NumberOfIterations, options.LearningRate, options.MinimumExampleCountPerLeaf, options.MaximumBinCountPerFeature, options.NumberOfThreads, options.Seed));
        Assert.False(options.EnablePruning);
    }

    [Fact]
    public void Sets_linear_options_with_one_thread_and_no_l1_whatever_the_slot_has()
    {
        var job = TinyTables.Job(TinyTables.Data(), FamilyNames.Linear, threads: 4, budget: 12);

        var options = LinearLearner.Options(job);

        Assert.Equal((12, 1, 0f, 1e-3f), (options.MaximumNumberOfIterations, options.NumberOfThreads, options.L1Regularization, options.L2Regularization));
    }

    [Fact]
    public void Sets_LightGbm_options_from_the_job()
    {
        // Given a job with row_fraction 0.8
        var job = TinyTables.Job(TinyTables.Data(), FamilyNames.LightGbm, TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.8), seed: 42, threads: 2, budget: 33);

        // When its options are built
        var options = MlNetLightGbmLearner.Options(job);

        // Then every mapped value and the fixed choices are in place
        var booster = Assert.IsType<GradientBooster.Options>(options.Booster);
        Assert.Equal((33, 8, 5, 0.1, 2, 42), (options.NumberOfIterations, options.NumberOfLeaves, options.MinimumExampleCountPerLeaf, options.LearningRate, options.NumberOfThreads, options.Seed));
        Assert.Equal((0.8, 1, 1.0, 1.0), (booster.SubsampleFraction, booster.SubsampleFrequency, booster.FeatureFraction, booster.L2Regularization));
        Assert.True(options.Deterministic);
        Assert.True(options.Silent);
    }

    [Fact]
    public void Turns_subsampling_off_when_every_row_is_used()
    {
        var lightGbm = MlNetLightGbmLearner.Options(TinyTables.Job(TinyTables.Data(), FamilyNames.LightGbm));
        var fastTree = FastTreeLearner.Options(TinyTables.Job(TinyTables.Data(), FamilyNames.FastTree));

        Assert.Equal(0, ((GradientBooster.Options)lightGbm.Booster).SubsampleFrequency);
        Assert.Equal(0, fastTree.BaggingSize);
    }

    [Fact]
    public void Sets_FastTree_bagging_every_tree_below_a_row_fraction_of_one()
    {
        var job = TinyTables.Job(TinyTables.Data(), FamilyNames.FastTree, TinyTables.Parameters(FamilyNames.FastTree, rowFraction: 0.7), threads: 2, budget: 25);

        var options = FastTreeLearner.Options(job);

        Assert.Equal((25, 1, 0.7, 5, 2), (options.NumberOfTrees, options.BaggingSize, options.BaggingExampleFraction, options.MinimumExampleCountPerLeaf, options.NumberOfThreads));
    }

    [Fact]
    public void Builds_the_test_view_once_per_test_matrix()
    {
        var data = TinyTables.Data();

        Assert.Same(SparseViews.Test(data.Test), SparseViews.Test(data.Test));
        Assert.NotSame(SparseViews.Test(data.Test), SparseViews.Test(TinyTables.Data().Test));
    }
}
