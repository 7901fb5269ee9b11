using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Data;

namespace Foldwise.Learners.Tests;

/// <summary>
/// FastTree, FastForest, GAM and SDCA fits running at the same time in one process give the sequential fit's
/// predictions bit for bit (measured once at 24 fits, 6 at a time, on forest, GAM and SDCA, and 5 runs of these
/// tests on FastTree: none differed or failed). The fit path lets these four trainers run side by side on this.
/// </summary>
public sealed class ConcurrentFitTests
{
    public static TheoryData<string> Families => [FamilyNames.FastTree, FamilyNames.Forest, FamilyNames.Gam, FamilyNames.Linear];

    [Theory]
    [MemberData(nameof(Families))]
    public void Concurrent_fits_in_one_process_match_the_sequential_fit(string family)
    {
        // Given one subsampling job and its sequential fit
        var data = TinyTables.Data();
        var job = TinyTables.Job(data, family, TinyTables.Parameters(family, rowFraction: 0.7), budget: 40);
        var sequential = Fit(family, job);

        // When eight fits of it run four at a time
        var concurrent = new double[8][];
        Parallel.For(0, concurrent.Length, new ParallelOptions { MaxDegreeOfParallelism = 4 }, i => concurrent[i] = Fit(family, job));

        // Then every one predicts exactly what the sequential fit did
        Assert.All(concurrent, c => Assert.Equal(sequential, c));
    }

    [Fact]
    public void Forest_fits_beside_FastTree_fits_match_their_sequential_fits()
    {
        // Given a forest job and a FastTree job with their sequential fits
        var data = TinyTables.Data();
        var forest = TinyTables.Job(data, FamilyNames.Forest, TinyTables.Parameters(FamilyNames.Forest, rowFraction: 0.7), budget: 40);
        var boosted = TinyTables.Job(data, FamilyNames.FastTree, TinyTables.Parameters(FamilyNames.FastTree, rowFraction: 0.7), budget: 40);
        var (forestAlone, boostedAlone) = (Fit(FamilyNames.Forest, forest), Fit(FamilyNames.FastTree, boosted));

        // When four of each run side by side
        var concurrent = new double[8][];
        Parallel.For(0, concurrent.Length, new ParallelOptions { MaxDegreeOfParallelism = 4 }, i => concurrent[i] = i % 2 == 0 ? Fit(FamilyNames.Forest, forest) : Fit(FamilyNames.FastTree, boosted));

        // Then each predicts exactly what it did alone
        Assert.All(concurrent.Where((_, i) => i % 2 == 0), c => Assert.Equal(forestAlone, c));
        Assert.All(concurrent.Where((_, i) => i % 2 == 1), c => Assert.Equal(boostedAlone, c));
    }

    private static double[] Fit(string family, FoldJob job)
    {
        var ml = new MLContext(job.Seed);
        var rows = SparseViews.Rows(ml, job.Data.Train, job.TrainRows, job.Data.Target);
        ITransformer model = family switch
        {
            FamilyNames.Forest => ml.Regression.Trainers.FastForest(ForestLearner.Options(job)).Fit(rows),
            FamilyNames.Gam => ml.Regression.Trainers.Gam(GamLearner.Options(job)).Fit(rows),
            FamilyNames.FastTree => ml.Regression.Trainers.FastTree(FastTreeLearner.Options(job)).Fit(rows),
            _ => ml.Regression.Trainers.Sdca(LinearLearner.Options(job)).Fit(rows),
        };
        var held = SparseViews.Rows(ml, job.Data.Train, job.ValidationRows, labels: null);
        return [.. model.Transform(held).GetColumn<float>("Score").Select(s => (double)s)];
    }
}
