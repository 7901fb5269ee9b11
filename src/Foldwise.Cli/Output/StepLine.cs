using System.Globalization;
using Foldwise.Core.Events;
using Spectre.Console;

namespace Foldwise.Cli.Output;

/// <summary>
/// Shows a long preparation step's progress: on a terminal one line rewritten in place and wiped before the next
/// output; otherwise a plain line at most every <see cref="StepThrottle.Interval"/>, so a log shows the step is alive.
/// </summary>
internal sealed class StepLine(IAnsiConsole console)
{
    private readonly StepThrottle plain = new();
    private int shownWidth;

    private bool InPlace => console.Profile.Capabilities.Interactive && console.Profile.Capabilities.Ansi;

    public void Show(StepProgress step)
    {
        string text = Describe(step);
        if (InPlace)
        {
            console.Profile.Out.Writer.Write("\r" + text.PadRight(shownWidth));
            shownWidth = text.Length;
            return;
        }

        if (plain.Due(step))
        {
            console.Profile.Out.Writer.WriteLine(text);
        }
    }

    /// <summary>Wipes the in-place line, if one is shown, so the next output starts on a clean line.</summary>
    public void Clear()
    {
        if (shownWidth > 0)
        {
            console.Profile.Out.Writer.Write("\r" + new string(' ', shownWidth) + "\r");
            shownWidth = 0;
        }
    }

    internal static string Describe(StepProgress step)
    {
        string seconds = step.Elapsed.TotalSeconds.ToString("F0", CultureInfo.InvariantCulture) + " s";
        return step.Step switch
        {
            PreparationStep.Screening => string.Create(CultureInfo.InvariantCulture, $"Screening {step.Subject}: {step.Done:N0} of {step.Total:N0} columns, {seconds}"),
            PreparationStep.Writing => string.Create(CultureInfo.InvariantCulture, $"Writing {step.Subject}: {Megabytes(step.Done)} MB, {seconds}"),
            PreparationStep.Refitting => string.Create(CultureInfo.InvariantCulture, $"Re-fitting {step.Subject} to keep their models: {step.Done:N0} of {step.Total:N0} folds, {seconds}"),
            PreparationStep.Fetching => string.Create(CultureInfo.InvariantCulture, $"Fetching {step.Subject}: {step.Fraction:P0} ({Megabytes(step.Done)} of {Megabytes(step.Total)} MB), {seconds}"),
            _ => string.Create(CultureInfo.InvariantCulture, $"Reading {step.Subject}: {step.Fraction:P0} ({Megabytes(step.Done)} of {Megabytes(step.Total)} MB), {seconds}"),
        };
    }

    private static string Megabytes(long bytes) => (bytes / 1e6).ToString(bytes < 10e6 ? "F1" : "F0", CultureInfo.InvariantCulture);
}
