namespace Foldwise.Tuning;

/// <summary>How a run of the search use case ended.</summary>
public enum SearchEnding
{
    /// <summary>The search stopped and its blend and prediction file are written.</summary>
    Blended,

    /// <summary>A resumed search had finished before; nothing ran.</summary>
    AlreadyFinished,

    /// <summary>No trial finished, so there was nothing to blend.</summary>
    NothingDone,

    /// <summary>Abandoned while trials ran: they go back to the queue on resume.</summary>
    Abandoned,

    /// <summary>Abandoned during the blend: every trial is stored, the prediction file was not written.</summary>
    BlendAbandoned,

    /// <summary>The store refused a write (a full disk): the search stopped, every trial committed before is kept.</summary>
    StoreFailed,
}
