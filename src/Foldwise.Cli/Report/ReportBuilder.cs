using Foldwise.Core.Blending;
using Foldwise.Storage;

namespace Foldwise.Cli.Report;

/// <summary>
/// Reads a store once and builds the report's parts in page order: first what the search found (how far candidates
/// got, the noise floor, the blend and its diversity, the blend's fit), then whether the definition's ranges were well
/// placed, then how the search spent its time and which columns it saw.
/// </summary>
public static class ReportBuilder
{
    public static (StoredSearch Search, IReadOnlyList<ReportPart> Parts) Build(string storeFileOrFolder)
    {
        using var store = SearchStore.OpenReadOnly(Path.GetFullPath(StoreFile.Resolve(storeFileOrFolder)));
        var search = StoredSearch.Load(store);
        double[]? blended = BlendedOutOfFold(store, search.Blend);
        var pooled = search.Blend?.Members.Select(m => store.LoadVectors(m.TrialId)?.OutOfFold
            ?? throw new StoreException($"{store.FilePath}: blend member {m.TrialId} has no stored predictions")).ToList();
        return (search,
        [
            new ReportPart(
                "found",
                "What the search found",
                "How far candidates got, how large a difference the folds can resolve, and what the blend made of the best trials.",
                [RungReachChart.Build(search), NoiseFloorChart.Build(search), BlendWeightsChart.Build(search), CorrelationTable.Build(search, pooled), OutOfFoldChart.Build(search, blended)]),
            new ReportPart(
                "ranges",
                "Were the definition's ranges well placed?",
                "Each candidate once, at its first rung, coloured by family (" + ReportPage.Swatches(search) + "), one chart per parameter in the definition's order. " +
                "Where the best scores crowd against one end of a range, better values may lie beyond it: widen the range there.",
                ParameterCharts.Build(search)),
            new ReportPart(
                "time",
                "How the search spent its time",
                "Whether more hours would have bought better candidates, where each slot's hours went, and which columns never reached a learner.",
                [BestOverTimeChart.Build(search), TimelineChart.Build(search), ScreeningSummary.Build(search)]),
        ]);
    }

    /// <summary>Σ weight × member OOF vector over the members with a weight; null without a blend.</summary>
    public static double[]? BlendedOutOfFold(SearchStore store, BlendSummary? blend)
    {
        ArgumentNullException.ThrowIfNull(store);
        if (blend is null)
        {
            return null;
        }

        var members = blend.Members.Where(m => m.Weight > 0).ToList();
        var vectors = members.Select(m => store.LoadVectors(m.TrialId)?.OutOfFold
            ?? throw new StoreException($"{store.FilePath}: blend member {m.TrialId} has no stored predictions")).ToList();
        return BlendStage.Combine([.. members.Select(m => m.Weight)], [.. vectors]);
    }
}
