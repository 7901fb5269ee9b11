using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Folds;
using Foldwise.Core.Screening;

namespace Foldwise.Tuning;

/// <summary>A search ready to run: screened, aligned tables, the report and the fold plan (<see cref="TableFiles"/> encodes the tables).</summary>
public sealed record PreparedSearch(
    SearchDefinition Definition,
    FeatureTable Train,
    FeatureTable Test,
    ScreeningReport Screening,
    FoldPlan Folds);
