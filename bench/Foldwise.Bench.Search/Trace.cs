using System.Globalization;
using System.Text;

/// <summary>One finished trial of a benchmark search, with the running totals the comparison needs.</summary>
internal sealed record TraceRow(int Trial, int Rung, int Budget, string Proposer, double Compute, double Score, double Best, double Seconds, string Parameters, string Rounds = "");

/// <summary>Trace files: one tab-separated line per finished trial, in the order they finished.</summary>
internal static class Trace
{
    private const string Header = "trial\trung\tbudget\tproposer\tcompute\tscore\tbest\tseconds\tparameters\trounds";

    public static void Write(string path, IReadOnlyList<TraceRow> rows)
    {
        var text = new StringBuilder(Header).Append('\n');
        foreach (var r in rows)
        {
            text.Append(string.Create(CultureInfo.InvariantCulture,
                $"{r.Trial}\t{r.Rung}\t{r.Budget}\t{r.Proposer}\t{r.Compute:R}\t{r.Score:R}\t{r.Best:R}\t{r.Seconds:F2}\t{r.Parameters}\t{r.Rounds}\n"));
        }

        // Written whole, then moved: an interrupted run leaves no half trace to be reused.
        File.WriteAllText(path + ".tmp", text.ToString());
        File.Move(path + ".tmp", path, overwrite: true);
    }

    /// <summary>The trace at the path if it holds at least <paramref name="trials"/> trials (its first that many), else null.</summary>
    public static List<TraceRow>? ReadIfComplete(string path, int trials)
    {
        var rows = Read(path);
        return rows is not null && rows.Count >= trials ? rows[..trials] : null;
    }

    public static List<TraceRow>? Read(string path)
    {
        if (!File.Exists(path))
        {
            return null;
        }

        var rows = new List<TraceRow>();
        foreach (string line in File.ReadLines(path).Skip(1))
        {
            var f = line.Split('\t');
            var c = CultureInfo.InvariantCulture;
            rows.Add(new TraceRow(int.Parse(f[0], c), int.Parse(f[1], c), int.Parse(f[2], c), f[3], double.Parse(f[4], c),
                double.Parse(f[5], c), double.Parse(f[6], c), double.Parse(f[7], c), f.Length > 8 ? f[8] : "", f.Length > 9 ? f[9] : ""));
        }

        return rows;
    }
}
