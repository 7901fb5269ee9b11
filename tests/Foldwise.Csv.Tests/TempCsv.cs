namespace Foldwise.Csv.Tests;

/// <summary>A CSV file in a directory of its own, deleted with the test.</summary>
internal sealed class TempCsv : IDisposable
{
    private readonly string directory;

    public TempCsv(string text, string name = "table.csv")
    {
        directory = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "foldwise-csv-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(directory);
        Path = System.IO.Path.Combine(directory, name);
        File.WriteAllText(Path, text);
    }

    public string Path { get; }

    /// <summary>A path in the same directory that does not exist.</summary>
    public string Missing => System.IO.Path.Combine(directory, "absent.csv");

    public void Dispose() => Directory.Delete(directory, recursive: true);
}
