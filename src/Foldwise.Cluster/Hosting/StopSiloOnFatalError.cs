using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cluster.Hosting;

/// <summary>
/// For a worker silo: where Orleans would end the process on a fatal error (its coordinator restarted and the
/// cluster's membership was lost, or the cluster declared this silo dead after the machine slept), stop only
/// this silo's host instead, so the worker process builds a fresh silo and joins again by itself.
/// </summary>
public sealed partial class StopSiloOnFatalError(IHostApplicationLifetime lifetime, ILogger<StopSiloOnFatalError> log) : IFatalErrorHandler
{
    public bool IsUnexpected(Exception exception) => true;

    public void OnFatalException(object? sender = null, string? context = null, Exception? exception = null)
    {
        LogFatal(context ?? "", exception?.Message.Split('\n')[0] ?? "");
        lifetime.StopApplication();
    }

    [LoggerMessage(Level = LogLevel.Warning, Message = "The cluster ended this silo ({Context}: {Reason}); starting over")]
    private partial void LogFatal(string context, string reason);
}
