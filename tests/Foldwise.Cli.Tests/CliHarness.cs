using Spectre.Console.Cli.Testing;
using Spectre.Console.Testing;

namespace Foldwise.Cli.Tests;

/// <summary>Runs <c>foldwise</c> commands through Spectre's console harness, on a wide test console.</summary>
public static class CliHarness
{
    public static CommandAppResult Run(params string[] args)
    {
        var console = new TestConsole().Width(220);
        var tester = new CommandAppTester(null, new CommandAppTesterSettings(), console);
        tester.Configure(FoldwiseApp.Configure);
        return tester.Run(args);
    }
}
