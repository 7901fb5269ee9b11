using Foldwise.Core.Folds;
using Foldwise.Core.Search;
using LiteDB;
using static Foldwise.Storage.BsonFields;

namespace Foldwise.Storage;

/// <summary>
/// Maps <see cref="SearchHeader"/> to two documents in <c>search</c>: <c>header</c>, written once, whose
/// per-row vectors (row ids, target, fold of each row) are chunks it refers to, and <c>progress</c>, the spent
/// time and the finished flag, small enough to rewrite every few seconds. Format 1 kept the vectors inline;
/// they still read.
/// </summary>
internal static class HeaderDocuments
{
    public const string Collection = "search";
    public const string HeaderId = "header";
    public const string ProgressId = "progress";
    private const string Owner = "the search header";

    /// <summary>Writes the vectors' chunks and returns the header document referring to them; call in a transaction.</summary>
    public static BsonDocument ToHeader(LiteDatabase db, SearchHeader h) => new()
    {
        ["_id"] = HeaderId,
        ["searchId"] = h.SearchId,
        ["definition"] = DefinitionDocuments.ToDocument(h.Definition),
        ["folds"] = new BsonDocument
        {
            ["foldCount"] = h.Folds.FoldCount,
            ["seed"] = h.Folds.Seed,
            ["foldOfRow"] = ChunkWriter.Ints(db, "header.foldOfRow", h.Folds.FoldOfRow.IsDefault ? [] : h.Folds.FoldOfRow.AsSpan()),
        },
        ["trainHash"] = h.TrainHash,
        ["testHash"] = h.TestHash,
        ["trainIds"] = ChunkWriter.Texts(db, "header.trainIds", h.TrainIds.IsDefault ? [] : h.TrainIds),
        ["testIds"] = ChunkWriter.Texts(db, "header.testIds", h.TestIds.IsDefault ? [] : h.TestIds),
        ["trainTarget"] = ChunkWriter.Doubles(db, "header.trainTarget", h.TrainTarget.IsDefault ? [] : h.TrainTarget.AsSpan()),
        ["created"] = Time(h.Created),
    };

    public static BsonDocument ToProgress(double spentSeconds, bool finished) => new()
    {
        ["_id"] = ProgressId,
        ["spentSeconds"] = spentSeconds,
        ["finished"] = finished,
    };

    /// <summary>Format 3 keeps the definition as a document of its own; formats 1 and 2 kept the definition file's text.</summary>
    private static Core.Definition.SearchDefinition DefinitionOf(BsonDocument header) =>
        header["definition"].IsDocument
            ? DefinitionDocuments.FromDocument(header["definition"].AsDocument)
            : EarlierDefinitionText.Read(String(header, "definitionJson", Owner));

    /// <summary>Rebuilds the header; <paramref name="fetch"/> reads one chunk by id.</summary>
    public static SearchHeader FromDocuments(BsonDocument header, BsonDocument? progress, Func<string, byte[]?> fetch)
    {
        var folds = Required(header, "folds", Owner, BsonType.Document).AsDocument;
        return new SearchHeader
        {
            SearchId = String(header, "searchId", Owner),
            Definition = DefinitionOf(header),
            Folds = new FoldPlan(
                Int(folds, "foldCount", Owner),
                Int(folds, "seed", Owner),
                [.. ChunkReader.Ints(folds, "foldOfRow", fetch, Owner)]),
            TrainHash = String(header, "trainHash", Owner),
            TestHash = String(header, "testHash", Owner),
            TrainIds = ChunkReader.Texts(header, "trainIds", fetch, Owner),
            TestIds = ChunkReader.Texts(header, "testIds", fetch, Owner),
            TrainTarget = [.. ChunkReader.Doubles(header, "trainTarget", fetch, Owner)],
            Created = RequiredTime(header, "created", Owner),
            SpentSeconds = progress is null ? 0 : Double(progress, "spentSeconds", Owner),
            Finished = progress is not null && Bool(progress, "finished", Owner),
        };
    }
}
