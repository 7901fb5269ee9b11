using System.Net;
using System.Net.Security;
using System.Net.Sockets;
using System.Security.Authentication;
using System.Security.Cryptography.X509Certificates;

namespace Foldwise.Cluster.Hosting;

/// <summary>
/// Finds out why a worker's silo cannot join when the coordinator's mutual TLS refuses it: one TLS handshake with
/// the coordinator's silo port shows whether it speaks TLS and which certificate it holds. Orleans itself only
/// closes such connections, so without this the worker would retry in silence.
/// </summary>
public static class ClusterProbe
{
    /// <summary>Whether anything accepts a TCP connection on the coordinator's silo port within <paramref name="timeout"/>.</summary>
    public static async Task<bool> AnswersAsync(IPEndPoint coordinator, TimeSpan timeout, CancellationToken cancellation)
    {
        ArgumentNullException.ThrowIfNull(coordinator);
        using var limit = CancellationTokenSource.CreateLinkedTokenSource(cancellation);
        limit.CancelAfter(timeout);
        try
        {
            using var tcp = new TcpClient(coordinator.AddressFamily);
            await tcp.ConnectAsync(coordinator, limit.Token);
            return true;
        }
        catch (Exception e) when (e is SocketException or OperationCanceledException && !cancellation.IsCancellationRequested)
        {
            return false;
        }
    }

    /// <summary>The line saying why this worker's certificate (or its absence) does not match the coordinator's; null when it matches or nothing answered.</summary>
    public static async Task<string?> MismatchAsync(IPEndPoint coordinator, X509Certificate2? own, TimeSpan timeout, CancellationToken cancellation)
    {
        ArgumentNullException.ThrowIfNull(coordinator);
        X509Certificate2? presented = null;
        bool connected = false;
        using var limit = CancellationTokenSource.CreateLinkedTokenSource(cancellation);
        limit.CancelAfter(timeout);
        try
        {
            using var tcp = new TcpClient(coordinator.AddressFamily);
            await tcp.ConnectAsync(coordinator, limit.Token);
            connected = true;
            await using var tls = new SslStream(tcp.GetStream(), leaveInnerStreamOpen: false);
            await tls.AuthenticateAsClientAsync(
                new SslClientAuthenticationOptions
                {
                    TargetHost = "foldwise",
                    ClientCertificates = own is null ? null : [own],
                    RemoteCertificateValidationCallback = (_, certificate, _, _) =>
                    {
                        presented = certificate is null ? null : X509CertificateLoader.LoadCertificate(certificate.GetRawCertData());
                        return own is not null && ClusterCertificate.IsSame(own, presented);
                    },
                },
                limit.Token);
        }
        catch (Exception e) when (e is IOException or AuthenticationException or SocketException or OperationCanceledException && !cancellation.IsCancellationRequested)
        {
            // The handshake did not finish: what the coordinator presented before it stopped (if anything) tells why.
        }

        using (presented)
        {
            return Judge(connected, presented, own);
        }
    }

    /// <summary>The decision, from what the coordinator's silo port did: accepted the connection, and presented a certificate or none.</summary>
    public static string? Judge(bool connected, X509Certificate2? presented, X509Certificate2? own) => (presented, own) switch
    {
        ({ }, null) => "the coordinator requires the cluster certificate: copy its cluster.pfx to this machine and give --cert FILE",
        ({ } theirs, { } mine) when !ClusterCertificate.IsSame(mine, theirs) =>
            $"this machine's certificate belongs to another cluster (the coordinator holds {theirs.Subject}, this machine {mine.Subject}): copy the coordinator's cluster.pfx here",
        (null, { }) when connected => "the coordinator runs without a cluster certificate: start this worker without --cert, or the coordinator with the same --cert",
        _ => null,
    };
}
