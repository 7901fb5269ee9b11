namespace Foldwise.Storage;

/// <summary>Where the chunks of per-row vectors live and how they are named (format 2 onwards).</summary>
internal static class Chunks
{
    public const string Collection = "chunks";

    /// <summary>Bytes per chunk document: 1 MiB, far below LiteDB's 16 MB document cap.</summary>
    public const int Bytes = 1 << 20;

    public static string Id(string key, int index) => $"{key}#{index}";
}
