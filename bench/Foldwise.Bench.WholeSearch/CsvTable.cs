namespace Foldwise.Bench.WholeSearch;

/// <summary>A table of the user's own: <c>--csv TRAIN,TEST,ID,TARGET</c> (the test file without the target).</summary>
internal sealed record CsvTable(string Train, string Test, string IdColumn, string TargetColumn)
{
    public static CsvTable? Parse(string text)
    {
        if (text.Length == 0)
        {
            return null;
        }

        string[] parts = text.Split(',');
        return parts.Length == 4
            ? new CsvTable(Path.GetFullPath(parts[0]), Path.GetFullPath(parts[1]), parts[2], parts[3])
            : throw new ArgumentException($"--csv wants TRAIN,TEST,ID,TARGET, got '{text}'");
    }
}
