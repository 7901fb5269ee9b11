using System.Net;

namespace Foldwise.Cli.Running;

/// <summary>
/// A machine that listens beyond loopback without the cluster certificate lets anyone who reaches it in: it starts
/// only when the user accepts that with <c>--open-cluster</c>, and then says the risk.
/// </summary>
internal static class OpenCluster
{
    public const string Option = "--open-cluster";

    public const string Risk = "anyone who can reach this machine's ports could read the training table and post results";

    /// <summary>Null when this may start; otherwise the one line refusing it.</summary>
    public static string? Refusal(string role, IPAddress listensOn, bool hasCertificate, bool accepted) =>
        IPAddress.IsLoopback(listensOn) || hasCertificate || accepted
            ? null
            : $"this {role} would listen on {listensOn} without a cluster certificate: {Risk}. Give --cert FILE (made by 'foldwise cluster-cert'), " +
              $"or accept an open cluster with {Option}";

    /// <summary>The line an accepted open cluster prints at start; null when it is not open.</summary>
    public static string? Warning(IPAddress listensOn, bool hasCertificate) =>
        IPAddress.IsLoopback(listensOn) || hasCertificate ? null : $"Open cluster (no certificate): {Risk}";
}
