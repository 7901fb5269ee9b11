namespace Foldwise.Core.Encodings;

/// <summary>
/// How category columns are encoded inside each fold. The defaults: levels seen fewer than <c>10</c> times in the fold's
/// training rows join one "other" level; at most <c>12</c> kept levels become indicator columns, more a smoothed target
/// mean with <c>MinSamples = 10</c> and <c>Steepness = 4</c> (Micci-Barreca's k and f) over <c>5</c> inner folds.
/// These values are chosen here, not taken from a source.
/// </summary>
/// <param name="MinLevelCount">A level needs this many training rows of the fold to be kept on its own.</param>
/// <param name="IndicatorCap">A column with more kept levels than this (missing and "other" included) is target-mean encoded.</param>
/// <param name="MinSamples">Micci-Barreca's k: the level count at which a level's own mean and the prior weigh equally.</param>
/// <param name="Steepness">Micci-Barreca's f: how quickly the weight moves from the prior to the level's own mean.</param>
/// <param name="InnerFolds">Inner folds over the fold's training rows, so a row's own target never enters its encoding.</param>
public sealed record EncodingOptions(
    int MinLevelCount = 10,
    int IndicatorCap = 12,
    double MinSamples = 10,
    double Steepness = 4,
    int InnerFolds = 5)
{
    public static EncodingOptions Default { get; } = new();
}
