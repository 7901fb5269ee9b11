using System.Diagnostics;
using System.Globalization;
using Foldwise.Cli.Output;
using Foldwise.Core.Definition;
using Foldwise.Core.Search;
using Foldwise.Tuning;

namespace Foldwise.Bench.WholeSearch;

/// <summary>What one search did: phases' times, trials done by family and rung, the best single trial, the blend's estimates.</summary>
internal static class Summary
{
    public static void Print(string name, SearchResult result, EventTally tally, SearchDefinition definition)
    {
        var started = tally.Started ?? TimeSpan.Zero;
        var stopped = tally.Stopped ?? tally.Elapsed;
        var blended = tally.Blended ?? stopped;
        Console.WriteLine(
            $"  ended {result.Ending.ToString().ToLowerInvariant()}, stopped: {ProgressView.Describe(tally.Progress?.Stopping)}; preparation {started.TotalSeconds:F1} s, trials {(stopped - started).TotalSeconds:F1} s " +
            $"(budget {definition.Budget.Hours * 3600:F0} s, spent {tally.Progress?.SpentSeconds:F1} s), blend {(blended - stopped).TotalSeconds:F1} s, " +
            $"keeping {((tally.Kept ?? blended) - blended).TotalSeconds:F1} s; whole run {tally.Elapsed.TotalSeconds:F1} s, CPU {Process.GetCurrentProcess().TotalProcessorTime.TotalSeconds:F0} s");
        var done = tally.Trials.Where(t => t.State == TrialState.Done).ToList();
        Console.WriteLine($"  trials done {done.Count}, failed attempts {tally.FailedAttempts}, trials failed {tally.Trials.Count(t => t.State == TrialState.Failed)}");
        foreach (var family in done.GroupBy(t => t.Family).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var rungs = family.GroupBy(t => (t.Rung, t.Budget)).OrderBy(g => g.Key.Rung).ThenBy(g => g.Key.Budget)
                .Select(g => $"rung {g.Key.Rung} ({g.Key.Budget}) {g.Count()}");
            var seconds = family.Where(t => t.Started is not null && t.Finished is not null).Select(t => (t.Finished!.Value - t.Started!.Value).TotalSeconds).ToList();
            Console.WriteLine(string.Create(
                CultureInfo.InvariantCulture,
                $"    {name} {family.Key,-9} {family.Count(),4} done: {string.Join(", ", rungs)}; best {family.Min(t => t.Score):F5}; {seconds.Sum():F0} s in trials, {seconds.Average():F1} s each"));
        }

        if (tally.Blend is { } blend)
        {
            var best = done.Single(t => t.Id == blend.BestSingleTrialId);
            var members = blend.Members.Where(m => m.Weight > 0).Select(m => $"{m.TrialId} {m.Family} {m.Weight:F3}");
            Console.WriteLine(string.Create(
                CultureInfo.InvariantCulture,
                $"  best single trial {blend.BestSingleScore:F5} (trial {best.Id}, {best.Family}, budget {best.Budget}); best done at any rung {done.Min(t => t.Score):F5}"));
            Console.WriteLine(string.Create(
                CultureInfo.InvariantCulture,
                $"  blend {DefinitionWords.Of(blend.Mode)}: nested estimate {blend.NestedScore:F5}, in-sample {blend.InSampleScore:F5}; members {string.Join(", ", members)}"));
        }

        Console.WriteLine($"  {tally.Keeping}");
        Console.WriteLine(string.Create(
            CultureInfo.InvariantCulture,
            $"RESULT {name} done={done.Count} best={tally.Blend?.BestSingleScore:F5} nested={tally.Blend?.NestedScore:F5} trials_s={(stopped - started).TotalSeconds:F0}"));
    }
}
