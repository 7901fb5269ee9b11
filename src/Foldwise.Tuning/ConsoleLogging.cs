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

    public static void Configure(ILoggingBuilder logging, bool verbose)
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
        }

        logging.Services.Configure<ConsoleLoggerOptions>(o => o.LogToStandardErrorThreshold = LogLevel.Trace);
    }
}
