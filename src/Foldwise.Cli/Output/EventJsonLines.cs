using System.Text.Json;
using System.Text.Json.Nodes;
using Foldwise.Core.Events;

namespace Foldwise.Cli.Output;

/// <summary>
/// Events as one JSON object per line, <c>{"event": "SlotTrialScored", …its fields}</c>: what a supervisor, a script
/// or a test reads instead of sentences.
/// </summary>
public sealed class EventJsonLines(TextWriter output) : IProgress<SearchEvent>
{
    private static readonly JsonSerializerOptions Options = new() { PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower };

    public void Report(SearchEvent value)
    {
        ArgumentNullException.ThrowIfNull(value);
        var line = new JsonObject { ["event"] = value.GetType().Name };
        foreach (var (key, node) in JsonSerializer.SerializeToNode(value, value.GetType(), Options)!.AsObject().ToList())
        {
            line[key] = node?.DeepClone();
        }

        lock (output)
        {
            output.WriteLine(line.ToJsonString());
        }
    }
}
