namespace Foldwise.Core.Search;

/// <summary>One kept blend member: its trial, family, blend weight, and the file holding its fold models (SHA-256, size).</summary>
public sealed record KeptMember(int TrialId, string Family, double Weight, string Hash, long Bytes, int Folds);
