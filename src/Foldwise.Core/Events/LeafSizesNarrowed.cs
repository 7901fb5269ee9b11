using System.Collections.Immutable;

namespace Foldwise.Core.Events;

/// <summary>The folds are too small for some families' leaf-size ranges, which were narrowed; one sentence per change.</summary>
public sealed record LeafSizesNarrowed(ImmutableArray<string> Changes) : SearchEvent;
