using System.Text.Json;
using Foldwise.Core.Events;

namespace Foldwise.Cli.Tests.Machines;

/// <summary>Reads a <c>foldwise worker --json</c> line as the event it reports.</summary>
public static class WorkerEvents
{
    /// <summary>True when <paramref name="line"/> is a JSON event line of type <typeparamref name="T"/>.</summary>
    public static bool Is<T>(string line)
        where T : SearchEvent
    {
        if (!line.StartsWith('{'))
        {
            return false;
        }

        using var json = JsonDocument.Parse(line);
        return json.RootElement.TryGetProperty("event", out var name) && name.GetString() == typeof(T).Name;
    }
}
