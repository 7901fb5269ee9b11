using Spectre.Console;

namespace Foldwise.Cli.Output;

/// <summary>A console that swallows everything, for steps whose human-readable lines would spoil JSON output.</summary>
public sealed class QuietConsole
{
    public IAnsiConsole Console { get; } = AnsiConsole.Create(new AnsiConsoleSettings
    {
        Out = new AnsiConsoleOutput(TextWriter.Null),
        Ansi = AnsiSupport.No,
        Interactive = InteractionSupport.No,
    });
}
