namespace Foldwise.Core.Search;

/// <summary>What a slot asking for work is told.</summary>
public enum LeaseKind
{
    /// <summary>A trial is leased to the slot.</summary>
    Granted,

    /// <summary>Nothing to start now (running trials must finish first); ask again shortly.</summary>
    Wait,

    /// <summary>The search has stopped handing out work; the slot may stop asking.</summary>
    Finished,

    /// <summary>The worker's trials failed too often in a row while others succeeded: it gets no more work in this search.</summary>
    Quarantined,
}
