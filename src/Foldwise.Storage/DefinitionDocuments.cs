using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Encodings;
using Foldwise.Core.Screening;
using Foldwise.Core.Spaces;
using LiteDB;
using static Foldwise.Storage.BsonFields;

namespace Foldwise.Storage;

/// <summary>
/// The store's own form of a <see cref="SearchDefinition"/> (store format 2 on): field names and value words of its
/// own, fixed here (<see cref="StoreWords"/>), neither the definition file's words nor the code's enum names, so
/// renaming either never touches a stored search. Every value is written, defaults included, and reads back to an
/// equal definition.
/// </summary>
internal static class DefinitionDocuments
{
    private const string Owner = "the search definition";

    public static BsonDocument ToDocument(SearchDefinition d) => new()
    {
        ["name"] = d.Name,
        ["data"] = new BsonDocument
        {
            ["train"] = d.Data.Train,
            ["test"] = d.Data.Test,
            ["idColumn"] = d.Data.IdColumn,
            ["targetColumn"] = d.Data.TargetColumn,
            ["missingWords"] = Array(d.Data.Rules.MissingWords),
            ["missingWordsStated"] = d.Data.Rules.MissingWordsStated,
            ["categories"] = Array(d.Data.Rules.Categories),
            ["ignore"] = Array(d.Data.Rules.Ignored),
        },
        ["metric"] = StoreWords.Metrics.Word(d.Metric),
        ["folds"] = d.Folds,
        ["seed"] = d.Seed,
        ["minNonZero"] = d.Screening.MinNonZero,
        ["families"] = new BsonArray(d.Families.Select(f => (BsonValue)new BsonDocument
        {
            ["family"] = f.Family,
            ["firstRung"] = f.Budget is { } b ? b.FirstRung : BsonValue.Null,
            ["fullBudget"] = f.Budget is { } c ? c.FullBudget : BsonValue.Null,
            ["fewLevels"] = StoreWords.FewLevelForms.Word(f.FewLevelsForm),
            ["ranges"] = new BsonArray(f.Space.Ranges.Select(r => (BsonValue)new BsonDocument
            {
                ["name"] = r.Name,
                ["kind"] = StoreWords.Ranges.Word(r.Kind),
                ["low"] = r.Low,
                ["high"] = r.High,
                ["choices"] = Array(r.Choices.IsDefault ? [] : r.Choices),
            })),
        })),
        ["schedule"] = new BsonDocument
        {
            ["kind"] = StoreWords.Schedules.Word(d.Schedule.Kind),
            ["proposer"] = StoreWords.Proposers.Word(d.Schedule.Proposer),
            ["firstRung"] = d.Schedule.FirstRung,
            ["fullBudget"] = d.Schedule.FullBudget,
            ["eta"] = d.Schedule.Eta,
            ["rateScaling"] = d.Schedule.RateScaling,
            ["brackets"] = d.Schedule.Brackets,
            ["screenFolds"] = d.Schedule.ScreenFolds,
        },
        ["trials"] = Nullable(d.Budget.Trials),
        ["hours"] = Nullable(d.Budget.Hours),
        ["blendMode"] = StoreWords.BlendModes.Word(d.Blend.Mode),
        ["blendPool"] = d.Blend.Pool,
    };

    public static SearchDefinition FromDocument(BsonDocument doc)
    {
        var data = Required(doc, "data", Owner, BsonType.Document).AsDocument;
        var schedule = Required(doc, "schedule", Owner, BsonType.Document).AsDocument;
        return new SearchDefinition
        {
            Name = String(doc, "name", Owner),
            Data = new DataSource(String(data, "train", Owner), String(data, "test", Owner), String(data, "idColumn", Owner), String(data, "targetColumn", Owner))
            {
                Rules = Rules(data),
            },
            Metric = StoreWords.Metrics.Value(String(doc, "metric", Owner)),
            Folds = Int(doc, "folds", Owner),
            Seed = Int(doc, "seed", Owner),
            Screening = new ScreeningOptions(Int(doc, "minNonZero", Owner)),
            Families = [.. Required(doc, "families", Owner, BsonType.Array).AsArray.Select(Family)],
            Schedule = new ScheduleOptions(
                StoreWords.Schedules.Value(String(schedule, "kind", Owner)),
                StoreWords.Proposers.Value(String(schedule, "proposer", Owner)),
                Int(schedule, "firstRung", Owner),
                Int(schedule, "fullBudget", Owner),
                Int(schedule, "eta", Owner),
                Double(schedule, "rateScaling", Owner),
                Int(schedule, "brackets", Owner),

                // Absent from stores written before schedules could screen on folds: rungs in the family's budget.
                OptionalInt(schedule, "screenFolds") ?? 0),
            Budget = new SearchBudget(OptionalInt(doc, "trials"), OptionalDouble(doc, "hours")),
            Blend = new BlendOptions(StoreWords.BlendModes.Value(String(doc, "blendMode", Owner)), Int(doc, "blendPool", Owner)),
        };
    }

    private static FamilySearch Family(BsonValue value)
    {
        var f = value.IsDocument ? value.AsDocument : throw Damaged(Owner, "a family is not a document");
        var ranges = Required(f, "ranges", Owner, BsonType.Array).AsArray.Select(v =>
        {
            var r = v.IsDocument ? v.AsDocument : throw Damaged(Owner, "a parameter range is not a document");
            return new ParameterRange(String(r, "name", Owner), StoreWords.Ranges.Value(String(r, "kind", Owner)), Double(r, "low", Owner), Double(r, "high", Owner), Strings(r, "choices", Owner));
        });
        // Stores written before families had rungs of their own have neither field: the family takes the schedule's.
        var first = OptionalInt(f, "firstRung");
        var full = OptionalInt(f, "fullBudget");
        var budget = first is { } fr && full is { } fb ? new FamilyBudget(fr, fb) : null;
        string family = String(f, "family", Owner);
        return new FamilySearch(family, new ParameterSpace([.. ranges]), budget) { FewLevels = FewLevels(f, family) };
    }

    /// <summary>
    /// The form a family reads few-level category columns in. A family offering a choice, in a store written before the
    /// choice was kept, read indicator columns: every search kept before LightGBM's own category splits did, and kept
    /// models of those searches score only on indicator columns.
    /// </summary>
    private static CategoryEncodingKind? FewLevels(BsonDocument f, string family)
    {
        if (OptionalString(f, "fewLevels") is { } word)
        {
            return StoreWords.FewLevelForms.Value(word);
        }

        return FamilyDescriptors.Find(family)?.FewLevelForms.Length > 1 ? CategoryEncodingKind.Indicators : null;
    }

    // Stores written before tables could hold gaps and text have none of these fields: they read as the defaults.
    private static TableRules Rules(BsonDocument data) => data.ContainsKey("missingWords")
        ? new TableRules(
            Strings(data, "missingWords", Owner), Bool(data, "missingWordsStated", Owner), Strings(data, "categories", Owner), Strings(data, "ignore", Owner))
        : TableRules.Default;
}
