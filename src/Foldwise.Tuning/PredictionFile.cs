using System.Collections.Immutable;
using System.Globalization;

namespace Foldwise.Tuning;

/// <summary>
/// Writes the test predictions under the header <c>&lt;id&gt;,predicted_&lt;target&gt;</c>, one row per test row in test
/// order, to a temporary file first so no half-written file is ever left.
/// </summary>
public static class PredictionFile
{
    public static void Write(string path, string idColumn, string targetColumn, ImmutableArray<string> ids, IReadOnlyList<double> predictions)
    {
        if (ids.Length != predictions.Count)
        {
            throw new InvalidOperationException($"{ids.Length} test ids but {predictions.Count} predictions");
        }

        string partial = path + ".part";
        using (var writer = new StreamWriter(partial, append: false, new System.Text.UTF8Encoding(false), bufferSize: 1 << 16))
        {
            writer.Write(Quote(idColumn));
            writer.Write(',');
            writer.WriteLine(Quote(ColumnFor(targetColumn)));
            for (int i = 0; i < ids.Length; i++)
            {
                double p = predictions[i];
                if (!double.IsFinite(p))
                {
                    throw new InvalidOperationException($"prediction for {ids[i]} is {p}");
                }

                writer.Write(Quote(ids[i]));
                writer.Write(',');
                writer.WriteLine(p.ToString("R", CultureInfo.InvariantCulture));
            }
        }

        File.Move(partial, path, overwrite: true);
    }

    /// <summary>The prediction column's name: the target's, marked as predicted.</summary>
    public static string ColumnFor(string targetColumn) => "predicted_" + targetColumn;

    private static string Quote(string field) =>
        field.AsSpan().IndexOfAny(",\"\r\n") >= 0 ? "\"" + field.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : field;
}
