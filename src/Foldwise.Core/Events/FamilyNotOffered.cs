namespace Foldwise.Core.Events;

/// <summary>A family failed this worker's self-test (a tiny model could not be trained), so it is not offered; <paramref name="Problem"/> names the missing library when one is.</summary>
public sealed record FamilyNotOffered(string Family, string Problem) : SearchEvent;
