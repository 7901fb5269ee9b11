using System.Runtime.InteropServices;

namespace Foldwise.Csv;

/// <summary>
/// Skips the zero cells that start at a field of an unquoted line: fields written "0" and ended by a comma, two at a
/// time by comparing the four characters "0,0," as one 64-bit number. A row of a mostly-zero table then costs about
/// its non-zero cells, not its thousands of fields; any other field ("00", "", "0.5") is left to the caller.
/// </summary>
internal static class ZeroRun
{
    private static readonly ulong TwoZeroCells = MemoryMarshal.Read<ulong>(MemoryMarshal.AsBytes("0,0,".AsSpan()));

    /// <summary>
    /// How many fields from <paramref name="start"/> (at most <paramref name="limit"/>) are "0" followed by a comma;
    /// <paramref name="next"/> is where the field after them starts.
    /// </summary>
    public static int Skip(ReadOnlySpan<char> line, int start, int limit, out int next)
    {
        int at = start;
        int fields = 0;
        var bytes = MemoryMarshal.AsBytes(line);
        while (fields + 2 <= limit && at + 4 <= line.Length && MemoryMarshal.Read<ulong>(bytes[(2 * at)..]) == TwoZeroCells)
        {
            at += 4;
            fields += 2;
        }

        if (fields < limit && at + 2 <= line.Length && line[at] == '0' && line[at + 1] == ',')
        {
            at += 2;
            fields++;
        }

        next = at;
        return fields;
    }
}
