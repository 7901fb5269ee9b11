using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cluster.Hosting;

/// <summary>Follows Orleans' membership snapshots and reports silos that joined or were declared dead.</summary>
internal sealed partial class MembershipWatch(IClusterMembershipService membership, ClusterMembers members, ILogger<MembershipWatch> logger) : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var known = new Dictionary<SiloAddress, SiloStatus>();
        try
        {
            await foreach (var snapshot in membership.MembershipUpdates.WithCancellation(stoppingToken))
            {
                var lines = new List<string>();
                foreach (var (address, member) in snapshot.Members)
                {
                    bool wasActive = known.TryGetValue(address, out var before) && before == SiloStatus.Active;
                    if (member.Status == SiloStatus.Active && !wasActive)
                    {
                        lines.Add($"joined: {address.Endpoint} ({member.Name})");
                    }
                    else if (member.Status == SiloStatus.Dead && wasActive)
                    {
                        lines.Add($"left: {address.Endpoint} ({member.Name})");
                    }

                    known[address] = member.Status;
                }

                string[] active = [.. snapshot.Members.Values.Where(m => m.Status == SiloStatus.Active).Select(m => $"{m.SiloAddress.Endpoint} ({m.Name})")];
                members.Update(active, lines);
                foreach (string line in lines)
                {
                    LogMembership(line);
                }
            }
        }
        catch (OperationCanceledException)
        {
            // Silo stopping.
        }
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Cluster member {Line}")]
    private partial void LogMembership(string line);
}
