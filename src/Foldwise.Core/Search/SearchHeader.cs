using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Folds;

namespace Foldwise.Core.Search;

/// <summary>
/// The search-level facts the store keeps so that resume, blend and export need nothing else:
/// the definition, the fold plan, the screened tables' content hashes, the row ids
/// of both tables, the training target on the original scale, and the wall-clock time spent so far.
/// </summary>
public sealed record SearchHeader
{
    public required string SearchId { get; init; }

    /// <summary>The definition the search runs, paths absolute (the store keeps it in a form of its own, not the file's syntax).</summary>
    public required SearchDefinition Definition { get; init; }

    public required FoldPlan Folds { get; init; }

    public required string TrainHash { get; init; }

    public required string TestHash { get; init; }

    public required ImmutableArray<string> TrainIds { get; init; }

    public required ImmutableArray<string> TestIds { get; init; }

    public required ImmutableArray<double> TrainTarget { get; init; }

    public required DateTimeOffset Created { get; init; }

    /// <summary>Wall-clock seconds the search has run over all its sessions; the hours budget counts these.</summary>
    public double SpentSeconds { get; init; }

    /// <summary>True once the search reached its budget and its blend is stored.</summary>
    public bool Finished { get; init; }
}
