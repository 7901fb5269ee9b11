using System.Buffers.Binary;
using System.Collections.Immutable;
using System.Runtime.InteropServices;
using System.Text;
using LiteDB;
using static Foldwise.Storage.BsonFields;

namespace Foldwise.Storage;

/// <summary>
/// Reads back a vector that <see cref="ChunkWriter"/> wrote, one chunk document per fetch, so a reader holds
/// the file for one chunk at a time and never builds the whole vector's bytes as one array.
/// </summary>
internal sealed class ChunkReader
{
    private readonly Func<string, byte[]?> _fetch;
    private readonly string _owner;
    private readonly string _key;
    private readonly int _chunkCount;
    private byte[] _chunk = [];
    private int _position;
    private int _next;

    private ChunkReader(BsonDocument reference, Func<string, byte[]?> fetch, string owner)
    {
        _fetch = fetch;
        _owner = owner;
        _key = String(reference, "key", owner);
        Count = Int(reference, "count", owner);
        Length = Required(reference, "bytes", owner, BsonType.Int64).AsInt64;
        _chunkCount = Int(reference, "chunks", owner);
    }

    public int Count { get; }

    public long Length { get; }

    /// <summary>A vector of doubles: chunked (format 2), or inline bytes as format 1 kept it.</summary>
    public static double[] Doubles(BsonDocument doc, string field, Func<string, byte[]?> fetch, string owner)
    {
        if (doc[field].IsBinary)
        {
            return BsonFields.Doubles(doc, field, owner);
        }

        var reader = Open(doc, field, fetch, owner, sizeof(double));
        var values = new double[reader.Count];
        reader.Fill(MemoryMarshal.AsBytes(values.AsSpan()));
        reader.EnsureEnd(reader.Length);
        return values;
    }

    /// <summary>A vector of integers: chunked (format 2), or inline bytes as format 1 kept it.</summary>
    public static int[] Ints(BsonDocument doc, string field, Func<string, byte[]?> fetch, string owner)
    {
        if (doc[field].IsBinary)
        {
            return BsonFields.Ints(doc, field, owner);
        }

        var reader = Open(doc, field, fetch, owner, sizeof(int));
        var values = new int[reader.Count];
        reader.Fill(MemoryMarshal.AsBytes(values.AsSpan()));
        reader.EnsureEnd(reader.Length);
        return values;
    }

    /// <summary>A vector of texts: chunked (format 2), or a BSON array as format 1 kept it.</summary>
    public static ImmutableArray<string> Texts(BsonDocument doc, string field, Func<string, byte[]?> fetch, string owner)
    {
        if (doc[field].IsArray)
        {
            return Strings(doc, field, owner);
        }

        var reader = new ChunkReader(Reference(doc, field, owner), fetch, owner);
        var texts = new string[reader.Count];
        Span<byte> length = stackalloc byte[sizeof(int)];
        byte[] buffer = new byte[256];
        long read = 0;
        for (int i = 0; i < texts.Length; i++)
        {
            reader.Fill(length);
            int n = BinaryPrimitives.ReadInt32LittleEndian(length);
            if (n < 0 || read + sizeof(int) + n > reader.Length)
            {
                throw Damaged(owner, $"text {i} claims {n} bytes, past the end of its chunks");
            }

            if (n > buffer.Length)
            {
                buffer = new byte[n];
            }

            reader.Fill(buffer.AsSpan(0, n));
            texts[i] = Encoding.UTF8.GetString(buffer, 0, n);
            read += sizeof(int) + n;
        }

        reader.EnsureEnd(read);
        return ImmutableCollectionsMarshal.AsImmutableArray(texts);
    }

    private static ChunkReader Open(BsonDocument doc, string field, Func<string, byte[]?> fetch, string owner, int width)
    {
        var reader = new ChunkReader(Reference(doc, field, owner), fetch, owner);
        if (reader.Length != (long)reader.Count * width)
        {
            throw Damaged(owner, $"'{reader._key}' holds {reader.Length} bytes, not {reader.Count} values of {width} bytes");
        }

        return reader;
    }

    private static BsonDocument Reference(BsonDocument doc, string field, string owner) =>
        Required(doc, field, owner, BsonType.Document).AsDocument;

    private void Fill(Span<byte> destination)
    {
        EnsureLittleEndian<byte>(destination);
        while (!destination.IsEmpty)
        {
            if (_position == _chunk.Length)
            {
                NextChunk();
            }

            int take = Math.Min(destination.Length, _chunk.Length - _position);
            _chunk.AsSpan(_position, take).CopyTo(destination);
            _position += take;
            destination = destination[take..];
        }
    }

    private void NextChunk()
    {
        if (_next >= _chunkCount)
        {
            throw Damaged(_owner, $"'{_key}' ends after {_chunkCount} chunks, before its {Length} bytes");
        }

        string id = Chunks.Id(_key, _next);
        _chunk = _fetch(id) ?? throw Damaged(_owner, $"chunk '{id}' is missing");
        if (_chunk.Length == 0)
        {
            throw Damaged(_owner, $"chunk '{id}' is empty");
        }

        _position = 0;
        _next++;
    }

    private void EnsureEnd(long read)
    {
        if (read != Length || _position != _chunk.Length || _next != _chunkCount)
        {
            throw Damaged(_owner, $"'{_key}' holds more than its {Count} values");
        }
    }
}
