using Foldwise.Core.Learning;

namespace Foldwise.Learners.Native;

/// <summary>
/// What a native fit reads from its <see cref="FoldJob"/>: the fold's training rows with their labels, its held-out
/// rows and the test table. The one place that knows how a job's table is laid out; cells stay as they are
/// (a NaN cell reaches LightGBM as missing, an absent cell as zero). It reads the job's
/// <see cref="FoldJob.Features"/>, never the raw table, so category encodings fitted for the fold are what it trains on.
/// </summary>
/// <param name="Offset">The training rows' mean target: labels are centred on it and predictions shifted back by it.</param>
internal sealed record NativeFoldRows(CsrRows Train, float[] Labels, double Offset, CsrRows Validation, CsrRows Test)
{
    public static NativeFoldRows From(FoldJob job)
    {
        var data = job.Data;
        double offset = FoldFitter.TrainingMean(job);
        var labels = new float[job.TrainRows.Length];
        for (int i = 0; i < labels.Length; i++)
        {
            labels[i] = (float)(data.Target[job.TrainRows[i]] - offset);
        }

        // The fold's own inputs (category encodings fitted on its training rows), NaN kept: LightGBM reads it as missing.
        var features = job.Features;
        return new NativeFoldRows(
            CsrRows.Select(features.Train, job.TrainRows), labels, offset, CsrRows.Select(features.Train, job.ValidationRows), CsrRows.All(features.Test));
    }
}
