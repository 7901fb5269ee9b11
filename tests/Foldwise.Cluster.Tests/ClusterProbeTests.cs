using Foldwise.Cluster.Hosting;

namespace Foldwise.Cluster.Tests;

/// <summary>What a worker concludes from the coordinator's silo port when its join does not go through.</summary>
public sealed class ClusterProbeTests
{
    [Fact]
    public void Each_certificate_mismatch_gets_its_own_line_and_a_match_none()
    {
        using var alpha = ClusterCertificate.Create("alpha");
        using var beta = ClusterCertificate.Create("beta");

        // A coordinator with a certificate, a worker without one
        Assert.StartsWith("the coordinator requires the cluster certificate", ClusterProbe.Judge(connected: true, presented: alpha, own: null), StringComparison.Ordinal);

        // Another cluster's certificate on each side
        Assert.Equal(
            "this machine's certificate belongs to another cluster (the coordinator holds CN=foldwise cluster alpha, this machine CN=foldwise cluster beta): copy the coordinator's cluster.pfx here",
            ClusterProbe.Judge(connected: true, presented: alpha, own: beta));

        // A plain coordinator, a worker with a certificate
        Assert.StartsWith("the coordinator runs without a cluster certificate", ClusterProbe.Judge(connected: true, presented: null, own: beta), StringComparison.Ordinal);

        // The same certificate, both plain, or nothing listening: nothing to say (the join's own retries report it)
        Assert.Null(ClusterProbe.Judge(connected: true, presented: alpha, own: alpha));
        Assert.Null(ClusterProbe.Judge(connected: true, presented: null, own: null));
        Assert.Null(ClusterProbe.Judge(connected: false, presented: null, own: beta));
    }

    [Fact]
    public async Task A_port_answers_while_something_listens_there_and_not_after()
    {
        // Given a listener on a free loopback port
        var listener = new System.Net.Sockets.TcpListener(System.Net.IPAddress.Loopback, 0);
        listener.Start();
        var port = (System.Net.IPEndPoint)listener.LocalEndpoint;

        // Then the port answers, and once the listener has stopped it does not
        Assert.True(await ClusterProbe.AnswersAsync(port, TimeSpan.FromSeconds(5), CancellationToken.None));
        listener.Stop();
        Assert.False(await ClusterProbe.AnswersAsync(port, TimeSpan.FromSeconds(5), CancellationToken.None));
    }
}
