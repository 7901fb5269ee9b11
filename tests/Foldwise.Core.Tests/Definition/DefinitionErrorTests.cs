using Foldwise.Core.Data;
using Foldwise.Core.Definition;

namespace Foldwise.Core.Tests.Definition;

public sealed class DefinitionErrorTests
{
    /// <summary>
    /// Each case edits <see cref="DefinitionText.Full"/> (replace → with), and names what the message must hold and
    /// the text the error must point at (its first occurrence in the edited file).
    /// </summary>
    public static TheoryData<string, string, string, string> Cases => new()
    {
        // unknown keys, with the nearest known one suggested
        { "\"folds\": 5", "\"fold\": 5", "unknown key 'fold'; did you mean 'folds'?", "\"fold\"" },
        { "\"first_rung\": 25", "\"first_rungs\": 25", "unknown key 'schedule.first_rungs'; did you mean 'first_rung'?", "\"first_rungs\"" },
        { "\"pool\": 3", "\"pool\": 3, \"weights\": 1", "unknown key 'blend.weights' (known keys here: mode, pool)", "\"weights\"" },
        { "\"lightgbm\": {", "\"lightgmb\": {", "unknown family 'families.lightgmb'; did you mean 'lightgbm'? (built-in families: lightgbm, fasttree, forest, gam, linear)", "\"lightgmb\"" },
        { "\"leaves\": {", "\"leafs\": {", "unknown parameter 'families.lightgbm.leafs'; did you mean 'leaves'? (lightgbm's parameters: learning_rate, leaves, min_leaf_rows, feature_fraction, row_fraction, l2, first_rung, full_budget, few_level_categories)", "\"leafs\"" },
        { "\"fasttree\": {}", "\"fasttree\": { \"l2\": 1 }", "unknown parameter 'families.fasttree.l2'", "\"l2\"" },
        { "{ \"whole\": [8, 128] }", "{ \"uniform\": [8, 128] }", "unknown key 'families.lightgbm.leaves.uniform'", "\"uniform\"" },
        { "\"seed\": 7,", "\"seed\": 7, \"seed\": 8,", "'seed' is given twice", "\"seed\": 8" },

        // wrong types
        { "\"folds\": 5", "\"folds\": \"5\"", "'folds' must be a number, got \"5\"", "\"5\"" },
        { "\"seed\": 7", "\"seed\": 7.5", "'seed' must be a whole number, got 7.5", "7.5" },
        { "\"name\": \"freight-test\"", "\"name\": 3", "'name' must be a non-empty string, got 3", "3," },
        { "{ \"kind\": \"asha\", \"proposer\": \"tpe\", \"first_rung\": 25, \"full_budget\": 400, \"eta\": 3 }", "[]", "'schedule' must be an object { ... }, got a list", "[]" },
        { "\"row_fraction\": 0.8", "\"row_fraction\": \"0.8\"", "'families.lightgbm.row_fraction' must be a number or a range", "\"0.8\"" },
        { "{ \"whole\": [8, 128] }", "{ \"whole\": [8, 128], \"linear\": [1, 2] }", "'families.lightgbm.leaves' must hold exactly one of", "{ \"whole\": [8, 128], \"linear\"" },
        { "{ \"whole\": [8, 128] }", "{ \"whole\": [8] }", "'families.lightgbm.leaves.whole' must be a list of two numbers [lo, hi], got a list of 1", "[8]" },
        { "{ \"whole\": [8, 128] }", "{ \"linear\": [8, 128] }", "'families.lightgbm.leaves' takes whole numbers, not 'linear'", "\"linear\"" },
        { "{ \"whole\": [8, 128] }", "{ \"whole\": [8.5, 128] }", "'families.lightgbm.leaves.whole[0]' must be a whole number, got 8.5", "8.5" },
        { "{ \"log\": [0.01, 0.3] }", "{ \"one_of\": [\"a\"] }", "'families.lightgbm.learning_rate' takes real numbers, not 'one_of'", "\"one_of\"" },

        // ranges and the families' hard limits
        { "{ \"whole\": [8, 128] }", "{ \"whole\": [128, 8] }", "'families.lightgbm.leaves.whole' has lo 128 above hi 8", "128, 8" },
        { "{ \"log\": [0.01, 0.3] }", "{ \"log\": [0, 0.3] }", "'families.lightgbm.learning_rate.log' is sampled in log space, so lo must be above 0, got 0", "0, 0.3" },
        { "{ \"whole\": [8, 128] }", "{ \"whole\": [1, 128] }", "'families.lightgbm.leaves.whole[0]' must be at least 2 (leaves per tree), got 1", "1, 128" },
        { "\"row_fraction\": 0.8", "\"row_fraction\": 1.5", "'families.lightgbm.row_fraction' must be at most 1 (a fraction of rows), got 1.5", "1.5" },
        { "\"fasttree\": {}", "\"fasttree\": { \"feature_fraction\": { \"linear\": [0, 1] } }", "'families.fasttree.feature_fraction.linear[0]' must be above 0", "0, 1]" },

        // bounds of the scalar keys
        { "\"folds\": 5", "\"folds\": 1", "'folds' must be at least 2 (K of a K-fold plan), got 1", "1," },
        { "\"eta\": 3", "\"eta\": 1", "'schedule.eta' must be at least 2", "1 }" },
        { "\"eta\": 3", "\"eta\": 3, \"brackets\": 5", "'schedule.brackets' (5) is more than the schedule's 4 rungs (25, 75, 225, 400 rounds)", "5 }" },
        { "\"kind\": \"asha\"", "\"kind\": \"hyperband\", \"brackets\": 2", "'schedule.brackets' applies to the asha schedule only, not 'hyperband'", "2," },
        { "\"eta\": 3", "\"eta\": 3, \"brackets\": 0", "'schedule.brackets' must be at least 1, got 0", "0 }" },
        { "\"eta\": 3", "\"eta\": 3, \"rate_scaling\": 2", "'schedule.rate_scaling' must be between 0 (short rungs run the drawn learning rate) and 1 (scaled by full_budget / rounds), got 2", "2 }" },
        { "\"first_rung\": 25", "\"first_rung\": 0", "'schedule.first_rung' must be at least 1, got 0", "0," },
        { "\"full_budget\": 400", "\"full_budget\": 20", "'schedule.full_budget' (20) is below 'schedule.first_rung' (25)", "20" },
        { "\"min_nonzero\": 3", "\"min_nonzero\": 0", "'screening.min_nonzero' must be at least 1, got 0", "0 }" },
        { "\"budget\": { \"trials\": 60, \"hours\": 2 }", "\"budget\": { }", "'budget' needs 'trials', 'hours' or both", "{ }" },
        { "\"trials\": 60", "\"trials\": 0", "'budget.trials' must be at least 1, got 0", "0, \"hours\"" },
        { "\"hours\": 2", "\"hours\": 0", "'budget.hours' must be above 0, got 0", "0 }" },
        { "\"hours\": 2", "\"hours\": -1", "'budget.hours' must be above 0, got -1", "-1" },
        { "\"pool\": 3", "\"pool\": 0", "'blend.pool' must be at least 1 (trials per family), got 0", "0 }" },

        // unknown words, with the valid ones listed
        { "\"metric\": \"rmsle\"", "\"metric\": \"rmlse\"", "'metric' cannot be \"rmlse\"; did you mean \"rmsle\"? (valid: rmsle, rmse, mae)", "\"rmlse\"" },
        { "\"kind\": \"asha\"", "\"kind\": \"halving\"", "'schedule.kind' cannot be \"halving\" (valid: full, asha, hyperband)", "\"halving\"" },
        { "\"proposer\": \"tpe\"", "\"proposer\": \"bayes\"", "'schedule.proposer' cannot be \"bayes\" (valid: random, tpe)", "\"bayes\"" },
        { "\"mode\": \"simplex\"", "\"mode\": \"average\"", "'blend.mode' cannot be \"average\" (valid: simplex, non_negative, greedy)", "\"average\"" },

        // data
        { "\"target\": \"q1_spend\"", "\"target\": \"shipper_id\"", "'data.target' must differ from 'data.id'", "\"shipper_id\" }" },
        { ", \"target\": \"q1_spend\"", "", "'data' needs the key 'target'", "{ \"train\"" },
        { "\"test\": \"test.csv\"", "\"test\": \"\"", "'data.test' must be a non-empty string", "\"\"" },
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void Names_the_key_and_points_at_the_offending_key_or_value(string replace, string with, string message, string pointedAt)
    {
        // Given the full definition with one mistake
        Assert.Contains(replace, DefinitionText.Full);
        string json = DefinitionText.Full.Replace(replace, with, StringComparison.Ordinal);

        // When it is parsed
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "/defs/bad.json", DefinitionText.Folder));

