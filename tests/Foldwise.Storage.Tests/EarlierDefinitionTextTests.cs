using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Core.Spaces;

namespace Foldwise.Storage.Tests;

/// <summary>Stores of formats 1 and 2 kept the definition file's text, in the words of their day; both spellings read.</summary>
public sealed class EarlierDefinitionTextTests
{
    private static readonly SearchDefinition Expected = new()
    {
        Name = "kept",
        Data = new DataSource("/runs/a/train.csv", "/runs/a/test.csv", "id", "y"),
        Metric = MetricKind.Rmse,
        Folds = 4,
        Seed = 11,
        Screening = new ScreeningOptions(MinNonZero: 2),
        Families =
        [
            new FamilySearch("lightgbm", new ParameterSpace([
                ParameterRange.Whole("leaves", 8, 64), ParameterRange.Linear("row_fraction", 0.5, 1), ParameterRange.Log("learning_rate", 0.01, 0.3),
                ParameterRange.Whole("min_leaf_rows", 20, 20), ParameterRange.Fixed("l2", 0.5), ParameterRange.OneOf("style", "a", "b")])),
        ],
        Schedule = new ScheduleOptions(ScheduleKind.Hyperband, ProposerKind.Random, FirstRung: 5, FullBudget: 45, Eta: 3, RateScaling: 0.25, Brackets: 1),
        Budget = new SearchBudget(Trials: 12, Hours: 0.5),
        Blend = new BlendOptions(BlendMode.NonNegative, Pool: 2),
    };

    [Fact]
    public void Reads_the_text_a_format_one_store_kept_in_the_words_before_the_renames()
    {
        // Given the text as the writer of format 1 wrote it (min_rounds / max_rounds, int / float / choice)
        string text = Text("min_rounds", "max_rounds", "int", "float", "choice");

        // Then it reads as the definition it was written from
        Assert.Equal(Expected, EarlierDefinitionText.Read(text), DefinitionComparer.Instance);
    }

    [Fact]
    public void Reads_the_text_a_format_two_store_kept_in_the_renamed_words()
    {
        // Given the text as the writer of format 2 wrote it (first_rung / full_budget, whole / linear / one_of)
        string text = Text("first_rung", "full_budget", "whole", "linear", "one_of");

        // Then it reads as the definition it was written from
        Assert.Equal(Expected, EarlierDefinitionText.Read(text), DefinitionComparer.Instance);
    }

    [Fact]
    public void Text_that_is_no_definition_is_a_damaged_store()
    {
        var e = Assert.Throws<StoreException>(() => EarlierDefinitionText.Read("{\"name\": \"kept\"}"));
        Assert.Contains("damaged", e.Message, StringComparison.Ordinal);
    }

    private static string Text(string first, string full, string whole, string linear, string oneOf) => $$"""
        {
          "name": "kept",
          "data": { "train": "/runs/a/train.csv", "test": "/runs/a/test.csv", "id": "id", "target": "y" },
          "metric": "rmse",
          "folds": 4,
          "seed": 11,
          "screening": { "min_nonzero": 2 },
          "families": {
            "lightgbm": {
              "leaves": {"{{whole}}": [8, 64]},
              "row_fraction": {"{{linear}}": [0.5, 1]},
              "learning_rate": {"log": [0.01, 0.3]},
              "min_leaf_rows": 20,
              "l2": 0.5,
              "style": {"{{oneOf}}": ["a", "b"]}
            }
          },
          "schedule": { "kind": "hyperband", "proposer": "random", "{{first}}": 5, "{{full}}": 45, "eta": 3, "rate_scaling": 0.25, "brackets": 1 },
          "budget": { "trials": 12, "hours": 0.5 },
          "blend": { "mode": "non_negative", "pool": 2 }
        }
        """;
}
