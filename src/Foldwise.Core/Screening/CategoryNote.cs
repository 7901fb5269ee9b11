using Foldwise.Core.Encodings;

namespace Foldwise.Core.Screening;

/// <summary>What was done with one kept category column, as the run summary, <c>show</c> and the report print it.</summary>
/// <param name="Levels">Distinct levels in the training table (missing not counted).</param>
/// <param name="LevelsKept">Levels seen often enough over all training rows to stay on their own (each fold decides on its own rows).</param>
/// <param name="MissingShare">Share of training cells that are missing.</param>
/// <param name="NewTestLevels">Levels of the test table that training never saw (they join "other").</param>
/// <param name="NewTestRows">Test rows holding such a level.</param>
public sealed record CategoryNote(
    string Name,
    int Levels,
    int LevelsKept,
    CategoryEncodingKind Encoding,
    double MissingShare,
    int NewTestLevels = 0,
    int NewTestRows = 0);
