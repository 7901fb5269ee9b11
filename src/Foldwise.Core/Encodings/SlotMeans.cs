namespace Foldwise.Core.Encodings;

/// <summary>The smoothed target mean of each slot of one category column, fitted on chosen rows (their targets only).</summary>
internal sealed class SlotMeans(LevelSlots slots, int[] codes, double[] target, EncodingOptions options)
{
    public double[] Fit(IReadOnlyList<int> rows)
    {
        var sums = new double[slots.Count];
        var counts = new int[slots.Count];
        double total = 0;
        foreach (int row in rows)
        {
            int slot = slots.Of(codes[row]);
            sums[slot] += target[row];
            counts[slot]++;
            total += target[row];
        }

        double prior = rows.Count == 0 ? 0 : total / rows.Count;
        var means = new double[slots.Count];
        for (int s = 0; s < means.Length; s++)
        {
            means[s] = SmoothedMean.Of(sums[s], counts[s], prior, options.MinSamples, options.Steepness);
        }

        return means;
    }
}
