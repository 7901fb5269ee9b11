using System.ComponentModel;
using System.Net;
using Foldwise.Cli.Running;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Workers;
using Foldwise.Core.Search;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>
/// Options shared by every command that hosts a coordinator: its local slots and how other machines reach it.
/// Defaults: one local slot per core, free loopback ports (a cluster of one), no certificate.
/// </summary>
public class SearchHostSettings : CommandSettings
{
    [CommandOption("--slots <N>")]
    [Description("Local slots training trials. Default: one per core, each fit single-threaded (on tables of a few thousand rows fits side by side beat one wide fit). 0 = this machine only coordinates.")]
    public int Slots { get; init; } = WorkerOptions.DefaultSlots;

    [CommandOption("--threads <N>")]
    [Description("Threads per fit in each slot. Default: 1, whatever the slot count (see the README on slots).")]
    public int? Threads { get; init; }

    [CommandOption("--port <P>")]
    [Description("Silo port other machines join ('foldwise worker --join HOST:P'). Default: a free loopback port (no workers).")]
    public int? Port { get; init; }

    [CommandOption("--gateway-port <P>")]
    [Description("Gateway port for clients. Default: --port + 1.")]
    public int? GatewayPort { get; init; }

    [CommandOption("--advertise <ADDRESS>")]
    [Description("The address workers reach this machine on (e.g. 192.168.1.20). Default 127.0.0.1: only workers on this machine can join.")]
    public string? Advertise { get; init; }

    [CommandOption("--cert <FILE>")]
    [Description("Cluster certificate (from 'foldwise cluster-cert'): silos then talk over mutual TLS and refuse machines without it.")]
    public string? Cert { get; init; }

    [CommandOption("--passphrase <TEXT>")]
    [Description("Passphrase of --cert. Default: the FOLDWISE_CERT_PASSPHRASE environment variable.")]
    public string? Passphrase { get; init; }

    [CommandOption("--open-cluster")]
    [Description("Accept listening beyond this machine without --cert: anyone who can reach the port could read the training table and post results.")]
    public bool OpenCluster { get; init; }

    [CommandOption("--verbose")]
    [Description("Log information messages of the cluster to stderr too, not only warnings and errors.")]
    public bool Verbose { get; init; }

    [CommandOption("--lease-seconds <S>", IsHidden = true)]
    [Description("Advanced: seconds a trial's lease lasts without renewal. Default 90.")]
    public double? LeaseSeconds { get; init; }

    public ClusterRole ToRole()
    {
        var advertise = Advertise is null ? IPAddress.Loopback : IPAddress.Parse(Advertise);
        return new ClusterRole
        {
            IsCoordinator = true,
            SiloPort = Port ?? 0,
            GatewayPort = GatewayPort ?? (Port is { } port ? port + 1 : 0),
            Advertise = advertise,
            SiloName = $"coordinator@{Environment.MachineName}",
            Certificate = ClusterTrust.Load(Cert, Passphrase),
            Verbose = Verbose,
        };
    }

    public CoordinatorOptions ToCoordinatorOptions() =>
        LeaseSeconds is { } seconds ? new CoordinatorOptions { LeaseDuration = TimeSpan.FromSeconds(seconds) } : new CoordinatorOptions();

    public override ValidationResult Validate()
    {
        if (Slots < 0)
        {
            return ValidationResult.Error("--slots cannot be negative");
        }

        if (Port is < 1 or > 65534 || GatewayPort is < 1 or > 65535)
        {
            return ValidationResult.Error("--port and --gateway-port must be TCP ports (1–65535)");
        }

        if (Advertise is not null && !IPAddress.TryParse(Advertise, out _))
        {
            return ValidationResult.Error("--advertise must be an IP address, e.g. 192.168.1.20");
        }

        if (Advertise is not null && Running.OpenCluster.Refusal("coordinator", IPAddress.Parse(Advertise), Cert is not null, OpenCluster) is { } open)
        {
            return ValidationResult.Error(open);
        }

        if (LeaseSeconds is <= 0)
        {
            return ValidationResult.Error("--lease-seconds must be more than 0");
        }

        return Threads is < 1 ? ValidationResult.Error("--threads must be at least 1") : ValidationResult.Success();
    }
}
