namespace Foldwise.Core.Blending;

/// <summary>
/// How alike the pooled members' out-of-fold predictions are: the Pearson correlation of every pair. Members whose
/// predictions correlate near 1 make the same errors, so blending them gains little.
/// </summary>
public static class OutOfFoldCorrelations
{
    /// <summary>A symmetric matrix with 1 on the diagonal; NaN for a pair where either vector is constant.</summary>
    public static double[,] Of(IReadOnlyList<double[]> vectors)
    {
        ArgumentNullException.ThrowIfNull(vectors);
        int n = vectors.Count;
        var centred = new double[n][];
        var norms = new double[n];
        for (int i = 0; i < n; i++)
        {
            if (i > 0 && vectors[i].Length != vectors[0].Length)
            {
                throw new ArgumentException($"vector {i} has {vectors[i].Length} values, vector 0 has {vectors[0].Length}", nameof(vectors));
            }

            double mean = vectors[i].Average();
            centred[i] = Array.ConvertAll(vectors[i], v => v - mean);
            norms[i] = Math.Sqrt(centred[i].Sum(v => v * v));
        }

        var r = new double[n, n];
        for (int i = 0; i < n; i++)
        {
            r[i, i] = norms[i] > 0 ? 1 : double.NaN;
            for (int j = i + 1; j < n; j++)
            {
                double dot = 0;
                for (int k = 0; k < centred[i].Length; k++)
                {
                    dot += centred[i][k] * centred[j][k];
                }

                r[i, j] = r[j, i] = norms[i] > 0 && norms[j] > 0 ? Math.Clamp(dot / (norms[i] * norms[j]), -1, 1) : double.NaN;
            }
        }

        return r;
    }
}
