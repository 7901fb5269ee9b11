using System.Text.Json;
using System.Text.Json.Nodes;
using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;

namespace Foldwise.Cli.Output;

/// <summary>The trial history as JSON: an array of objects, one per trial, with the same facts as the table.</summary>
public static class TrialJson
{
    private static readonly JsonSerializerOptions Indented = new() { WriteIndented = true };

    /// <param name="definition">Numbers the brackets as plan does (<see cref="BracketNumbers"/>).</param>
    public static string Write(IEnumerable<TrialRecord> trials, SearchDefinition definition)
    {
        var brackets = BracketNumbers.For(definition);
        var array = new JsonArray();
        foreach (var t in trials)
        {
            var parameters = new JsonObject();
            foreach (var (name, value) in t.Parameters.Values)
            {
                parameters[name] = value;
            }

            array.Add(new JsonObject
            {
                ["id"] = t.Id,
                ["family"] = t.Family,
                ["state"] = t.State.ToString().ToLowerInvariant(),
                ["score"] = t.Score,
                ["fold_scores"] = new JsonArray([.. t.FoldScores.Select(s => (JsonNode?)s)]),
                ["rung"] = t.Rung,
                ["bracket"] = brackets.Of(t.Family, t.Bracket),
                ["budget"] = t.Budget,
                ["folds"] = t.AllFolds ? definition.Folds : t.Folds,
                ["parent"] = t.ParentId,
                ["best_round"] = t.BestRound,
                ["rounds_continued"] = t.RoundsContinued,
                ["proposer"] = t.Proposer,
                ["attempt"] = t.Attempt,
                ["lost_attempts"] = new JsonArray([.. t.LostAttempts.Select(s => (JsonNode?)s)]),
                ["failure"] = t.FailureReason,
                ["worker"] = t.Worker,
                ["slot"] = t.Slot,
                ["started"] = t.Started,
                ["finished"] = t.Finished,
                ["seconds"] = t.Duration?.TotalSeconds,
                ["parameters"] = parameters,
            });
        }

        return array.ToJsonString(Indented);
    }
}
