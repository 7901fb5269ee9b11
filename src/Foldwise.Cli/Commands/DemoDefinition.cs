using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Cli.Commands;

/// <summary>The demo's search: the default families, ASHA with TPE racing over folds (<see cref="ScheduleDefaults"/>); the quick one on a small table with small budgets.</summary>
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
            ? ScheduleDefaults.Standard with { FirstRung = 20, FullBudget = 180 }
            : ScheduleDefaults.Standard with { FirstRung = 25, FullBudget = 400 },
        Budget = quick ? new SearchBudget(Trials: 40, Hours: null) : new SearchBudget(Trials: 60, Hours: 3),
    };
}
