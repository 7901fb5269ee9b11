using System.Buffers.Binary;
using System.Runtime.InteropServices;
using System.Text;
using LiteDB;

namespace Foldwise.Storage;

/// <summary>
/// Writes one per-row vector as numbered documents of at most <see cref="Chunks.Bytes"/> bytes in collection
/// <c>chunks</c>, so no document nears LiteDB's 16 MB cap at any row count; the owning document keeps only
/// the reference <see cref="Finish"/> returns. Call inside the owner's transaction.
/// </summary>
internal sealed class ChunkWriter
{
    private readonly ILiteCollection<BsonDocument> _chunks;
    private readonly string _key;
    private readonly byte[] _buffer = new byte[Chunks.Bytes];
    private int _filled;
    private int _written;
    private long _total;
    private int _count;

    public ChunkWriter(LiteDatabase db, string key)
    {
        _chunks = db.GetCollection(Chunks.Collection);
        _key = key;
    }

    public static BsonDocument Doubles(LiteDatabase db, string key, ReadOnlySpan<double> values)
    {
        var writer = new ChunkWriter(db, key);
        writer.Append(MemoryMarshal.AsBytes(BsonFields.EnsureLittleEndian(values)));
        writer._count = values.Length;
        return writer.Finish();
    }

    public static BsonDocument Ints(LiteDatabase db, string key, ReadOnlySpan<int> values)
    {
        var writer = new ChunkWriter(db, key);
        writer.Append(MemoryMarshal.AsBytes(BsonFields.EnsureLittleEndian(values)));
        writer._count = values.Length;
        return writer.Finish();
    }

    /// <summary>Each text as its UTF-8 byte count (32-bit little-endian) and bytes, so any text survives.</summary>
    public static BsonDocument Texts(LiteDatabase db, string key, IEnumerable<string> texts)
    {
        var writer = new ChunkWriter(db, key);
        Span<byte> length = stackalloc byte[sizeof(int)];
        byte[] encoded = new byte[256];
        foreach (string text in texts)
        {
            int needed = Encoding.UTF8.GetMaxByteCount(text.Length);
            if (needed > encoded.Length)
            {
                encoded = new byte[needed];
            }

            int n = Encoding.UTF8.GetBytes(text, encoded);
            BinaryPrimitives.WriteInt32LittleEndian(length, n);
            writer.Append(length);
            writer.Append(encoded.AsSpan(0, n));
            writer._count++;
        }

        return writer.Finish();
    }

    private void Append(ReadOnlySpan<byte> bytes)
    {
        while (!bytes.IsEmpty)
        {
            int take = Math.Min(bytes.Length, _buffer.Length - _filled);
            bytes[..take].CopyTo(_buffer.AsSpan(_filled));
            _filled += take;
            _total += take;
            bytes = bytes[take..];
            if (_filled == _buffer.Length)
            {
                Flush();
            }
        }
    }

    private void Flush()
    {
        _chunks.Upsert(new BsonDocument
        {
            ["_id"] = Chunks.Id(_key, _written),
            ["data"] = _buffer.AsSpan(0, _filled).ToArray(),
        });
        _written++;
        _filled = 0;
    }

    private BsonDocument Finish()
    {
        if (_filled > 0)
        {
            Flush();
        }

        // A vector saved again may be shorter than before: its old tail chunks go.
        for (int stale = _written; _chunks.Delete(Chunks.Id(_key, stale)); stale++)
        {
        }

        return new BsonDocument
        {
            ["key"] = _key,
            ["count"] = _count,
            ["bytes"] = _total,
            ["chunks"] = _written,
        };
    }
}
