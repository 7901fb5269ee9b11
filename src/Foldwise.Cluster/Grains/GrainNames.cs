namespace Foldwise.Cluster.Grains;

/// <summary>
/// Stable grain type names. They name the grains in the cluster's type map; all three run only on
/// the coordinator (worker silos exclude their classes), where the session and the store live.
/// </summary>
public static class GrainNames
{
    public const string Search = "foldwise-search";
    public const string Dataset = "foldwise-dataset";
    public const string Board = "foldwise-board";
}
