using System.Collections.Immutable;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>
/// Reads <c>families</c>: each key a built-in family, each value an object naming only the parameters it changes
/// (every other parameter keeps the family's default range, in the default order) and, optionally, the family's own
/// <c>first_rung</c> and <c>full_budget</c> in its budget unit; what it leaves out comes from <paramref name="fallback"/>.
/// A family that can read few-level category columns in more than one form also takes <c>few_level_categories</c>.
/// </summary>
internal sealed class FamiliesReader(DefinitionCheck check, IReadOnlyList<FamilySearch> builtIn, Func<string, FamilyBudget> fallback)
{
    /// <summary>The keys of a family's object that are not parameters.</summary>
    public static readonly string[] BudgetKeys = ["first_rung", "full_budget"];

    public ImmutableArray<FamilySearch> Read(DefinitionNode node)
    {
        string[] known = [.. builtIn.Select(f => f.Family)];
        var families = check.Object(node, known, "family", "built-in families");
        if (families.Count == 0)
        {
            throw check.Fail(node, $"'families' names no family; add one or more of {string.Join(", ", known)}");
        }

        return [.. families.Members.Select(m => Family(m.Key, m.Value, builtIn.First(f => f.Family == m.Key).Space))];
    }

    private FamilySearch Family(string family, DefinitionNode node, ParameterSpace standard)
    {
        var descriptor = FamilyDescriptors.Find(family);
        bool chooses = descriptor?.FewLevelForms.Length > 1;
        string[] names = [.. standard.Ranges.Select(r => r.Name), .. BudgetKeys, .. chooses ? [DefinitionNames.FewLevelsKey] : Array.Empty<string>()];
        var given = check.Object(node, names, "parameter", $"{family}'s parameters");
        var ranges = new RangeReader(check, FamilyDescriptors.Find(family));
        var space = new ParameterSpace([.. standard.Ranges.Select(r => given.Get(r.Name) is { } m ? ranges.Read(m.Value, r) : r)]);

        var standardBudget = fallback(family);
        var first = given.Get("first_rung")?.Value;
        var full = given.Get("full_budget")?.Value;
        var budget = new FamilyBudget(
            first is null ? standardBudget.FirstRung : check.Whole(first, 1),
            full is null ? standardBudget.FullBudget : check.Whole(full, 1));
        if (budget.FullBudget < budget.FirstRung)
        {
            string unit = FamilyDescriptors.UnitOf(family).Many;
            throw check.Fail(full ?? first!, $"'{node.Path}.full_budget' ({budget.FullBudget}{(full is null ? ", from the schedule or the family's default" : "")}) " +
                                             $"is below its first_rung ({budget.FirstRung}{(first is null ? ", from the schedule or the family's default" : "")}) {unit}");
        }

        return new FamilySearch(family, space, budget) { FewLevels = chooses ? FewLevels(given.Get(DefinitionNames.FewLevelsKey)?.Value, descriptor!) : null };
    }

    /// <summary>
    /// The family's form for few-level category columns: the one given, else its default; a stored definition without
    /// the key was written before families could choose, when every family read indicator columns.
    /// </summary>
    private Encodings.CategoryEncodingKind FewLevels(DefinitionNode? given, FamilyDescriptor descriptor)
    {
        if (given is null)
        {
            return check.ReadsStoredText ? Encodings.CategoryEncodingKind.Indicators : descriptor.FewLevelForms[0];
        }

        return check.Word(given, DefinitionNames.FewLevelForms);
    }
}
