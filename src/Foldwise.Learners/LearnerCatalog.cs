using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;

namespace Foldwise.Learners;

/// <summary>The learner families a worker can run, by name; <see cref="BuiltIn"/> holds every built-in family.</summary>
public sealed class LearnerCatalog : ILearnerCatalog
{
    private readonly Dictionary<string, IFoldLearner> byFamily;

    private LearnerCatalog(IEnumerable<IFoldLearner> learners)
    {
        byFamily = learners.ToDictionary(l => l.Family, StringComparer.Ordinal);
        Families = [.. byFamily.Keys];
    }

    public static LearnerCatalog BuiltIn { get; } = new([new LightGbmLearner(), new FastTreeLearner(), new ForestLearner(), new GamLearner(), new LinearLearner()]);

    public IReadOnlyList<string> Families { get; }

    public IFoldLearner Get(string family) =>
        family is not null && byFamily.TryGetValue(family, out var learner)
            ? learner
            : throw new ArgumentException($"unknown learner family '{family}'; this worker runs {string.Join(", ", Families)}", nameof(family));

    public IReadOnlyList<string> MissingLibraries() => NativePrerequisites.Missing();

    /// <summary>Whether every built-in family name has a learner here (a test pins it against <see cref="FamilyNames.All"/>).</summary>
    internal bool Covers(IEnumerable<string> families) => families.All(byFamily.ContainsKey);
}
