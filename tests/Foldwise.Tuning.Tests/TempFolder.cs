namespace Foldwise.Tuning.Tests;

/// <summary>A fresh folder under the system's temporary directory, deleted afterwards.</summary>
public sealed class TempFolder : IDisposable
{
    public TempFolder() => Directory.CreateDirectory(Root);

    public string Root { get; } = Path.Combine(Path.GetTempPath(), "foldwise-tuning-tests", Guid.NewGuid().ToString("N"));

    public string PathOf(string name) => Path.Combine(Root, name);

    public void Dispose()
    {
        try
        {
            Directory.Delete(Root, recursive: true);
        }
        catch (IOException)
        {
            // A store's file may still be closing; the temporary folder is cleaned by the system.
        }
    }
}
