using System.Net;
using System.Net.Sockets;

namespace Foldwise.Cluster.Hosting;

/// <summary>Resolves the endpoints a worker needs: the coordinator's, and this machine's address facing it.</summary>
public static class LocalAddress
{
    /// <summary>Parses <c>HOST:PORT</c> (a name or an IPv4/IPv6 address; IPv4 preferred for names).</summary>
    public static IPEndPoint ParseJoin(string join)
    {
        int colon = join.LastIndexOf(':');
        if (colon <= 0 || !int.TryParse(join.AsSpan(colon + 1), out int port) || port is < 1 or > 65535)
        {
            throw new FormatException($"'{join}' is not HOST:PORT (e.g. 192.168.1.20:11111)");
        }

        string host = join[..colon].Trim('[', ']');
        if (IPAddress.TryParse(host, out var address))
        {
            return new IPEndPoint(address, port);
        }

        var addresses = Dns.GetHostAddresses(host);
        var chosen = addresses.FirstOrDefault(a => a.AddressFamily == AddressFamily.InterNetwork) ?? addresses.FirstOrDefault()
            ?? throw new FormatException($"'{host}' does not resolve to an address");
        return new IPEndPoint(chosen, port);
    }

    /// <summary>
    /// The local address the OS would use to reach <paramref name="remote"/> (a UDP "connect" sends nothing),
    /// so a worker advertises the interface the coordinator can actually reach.
    /// </summary>
    public static IPAddress Facing(IPEndPoint remote)
    {
        if (IPAddress.IsLoopback(remote.Address))
        {
            return remote.Address;
        }

        using var socket = new Socket(remote.AddressFamily, SocketType.Dgram, ProtocolType.Udp);
        socket.Connect(remote);
        return ((IPEndPoint)socket.LocalEndPoint!).Address;
    }
}
