using Foldwise.Cli.Commands;
using Foldwise.Core;
using Spectre.Console.Cli;

namespace Foldwise.Cli;

/// <summary>The command table of <c>foldwise</c>, shared by the program and the console-harness tests.</summary>
public static class FoldwiseApp
{
    public static void Configure(IConfigurator config)
    {
        config.SetApplicationName("foldwise");
        config.SetApplicationVersion(BuildVersion.Text);
        config.UseStrictParsing();
        config.SetExceptionHandler((exception, resolver) => ErrorReport.Handle(exception, resolver, config.Settings.Console));
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
        config.AddCommand<BlendCommand>("blend")
            .WithDescription("Solve the blend again from the stored out-of-fold predictions, store it, and rewrite the prediction file.")
            .WithExample("blend", "runs/demo/search.db", "--mode", "non_negative", "--pool", "5");
        config.AddCommand<PredictCommand>("predict")
            .WithDescription("Score a table of new rows with the blend's kept models, written under the search's prediction header.")
            .WithExample("predict", "runs/demo/search.db", "--rows", "new-rows.csv", "--out", "runs/demo/new-predictions.csv");
        config.AddCommand<ExportCommand>("export")
            .WithDescription("Write every full-budget trial's out-of-fold predictions (original scale) to a CSV file.")
            .WithExample("export", "runs/demo/search.db", "--oof", "runs/demo/oof.csv");
        config.AddCommand<ShowCommand>("show")
            .WithDescription("Show one trial: readable parameters, fold scores and spread, lineage, machine, time, attempts.")
            .WithExample("show", "runs/demo/search.db", "12");
        config.AddCommand<StatusCommand>("status")
            .WithDescription("Where a search stands, from its store (works while it runs): trials by state, best per family, time, slots.")
            .WithExample("status", "runs/demo/search.db");
        config.AddCommand<ReportCommand>("report")
            .WithDescription("Write one self-contained HTML page of a search's charts (no network needed to open it).")
            .WithExample("report", "runs/demo/search.db", "--out", "runs/demo/report.html");
        config.AddCommand<PlanCommand>("plan")
            .WithDescription("Print the rung and bracket plan for a budget range, to size a search before running it.")
            .WithExample("plan", "--first-rung", "20", "--full-budget", "180", "--eta", "9");
        config.AddCommand<WorkerCommand>("worker")
            .WithDescription("Offer this machine's slots to a coordinator ('run --port P') until Ctrl-C; rejoins by itself when the coordinator restarts.")
            .WithExample("worker", "--join", "office-pc-7:11111", "--cert", "cluster.pfx");
        config.AddCommand<ClusterCertCommand>("cluster-cert")
            .WithDescription("Create the certificate the machines of one cluster share (mutual TLS; machines without it are refused).")
            .WithExample("cluster-cert", "--out", "cluster.pfx");
    }
}
