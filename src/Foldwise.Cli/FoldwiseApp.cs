using Foldwise.Cli.Commands;
using Spectre.Console.Cli;

namespace Foldwise.Cli;

/// <summary>The command table of <c>foldwise</c>, shared by the program and the console-harness tests.</summary>
public static class FoldwiseApp
{
    public static void Configure(IConfigurator config)
    {
        config.SetApplicationName("foldwise");
        config.SetExceptionHandler(ErrorReport.Handle);
        config.AddCommand<RunCommand>("run")
            .WithDescription("Run a search from a definition file (or flags): cross-validated trials, then the blend and a prediction file.")
            .WithExample("run", "configs/demo.json", "--out", "runs/demo");
        config.AddCommand<DemoCommand>("demo")
            .WithDescription("Write the invented freight demo tables and definition into a folder, then run that search.")
            .WithExample("demo", "--quick", "--out", "runs/demo");
        config.AddCommand<ResumeCommand>("resume")
            .WithDescription("Continue an interrupted search from its store: done trials are kept, running ones run again, budgets go on from what was spent.")
            .WithExample("resume", "runs/demo");
        config.AddCommand<HistoryCommand>("history")
            .WithDescription("List a search's trials, best first (works while the search runs).")
            .WithExample("history", "runs/demo/search.db");
        config.AddCommand<PlanCommand>("plan")
            .WithDescription("Print the rung and bracket plan for a budget range, to size a search before running it.")
            .WithExample("plan", "--min-budget", "1", "--max-budget", "81", "--eta", "3");
    }
}
