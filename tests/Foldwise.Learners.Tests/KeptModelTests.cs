using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;

namespace Foldwise.Learners.Tests;

public sealed class KeptModelTests
{
    private static readonly TrialData Data = TinyTables.Data();

    public static TheoryData<string> Families => [.. FamilyNames.All];

    [Theory]
    [MemberData(nameof(Families))]
    public void A_kept_fit_predicts_what_a_plain_fit_predicts(string family)
    {
        // Given a job that subsamples rows
        var job = TinyTables.Job(Data, family, TinyTables.Parameters(family, rowFraction: 0.7));
        var learner = LearnerCatalog.BuiltIn.Get(family);

        // When it is fitted plainly and fitted keeping its model
        var plain = learner.Fit(job, CancellationToken.None);
        var kept = ((IKeepsModels)learner).FitAndKeep(job, CancellationToken.None);

        // Then both predict the same to the bit, and the kept fit hands back a model
        Assert.Equal(plain.Validation, kept.Prediction.Validation);
        Assert.Equal(plain.Test, kept.Prediction.Test);
        Assert.NotEmpty(kept.Model);
    }

    [Theory]
    [MemberData(nameof(Families))]
    public void A_kept_model_scores_the_test_rows_as_its_fit_did(string family)
    {
        // Given a fold model kept from a fit
        var job = TinyTables.Job(Data, family, TinyTables.Parameters(family, rowFraction: 0.7));
        var keeper = (IKeepsModels)LearnerCatalog.BuiltIn.Get(family);
        var kept = keeper.FitAndKeep(job, CancellationToken.None);

        // When the kept bytes score the same job's test rows
        var again = keeper.PredictKept(job, kept.Model);

        // Then every prediction matches the fit's own to a relative 1e-9, and a tree family's (scored on dense rows) to the bit
        Assert.Equal(kept.Prediction.Test.Length, again.Length);
        if (family is FamilyNames.FastTree or FamilyNames.Forest)
        {
            Assert.Equal(kept.Prediction.Test, again);
        }

        for (int i = 0; i < again.Length; i++)
        {
            Assert.True(Math.Abs(again[i] - kept.Prediction.Test[i]) <= 1e-9 * Math.Max(1, Math.Abs(kept.Prediction.Test[i])), $"{family} row {i}: {again[i]:R} vs {kept.Prediction.Test[i]:R}");
        }
    }

    [Fact]
    public void LightGbm_predicts_the_same_on_one_thread_as_on_two()
    {
        // Given a subsampling LightGBM job, fitted once on one thread and once on two
        var parameters = TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.7);
        var learner = LearnerCatalog.BuiltIn.Get(FamilyNames.LightGbm);
        var one = learner.Fit(TinyTables.Job(Data, FamilyNames.LightGbm, parameters, threads: 1), CancellationToken.None);
        var two = learner.Fit(TinyTables.Job(Data, FamilyNames.LightGbm, parameters, threads: 2), CancellationToken.None);

        // Then the test predictions agree to a relative 1e-9 (a re-fit of kept models may use other threads than the search)
        for (int i = 0; i < one.Test.Length; i++)
        {
            Assert.True(Math.Abs(one.Test[i] - two.Test[i]) <= 1e-9 * Math.Max(1, Math.Abs(one.Test[i])), $"row {i}: {one.Test[i]:R} vs {two.Test[i]:R}");
        }
    }

    [Fact]
    public void A_family_that_cannot_keep_its_models_is_refused_before_any_fit()
    {
        // Given ML.NET's LightGBM trainer, kept as the tests' reference only
        var reference = new MlNetLightGbmLearner();

        // When a keeping learner is asked to wrap it, then it is refused naming the family
        var error = Assert.Throws<ArgumentException>(() => new KeepingLearner(reference));
        Assert.Contains(reference.Family, error.Message, StringComparison.Ordinal);
    }
}
