using System.Buffers.Binary;
using System.Runtime.InteropServices;
using System.Text;

namespace Foldwise.Core.Data;

/// <summary>Little-endian writes into a buffer sized in advance (the table codec's writing half).</summary>
internal ref struct SpanWriter(Span<byte> buffer)
{
    private readonly Span<byte> buffer = buffer;
    private int position;

    public void Bytes(ReadOnlySpan<byte> bytes)
    {
        bytes.CopyTo(buffer[position..]);
        position += bytes.Length;
    }

    public void Int32(int value)
    {
        BinaryPrimitives.WriteInt32LittleEndian(buffer[position..], value);
        position += sizeof(int);
    }

    public void Text(string text)
    {
        int length = Encoding.UTF8.GetBytes(text, buffer[(position + sizeof(int))..]);
        Int32(length);
        position += length;
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

        foreach (double v in values)
        {
            BinaryPrimitives.WriteDoubleLittleEndian(buffer[position..], v);
            position += sizeof(double);
        }
    }

    public readonly void EnsureFull()
    {
        if (position != buffer.Length)
        {
            throw new InvalidOperationException($"wrote {position} of {buffer.Length} planned bytes");
        }
    }
}
