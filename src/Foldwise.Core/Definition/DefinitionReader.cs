using System.Text;
using Foldwise.Core.Data;
using Foldwise.Core.Screening;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>
/// Reads a search definition file strictly: an unknown key, a wrong type or a value out of bounds is an
/// <see cref="InputException"/> naming the key's path with its 1-based line and column. Comments
/// (<c>//</c>, <c>/* */</c>) and trailing commas are allowed. What a file leaves out takes the records'
/// defaults; the name defaults to the file's name without extension. See docs/definition.md.
/// </summary>
public static class DefinitionReader
{
    /// <summary>Reads the file at <paramref name="path"/>; its data paths are taken relative to the file's folder.</summary>
    public static SearchDefinition Read(string path)
    {
        byte[] bytes;
        try
        {
            bytes = File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InputException(path, $"cannot read the definition file: {e.Message}");
        }

        string folder = Path.GetDirectoryName(Path.GetFullPath(path))!;
        return Parse(bytes, path, folder, DefinitionDefaults.BuiltInFamilies);
    }

    /// <summary>
    /// Reads definition text. <paramref name="sourcePath"/> names the text in messages and gives the default
    /// name; relative data paths are resolved against <paramref name="baseDirectory"/> and become absolute.
    /// </summary>
    public static SearchDefinition Parse(string json, string sourcePath, string baseDirectory) =>
        Parse(Encoding.UTF8.GetBytes(json), sourcePath, baseDirectory, DefinitionDefaults.BuiltInFamilies);

    /// <summary>
    /// Reads the definition text a store kept. A store written before a name was retired holds the old name
    /// (<see cref="RetiredNames"/>), so here each retired name is read as its replacement; a file a person writes is
    /// held to the current names by <see cref="Parse(string, string, string)"/>.
    /// </summary>
    public static SearchDefinition ParseStored(string json, string sourcePath, string baseDirectory) =>
        Parse(Encoding.UTF8.GetBytes(json), sourcePath, baseDirectory, DefinitionDefaults.BuiltInFamilies, acceptRetired: true);

    // Test seam: the families a file may name, with their default spaces.
    internal static SearchDefinition Parse(ReadOnlySpan<byte> utf8, string sourcePath, string baseDirectory, IReadOnlyList<FamilySearch> builtIn, bool acceptRetired = false)
    {
        ReadOnlySpan<byte> bom = [0xEF, 0xBB, 0xBF];
        if (utf8.StartsWith(bom))
        {
            utf8 = utf8[bom.Length..];
        }

        var check = new DefinitionCheck(sourcePath, acceptRetired);
        var root = check.Object(DefinitionTree.Parse(utf8, sourcePath), DefinitionNames.RootKeys);
        var scheduleNode = root.Get("schedule")?.Value;
        var schedule = scheduleNode is null ? ScheduleDefaults.Standard : ScheduleReader.Read(check, scheduleNode);
        var fallback = SharedBudget(check, scheduleNode, schedule);
        var definition = new SearchDefinition
        {
            Name = root.Get("name") is { } name ? Name(check, name.Value) : DefaultName(sourcePath),
            Data = Data(check, check.Require(root, "data").Value, Path.GetFullPath(baseDirectory)),
            Families = root.Get("families") is { } families
                ? new FamiliesReader(check, builtIn, fallback).Read(families.Value)
                : [.. builtIn.Where(f => FamilyNames.Default.Contains(f.Family)).Select(f => f with { Budget = fallback(f.Family) })],
            Schedule = schedule,
            Budget = root.Get("budget") is { } budget ? Budget(check, budget.Value) : new SearchBudget(DefinitionDefaults.Trials, null),
        };

        if (root.Get("metric") is { } metric)
        {
            definition = definition with { Metric = check.Word(metric.Value, DefinitionNames.Metrics) };
        }

        if (root.Get("folds") is { } folds)
        {
            definition = definition with { Folds = check.Whole(folds.Value, 2, " (K of a K-fold plan)") };
        }

        if (root.Get("seed") is { } seed)
        {
            definition = definition with { Seed = check.Whole(seed.Value) };
        }

        if (root.Get("screening") is { } screening)
        {
            var s = check.Object(screening.Value, DefinitionNames.ScreeningKeys);
            definition = definition with
            {
                Screening = s.Get("min_nonzero") is { } m ? new ScreeningOptions(check.Whole(m.Value, 1)) : new ScreeningOptions(),
            };
        }

        if (scheduleNode is not null && schedule.ByFolds && schedule.ScreenFolds >= definition.Folds)
        {
            var screen = check.Object(scheduleNode, DefinitionNames.ScheduleKeys).Get("screen_folds")!;
            throw check.Fail(screen.Value, $"'schedule.screen_folds' ({schedule.ScreenFolds}) must be below the plan's {definition.Folds} folds");
        }

        if (scheduleNode is not null && schedule.Brackets > 1)
        {
            CheckBrackets(check, scheduleNode, definition);
        }

        if (root.Get("blend") is { } blend)
        {
            definition = definition with { Blend = Blend(check, blend.Value) };
        }

        return definition;
    }

