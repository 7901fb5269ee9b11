namespace Foldwise.Core.Definition;

/// <summary>
/// What a definition's schedule gets for what it leaves out; <see cref="ScheduleOptions"/>' own defaults are the
/// rounds screen, which stores and definitions written before the fold screen became the default keep.
/// </summary>
public static class ScheduleDefaults
{
    /// <summary>Folds a new candidate trains first when an ASHA definition names no rungs of its own (racing over folds).</summary>
    public const int ScreenFolds = 1;

    /// <summary>η of the fold screen: with 5 folds, 1 → 5 (the best fifth of the one-fold screens trains every fold).</summary>
    public const int FoldScreenEta = 5;

    /// <summary>The schedule of a definition without a <c>schedule</c>: ASHA with TPE over folds.</summary>
    public static ScheduleOptions Standard { get; } = new(Eta: FoldScreenEta, ScreenFolds: ScreenFolds);

    /// <summary>
    /// The screen of an ASHA definition that did not write <c>screen_folds</c>: folds, unless it wrote rungs in its
    /// learners' budget (<c>first_rung</c>), which it would not write for a fold screen.
    /// </summary>
    public static int ScreenFoldsFor(ScheduleKind kind, bool firstRungWritten) =>
        kind == ScheduleKind.Asha && !firstRungWritten ? ScreenFolds : 0;

    /// <summary>η when the definition wrote none: 5 for a fold screen, else the rounds screen's 3.</summary>
    public static int EtaFor(int screenFolds) => screenFolds > 0 ? FoldScreenEta : new ScheduleOptions().Eta;
}
