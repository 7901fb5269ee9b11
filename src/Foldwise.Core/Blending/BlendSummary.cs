using System.Collections.Immutable;
using Foldwise.Core.Definition;

namespace Foldwise.Core.Blending;

/// <summary>
/// The chosen blend as stored with the search: every pool member with its weight, the in-sample
/// score of the blended out-of-fold predictions, the nested estimate (weights fitted without the fold
/// they are scored on) with each fold's score, and the best single trial for comparison.
/// All scores are on the fitting scale.
/// </summary>
public sealed record BlendSummary(
    BlendMode Mode,
    ImmutableArray<BlendMember> Members,
    double InSampleScore,
    double NestedScore,
    ImmutableArray<double> NestedFoldScores,
    int BestSingleTrialId,
    double BestSingleScore);
