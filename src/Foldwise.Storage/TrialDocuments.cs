using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using LiteDB;
using static Foldwise.Storage.BsonFields;

namespace Foldwise.Storage;

/// <summary>
/// Maps <see cref="TrialRecord"/> to its document in <c>trials</c> (keyed by trial id) and back, field by
/// field, so renaming a C# member never changes the file format.
/// </summary>
internal static class TrialDocuments
{
    public const string Collection = "trials";

    public static BsonDocument ToDocument(TrialRecord t)
    {
        var parameters = new BsonDocument();
        foreach (var (name, value) in t.Parameters.Values)
        {
            // LiteDB compares field names ignoring case: a second such name would silently replace the first.
            if (parameters.ContainsKey(name))
            {
                string earlier = parameters.Keys.First(k => string.Equals(k, name, StringComparison.OrdinalIgnoreCase));
                throw new StoreException(
                    $"Trial {t.Id} has parameters '{earlier}' and '{name}', whose names differ only by case; the store cannot keep both.");
            }

            parameters[name] = value;
        }

        return new BsonDocument
        {
            ["_id"] = t.Id,
            ["family"] = t.Family,
            ["parameters"] = parameters,
            ["budget"] = t.Budget,
            ["rung"] = t.Rung,
            ["parentId"] = Nullable(t.ParentId),
            ["proposer"] = t.Proposer,
            ["bracket"] = t.Bracket,
            ["folds"] = t.Folds,
            ["state"] = t.State.ToString(),
            ["attempt"] = t.Attempt,
            ["failures"] = t.Failures,
            ["worker"] = Nullable(t.Worker),
            ["slot"] = Nullable(t.Slot),
            ["leaseExpires"] = Time(t.LeaseExpires),
            ["created"] = Time(t.Created),
            ["started"] = Time(t.Started),
            ["finished"] = Time(t.Finished),
            ["score"] = Nullable(t.Score),
            ["foldScores"] = Array(t.FoldScores),
            ["bestRound"] = Nullable(t.BestRound),
            ["roundsContinued"] = t.RoundsContinued,
            ["failureReason"] = Nullable(t.FailureReason),
            ["lostAttempts"] = Array(t.LostAttempts),
        };
    }

    public static TrialRecord FromDocument(BsonDocument doc)
    {
        var idValue = doc["_id"];
        string owner = $"trial {idValue}";
        int id = idValue.IsInt32 ? idValue.AsInt32 : throw Damaged(owner, "its id is not an integer");
        var parameters = Required(doc, "parameters", owner, BsonType.Document).AsDocument;

        return new TrialRecord
        {
            Id = id,
            Family = String(doc, "family", owner),
            Parameters = ParameterSet.Of(parameters.Select(kv => KeyValuePair.Create(kv.Key, ParameterValue(kv, owner)))),
            Budget = Int(doc, "budget", owner),
            Rung = Int(doc, "rung", owner),
            ParentId = OptionalInt(doc, "parentId"),
            Proposer = String(doc, "proposer", owner),
            Bracket = Int(doc, "bracket", owner),

            // Absent from stores written before schedules could screen on folds: every fold.
            Folds = OptionalInt(doc, "folds") ?? 0,
            State = Enum<TrialState>(doc, "state", owner),
            Attempt = Int(doc, "attempt", owner),
            Failures = OptionalInt(doc, "failures") ?? 0,
            Worker = OptionalString(doc, "worker"),
            Slot = OptionalString(doc, "slot"),
            LeaseExpires = OptionalTime(doc, "leaseExpires", owner),
            Created = RequiredTime(doc, "created", owner),
            Started = OptionalTime(doc, "started", owner),
            Finished = OptionalTime(doc, "finished", owner),
            Score = OptionalDouble(doc, "score"),
            FoldScores = DoubleArray(doc, "foldScores", owner),

            // Absent from stores written before trials kept their best round.
            BestRound = OptionalInt(doc, "bestRound"),

            // Absent from stores written before promotions continued their screens.
            RoundsContinued = OptionalInt(doc, "roundsContinued") ?? 0,
            FailureReason = OptionalString(doc, "failureReason"),
            LostAttempts = Strings(doc, "lostAttempts", owner),
        };
    }

    private static double ParameterValue(KeyValuePair<string, BsonValue> kv, string owner) =>
        kv.Value.IsDouble ? kv.Value.AsDouble : throw Damaged(owner, $"parameter '{kv.Key}' is a {kv.Value.Type}, not a Double");
}
