using Foldwise.Core.Data;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli;

/// <summary>
/// Turns any failure into one clear line and an exit code: bad input (files, flags, definitions) exits 1 and
/// names the file, line and column; anything else exits 3.
/// </summary>
public static class ErrorReport
{
    public static int Handle(Exception exception, ITypeResolver? resolver)
    {
        var (code, message) = exception switch
        {
            InputException input => (ExitCodes.BadInput, input.Message),
            CommandAppException app => (ExitCodes.BadInput, app.Message),
            Storage.StoreException store => (ExitCodes.BadInput, store.Message),
            FileNotFoundException missing => (ExitCodes.BadInput, $"{missing.FileName ?? "file"}: not found"),
            DirectoryNotFoundException missingDir => (ExitCodes.BadInput, missingDir.Message),
            UnauthorizedAccessException denied => (ExitCodes.BadInput, denied.Message),
            _ => (ExitCodes.Failed, $"{exception.GetType().Name}: {exception.Message}"),
        };
        var console = resolver?.Resolve(typeof(IAnsiConsole)) as IAnsiConsole;
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
}
