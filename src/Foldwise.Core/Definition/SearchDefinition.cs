using System.Collections.Immutable;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;

namespace Foldwise.Core.Definition;

/// <summary>One tuning job, as read from a definition file or from command-line flags, and as stored with the search.</summary>
public sealed record SearchDefinition
{
    public required string Name { get; init; }

    public required DataSource Data { get; init; }

    public MetricKind Metric { get; init; } = MetricKind.Rmsle;

    /// <summary>K of the K-fold plan. The default is <c>5</c>.</summary>
    public int Folds { get; init; } = 5;

    /// <summary>Seeds the fold plan, the proposers and every learner. The default is <c>1</c>.</summary>
    public int Seed { get; init; } = 1;

    public ScreeningOptions Screening { get; init; } = new();

    public required ImmutableArray<FamilySearch> Families { get; init; }

    public ScheduleOptions Schedule { get; init; } = new();

    public required SearchBudget Budget { get; init; }

    public BlendOptions Blend { get; init; } = new();

    /// <summary>The families of this search that read few-level category columns as level codes (their own category splits).</summary>
    public ImmutableArray<string> LevelCodeFamilies() =>
        [.. Families.Where(f => f.FewLevelsForm == Encodings.CategoryEncodingKind.LevelCodes).Select(f => f.Family)];

    /// <summary>A family's rungs in its own unit; a family the search does not name takes the schedule's range.</summary>
    public FamilyBudget BudgetOf(string family) =>
        Families.FirstOrDefault(f => f.Family == family)?.BudgetUnder(Schedule) ?? new FamilyBudget(Schedule.FirstRung, Schedule.FullBudget);
}
