using System.Buffers.Binary;
using System.Runtime.InteropServices;
using System.Text;

namespace Foldwise.Core.Data;

/// <summary>
/// Little-endian reads from a stream that fail with <see cref="InvalidDataException"/> on truncated input (the
/// codec's reading half); arrays are read straight into their own memory, so no copy of the whole encoding exists.
/// </summary>
internal sealed class EncodingReader(Stream source, long length)
{
    private byte[] text = new byte[256];
    private long position;

    public bool AtEnd => position == length;

    public ReadOnlySpan<byte> Bytes(int count)
    {
        var bytes = new byte[count];
        Fill(bytes);
        return bytes;
    }

    public int Int32()
    {
        Span<byte> bytes = stackalloc byte[sizeof(int)];
        Fill(bytes);
        return BinaryPrimitives.ReadInt32LittleEndian(bytes);
    }

    /// <summary>A count, which can be neither negative nor larger than the bytes left.</summary>
    public int Count()
    {
        int n = Int32();
        return n >= 0 && n <= length - position ? n : throw new InvalidDataException("the table encoding holds an impossible count");
    }

    public string Text()
    {
        int n = Count();
        if (n > text.Length)
        {
            text = new byte[n];
        }

        Fill(text.AsSpan(0, n));
        return Encoding.UTF8.GetString(text, 0, n);
    }

    public int[] Int32s(int count)
    {
        var values = new int[Checked(count, sizeof(int))];
        Fill(MemoryMarshal.AsBytes(values.AsSpan()));
        if (!BitConverter.IsLittleEndian)
        {
            BinaryPrimitives.ReverseEndianness(values, values);
        }

        return values;
    }

    public float[] Singles(int count)
    {
        var values = new float[Checked(count, sizeof(float))];
        Fill(MemoryMarshal.AsBytes(values.AsSpan()));
        if (!BitConverter.IsLittleEndian)
        {
            var raw = MemoryMarshal.Cast<float, int>(values.AsSpan());
            BinaryPrimitives.ReverseEndianness(raw, raw);
        }

        return values;
    }

    public double[] Doubles(int count)
    {
        var values = new double[Checked(count, sizeof(double))];
        Fill(MemoryMarshal.AsBytes(values.AsSpan()));
        if (!BitConverter.IsLittleEndian)
        {
            var raw = MemoryMarshal.Cast<double, long>(values.AsSpan());
            BinaryPrimitives.ReverseEndianness(raw, raw);
        }

        return values;
    }

    // An impossible count is refused before its array is allocated.
    private int Checked(int count, int width) =>
        count >= 0 && (long)count * width <= length - position ? count : throw new InvalidDataException("the table encoding ends early");

    private void Fill(Span<byte> destination)
    {
        if (destination.Length > length - position)
        {
            throw new InvalidDataException("the table encoding ends early");
        }

        try
        {
            source.ReadExactly(destination);
        }
        catch (EndOfStreamException ex)
        {
            throw new InvalidDataException("the table encoding ends early", ex);
        }

        position += destination.Length;
    }
}
