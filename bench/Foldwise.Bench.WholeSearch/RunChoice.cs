using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Bench.WholeSearch;

/// <summary>
/// One run of the bench, written <c>setting[/schedule[/families[/table]]]</c>. Schedule: <c>asha</c> the definition's
/// own (ASHA with TPE), <c>random</c> random candidates at the full budget, <c>racing</c> ASHA over folds (a new
/// candidate on the first fold, then all of them, η 5). Families: <c>default</c> the definition's, <c>all</c> every
/// built-in family on its own rungs, or one family's name. Table: <c>demo</c> the full-size demo, <c>csv</c> the pair
/// given by <c>--csv</c>.
/// </summary>
internal sealed record RunChoice(Setting Setting, string Schedule, string Families, string Table)
{
    public string Name => $"{Setting.Name}/{Schedule}/{Families}/{Table}";

    public static RunChoice Parse(string text, string families)
    {
        string[] parts = text.Split('/');
        string Part(int i, string fallback) => parts.Length > i ? parts[i] : fallback;
        var choice = new RunChoice(Setting.Named(parts[0]), Part(1, "asha"), Part(2, families), Part(3, "demo"));
        _ = choice.ScheduleFor(new ScheduleOptions());
        _ = choice.FamiliesFor([.. FamilyNames.Default.Select(f => new FamilySearch(f, DefaultSpaces.For(f)))]);
        return choice.Table is "demo" or "csv" ? choice : throw new ArgumentException($"unknown table '{choice.Table}' in run '{text}': demo or csv");
    }

    public ScheduleOptions ScheduleFor(ScheduleOptions definitions) => Schedule switch
    {
        "asha" => definitions,
        "random" => definitions with { Kind = ScheduleKind.Full, Proposer = ProposerKind.Random },
        "racing" => definitions with { Kind = ScheduleKind.Asha, ScreenFolds = 1, Eta = 5 },
        _ => throw new ArgumentException($"unknown schedule '{Schedule}': asha, random or racing"),
    };

    public ImmutableArray<FamilySearch> FamiliesFor(ImmutableArray<FamilySearch> definitions)
    {
        ImmutableArray<FamilySearch> chosen = Families switch
        {
            "default" => definitions,
            "all" => [.. FamilyDescriptors.All.Select(d => new FamilySearch(d.Name, DefaultSpaces.For(d.Name), new FamilyBudget(d.FirstRung, d.FullBudget)))],
            _ => [.. definitions.Where(f => f.Family == Families)],
        };
        return chosen.IsEmpty ? throw new ArgumentException($"unknown families '{Families}': default, all or one of {string.Join(", ", definitions.Select(f => f.Family))}") : chosen;
    }
}
