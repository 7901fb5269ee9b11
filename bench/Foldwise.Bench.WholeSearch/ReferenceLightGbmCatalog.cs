using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Foldwise.Learners;

namespace Foldwise.Bench.WholeSearch;

/// <summary>The built-in learners with the lightgbm family trained by ML.NET's LightGBM trainer, the former default.</summary>
internal sealed class ReferenceLightGbmCatalog : ILearnerCatalog
{
    private readonly MlNetLightGbmLearner reference = new();

    public IReadOnlyList<string> Families => LearnerCatalog.BuiltIn.Families;

    public IFoldLearner Get(string family) => family == FamilyNames.LightGbm ? reference : LearnerCatalog.BuiltIn.Get(family);

    public IReadOnlyList<string> MissingLibraries() => LearnerCatalog.BuiltIn.MissingLibraries();
}
