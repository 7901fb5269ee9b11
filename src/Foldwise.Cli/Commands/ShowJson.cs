using System.Text.Json;
using System.Text.Json.Nodes;
using Foldwise.Cli.Output;
using Foldwise.Cli.Report;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise show --json</c>: one object with the trial's facts; parameters both raw and as read.</summary>
public static class ShowJson
{
    private static readonly JsonSerializerOptions Indented = new() { WriteIndented = true };

    public static string Write(StoredSearch search, TrialRecord t)
    {
        var parameters = new JsonObject();
        var readable = new JsonObject();
        foreach (var (name, value) in t.Parameters.Values)
        {
            parameters[name] = value;
            readable[name] = search.Display(t.Family, name, value);
        }

        var node = new JsonObject
        {
            ["id"] = t.Id,
            ["family"] = t.Family,
            ["state"] = t.State.ToString().ToLowerInvariant(),
            ["metric"] = search.Metric.Name,
            ["score"] = t.Score,
            ["fold_scores"] = new JsonArray([.. t.FoldScores.Select(s => (JsonNode?)s)]),
            ["fold_sd"] = t.FoldScores.Length > 1 ? BlendView.Spread(t.FoldScores) : null,
            ["budget"] = t.Budget,
            ["rung"] = t.Rung,
            ["bracket"] = BracketNumbers.For(search.Definition).Of(t.Family, t.Bracket),
            ["parent"] = t.ParentId,
            ["best_round"] = t.BestRound,
            ["rounds_continued"] = t.RoundsContinued,
            ["parent_chain"] = new JsonArray([.. ShowLineage.Chain(t, search.Trials).Skip(1).Select(c => (JsonNode?)c.Id)]),
            ["promoted_to"] = new JsonArray([.. ShowLineage.Children(t, search.Trials).Select(c => (JsonNode?)c.Id)]),
            ["proposer"] = t.Proposer,
            ["worker"] = t.Worker,
            ["slot"] = t.Slot,
            ["started"] = t.Started,
            ["finished"] = t.Finished,
            ["seconds"] = t.Duration?.TotalSeconds,
            ["kept_models"] = search.KeptMemberOf(t.Id) is { } kept
                ? new JsonObject { ["file"] = $"{Tuning.KeptModelFiles.FolderName}/{kept.Hash}.fwm", ["sha256"] = kept.Hash, ["bytes"] = kept.Bytes, ["folds"] = kept.Folds, ["weight"] = kept.Weight }
                : null,
            ["attempts"] = t.Attempt,
            ["lost_attempts"] = new JsonArray([.. t.LostAttempts.Select(s => (JsonNode?)s)]),
            ["failure"] = t.FailureReason,
            ["parameters"] = parameters,
            ["parameters_readable"] = readable,
        };
        return node.ToJsonString(Indented);
    }
}
