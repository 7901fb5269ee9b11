using System.Globalization;
using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Cli.Output;

/// <summary>Each family's rungs in its own unit, for people: "lightgbm 25 to 400 rounds, forest 20 to 300 trees".</summary>
internal static class FamilyRungs
{
    public static string Describe(SearchDefinition definition) =>
        definition.Schedule.ByFolds
            ? string.Create(CultureInfo.InvariantCulture, $"{string.Join(", ", definition.Families.Select(f => FamilyDescriptors.UnitOf(f.Family).Count(definition.BudgetOf(f.Family).FullBudget) is var full ? $"{f.Family} {full}" : ""))} screened on the first {definition.Schedule.ScreenFolds} of {definition.Folds} folds")
            : string.Join(", ", definition.Families.Select(f => Describe(f.Family, definition.BudgetOf(f.Family))));

    public static string Describe(string family, FamilyBudget budget) =>
        string.Create(CultureInfo.InvariantCulture, $"{family} {budget.FirstRung} to {FamilyDescriptors.UnitOf(family).Count(budget.FullBudget)}");
}
