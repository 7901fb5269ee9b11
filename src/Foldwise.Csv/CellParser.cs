using System.Globalization;
using Foldwise.Core.Data;

namespace Foldwise.Csv;

/// <summary>Span-based, invariant-culture parsing of numeric cells, with the loader's error sentences.</summary>
internal static class CellParser
{
    private const NumberStyles Styles = NumberStyles.Float;
    private const int QuotedTextLimit = 40;

    /// <summary>A feature cell; "0" (by far the most common cell) is recognised without parsing.</summary>
    public static float Feature(ReadOnlySpan<char> cell, string file, long line, int ordinal, string column)
    {
        if (cell.Length == 1 && cell[0] == '0')
        {
            return 0f;
        }

        if (!float.TryParse(cell, Styles, CultureInfo.InvariantCulture, out float value))
        {
            throw NotANumber(cell, file, line, ordinal, column);
        }

        // Overflowing float's range parses as an infinity, which the same check catches.
        if (!float.IsFinite(value))
        {
            throw new InputException(
                file, $"column '{column}' holds {Quote(cell)}, which is not a finite 32-bit number", line, ordinal + 1);
        }

        return value;
    }

    public static double Target(ReadOnlySpan<char> cell, string file, long line, int ordinal, string column)
    {
        if (!double.TryParse(cell, Styles, CultureInfo.InvariantCulture, out double value))
        {
            throw NotANumber(cell, file, line, ordinal, column);
        }

        return value;
    }

    private static InputException NotANumber(ReadOnlySpan<char> cell, string file, long line, int ordinal, string column) =>
        cell.IsWhiteSpace()
            ? new InputException(file, $"column '{column}' has an empty cell; write 0 for a zero", line, ordinal + 1)
            : new InputException(file, $"column '{column}' holds the text {Quote(cell)} where a number is expected", line, ordinal + 1);

    internal static string Quote(ReadOnlySpan<char> cell) =>
        cell.Length <= QuotedTextLimit ? $"\"{cell}\"" : $"\"{cell[..QuotedTextLimit]}…\"";
}
