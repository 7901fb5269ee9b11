using System.Diagnostics;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Events;
using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cluster.Workers;

/// <summary>
/// One slot: asks the coordinator for a lease, trains the trial's folds, renews the lease while it works,
/// and reports. It survives the coordinator going away by retrying with a growing pause.
/// </summary>
public sealed partial class SlotRunner(
    string slot,
    IGrainFactory grains,
    TrialDataCache data,
    ILearnerCatalog learners,
    WorkerOptions options,
    SlotStatistics statistics,
    TimeProvider time,
    FoldwiseMetrics metrics,
    IProgress<SearchEvent> events,
    ILogger logger)
{
    private static readonly TimeSpan MaxBackoff = TimeSpan.FromSeconds(5);

    public async Task RunAsync(CancellationToken stopping)
    {
        var backoff = options.PollInterval;
        while (!stopping.IsCancellationRequested)
        {
            try
            {
                bool worked = await StepAsync(stopping);
                backoff = options.PollInterval;
                if (!worked)
                {
                    await Task.Delay(options.PollInterval, time, stopping);
                }
            }
            catch (OperationCanceledException) when (stopping.IsCancellationRequested)
            {
                return;
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                // The coordinator may be restarting or unreachable: wait and ask again.
                LogCoordinatorUnreachable(slot, e.Message.Split('\n')[0].Trim());
                events.Report(new SlotCoordinatorUnreachable(options.Name, slot, e.Message.Split('\n')[0].Trim()));
                await DelayQuietly(backoff, stopping);
                backoff = TimeSpan.FromTicks(Math.Min(MaxBackoff.Ticks, backoff.Ticks * 2));
            }
        }
    }

    /// <summary>Asks once; true when a trial was run.</summary>
    private async Task<bool> StepAsync(CancellationToken stopping)
    {
        string? searchId = options.SearchId ?? (await grains.GetGrain<ISearchBoardGrain>(0).ActiveSearchesAsync()).FirstOrDefault();
        if (searchId is null)
        {
            return false;
        }

        var search = grains.GetGrain<ISearchGrain>(searchId);
        var lease = await search.LeaseAsync(options.Name, slot);
        if (lease.Status != LeaseStatus.Granted)
        {
            return false;
        }

        await RunTrialAsync(searchId, search, lease, stopping);
        return true;
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
            var executor = new TrialExecutor(learners.Get(lease.Family));
            var parameters = ParameterSet.Of(lease.Parameters);
            using var folds = new FoldSpans(span?.Context ?? default, lease.TrialId, trialData.Folds.FoldCount);
            var outcome = await Task.Factory.StartNew(
                () => executor.Run(trialData, parameters, lease.Budget, lease.Seed, options.Threads, abandon.Token, folds.FoldDone),
                abandon.Token,
                TaskCreationOptions.LongRunning,
                TaskScheduler.Default);
            statistics.AddBusy(clock.Elapsed);
            await abandon.CancelAsync();
            var report = new TrialReport(
                lease.TrialId, lease.Attempt, options.Name, slot, outcome.Score, [.. outcome.FoldScores], outcome.OutOfFold, outcome.Test, clock.Elapsed.TotalSeconds);
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
        catch (Exception e) when (e is ArgumentException or InvalidOperationException or IOException or OutOfMemoryException)
        {
            LogTrialFailed(slot, lease.TrialId, e.Message);
            events.Report(new SlotTrialFailed(options.Name, slot, lease.TrialId, lease.Attempt, e.Message));
            ending = "failed";
            span?.SetStatus(ActivityStatusCode.Error, e.Message);
            await ReleaseQuietly(search, lease, $"{e.GetType().Name}: {e.Message}", interrupted: false);
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

    [LoggerMessage(Level = LogLevel.Warning, Message = "Slot {Slot}: coordinator unreachable ({Reason}); retrying")]
    private partial void LogCoordinatorUnreachable(string slot, string reason);
}
