using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Console;

namespace Foldwise.Tuning;

/// <summary>
/// Where a silo's log goes: warnings and errors to stderr, one line each, so faults show without being asked for;
/// <c>--verbose</c> adds information messages. <c>FOLDWISE_LOG</c> (a level name: Trace, Debug, Information,
/// Warning, Error, None) overrides both, e.g. Debug to follow Orleans' own messages.
/// </summary>
internal static class ConsoleLogging
{
    public const string Variable = "FOLDWISE_LOG";

    /// <summary>
    /// Where Orleans and the host log a worker's failed join and the calls that fail once its coordinator has gone
    /// (each also said by the worker's own line: "Cannot join …", "The coordinator … has stopped").
    /// </summary>
    public static readonly string[] JoiningNoise =
    [
        "Polly",
        "Orleans.Messaging",
        "Orleans.Runtime.Messaging.ConnectionManager",
        "Orleans.Runtime.MembershipService.MembershipTableManager",
        "Orleans.Runtime.SiloLifecycleSubject",
        "Orleans.Runtime.Silo",
        "Microsoft.Extensions.Hosting.Internal.Host",
    ];

    /// <param name="joining">
    /// A worker's silo: while the coordinator is unreachable Orleans logs every refused connection, the failed start and
    /// each call to the gone coordinator with stack traces, every few seconds; the worker says the same in one line, so at
    /// the default level those messages stay out (<c>--verbose</c> or <c>FOLDWISE_LOG</c> shows them).
    /// </param>
    public static void Configure(ILoggingBuilder logging, bool verbose, bool joining = false)
    {
        logging.ClearProviders();
        var level = Environment.GetEnvironmentVariable(Variable) is { Length: > 0 } text && Enum.TryParse<LogLevel>(text, true, out var asked)
            ? asked
            : verbose ? LogLevel.Information : LogLevel.Warning;
        if (level == LogLevel.None)
        {
            return;
        }

        logging.AddSimpleConsole(o => o.SingleLine = true).SetMinimumLevel(level);
        if (level == LogLevel.Warning)
        {
            // At start every silo warns that server GC is off (Foldwise turns it off on purpose: several processes share a
            // machine), and the watchdog warns of a stalled check on its first round; neither is a fault to show a user.
            logging.AddFilter("Orleans.Runtime.Silo", LogLevel.Error);
            logging.AddFilter("Orleans.Runtime.Watchdog", LogLevel.Error);
            if (joining)
            {
                foreach (string category in JoiningNoise)
                {
                    logging.AddFilter(category, LogLevel.Critical);
                }
            }
        }

        logging.Services.Configure<ConsoleLoggerOptions>(o => o.LogToStandardErrorThreshold = LogLevel.Trace);
    }
}
