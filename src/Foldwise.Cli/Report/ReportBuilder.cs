using Foldwise.Core.Blending;
using Foldwise.Storage;

namespace Foldwise.Cli.Report;

/// <summary>Reads a store once and builds every chart of the report, in page order.</summary>
public static class ReportBuilder
{
    public static (StoredSearch Search, IReadOnlyList<ChartSection> Charts) Build(string storeFileOrFolder)
    {
        using var store = SearchStore.OpenReadOnly(Path.GetFullPath(StoreFile.Resolve(storeFileOrFolder)));
        var search = StoredSearch.Load(store);
        double[]? blended = BlendedOutOfFold(store, search.Blend);
        var charts = new List<ChartSection>
        {
            BestOverTimeChart.Build(search),
            RungReachChart.Build(search),
        };
        charts.AddRange(ParameterCharts.Build(search));
        charts.Add(BlendWeightsChart.Build(search));
        charts.Add(OutOfFoldChart.Build(search, blended));
        charts.Add(TimelineChart.Build(search));
        charts.Add(ScreeningSummary.Build(search));
        charts.Add(NoiseFloorChart.Build(search));
        return (search, charts);
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
