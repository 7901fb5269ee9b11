namespace Foldwise.Core.Definition;

/// <summary>
/// Turns byte offsets into UTF-8 text into 1-based lines and character columns, counting lines at
/// '\n' as System.Text.Json does, so positions from tokens and from its exceptions agree.
/// </summary>
internal sealed class LineMap
{
    private readonly byte[] text;
    private readonly List<int> lineStarts = [0];

    public LineMap(ReadOnlySpan<byte> utf8)
    {
        text = utf8.ToArray();
        for (int i = 0; i < text.Length; i++)
        {
            if (text[i] == (byte)'\n')
            {
                lineStarts.Add(i + 1);
            }
        }
    }

    /// <summary>The position of the byte at <paramref name="offset"/>.</summary>
    public TextPosition At(long offset)
    {
        int target = (int)Math.Clamp(offset, 0, text.Length);
        int line = lineStarts.BinarySearch(target);
        if (line < 0)
        {
            line = ~line - 1;
        }

        return new TextPosition(line + 1, ColumnOf(lineStarts[line], target));
    }

    /// <summary>The position System.Text.Json reports as a 0-based line and byte in that line.</summary>
    public TextPosition At(long zeroBasedLine, long byteInLine)
    {
        int line = (int)Math.Clamp(zeroBasedLine, 0, lineStarts.Count - 1);
        int start = lineStarts[line];
        int target = (int)Math.Clamp(start + byteInLine, start, text.Length);
        return new TextPosition(line + 1, ColumnOf(start, target));
    }

    // A character starts at every byte that is not a UTF-8 continuation byte (10xxxxxx).
    private int ColumnOf(int lineStart, int offset)
    {
        int column = 1;
        for (int i = lineStart; i < offset; i++)
        {
            if ((text[i] & 0xC0) != 0x80)
            {
                column++;
            }
        }

        return column;
    }
}
