using System.ComponentModel;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise status</c>.</summary>
public sealed class StatusSettings : CommandSettings
{
    [CommandArgument(0, "<STORE|HOST:PORT>")]
    [Description("The search's store (OUT/search.db) or its folder, read while the search runs; or a running coordinator's gateway HOST:PORT (its --port + 1) for live progress.")]
    public string Store { get; init; } = "";

    [CommandOption("--cert <FILE>")]
    [Description("With HOST:PORT: the cluster certificate, when the coordinator runs with one.")]
    public string? Cert { get; init; }

    [CommandOption("--passphrase <TEXT>")]
    [Description("Passphrase of --cert. Default: the FOLDWISE_CERT_PASSPHRASE environment variable.")]
    public string? Passphrase { get; init; }
}
