using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Screening;

namespace Foldwise.Core.Events;

/// <summary>
/// Screening decided which columns stay; <paramref name="MinNonZero"/> is the threshold it applied;
/// <paramref name="Families"/> are the search's families, whose forms of few-level category columns the summary names.
/// </summary>
public sealed record ColumnsScreened(ScreeningReport Report, int MinNonZero, ImmutableArray<FamilySearch> Families) : SearchEvent;
