using System.Collections.Immutable;
using System.Runtime.InteropServices;
using System.Text;

namespace Foldwise.Core.Data;

/// <summary>
/// The project's binary form of a <see cref="FeatureTable"/>, the bytes workers fetch by hash: little-endian,
/// <c>"FWTB"</c> magic, a 32-bit version (<c>2</c>), then counts, ids, feature names, the target, each
/// column's rows and values, then each category column's name, levels and one code per row. The source path is not
/// encoded, so equal tables encode to equal bytes. Encoding and decoding stream: a table of millions of rows is never
/// one array of bytes.
/// </summary>
public static class TableCodec
{
    internal const int Version = 2;

    internal static ReadOnlySpan<byte> Magic => "FWTB"u8;

    /// <summary>The encoding as one array, for small tables (at most 2 GB).</summary>
    public static byte[] Encode(FeatureTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        using var bytes = new MemoryStream(EncodedLength(table));
        Encode(table, bytes);
        return bytes.ToArray();
    }

    /// <summary>Writes the encoding to <paramref name="destination"/> piece by piece and returns its SHA-256 (<see cref="TableHash"/>).</summary>
    public static string Encode(FeatureTable table, Stream destination)
    {
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(destination);
        using var writer = new EncodingWriter(destination);
        writer.Bytes(Magic);
        writer.Int32(Version);
        writer.Int32(table.RowCount);
        writer.Int32(table.FeatureCount);
        writer.Int32(table.HasTarget ? 1 : 0);
        foreach (string id in table.Ids)
        {
            writer.Text(id);
        }

        foreach (string name in table.FeatureNames)
        {
            writer.Text(name);
        }

        writer.Doubles(table.Target.AsSpan());
        foreach (var column in table.Columns)
        {
            writer.Int32(column.NonZeroCount);
            writer.Int32s(column.Rows.AsSpan());
            writer.Singles(column.Values.AsSpan());
        }

        writer.Int32(table.Categories.Length);
        for (int c = 0; c < table.Categories.Length; c++)
        {
            var category = table.Categories[c];
            writer.Text(table.CategoryNames[c]);
            writer.Int32(category.Levels.Length);
            foreach (string level in category.Levels)
            {
                writer.Text(level);
            }

            writer.Int32s(category.Codes.AsSpan());
        }

        return writer.Finish();
    }

    /// <summary>Rebuilds a table, checking the structure; bytes that are not a valid encoding throw <see cref="InvalidDataException"/>.</summary>
    public static FeatureTable Decode(ReadOnlySpan<byte> bytes, string source)
    {
        using var stream = new MemoryStream(bytes.ToArray(), writable: false);
        return Decode(stream, source);
    }

    /// <summary>Rebuilds a table from a seekable stream positioned at its encoding, which runs to the stream's end.</summary>
    public static FeatureTable Decode(Stream encoded, string source)
    {
        ArgumentNullException.ThrowIfNull(encoded);
        var reader = new EncodingReader(encoded, encoded.Length - encoded.Position);
        if (!reader.Bytes(Magic.Length).SequenceEqual(Magic))
        {
            throw new InvalidDataException($"{source}: not a Foldwise table encoding");
        }

        int version = reader.Int32();
        if (version != Version)
        {
            throw new InvalidDataException($"{source}: table encoding version {version} is not {Version}");
        }

        int rowCount = reader.Count();
        int featureCount = reader.Count();
        bool hasTarget = reader.Int32() != 0;
        var ids = ReadTexts(ref reader, rowCount);
        var names = ReadTexts(ref reader, featureCount);
        var target = hasTarget ? ImmutableCollectionsMarshal.AsImmutableArray(reader.Doubles(rowCount)) : [];
        var columns = new SparseColumn[featureCount];
        for (int c = 0; c < featureCount; c++)
        {
            int n = reader.Count();
            var rows = reader.Int32s(n);
            CheckRows(rows, rowCount, source);
            var values = reader.Singles(n);
            columns[c] = n == 0
                ? SparseColumn.Empty
                : new SparseColumn(ImmutableCollectionsMarshal.AsImmutableArray(rows), ImmutableCollectionsMarshal.AsImmutableArray(values));
        }

        int categoryCount = reader.Count();
        var categoryNames = new string[categoryCount];
        var categories = new CategoryColumn[categoryCount];
        for (int c = 0; c < categoryCount; c++)
        {
            categoryNames[c] = reader.Text();
            var levels = ReadTexts(ref reader, reader.Count());
            var codes = reader.Int32s(rowCount);
            if (codes.AsSpan().ContainsAnyExceptInRange(CategoryColumn.Missing, levels.Length - 1))
            {
                throw new InvalidDataException($"{source}: a category code lies outside its levels");
            }

            categories[c] = new CategoryColumn(levels, ImmutableCollectionsMarshal.AsImmutableArray(codes));
        }

        if (!reader.AtEnd)
        {
            throw new InvalidDataException($"{source}: bytes left over after the table");
        }

        return new FeatureTable(
            source, ids, names, ImmutableCollectionsMarshal.AsImmutableArray(columns), target,
            ImmutableCollectionsMarshal.AsImmutableArray(categoryNames), ImmutableCollectionsMarshal.AsImmutableArray(categories));
    }

    private static int EncodedLength(FeatureTable table)
    {
        long length = Magic.Length + (4 * sizeof(int));
        length += table.Ids.Sum(s => (long)sizeof(int) + Encoding.UTF8.GetByteCount(s));
        length += table.FeatureNames.Sum(s => (long)sizeof(int) + Encoding.UTF8.GetByteCount(s));
        length += (long)table.Target.Length * sizeof(double);
        length += table.Columns.Sum(c => sizeof(int) + ((long)c.NonZeroCount * (sizeof(int) + sizeof(float))));
        length += sizeof(int);
        for (int c = 0; c < table.Categories.Length; c++)
        {
            length += sizeof(int) + Encoding.UTF8.GetByteCount(table.CategoryNames[c]) + sizeof(int);
            length += table.Categories[c].Levels.Sum(s => (long)sizeof(int) + Encoding.UTF8.GetByteCount(s));
            length += (long)table.RowCount * sizeof(int);
        }

        return length <= Array.MaxLength ? (int)length : throw new InvalidOperationException("the table is too large to encode as one array; encode it to a stream");
    }

    private static ImmutableArray<string> ReadTexts(ref EncodingReader reader, int count)
    {
        var texts = new string[count];
        for (int i = 0; i < count; i++)
        {
            texts[i] = reader.Text();
        }

        return ImmutableCollectionsMarshal.AsImmutableArray(texts);
    }

    private static void CheckRows(int[] rows, int rowCount, string source)
    {
        for (int k = 0; k < rows.Length; k++)
        {
            if (rows[k] < 0 || rows[k] >= rowCount || (k > 0 && rows[k] <= rows[k - 1]))
            {
                throw new InvalidDataException($"{source}: a column's rows are not ascending within the table");
            }
        }
    }
}
