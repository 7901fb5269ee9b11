using System.Collections.Immutable;
using Foldwise.Core.Blending;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;

namespace Foldwise.Core.Events;

/// <summary>The blend is stored and its predictions written (<paramref name="Predictions"/> rows in <paramref name="PredictionFile"/>).</summary>
public sealed record BlendSolved(BlendSummary Summary, MetricKind Metric, ImmutableArray<TrialRecord> Trials, string PredictionFile, int Predictions) : SearchEvent;
