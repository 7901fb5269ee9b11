using System.Globalization;
using Foldwise.Core.Data;

namespace Foldwise.Csv;

/// <summary>Span-based, invariant-culture parsing of numeric cells, with the loader's error sentences.</summary>
internal static class CellParser
{
    private const NumberStyles Styles = NumberStyles.Float;
    private const int QuotedTextLimit = 40;

    /// <summary>
    /// A numeric feature cell: true with its value (NaN for a missing cell), or false when the cell holds text.
    /// "0" (by far the most common cell) is recognised without parsing.
    /// </summary>
    public static bool TryFeature(ReadOnlySpan<char> cell, TableRules rules, string file, long line, int ordinal, string column, out float value)
    {
        if (cell.Length == 1 && cell[0] == '0')
        {
            value = 0f;
            return true;
        }

        if (float.TryParse(cell, Styles, CultureInfo.InvariantCulture, out value))
        {
            // Overflowing float's range parses as an infinity, which the same check catches; "NaN" parses too.
            if (float.IsFinite(value))
            {
                return true;
            }

            return rules.IsMissing(cell)
                ? true
                : throw new InputException(file, $"column '{column}' holds {Quote(cell)}, which is not a finite 32-bit number", line, ordinal + 1);
        }

        value = float.NaN;
        return cell.IsWhiteSpace() || rules.IsMissing(cell);
    }

    public static double Target(ReadOnlySpan<char> cell, TableRules rules, string file, long line, int ordinal, string column)
    {
        if (cell.IsWhiteSpace() || rules.IsMissing(cell))
        {
            throw new InputException(file, $"the target '{column}' is missing; every training row needs one", line, ordinal + 1);
        }

        if (!double.TryParse(cell, Styles, CultureInfo.InvariantCulture, out double value))
        {
            throw NotANumber(cell, file, line, ordinal, column);
        }

        return value;
    }

    private static InputException NotANumber(ReadOnlySpan<char> cell, string file, long line, int ordinal, string column) =>
        new(file, $"column '{column}' holds the text {Quote(cell)} where a number is expected", line, ordinal + 1);

    internal static string Quote(ReadOnlySpan<char> cell) =>
        cell.Length <= QuotedTextLimit ? $"\"{cell}\"" : $"\"{cell[..QuotedTextLimit]}…\"";
}
