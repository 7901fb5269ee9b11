using Foldwise.Cli.Output;
using Foldwise.Core.Events;
using Spectre.Console.Testing;

namespace Foldwise.Cli.Tests.Output;

public sealed class StepLineTests
{
    [Fact]
    public void Describes_reading_in_megabytes_and_screening_in_columns()
    {
        var reading = new StepProgress(PreparationStep.Reading, "train.csv", 88_000_000, 195_000_000, TimeSpan.FromSeconds(3.2));
        var screening = new StepProgress(PreparationStep.Screening, "train.csv", 1_200, 7_000, TimeSpan.FromSeconds(2));

        Assert.Equal("Reading train.csv: 45 % (88 of 195 MB), 3 s", StepLine.Describe(reading));
        Assert.Equal("Screening train.csv: 1,200 of 7,000 columns, 2 s", StepLine.Describe(screening));
    }

    [Fact]
    public void Describes_writing_in_megabytes_and_re_fitting_in_folds()
    {
        var writing = new StepProgress(PreparationStep.Writing, "the screened training table", 412_000_000, 0, TimeSpan.FromSeconds(6.4));
        var refitting = new StepProgress(PreparationStep.Refitting, "2 blend member(s)", 3, 10, TimeSpan.FromSeconds(41));

        Assert.Equal("Writing the screened training table: 412 MB, 6 s", StepLine.Describe(writing));
        Assert.Equal("Re-fitting 2 blend member(s) to keep their models: 3 of 10 folds, 41 s", StepLine.Describe(refitting));
    }

    [Fact]
    public void Writes_a_plain_line_at_most_every_ten_seconds_of_one_step()
    {
        // Given a console that is not a terminal
        var console = new TestConsole();
        var line = new StepLine(console);

        // When a step reports each second from 2 to 25 s
        for (int s = 2; s <= 25; s++)
        {
            line.Show(new StepProgress(PreparationStep.Reading, "big.csv", s, 25, TimeSpan.FromSeconds(s)));
        }

        // Then it wrote the reports of 2, 12 and 22 s
        Assert.Equal(["2 s", "12 s", "22 s"], console.Lines.Where(l => l.Length > 0).Select(l => l[(l.LastIndexOf(", ", StringComparison.Ordinal) + 2)..]).ToArray());
    }

    [Fact]
    public void A_worker_shows_fold_lines_only_for_long_trials()
    {
        // Given a worker's screen
        var output = new StringWriter();
        var lines = new WorkerLines(output);

        // When a quick trial's fold and a long trial's fold are fitted
        lines.Report(new SlotFoldFitted("w1", "0", 4, 1, 5, TimeSpan.FromSeconds(3)));
        lines.Report(new SlotFoldFitted("w1", "1", 5, 2, 5, TimeSpan.FromSeconds(41)));

        // Then only the long one has a line
        Assert.Equal("Slot 1: trial 5 fold 3 of 5 fitted after 41 s", output.ToString().Trim());
    }

    [Fact]
    public void A_worker_shows_how_far_a_long_trial_has_come_every_ten_seconds_per_slot()
    {
        // Given a worker's screen
        var output = new StringWriter();
        var lines = new WorkerLines(output);

        // When slot 0's trial reports each second from 2 to 31 s (its 5 folds prepared by 14 s, then a round a second),
        // and slot 1's quick trial at 3 s
        for (int s = 2; s <= 31; s++)
        {
            int ready = Math.Min(5, s / 3), round = Math.Max(0, s - 14);
            lines.Report(new SlotTrialAdvanced("w1", "0", 7, ready, 5, round, 40, TimeSpan.FromSeconds(s)));
        }

        lines.Report(new SlotTrialAdvanced("w1", "1", 8, 5, 5, 3, 40, TimeSpan.FromSeconds(3)));

        // Then slot 0 has lines at 10, 20 and 30 s (a trial is long from 10 s) and slot 1 none
        Assert.Equal(
            [
                "Slot 0: trial 7: 3 of 5 folds prepared after 10 s",
                "Slot 0: trial 7: round 6 of 40 trained on every fold after 20 s",
                "Slot 0: trial 7: round 16 of 40 trained on every fold after 30 s",
            ],
            output.ToString().Split(Environment.NewLine, StringSplitOptions.RemoveEmptyEntries));
    }
}
