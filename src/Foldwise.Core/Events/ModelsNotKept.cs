namespace Foldwise.Core.Events;

/// <summary>The blend is written but its members' models were not kept, for the reason given; predicting new rows needs them.</summary>
public sealed record ModelsNotKept(string Reason) : SearchEvent;
