using System.Buffers.Binary;
using System.Runtime.InteropServices;
using System.Security.Cryptography;
using System.Text;

namespace Foldwise.Core.Data;

/// <summary>
/// Little-endian writes to a stream, hashing every byte as it passes (the table codec's writing half), so an
/// encoding of any size goes to a file or a hash without ever being one array.
/// </summary>
internal sealed class EncodingWriter(Stream destination) : IDisposable
{
    private const int BufferSize = 1 << 16;
    private readonly IncrementalHash hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
    private readonly byte[] buffer = new byte[BufferSize];
    private int filled;

    public long Length { get; private set; }

    public void Bytes(ReadOnlySpan<byte> bytes)
    {
        Length += bytes.Length;
        if (bytes.Length > buffer.Length - filled)
        {
            Drain();
            if (bytes.Length > buffer.Length)
            {
                Pass(bytes);
                return;
            }
        }

        bytes.CopyTo(buffer.AsSpan(filled));
        filled += bytes.Length;
    }

    public void Int32(int value)
    {
        Span<byte> bytes = stackalloc byte[sizeof(int)];
        BinaryPrimitives.WriteInt32LittleEndian(bytes, value);
        Bytes(bytes);
    }

    public void Text(string text)
    {
        byte[] encoded = Encoding.UTF8.GetBytes(text);
        Int32(encoded.Length);
        Bytes(encoded);
    }

    public void Int32s(ReadOnlySpan<int> values)
    {
        if (BitConverter.IsLittleEndian)
        {
            Bytes(MemoryMarshal.AsBytes(values));
            return;
        }

        foreach (int v in values)
        {
            Int32(v);
        }
    }

    public void Singles(ReadOnlySpan<float> values) => Int32s(MemoryMarshal.Cast<float, int>(values));

    public void Doubles(ReadOnlySpan<double> values)
    {
        if (BitConverter.IsLittleEndian)
        {
            Bytes(MemoryMarshal.AsBytes(values));
            return;
        }

        Span<byte> bytes = stackalloc byte[sizeof(double)];
        foreach (double v in values)
        {
            BinaryPrimitives.WriteDoubleLittleEndian(bytes, v);
            Bytes(bytes);
        }
    }

    /// <summary>Writes what is buffered and returns the lowercase hex SHA-256 of everything written.</summary>
    public string Finish()
    {
        Drain();
        destination.Flush();
        return Convert.ToHexStringLower(hash.GetHashAndReset());
    }

    public void Dispose() => hash.Dispose();

    private void Drain()
    {
        Pass(buffer.AsSpan(0, filled));
        filled = 0;
    }

    private void Pass(ReadOnlySpan<byte> bytes)
    {
        hash.AppendData(bytes);
        destination.Write(bytes);
    }
}
