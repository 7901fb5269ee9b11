using System.Buffers.Binary;
using System.Runtime.InteropServices;
using System.Text;

namespace Foldwise.Core.Data;

/// <summary>Little-endian reads that fail with <see cref="InvalidDataException"/> on truncated input (the codec's reading half).</summary>
internal ref struct SpanReader(ReadOnlySpan<byte> bytes)
{
    private readonly ReadOnlySpan<byte> bytes = bytes;
    private int position;

    public readonly bool AtEnd => position == bytes.Length;

    public ReadOnlySpan<byte> Bytes(int length)
    {
        if (length < 0 || length > bytes.Length - position)
        {
            throw new InvalidDataException("the table encoding ends early");
        }

        var span = bytes.Slice(position, length);
        position += length;
        return span;
    }

    public int Int32() => BinaryPrimitives.ReadInt32LittleEndian(Bytes(sizeof(int)));

    /// <summary>A count, which can be neither negative nor larger than the bytes left.</summary>
    public int Count()
    {
        int n = Int32();
        return n >= 0 && n <= bytes.Length - position ? n : throw new InvalidDataException("the table encoding holds an impossible count");
    }

    public string Text() => Encoding.UTF8.GetString(Bytes(Count()));

    public int[] Int32s(int count)
    {
        var raw = Bytes(checked(count * sizeof(int)));
        if (BitConverter.IsLittleEndian)
        {
            return MemoryMarshal.Cast<byte, int>(raw).ToArray();
        }

        var values = new int[count];
        for (int i = 0; i < count; i++)
        {
            values[i] = BinaryPrimitives.ReadInt32LittleEndian(raw[(i * sizeof(int))..]);
        }

        return values;
    }

    public float[] Singles(int count)
    {
        var raw = Bytes(checked(count * sizeof(float)));
        if (BitConverter.IsLittleEndian)
        {
            return MemoryMarshal.Cast<byte, float>(raw).ToArray();
        }

        var values = new float[count];
        for (int i = 0; i < count; i++)
        {
            values[i] = BinaryPrimitives.ReadSingleLittleEndian(raw[(i * sizeof(float))..]);
        }

        return values;
    }

    public double[] Doubles(int count)
    {
        var raw = Bytes(checked(count * sizeof(double)));
        if (BitConverter.IsLittleEndian)
        {
            return MemoryMarshal.Cast<byte, double>(raw).ToArray();
        }

        var values = new double[count];
        for (int i = 0; i < count; i++)
        {
            values[i] = BinaryPrimitives.ReadDoubleLittleEndian(raw[(i * sizeof(double))..]);
        }

        return values;
    }
}
