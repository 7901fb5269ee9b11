namespace Foldwise.Core.Events;

/// <summary>The steps before trials run whose length grows with the table.</summary>
public enum PreparationStep
{
    /// <summary>Reading a CSV table; progress in bytes of the file.</summary>
    Reading,

    /// <summary>Screening the training table's columns; progress in columns.</summary>
    Screening,

    /// <summary>A worker fetching the screened table from the coordinator; progress in bytes.</summary>
    Fetching,
}
