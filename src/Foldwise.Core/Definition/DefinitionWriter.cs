using System.Globalization;
using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>
/// Writes a definition in the syntax <see cref="DefinitionReader"/> reads, indented, with every key spelled
/// out (defaults included, every parameter of every family), so the text the store keeps stands alone and
/// reads back to an equal definition. Paths are written as they are held: absolute.
/// </summary>
public static class DefinitionWriter
{
    private static readonly JsonWriterOptions Options = new()
    {
        Indented = true,

        // Paths and names stay readable (no \u escapes for non-ASCII); the text is never embedded raw in HTML.
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
    };

    public static string Write(SearchDefinition definition)
    {
        using var buffer = new MemoryStream();
        using (var json = new Utf8JsonWriter(buffer, Options))
        {
            json.WriteStartObject();
            json.WriteString("name", definition.Name);
            Section(json, "data", () =>
            {
                json.WriteString("train", definition.Data.Train);
                json.WriteString("test", definition.Data.Test);
                json.WriteString("id", definition.Data.IdColumn);
                json.WriteString("target", definition.Data.TargetColumn);
                var rules = definition.Data.Rules;
                if (rules.MissingWordsStated)
                {
                    Texts(json, "missing", rules.MissingWords);
                }

                if (rules.Categories.Length > 0)
                {
                    Texts(json, "categories", rules.Categories);
                }

                if (rules.Ignored.Length > 0)
                {
                    Texts(json, "ignore", rules.Ignored);
                }
            });
            json.WriteString("metric", DefinitionNames.Metrics.NameOf(definition.Metric));
            json.WriteNumber("folds", definition.Folds);
            json.WriteNumber("seed", definition.Seed);
            Section(json, "screening", () => json.WriteNumber("min_nonzero", definition.Screening.MinNonZero));
            Section(json, "families", () =>
            {
                foreach (var family in definition.Families)
                {
                    Section(json, family.Family, () =>
                    {
                        if (family.Budget is { } budget)
                        {
                            json.WriteNumber("first_rung", budget.FirstRung);
                            json.WriteNumber("full_budget", budget.FullBudget);
                        }

                        if (FamilyDescriptors.Find(family.Family)?.FewLevelForms.Length > 1)
                        {
                            json.WriteString(DefinitionNames.FewLevelsKey, DefinitionNames.FewLevelForms.NameOf(family.FewLevelsForm));
                        }

                        Space(json, family.Space);
                    });
                }
            });
            var schedule = definition.Schedule;
            Section(json, "schedule", () =>
            {
                json.WriteString("kind", DefinitionNames.Schedules.NameOf(schedule.Kind));
                json.WriteString("proposer", DefinitionNames.Proposers.NameOf(schedule.Proposer));
                json.WriteNumber("first_rung", schedule.FirstRung);
                json.WriteNumber("full_budget", schedule.FullBudget);
                json.WriteNumber("eta", schedule.Eta);
                json.WriteNumber("rate_scaling", schedule.RateScaling);
                json.WriteNumber("brackets", schedule.Brackets);
                if (schedule.Kind == ScheduleKind.Asha)
                {
                    // Written even when 0 (rungs in rounds): a definition that leaves it out races over folds.
                    json.WriteNumber("screen_folds", schedule.ScreenFolds);
                }
            });
            Section(json, "budget", () =>
            {
                if (definition.Budget.Trials is { } trials)
                {
                    json.WriteNumber("trials", trials);
                }

                if (definition.Budget.Hours is { } hours)
                {
                    json.WriteNumber("hours", hours);
                }
            });
            Section(json, "blend", () =>
            {
                json.WriteString("mode", DefinitionNames.BlendModes.NameOf(definition.Blend.Mode));
                json.WriteNumber("pool", definition.Blend.Pool);
            });
            json.WriteEndObject();
        }

        return Encoding.UTF8.GetString(buffer.ToArray()) + "\n";
    }

    private static void Section(Utf8JsonWriter json, string key, Action body)
    {
        json.WriteStartObject(key);
        body();
        json.WriteEndObject();
    }

    // Each range goes on one line as raw JSON: {"whole": [8, 128]} reads better than the writer's six lines.
    private static void Space(Utf8JsonWriter json, ParameterSpace space)
    {
        foreach (var range in space.Ranges)
        {
            json.WritePropertyName(range.Name);
            json.WriteRawValue(Range(range));
        }
    }

    internal static string Range(ParameterRange range) => range.Kind switch
    {
        // Fixed ints and floats read back as bare numbers; a fixed log range keeps its kind.
        ParameterKind.Whole when range.IsFixed => Number(range.Low),
        ParameterKind.Linear when range.IsFixed => Number(range.Low),
        ParameterKind.Whole => $"{{\"whole\": [{Number(range.Low)}, {Number(range.High)}]}}",
        ParameterKind.Linear => $"{{\"linear\": [{Number(range.Low)}, {Number(range.High)}]}}",
        ParameterKind.Log => $"{{\"log\": [{Number(range.Low)}, {Number(range.High)}]}}",
        _ => $"{{\"one_of\": [{string.Join(", ", range.Choices.Select(c => $"\"{JsonEncodedText.Encode(c, Options.Encoder)}\""))}]}}",
    };

    // "R" is the shortest text that parses back to the same double, e.g. 0.01, 1E-05; JSON accepts both forms.
    private static string Number(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static void Texts(Utf8JsonWriter json, string key, IEnumerable<string> texts)
    {
        json.WriteStartArray(key);
        foreach (string text in texts)
        {
            json.WriteStringValue(text);
        }

        json.WriteEndArray();
    }
}
