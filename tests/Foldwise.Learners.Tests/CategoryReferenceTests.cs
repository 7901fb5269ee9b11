using System.Globalization;
using System.Text.Json;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;
using Xunit.Abstractions;

namespace Foldwise.Learners.Tests;

/// <summary>
/// LightGBM on a table with text categories, encoded inside each fold, against scikit-learn's
/// HistGradientBoostingRegressor (Debian python3-sklearn) with its own categorical splits and with one-hot columns, same folds and settings:
/// reference/category_reference.json, written by reference/make_category_reference.py from reference/diamonds-2000.csv
/// (2,000 rows of ggplot2's diamonds, MIT licence).
/// </summary>
public sealed class CategoryReferenceTests(ITestOutputHelper output)
{
    /// <remarks>
    /// Measured 2026-12-05 against scikit-learn 1.2.1's figures in the reference file (one-hot 0.12127, native categorical
    /// 0.11709): Foldwise with indicator columns 0.12195 (0.6 % above one-hot), with level codes and LightGBM's own
    /// category splits 0.11803 (0.8 % above native categorical). Each form is held to within 2 % of its own counterpart.
    /// </remarks>
    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void Scores_within_two_percent_of_scikit_learns_boosting_with_the_same_kind_of_category_encoding(bool levelCodes)
    {
        // Given diamonds with cut, color and clarity as text, log1p(price) scored, row r held out in fold r mod 5, and
        // LightGBM reading them as level codes (its own category splits) or as indicator columns
        var table = Diamonds();
        var data = TrialData.From(table, table, new FoldPlan(5, 0, [.. Enumerable.Range(0, table.RowCount).Select(r => r % 5)]), Metric.Rmsle)
            with { LevelCodeFamilies = levelCodes ? [FamilyNames.LightGbm] : [] };

        // scikit-learn 1.2.1 (Debian python3-sklearn) HistGradientBoostingRegressor fold scores, written by reference/make_category_reference.py
        var reference = JsonDocument.Parse(File.ReadAllBytes(Path.Combine(AppContext.BaseDirectory, "reference", "category_reference.json"))).RootElement;
        double native = reference.GetProperty("native_categorical_fold_scores").EnumerateArray().Average(e => e.GetDouble());
        double oneHot = reference.GetProperty("one_hot_fold_scores").EnumerateArray().Average(e => e.GetDouble());

        // When LightGBM runs with the reference's settings: 200 rounds, rate 0.1, ≤ 31 leaves, ≥ 20 rows a leaf, no L2, every row and column
        var parameters = ParameterSet.Of(new Dictionary<string, double>
        {
            ["learning_rate"] = 0.1, ["leaves"] = 31, ["min_leaf_rows"] = 20, ["l2"] = 0, ["feature_fraction"] = 1, ["row_fraction"] = 1,
        });
        var outcome = new TrialExecutor(LearnerCatalog.BuiltIn.Get(FamilyNames.LightGbm)).Run(data, parameters, budget: 200, seed: 3, threads: 1, CancellationToken.None);

        // Then its mean fold RMSLE is at most 2 % above scikit-learn's with the same kind of encoding
        double ours = outcome.FoldScores.Average();
        double counterpart = levelCodes ? native : oneHot;
        output.WriteLine($"Foldwise lightgbm ({(levelCodes ? "level codes" : "indicators")}) {ours:F5}; scikit-learn native categorical {native:F5}, one-hot {oneHot:F5}");
        Assert.True(ours <= 1.02 * counterpart, $"Foldwise {ours:F5} against scikit-learn's {(levelCodes ? "native categorical" : "one-hot")} {counterpart:F5}");
    }

    /// <summary>Columns: carat, cut, color, clarity, depth, table, price, x, y, z, id (quoted text, plain numbers).</summary>
    private static Core.Data.FeatureTable Diamonds()
    {
        var lines = File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "reference", "diamonds-2000.csv")).Skip(1)
            .Select(l => l.Split(',').Select(c => c.Trim('"')).ToArray()).ToArray();
        float Number(string cell) => float.Parse(cell, CultureInfo.InvariantCulture);
        var numeric = Foldwise.Testing.TinyTables.FromRows(
            [.. lines.Select(c => new[] { Number(c[0]), Number(c[4]), Number(c[5]), Number(c[7]), Number(c[8]), Number(c[9]) })],
            [.. lines.Select(c => double.Parse(c[6], CultureInfo.InvariantCulture))]);
        var withCut = Foldwise.Testing.TinyTables.WithCategory(numeric, "cut", [.. lines.Select(c => c[1])]);
        var withColor = Foldwise.Testing.TinyTables.WithCategory(withCut, "color", [.. lines.Select(c => c[2])]);
        return Foldwise.Testing.TinyTables.WithCategory(withColor, "clarity", [.. lines.Select(c => c[3])]);
    }
}
