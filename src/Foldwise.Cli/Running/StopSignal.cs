using System.Runtime.InteropServices;
using Spectre.Console;

namespace Foldwise.Cli.Running;

/// <summary>
/// Ctrl-C once: stop creating trials, let running ones finish, then blend. Ctrl-C again (or SIGTERM):
/// abandon running trials (or the blend, if it has begun); everything done is already in the store.
/// </summary>
public sealed class StopSignal : IDisposable
{
    private readonly IAnsiConsole console;
    private readonly CancellationTokenSource stop = new();
    private readonly CancellationTokenSource abandon = new();
    private readonly PosixSignalRegistration? terminate;
    private int presses;

    public StopSignal(IAnsiConsole console)
    {
        this.console = console;
        Console.CancelKeyPress += OnCancel;
        terminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, context =>
        {
            context.Cancel = true;
            abandon.Cancel();
        });
    }

    public CancellationToken Stop => stop.Token;

    public CancellationToken Abandon => abandon.Token;

    public void Dispose()
    {
        Console.CancelKeyPress -= OnCancel;
        terminate?.Dispose();
        stop.Dispose();
        abandon.Dispose();
    }

    private void OnCancel(object? sender, ConsoleCancelEventArgs e)
    {
        e.Cancel = true;
        if (Interlocked.Increment(ref presses) == 1)
        {
            // Stop first, then print: a slot asking for work meanwhile must already be refused.
            stop.Cancel();
            console.MarkupLine("[yellow]Stopping: no new trials; running ones finish, then the blend runs. Ctrl-C again to abandon them.[/]");
        }
        else
        {
            abandon.Cancel();
        }
    }
}
