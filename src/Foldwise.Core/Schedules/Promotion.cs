namespace Foldwise.Core.Schedules;

/// <summary>The proposer name a schedule records on a trial that continues a finished one at a higher budget.</summary>
public static class Promotion
{
    public const string ProposerName = "promotion";
}
