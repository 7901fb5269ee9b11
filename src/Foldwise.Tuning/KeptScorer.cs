using Foldwise.Core.Encodings;
using Foldwise.Core.Learning;
using Foldwise.Core.Search;

namespace Foldwise.Tuning;

/// <summary>
/// One kept blend member ready to predict: its family's way of using kept models, the trial's re-fit (parameters, budget,
/// seed), its fold models in fold order, and the form its family reads few-level category columns in.
/// </summary>
internal sealed record KeptScorer(IKeepsModels Keeper, TrialFit Fit, IReadOnlyList<byte[]> Models, CategoryEncodingKind FewLevels);
