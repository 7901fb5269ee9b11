using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;

namespace Foldwise.Learners.Tests;

public sealed class FoldLearnerTests
{
    private static readonly TrialData Data = TinyTables.Data();

    public static TheoryData<string> Families => [.. FamilyNames.All];

    public static TheoryData<string> SubsamplingFamilies => [.. TinyTables.Subsampling];

    [Theory]
    [MemberData(nameof(Families))]
    public void Beats_predicting_the_training_mean_on_held_out_rows(string family)
    {
        // Given a fold of a table with a strong known signal
        var job = TinyTables.Job(Data, family);
        double mean = job.TrainRows.Average(r => Data.Target[r]);
        var actual = job.ValidationRows.Select(r => Data.Target[r]).ToArray();

        // When the family fits it
        var prediction = LearnerCatalog.BuiltIn.Get(family).Fit(job, CancellationToken.None);

        // Then its held-out error is well below that of the mean, and it predicts every test row
        double model = Data.Metric.Score(actual, prediction.Validation);
        double baseline = Data.Metric.Score(actual, [.. actual.Select(_ => mean)]);
        Assert.True(model < 0.6 * baseline, $"{family}: {model:F4} vs mean {baseline:F4}");
        Assert.Equal(Data.Test.RowCount, prediction.Test.Length);
        Assert.All(prediction.Test, p => Assert.True(double.IsFinite(p)));
    }

    [Theory]
    [MemberData(nameof(Families))]
    public void Gives_bit_identical_predictions_for_the_same_seed(string family)
    {
        // Given a job that subsamples rows, on two threads
        var job = TinyTables.Job(Data, family, TinyTables.Parameters(family, rowFraction: 0.7), threads: 2);
        var learner = LearnerCatalog.BuiltIn.Get(family);

        // When it is fitted twice
        var first = learner.Fit(job, CancellationToken.None);
        var second = learner.Fit(job, CancellationToken.None);

        // Then every prediction is the same to the bit
        Assert.Equal(first.Validation, second.Validation);
        Assert.Equal(first.Test, second.Test);
    }

    [Theory]
    [MemberData(nameof(SubsamplingFamilies))]
    public void Uses_the_seed_when_it_subsamples_rows(string family)
    {
        // Given the same subsampling job under two seeds
        var parameters = TinyTables.Parameters(family, rowFraction: 0.6);
        var learner = LearnerCatalog.BuiltIn.Get(family);

        // When both are fitted
        var a = learner.Fit(TinyTables.Job(Data, family, parameters, seed: 1), CancellationToken.None);
        var b = learner.Fit(TinyTables.Job(Data, family, parameters, seed: 2), CancellationToken.None);

        // Then the models differ
        Assert.NotEqual(a.Validation, b.Validation);
    }

    [Theory]
    [InlineData(FamilyNames.LightGbm, "leaves", 200000)]
    [InlineData(FamilyNames.FastTree, "leaves", 1)]
    [InlineData(FamilyNames.LightGbm, "learning_rate", 0)]
    [InlineData(FamilyNames.LightGbm, "feature_fraction", 1.5)]
    [InlineData(FamilyNames.FastTree, "min_leaf_rows", 5.5)]
    public void Refuses_a_value_outside_the_parameters_hard_limits(string family, string name, double value)
    {
        // Given a value no definition may ask for (a definition may widen the default ranges, not pass these limits)
        var parameters = TinyTables.Parameters(family).Values.SetItem(name, value);
        var job = TinyTables.Job(Data, family, new ParameterSet(parameters));

        // When it is fitted, then it is refused, naming the parameter
        var error = Assert.Throws<ArgumentException>(() => LearnerCatalog.BuiltIn.Get(family).Fit(job, CancellationToken.None));
        Assert.Contains($"'{name}'", error.Message);
    }

    [Fact]
    public void Refuses_an_unknown_or_missing_parameter_and_lists_both()
    {
        // Given FastTree parameters with LightGBM's l2 added and leaves removed
        var values = TinyTables.Parameters(FamilyNames.FastTree).Values.Add("l2", 1.0).Remove("leaves");
        var job = TinyTables.Job(Data, FamilyNames.FastTree, new ParameterSet(values));

        // When it is fitted
        var error = Assert.Throws<ArgumentException>(() => new FastTreeLearner().Fit(job, CancellationToken.None));

        // Then both problems are named
        Assert.Contains("unknown parameter 'l2'", error.Message);
        Assert.Contains("'leaves' is missing", error.Message);
    }

    [Fact]
    public void Refuses_a_budget_below_one_round()
    {
        var job = TinyTables.Job(Data, FamilyNames.LightGbm, budget: 0);

        var error = Assert.Throws<ArgumentException>(() => new LightGbmLearner().Fit(job, CancellationToken.None));

        Assert.Contains("budget 0", error.Message);
    }

    [Fact]
    public void Does_not_start_a_fit_once_cancelled()
    {
        using var cancelled = new CancellationTokenSource();
        cancelled.Cancel();

        Assert.ThrowsAny<OperationCanceledException>(() => new LightGbmLearner().Fit(TinyTables.Job(Data, FamilyNames.LightGbm), cancelled.Token));
    }

    [Theory]
    [InlineData(FamilyNames.LightGbm)]
    [InlineData(FamilyNames.FastTree)]
    public void Starts_from_the_training_mean_so_a_one_round_fit_is_scored_on_what_it_learned(string family)
    {
        // Given a target far from zero (as log1p of a spend is) and a single round at the smallest learning rate
        var data = Data with { Target = [.. Data.Target.Select(t => t + 8)] };
        var parameters = new ParameterSet(TinyTables.Parameters(family).Values.SetItem("learning_rate", 0.01));
        var job = TinyTables.Job(data, family, parameters, budget: 1);
        double trainMean = job.TrainRows.Average(r => data.Target[r]);

        // When it is fitted
        var prediction = LearnerCatalog.BuiltIn.Get(family).Fit(job, CancellationToken.None);

        // Then its predictions sit at the training mean, not near zero (FastTree on its own boosts from zero)
        Assert.All(prediction.Validation, p => Assert.InRange(p, trainMean - 0.1, trainMean + 0.1));
        Assert.All(prediction.Test, p => Assert.InRange(p, trainMean - 0.1, trainMean + 0.1));
    }
}
