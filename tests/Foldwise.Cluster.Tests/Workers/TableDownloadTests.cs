using System.Security.Cryptography;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Workers;

namespace Foldwise.Cluster.Tests.Workers;

public sealed class TableDownloadTests : IDisposable
{
    private readonly string _path = Path.Combine(Path.GetTempPath(), "foldwise-download-" + Guid.NewGuid().ToString("N") + ".part");

    public void Dispose() => File.Delete(_path);

    private static (string Hash, TableListing Listing, byte[][] Chunks) Served(int chunkCount, int chunkSize)
    {
        var random = new Random(3);
        var chunks = Enumerable.Range(0, chunkCount).Select(_ =>
        {
            var bytes = new byte[chunkSize];
            random.NextBytes(bytes);
            return bytes;
        }).ToArray();
        string hash = Convert.ToHexStringLower(SHA256.HashData(chunks.SelectMany(c => c).ToArray()));
        var listing = new TableListing(chunks.Sum(c => (long)c.Length), chunkSize, [.. chunks.Select(c => Convert.ToHexStringLower(SHA256.HashData(c)))]);
        return (hash, listing, chunks);
    }

    [Fact]
    public async Task Writes_every_chunk_in_order_when_each_matches_its_listing()
    {
        var (hash, listing, chunks) = Served(chunkCount: 3, chunkSize: 1000);

        await TableDownload.ToFileAsync(hash, listing, i => Task.FromResult(chunks[i]), _path, CancellationToken.None);

        Assert.Equal(chunks.SelectMany(c => c).ToArray(), await File.ReadAllBytesAsync(_path));
    }

    [Fact]
    public async Task Tells_the_bytes_written_after_each_chunk()
    {
        var (hash, listing, chunks) = Served(chunkCount: 3, chunkSize: 1000);
        var told = new List<(long, long)>();

        await TableDownload.ToFileAsync(hash, listing, i => Task.FromResult(chunks[i]), _path, CancellationToken.None, (done, total) => told.Add((done, total)));

        Assert.Equal([(1000L, 3000L), (2000L, 3000L), (3000L, 3000L)], told);
    }

    [Fact]
    public async Task Refuses_a_corrupted_chunk_and_asks_for_no_chunk_after_it()
    {
        // Given a coordinator whose second chunk arrives with one flipped bit
        var (hash, listing, chunks) = Served(chunkCount: 4, chunkSize: 1000);
        var asked = new List<int>();
        Task<byte[]> Fetch(int i)
        {
            asked.Add(i);
            var bytes = (byte[])chunks[i].Clone();
            if (i == 1)
            {
                bytes[500] ^= 0x04;
            }

            return Task.FromResult(bytes);
        }

        // When the worker downloads the table
        var error = await Assert.ThrowsAsync<IOException>(() => TableDownload.ToFileAsync(hash, listing, Fetch, _path, CancellationToken.None));

        // Then the damaged chunk is named and refused before it is written, and the download stops there
        Assert.Equal($"chunk 2 of 4 of table {hash} arrived damaged (its SHA-256 is not the listed one); refusing it", error.Message);
        Assert.Equal([0, 1], asked);
        Assert.Equal(chunks[0], await File.ReadAllBytesAsync(_path));
    }

    [Fact]
    public async Task Refuses_chunks_that_match_a_listing_of_another_table()
    {
        var (_, listing, chunks) = Served(chunkCount: 2, chunkSize: 100);
        string otherHash = new('0', 64);

        var error = await Assert.ThrowsAsync<IOException>(() =>
            TableDownload.ToFileAsync(otherHash, listing, i => Task.FromResult(chunks[i]), _path, CancellationToken.None));

        Assert.Equal($"table {otherHash} arrived with a different hash; refusing it", error.Message);
    }
}
