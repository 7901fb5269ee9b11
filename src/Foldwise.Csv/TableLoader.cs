using System.Collections.Immutable;
using System.Text;
using Foldwise.Core.Data;
using Foldwise.Core.Metrics;
using Sylvan.Data.Csv;

namespace Foldwise.Csv;

/// <summary>
/// One pass over a CSV file: header checks, then row by row into sparse numeric columns and category columns.
/// A training column starts numeric and becomes a category column at its first present cell that is not a number.
/// </summary>
internal static class TableLoader
{
    // A 7,000-column row is ~15–60 K characters; the buffer grows up to this before a row counts as broken.
    private const int MaxRowChars = 1 << 25;

    /// <param name="bytesRead">Told every few thousand rows how far the read has come: bytes of the file read, and its length.</param>
    public static FeatureTable Load(
        string path, string idColumn, string? targetColumn, TargetUse use, Metric? metric, TableRules rules, TrainingColumns? training, Action<long, long>? bytesRead = null)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        ArgumentException.ThrowIfNullOrEmpty(idColumn);
        if (!File.Exists(path))
        {
            throw new InputException(path, "the file does not exist");
        }

        try
        {
            using var file = new FileStream(path, new FileStreamOptions { BufferSize = 1 << 16 });
            using var text = new StreamReader(file, Encoding.UTF8, detectEncodingFromByteOrderMarks: true);
            using var csv = CsvDataReader.Create(text, new CsvDataReaderOptions { Delimiter = ',', BufferSize = 1 << 16, MaxBufferSize = MaxRowChars });
            var names = Enumerable.Range(0, csv.FieldCount).Select(csv.GetName).ToArray();
            if (names.Length == 1 && names[0].Length == 0)
            {
                throw Empty(path);
            }

            var layout = HeaderLayout.From(path, names, idColumn, targetColumn, use == TargetUse.Required, rules);
            Action? tick = bytesRead is null ? null : () => bytesRead(file.Position, file.Length);
            return ReadRows(path, csv, layout, use == TargetUse.Required ? metric : null, targetColumn, rules, training, tick);
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

    private static FeatureTable ReadRows(
        string path, CsvDataReader csv, HeaderLayout layout, Metric? metric, string? targetColumn, TableRules rules, TrainingColumns? training, Action? tick)
    {
        var ids = ImmutableArray.CreateBuilder<string>();
        var target = ImmutableArray.CreateBuilder<double>();
        var lineOfId = new Dictionary<string, long>(StringComparer.Ordinal);
        var columns = new SparseColumnsBuilder(layout.FeatureOrdinals.Length);
        var ordinals = layout.FeatureOrdinals;
        var names = layout.FeatureNames;
        var levels = new LevelColumnBuilder?[ordinals.Length];
        var gaps = new GapLines(ordinals.Length);
        var declared = training?.Categories ?? rules.Categories.ToHashSet(StringComparer.Ordinal);
        for (int f = 0; f < ordinals.Length; f++)
        {
            levels[f] = declared.Contains(names[f]) ? new LevelColumnBuilder() : null;
        }

        // Where a row's fields can be skipped as zero cells: numeric feature columns (not id, target, ignored or category columns).
        var featureOf = new int[layout.FieldCount];
        Array.Fill(featureOf, -1);
        for (int f = 0; f < ordinals.Length; f++)
        {
            featureOf[ordinals[f]] = f;
        }

        var plainUntil = PlainUntil(featureOf, levels);
        while (csv.Read())
        {
            // Sylvan numbers data records from 1; the header is line 1 of the file.
            long line = csv.RowNumber + 1;
            if ((line & 0xFFF) == 0)
            {
                tick?.Invoke();
            }

            if (csv.RowFieldCount != layout.FieldCount)
            {
                if (csv.RowFieldCount == 1 && csv.GetFieldSpan(0).IsWhiteSpace())
                {
                    continue;
                }

                throw Ragged(path, line, csv.RowFieldCount, layout.FieldCount);
            }

            int row = ids.Count;
            ids.Add(ReadId(path, csv, layout.IdOrdinal, line, lineOfId, rules));
            if (metric is not null)
            {
                target.Add(ReadTarget(path, csv, layout.TargetOrdinal, line, targetColumn!, metric, rules));
            }

            // A row without quotes is split here, skipping runs of zero cells (ZeroRun); a quoted one field by field.
            var raw = TrimLineEnd(csv.GetRawRecordSpan());
            if (raw.IndexOf('"') < 0)
            {
                int at = 0;
                for (int ordinal = 0; ordinal < layout.FieldCount; ordinal++)
                {
                    int skipped = ZeroRun.Skip(raw, at, plainUntil[ordinal] - ordinal, out int next);
                    if (skipped > 0)
                    {
                        ordinal += skipped - 1;
                        at = next;
                        continue;
                    }

                    int length = raw[at..].IndexOf(',');
                    var cell = length < 0 ? raw[at..] : raw.Slice(at, length);
                    at += cell.Length + 1;
                    if (featureOf[ordinal] is int f and >= 0 && Feature(f, cell, row, line))
                    {
                        plainUntil = PlainUntil(featureOf, levels);
                    }
                }

                continue;
            }

            for (int f = 0; f < ordinals.Length; f++)
            {
                if (Feature(f, csv.GetFieldSpan(ordinals[f]), row, line))
                {
                    plainUntil = PlainUntil(featureOf, levels);
                }
            }
        }

        // Reads one feature cell; true when it turned a numeric column into a category column.
        bool Feature(int f, ReadOnlySpan<char> cell, int row, long line)
        {
            if (levels[f] is { } text)
            {
                text.Add(cell, rules, line);
                return false;
            }

            if (CellParser.TryFeature(cell, rules, path, line, ordinals[f], names[f], out float value))
            {
                if (value != 0f)
                {
                    columns.Add(f, row, value);
                    if (float.IsNaN(value))
                    {
                        gaps.Note(f, cell, line);
                    }
                }

                return false;
            }

            if (training is not null && training.Numeric.Contains(names[f]))
            {
                throw new InputException(
                    path, $"column '{names[f]}' holds only numbers in {training.Path} but the text {CellParser.Quote(cell)} here", line, ordinals[f] + 1);
            }

            // The first text cell: the column is a category column, its earlier numbers become levels.
            text = new LevelColumnBuilder();
            text.AddNumbers(row, columns.Rows(f), columns.Values(f));
            text.NoteEarlierGaps(gaps.FirstEmptyLine[f], gaps.FirstWordLine[f], gaps.FirstWord[f]);
            columns.Clear(f);
            text.Add(cell, rules, line);
            levels[f] = text;
            return true;
        }

        if (ids.Count == 0)
        {
            throw new InputException(path, "the file has a header but no data rows");
        }

        return Assemble(path, layout, ids.ToImmutable(), target.ToImmutable(), columns, levels, rules, training);
    }

    private static FeatureTable Assemble(
        string path, HeaderLayout layout, ImmutableArray<string> ids, ImmutableArray<double> target,
        SparseColumnsBuilder columns, LevelColumnBuilder?[] levels, TableRules rules, TrainingColumns? training)
    {
        var all = columns.Build();
        var numericNames = ImmutableArray.CreateBuilder<string>();
        var numeric = ImmutableArray.CreateBuilder<SparseColumn>();
        var categoryNames = ImmutableArray.CreateBuilder<string>();
        var categories = ImmutableArray.CreateBuilder<CategoryColumn>();
        for (int f = 0; f < levels.Length; f++)
        {
            string name = layout.FeatureNames[f];
            if (levels[f] is not { } text)
            {
                numericNames.Add(name);
                numeric.Add(all[f]);
                continue;
            }

            int column = layout.FeatureOrdinals[f] + 1;
            if (!rules.MissingWordsStated && text.FirstEmptyLine > 0 && text.FirstWordLine > 0)
            {
                throw new InputException(
                    path,
                    $"category column '{name}' has blank cells (line {text.FirstEmptyLine}) and {CellParser.Quote(text.FirstWord)}, a default missing word that may be a level here; set 'data.missing'",
                    Math.Max(text.FirstEmptyLine, text.FirstWordLine),
                    column);
            }

            if (training is not null && training.TextCategories.Contains(name) && !text.SawText && text.PresentCount > 0)
            {
                throw new InputException(path, $"column '{name}' holds text in {training.Path} but only numbers here", 1, column);
            }

            categoryNames.Add(name);
            categories.Add(text.Build());
        }

        return new FeatureTable(path, ids, numericNames.ToImmutable(), numeric.ToImmutable(), target, categoryNames.ToImmutable(), categories.ToImmutable());
    }

    /// <summary>For each field, the first field at or after it that is not a numeric feature column: zero runs stop there.</summary>
    private static int[] PlainUntil(int[] featureOf, LevelColumnBuilder?[] levels)
    {
        var until = new int[featureOf.Length + 1];
        until[featureOf.Length] = featureOf.Length;
        for (int o = featureOf.Length - 1; o >= 0; o--)
        {
            until[o] = featureOf[o] >= 0 && levels[featureOf[o]] is null ? until[o + 1] : o;
        }

        return until;
    }

    private static ReadOnlySpan<char> TrimLineEnd(ReadOnlySpan<char> record)
    {
        int end = record.Length;
        while (end > 0 && record[end - 1] is '\n' or '\r')
        {
            end--;
        }

        return record[..end];
    }

    private static string ReadId(string path, CsvDataReader csv, int ordinal, long line, Dictionary<string, long> lineOfId, TableRules rules)
    {
        var cell = csv.GetFieldSpan(ordinal);
        if (cell.IsWhiteSpace() || rules.IsMissing(cell))
        {
            throw new InputException(path, $"the id is missing ({CellParser.Quote(cell)}); every row needs its own id", line, ordinal + 1);
        }

        string id = cell.ToString();

        if (!lineOfId.TryAdd(id, line))
        {
            throw new InputException(path, $"id {CellParser.Quote(id)} repeats the id on line {lineOfId[id]}", line, ordinal + 1);
        }

        return id;
    }

    private static double ReadTarget(string path, CsvDataReader csv, int ordinal, long line, string column, Metric metric, TableRules rules)
    {
        double y = CellParser.Target(csv.GetFieldSpan(ordinal), rules, path, line, ordinal, column);
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
