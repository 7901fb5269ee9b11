using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;

namespace Foldwise.Cluster.Hosting;

/// <summary>
/// The one self-signed certificate every silo of a Foldwise cluster holds (PKCS#12 with a passphrase). A silo
/// accepts a peer only when the peer presents exactly this certificate. Default lifetime: 5 years.
/// </summary>
public static class ClusterCertificate
{
    /// <summary>The environment variable read for the passphrase when no option gives it.</summary>
    public const string PassphraseVariable = "FOLDWISE_CERT_PASSPHRASE";

    private const string ServerAuth = "1.3.6.1.5.5.7.3.1";
    private const string ClientAuth = "1.3.6.1.5.5.7.3.2";

    /// <summary>A new key pair and certificate usable both to accept (server) and to open (client) silo connections.</summary>
    public static X509Certificate2 Create(string clusterName, int years = 5)
    {
        using var key = ECDsa.Create(ECCurve.NamedCurves.nistP256);
        var request = new CertificateRequest($"CN=foldwise cluster {clusterName}", key, HashAlgorithmName.SHA256);
        request.CertificateExtensions.Add(new X509BasicConstraintsExtension(false, false, 0, true));
        request.CertificateExtensions.Add(new X509KeyUsageExtension(X509KeyUsageFlags.DigitalSignature, true));
        // Silo-to-silo TLS is mutual: every silo is a server to some peers and a client to others.
        request.CertificateExtensions.Add(new X509EnhancedKeyUsageExtension([new Oid(ServerAuth), new Oid(ClientAuth)], false));
        var now = DateTimeOffset.UtcNow;
        return request.CreateSelfSigned(now.AddDays(-1), now.AddYears(years));
    }

    /// <summary>Writes the certificate with its private key as PKCS#12, readable only by the owner where the OS allows.</summary>
    public static void Export(X509Certificate2 certificate, string path, string passphrase)
    {
        byte[] pfx = certificate.Export(X509ContentType.Pkcs12, passphrase);
        string? folder = Path.GetDirectoryName(Path.GetFullPath(path));
        if (folder is not null)
        {
            Directory.CreateDirectory(folder);
        }

        File.WriteAllBytes(path, pfx);
        if (!OperatingSystem.IsWindows())
        {
            File.SetUnixFileMode(path, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        }
    }

    /// <summary>Reads a certificate written by <see cref="Export"/>; throws <see cref="CryptographicException"/> for a wrong passphrase.</summary>
    public static X509Certificate2 Load(string path, string passphrase)
    {
        var certificate = X509CertificateLoader.LoadPkcs12FromFile(path, passphrase, X509KeyStorageFlags.Exportable);
        if (!certificate.HasPrivateKey)
        {
            certificate.Dispose();
            throw new CryptographicException($"{path} holds no private key: export the cluster certificate with its key");
        }

        return certificate;
    }

    /// <summary>True only for the very certificate the cluster shares (same SHA-256 thumbprint).</summary>
    public static bool IsSame(X509Certificate2 expected, X509Certificate2? presented) =>
        presented is not null &&
        CryptographicOperations.FixedTimeEquals(
            expected.GetCertHash(HashAlgorithmName.SHA256), presented.GetCertHash(HashAlgorithmName.SHA256));
}
