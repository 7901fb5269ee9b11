using System.Globalization;
using System.Text.Json;
using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Xunit.Abstractions;

namespace Foldwise.Learners.Tests;

/// <summary>
/// The forest family against scikit-learn's RandomForestRegressor (Debian python3-sklearn) on an open table,
/// same folds: reference/forest_reference.json, written by reference/make_forest_reference.py from
/// reference/concrete.csv (modeldata 1.1.0's concrete table, MIT licence).
/// </summary>
public sealed class ForestReferenceTests(ITestOutputHelper output)
{
    [Fact]
    public void Scores_within_the_fold_to_fold_noise_of_scikit_learns_forest_on_the_same_folds()
    {
        // Given the concrete table, log1p of strength as the target, row r held out in fold r mod 5
        var (rows, target) = Concrete();
        var data = DenseTables.Data(rows, target, rows[..10], [.. Enumerable.Range(0, rows.Length).Select(r => r % 5)]);
        var reference = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(AppContext.BaseDirectory, "reference", "forest_reference.json")))
            .RootElement.GetProperty("fold_scores").EnumerateArray().Select(e => e.GetDouble()).ToArray();

        // When the forest runs with the reference's settings: 200 trees, ≤ 64 leaves, ≥ 5 rows a leaf, all columns, 70 % of rows a tree
        var parameters = ParameterSet.Of(new Dictionary<string, double> { ["leaves"] = 64, ["min_leaf_rows"] = 5, ["feature_fraction"] = 1, ["row_fraction"] = 0.7 });
        var outcome = new TrialExecutor(new ForestLearner()).Run(data, parameters, budget: 200, seed: 3, threads: 1, CancellationToken.None, _ => { });

        // Then its mean fold score is within one standard deviation of scikit-learn's fold scores from theirs
        double noise = StandardDeviation(reference);
        double difference = outcome.FoldScores.Average() - reference.Average();
        output.WriteLine($"forest {outcome.FoldScores.Average():F4}, scikit-learn {reference.Average():F4}, fold-to-fold sd {noise:F4}");
        Assert.True(Math.Abs(difference) <= noise, $"forest {outcome.FoldScores.Average():F4}, scikit-learn {reference.Average():F4}, fold-to-fold sd {noise:F4}");
    }

    private static (double[][] Rows, double[] Target) Concrete()
    {
        var lines = File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "reference", "concrete.csv")).Skip(1).ToArray();
        var cells = lines.Select(l => l.Split(',').Select(c => double.Parse(c, CultureInfo.InvariantCulture)).ToArray()).ToArray();
        return ([.. cells.Select(c => c[..^1])], [.. cells.Select(c => Math.Log(1 + c[^1]))]);
    }

    private static double StandardDeviation(double[] values)
    {
        double mean = values.Average();
        return Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1));
    }
}
