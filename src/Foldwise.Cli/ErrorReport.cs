using Foldwise.Core.Data;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli;

/// <summary>
/// Turns any failure into one clear line on stderr and an exit code (<see cref="ExitCodes"/>): bad input (files,
/// definitions) exits 1 and names the file, line and column; a wrong command line (an unknown command or option, an
/// invalid flag) exits 2 and names it; a store another process is writing exits 4; anything else exits 3.
/// </summary>
public static class ErrorReport
{
    public static int Handle(Exception exception, ITypeResolver? resolver) => Handle(exception, resolver, null);

    /// <summary>
    /// As <see cref="Handle(Exception, ITypeResolver?)"/>; <paramref name="configured"/> is the app's own console, used when
    /// the failure came before any command was resolved (an unknown command or option).
    /// </summary>
    public static int Handle(Exception exception, ITypeResolver? resolver, IAnsiConsole? configured)
    {
        var (code, message) = exception switch
        {
            InputException input => (ExitCodes.BadInput, input.Message),
            CommandAppException app => (ExitCodes.Usage, UsageLine(app.Message)),
            Storage.StoreBusyException busy => (ExitCodes.StoreBusy, busy.Message),
            Storage.StoreException store => (ExitCodes.BadInput, store.Message),
            FileNotFoundException missing => (ExitCodes.BadInput, $"{missing.FileName ?? "file"}: not found"),
            DirectoryNotFoundException missingDir => (ExitCodes.BadInput, missingDir.Message),
            UnauthorizedAccessException denied => (ExitCodes.BadInput, denied.Message),
            _ => (ExitCodes.Failed, $"{exception.GetType().Name}: {exception.Message}"),
        };
        var console = resolver?.Resolve(typeof(IAnsiConsole)) as IAnsiConsole ?? configured;
        if (console is null || ReferenceEquals(console, AnsiConsole.Console))
        {
            Console.Error.WriteLine($"foldwise: {message}");
        }
        else
        {
            console.WriteLine($"foldwise: {message}");
        }

        return code;
    }

    /// <summary>Spectre names an unknown option without its dashes ("Unknown option 'jsn'."); say it as it was typed.</summary>
    private static string UsageLine(string message)
    {
        var unknown = System.Text.RegularExpressions.Regex.Match(message, @"^Unknown option '(?<name>[^']+)'\.?$");
        if (!unknown.Success)
        {
            return message;
        }

        string name = unknown.Groups["name"].Value;
        return $"unknown option '{(name.Length == 1 ? "-" : "--")}{name}' ('foldwise COMMAND --help' lists a command's options)";
    }
}
