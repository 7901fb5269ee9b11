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
    };

    public static ScreeningReport FromDocument(BsonDocument doc) => new(
        Int(doc, "columnsRead", Owner),
        Strings(doc, "kept", Owner),
        [.. Required(doc, "dropped", Owner, BsonType.Array).AsArray.Select(v => Dropped(v))]);

    private static DroppedColumn Dropped(BsonValue value)
    {
        var d = value.IsDocument ? value.AsDocument : throw Damaged(Owner, "a dropped column is not a document");
        return new DroppedColumn(String(d, "name", Owner), Enum<DropReason>(d, "reason", Owner), OptionalString(d, "sameAs"));
    }
}
