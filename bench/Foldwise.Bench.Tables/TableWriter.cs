using System.Globalization;
using System.Text;

namespace Foldwise.Bench.Tables;

/// <summary>Writes the same invented table twice: category columns as text words, and as their level numbers.</summary>
internal static class TableWriter
{
    public static void Write(string textPath, string codedPath, int rows, int textColumns, int numericColumns, int seed)
    {
        var random = new Random(seed);
        using var text = new StreamWriter(textPath, false, Encoding.UTF8);
        using var coded = new StreamWriter(codedPath, false, Encoding.UTF8);
        string header = "id," + string.Join(",", Enumerable.Range(0, textColumns).Select(c => $"cat{c}").Concat(Enumerable.Range(0, numericColumns).Select(c => $"num{c}")));
        text.WriteLine(header);
        coded.WriteLine(header);
        var line = new StringBuilder();
        var codedLine = new StringBuilder();
        for (int r = 0; r < rows; r++)
        {
            line.Clear().Append('r').Append(r);
            codedLine.Clear().Append('r').Append(r);
            for (int c = 0; c < textColumns; c++)
            {
                // Between 5 and 500 levels per column; about 3 % of cells left blank.
                int levels = 5 * (int)Math.Pow(10, c % 3);
                int level = random.Next(levels);
                bool blank = random.NextDouble() < 0.03;
                line.Append(',').Append(blank ? "" : $"level_{c}_{level}");
                codedLine.Append(',').Append(blank ? "" : (level + 1).ToString(CultureInfo.InvariantCulture));
            }

            for (int c = 0; c < numericColumns; c++)
            {
                string cell = random.NextDouble() < 0.7 ? "0" : (random.NextDouble() * 100).ToString("F2", CultureInfo.InvariantCulture);
                line.Append(',').Append(cell);
                codedLine.Append(',').Append(cell);
            }

            text.WriteLine(line);
            coded.WriteLine(codedLine);
        }
    }
}
