using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Folds;
using Foldwise.Core.Screening;

namespace Foldwise.Tuning;

/// <summary>A search ready to run: screened, aligned tables with their hashes and encodings, the report and the fold plan.</summary>
public sealed record PreparedSearch(
    SearchDefinition Definition,
    FeatureTable Train,
    FeatureTable Test,
    byte[] TrainBytes,
    byte[] TestBytes,
    string TrainHash,
    string TestHash,
    ScreeningReport Screening,
    FoldPlan Folds);
