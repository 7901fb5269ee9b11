namespace Foldwise.Core.Blending;

/// <summary>
/// Euclidean projection onto the probability simplex {w ≥ 0, Σw = 1} by the sort-based algorithm of
/// Duchi, Shalev-Shwartz, Singer and Chandra, "Efficient Projections onto the ℓ1-Ball", ICML 2008.
/// </summary>
public static class SimplexProjection
{
    /// <summary>The closest point of the simplex to <paramref name="v"/> (which must be non-empty and finite).</summary>
    public static double[] Project(ReadOnlySpan<double> v)
    {
        if (v.IsEmpty)
        {
            throw new ArgumentException("cannot project an empty vector", nameof(v));
        }

        BlendColumns.RequireFinite(v, "the vector to project");
        var sorted = v.ToArray();
        Array.Sort(sorted);
        Array.Reverse(sorted);

        // ρ is the largest j with u_j − (Σ_{r≤j} u_r − 1)/j > 0; θ shifts every entry by the same amount.
        double prefix = 0;
        double theta = 0;
        for (int j = 0; j < sorted.Length; j++)
        {
            prefix += sorted[j];
            double candidate = (prefix - 1) / (j + 1);
            if (sorted[j] - candidate > 0)
            {
                theta = candidate;
            }
        }

        var w = new double[v.Length];
        for (int i = 0; i < w.Length; i++)
        {
            w[i] = Math.Max(0, v[i] - theta);
        }

        return w;
    }
}
