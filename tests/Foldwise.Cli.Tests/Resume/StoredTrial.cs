using System.Text.Json;

namespace Foldwise.Cli.Tests.Resume;

/// <summary>One trial as <c>foldwise history --json</c> prints it, with the facts resume and reproducibility compare.</summary>
public sealed record StoredTrial(int Id, string Family, string State, double? Score, int Budget, int Rung, int? Parent, string Parameters)
{
    /// <summary>The work a trial stands for: two trials with the same key did the same thing twice.</summary>
    public string WorkKey => $"{Family}|{Budget}|{Rung}|{Parameters}";

    /// <summary>Reads the store through <c>history --json</c> (read-only, so it also works while a search runs).</summary>
    public static IReadOnlyList<StoredTrial> Read(string store)
    {
        var history = CliHarness.Run("history", store, "--json");
        Assert.True(history.ExitCode == 0, history.Output);
        return Parse(history.Output);
    }

    public static IReadOnlyList<StoredTrial> Parse(string json)
    {
        using var document = JsonDocument.Parse(json);
        return [.. document.RootElement.EnumerateArray().Select(t => new StoredTrial(
            t.GetProperty("id").GetInt32(),
            t.GetProperty("family").GetString()!,
            t.GetProperty("state").GetString()!,
            t.GetProperty("score").ValueKind == JsonValueKind.Null ? null : t.GetProperty("score").GetDouble(),
            t.GetProperty("budget").GetInt32(),
            t.GetProperty("rung").GetInt32(),
            t.GetProperty("parent").ValueKind == JsonValueKind.Null ? null : t.GetProperty("parent").GetInt32(),
            t.GetProperty("parameters").GetRawText()))
            .OrderBy(t => t.Id)];
    }
}
