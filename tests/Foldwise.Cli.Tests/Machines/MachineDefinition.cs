using System.Text.Json.Nodes;
using Foldwise.Cluster.Hosting;

namespace Foldwise.Cli.Tests.Machines;

/// <summary>Helpers for multi-process tests: a definition whose trials last about a second, free port pairs, history reads.</summary>
internal static class MachineDefinition
{
    /// <summary>LightGBM only, random proposals over a grid-free ASHA with long rungs, so a kill lands mid-trial.</summary>
    public static string Write(Workspace workspace, int trials)
    {
        workspace.WriteTables(trainRows: 2000, testRows: 50);
        return workspace.Write("machines.json", $$"""
            {
              "name": "machines",
              "data": { "train": "train.csv", "test": "test.csv", "id": "id", "target": "y" },
              "folds": 3,
              "screening": { "min_nonzero": 2 },
              "families": { "lightgbm": { "min_leaf_rows": 3 } },
              "schedule": { "kind": "asha", "proposer": "random", "first_rung": 300, "full_budget": 900, "eta": 3 },
              "budget": { "trials": {{trials}} }
            }
            """);
    }

    /// <summary>A silo port whose next port (the gateway) is free too.</summary>
    public static int FreePortPair()
    {
        for (int i = 0; i < 50; i++)
        {
            int port = FreePort.Find();
            try
            {
                using var probe = new System.Net.Sockets.TcpListener(System.Net.IPAddress.Loopback, port + 1);
                probe.Start();
                return port;
            }
            catch (System.Net.Sockets.SocketException)
            {
                // Taken: try another.
            }
        }

        throw new InvalidOperationException("no free port pair on loopback");
    }

    public static JsonArray History(string outDir)
    {
        var result = CliHarness.Run("history", Path.Combine(outDir, "search.db"), "--json");
        Assert.Equal(0, result.ExitCode);
        string text = result.Output;
        return JsonNode.Parse(text[text.IndexOf('[', StringComparison.Ordinal)..])!.AsArray();
    }
}
