using System.Text;

namespace Foldwise.Bench.Load;

/// <summary>
/// Writes a synthetic id + feature CSV where each cell is non-zero with the given probability:
/// counts 1–20 and, for one cell in four, a three-decimal amount, so number parsing is exercised too.
/// </summary>
internal static class SparseCsvWriter
{
    public static long Write(string path, int rows, int columns, double density, int seed)
    {
        var random = new Random(seed);
        using var writer = new StreamWriter(path, append: false, new UTF8Encoding(false), bufferSize: 1 << 20);
        var line = new StringBuilder(columns * 3);
        line.Append("id");
        for (int c = 0; c < columns; c++)
        {
            line.Append(",f").Append(c);
        }

        writer.Write(line);
        writer.Write('\n');
        long nonZero = 0;
        Span<char> number = stackalloc char[32];
        for (int r = 0; r < rows; r++)
        {
            line.Clear().Append('s').Append(r);
            for (int c = 0; c < columns; c++)
            {
                if (random.NextDouble() >= density)
                {
                    line.Append(",0");
                    continue;
                }

                nonZero++;
                double value = random.Next(4) == 0 ? Math.Round(random.NextDouble() * 100, 3) + 0.001 : random.Next(1, 21);
                value.TryFormat(number, out int written, provider: System.Globalization.CultureInfo.InvariantCulture);
                line.Append(',').Append(number[..written]);
            }

            writer.Write(line);
            writer.Write('\n');
        }

        return nonZero;
    }
}
