using Foldwise.Core.Definition;
using Foldwise.Core.Folds;
using Foldwise.Core.Metrics;

namespace Foldwise.Core.Blending;

/// <summary>
/// What the blend stage needs: the options, the pool (see <see cref="BlendPool"/>), the target on the
/// fitting scale, the folds the out-of-fold predictions came from, and the metric that scores them.
/// </summary>
public sealed record BlendInput(BlendOptions Options, IReadOnlyList<BlendCandidate> Pool, double[] Target, FoldPlan Folds, Metric Metric);
