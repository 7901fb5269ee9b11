using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using Foldwise.Cluster.Hosting;
using Foldwise.Core.Data;

namespace Foldwise.Cli.Running;

/// <summary>Loads the cluster certificate named on the command line; the passphrase comes from the option or the environment.</summary>
public static class ClusterTrust
{
    public static X509Certificate2? Load(string? path, string? passphrase)
    {
        if (path is null)
        {
            return null;
        }

        if (!File.Exists(path))
        {
            throw new InputException(path, "cluster certificate not found (create one with 'foldwise cluster-cert --out FILE')");
        }

        try
        {
            return ClusterCertificate.Load(path, Passphrase(passphrase, path));
        }
        catch (CryptographicException e)
        {
            throw new InputException(path, $"cannot open the cluster certificate (wrong passphrase?): {e.Message}");
        }
    }

    public static string Passphrase(string? given, string path)
    {
        string? passphrase = given ?? Environment.GetEnvironmentVariable(ClusterCertificate.PassphraseVariable);
        return string.IsNullOrEmpty(passphrase)
            ? throw new InputException(path, $"give the certificate's passphrase with --passphrase or {ClusterCertificate.PassphraseVariable}")
            : passphrase;
    }
}
