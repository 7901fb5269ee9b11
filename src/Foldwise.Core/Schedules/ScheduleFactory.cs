using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Search;

namespace Foldwise.Core.Schedules;

/// <summary>Builds the schedule and proposer a definition asks for (the defaults: ASHA with TPE), seeded by its Seed.</summary>
public static class ScheduleFactory
{
    /// <param name="tpe">TPE settings other than the defaults (benchmarks compare them); ignored for random proposals.</param>
    public static ISchedule Create(SearchDefinition definition, TpeOptions? tpe = null)
    {
        var options = definition.Schedule;
        var proposer = CreateProposer(options.Proposer, tpe);
        return options.Kind switch
        {
            ScheduleKind.Full => new FullBudgetSchedule(definition.Families, options, proposer, definition.Seed),
            ScheduleKind.Asha => new AshaSchedule(definition.Families, options, proposer, definition.Seed, definition.Folds),
            ScheduleKind.Hyperband => new HyperbandSchedule(definition.Families, options, proposer, definition.Seed, definition.Folds),
            _ => throw new ArgumentOutOfRangeException(nameof(definition), options.Kind, "unknown schedule kind"),
        };
    }

    public static IProposer CreateProposer(ProposerKind kind, TpeOptions? tpe = null) => kind switch
    {
        ProposerKind.Random => new RandomProposer(),
        ProposerKind.Tpe => new TpeProposer(tpe),
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "unknown proposer kind"),
    };
}
