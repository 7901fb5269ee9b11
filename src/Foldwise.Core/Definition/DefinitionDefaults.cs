using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>
/// What a search means without a definition file: every built-in family with its default space, the default
/// schedule, the name "search", and 40 trials when neither a trial nor an hour budget is given.
/// </summary>
public static class DefinitionDefaults
{
    /// <summary>Where a flag's problem is reported.</summary>
    public const string CommandLine = "command line";

    /// <summary>The trial budget when neither <c>--trials</c> nor <c>--hours</c> is given, nor a budget in a file.</summary>
    public const int Trials = 40;

    /// <summary>The name of a search started from flags alone.</summary>
    public const string Name = "search";

    /// <summary>Every built-in family with its default space, in <see cref="FamilyDescriptors.All"/> order: what a definition may name.</summary>
    public static ImmutableArray<FamilySearch> BuiltInFamilies { get; } =
        [.. FamilyDescriptors.All.Select(d => new FamilySearch(d.Name, d.Space))];

    /// <summary>The families searched when a definition names none: those whose descriptor is in the default set.</summary>
    public static ImmutableArray<FamilySearch> DefaultFamilies { get; } =
        [.. BuiltInFamilies.Where(f => FamilyDescriptors.Get(f.Family).InDefaultSet)];

    /// <summary>
    /// The definition behind <c>foldwise run --train --test --id --target [--trials] [--hours]</c>. Relative paths
    /// are taken from <paramref name="baseDirectory"/> (the current folder when null) and become absolute.
    /// </summary>
    public static SearchDefinition FromFlags(
        string train,
        string test,
        string id,
        string target,
        int? trials,
        double? hours,
        int? seed = null,
        int? folds = null,
        string? baseDirectory = null)
    {
        string folder = Path.GetFullPath(baseDirectory ?? Directory.GetCurrentDirectory());
        var data = new DataSource(Flag("--train", train, folder), Flag("--test", test, folder), Flag("--id", id, null), Flag("--target", target, null));
        if (data.IdColumn == data.TargetColumn)
        {
            throw new InputException(CommandLine, $"--target must differ from --id, both are \"{id}\"");
        }

        var definition = new SearchDefinition
        {
            Name = Name,
            Data = data,
            Families = DefaultFamilies,
            Schedule = ScheduleDefaults.Standard,
            Budget = Budget(null, trials, hours),
        };

        if (seed is { } s)
        {
            definition = definition with { Seed = s };
        }

        return folds switch
        {
            null => definition,
            < 2 => throw new InputException(CommandLine, $"--folds must be at least 2, got {folds}"),
            { } k => definition with { Folds = k },
        };
    }

    /// <summary>
    /// A file's definition with the budget flags given beside it: each flag given replaces that part of the
    /// file's budget and the other part stays.
    /// </summary>
    public static SearchDefinition Override(SearchDefinition definition, int? trials, double? hours) =>
        trials is null && hours is null ? definition : definition with { Budget = Budget(definition.Budget, trials, hours) };

    private static SearchBudget Budget(SearchBudget? current, int? trials, double? hours)
    {
        if (trials < 1)
        {
            throw new InputException(CommandLine, $"--trials must be at least 1, got {trials}");
        }

        if (hours is { } h && !(double.IsFinite(h) && h > 0))
        {
            throw new InputException(CommandLine, $"--hours must be above 0, got {h}");
        }

        return current is null
            ? new SearchBudget(trials ?? (hours is null ? Trials : null), hours)
            : new SearchBudget(trials ?? current.Trials, hours ?? current.Hours);
    }

    private static string Flag(string flag, string value, string? folder) =>
        string.IsNullOrWhiteSpace(value) ? throw new InputException(CommandLine, $"{flag} needs a value")
        : folder is null ? value : Path.GetFullPath(value, folder);
}
