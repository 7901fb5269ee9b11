using Foldwise.Core.Search;

namespace Foldwise.Tuning;

/// <summary>
/// What <see cref="KeptScoring.Predict"/> wrote: the file, its rows, the kept blend used, and its time by phase.
/// </summary>
/// <param name="Read">Opening the store and models, and reading the new rows' CSV against the training table.</param>
/// <param name="Prepare">Turning the new rows into the learners' row form (wall time).</param>
/// <param name="Score">Encoding each fold's inputs and predicting with every fold model (wall time; the two are split in <see cref="Work"/>).</param>
/// <param name="Write">Blending and writing the prediction file.</param>
/// <param name="Took">All of it.</param>
public sealed record ScoringSummary(
    string File, int Rows, KeptModels Kept, TimeSpan Read, TimeSpan Prepare, TimeSpan Score, TimeSpan Write, TimeSpan Took, KeptScoringWork Work);
