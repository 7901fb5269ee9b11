using Foldwise.Core.Metrics;

namespace Foldwise.Core.Definition;

/// <summary>Every key and enum word of the definition syntax, shared by the reader and the writer so they cannot drift.</summary>
internal static class DefinitionNames
{
    public static readonly string[] RootKeys = ["name", "data", "metric", "folds", "seed", "screening", "families", "schedule", "budget", "blend"];
    public static readonly string[] DataKeys = ["train", "test", "id", "target", "missing", "categories", "ignore"];
    public static readonly string[] ScreeningKeys = ["min_nonzero"];
    public static readonly string[] ScheduleKeys = ["kind", "proposer", "first_rung", "full_budget", "eta", "rate_scaling", "brackets", "screen_folds"];
    public static readonly string[] BudgetKeys = ["trials", "hours"];
    public static readonly string[] BlendKeys = ["mode", "pool"];
    public static readonly string[] RangeKeys = ["whole", "linear", "log", "one_of"];

    /// <summary>A family's key choosing how it reads few-level category columns (only for a family that can choose).</summary>
    public const string FewLevelsKey = "few_level_categories";

    public static readonly NameTable<Encodings.CategoryEncodingKind> FewLevelForms = new(
        ("splits", Encodings.CategoryEncodingKind.LevelCodes), ("indicators", Encodings.CategoryEncodingKind.Indicators));

    public static readonly NameTable<MetricKind> Metrics = new(("rmsle", MetricKind.Rmsle), ("rmse", MetricKind.Rmse), ("mae", MetricKind.Mae));

    public static readonly NameTable<ScheduleKind> Schedules = new(("full", ScheduleKind.Full), ("asha", ScheduleKind.Asha), ("hyperband", ScheduleKind.Hyperband));

    public static readonly NameTable<ProposerKind> Proposers = new(("random", ProposerKind.Random), ("tpe", ProposerKind.Tpe));

    public static readonly NameTable<BlendMode> BlendModes = new(("simplex", BlendMode.Simplex), ("non_negative", BlendMode.NonNegative), ("greedy", BlendMode.Greedy));
}
