using Foldwise.Core.Spaces;

namespace Foldwise.Core.Schedules;

/// <summary>
/// One family's results at one ASHA rung, kept so a promotion decision costs O(log n): every result in
/// (score, id) order, and the results not yet promoted in a sorted set. The best waiting result is promotable
/// when its rank among all results is below ⌊n/η⌋ — everything ranked above it has been promoted already.
/// </summary>
internal sealed class AshaRung
{
    private readonly List<(double Score, int Id)> _ranked = [];
    private readonly SortedSet<(double Score, int Id)> _waiting = [];
    private readonly Dictionary<int, (double Score, ParameterSet Parameters)> _results = [];
    private readonly HashSet<int> _promoted = [];

    public int Results => _ranked.Count;

    public void Add(int id, double score, ParameterSet parameters)
    {
        if (!_results.TryAdd(id, (score, parameters)))
        {
            return;
        }

        var key = (score, id);
        int at = _ranked.BinarySearch(key);
        _ranked.Insert(at >= 0 ? at : ~at, key);
        if (!_promoted.Contains(id))
        {
            _waiting.Add(key);
        }
    }

    /// <summary>A trial of the next rung names this one as its parent (it may be seen before or after its result).</summary>
    public void MarkPromoted(int id)
    {
        if (_promoted.Add(id) && _results.TryGetValue(id, out var result))
        {
            _waiting.Remove((result.Score, id));
        }
    }

    /// <summary>The best result not yet promoted, if it lies in the top ⌊n/η⌋ of this rung.</summary>
    public bool TryPromotable(int eta, out int id, out ParameterSet parameters)
    {
        id = 0;
        parameters = ParameterSet.Empty;
        if (_waiting.Count == 0)
        {
            return false;
        }

        var best = _waiting.Min;
        int rank = _ranked.BinarySearch(best);
        if (rank >= _ranked.Count / eta)
        {
            return false;
        }

        id = best.Id;
        parameters = _results[best.Id].Parameters;
        return true;
    }
}
