using System.ComponentModel;
using System.Net;
using Foldwise.Cluster.Workers;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>
/// Options of <c>foldwise worker</c>. Defaults: one single-threaded slot per core, a free silo port, the address
/// facing the coordinator, the host name as the worker's name.
/// </summary>
public sealed class WorkerSettings : CommandSettings
{
    [CommandOption("--join <HOST:PORT>")]
    [Description("The coordinator's address and --port, e.g. 192.168.1.20:11111. Required.")]
    public string Join { get; init; } = "";

    [CommandOption("--slots <N>")]
    [Description("Slots training trials. Default: one per core, each fit single-threaded (on tables of a few thousand rows fits side by side beat one wide fit).")]
    public int Slots { get; init; } = WorkerOptions.DefaultSlots;

    [CommandOption("--threads <N>")]
    [Description("Threads per fit in each slot. Default: 1, whatever the slot count (see the README on slots).")]
    public int? Threads { get; init; }

    [CommandOption("--port <P>")]
    [Description("This worker's silo port (the coordinator connects back to it; open it in the firewall). Default: a free port.")]
    public int Port { get; init; }

    [CommandOption("--advertise <ADDRESS>")]
    [Description("The address the coordinator reaches this machine on. Default: the local address facing the coordinator.")]
    public string? Advertise { get; init; }

    [CommandOption("--name <NAME>")]
    [Description("The machine name trials record. Default: the host name.")]
    public string? Name { get; init; }

    [CommandOption("--cache <DIR>")]
    [Description("Folder for tables fetched from the coordinator, kept for later searches. Default ~/.cache/foldwise/tables.")]
    public string? Cache { get; init; }

    [CommandOption("--cert <FILE>")]
    [Description("The cluster certificate, copied from the coordinator's machine. Required when the coordinator uses one.")]
    public string? Cert { get; init; }

    [CommandOption("--passphrase <TEXT>")]
    [Description("Passphrase of --cert. Default: the FOLDWISE_CERT_PASSPHRASE environment variable.")]
    public string? Passphrase { get; init; }

    [CommandOption("--open-cluster")]
    [Description("Accept joining without --cert from an address beyond this machine: anyone who can reach the ports could read the training table and post results.")]
    public bool OpenCluster { get; init; }

    [CommandOption("--cache-limit <GB>")]
    [Description("Most gigabytes the table cache keeps; the least recently used tables go first. Default 4.")]
    public double CacheLimit { get; init; } = 4;

    [CommandOption("--clear-cache")]
    [Description("Delete the cached tables (in --cache) and exit; no --join needed.")]
    public bool ClearCache { get; init; }

    [CommandOption("--leave-when-done")]
    [Description("Leave (exit 0) when the search this worker works on has finished, instead of waiting for the coordinator's next search.")]
    public bool LeaveWhenDone { get; init; }

    [CommandOption("--json")]
    [Description("Print each event (joined, trial scored, lease lost, …) as one JSON object per line instead of sentences.")]
    public bool Json { get; init; }

    [CommandOption("--verbose")]
    [Description("Log information messages of the cluster to stderr too, not only warnings and errors.")]
    public bool Verbose { get; init; }

    public override ValidationResult Validate()
    {
        if (CacheLimit <= 0)
        {
            return ValidationResult.Error("--cache-limit must be more than 0 GB");
        }

        if (string.IsNullOrWhiteSpace(Join) && !ClearCache)
        {
            return ValidationResult.Error("--join HOST:PORT is required: the coordinator's address and --port");
        }

        if (Slots < 1)
        {
            return ValidationResult.Error("--slots must be at least 1 on a worker");
        }

        if (Port is < 0 or > 65535)
        {
            return ValidationResult.Error("--port must be a TCP port (1–65535)");
        }

        if (Advertise is not null && !IPAddress.TryParse(Advertise, out _))
        {
            return ValidationResult.Error("--advertise must be an IP address");
        }

        return Threads is < 1 ? ValidationResult.Error("--threads must be at least 1") : ValidationResult.Success();
    }
}