        // Then the message names the key, and the line and column are where the mistake starts
        Assert.Contains(message, e.Problem);
        Assert.Equal("/defs/bad.json", e.File);
        Assert.Equal(DefinitionText.PositionOf(json, pointedAt), (e.Line!.Value, e.Column!.Value));
        Assert.Equal($"/defs/bad.json:{e.Line}:{e.Column}: {e.Problem}", e.Message);
    }

    [Fact]
    public void Points_at_a_misspelt_schedule_key_by_line_and_column()
    {
        // Given a misspelt key on line 3, column 5 (counted by hand)
        string json = "{\n  \"data\": { \"train\": \"a\", \"test\": \"b\", \"id\": \"i\", \"target\": \"y\" },\n  \"schedule\": {\n    \"frist_rung\": 10\n  }\n}";

        // When it is parsed
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "s.json", "/defs"));

        // Then the error is at the key's opening quote
        Assert.Equal((4L, 5), (e.Line, e.Column));
        Assert.Equal("s.json:4:5: unknown key 'schedule.frist_rung'; did you mean 'first_rung'? (known keys here: kind, proposer, first_rung, full_budget, eta, rate_scaling, brackets, screen_folds)", e.Message);
    }

    [Fact]
    public void Counts_columns_in_characters_not_bytes()
    {
        // Given a bad value after a three-byte character on the same line
        string json = "{ \"name\": \"fracht—q1\", \"folds\": 0, \"data\": { \"train\": \"a\", \"test\": \"b\", \"id\": \"i\", \"target\": \"y\" } }";

        // When it is parsed
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "s.json", "/defs"));

        // Then the column counts the dash as one character: the 0 is character 33 (35 in bytes)
        Assert.Equal((1L, 33), (e.Line, e.Column));
    }

    [Fact]
    public void A_missing_data_section_points_at_the_start_of_the_definition()
    {
        // When a definition without data is parsed
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse("\n  { \"folds\": 3 }", "s.json", "/defs"));

        // Then the error names the key and points at the opening brace
        Assert.Equal("the definition needs the key 'data'", e.Problem);
        Assert.Equal((2L, 3), (e.Line, e.Column));
    }

    [Fact]
    public void A_range_limit_is_checked_where_the_file_fixes_a_value()
    {
        // Given leaves fixed at 1, below LightGBM's least of 2
        string json = """{ "data": { "train": "a", "test": "b", "id": "i", "target": "y" }, "families": { "lightgbm": { "leaves": 1 } } }""";

        // When it is parsed
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "s.json", "/defs"));

        // Then the fixed value is refused at its position
        Assert.Contains("'families.lightgbm.leaves' must be at least 2", e.Problem);
        Assert.Equal(DefinitionText.PositionOf(json, "1 }"), (e.Line!.Value, e.Column!.Value));
    }

    [Fact]
    public void A_families_section_that_names_no_family_is_refused()
    {
        // Given an empty families object on line 2, column 15
        string json = "{ \"data\": { \"train\": \"a\", \"test\": \"b\", \"id\": \"i\", \"target\": \"y\" },\n  \"families\": { } }";

        // When it is parsed
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "s.json", "/defs"));

        // Then the error lists the families to choose from
        Assert.Equal("'families' names no family; add one or more of lightgbm, fasttree, forest, gam, linear", e.Problem);
        Assert.Equal((2L, 15), (e.Line, e.Column));
    }

    [Fact]
    public void A_top_level_value_that_is_not_an_object_is_refused()
    {
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse("[1, 2]", "s.json", "/defs"));

        Assert.Equal("the definition must be an object { ... }, got a list", e.Problem);
        Assert.Equal((1L, 1), (e.Line, e.Column));
    }
}
