namespace Foldwise.Core.Search;

/// <summary>
/// Lease rules of the coordinator. Defaults: a lease lasts <c>90 s</c> unless renewed (slots renew every
/// third of that), a trial whose lease is lost <c>3</c> times is failed, and an idle slot backs up a trial
/// running twice as long as expected.
/// </summary>
public sealed record CoordinatorOptions
{
    public TimeSpan LeaseDuration { get; init; } = TimeSpan.FromSeconds(90);

    public int MaxAttempts { get; init; } = 3;

    /// <summary>
    /// An idle slot runs a backup copy of a trial that has run this many times its expected time
    /// (see <see cref="StragglerWatch"/>). Null: never. Default 2.
    /// </summary>
    public double? BackupAfter { get; init; } = 2.0;

    /// <summary>Finished trials needed before a trial can be called overdue. Default 5.</summary>
    public int BackupMinimumDone { get; init; } = 5;

    /// <summary>
    /// A worker whose trials fail this many times in a row, while another worker has finished trials, is quarantined:
    /// it gets no more work in this session. Default 3.
    /// </summary>
    public int QuarantineAfter { get; init; } = 3;

    public void Validate()
    {
        if (LeaseDuration <= TimeSpan.Zero)
        {
            throw new ArgumentOutOfRangeException(nameof(LeaseDuration), LeaseDuration, "a lease must last longer than zero");
        }

        if (MaxAttempts < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(MaxAttempts), MaxAttempts, "a trial needs at least one attempt");
        }

        if (QuarantineAfter < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(QuarantineAfter), QuarantineAfter, "quarantine needs at least one failure");
        }

        if (BackupAfter is <= 1.0)
        {
            throw new ArgumentOutOfRangeException(nameof(BackupAfter), BackupAfter, "a backup copy needs a trial overdue by more than its expected time");
        }
    }
}
