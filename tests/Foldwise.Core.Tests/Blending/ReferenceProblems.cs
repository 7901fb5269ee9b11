using System.Text.Json;

namespace Foldwise.Core.Tests.Blending;

/// <summary>
/// The problems and scipy answers in reference/reference_problems.json, written by
/// reference/make_reference.py (scipy 1.10.1, Debian python3-scipy; seed 20261201).
/// </summary>
internal static class ReferenceProblems
{
    private static readonly Lazy<IReadOnlyList<ReferenceProblem>> All = new(Load);

    public static IReadOnlyList<ReferenceProblem> Problems => All.Value;

    public static TheoryData<string> Names()
    {
        var data = new TheoryData<string>();
        foreach (var p in Problems)
        {
            data.Add(p.Name);
        }

        return data;
    }

    public static ReferenceProblem Named(string name) => Problems.Single(p => p.Name == name);

    private static IReadOnlyList<ReferenceProblem> Load()
    {
        var path = Path.Combine(AppContext.BaseDirectory, "Blending", "reference", "reference_problems.json");
        using var document = JsonDocument.Parse(File.ReadAllBytes(path));
        return
        [
            .. document.RootElement.GetProperty("problems").EnumerateArray().Select(p => new ReferenceProblem(
                p.GetProperty("name").GetString()!,
                [.. p.GetProperty("columns").EnumerateArray().Select(Vector)],
                Vector(p.GetProperty("target")),
                p.GetProperty("simplex_objective").GetDouble(),
                p.GetProperty("simplex_exact").GetBoolean(),
                p.GetProperty("nnls_objective").GetDouble())),
        ];
    }

    private static double[] Vector(JsonElement array) => [.. array.EnumerateArray().Select(v => v.GetDouble())];
}

internal sealed record ReferenceProblem(
    string Name, double[][] Columns, double[] Target, double SimplexObjective, bool SimplexExact, double NnlsObjective);
