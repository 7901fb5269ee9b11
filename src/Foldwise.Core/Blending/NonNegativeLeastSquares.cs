namespace Foldwise.Core.Blending;

/// <summary>
/// Non-negative least squares, min ‖y − P w‖² subject to w ≥ 0 with no sum constraint, by the
/// active-set method of Lawson and Hanson ("Solving Least Squares Problems", 1974, ch. 23) run on the
/// Gram of [P, y]. It stops when every left-out column's gradient Pᵢᵀ(y − P w) is at most 1e-12 of its scale.
/// </summary>
public static class NonNegativeLeastSquares
{
    private const double Tolerance = 1e-12;

    /// <summary>The optimal non-negative weights for the columns of P (each as long as y) and their objective.</summary>
    public static BlendWeights Solve(IReadOnlyList<double[]> columns, ReadOnlySpan<double> y)
    {
        var target = BlendColumns.Validated(columns, y);
        var weights = SolveGram(Gram.Of([.. columns, target]));
        return new BlendWeights(weights, BlendColumns.SumOfSquares(columns, weights, target));
    }

    /// <summary>Solves on the Gram of [P, y] (the target last) and returns k non-negative weights.</summary>
    internal static double[] SolveGram(Gram augmented)
    {
        int k = augmented.Size - 1;
        var w = new double[k];
        var norm = new double[k];
        for (int i = 0; i < k; i++)
        {
            norm[i] = Math.Sqrt(Math.Max(0, augmented[i, i]));
        }

        double targetNorm = Math.Sqrt(Math.Max(0, augmented[k, k]));
        var support = new List<int>();
        var refused = new bool[k];
        var gradient = new double[k];
        // Each accepted entry lowers the objective, and refusals are at most k between entries, so
        // only entries need a cap; it guards against rounding making the method cycle.
        int limit = (10 * k) + 100;
        for (int entries = 0; ;)
        {
            if (entries == limit)
            {
                throw new InvalidOperationException($"the non-negative active set did not settle in {limit} entries");
            }

            double scale = targetNorm;
            foreach (int j in support)
            {
                scale += w[j] * norm[j];
            }

            int enter = -1;
            double most = 0;
            for (int i = 0; i < k; i++)
            {
                double g = augmented[i, k];
                foreach (int j in support)
                {
                    g -= augmented[i, j] * w[j];
                }

                gradient[i] = g;
                if (w[i] == 0 && !refused[i] && g > Tolerance * norm[i] * scale && g > most)
                {
                    enter = i;
                    most = g;
                }
            }

            if (enter < 0)
            {
                return w;
            }

            support.Add(enter);
            if (Descend(augmented, w, support, enter))
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

    /// <summary>Lawson–Hanson's inner loop; false (support restored) when the entering column gets no positive weight.</summary>
    private static bool Descend(Gram augmented, double[] w, List<int> support, int enter)
    {
        int k = augmented.Size - 1;
        for (bool firstStep = true; ; firstStep = false)
        {
            var rhs = new double[support.Count];
            for (int p = 0; p < rhs.Length; p++)
            {
                rhs[p] = augmented[support[p], k];
            }

            var z = SupportSystem.Solve(augmented, support, rhs);
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

            for (int p = 0; p < support.Count; p++)
            {
                int j = support[p];
                w[j] = Math.Max(0, w[j] + (step * (z[p] - w[j])));
            }

            w[blocking] = 0;
            support.RemoveAll(j => w[j] == 0);
        }
    }
}
