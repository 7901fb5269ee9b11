using Foldwise.Core.Definition;

namespace Foldwise.Core.Events;

/// <summary>The search's coordinator is about to start, with this many slots of its own.</summary>
public sealed record SearchStarted(string SearchId, SearchDefinition Definition, int LocalSlots) : SearchEvent;
