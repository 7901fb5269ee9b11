using System.Net;
using System.Runtime.InteropServices;
using Foldwise.Cli.Output;
using Foldwise.Cli.Running;
using Foldwise.Tuning;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Telemetry;
using Foldwise.Cluster.Workers;
using Foldwise.Core.Data;
using Foldwise.Core.Events;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise worker</c>: offers this machine's slots to a coordinator until Ctrl-C or SIGTERM; rejoins by itself.</summary>
public sealed class WorkerCommand(IAnsiConsole console) : AsyncCommand<WorkerSettings>
{
    public override async Task<int> ExecuteAsync(CommandContext context, WorkerSettings settings, CancellationToken cancellationToken)
    {
        if (settings.ClearCache)
        {
            string folder = settings.Cache ?? new WorkerOptions().CacheDirectory;
            console.MarkupLine($"Deleted {CacheFolder.Clear(folder)} cached table(s) from {Markup.Escape(folder)}");
            return ExitCodes.Ok;
        }

        IPEndPoint join;
        try
        {
            join = LocalAddress.ParseJoin(settings.Join);
        }
        catch (Exception e) when (e is FormatException or System.Net.Sockets.SocketException)
        {
            throw new InputException("--join", e.Message);
        }

        var options = new WorkerOptions { Slots = settings.Slots, ThreadsPerSlot = settings.Threads };
        options.Name = settings.Name ?? options.Name;
        options.CacheDirectory = settings.Cache ?? options.CacheDirectory;
        options.LeaveWhenDone = settings.LeaveWhenDone;
        options.CacheLimitBytes = (long)(settings.CacheLimit * (1L << 30));
        var role = new ClusterRole
        {
            IsCoordinator = false,
            Join = join,
            SiloPort = settings.Port,
            Advertise = settings.Advertise is { } advertise ? IPAddress.Parse(advertise) : LocalAddress.Facing(join),
            SiloName = options.Name,
            Certificate = ClusterTrust.Load(settings.Cert, settings.Passphrase),
            Verbose = settings.Verbose,
        };

        if (OpenCluster.Refusal("worker", role.Advertise, role.Certificate is not null, settings.OpenCluster) is { } refused)
        {
            await Console.Error.WriteLineAsync($"foldwise: {refused}");
            return ExitCodes.Usage;
        }

        if (OpenCluster.Warning(role.Advertise, role.Certificate is not null) is { } risk)
        {
            // stderr, with the other warnings: stdout may be the --json event stream.
            await Console.Error.WriteLineAsync($"foldwise: {risk}");
        }

        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        using var sigterm = PosixSignalRegistration.Create(PosixSignal.SIGTERM, s => { s.Cancel = true; stop.Cancel(); });
        using var sigint = PosixSignalRegistration.Create(PosixSignal.SIGINT, s => { s.Cancel = true; stop.Cancel(); });
        string[] commandLine = [.. context.Arguments];
        IProgress<SearchEvent> events = settings.Json ? new EventJsonLines(Console.Out) : new WorkerLines(Console.Out);
        string? refusal = await new WorkerHost(role, options, events)
        {
            Telemetry = FoldwiseTelemetryOptions.FromEnvironment(),
            StartOver = attempts => FreshProcess.Restart(commandLine, attempts),
            EarlierAttempts = int.TryParse(Environment.GetEnvironmentVariable(FreshProcess.AttemptVariable), out int earlier) ? earlier : 0,
        }.RunAsync(stop.Token);
        return refusal is null ? ExitCodes.Ok : ExitCodes.Refused;
    }
}
