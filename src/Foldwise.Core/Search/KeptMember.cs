namespace Foldwise.Core.Search;

/// <summary>
/// One kept blend member: its trial, family, blend weight, the file holding its fold models (SHA-256, size, folds),
/// and how far its re-fitted test predictions came from the search's own (relative, absolute below 1, fitting scale).
/// </summary>
public sealed record KeptMember(int TrialId, string Family, double Weight, string Hash, long Bytes, int Folds, double Difference);
