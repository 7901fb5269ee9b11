using Foldwise.Core.Definition;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Bench.Cluster;

internal static class BenchDefinitions
{
    public static SearchDefinition Asha(int trials, ProposerKind proposer) => new()
    {
        Name = "bench",
        Data = new DataSource("train.csv", "test.csv", "id", "y"),
        Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm)],
        Schedule = new ScheduleOptions(ScheduleKind.Asha, proposer, 25, 675, 3),
        Budget = new SearchBudget(trials, null),
    };
}

/// <summary>Commits nothing: the benchmark measures the coordinator, not a store.</summary>
internal sealed class NullJournal : ITrialJournal
{
    public void Save(TrialRecord trial)
    {
        // Discarded on purpose.
    }
}
