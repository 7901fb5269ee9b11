namespace Foldwise.Core.Learning;

/// <summary>The families a worker can train, by name: the built-in ones in production, fakes in tests.</summary>
public interface ILearnerCatalog
{
    /// <summary>The families this catalog holds, in order.</summary>
    IReadOnlyList<string> Families { get; }

    IFoldLearner Get(string family);
}
