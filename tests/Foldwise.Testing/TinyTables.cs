using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;

namespace Foldwise.Testing;

/// <summary>
/// Builds small <see cref="FeatureTable"/>s for tests from dense cells; ids default to <c>r1</c>, <c>r2</c> …,
/// feature names to <c>f1</c>, <c>f2</c> …, and the source to <c>tiny.csv</c>.
/// </summary>
public static class TinyTables
{
    /// <summary>A sparse column from dense cells, keeping the non-zero ones.</summary>
    public static SparseColumn Column(params float[] cells)
    {
        var rows = ImmutableArray.CreateBuilder<int>();
        var values = ImmutableArray.CreateBuilder<float>();
        for (int r = 0; r < cells.Length; r++)
        {
            if (cells[r] != 0f)
            {
                rows.Add(r);
                values.Add(cells[r]);
            }
        }

        return new SparseColumn(rows.ToImmutable(), values.ToImmutable());
    }

    /// <summary>A table from named dense columns of equal length.</summary>
    public static FeatureTable FromColumns(
        IReadOnlyList<(string Name, float[] Cells)> columns,
        double[]? target = null,
        string source = "tiny.csv",
        int? rowCount = null)
    {
        int rows = rowCount ?? (columns.Count > 0 ? columns[0].Cells.Length : target?.Length ?? 0);
        if (columns.Any(c => c.Cells.Length != rows))
        {
            throw new ArgumentException("every column needs one cell per row", nameof(columns));
        }

        return new FeatureTable(
            source,
            [.. Enumerable.Range(1, rows).Select(i => $"r{i}")],
            [.. columns.Select(c => c.Name)],
            [.. columns.Select(c => Column(c.Cells))],
            target is null ? [] : [.. target]);
    }

    /// <summary>A table from dense rows, with features named f1, f2 ….</summary>
    /// <summary>Fifty training rows whose one feature is their target 0..49, seven test rows, five folds (seed 3), RMSE: for learners whose predictions are made up from the target.</summary>
    public static TrialData RampTrialData()
    {
        double[] target = [.. Enumerable.Range(0, 50).Select(i => (double)i)];
        var train = FromRows([.. target.Select(y => new[] { (float)y })], target);
        var test = FromRows([.. Enumerable.Range(0, 7).Select(i => new[] { (float)i })]);
        return TrialData.From(train, test, StratifiedFoldPlanner.Create(target, 5, seed: 3), Metric.Rmse);
    }

    public static FeatureTable FromRows(float[][] rows, double[]? target = null, string source = "tiny.csv")
    {
        int width = rows.Length > 0 ? rows[0].Length : 0;
        var columns = Enumerable.Range(0, width)
            .Select(c => ($"f{c + 1}", rows.Select(row => row[c]).ToArray()))
            .ToList();
        return FromColumns(columns, target, source, rows.Length);
    }

    /// <summary>The table with one more category column; a null cell is missing, levels are numbered in order of first appearance.</summary>
    public static FeatureTable WithCategory(FeatureTable table, string name, params string?[] cells)
    {
        ArgumentNullException.ThrowIfNull(table);
        var levels = new List<string>();
        var codes = cells.Select(cell =>
        {
            if (cell is null)
            {
                return CategoryColumn.Missing;
            }

            int at = levels.IndexOf(cell);
            if (at < 0)
            {
                levels.Add(cell);
                at = levels.Count - 1;
            }

            return at;
        }).ToArray();
        return new FeatureTable(
            table.Source, table.Ids, table.FeatureNames, table.Columns, table.Target,
            table.CategoryNames.Add(name), table.Categories.Add(new CategoryColumn([.. levels], [.. codes])));
    }
}
