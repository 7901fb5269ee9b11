using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Cli.Commands;

/// <summary>The demo's search: both families, ASHA with TPE; the quick one on a small table with small budgets.</summary>
public static class DemoDefinition
{
    public const string IdColumn = "shipper_id";
    public const string TargetColumn = "q1_spend";

    public static SearchDefinition For(bool quick, int seed) => new()
    {
        Name = quick ? "freight-demo-quick" : "freight-demo",
        Data = new DataSource("train.csv", "test.csv", IdColumn, TargetColumn),
        Seed = seed,
        Families = [.. FamilyNames.Default.Select(f => new FamilySearch(f, DefaultSpaces.For(f)))],
        Schedule = quick
            ? new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Tpe, FirstRung: 20, FullBudget: 180, Eta: 3)
            : new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Tpe, FirstRung: 25, FullBudget: 400, Eta: 3),
        Budget = quick ? new SearchBudget(Trials: 40, Hours: null) : new SearchBudget(Trials: 60, Hours: 3),
    };
}
