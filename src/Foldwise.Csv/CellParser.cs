using System.Globalization;
using Foldwise.Core.Data;

namespace Foldwise.Csv;

/// <summary>Span-based, invariant-culture parsing of numeric cells, with the loader's error sentences.</summary>
internal static class CellParser
{
    private const NumberStyles Styles = NumberStyles.Float;
    private const int QuotedTextLimit = 40;

    // 9,999,999 < 2^24: every whole number of up to 7 digits is exact in a float.
    private const int MaxExactDigits = 7;

    /// <summary>
    /// A numeric feature cell: true with its value (NaN for a missing cell), or false when the cell holds text.
    /// "0" (by far the most common cell) and other whole numbers of up to 7 digits are read without the general parser.
    /// </summary>
    public static bool TryFeature(ReadOnlySpan<char> cell, TableRules rules, string file, long line, int ordinal, string column, out float value)
    {
        if (cell.Length == 1 && cell[0] == '0')
        {
            value = 0f;
            return true;
        }

        if (cell.Length <= MaxExactDigits && !cell.IsEmpty && !cell.ContainsAnyExceptInRange('0', '9'))
        {
            value = WholeNumber(cell);
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

    /// <summary>The value of up to <see cref="MaxExactDigits"/> digits: below 2^24, so the float is exact and equals what the general parser gives.</summary>
    private static float WholeNumber(ReadOnlySpan<char> digits)
    {
        int number = 0;
        foreach (char digit in digits)
        {
            number = (number * 10) + (digit - '0');
        }

        return number;
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
