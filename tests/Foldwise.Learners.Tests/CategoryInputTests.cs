using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;

namespace Foldwise.Learners.Tests;

/// <summary>Every family trains on the fold's encoded inputs (<see cref="FoldJob.Features"/>), not on the raw numeric table.</summary>
public sealed class CategoryInputTests
{
    private const int Rows = 300;

    [Theory]
    [InlineData(FamilyNames.LightGbm)]
    [InlineData(FamilyNames.FastTree)]
    [InlineData(FamilyNames.Forest)]
    [InlineData(FamilyNames.Gam)]
    public void Each_family_learns_a_target_carried_only_by_a_text_category(string family)
    {
        // Given a table whose only numeric column is noise-free zero and whose target is set by a text level
        string[] levels = ["north", "south", "west"];
        double[] means = [0, 5, 10];
        var cells = Enumerable.Range(0, Rows).Select(r => levels[r % 3]).ToArray();
        var numeric = Foldwise.Testing.TinyTables.FromRows(
            [.. Enumerable.Range(0, Rows).Select(_ => new float[1])],
            [.. Enumerable.Range(0, Rows).Select(r => means[r % 3])]);
        var table = Foldwise.Testing.TinyTables.WithCategory(numeric, "region", cells);
        var data = TrialData.From(table, table, new FoldPlan(2, 0, [.. Enumerable.Range(0, Rows).Select(r => (r / 3) % 2)]), Metric.Rmse);
        var learner = LearnerCatalog.BuiltIn.Get(family);

        // When one fold is fitted on its encoded inputs
        var job = TinyTables.Job(data, family, TinyTables.Parameters(family), budget: 100) with { Inputs = data.InputsFor(fold: 0, family) };
        var prediction = learner.Fit(job, CancellationToken.None);

        // Then each level's rows are predicted near that level's target, which only the encoding can tell apart
        for (int r = 0; r < 3; r++)
        {
            Assert.InRange(prediction.Test[r], means[r] - 1, means[r] + 1);
        }
    }
}
