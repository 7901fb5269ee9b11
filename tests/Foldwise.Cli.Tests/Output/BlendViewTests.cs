using System.Collections.Immutable;
using Foldwise.Cli.Output;
using Foldwise.Core.Blending;
using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Spectre.Console.Testing;

namespace Foldwise.Cli.Tests.Output;

public sealed class BlendViewTests
{
    [Fact]
    public void Lists_weighted_members_in_the_table_and_names_pooled_trials_that_got_no_weight_below_it()
    {
        // Given a simplex blend that gave trial 7 no weight
        var blend = new BlendSummary(
            BlendMode.Simplex,
            [new BlendMember(3, "lightgbm", 0.7), new BlendMember(7, "fasttree", 0), new BlendMember(5, "fasttree", 0.3)],
            InSampleScore: 0.5,
            NestedScore: 0.51,
            NestedFoldScores: [0.5, 0.52],
            BestSingleTrialId: 3,
            BestSingleScore: 0.52);
        var console = new TestConsole().Width(120);

        // When it is shown
        BlendView.Render(console, blend, Metric.Rmsle, []);

        // Then only the weighted members are rows, heaviest first, and trial 7 is named as pooled with no weight
        var rows = console.Lines.Where(l => l.StartsWith('│')).Select(l => l.Split('│', StringSplitOptions.TrimEntries)[1]).ToList();
        Assert.Equal(["trial", "3", "5"], rows);
        Assert.Contains("Pooled but given no weight: trial 7 (fasttree)", console.Output);
    }
}
