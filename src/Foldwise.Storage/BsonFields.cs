using System.Collections.Immutable;
using System.Globalization;
using System.Runtime.InteropServices;
using LiteDB;

namespace Foldwise.Storage;

/// <summary>
/// Conversions between domain values and BSON fields, shared by the document mappers.
/// Numeric vectors are raw little-endian bytes (about 20× faster than a BSON array of doubles; these read
/// format 1's inline vectors, <see cref="ChunkReader"/> the chunked ones); times are round-trip ("O") text
/// so the offset and the full tick precision survive.
/// </summary>
internal static class BsonFields
{
    public static double[] Doubles(BsonDocument doc, string field, string owner) =>
        MemoryMarshal.Cast<byte, double>(Blob(doc, field, owner, sizeof(double))).ToArray();

    public static int[] Ints(BsonDocument doc, string field, string owner) =>
        MemoryMarshal.Cast<byte, int>(Blob(doc, field, owner, sizeof(int))).ToArray();

    public static BsonValue Time(DateTimeOffset? time) =>
        time is { } t ? new BsonValue(t.ToString("O", CultureInfo.InvariantCulture)) : BsonValue.Null;

    public static DateTimeOffset? OptionalTime(BsonDocument doc, string field, string owner) =>
        doc[field].IsNull ? null : ParseTime(doc, field, owner);

    public static DateTimeOffset RequiredTime(BsonDocument doc, string field, string owner) =>
        ParseTime(doc, field, owner);

    public static BsonValue Nullable(int? value) => value is { } v ? new BsonValue(v) : BsonValue.Null;

    public static BsonValue Nullable(double? value) => value is { } v ? new BsonValue(v) : BsonValue.Null;

    public static BsonValue Nullable(string? value) => value is null ? BsonValue.Null : new BsonValue(value);

    public static BsonArray Array(ImmutableArray<string> values) =>
        new(values.IsDefault ? [] : values.Select(v => new BsonValue(v)));

    public static BsonArray Array(ImmutableArray<double> values) =>
        new(values.IsDefault ? [] : values.Select(v => new BsonValue(v)));

    public static ImmutableArray<string> Strings(BsonDocument doc, string field, string owner) =>
        [.. Required(doc, field, owner, BsonType.Array).AsArray.Select(v => v.AsString)];

    public static ImmutableArray<double> DoubleArray(BsonDocument doc, string field, string owner) =>
        [.. Required(doc, field, owner, BsonType.Array).AsArray.Select(v => v.AsDouble)];

    public static string String(BsonDocument doc, string field, string owner) =>
        Required(doc, field, owner, BsonType.String).AsString;

    public static string? OptionalString(BsonDocument doc, string field) =>
        doc[field].IsNull ? null : doc[field].AsString;

    public static int Int(BsonDocument doc, string field, string owner) =>
        Required(doc, field, owner, BsonType.Int32).AsInt32;

    public static int? OptionalInt(BsonDocument doc, string field) =>
        doc[field].IsNull ? null : doc[field].AsInt32;

    public static double Double(BsonDocument doc, string field, string owner) =>
        Required(doc, field, owner, BsonType.Double).AsDouble;

    public static double? OptionalDouble(BsonDocument doc, string field) =>
        doc[field].IsNull ? null : doc[field].AsDouble;

    public static bool Bool(BsonDocument doc, string field, string owner) =>
        Required(doc, field, owner, BsonType.Boolean).AsBoolean;

    public static TEnum Enum<TEnum>(BsonDocument doc, string field, string owner)
        where TEnum : struct, Enum
    {
        string text = String(doc, field, owner);
        return System.Enum.TryParse(text, ignoreCase: false, out TEnum value) && System.Enum.IsDefined(value)
            ? value
            : throw Damaged(owner, $"'{field}' holds '{text}', which is not a {typeof(TEnum).Name}");
    }

    public static BsonValue Required(BsonDocument doc, string field, string owner, BsonType type)
    {
        var value = doc[field];
        return value.Type == type ? value : throw Damaged(owner, value.IsNull ? $"'{field}' is missing" : $"'{field}' is a {value.Type}, not a {type}");
    }

    public static StoreException Damaged(string owner, string why) => new($"The search store is damaged: {owner}: {why}.");

    private static ReadOnlySpan<byte> Blob(BsonDocument doc, string field, string owner, int width)
    {
        byte[] bytes = Required(doc, field, owner, BsonType.Binary).AsBinary;
        if (bytes.Length % width != 0)
        {
            throw Damaged(owner, $"'{field}' holds {bytes.Length} bytes, not a whole number of {width}-byte values");
        }

        return EnsureLittleEndian<byte>(bytes);
    }

    private static DateTimeOffset ParseTime(BsonDocument doc, string field, string owner)
    {
        string text = String(doc, field, owner);
        return DateTimeOffset.TryParseExact(text, "O", CultureInfo.InvariantCulture, DateTimeStyles.None, out var time)
            ? time
            : throw Damaged(owner, $"'{field}' holds '{text}', which is not a round-trip time");
    }

    // The byte layout is little-endian by definition; a big-endian host would misread every vector.
    public static ReadOnlySpan<T> EnsureLittleEndian<T>(ReadOnlySpan<T> values) =>
        BitConverter.IsLittleEndian ? values : throw new StoreException("The search store's vectors are little-endian; this host is big-endian.");
}
