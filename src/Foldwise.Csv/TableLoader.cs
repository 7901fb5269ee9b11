using System.Collections.Immutable;
using System.Text;
using Foldwise.Core.Data;
using Foldwise.Core.Metrics;
using Sylvan.Data.Csv;

namespace Foldwise.Csv;

/// <summary>One pass over a CSV file: header checks, then row by row into sparse columns.</summary>
internal static class TableLoader
{
    // A 7,000-column row is ~15–60 K characters; the buffer grows up to this before a row counts as broken.
    private const int MaxRowChars = 1 << 25;

    public static FeatureTable Load(string path, string idColumn, string? targetColumn, TargetUse use, Metric? metric)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        ArgumentException.ThrowIfNullOrEmpty(idColumn);
        if (!File.Exists(path))
        {
            throw new InputException(path, "the file does not exist");
        }

        try
        {
            using var text = new StreamReader(path, Encoding.UTF8, detectEncodingFromByteOrderMarks: true, new FileStreamOptions { BufferSize = 1 << 16 });
            using var csv = CsvDataReader.Create(text, new CsvDataReaderOptions { Delimiter = ',', BufferSize = 1 << 16, MaxBufferSize = MaxRowChars });
            var names = Enumerable.Range(0, csv.FieldCount).Select(csv.GetName).ToArray();
            if (names.Length == 1 && names[0].Length == 0)
            {
                throw Empty(path);
            }

            var layout = HeaderLayout.From(path, names, idColumn, targetColumn, use == TargetUse.Required);
            return ReadRows(path, csv, layout, use == TargetUse.Required ? metric : null, targetColumn);
        }
        catch (CsvMissingHeadersException)
        {
            throw Empty(path);
        }
        catch (CsvRecordTooLargeException e)
        {
            throw new InputException(path, $"a row is longer than {MaxRowChars} characters, so the file is likely not CSV", e.RowNumber + 1);
        }
        catch (CsvFormatException e)
        {
            throw new InputException(path, $"the row is not valid CSV: {e.Message.TrimEnd('.')}", e.RowNumber + 1, e.FieldOrdinal + 1);
        }
    }

    private static FeatureTable ReadRows(string path, CsvDataReader csv, HeaderLayout layout, Metric? metric, string? targetColumn)
    {
        var ids = ImmutableArray.CreateBuilder<string>();
        var target = ImmutableArray.CreateBuilder<double>();
        var lineOfId = new Dictionary<string, long>(StringComparer.Ordinal);
        var columns = new SparseColumnsBuilder(layout.FeatureOrdinals.Length);
        var ordinals = layout.FeatureOrdinals;
        while (csv.Read())
        {
            // Sylvan numbers data records from 1; the header is line 1 of the file.
            long line = csv.RowNumber + 1;
            if (csv.RowFieldCount != layout.FieldCount)
            {
                if (csv.RowFieldCount == 1 && csv.GetFieldSpan(0).IsWhiteSpace())
                {
                    continue;
                }

                throw Ragged(path, line, csv.RowFieldCount, layout.FieldCount);
            }

            int row = ids.Count;
            ids.Add(ReadId(path, csv, layout.IdOrdinal, line, lineOfId));
            if (metric is not null)
            {
                target.Add(ReadTarget(path, csv, layout.TargetOrdinal, line, targetColumn!, metric));
            }

            for (int f = 0; f < ordinals.Length; f++)
            {
                float value = CellParser.Feature(csv.GetFieldSpan(ordinals[f]), path, line, ordinals[f], layout.FeatureNames[f]);
                if (value != 0f)
                {
                    columns.Add(f, row, value);
                }
            }
        }

        if (ids.Count == 0)
        {
            throw new InputException(path, "the file has a header but no data rows");
        }

        return new FeatureTable(path, ids.ToImmutable(), [.. layout.FeatureNames], columns.Build(), target.ToImmutable());
    }

    private static string ReadId(string path, CsvDataReader csv, int ordinal, long line, Dictionary<string, long> lineOfId)
    {
        string id = csv.GetString(ordinal);
        if (id.Length == 0)
        {
            throw new InputException(path, "the id is empty", line, ordinal + 1);
        }

        if (!lineOfId.TryAdd(id, line))
        {
            throw new InputException(path, $"id {CellParser.Quote(id)} repeats the id on line {lineOfId[id]}", line, ordinal + 1);
        }

        return id;
    }

    private static double ReadTarget(string path, CsvDataReader csv, int ordinal, long line, string column, Metric metric)
    {
        double y = CellParser.Target(csv.GetFieldSpan(ordinal), path, line, ordinal, column);
        return metric.TargetProblem(y) is { } problem
            ? throw new InputException(path, $"column '{column}': {problem}", line, ordinal + 1)
            : y;
    }

    private static InputException Ragged(string path, long line, int fields, int headerFields) => new(
        path,
        $"the row has {fields} fields but the header has {headerFields}",
        line,
        Math.Min(fields, headerFields) + 1);

    private static InputException Empty(string path) => new(path, "the file is empty; a header line is required");
}
