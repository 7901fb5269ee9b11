using Foldwise.Core.Definition;
using Foldwise.Core.Encodings;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;

namespace Foldwise.Storage;

/// <summary>
/// The words a store of format 2 on writes for the definition's enumerations. Fixed for good: a new value gets a new
/// word, an existing word never changes (a renamed enum member keeps its word here).
/// </summary>
internal static class StoreWords
{
    public static readonly Words<MetricKind> Metrics = new(("rmsle", MetricKind.Rmsle), ("rmse", MetricKind.Rmse), ("mae", MetricKind.Mae));

    public static readonly Words<ScheduleKind> Schedules = new(("full", ScheduleKind.Full), ("asha", ScheduleKind.Asha), ("hyperband", ScheduleKind.Hyperband));

    public static readonly Words<ProposerKind> Proposers = new(("random", ProposerKind.Random), ("tpe", ProposerKind.Tpe));

    public static readonly Words<BlendMode> BlendModes = new(("simplex", BlendMode.Simplex), ("nonnegative", BlendMode.NonNegative), ("greedy", BlendMode.Greedy));

    public static readonly Words<CategoryEncodingKind> FewLevelForms = new(("levelcodes", CategoryEncodingKind.LevelCodes), ("indicators", CategoryEncodingKind.Indicators));

    public static readonly Words<ParameterKind> Ranges = new(("integer", ParameterKind.Whole), ("uniform", ParameterKind.Linear), ("logarithmic", ParameterKind.Log), ("categorical", ParameterKind.OneOf));

    /// <summary>One enumeration's words, both ways; an unknown word is a damaged store.</summary>
    public sealed class Words<T>(params (string Word, T Value)[] pairs)
        where T : struct, Enum
    {
        public string Word(T value) => pairs.Single(p => p.Value.Equals(value)).Word;

        public T Value(string word) =>
            pairs.Where(p => p.Word == word).Select(p => (T?)p.Value).FirstOrDefault()
            ?? throw BsonFields.Damaged("the search definition", $"'{word}' is not a {typeof(T).Name} word of the store");
    }
}
