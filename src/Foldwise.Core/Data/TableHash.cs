using System.Security.Cryptography;

namespace Foldwise.Core.Data;

/// <summary>
/// A table's content address: lowercase hex SHA-256 of its <see cref="TableCodec"/> encoding, so the
/// source path never affects it and a worker can check the bytes it fetched.
/// </summary>
public static class TableHash
{
    public static string Of(FeatureTable table) => TableCodec.Encode(table, Stream.Null);

    /// <summary>The hash of bytes already encoded, for callers that keep the encoding anyway.</summary>
    public static string Of(ReadOnlySpan<byte> encoded) => Convert.ToHexStringLower(SHA256.HashData(encoded));
}
