using System.Security.Cryptography;
using Foldwise.Cluster.Contracts;

namespace Foldwise.Cluster.Coordination;

/// <summary>A table file the coordinator serves, with its listing; the bytes stay on disk until a chunk is asked for.</summary>
public sealed class ShelvedTable
{
    /// <summary>Bytes per chunk: 4 MiB keeps each message far below Orleans' limits and a worker's buffer small.</summary>
    public const int ChunkSize = 4 << 20;

    private ShelvedTable(string path, TableListing listing)
    {
        Path = path;
        Listing = listing;
    }

    public string Path { get; }

    public TableListing Listing { get; }

    /// <summary>Reads the file once, hashing each chunk and the whole; a file whose hash is not <paramref name="hash"/> is refused.</summary>
    public static ShelvedTable Open(string hash, string path)
    {
        using var file = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 1);
        using var whole = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        var chunkHashes = new List<string>();
        byte[] buffer = new byte[ChunkSize];
        int read;
        while ((read = file.ReadAtLeast(buffer, buffer.Length, throwOnEndOfStream: false)) > 0)
        {
            var chunk = buffer.AsSpan(0, read);
            whole.AppendData(chunk);
            chunkHashes.Add(Convert.ToHexStringLower(SHA256.HashData(chunk)));
        }

        string actual = Convert.ToHexStringLower(whole.GetHashAndReset());
        return actual == hash
            ? new ShelvedTable(path, new TableListing(file.Length, ChunkSize, [.. chunkHashes]))
            : throw new InvalidDataException($"{path} has SHA-256 {actual}, not the table {hash} it should hold");
    }

    /// <summary>Chunk <paramref name="index"/>'s bytes, read from the file at its offset.</summary>
    public byte[] Chunk(int index)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(index);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(index, Listing.ChunkHashes.Length);
        long offset = (long)index * ChunkSize;
        var bytes = new byte[(int)Math.Min(ChunkSize, Listing.Length - offset)];
        using var handle = File.OpenHandle(Path, FileMode.Open, FileAccess.Read, FileShare.Read);
        int read = 0;
        while (read < bytes.Length)
        {
            int n = RandomAccess.Read(handle, bytes.AsSpan(read), offset + read);
            read += n > 0 ? n : throw new IOException($"{Path} ended at byte {offset + read}, before its listed {Listing.Length} bytes");
        }

        return bytes;
    }
}
