namespace Foldwise.Core.Blending;

/// <summary>
/// Solves H[S,S] x = b for a positive semi-definite Gram restricted to a support S. Collinear or
/// duplicated columns make H[S,S] singular, so it is factorised as H[S,S] + εI with the smallest ε
/// (from 1e-13 of the largest diagonal, growing ×100) that Cholesky accepts, and the answer is then
/// refined against the unregularised matrix, which removes the bias wherever H[S,S] is well conditioned.
/// </summary>
internal static class SupportSystem
{
    private const double RelativeRidge = 1e-13;
    private const int RefinementSteps = 3;

    public static double[] Solve(Gram h, IReadOnlyList<int> support, ReadOnlySpan<double> b)
    {
        int s = support.Count;
        var a = new double[s * s];
        double maxDiagonal = 0;
        for (int i = 0; i < s; i++)
        {
            for (int j = 0; j < s; j++)
            {
                a[(i * s) + j] = h[support[i], support[j]];
            }

            maxDiagonal = Math.Max(maxDiagonal, a[(i * s) + i]);
        }

        // An all-zero block (every column equal to the shift) has no scale; any ridge gives the
        // right direction, and 1 keeps the refined answer far from overflow.
        double ridge = maxDiagonal > 0 ? maxDiagonal * RelativeRidge : 1;
        double[]? factor = null;
        for (int attempt = 0; attempt < 12 && factor is null; attempt++, ridge *= 100)
        {
            factor = Cholesky(a, s, ridge);
        }

        if (factor is null)
        {
            throw new InvalidOperationException("the support system could not be factorised; the Gram has non-finite entries");
        }

        var x = new double[s];
        b.CopyTo(x);
        SolveInPlace(factor, s, x);
        var residual = new double[s];
        for (int step = 0; step < RefinementSteps; step++)
        {
            for (int i = 0; i < s; i++)
            {
                double sum = b[i];
                for (int j = 0; j < s; j++)
                {
                    sum -= a[(i * s) + j] * x[j];
                }

                residual[i] = sum;
            }

            SolveInPlace(factor, s, residual);
            for (int i = 0; i < s; i++)
            {
                x[i] += residual[i];
            }
        }

        return x;
    }

    /// <summary>The lower Cholesky factor of A + ridge·I, or null when a pivot is not positive.</summary>
    private static double[]? Cholesky(double[] a, int s, double ridge)
    {
        var l = new double[s * s];
        for (int j = 0; j < s; j++)
        {
            double pivot = a[(j * s) + j] + ridge;
            for (int p = 0; p < j; p++)
            {
                pivot -= l[(j * s) + p] * l[(j * s) + p];
            }

            if (!(pivot > 0) || !double.IsFinite(pivot))
            {
                return null;
            }

            double root = Math.Sqrt(pivot);
            l[(j * s) + j] = root;
            for (int i = j + 1; i < s; i++)
            {
                double sum = a[(i * s) + j];
                for (int p = 0; p < j; p++)
                {
                    sum -= l[(i * s) + p] * l[(j * s) + p];
                }

                l[(i * s) + j] = sum / root;
            }
        }

        return l;
    }

    private static void SolveInPlace(double[] l, int s, double[] x)
    {
        for (int i = 0; i < s; i++)
        {
            double sum = x[i];
            for (int p = 0; p < i; p++)
            {
                sum -= l[(i * s) + p] * x[p];
            }

            x[i] = sum / l[(i * s) + i];
        }

        for (int i = s - 1; i >= 0; i--)
        {
            double sum = x[i];
            for (int p = i + 1; p < s; p++)
            {
                sum -= l[(p * s) + i] * x[p];
            }

            x[i] = sum / l[(i * s) + i];
        }
    }
}
