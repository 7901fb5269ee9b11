using Foldwise.Core.Blending;
using Foldwise.Core.Definition;
using LiteDB;
using static Foldwise.Storage.BsonFields;

namespace Foldwise.Storage;

/// <summary>Maps <see cref="BlendSummary"/> to the <c>blend</c> document of collection <c>search</c> and back.</summary>
internal static class BlendDocuments
{
    public const string Id = "blend";
    private const string Owner = "the blend summary";

    public static BsonDocument ToDocument(BlendSummary blend) => new()
    {
        ["_id"] = Id,
        ["mode"] = blend.Mode.ToString(),
        ["members"] = new BsonArray(blend.Members.IsDefault ? [] : blend.Members.Select(m => (BsonValue)new BsonDocument
        {
            ["trialId"] = m.TrialId,
            ["family"] = m.Family,
            ["weight"] = m.Weight,
        })),
        ["inSampleScore"] = blend.InSampleScore,
        ["nestedScore"] = blend.NestedScore,
        ["nestedFoldScores"] = Array(blend.NestedFoldScores),
        ["bestSingleTrialId"] = blend.BestSingleTrialId,
        ["bestSingleScore"] = blend.BestSingleScore,
    };

    public static BlendSummary FromDocument(BsonDocument doc) => new(
        Enum<BlendMode>(doc, "mode", Owner),
        [.. Required(doc, "members", Owner, BsonType.Array).AsArray.Select(v => Member(v))],
        Double(doc, "inSampleScore", Owner),
        Double(doc, "nestedScore", Owner),
        DoubleArray(doc, "nestedFoldScores", Owner),
        Int(doc, "bestSingleTrialId", Owner),
        Double(doc, "bestSingleScore", Owner));

    private static BlendMember Member(BsonValue value)
    {
        var m = value.IsDocument ? value.AsDocument : throw Damaged(Owner, "a member is not a document");
        return new BlendMember(Int(m, "trialId", Owner), String(m, "family", Owner), Double(m, "weight", Owner));
    }
}
