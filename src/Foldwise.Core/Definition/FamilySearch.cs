using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>One family taking part in a search, with the space its candidates are drawn from.</summary>
public sealed record FamilySearch(string Family, ParameterSpace Space);
