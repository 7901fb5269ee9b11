namespace Foldwise.Core.Definition;

/// <summary>How budgets are handed out. The default is <see cref="Asha"/>.</summary>
public enum ScheduleKind
{
    /// <summary>Every candidate trains at the full budget (plain search).</summary>
    Full,

    /// <summary>Asynchronous successive halving (Li et al., MLSys 2020).</summary>
    Asha,

    /// <summary>Hyperband brackets of synchronous successive halving (Li et al., JMLR 2018).</summary>
    Hyperband,
}
