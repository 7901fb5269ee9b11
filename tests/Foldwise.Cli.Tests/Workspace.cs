using System.Globalization;
using System.Text;

namespace Foldwise.Cli.Tests;

/// <summary>A temporary folder with small CSV tables and a definition for end-to-end command tests.</summary>
public sealed class Workspace : IDisposable
{
    public Workspace()
    {
        Directory.CreateDirectory(Root);
    }

    public string Root { get; } = Path.Combine(Path.GetTempPath(), "foldwise-cli-tests", Guid.NewGuid().ToString("N"));

    public string Out => Path.Combine(Root, "out");

    public string PathOf(string name) => Path.Combine(Root, name);

    public string Write(string name, string text)
    {
        string path = PathOf(name);
        File.WriteAllText(path, text);
        return path;
    }

    /// <summary>A learnable table: y grows with f1 and f2; f3 is noise, f4 is constant, f5 repeats f1.</summary>
    public void WriteTables(int trainRows = 80, int testRows = 20)
    {
        var random = new Random(5);
        var train = new StringBuilder("id,f1,f2,f3,f4,f5,y\n");
        for (int r = 0; r < trainRows; r++)
        {
            int f1 = random.Next(0, 4), f2 = random.Next(0, 3), f3 = random.Next(0, 2);
            double y = Math.Exp(1 + (0.6 * f1) + (0.4 * f2) + (0.1 * random.NextDouble()));
            train.Append(CultureInfo.InvariantCulture, $"a{r},{f1},{f2},{f3},1,{f1},{y:F3}\n");
        }

        var test = new StringBuilder("id,f5,f4,f3,f2,f1\n");
        for (int r = 0; r < testRows; r++)
        {
            test.Append(CultureInfo.InvariantCulture, $"b{r},{r % 4},1,{r % 2},{r % 3},{r % 4}\n");
        }

        Write("train.csv", train.ToString());
        Write("test.csv", test.ToString());
    }

    /// <summary>A small ASHA search over both families: rungs 5 → 15 rounds.</summary>
    public string WriteDefinition(int trials = 8, string extra = "") => Write("search.json", $$"""
        {
          "name": "cli-test",
          "data": { "train": "train.csv", "test": "test.csv", "id": "id", "target": "y" },
          "folds": 3,
          "screening": { "min_nonzero": 2 },
          "families": { "lightgbm": { "min_leaf_rows": 3 }, "fasttree": { "min_leaf_rows": 3 } },
          "schedule": { "kind": "asha", "proposer": "random", "first_rung": 5, "full_budget": 15, "eta": 3 },
          "budget": { "trials": {{trials}} }{{extra}}
        }
        """);

    public void Dispose()
    {
        try
        {
            Directory.Delete(Root, recursive: true);
        }
        catch (IOException)
        {
            // Best effort: a temp folder.
        }
    }
}
