using System.Net;
using System.Security.Cryptography.X509Certificates;
using Microsoft.AspNetCore.Connections;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using Orleans.Configuration;

namespace Foldwise.Cluster.Hosting;

/// <summary>
/// The coordinator's log line for each machine its mutual TLS refuses, with its address and why: a plain
/// connection (a worker started without --cert) is told apart by its first byte, a certificate of another cluster
/// by the certificate check. Orleans' own handshake log names neither.
/// </summary>
internal static partial class TlsRefusals
{
    /// <summary>The first byte of every TLS connection: a handshake record (RFC 8446, section 5.1).</summary>
    private const byte HandshakeRecord = 0x16;

    private static readonly AsyncLocal<Peer?> Current = new();

    /// <summary>Installs the check in front of the silo port's TLS; call before the TLS itself is configured.</summary>
    public static ISiloBuilder LogTlsRefusals(this ISiloBuilder silo) =>
        silo.Configure<SiloConnectionOptions>(o => o.ConfigureSiloInboundConnection(connection =>
        {
            var logger = connection.ApplicationServices.GetRequiredService<ILoggerFactory>().CreateLogger("Foldwise.Cluster.Refused");
            connection.Use(next => context => WatchAsync(context, next, logger));
        }));

    /// <summary>The certificate check of the silo port: the same certificate passes; another is remembered for the log line.</summary>
    public static bool Check(X509Certificate2 expected, X509Certificate2? presented)
    {
        if (ClusterCertificate.IsSame(expected, presented))
        {
            return true;
        }

        if (Current.Value is { } peer && presented is not null)
        {
            peer.Refusal = $"its certificate belongs to another cluster ({presented.Subject}; this cluster's is {expected.Subject})";
        }

        return false;
    }

    private static async Task WatchAsync(ConnectionContext context, ConnectionDelegate next, ILogger logger)
    {
        var peer = new Peer();
        Current.Value = peer;
        using (var patience = new CancellationTokenSource(TimeSpan.FromSeconds(10)))
        {
            try
            {
                var read = await context.Transport.Input.ReadAsync(patience.Token);
                if (!read.Buffer.IsEmpty && read.Buffer.FirstSpan[0] != HandshakeRecord)
                {
                    peer.Refusal = "it did not present the cluster certificate (a worker started without --cert?)";
                }

                // Nothing consumed: the TLS handshake reads the same bytes.
                context.Transport.Input.AdvanceTo(read.Buffer.Start);
            }
            catch (OperationCanceledException)
            {
                context.Abort();
                return;
            }
        }

        try
        {
            await next(context);
        }
        finally
        {
            if (peer.Refusal is { } refusal)
            {
                LogRefused(logger, context.RemoteEndPoint?.ToString() ?? "an unknown address", refusal);
            }
        }
    }

    [LoggerMessage(Level = LogLevel.Warning, Message = "Refused a connection from {Address}: {Reason}")]
    private static partial void LogRefused(ILogger logger, string address, string reason);

    private sealed class Peer
    {
        public string? Refusal { get; set; }
    }
}
