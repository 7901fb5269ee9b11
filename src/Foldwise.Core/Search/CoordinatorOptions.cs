namespace Foldwise.Core.Search;

/// <summary>
/// Lease rules of the coordinator. Defaults: a lease lasts <c>90 s</c> unless renewed (slots renew every
/// third of that), and a trial whose lease is lost <c>3</c> times is failed.
/// </summary>
public sealed record CoordinatorOptions
{
    public TimeSpan LeaseDuration { get; init; } = TimeSpan.FromSeconds(90);

    public int MaxAttempts { get; init; } = 3;

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
    }
}
