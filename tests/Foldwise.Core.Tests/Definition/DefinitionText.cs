namespace Foldwise.Core.Tests.Definition;

/// <summary>Definition texts for tests, and where a piece of text stands in them.</summary>
internal static class DefinitionText
{
    public const string Folder = "/defs";

    /// <summary>A valid definition naming every key, one section per line so edits land on known lines.</summary>
    public const string Full = """
        {
          "name": "freight-test",
          "data": { "train": "train.csv", "test": "test.csv", "id": "shipper_id", "target": "q1_spend" },
          "metric": "rmsle",
          "folds": 5,
          "seed": 7,
          "screening": { "min_nonzero": 3 },
          "families": {
            "lightgbm": { "learning_rate": { "log": [0.01, 0.3] }, "leaves": { "whole": [8, 128] }, "row_fraction": 0.8 },
            "fasttree": {}
          },
          "schedule": { "kind": "asha", "proposer": "tpe", "first_rung": 25, "full_budget": 400, "eta": 3 },
          "budget": { "trials": 60, "hours": 2 },
          "blend": { "mode": "simplex", "pool": 3 }
        }
        """;

    /// <summary>
    /// The 1-based line and column of the first <paramref name="needle"/> in <paramref name="text"/>, counted
    /// here on the string itself, independently of the reader's own byte-offset map.
    /// </summary>
    public static (long Line, int Column) PositionOf(string text, string needle)
    {
        int index = text.IndexOf(needle, StringComparison.Ordinal);
        Assert.True(index >= 0, $"'{needle}' is not in the text");
        int lineStart = index == 0 ? 0 : text.LastIndexOf('\n', index - 1) + 1;
        return (text[..index].Count(c => c == '\n') + 1, index - lineStart + 1);
    }

    /// <summary>The repository's copy of a file, found by walking up from the test's output folder.</summary>
    public static string RepositoryFile(string relative)
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "Foldwise.slnx")))
            {
                return Path.Combine(dir.FullName, relative);
            }
        }

        throw new InvalidOperationException($"no Foldwise.slnx above {AppContext.BaseDirectory}");
    }
}
