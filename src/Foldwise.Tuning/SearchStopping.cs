namespace Foldwise.Tuning;

/// <summary>
/// How the caller stops a running search. <see cref="Stop"/>: create no more trials, let running ones finish, then
/// blend. <see cref="Abandon"/>: drop running trials (or the blend, if it has begun); everything done is stored.
/// </summary>
public sealed record SearchStopping(CancellationToken Stop, CancellationToken Abandon)
{
    /// <summary>Runs until its budget ends.</summary>
    public static SearchStopping Never { get; } = new(CancellationToken.None, CancellationToken.None);
}
