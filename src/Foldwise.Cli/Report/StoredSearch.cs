using Foldwise.Core.Blending;
using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Storage;

namespace Foldwise.Cli.Report;

/// <summary>
/// One read of a search's store for <c>show</c>, <c>status</c> and <c>report</c>: header, definition, trials,
/// screening, blend and kept models as they were at the moment of reading (the store may be written meanwhile).
/// </summary>
public sealed record StoredSearch(
    string StorePath,
    SearchHeader Header,
    SearchDefinition Definition,
    IReadOnlyList<TrialRecord> Trials,
    ScreeningReport? Screening,
    BlendSummary? Blend,
    KeptModels? Kept = null)
{
    public Metric Metric => Metric.For(Definition.Metric);

    /// <summary>Opens the store read-only (a file or its folder), reads everything but the vectors, and closes it.</summary>
    public static StoredSearch Load(string fileOrFolder)
    {
        string path = Path.GetFullPath(StoreFile.Resolve(fileOrFolder));
        using var store = SearchStore.OpenReadOnly(path);
        return Load(store);
    }

    public static StoredSearch Load(SearchStore store)
    {
        var (header, definition) = HeaderOf(store);
        return new StoredSearch(store.FilePath, header, definition, store.LoadTrials(), store.LoadScreening(), store.LoadBlend(), store.LoadKept());
    }

    /// <summary>The search's header and its definition as stored (paths in it are absolute already).</summary>
    public static (SearchHeader Header, SearchDefinition Definition) HeaderOf(SearchStore store)
    {
        ArgumentNullException.ThrowIfNull(store);
        var header = store.LoadHeader() ?? throw new StoreException($"{store.FilePath} holds no search yet (no header).");
        return (header, header.Definition);
    }

    /// <summary>The kept model file of a blend member, as <c>models/SHA256.fwm</c>, or null when the trial's models are not kept.</summary>
    public KeptMember? KeptMemberOf(int trialId) => Kept?.Members.FirstOrDefault(m => m.TrialId == trialId);

    /// <summary>The space a family's trials were drawn from, or null for a family the definition does not name.</summary>
    public ParameterSpace? SpaceOf(string family) => Definition.Families.FirstOrDefault(f => f.Family == family)?.Space;

    /// <summary>The parameter's value as a person reads it (choice name, whole number, short real).</summary>
    public string Display(string family, string parameter, double value) =>
        SpaceOf(family)?.Find(parameter)?.Display(value) ?? value.ToString("G4", System.Globalization.CultureInfo.InvariantCulture);
}
