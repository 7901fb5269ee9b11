using System.Net;
using Foldwise.Cli.Report;
using Foldwise.Cli.Running;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Hosting;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>
/// <c>foldwise status STORE</c>: where a search stands, read from its store (works while it runs);
/// <c>foldwise status HOST:PORT</c>: the same asked live of a running coordinator through its gateway.
/// </summary>
public sealed class StatusCommand(IAnsiConsole console) : AsyncCommand<StatusSettings>
{
    public override async Task<int> ExecuteAsync(CommandContext context, StatusSettings settings, CancellationToken cancellationToken)
    {
        if (File.Exists(settings.Store) || Directory.Exists(settings.Store) || !TryGateway(settings.Store, out var gateway))
        {
            StatusView.Render(console, StoredSearch.Load(settings.Store));
            return ExitCodes.Ok;
        }

        var certificate = settings.Cert is null ? null : ClusterTrust.Load(settings.Cert, settings.Passphrase);
        using var timeout = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        timeout.CancelAfter(TimeSpan.FromSeconds(20));
        FoldwiseClient client;
        try
        {
            client = await FoldwiseClient.ConnectAsync(gateway, certificate, new ClusterRole().ClusterId, timeout.Token);
        }
        catch (Exception e) when (e is OperationCanceledException or OrleansException or TimeoutException)
        {
            console.WriteLine($"foldwise: no coordinator answered at {settings.Store} within 20 s — is it running with '--port {gateway.Port - 1}' (the gateway is that port + 1){(certificate is null ? ", and without --cert" : "")}?");
            return ExitCodes.Failed;
        }

        await using var connected = client;
        var searches = await client.Client.GetGrain<ISearchBoardGrain>(0).ActiveSearchesAsync();
        if (searches.Length == 0)
        {
            console.MarkupLine($"The coordinator at {Markup.Escape(settings.Store)} runs no search now.");
        }

        foreach (string id in searches)
        {
            Render(console, id, await client.Client.GetGrain<ISearchGrain>(id).GetProgressAsync());
        }

        return ExitCodes.Ok;
    }

    private static void Render(IAnsiConsole console, string searchId, ProgressReply p)
    {
        console.MarkupLine($"Search [bold]{Markup.Escape(searchId)}[/] (live): {(p.Finished ? "finished" : p.Stopping is { } s ? $"stopping ({s})" : "running")}.");
        console.MarkupLine($"Trials: {p.Created} created: {p.Done} done, {p.Running} running, {p.Queued} queued, {p.Failed} failed{(p.TrialBudget is { } b ? $" (budget {b} trials)" : "")}.");
        console.MarkupLine($"Time spent: {TimeSpan.FromSeconds(p.SpentSeconds):hh\\:mm\\:ss}{(p.HoursBudget is { } h ? $" of {h:G3} h" : "")}.");
        foreach (var (family, best) in p.BestByFamily.OrderBy(kv => kv.Value))
        {
            console.MarkupLine($"Best {Markup.Escape(family)}: {best:F5}");
        }

        console.MarkupLine($"Running now: {(p.RunningOn.Length == 0 ? "none" : Markup.Escape(string.Join(", ", p.RunningOn)))}.");
        foreach (var (worker, why) in p.Quarantined ?? [])
        {
            console.MarkupLine($"[red]Quarantined[/] {Markup.Escape(worker)}: {Markup.Escape(why)}");
        }
    }

    private static bool TryGateway(string text, out IPEndPoint gateway)
    {
        gateway = null!;
        int colon = text.LastIndexOf(':');
        if (colon <= 0 || !int.TryParse(text.AsSpan(colon + 1), out int port) || port is < 1 or > 65535)
        {
            return false;
        }

        string host = text[..colon];
        var address = IPAddress.TryParse(host, out var parsed) ? parsed : Dns.GetHostAddresses(host).FirstOrDefault();
        if (address is null)
        {
            return false;
        }

        gateway = new IPEndPoint(address, port);
        return true;
    }
}
