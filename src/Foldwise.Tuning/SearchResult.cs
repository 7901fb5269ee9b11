using Foldwise.Core.Blending;

namespace Foldwise.Tuning;

/// <summary>What a run of the search use case leaves: how it ended, where, and the blend when one was solved.</summary>
public sealed record SearchResult(SearchEnding Ending, string SearchId, string OutDir, BlendSummary? Blend)
{
    /// <summary>The blended test predictions (written when <see cref="Ending"/> is <see cref="SearchEnding.Blended"/>).</summary>
    public string PredictionFile => Path.Combine(OutDir, BlendStep.PredictionFileName);

    /// <summary>The write the store refused (e.g. "IOException: No space left on device") when <see cref="Ending"/> is <see cref="SearchEnding.StoreFailed"/>.</summary>
    public string? StoreFault { get; init; }
}
