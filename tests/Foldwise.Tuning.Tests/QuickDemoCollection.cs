namespace Foldwise.Tuning.Tests;

/// <summary>
/// The test classes that read one run of the quick demo share it: separate runs started in the same second got the
/// same search id, and each run's in-memory exporter sees every run's spans, so the trace test found two search spans.
/// </summary>
[CollectionDefinition(Name)]
public sealed class QuickDemoCollection : ICollectionFixture<QuickDemoRun>
{
    public const string Name = "quick demo run";
}
