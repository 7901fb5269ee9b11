using System.Globalization;
using System.Text;

namespace Foldwise.Bench.Rows;

/// <summary>
/// Writes an invented tall table: an id, <c>columns</c> features each non-zero with probability <c>density</c>
/// (counts 1–20, one in four a two-decimal amount) and, for training tables, a right-skewed positive target
/// (exp of a sparse linear signal plus noise), so a search has something to learn.
/// </summary>
internal static class TallCsvWriter
{
    public static void Write(string path, string idPrefix, int rows, int columns, double density, bool withTarget, int seed)
    {
        var random = new Random(seed);
        var weights = Enumerable.Range(0, columns).Select(c => c % 4 == 0 ? 0.04 * ((c % 7) - 3) : 0.0).ToArray();
        using var writer = new StreamWriter(path, append: false, new UTF8Encoding(false), bufferSize: 1 << 20);
        var line = new StringBuilder(columns * 4);
        line.Append("row_id");
        for (int c = 0; c < columns; c++)
        {
            line.Append(",x").Append(c);
        }

        writer.Write(line.Append(withTarget ? ",amount\n" : "\n"));
        for (int r = 0; r < rows; r++)
        {
            line.Clear().Append(idPrefix).Append(r);
            double signal = 0;
            for (int c = 0; c < columns; c++)
            {
                if (random.NextDouble() >= density)
                {
                    line.Append(",0");
                    continue;
                }

                double value = random.Next(4) == 0 ? Math.Round(random.NextDouble() * 50, 2) + 0.01 : random.Next(1, 21);
                signal += weights[c] * Math.Log(1 + value);
                line.Append(',').Append(value.ToString(CultureInfo.InvariantCulture));
            }

            if (withTarget)
            {
                double target = Math.Round(Math.Exp(3 + signal + (0.5 * Gaussian(random))) - 1, 2);
                line.Append(',').Append(Math.Max(0, target).ToString(CultureInfo.InvariantCulture));
            }

            writer.Write(line.Append('\n'));
        }
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
}
