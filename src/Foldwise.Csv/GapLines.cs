namespace Foldwise.Csv;

/// <summary>Where each numeric column first had an empty cell and a missing-value word, in case it turns out to hold text.</summary>
internal sealed class GapLines(int columnCount)
{
    public long[] FirstEmptyLine { get; } = new long[columnCount];

    public long[] FirstWordLine { get; } = new long[columnCount];

    public string[] FirstWord { get; } = [.. Enumerable.Repeat("", columnCount)];

    public void Note(int column, ReadOnlySpan<char> cell, long line)
    {
        if (cell.IsWhiteSpace())
        {
            FirstEmptyLine[column] = FirstEmptyLine[column] == 0 ? line : FirstEmptyLine[column];
        }
        else if (FirstWordLine[column] == 0)
        {
            FirstWordLine[column] = line;
            FirstWord[column] = cell.ToString();
        }
    }
}
