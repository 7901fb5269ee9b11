using System.Collections.Immutable;

namespace Foldwise.Core.Data;

/// <summary>A test table reshaped to the training features, and the test columns it had beyond them (dropped).</summary>
public sealed record AlignedTest(FeatureTable Table, ImmutableArray<string> ExtraColumns);
