using System.Diagnostics;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Events;
using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cluster.Workers;

/// <summary>
/// One slot: asks the coordinator for a lease of a family its worker offers, trains the trial's folds, renews the
/// lease while it works, and reports. Any failure of a trial releases its lease at once with the reason. It survives
/// the coordinator going away by retrying with a growing pause.
/// </summary>
public sealed partial class SlotRunner(
    string slot,
    string[] families,
    IGrainFactory grains,
    TrialDataCache data,
    ILearnerCatalog learners,
    ScreenedFits screens,
    WorkerOptions options,
    SlotStatistics statistics,
    TimeProvider time,
    FoldwiseMetrics metrics,
    IProgress<SearchEvent> events,
    ILogger logger)
{
    private static readonly TimeSpan MaxBackoff = TimeSpan.FromSeconds(5);

    /// <summary>How long a quarantined slot waits before asking again (a new search may take it).</summary>
    private static readonly TimeSpan QuarantinePause = TimeSpan.FromSeconds(30);

    private bool unreachable;
    private bool searchFinished;
    private string? quarantinedIn;

    public async Task RunAsync(CancellationToken stopping)
    {
        var backoff = options.PollInterval;
        while (!stopping.IsCancellationRequested)
        {
            try
            {
                var pause = await StepAsync(stopping);
                backoff = options.PollInterval;
                unreachable = false;
                if (pause > TimeSpan.Zero)
                {
                    await Task.Delay(pause, time, stopping);
                }
            }
            catch (OperationCanceledException) when (stopping.IsCancellationRequested)
            {
                return;
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                // The coordinator may be restarting or unreachable: wait and ask again. The worker host says what it
                // sees of the cluster; a slot warns once per outage, not at every retry, and not at all when the search
                // it worked on had finished (its coordinator is expected to go).
                if (!unreachable && !searchFinished)
                {
                    string reason = e.Message.Split('\n')[0].Trim();
                    LogCoordinatorUnreachable(slot, reason);
                    events.Report(new SlotCoordinatorUnreachable(options.Name, slot, reason));
                    unreachable = true;
                }

                await DelayQuietly(backoff, stopping);
                backoff = TimeSpan.FromTicks(Math.Min(MaxBackoff.Ticks, backoff.Ticks * 2));
            }
        }
    }

    /// <summary>Asks once; returns how long to wait before asking again (zero after a trial ran).</summary>
    private async Task<TimeSpan> StepAsync(CancellationToken stopping)
    {
        string? searchId = options.SearchId ?? (await grains.GetGrain<ISearchBoardGrain>(0).ActiveSearchesAsync()).FirstOrDefault();
        if (searchId is null)
        {
            return options.PollInterval;
        }

        var search = grains.GetGrain<ISearchGrain>(searchId);
        var lease = await search.LeaseAsync(options.Name, slot, families);
        if (lease.Status == LeaseStatus.Quarantined)
        {
            if (quarantinedIn != searchId)
            {
                string reason = lease.Reason ?? "no reason given";
                LogQuarantined(slot, searchId, reason);
                events.Report(new SlotQuarantined(options.Name, slot, searchId, reason));
                quarantinedIn = searchId;
            }

            return QuarantinePause;
        }

        searchFinished = lease.Status == LeaseStatus.Finished;
        if (lease.Status != LeaseStatus.Granted)
        {
            return options.PollInterval;
        }

        await RunTrialAsync(searchId, search, lease, stopping);
        return TimeSpan.Zero;
    }

    private async Task RunTrialAsync(string searchId, ISearchGrain search, LeaseReply lease, CancellationToken stopping)
    {
        using var abandon = CancellationTokenSource.CreateLinkedTokenSource(stopping);
        var renewing = RenewAsync(search, lease, abandon);
        var clock = Stopwatch.StartNew();
        using var span = FoldwiseTelemetry.Source.StartActivity(FoldwiseTelemetry.TrialSpan, ActivityKind.Consumer, TraceParent.Parse(lease.TraceParent));
        span?.SetTag(FoldwiseTelemetry.SearchTag, searchId).SetTag("foldwise.trial", lease.TrialId).SetTag("foldwise.attempt", lease.Attempt)
            .SetTag(FoldwiseTelemetry.FamilyTag, lease.Family).SetTag("foldwise.budget", lease.Budget).SetTag("foldwise.worker", options.Name).SetTag("foldwise.slot", slot);
        metrics.SlotBusy();
        string ending = "lost";
        try
        {
            var trialData = await data.GetAsync(searchId, abandon.Token);
            var executor = new TrialExecutor(learners.Get(lease.Family), RoundStopping.Default, screens);
            var parameters = ParameterSet.Of(lease.Parameters);
            int foldCount = lease.Folds == 0 ? trialData.Folds.FoldCount : lease.Folds;
            using var folds = new FoldSpans(span?.Context ?? default, lease.TrialId, foldCount);
            var advancing = new ReportPace(time);
            var outcome = await Task.Factory.StartNew(
                () => executor.Run(
                    trialData,
                    parameters,
                    lease.Budget,
                    lease.Seed,
                    options.Threads,
                    abandon.Token,
                    fold =>
                    {
                        folds.FoldDone(fold);
                        events.Report(new SlotFoldFitted(options.Name, slot, lease.TrialId, fold, foldCount, clock.Elapsed));
                    },
                    lease.PredictsTest,
                    (ready, round) =>
                    {
                        if (advancing.Due(out _))
                        {
                            events.Report(new SlotTrialAdvanced(options.Name, slot, lease.TrialId, ready, foldCount, round, lease.Budget, clock.Elapsed));
                        }
                    },
                    lease.Folds == 0 ? null : lease.Folds,
                    new TrialLineage(lease.TrialId, lease.ParentId)),
                abandon.Token,
                TaskCreationOptions.LongRunning,
                TaskScheduler.Default);
            statistics.AddBusy(clock.Elapsed);
            await abandon.CancelAsync();
            var report = new TrialReport(
                lease.TrialId, lease.Attempt, options.Name, slot, outcome.Score, [.. outcome.FoldScores], outcome.OutOfFold, outcome.Test, clock.Elapsed.TotalSeconds, outcome.BestRound, outcome.RoundsContinued);
            bool accepted = await search.ReportAsync(report);
            ending = "scored";
            span?.SetTag("foldwise.score", outcome.Score).SetTag("foldwise.accepted", accepted);
            LogTrialDone(slot, lease.TrialId, lease.Attempt, outcome.Score, clock.Elapsed.TotalSeconds, accepted);
            events.Report(new SlotTrialScored(options.Name, slot, lease.TrialId, lease.Attempt, outcome.Score, clock.Elapsed, accepted));
        }
        catch (OperationCanceledException) when (stopping.IsCancellationRequested)
        {
            ending = "interrupted";
            await ReleaseQuietly(search, lease, "the worker stopped", interrupted: true);
            throw;
        }
        catch (OperationCanceledException)
        {
            // The lease was lost (renewal refused): another attempt owns the trial now.
            LogLeaseLost(slot, lease.TrialId, lease.Attempt);
            events.Report(new SlotLeaseLost(options.Name, slot, lease.TrialId, lease.Attempt));
        }
        catch (Exception e) when (e is not OperationCanceledException)
        {
            // Whatever failed (the learner, a native library, the table), the trial goes back at once with the reason,
            // instead of holding its lease until it expires.
            string reason = $"{e.GetType().Name}: {e.Message.Split('\n')[0].Trim()}";
            LogTrialFailed(slot, lease.TrialId, reason);
            events.Report(new SlotTrialFailed(options.Name, slot, lease.TrialId, lease.Attempt, reason));
            ending = "failed";
            span?.SetStatus(ActivityStatusCode.Error, reason);
            await ReleaseQuietly(search, lease, reason, interrupted: false);
        }
        finally
        {
            metrics.SlotIdle();
            metrics.TrialEnded(lease.Family, ending, clock.Elapsed.TotalSeconds);
            span?.SetTag(FoldwiseTelemetry.OutcomeTag, ending);
            await abandon.CancelAsync();
            await renewing;
        }
    }

    private async Task RenewAsync(ISearchGrain search, LeaseReply lease, CancellationTokenSource abandon)
    {
        var every = TimeSpan.FromTicks(Math.Max(TimeSpan.FromMilliseconds(100).Ticks, lease.LeaseDuration.Ticks / 3));
        while (!abandon.IsCancellationRequested)
        {
            try
            {
                await Task.Delay(every, time, abandon.Token);
                if (!await search.RenewAsync(lease.TrialId, lease.Attempt))
                {
                    await abandon.CancelAsync();
                }
            }
            catch (OperationCanceledException)
            {
                return;
            }
            catch (Exception e)
            {
                // A missed renewal is not fatal: the lease lasts three renewal periods.
                LogRenewFailed(slot, lease.TrialId, e.Message);
            }
        }
    }

    private async Task ReleaseQuietly(ISearchGrain search, LeaseReply lease, string reason, bool interrupted)
    {
        try
        {
            await search.ReleaseAsync(lease.TrialId, lease.Attempt, reason, interrupted).WaitAsync(TimeSpan.FromSeconds(5));
        }
        catch (Exception e)
        {
            // The lease will expire on its own.
            LogRenewFailed(slot, lease.TrialId, e.Message);
        }
    }

    private async Task DelayQuietly(TimeSpan delay, CancellationToken stopping)
    {
        try
        {
            await Task.Delay(delay, time, stopping);
        }
        catch (OperationCanceledException)
        {
            // Stopping.
        }
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Slot {Slot}: trial {TrialId} attempt {Attempt} scored {Score:F5} in {Seconds:F1} s (accepted: {Accepted})")]
    private partial void LogTrialDone(string slot, int trialId, int attempt, double score, double seconds, bool accepted);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Slot {Slot}: lost the lease of trial {TrialId} attempt {Attempt}; dropping it")]
    private partial void LogLeaseLost(string slot, int trialId, int attempt);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Slot {Slot}: trial {TrialId} failed: {Reason}")]
    private partial void LogTrialFailed(string slot, int trialId, string reason);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Slot {Slot}: could not renew or release trial {TrialId}: {Reason}")]
    private partial void LogRenewFailed(string slot, int trialId, string reason);

    [LoggerMessage(Level = LogLevel.Error, Message = "Slot {Slot}: quarantined by search {SearchId}: {Reason}")]
    private partial void LogQuarantined(string slot, string searchId, string reason);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Slot {Slot}: coordinator unreachable ({Reason}); retrying")]
    private partial void LogCoordinatorUnreachable(string slot, string reason);
}
