using System.Collections.Immutable;
using System.Runtime.InteropServices;
using Foldwise.Core.Data;

namespace Foldwise.Csv;

/// <summary>
/// Collects one category column's cells as level codes. Levels are looked up by span, so a cell whose level was
/// seen before costs no allocation; missing-value words are remembered with the missing code after their first check.
/// </summary>
internal sealed class LevelColumnBuilder
{
    private readonly Dictionary<string, int> codeOf = new(StringComparer.Ordinal);
    private readonly Dictionary<string, int>.AlternateLookup<ReadOnlySpan<char>> lookup;
    private readonly List<string> levels = [];
    private int[] codes = new int[16];

    public LevelColumnBuilder()
    {
        lookup = codeOf.GetAlternateLookup<ReadOnlySpan<char>>();
    }

    public int Count { get; private set; }

    /// <summary>How many cells so far hold a level (not missing).</summary>
    public int PresentCount { get; private set; }

    /// <summary>The line of the first empty cell, or 0.</summary>
    public long FirstEmptyLine { get; private set; }

    /// <summary>The line of the first cell holding a missing-value word, or 0.</summary>
    public long FirstWordLine { get; private set; }

    /// <summary>The first missing-value word met, as written.</summary>
    public string FirstWord { get; private set; } = "";

    /// <summary>True once a present cell did not read as a number.</summary>
    public bool SawText { get; private set; }

    public void Add(ReadOnlySpan<char> cell, TableRules rules, long line)
    {
        int code;
        if (cell.IsWhiteSpace())
        {
            code = CategoryColumn.Missing;
            FirstEmptyLine = FirstEmptyLine == 0 ? line : FirstEmptyLine;
        }
        else if (!lookup.TryGetValue(cell, out code))
        {
            code = rules.IsMissing(cell) ? CategoryColumn.Missing : levels.Count;
            if (code != CategoryColumn.Missing)
            {
                levels.Add(cell.ToString());
                SawText |= !float.TryParse(cell, System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out _);
            }

            lookup[cell] = code;
        }

        if (code == CategoryColumn.Missing && FirstWordLine == 0 && !cell.IsWhiteSpace())
        {
            FirstWordLine = line;
            FirstWord = cell.ToString();
        }

        Append(code);
    }

    /// <summary>Starts the column from numbers already read (a column found to hold text part-way): each number becomes the level of its shortest text.</summary>
    public void AddNumbers(int rowCount, ReadOnlySpan<int> rows, ReadOnlySpan<float> values)
    {
        int next = 0;
        for (int r = 0; r < rowCount; r++)
        {
            if (next < rows.Length && rows[next] == r)
            {
                float v = values[next++];
                if (float.IsNaN(v))
                {
                    Append(CategoryColumn.Missing);
                    continue;
                }

                AddLevel(v.ToString("R", System.Globalization.CultureInfo.InvariantCulture));
            }
            else
            {
                AddLevel("0");
            }
        }
    }

    /// <summary>Carries over where the numbers read before this column turned to text had empty cells and missing words.</summary>
    public void NoteEarlierGaps(long emptyLine, long wordLine, string word)
    {
        FirstEmptyLine = emptyLine;
        FirstWordLine = wordLine;
        FirstWord = word;
    }

    public CategoryColumn Build() => new(
        [.. levels],
        ImmutableCollectionsMarshal.AsImmutableArray(codes.AsSpan(0, Count).ToArray()));

    private void AddLevel(string text)
    {
        if (!codeOf.TryGetValue(text, out int code))
        {
            code = levels.Count;
            levels.Add(text);
            codeOf[text] = code;
        }

        Append(code);
    }

    private void Append(int code)
    {
        if (Count == codes.Length)
        {
            Array.Resize(ref codes, codes.Length * 2);
        }

        codes[Count++] = code;
        PresentCount += code == CategoryColumn.Missing ? 0 : 1;
    }
}
