using Foldwise.Core.Screening;

namespace Foldwise.Core.Events;

/// <summary>Screening decided which columns stay; <paramref name="MinNonZero"/> is the threshold it applied.</summary>
public sealed record ColumnsScreened(ScreeningReport Report, int MinNonZero) : SearchEvent;
