using System.Net;
using System.Security.Cryptography.X509Certificates;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Orleans.Configuration;
using Orleans.Connections.Security;

namespace Foldwise.Cluster.Hosting;

/// <summary>
/// An Orleans client of a running coordinator, through its gateway port: what <c>foldwise status HOST:PORT</c>
/// reads live progress with. With the cluster certificate it speaks the same mutual TLS the silos do.
/// </summary>
public sealed class FoldwiseClient : IAsyncDisposable
{
    private readonly IHost host;

    private FoldwiseClient(IHost host) => this.host = host;

    public IClusterClient Client => host.Services.GetRequiredService<IClusterClient>();

    public static async Task<FoldwiseClient> ConnectAsync(IPEndPoint gateway, X509Certificate2? certificate, string clusterId, CancellationToken cancellation)
    {
        var builder = Host.CreateApplicationBuilder([]);
        builder.Logging.ClearProviders();
        builder.UseOrleansClient(client =>
        {
            client.UseStaticClustering(gateway);
            client.Configure<ClusterOptions>(o =>
            {
                o.ClusterId = clusterId;
                o.ServiceId = clusterId;
            });
            if (certificate is not null)
            {
                client.UseTls(certificate, o =>
                {
                    o.RemoteCertificateMode = RemoteCertificateMode.RequireCertificate;
                    o.RemoteCertificateValidation = (presented, _, _) => ClusterCertificate.IsSame(certificate, presented);
                    o.OnAuthenticateAsClient = (_, ssl) => ssl.TargetHost = "foldwise";
                    o.HandshakeTimeout = TimeSpan.FromSeconds(5);
                });
            }
        });
        var host = builder.Build();
        try
        {
            await host.StartAsync(cancellation);
        }
        catch
        {
            host.Dispose();
            throw;
        }

        return new FoldwiseClient(host);
    }

    public async ValueTask DisposeAsync()
    {
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(5));
        try
        {
            await host.StopAsync(timeout.Token);
        }
        finally
        {
            host.Dispose();
        }
    }
}
