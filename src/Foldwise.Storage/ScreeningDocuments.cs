using Foldwise.Core.Encodings;
using Foldwise.Core.Screening;
using LiteDB;
using static Foldwise.Storage.BsonFields;

namespace Foldwise.Storage;

/// <summary>Maps <see cref="ScreeningReport"/> to the <c>screening</c> document of collection <c>search</c> and back.</summary>
internal static class ScreeningDocuments
{
    public const string Id = "screening";
    private const string Owner = "the screening report";

    public static BsonDocument ToDocument(ScreeningReport report) => new()
    {
        ["_id"] = Id,
        ["columnsRead"] = report.ColumnsRead,
        ["kept"] = Array(report.Kept),
        ["dropped"] = new BsonArray(report.Dropped.IsDefault ? [] : report.Dropped.Select(d => (BsonValue)new BsonDocument
        {
            ["name"] = d.Name,
            ["reason"] = d.Reason.ToString(),
            ["sameAs"] = Nullable(d.SameAs),
        })),
        ["categories"] = new BsonArray(report.Categories.Select(c => (BsonValue)new BsonDocument
        {
            ["name"] = c.Name,
            ["levels"] = c.Levels,
            ["levelsKept"] = c.LevelsKept,
            ["encoding"] = c.Encoding.ToString(),
            ["missingShare"] = c.MissingShare,
            ["newTestLevels"] = c.NewTestLevels,
            ["newTestRows"] = c.NewTestRows,
        })),
        ["gaps"] = new BsonArray(report.Gaps.Select(g => (BsonValue)new BsonDocument
        {
            ["name"] = g.Name,
            ["missingShare"] = g.MissingShare,
        })),
    };

    // Stores written before category columns existed have no "categories" or "gaps": they read as none.
    public static ScreeningReport FromDocument(BsonDocument doc) => new(
        Int(doc, "columnsRead", Owner),
        Strings(doc, "kept", Owner),
        [.. Required(doc, "dropped", Owner, BsonType.Array).AsArray.Select(v => Dropped(v))],
        [.. Optional(doc, "categories").Select(v => Category(v))],
        [.. Optional(doc, "gaps").Select(v => Gap(v))]);

    private static BsonArray Optional(BsonDocument doc, string field) =>
        doc.TryGetValue(field, out var value) && value.IsArray ? value.AsArray : [];

    private static CategoryNote Category(BsonValue value)
    {
        var c = value.IsDocument ? value.AsDocument : throw Damaged(Owner, "a category column is not a document");
        return new CategoryNote(
            String(c, "name", Owner), Int(c, "levels", Owner), Int(c, "levelsKept", Owner), Enum<CategoryEncodingKind>(c, "encoding", Owner),
            Double(c, "missingShare", Owner), Int(c, "newTestLevels", Owner), Int(c, "newTestRows", Owner));
    }

    private static ColumnGap Gap(BsonValue value)
    {
        var g = value.IsDocument ? value.AsDocument : throw Damaged(Owner, "a column with gaps is not a document");
        return new ColumnGap(String(g, "name", Owner), Double(g, "missingShare", Owner));
    }

    private static DroppedColumn Dropped(BsonValue value)
    {
        var d = value.IsDocument ? value.AsDocument : throw Damaged(Owner, "a dropped column is not a document");
        return new DroppedColumn(String(d, "name", Owner), Enum<DropReason>(d, "reason", Owner), OptionalString(d, "sameAs"));
    }
}
