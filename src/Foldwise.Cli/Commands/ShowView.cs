using System.Globalization;
using Foldwise.Cli.Output;
using Foldwise.Cli.Report;
using Foldwise.Core.Blending;
using Foldwise.Core.Schedules;
using Foldwise.Core.Screening;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Spectre.Console;

namespace Foldwise.Cli.Commands;

/// <summary>One trial as a person reads it: what it was, how it scored fold by fold, where and how long it ran, and what went wrong.</summary>
public static class ShowView
{
    private static readonly CultureInfo Invariant = CultureInfo.InvariantCulture;

    /// <summary>Where the trial's fold models are kept (the file and its SHA-256), or why they are not.</summary>
    internal static string KeptText(StoredSearch search, TrialRecord t) => search.KeptMemberOf(t.Id) is { } kept
        ? $"{Tuning.KeptModelFiles.FolderName}/{kept.Hash}.fwm ({kept.Folds} fold models, {(kept.Bytes / 1e6).ToString("F2", Invariant)} MB, blend weight {kept.Weight.ToString("F4", Invariant)})"
        : search.Kept is null ? "none: the search kept no models ('foldwise blend STORE' keeps the blend's)" : "none: not a member of the kept blend";

    /// <summary>The trial's place in the stored blend.</summary>
    internal static string BlendText(BlendSummary blend, TrialRecord t) => blend.Members.FirstOrDefault(m => m.TrialId == t.Id) is { } member
        ? member.Weight > 0 ? $"member with weight {member.Weight.ToString("F4", Invariant)}." : "pooled, given no weight."
        : "not pooled.";

    public static void Render(IAnsiConsole console, StoredSearch search, TrialRecord t)
    {
        string metric = search.Metric.Name;
        console.MarkupLine($"[bold]Trial {t.Id}[/]: {t.Family}, {t.State.ToString().ToLowerInvariant()}");
        var facts = new Grid().AddColumn(new GridColumn().NoWrap()).AddColumn();
        void Fact(string name, string value) => facts.AddRow(name, Markup.Escape(value));

        // No bracket: a schedule without brackets (plain ASHA, full budget).
        int? bracket = BracketNumbers.For(search.Definition).Of(t.Family, t.Bracket);
        string unit = FamilyDescriptors.UnitOf(t.Family).Many;
        int foldCount = search.Definition.Folds;
        string Reach(TrialRecord r) => $"{r.Budget} {unit}{(r.AllFolds ? "" : $" on the first {r.Folds} of {foldCount} folds")}";
        Fact("rung", $"{t.Rung}{(bracket is { } b ? $" (bracket {b})" : "")}, {Reach(t)}");
        Fact("proposed by", t.ParentId is { } p ? $"{t.Proposer} of trial {p}" : t.Proposer);
        var chain = ShowLineage.Chain(t, search.Trials);
        if (chain.Count > 1)
        {
            Fact("parent chain", string.Join(" ← ", chain.Select(c => $"{c.Id} ({Reach(c)}{ScoreText(c.Score)})")));
        }

        var children = ShowLineage.Children(t, search.Trials);
        if (children.Count > 0)
        {
            Fact("promoted to", string.Join(", ", children.Select(c => $"{c.Id} ({Reach(c)})")));
        }

        Fact($"OOF {metric}", t.Score?.ToString("F5", Invariant) ?? "not scored");
        if (t.BestRound is { } best)
        {
            Fact("best round", $"{best} of {t.Budget} {unit}, kept for its predictions");
        }

        if (t.RoundsContinued > 0)
        {
            Fact("continued", $"{t.RoundsContinued} {unit} of its screen's fold models{(t.ParentId is { } screen ? $" (trial {screen})" : "")}, not trained again");
        }

        if (t.FoldScores.Length > 0)
        {
            Fact("fold scores", string.Join("  ", t.FoldScores.Select(s => s.ToString("F5", Invariant))));
            Fact("fold spread", t.FoldScores.Length > 1
                ? $"sd {BlendView.Spread(t.FoldScores).ToString("F5", Invariant)}, range {t.FoldScores.Min().ToString("F5", Invariant)} to {t.FoldScores.Max().ToString("F5", Invariant)}"
                : "one fold only");
        }

        Fact("machine/slot", t.Worker is null ? "not leased yet" : $"{t.Worker}/{t.Slot}");
        Fact("started", t.Started?.ToString("u", Invariant) ?? "");
        Fact("finished", t.Finished?.ToString("u", Invariant) ?? "");
        Fact("duration", t.Duration is { } d ? $"{d.TotalSeconds.ToString("F1", Invariant)} s" : "");
        Fact("attempts", $"{t.Attempt} ({t.Failures} lost)");
        Fact("kept models", KeptText(search, t));
        if (search.Blend is { } blend)
        {
            Fact("blend", BlendText(blend, t) + " " + BlendView.CarriedBy(blend, search.Definition.Families.Select(f => f.Family)));
        }

        foreach (string lost in t.LostAttempts)
        {
            Fact("  lost attempt", lost);
        }

        if (t.FailureReason is { } reason)
        {
            Fact("failure", reason);
        }

        console.Write(facts);
        RenderParameters(console, search, t);
        RenderInputs(console, search);
    }

    /// <summary>What every fold did with the table's category columns and gaps (the same for every trial of the search).</summary>
    private static void RenderInputs(IAnsiConsole console, StoredSearch search)
    {
        var lines = search.Screening is { } report ? ColumnNotes.Lines(report, search.Definition.Families).ToList() : [];
        if (lines.Count == 0)
        {
            return;
        }

        console.MarkupLine("[bold]Inputs[/] (encoded inside each fold from its training rows):");
        foreach (string line in lines)
        {
            console.MarkupLine("  " + Markup.Escape(line));
        }
    }

    private static void RenderParameters(IAnsiConsole console, StoredSearch search, TrialRecord t)
    {
        var space = search.SpaceOf(t.Family);
        var table = new Table().Border(TableBorder.Simple).AddColumns("parameter", "value", "searched over");
        foreach (var (name, value) in t.Parameters.Values)
        {
            var range = space?.Find(name);
            table.AddRow(Markup.Escape(name), Markup.Escape(search.Display(t.Family, name, value)), Markup.Escape(range is null ? "" : RangeText(range)));
        }

        console.Write(table);
    }

    /// <summary>E.g. <c>0.005 to 0.3 (log)</c>, <c>gbdt | dart</c>, <c>fixed</c>.</summary>
    public static string RangeText(Core.Spaces.ParameterRange range) => range switch
    {
        { IsFixed: true } => "fixed",
        { Kind: Core.Spaces.ParameterKind.OneOf } => string.Join(" | ", range.Choices),
        { Kind: Core.Spaces.ParameterKind.Log } => $"{range.Display(range.Low)} to {range.Display(range.High)} (log)",
        _ => $"{range.Display(range.Low)} to {range.Display(range.High)}",
    };

    private static string ScoreText(double? score) => score is { } s ? $", {s.ToString("F5", Invariant)}" : "";
}
