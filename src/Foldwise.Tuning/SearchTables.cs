using Foldwise.Core.Data;

namespace Foldwise.Tuning;

/// <summary>
/// A search's screened training and test tables as the process already holds them: the ones stored under the
/// search's hashes, so whatever needs them again (the re-fit of the blend's members) need not read and hold a second copy.
/// </summary>
public sealed record SearchTables(FeatureTable Train, FeatureTable Test);
