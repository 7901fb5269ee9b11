namespace Foldwise.Core.Learning;

/// <summary>
/// Which trial a run carries out and which it was promoted from: a worker's <see cref="ScreenedFits"/> keeps a
/// screened trial's folds under its id, and a promotion to every fold takes over its parent's.
/// </summary>
public readonly record struct TrialLineage(int TrialId, int? ParentId);
