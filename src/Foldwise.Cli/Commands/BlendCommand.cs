using System.Text.Json;
using System.Text.Json.Nodes;
using Foldwise.Cli.Output;
using Foldwise.Cli.Running;
using Foldwise.Tuning;
using Foldwise.Cli.Report;
using Foldwise.Core.Definition;
using Foldwise.Storage;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>
/// <c>foldwise blend</c>: solves the blend again from the stored out-of-fold predictions (another mode or pool size),
/// stores it with the search and writes the prediction file beside the store.
/// </summary>
public sealed class BlendCommand(IAnsiConsole console) : Command<BlendSettings>
{
    public override int Execute(CommandContext context, BlendSettings settings, CancellationToken cancellationToken)
    {
        string path = StoreFile.Resolve(settings.Store);
        using var store = SearchStore.Open(path);
        var (header, definition) = StoredSearch.HeaderOf(store);
        var options = new BlendOptions(settings.ParsedMode ?? definition.Blend.Mode, settings.Pool ?? definition.Blend.Pool);
        IProgress<Core.Events.SearchEvent> events = settings.Json ? Core.Events.NoEvents.Instance : new ProgressView(console);
        var blend = BlendStep.Run(store, header, definition, Path.GetDirectoryName(Path.GetFullPath(path))!, events, options, abandon: cancellationToken);
        if (settings.Json)
        {
            var root = new JsonObject
            {
                ["mode"] = DefinitionWords.Of(blend.Mode),
                ["in_sample_score"] = blend.InSampleScore,
                ["nested_score"] = blend.NestedScore,
                ["nested_fold_scores"] = new JsonArray([.. blend.NestedFoldScores.Select(s => (JsonNode?)s)]),
                ["best_single_trial"] = blend.BestSingleTrialId,
                ["best_single_score"] = blend.BestSingleScore,
                ["members"] = new JsonArray([.. blend.Members.Select(m => (JsonNode?)new JsonObject
                {
                    ["trial"] = m.TrialId,
                    ["family"] = m.Family,
                    ["weight"] = m.Weight,
                })]),
                ["predictions"] = Path.Combine(Path.GetDirectoryName(Path.GetFullPath(path))!, BlendStep.PredictionFileName),
            };
            console.Profile.Out.Writer.WriteLine(root.ToJsonString(new JsonSerializerOptions { WriteIndented = true }));
        }

        return ExitCodes.Ok;
    }
}
