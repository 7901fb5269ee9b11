using Foldwise.Core.Search;

namespace Foldwise.Tuning;

/// <summary>What <see cref="KeptScoring.Predict"/> wrote: the file, its rows, the kept blend used, and the time to read the rows and in all.</summary>
public sealed record ScoringSummary(string File, int Rows, KeptModels Kept, TimeSpan Read, TimeSpan Took);
