using System.Collections.Immutable;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Learning;

/// <summary>One fold of one trial: train on <see cref="TrainRows"/>, predict <see cref="ValidationRows"/> and the test table.</summary>
/// <param name="Budget">Boosting rounds (or trees) this fit may use.</param>
/// <param name="Threads">Threads the learner may use; the slot has these cores to itself.</param>
/// <param name="Inputs">The fold's encoded features; when null, the table's own features (a table without category columns).</param>
public sealed record FoldJob(
    TrialData Data,
    int Fold,
    ImmutableArray<int> TrainRows,
    ImmutableArray<int> ValidationRows,
    ParameterSet Parameters,
    int Budget,
    int Seed,
    int Threads,
    FoldInputs? Inputs = null)
{
    /// <summary>The features a learner reads: rows of <see cref="FoldInputs.Train"/> are indexed by <see cref="TrainRows"/> and <see cref="ValidationRows"/>.</summary>
    public FoldInputs Features => Inputs ?? FoldInputs.Plain(Data);
}
