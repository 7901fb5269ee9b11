using System.Net;
using System.Net.Sockets;

namespace Foldwise.Cluster.Hosting;

/// <summary>Finds a free TCP port on loopback, so two embedded searches on one machine never collide.</summary>
public static class FreePort
{
    public static int Find()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}
