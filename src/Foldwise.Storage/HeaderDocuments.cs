using Foldwise.Core.Folds;
using Foldwise.Core.Search;
using LiteDB;
using static Foldwise.Storage.BsonFields;

namespace Foldwise.Storage;

/// <summary>
/// Maps <see cref="SearchHeader"/> to two documents in <c>search</c>: <c>header</c>, written once
/// (it carries every row id, so it can be a megabyte), and <c>progress</c>, the spent time and the
/// finished flag, small enough to rewrite every few seconds.
/// </summary>
internal static class HeaderDocuments
{
    public const string Collection = "search";
    public const string HeaderId = "header";
    public const string ProgressId = "progress";
    private const string Owner = "the search header";

    public static BsonDocument ToHeader(SearchHeader h) => new()
    {
        ["_id"] = HeaderId,
        ["searchId"] = h.SearchId,
        ["definition"] = DefinitionDocuments.ToDocument(h.Definition),
        ["folds"] = new BsonDocument
        {
            ["foldCount"] = h.Folds.FoldCount,
            ["seed"] = h.Folds.Seed,
            ["foldOfRow"] = Bytes(h.Folds.FoldOfRow.IsDefault ? [] : h.Folds.FoldOfRow.AsSpan()),
        },
        ["trainHash"] = h.TrainHash,
        ["testHash"] = h.TestHash,
        ["trainIds"] = Array(h.TrainIds),
        ["testIds"] = Array(h.TestIds),
        ["trainTarget"] = Bytes(h.TrainTarget.IsDefault ? [] : h.TrainTarget.AsSpan()),
        ["created"] = Time(h.Created),
    };

    public static BsonDocument ToProgress(double spentSeconds, bool finished) => new()
    {
        ["_id"] = ProgressId,
        ["spentSeconds"] = spentSeconds,
        ["finished"] = finished,
    };

    /// <summary>Format 2 keeps the definition as a document of its own; format 1 kept the definition file's text.</summary>
    private static Core.Definition.SearchDefinition DefinitionOf(BsonDocument header) =>
        header["definition"].IsDocument
            ? DefinitionDocuments.FromDocument(header["definition"].AsDocument)
            : FormatOneDefinition.Read(String(header, "definitionJson", Owner));

    public static SearchHeader FromDocuments(BsonDocument header, BsonDocument? progress)
    {
        var folds = Required(header, "folds", Owner, BsonType.Document).AsDocument;
        return new SearchHeader
        {
            SearchId = String(header, "searchId", Owner),
            Definition = DefinitionOf(header),
            Folds = new FoldPlan(
                Int(folds, "foldCount", Owner),
                Int(folds, "seed", Owner),
                [.. Ints(folds, "foldOfRow", Owner)]),
            TrainHash = String(header, "trainHash", Owner),
            TestHash = String(header, "testHash", Owner),
            TrainIds = Strings(header, "trainIds", Owner),
            TestIds = Strings(header, "testIds", Owner),
            TrainTarget = [.. Doubles(header, "trainTarget", Owner)],
            Created = RequiredTime(header, "created", Owner),
            SpentSeconds = progress is null ? 0 : Double(progress, "spentSeconds", Owner),
            Finished = progress is not null && Bool(progress, "finished", Owner),
        };
    }
}
