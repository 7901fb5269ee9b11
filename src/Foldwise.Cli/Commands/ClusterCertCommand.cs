using Foldwise.Cli.Running;
using Foldwise.Cluster.Hosting;
using Foldwise.Core.Data;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise cluster-cert</c>: creates the self-signed certificate every machine of one cluster shares.</summary>
public sealed class ClusterCertCommand(IAnsiConsole console) : Command<ClusterCertSettings>
{
    public override int Execute(CommandContext context, ClusterCertSettings settings, CancellationToken cancellationToken)
    {
        if (File.Exists(settings.Out) && !settings.Force)
        {
            throw new InputException(settings.Out, "already exists; pass --force to replace it (and copy the new file to every machine)");
        }

        string passphrase = ClusterTrust.Passphrase(settings.Passphrase, settings.Out);
        using var certificate = ClusterCertificate.Create(settings.Name, settings.Years);
        ClusterCertificate.Export(certificate, settings.Out, passphrase);
        console.MarkupLine($"Wrote [bold]{Markup.Escape(settings.Out)}[/] ({Markup.Escape(certificate.Subject)}, SHA-256 {certificate.GetCertHashString(System.Security.Cryptography.HashAlgorithmName.SHA256)[..16]}…, valid to {certificate.NotAfter:yyyy-MM-dd}).");
        console.MarkupLine("Copy it to every machine of the cluster and pass --cert FILE to 'foldwise run' and 'foldwise worker'; keep it private.");
        return ExitCodes.Ok;
    }
}