    /// <summary>
    /// A family's rungs when its own object gives none: what <c>schedule</c> wrote (it then speaks for every family, as
    /// definitions did before families had budgets of their own), else the family's descriptor.
    /// </summary>
    private static Func<string, FamilyBudget> SharedBudget(DefinitionCheck check, DefinitionNode? scheduleNode, ScheduleOptions schedule)
    {
        var written = scheduleNode is null ? null : check.Object(scheduleNode, DefinitionNames.ScheduleKeys);
        bool firstWritten = written?.Get("first_rung") is not null;
        bool fullWritten = written?.Get("full_budget") is not null;
        return family => FamilyDescriptors.Find(family) is { } d
            ? new FamilyBudget(firstWritten ? schedule.FirstRung : d.FirstRung, fullWritten ? schedule.FullBudget : d.FullBudget)
            : new FamilyBudget(schedule.FirstRung, schedule.FullBudget);
    }

    /// <summary>Every family has at least as many rungs as ASHA has brackets.</summary>
    private static void CheckBrackets(DefinitionCheck check, DefinitionNode scheduleNode, SearchDefinition definition)
    {
        var given = check.Object(scheduleNode, DefinitionNames.ScheduleKeys).Get("brackets");
        var schedule = definition.Schedule;
        foreach (var family in definition.Families)
        {
            var budget = family.BudgetUnder(schedule);
            var rungs = schedule.ByFolds
                ? Schedules.RungBudgets.For(schedule.ScreenFolds, definition.Folds, schedule.Eta)
                : Schedules.RungBudgets.For(budget.FirstRung, budget.FullBudget, schedule.Eta);
            string unit = schedule.ByFolds ? "folds" : FamilyDescriptors.UnitOf(family.Family).Many;
            if (schedule.Brackets > rungs.Length && given is not null)
            {
                throw check.Fail(given.Value, $"'schedule.brackets' ({schedule.Brackets}) is more than {family.Family}'s {rungs.Length} rungs ({string.Join(", ", rungs)} {unit})");
            }
        }
    }

    private static string Name(DefinitionCheck check, DefinitionNode node)
    {
        string name = check.Text(node);

        // The name may end up in file names beside the search.
        return name.Any(c => char.IsControl(c) || c is '/' or '\\')
            ? throw check.Fail(node, $"'name' must not hold '/', '\\' or control characters, got {node.Describe()}")
            : name;
    }

    private static string DefaultName(string sourcePath) =>
        Path.GetFileNameWithoutExtension(sourcePath) is { Length: > 0 } stem ? stem : DefinitionDefaults.Name;

    private static DataSource Data(DefinitionCheck check, DefinitionNode node, string baseDirectory)
    {
        var data = check.Object(node, DefinitionNames.DataKeys);
        string Absolute(string key) => Path.GetFullPath(check.Text(check.Require(data, key).Value), baseDirectory);

        string train = Absolute("train");
        string test = Absolute("test");
        string id = check.Text(check.Require(data, "id").Value);
        var target = check.Require(data, "target").Value;
        if (check.Text(target) == id)
        {
            throw check.Fail(target, $"'data.target' must differ from 'data.id', both are \"{id}\"");
        }

        System.Collections.Immutable.ImmutableArray<string>? missing = data.Get("missing") is { } m ? Texts(check, m.Value, allowEmpty: true) : null;
        var categories = data.Get("categories") is { } c ? Texts(check, c.Value, allowEmpty: false) : [];
        var ignored = data.Get("ignore") is { } i ? Texts(check, i.Value, allowEmpty: false) : [];
        foreach (string name in categories.Intersect(ignored, StringComparer.Ordinal))
        {
            throw check.Fail(data.Get("ignore")!.Value, $"'data.ignore' names '{name}', which 'data.categories' lists too");
        }

        var rules = new TableRules(missing ?? TableRules.DefaultMissingWords, missing is not null, categories, ignored);
        return new DataSource(train, test, id, target.Text!) { Rules = rules };
    }

    private static System.Collections.Immutable.ImmutableArray<string> Texts(DefinitionCheck check, DefinitionNode node, bool allowEmpty)
    {
        if (node.Kind != System.Text.Json.JsonValueKind.Array)
        {
            throw check.Fail(node, $"{DefinitionCheck.Label(node)} must be a list of texts, got {node.Describe()}");
        }

        var texts = new List<string>();
        foreach (var item in node.Items)
        {
            string text = check.Text(item);
            if (!allowEmpty && text.Length == 0)
            {
                throw check.Fail(item, $"{DefinitionCheck.Label(node)} holds an empty name");
            }

            if (texts.Contains(text, StringComparer.Ordinal))
            {
                throw check.Fail(item, $"{DefinitionCheck.Label(node)} names \"{text}\" twice");
            }

            texts.Add(text);
        }

        return [.. texts];
    }

    private static SearchBudget Budget(DefinitionCheck check, DefinitionNode node)
    {
        var budget = check.Object(node, DefinitionNames.BudgetKeys);
        int? trials = budget.Get("trials") is { } t ? check.Whole(t.Value, 1) : null;
        double? hours = budget.Get("hours") is { } h ? check.Number(h.Value) : null;
        if (hours <= 0)
        {
            throw check.Fail(budget.Get("hours")!.Value, $"'budget.hours' must be above 0, got {budget.Get("hours")!.Value.Text}");
        }

        return trials is null && hours is null
            ? throw check.Fail(node, "'budget' needs 'trials', 'hours' or both")
            : new SearchBudget(trials, hours);
    }

    private static BlendOptions Blend(DefinitionCheck check, DefinitionNode node)
    {
        var blend = check.Object(node, DefinitionNames.BlendKeys);
        var standard = new BlendOptions();
        return new BlendOptions(
            blend.Get("mode") is { } m ? check.Word(m.Value, DefinitionNames.BlendModes) : standard.Mode,
            blend.Get("pool") is { } p ? check.Whole(p.Value, 1, " (trials per family)") : standard.Pool);
    }
}
