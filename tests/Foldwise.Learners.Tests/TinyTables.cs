using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;

namespace Foldwise.Learners.Tests;

/// <summary>Small sparse tables with a known signal, and parameter sets inside the default spaces.</summary>
internal static class TinyTables
{
    public const int Features = 20;

    /// <summary>
    /// log1p(y) = 1 + 0.6·x0 + 1.2·[x1 &gt; 0] + 0.25·x2·x3 + small noise, with each feature non-zero in
    /// ~30% of rows as a count 1–5; the other 16 features are noise.
    /// </summary>
    public static FeatureTable Table(int rows, int seed, bool withTarget)
    {
        var random = new Random(seed);
        var cells = new float[rows, Features];
        var target = ImmutableArray.CreateBuilder<double>(rows);
        for (int r = 0; r < rows; r++)
        {
            for (int c = 0; c < Features; c++)
            {
                cells[r, c] = random.NextDouble() < 0.3 ? random.Next(1, 6) : 0;
            }

            double log = 1 + (0.6 * cells[r, 0]) + (cells[r, 1] > 0 ? 1.2 : 0) + (0.25 * cells[r, 2] * cells[r, 3]) + (0.1 * (random.NextDouble() - 0.5));
            target.Add(Math.Exp(log) - 1);
        }

        var columns = Enumerable.Range(0, Features).Select(c =>
        {
            var nonZero = Enumerable.Range(0, rows).Where(r => cells[r, c] != 0).ToArray();
            return new SparseColumn([.. nonZero], [.. nonZero.Select(r => cells[r, c])]);
        });
        return new FeatureTable(
            "tiny.csv",
            [.. Enumerable.Range(0, rows).Select(r => $"T{r:D4}")],
            [.. Enumerable.Range(0, Features).Select(c => $"f{c:D2}")],
            [.. columns],
            withTarget ? target.MoveToImmutable() : []);
    }

    /// <summary>Row r is held out in fold r mod k: simple, and every fold sees every kind of row.</summary>
    public static FoldPlan RoundRobin(int rows, int folds) => new(folds, 0, [.. Enumerable.Range(0, rows).Select(r => r % folds)]);

    public static TrialData Data(int rows = 200, int testRows = 100, int folds = 3) =>
        TrialData.From(Table(rows, seed: 11, withTarget: true), Table(testRows, seed: 12, withTarget: false), RoundRobin(rows, folds), Metric.Rmsle);

    /// <summary>Values for every parameter of the family's default space; row_fraction as asked where the family has it.</summary>
    /// <param name="features">The columns the learner reads: GAM's rate is shared among them.</param>
    public static ParameterSet Parameters(string family, double rowFraction = 1.0, int features = Features)
    {
        var chosen = new Dictionary<string, double>
        {
            ["learning_rate"] = 0.1,
            ["leaves"] = 8,
            ["min_leaf_rows"] = 5,
            ["feature_fraction"] = 1.0,
            ["row_fraction"] = rowFraction,
            ["l2"] = 1.0,
            ["bins"] = 64,
        };
        if (family == FamilyNames.Linear)
        {
            chosen["l2"] = 1e-3;
        }

        if (family == FamilyNames.Gam)
        {
            // GAM's rate is a whole iteration's step, shared among the features: 0.1 for each feature here.
            chosen["learning_rate"] = 0.1 * features;
        }

        // A parameter not listed takes its default range's low end, so a new family needs no line here.
        return ParameterSet.Of(DefaultSpaces.For(family).Ranges.Select(r => KeyValuePair.Create(r.Name, chosen.GetValueOrDefault(r.Name, r.Low))));
    }

    /// <summary>The families whose space samples rows, so that their seed shows in the fit.</summary>
    public static IEnumerable<string> Subsampling => FamilyNames.All.Where(f => DefaultSpaces.For(f).Find("row_fraction") is not null);

    public static FoldJob Job(TrialData data, string family, ParameterSet? parameters = null, int seed = 7, int threads = 1, int budget = 60) =>
        new(data, 0, data.Folds.TrainRows(0), data.Folds.ValidationRows(0), parameters ?? Parameters(family), budget, seed, threads);
}
