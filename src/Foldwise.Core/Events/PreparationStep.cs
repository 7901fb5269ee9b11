namespace Foldwise.Core.Events;

/// <summary>The steps outside the trials whose length grows with the table.</summary>
public enum PreparationStep
{
    /// <summary>Reading a CSV table; progress in bytes of the file.</summary>
    Reading,

    /// <summary>Screening the training table's columns; progress in columns.</summary>
    Screening,

    /// <summary>A worker fetching the screened table from the coordinator; progress in bytes.</summary>
    Fetching,

    /// <summary>Writing the screened tables beside the store; progress in bytes written (the total is not known before).</summary>
    Writing,

    /// <summary>Re-fitting the blend's members to keep their models; progress in folds fitted of all members.</summary>
    Refitting,
}
