using Foldwise.Cli.Output;
using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Spectre.Console.Testing;

namespace Foldwise.Cli.Tests.Output;

public sealed class TrialTableTests
{
    private static readonly SearchDefinition Definition = new()
    {
        Name = "t",
        Data = new DataSource("train.csv", "test.csv", "id", "y"),
        Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm)],
        Budget = new SearchBudget(10, null),
    };

    [Fact]
    public void Adds_a_bracket_column_only_when_the_trials_carry_brackets()
    {
        // Given trials of a two-bracket search (bracket 2 starts at rung 1) and trials without brackets
        TrialRecord[] bracketed = [Trial(1, rung: 0, bracket: 1), Trial(2, rung: 1, bracket: 2)];
        TrialRecord[] plain = [Trial(1, rung: 0, bracket: 0), Trial(2, rung: 1, bracket: 0)];

        // When each is listed
        string[] Header(TrialRecord[] trials)
        {
            var console = new TestConsole().Width(200);
            TrialTable.Render(console, trials, Definition, Metric.Rmsle);
            return console.Lines.First(l => l.Contains("trial", StringComparison.Ordinal)).Split(' ', StringSplitOptions.RemoveEmptyEntries);
        }

        // Then only the bracketed search gets the column, just after the rung
        Assert.Equal(["trial", "family", "state", "rung", "bracket", "rounds"], Header(bracketed)[..6]);
        Assert.DoesNotContain("bracket", Header(plain));
    }

    [Fact]
    public void A_fold_screen_adds_a_folds_column_and_history_lists_whole_trials_before_screened_ones()
    {
        // Given a screened trial on 1 fold that scored lower than its promotion on all 5
        TrialRecord[] trials =
        [
            Trial(1, rung: 0, bracket: 0) with { Folds = 1, State = TrialState.Done, Score = 0.40 },
            Trial(2, rung: 1, bracket: 0) with { State = TrialState.Done, Score = 0.55, ParentId = 1 },
        ];

        // When they are listed as history lists them
        var listed = Foldwise.Cli.Commands.HistoryCommand.Filter(trials, new Foldwise.Cli.Commands.HistorySettings());
        var console = new TestConsole().Width(200);
        TrialTable.Render(console, listed, Definition, Metric.Rmsle);
        string[] header = console.Lines.First(l => l.Contains("trial", StringComparison.Ordinal)).Split(' ', StringSplitOptions.RemoveEmptyEntries);

        // Then the whole trial comes first, and each row says how many folds it trained
        Assert.Equal([2, 1], listed.Select(t => t.Id));
        Assert.Equal(["rounds", "folds"], header[4..6]);
        Assert.Contains(console.Lines, l => l.Split(' ', StringSplitOptions.RemoveEmptyEntries) is [ "1", _, _, "0", _, "1", "0.40000", ..]);
        Assert.Contains(console.Lines, l => l.Split(' ', StringSplitOptions.RemoveEmptyEntries) is [ "2", _, _, "1", _, "5", "0.55000", ..]);
    }

    private static TrialRecord Trial(int id, int rung, int bracket) => new()
    {
        Id = id,
        Family = FamilyNames.LightGbm,
        Parameters = ParameterSet.Of([new("learning_rate", 0.1)]),
        Budget = 20 * (rung + 1),
        Rung = rung,
        Bracket = bracket,
        Proposer = "random",
        Created = DateTimeOffset.UnixEpoch,
    };
}
