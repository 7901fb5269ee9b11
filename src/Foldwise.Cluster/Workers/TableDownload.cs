using System.Security.Cryptography;
using Foldwise.Cluster.Contracts;

namespace Foldwise.Cluster.Workers;

/// <summary>
/// Fetches a table chunk by chunk into a file: each chunk is checked against its listed SHA-256 before it is
/// written, and the whole against the table's hash as the chunks pass, so at most one chunk is ever in memory.
/// The file is its owner's only (<see cref="CacheFolder"/>).
/// </summary>
public static class TableDownload
{
    /// <summary>Writes the table to <paramref name="path"/>; a damaged chunk or a whole that does not match throws <see cref="IOException"/>.</summary>
    /// <param name="bytesWritten">Told after each chunk the bytes written so far and the table's length.</param>
    public static async Task ToFileAsync(
        string hash,
        TableListing listing,
        Func<int, Task<byte[]>> chunk,
        string path,
        CancellationToken cancellation,
        Action<long, long>? bytesWritten = null)
    {
        ArgumentNullException.ThrowIfNull(listing);
        ArgumentNullException.ThrowIfNull(chunk);
        using var whole = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        await using var file = CacheFolder.CreateOwnerOnly(path);
        int count = listing.ChunkHashes.Length;
        long written = 0;
        for (int i = 0; i < count; i++)
        {
            cancellation.ThrowIfCancellationRequested();
            var bytes = await chunk(i);
            if (Convert.ToHexStringLower(SHA256.HashData(bytes)) != listing.ChunkHashes[i])
            {
                throw new IOException($"chunk {i + 1} of {count} of table {hash} arrived damaged (its SHA-256 is not the listed one); refusing it");
            }

            whole.AppendData(bytes);
            await file.WriteAsync(bytes, cancellation);
            written += bytes.Length;
            bytesWritten?.Invoke(written, listing.Length);
        }

        if (written != listing.Length || Convert.ToHexStringLower(whole.GetHashAndReset()) != hash)
        {
            throw new IOException($"table {hash} arrived with a different hash; refusing it");
        }

        await file.FlushAsync(cancellation);
    }
}
