namespace Foldwise.Core.Blending;

/// <summary>
/// Exact least squares on the probability simplex: min ‖y − P w‖² subject to w ≥ 0 and Σw = 1
/// (Breiman, "Stacked Regressions", 1996, with the sum constraint). A primal active-set method on the
/// error Gram E = (P − y1ᵀ)ᵀ(P − y1ᵀ): each step solves the equality-constrained problem on the support
/// exactly, and it stops only when the KKT conditions hold — every left-out column's multiplier
/// (Ew)ᵢ − wᵀEw is non-negative to within 1e-12 of its scale.
/// </summary>
public static class SimplexLeastSquares
{
    private const double Tolerance = 1e-12;

    /// <summary>The optimal weights for the columns of P (each as long as y) and their objective.</summary>
    public static BlendWeights Solve(IReadOnlyList<double[]> columns, ReadOnlySpan<double> y)
    {
        var target = BlendColumns.Validated(columns, y);
        var weights = SolveGram(Gram.Of(columns, shift: target));
        return new BlendWeights(weights, BlendColumns.SumOfSquares(columns, weights, target));
    }

    /// <summary>Solves on an error Gram (columns shifted by the target) and returns weights on the simplex.</summary>
    internal static double[] SolveGram(Gram e)
    {
        int k = e.Size;
        var w = new double[k];
        var norm = new double[k];
        int first = 0;
        for (int i = 0; i < k; i++)
        {
            norm[i] = Math.Sqrt(Math.Max(0, e[i, i]));
            if (e[i, i] < e[first, first])
            {
                first = i;
            }
        }

        // The best single column is a vertex of the simplex and the optimum of its own support.
        w[first] = 1;
        var support = new List<int> { first };
        var refused = new bool[k];
        var gradient = new double[k];
        // Each accepted entry lowers the objective, and refusals are at most k between entries, so
        // only entries need a cap; it guards against rounding making the method cycle.
        int limit = (10 * k) + 100;
        for (int entries = 0; ;)
        {
            if (entries == limit)
            {
                throw new InvalidOperationException($"the simplex active set did not settle in {limit} entries");
            }

            double objective = Gradient(e, w, support, gradient);
            double scale = 0;
            foreach (int j in support)
            {
                scale += w[j] * norm[j];
            }

            int enter = -1;
            double most = 0;
            for (int i = 0; i < k; i++)
            {
                double multiplier = gradient[i] - objective;
                if (w[i] == 0 && !refused[i] && multiplier < -Tolerance * norm[i] * scale && multiplier < most)
                {
                    enter = i;
                    most = multiplier;
                }
            }

            if (enter < 0)
            {
                return SimplexProjection.Project(w);
            }

            support.Add(enter);
            if (Descend(e, w, support, enter))
            {
                entries++;
                Array.Clear(refused);
            }
            else
            {
                refused[enter] = true;
            }
        }
    }

    /// <summary>Fills g = E w and returns wᵀ E w.</summary>
    private static double Gradient(Gram e, double[] w, List<int> support, double[] g)
    {
        int k = e.Size;
        double objective = 0;
        for (int i = 0; i < k; i++)
        {
            double sum = 0;
            foreach (int j in support)
            {
                sum += e[i, j] * w[j];
            }

            g[i] = sum;
        }

        foreach (int j in support)
        {
            objective += w[j] * g[j];
        }

        return objective;
    }

    /// <summary>
    /// Moves w to the optimum on the enlarged support, stepping back to the boundary and dropping a
    /// column whenever the unconstrained optimum leaves the simplex. Returns false (and restores the
    /// support) when the entering column gets no positive weight: its multiplier was rounding noise.
    /// </summary>
    private static bool Descend(Gram e, double[] w, List<int> support, int enter)
    {
        for (bool firstStep = true; ; firstStep = false)
        {
            var z = OnSupport(e, support);
            int blocking = ActiveSetStep.Blocking(w, support, z, out double step);

            if (blocking < 0)
            {
                for (int p = 0; p < support.Count; p++)
                {
                    w[support[p]] = z[p];
                }

                return true;
            }

            if (firstStep && z[support.IndexOf(enter)] <= 0)
            {
                support.Remove(enter);
                return false;
            }

            double total = 0;
            for (int p = 0; p < support.Count; p++)
            {
                int j = support[p];
                w[j] += step * (z[p] - w[j]);
                total += w[j] > 0 && j != blocking ? w[j] : 0;
            }

            w[blocking] = 0;
            foreach (int j in support)
            {
                w[j] = Math.Max(0, w[j]);
            }

            support.RemoveAll(j => w[j] == 0);
            foreach (int j in support)
            {
                w[j] /= total;
            }
        }
    }

    /// <summary>The minimiser of zᵀE z with Σz = 1 over the support: z ∝ E_SS⁻¹ 1.</summary>
    private static double[] OnSupport(Gram e, List<int> support)
    {
        var ones = new double[support.Count];
        Array.Fill(ones, 1.0);
        var u = SupportSystem.Solve(e, support, ones);
        double sum = 0;
        foreach (double v in u)
        {
            sum += v;
        }

        if (!(sum > 0) || !double.IsFinite(sum))
        {
            throw new InvalidOperationException($"the support system gave 1ᵀE⁻¹1 = {sum}; the error Gram is not positive semi-definite");
        }

        for (int p = 0; p < u.Length; p++)
        {
            u[p] /= sum;
        }

        return u;
    }
}
