using Foldwise.Cluster.Workers;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cli.Running;

/// <summary>
/// Prints the slot runner's information messages (a trial done) as plain lines on stdout: a worker's visible heartbeat.
/// Its warnings and errors (a trial failed, a lease lost) go to stderr with every other warning.
/// </summary>
internal sealed class TrialLines(TextWriter output) : ILoggerProvider
{
    private static readonly string Category = typeof(SlotRunner).FullName!;

    public ILogger CreateLogger(string categoryName) => categoryName == Category ? new Printer(output) : NullLogger.Instance;

    public void Dispose()
    {
        // Nothing held.
    }

    private sealed class Printer(TextWriter output) : ILogger
    {
        public IDisposable? BeginScope<TState>(TState state)
            where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => logLevel == LogLevel.Information;

        public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter)
        {
            if (IsEnabled(logLevel))
            {
                lock (output)
                {
                    output.WriteLine(formatter(state, exception));
                }
            }
        }
    }

    private sealed class NullLogger : ILogger
    {
        public static readonly NullLogger Instance = new();

        public IDisposable? BeginScope<TState>(TState state)
            where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => false;

        public void Log<TState>(LogLevel logLevel, EventId eventId, TState state, Exception? exception, Func<TState, Exception?, string> formatter)
        {
            // Other categories go to the console logger (stderr).
        }
    }
}
