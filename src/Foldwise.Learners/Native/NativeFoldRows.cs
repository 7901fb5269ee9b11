using Foldwise.Core.Learning;

namespace Foldwise.Learners.Native;

/// <summary>
/// What a native fit reads from its <see cref="FoldJob"/>: the fold's training rows with their labels, its held-out
/// rows and the test table. The one place that knows how a job's table is laid out; cells stay as they are
/// (a NaN cell reaches LightGBM as missing, an absent cell as zero). It reads the job's
/// <see cref="FoldJob.Features"/>, never the raw table, so category encodings fitted for the fold are what it trains on.
/// Rows are copied only when asked for, and each copy lives only as long as the call that reads it: a fold whose
/// Datasets are already binned copies no training rows at all.
/// </summary>
/// <param name="Offset">The training rows' mean target: labels are centred on it and predictions shifted back by it.</param>
internal sealed record NativeFoldRows(FoldJob Job, double Offset)
{
    public static NativeFoldRows From(FoldJob job) => new(job, FoldFitter.TrainingMean(job));

    /// <summary>The fold's training rows, copied: dispose them once LightGBM has binned them.</summary>
    public CsrRows CopyTrain() => CsrRows.Select(Job.Features.Train, Job.TrainRows);

    /// <summary>The fold's held-out rows, copied: dispose them after the call that reads them.</summary>
    public CsrRows CopyValidation() => CsrRows.Select(Job.Features.Train, Job.ValidationRows);

    /// <summary>The test table where it lies (pinned, not copied): dispose after the call that reads it.</summary>
    public CsrRows PinTest() => CsrRows.All(Job.Features.Test);

    /// <summary>The training rows' targets less <see cref="Offset"/>, in the order of the training rows.</summary>
    public float[] Labels()
    {
        var labels = new float[Job.TrainRows.Length];
        for (int i = 0; i < labels.Length; i++)
        {
            labels[i] = (float)(Job.Data.Target[Job.TrainRows[i]] - Offset);
        }

        return labels;
    }

    /// <summary>Stored cells of the training and of the held-out rows, counted without copying them.</summary>
    public (long Train, long Validation) Cells() =>
        (CsrRows.Cells(Job.Features.Train, Job.TrainRows), CsrRows.Cells(Job.Features.Train, Job.ValidationRows));
}
