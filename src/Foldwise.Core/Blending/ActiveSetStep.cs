namespace Foldwise.Core.Blending;

/// <summary>
/// The ratio test both active-set solvers share (Lawson–Hanson's inner loop): how far the weights may move from
/// <c>w</c> toward the support solution <c>z</c> before a support weight reaches zero.
/// </summary>
internal static class ActiveSetStep
{
    /// <summary>The column that blocks the step (−1 when <c>z</c> is positive on the whole support) and the step length in (0, 1].</summary>
    public static int Blocking(double[] w, List<int> support, double[] z, out double step)
    {
        int blocking = -1;
        step = 1;
        for (int p = 0; p < support.Count; p++)
        {
            if (z[p] <= 0)
            {
                int j = support[p];
                double ratio = w[j] / (w[j] - z[p]);
                if (ratio < step || blocking < 0)
                {
                    step = Math.Min(step, ratio);
                    blocking = j;
                }
            }
        }

        return blocking;
    }
}
