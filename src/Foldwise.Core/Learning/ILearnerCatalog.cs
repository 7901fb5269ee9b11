namespace Foldwise.Core.Learning;

/// <summary>The families a worker can train, by name: the built-in ones in production, fakes in tests.</summary>
public interface ILearnerCatalog
{
    /// <summary>The families this catalog holds, in order.</summary>
    IReadOnlyList<string> Families { get; }

    IFoldLearner Get(string family);

    /// <summary>One line per system library this machine lacks that a family needs, naming how to install it; empty when none is missing.</summary>
    IReadOnlyList<string> MissingLibraries() => [];
}
