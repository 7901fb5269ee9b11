using System.Collections.Immutable;
using System.Text.Json;
using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Core.Spaces;

namespace Foldwise.Storage;

/// <summary>
/// Reads the definition a store of format 1 kept: the definition file's JSON as the writer of that version wrote it
/// (every key spelled out, a range as one word and its bounds, or a bare number). Format 1 was written in two spellings,
/// before and after the definition's words were renamed: <c>min_rounds</c> / <c>max_rounds</c> and ranges
/// <c>int</c>, <c>float</c>, <c>log</c>, <c>choice</c>, then <c>first_rung</c> / <c>full_budget</c> and <c>whole</c>,
/// <c>linear</c>, <c>log</c>, <c>one_of</c>. Both are frozen here, so later changes of the definition syntax leave
/// old stores readable. <c>StoreFormatTests</c> opens a store of format 1 kept as a fixture.
/// </summary>
internal static class EarlierDefinitionText
{
    private const string Owner = "the search definition (store format 1)";
    private static readonly ScheduleOptions Defaults = new();

    public static SearchDefinition Read(string json)
    {
        try
        {
            using var document = JsonDocument.Parse(json, new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
            return Read(document.RootElement);
        }
        catch (Exception e) when (e is JsonException or KeyNotFoundException or InvalidOperationException or FormatException)
        {
            throw BsonFields.Damaged(Owner, e.Message);
        }
    }

    private static SearchDefinition Read(JsonElement root)
    {
        var data = root.GetProperty("data");
        var schedule = root.GetProperty("schedule");
        var budget = root.GetProperty("budget");
        var blend = root.GetProperty("blend");
        return new SearchDefinition
        {
            Name = root.GetProperty("name").GetString()!,
            Data = new DataSource(Text(data, "train"), Text(data, "test"), Text(data, "id"), Text(data, "target")),
            Metric = Word(root, "metric", ("rmsle", MetricKind.Rmsle), ("rmse", MetricKind.Rmse), ("mae", MetricKind.Mae)),
            Folds = root.GetProperty("folds").GetInt32(),
            Seed = root.GetProperty("seed").GetInt32(),
            Screening = new ScreeningOptions(root.GetProperty("screening").GetProperty("min_nonzero").GetInt32()),
            Families = [.. root.GetProperty("families").EnumerateObject().Select(f => new FamilySearch(f.Name, Space(f.Name, f.Value)))],
            Schedule = new ScheduleOptions(
                Word(schedule, "kind", ("full", ScheduleKind.Full), ("asha", ScheduleKind.Asha), ("hyperband", ScheduleKind.Hyperband)),
                Word(schedule, "proposer", ("random", ProposerKind.Random), ("tpe", ProposerKind.Tpe)),
                Either(schedule, "min_rounds", "first_rung").GetInt32(),
                Either(schedule, "max_rounds", "full_budget").GetInt32(),
                schedule.GetProperty("eta").GetInt32(),

                // Written by later format-1 builds only; an earlier store reads as the definition reader of format 1 read it: the defaults.
                schedule.TryGetProperty("rate_scaling", out var rate) ? rate.GetDouble() : Defaults.RateScaling,
                schedule.TryGetProperty("brackets", out var brackets) ? brackets.GetInt32() : Defaults.Brackets),
            Budget = new SearchBudget(
                budget.TryGetProperty("trials", out var trials) ? trials.GetInt32() : null,
                budget.TryGetProperty("hours", out var hours) ? hours.GetDouble() : null),
            Blend = new BlendOptions(
                Word(blend, "mode", ("simplex", BlendMode.Simplex), ("non_negative", BlendMode.NonNegative), ("greedy", BlendMode.Greedy)),
                blend.GetProperty("pool").GetInt32()),
        };
    }

    private static ParameterSpace Space(string family, JsonElement ranges) =>
        new([.. ranges.EnumerateObject().Select(r => Range(family, r.Name, r.Value))]);

    private static ParameterRange Range(string family, string name, JsonElement value)
    {
        if (value.ValueKind == JsonValueKind.Number)
        {
            // A bare number was a fixed value; a whole-number parameter stayed whole.
            double v = value.GetDouble();
            return IsWhole(family, name)
                ? ParameterRange.Whole(name, (int)v, (int)v)
                : ParameterRange.Fixed(name, v);
        }

        var member = value.EnumerateObject().Single();
        return member.Name switch
        {
            "int" or "whole" => ParameterRange.Whole(name, member.Value[0].GetInt32(), member.Value[1].GetInt32()),
            "float" or "linear" => ParameterRange.Linear(name, member.Value[0].GetDouble(), member.Value[1].GetDouble()),
            "log" => ParameterRange.Log(name, member.Value[0].GetDouble(), member.Value[1].GetDouble()),
            "choice" or "one_of" => ParameterRange.OneOf(name, [.. member.Value.EnumerateArray().Select(c => c.GetString()!)]),
            _ => throw new FormatException($"'{family}.{name}' holds an unknown range '{member.Name}'"),
        };
    }

    private static bool IsWhole(string family, string name)
    {
        try
        {
            return DefaultSpaces.For(family).Find(name)?.Kind == ParameterKind.Whole;
        }
        catch (ArgumentException)
        {
            return false; // a family this build does not know: its fixed values stay as written
        }
    }

    private static JsonElement Either(JsonElement section, string before, string after) =>
        section.TryGetProperty(before, out var value) ? value : section.GetProperty(after);

    private static string Text(JsonElement section, string key) => section.GetProperty(key).GetString()!;

    private static T Word<T>(JsonElement section, string key, params (string Word, T Value)[] words)
    {
        string text = section.GetProperty(key).GetString()!;
        foreach (var (word, v) in words)
        {
            if (word == text)
            {
                return v;
            }
        }

        throw new FormatException($"'{key}' holds '{text}', which format 1 did not write");
    }
}
