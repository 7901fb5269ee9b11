using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Data;

namespace Foldwise.Learners.Tests;

/// <summary>
/// What ML.NET 5.0.1's trainers do with a NaN cell, pinned so that an upgrade that changes it shows here: FastForest,
/// GAM and SDCA train as if the cell were 0, but score it otherwise (forest: as a value above every split; GAM: as
/// a value in its lowest bin; SDCA: NaN). Training and scoring disagree, so these families take no missing cells.
/// </summary>
public sealed class MissingCellTests
{
    [Fact]
    public void Forest_trains_a_missing_cell_as_zero_but_scores_it_as_a_large_value()
    {
        var (withMissing, withZero) = Fits((ml, train, job) => ml.Regression.Trainers.FastForest(ForestLearner.Options(job)).Fit(train), FamilyNames.Forest);

        Assert.Equal(withZero.Test[1..], withMissing.Test[1..]);
        Assert.True(withMissing.Test[0] > withZero.Test[1] + 1, $"missing {withMissing.Test[0]:F3}, zero {withZero.Test[0]:F3}, x0 = 1 {withZero.Test[1]:F3}");
    }

    [Fact]
    public void Gam_trains_a_missing_cell_as_zero_but_scores_it_in_its_lowest_bin()
    {
        var (withMissing, withZero) = Fits((ml, train, job) => ml.Regression.Trainers.Gam(GamLearner.Options(job)).Fit(train), FamilyNames.Gam);

        Assert.Equal(withZero.Test[1..], withMissing.Test[1..]);
        Assert.True(withMissing.Test[0] < withZero.Test[2] - 1, $"missing {withMissing.Test[0]:F3}, zero {withZero.Test[0]:F3}, x0 = −1 {withZero.Test[2]:F3}");
    }

    [Fact]
    public void Sdca_trains_a_missing_cell_as_zero_and_predicts_NaN_for_it()
    {
        var (withMissing, withZero) = Fits((ml, train, job) => ml.Regression.Trainers.Sdca(LinearLearner.Options(job)).Fit(train), FamilyNames.Linear);

        Assert.Equal(withZero.Test[1..], withMissing.Test[1..]);
        Assert.True(double.IsNaN(withMissing.Test[0]));
    }

    [Theory]
    [InlineData(FamilyNames.Forest)]
    [InlineData(FamilyNames.Gam)]
    [InlineData(FamilyNames.Linear)]
    public void Refuses_a_fold_with_a_missing_cell_naming_where_it_is(string family)
    {
        // Given a table whose first feature is missing in every third training row
        var job = TinyTables.Job(Table(double.NaN), family, budget: 5);

        // When the family fits it, then it refuses before training, naming the first missing cell
        var error = Assert.Throws<ArgumentException>(() => LearnerCatalog.BuiltIn.Get(family).Fit(job, CancellationToken.None));
        Assert.Contains($"{family} fold 0 refused: the training table has missing cells (first at row 1, feature 1)", error.Message);
    }

    /// <summary>y = 3·x0 + x1 + noise; x0 is <paramref name="missing"/> in every third training row and in the first test row.</summary>
    private static TrialData Table(double missing)
    {
        var random = new Random(3);
        var train = new double[300][];
        var target = new double[300];
        for (int r = 0; r < train.Length; r++)
        {
            double x0 = (random.NextDouble() * 4) - 2;
            double x1 = (random.NextDouble() * 4) - 2;
            target[r] = (3 * x0) + x1 + (0.1 * random.NextDouble());
            train[r] = [r % 3 == 0 ? missing : x0, x1];
        }

        double[][] test = [[missing, 0.5], [1.0, 0.5], [-1.0, 0.5], [0, 0.5]];
        return DenseTables.Data(train, target, test, [.. Enumerable.Range(0, train.Length).Select(r => r % 3)]);
    }

    /// <summary>The same fit on the table with NaN cells and with zero cells, past the learners' own refusal.</summary>
    private static (FoldPrediction WithMissing, FoldPrediction WithZero) Fits(Func<MLContext, IDataView, FoldJob, ITransformer> train, string family)
    {
        FoldPrediction Fit(TrialData data)
        {
            var job = TinyTables.Job(data, family, budget: 50);
            return FoldFitter.Fit(family, job, (ml, view) => train(ml, view, job), CancellationToken.None);
        }

        return (Fit(Table(double.NaN)), Fit(Table(0)));
    }
}
