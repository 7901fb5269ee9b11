using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Encodings;

namespace Foldwise.Core.Spaces;

/// <summary>
/// Everything the coordinator, the definition reader and the command line know about one built-in family: its name,
/// what its budget counts and the rungs a search gives it when a definition names none, its default parameter space,
/// limits for parameter names only it has, the inputs it reads, and whether a search without <c>families</c> runs it.
/// How it trains is its learner's business (one class in Foldwise.Learners).
/// </summary>
/// <param name="FirstRung">The family's first rung when a definition gives none, in <paramref name="Unit"/>.</param>
/// <param name="FullBudget">The budget a candidate is scored at when it reaches the top, in <paramref name="Unit"/>.</param>
public sealed record FamilyDescriptor(
    string Name,
    BudgetUnit Unit,
    int FirstRung,
    int FullBudget,
    ParameterSpace Space,
    FamilyInput Input,
    bool InDefaultSet)
{
    /// <summary>Hard limits for parameter names no other family has; shared names take <see cref="ParameterLimit"/>'s table.</summary>
    public ImmutableDictionary<string, ParameterLimit> Limits { get; init; } = ImmutableDictionary<string, ParameterLimit>.Empty;

    /// <summary>
    /// The forms this family can read a few-level category column in, its default first: indicator columns, which
    /// every family reads, or one column of level codes for a learner that splits on categories itself.
    /// </summary>
    public ImmutableArray<CategoryEncodingKind> FewLevelForms { get; init; } = [CategoryEncodingKind.Indicators];

    /// <summary>The limit this family puts on a parameter, or null when it has none.</summary>
    public ParameterLimit? LimitOf(string parameter) => Limits.GetValueOrDefault(parameter) ?? ParameterLimit.For(parameter);
}
