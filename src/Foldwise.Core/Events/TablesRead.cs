using System.Collections.Immutable;

namespace Foldwise.Core.Events;

/// <summary>Both tables were read and aligned; <paramref name="IgnoredTestColumns"/> are test columns training lacks.</summary>
public sealed record TablesRead(
    string TrainFile,
    int TrainRows,
    int Features,
    double Density,
    string TestFile,
    int TestRows,
    TimeSpan Took,
    ImmutableArray<string> IgnoredTestColumns) : SearchEvent;
