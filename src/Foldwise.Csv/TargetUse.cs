namespace Foldwise.Csv;

/// <summary>What the loader does with the target column.</summary>
internal enum TargetUse
{
    /// <summary>The header must have it and every row's value is read and checked (training).</summary>
    Required,

    /// <summary>It may be absent; when present its cells are skipped (test).</summary>
    IgnoredIfPresent,
}
