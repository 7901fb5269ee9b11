using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise cluster-cert</c>. Defaults: cluster name "foldwise", valid 5 years, no overwrite.</summary>
public sealed class ClusterCertSettings : CommandSettings
{
    [CommandOption("--out <FILE>")]
    [Description("Where to write the certificate (PKCS#12, e.g. cluster.pfx). Required.")]
    public string Out { get; init; } = "";

    [CommandOption("--passphrase <TEXT>")]
    [Description("Passphrase protecting the file. Default: the FOLDWISE_CERT_PASSPHRASE environment variable.")]
    public string? Passphrase { get; init; }

    [CommandOption("--name <NAME>")]
    [Description("A name for the cluster, written into the certificate's subject. Default foldwise.")]
    public string Name { get; init; } = "foldwise";

    [CommandOption("--years <N>")]
    [Description("How long the certificate is valid. Default 5.")]
    public int Years { get; init; } = 5;

    [CommandOption("--force")]
    [Description("Overwrite an existing file (every machine then needs the new copy).")]
    public bool Force { get; init; }

    public override ValidationResult Validate()
    {
        if (string.IsNullOrWhiteSpace(Out))
        {
            return ValidationResult.Error("--out FILE is required");
        }

        return Years is < 1 or > 50 ? ValidationResult.Error("--years must be 1 to 50") : ValidationResult.Success();
    }
}
