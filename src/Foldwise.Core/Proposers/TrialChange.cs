namespace Foldwise.Core.Proposers;

/// <summary>What one observed record changed: whether the trial is new, and whether it just reached Done or Failed.</summary>
public readonly record struct TrialChange(bool Created, bool Finished)
{
    public static TrialChange None => default;
}
