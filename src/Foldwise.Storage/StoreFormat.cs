using System.Reflection;
using System.Text;
using LiteDB;

namespace Foldwise.Storage;

/// <summary>
/// The store's self-description (collection <c>meta</c>, document <c>format</c>): a format name, a format
/// version that grows whenever a reader of the old version could misread the new layout, and the tool that wrote it.
/// </summary>
internal static class StoreFormat
{
    public const string Name = "foldwise-search";

    /// <summary>
    /// The layout this build writes and the newest it reads. 1: each per-row vector inline in one document
    /// (a million row ids passed LiteDB's 16 MB document cap). 2: per-row vectors in chunks of collection
    /// <c>chunks</c>; format 1's inline vectors still read. 3: the definition kept as a document in the store's
    /// own form (<see cref="DefinitionDocuments"/>), no longer the definition file's text. Every earlier layout still
    /// reads, so opening an earlier store to write only raises its version.
    /// </summary>
    public const int Version = 3;

    public const string MetaCollection = "meta";

    private const string DocumentId = "format";

    // LiteDB 5 writes this text at byte 32 of the header page. Checking it before LiteDB opens a file
    // matters: LiteDB 5.0.21 truncated a CSV and a random file to a page multiple when asked to open them.
    private static readonly byte[] LiteDbMarker = Encoding.ASCII.GetBytes("** This is a LiteDB file **");
    private const int MarkerOffset = 32;
    private const int PageSize = 8192;

    public static string ToolVersion { get; } = ReadToolVersion();

    /// <summary>Refuses, without modifying it, a file LiteDB did not write.</summary>
    public static void EnsureLiteDbFile(string path)
    {
        Span<byte> head = stackalloc byte[MarkerOffset + 27];
        int read;
        using (var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite))
        {
            if (stream.Length < PageSize)
            {
                throw NotAStore(path, "it is too short to be a database");
            }

            read = stream.ReadAtLeast(head, head.Length, throwOnEndOfStream: false);
        }

        if (read < head.Length || !head[MarkerOffset..].SequenceEqual(LiteDbMarker))
        {
            throw NotAStore(path, "it is not a LiteDB database");
        }
    }

    public static void Write(LiteDatabase db) =>
        db.GetCollection(MetaCollection).Upsert(new BsonDocument
        {
            ["_id"] = DocumentId,
            ["name"] = Name,
            ["version"] = Version,
            ["writer"] = ToolVersion,
        });

    /// <summary>Checks the file is a Foldwise store this build can read, and returns the tool that wrote it.</summary>
    public static string Check(LiteDatabase db, string path)
    {
        var doc = db.GetCollection(MetaCollection).FindById(DocumentId);
        if (doc is null || doc["name"] != Name)
        {
            throw NotAStore(path, "it is a LiteDB database without Foldwise's format record");
        }

        int version = doc["version"].IsInt32 ? doc["version"].AsInt32 : 0;
        if (version > Version)
        {
            throw new StoreException(
                $"{Path.GetFileName(path)} was written by a newer Foldwise (store format {version}); this one reads up to {Version}. " +
                $"File: {path}; written by {doc["writer"].AsString ?? "an unknown version"}.");
        }

        if (version < 1)
        {
            throw NotAStore(path, "its format record has no valid version");
        }

        return doc["writer"].AsString ?? "unknown";
    }

    /// <summary>Raises an older store's version to <see cref="Version"/> before this build writes its layout into it.</summary>
    public static void Upgrade(LiteDatabase db)
    {
        var doc = db.GetCollection(MetaCollection).FindById(DocumentId);
        if (doc["version"].AsInt32 < Version)
        {
            doc["version"] = Version;
            db.GetCollection(MetaCollection).Update(doc);
        }
    }

    private static StoreException NotAStore(string path, string why) =>
        new($"{path} is not a Foldwise search store: {why}.");

    private static string ReadToolVersion()
    {
        string? version = typeof(StoreFormat).Assembly
            .GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion;
        return "Foldwise " + (version?.Split('+')[0] ?? "unknown");
    }
}
