using Foldwise.Cli;
using Spectre.Console;
using Spectre.Console.Cli;

if (Console.IsOutputRedirected)
{
    // Piped to a file or another program: tables get room instead of an assumed 80 columns.
    AnsiConsole.Profile.Width = 160;
}

var app = new CommandApp();
app.Configure(FoldwiseApp.Configure);
return await app.RunAsync(args);
