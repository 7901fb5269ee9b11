using Foldwise.Core.Metrics;

namespace Foldwise.Core.Definition;

/// <summary>
/// The definition file's spelling of each choice a search makes (<c>asha</c>, <c>tpe</c>, <c>non_negative</c>), so
/// everything a person reads — the command line, tables, JSON, the report — spells them as the file does.
/// </summary>
public static class DefinitionWords
{
    public static string Of(ScheduleKind kind) => DefinitionNames.Schedules.NameOf(kind);

    public static string Of(ProposerKind proposer) => DefinitionNames.Proposers.NameOf(proposer);

    public static string Of(BlendMode mode) => DefinitionNames.BlendModes.NameOf(mode);

    public static string Of(MetricKind metric) => DefinitionNames.Metrics.NameOf(metric);

    /// <summary>The blend modes as the definition spells them.</summary>
    public static IReadOnlyList<string> BlendModes => DefinitionNames.BlendModes.Names;

    /// <summary>Reads a blend mode spelled as in the definition (exact, lower case).</summary>
    public static bool TryBlendMode(string word, out BlendMode mode) => DefinitionNames.BlendModes.TryParse(word, out mode);
}
