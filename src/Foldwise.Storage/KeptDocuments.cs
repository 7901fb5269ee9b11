using Foldwise.Core.Search;
using LiteDB;
using static Foldwise.Storage.BsonFields;

namespace Foldwise.Storage;

/// <summary>Maps <see cref="KeptModels"/> to the <c>kept</c> document of collection <c>search</c> and back.</summary>
internal static class KeptDocuments
{
    public const string Id = "kept";
    private const string Owner = "the kept models";

    public static BsonDocument ToDocument(KeptModels kept) => new()
    {
        ["_id"] = Id,
        ["searchId"] = kept.SearchId,
        ["members"] = new BsonArray(kept.Members.Select(m => (BsonValue)new BsonDocument
        {
            ["trialId"] = m.TrialId,
            ["family"] = m.Family,
            ["weight"] = m.Weight,
            ["hash"] = m.Hash,
            ["bytes"] = m.Bytes,
            ["folds"] = m.Folds,
            ["difference"] = m.Difference,
        })),
        ["kept"] = Time(kept.Kept),
    };

    public static KeptModels FromDocument(BsonDocument doc) => new(
        String(doc, "searchId", Owner),
        [.. Required(doc, "members", Owner, BsonType.Array).AsArray.Select(Member)],
        RequiredTime(doc, "kept", Owner));

    private static KeptMember Member(BsonValue value)
    {
        var m = value.IsDocument ? value.AsDocument : throw Damaged(Owner, "a member is not a document");
        var bytes = Required(m, "bytes", Owner, BsonType.Int64);
        return new KeptMember(Int(m, "trialId", Owner), String(m, "family", Owner), Double(m, "weight", Owner), String(m, "hash", Owner), bytes.AsInt64, Int(m, "folds", Owner), Double(m, "difference", Owner));
    }
}
