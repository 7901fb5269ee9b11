using Foldwise.Core.Encodings;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>One family taking part in a search, with the space its candidates are drawn from and its own rungs.</summary>
/// <param name="Budget">
/// The family's first rung and full budget in its own unit. A definition file always resolves it (the family's own,
/// else the schedule's, else its descriptor's); null means the schedule's shared range, as in stores written before
/// families had budgets of their own and in searches built in code.
/// </param>
public sealed record FamilySearch(string Family, ParameterSpace Space, FamilyBudget? Budget = null)
{
    /// <summary>
    /// What a few-level category column becomes for this family (<see cref="CategoryEncodingKind.Indicators"/> or
    /// <see cref="CategoryEncodingKind.LevelCodes"/>); null: the family's default (<see cref="FamilyDescriptor.FewLevelForms"/>).
    /// A definition file always resolves it; a stored definition written before families could choose reads as indicators.
    /// </summary>
    public CategoryEncodingKind? FewLevels { get; init; }

    /// <summary>The form this family reads few-level category columns in: its own choice, else its descriptor's default.</summary>
    public CategoryEncodingKind FewLevelsForm => FewLevels ?? FamilyDescriptors.Find(Family)?.FewLevelForms[0] ?? CategoryEncodingKind.Indicators;

    /// <summary>The family's rungs under <paramref name="schedule"/>: its own when it has them, else the schedule's.</summary>
    public FamilyBudget BudgetUnder(ScheduleOptions schedule)
    {
        ArgumentNullException.ThrowIfNull(schedule);
        return Budget ?? new FamilyBudget(schedule.FirstRung, schedule.FullBudget);
    }
}
