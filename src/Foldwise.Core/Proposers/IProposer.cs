namespace Foldwise.Core.Proposers;

/// <summary>
/// Chooses a new candidate's parameters for one family from what that family has shown so far.
/// A proposer keeps no state of its own: the same history and the same random stream give the same proposal,
/// which is what lets a resumed search decide exactly as the original one would have.
/// </summary>
public interface IProposer
{
    /// <summary>The name recorded on trials this proposer chose, e.g. <c>random</c> or <c>tpe</c>.</summary>
    string Name { get; }

    Proposal Propose(FamilyHistory history, Random random);
}
