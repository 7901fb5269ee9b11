using Foldwise.Core.Search;

namespace Foldwise.Core.Events;

/// <summary>The blend members' fold models were re-fitted and kept beside the store, in <paramref name="Folder"/>.</summary>
public sealed record ModelsKept(KeptModels Kept, string Folder, int Refitted, TimeSpan Took) : SearchEvent;
