using Foldwise.Core.Spaces;

namespace Foldwise.Core.Proposers;

/// <summary>A proposed parameter set and who actually chose it (TPE reports <c>random</c> while it is still starting up).</summary>
public sealed record Proposal(ParameterSet Parameters, string Proposer);
