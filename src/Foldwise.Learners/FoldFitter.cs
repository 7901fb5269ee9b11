using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Data;

namespace Foldwise.Learners;

/// <summary>
/// The fit path of the ML.NET families (FastTree, and ML.NET's LightGBM trainer kept as a reference): check the job, train in a context seeded from it, then score the
/// held-out rows and the whole test table in batch (one cursor each, no per-row engine).
/// Cancellation is checked before and after training; a fit itself runs to its end.
/// </summary>
internal static class FoldFitter
{
    /// <summary>
    /// ML.NET's LightGBM trainer fits alone in a process: ML.NET serialises its own LightGBM training (two fits started
    /// together in one process took 22.5 s against 22.1 s one after the other, measured 2026-12-01), and concurrent
    /// fits of its LightGBM and FastTree trainers in one test process crashed the process natively (seen 2026-12-02).
    /// It takes this lock to write, every other ML.NET fit to read. The native LightGBM learner takes no part in it.
    /// </summary>
    private static readonly ReaderWriterLockSlim MlNetLightGbmAlone = new(LockRecursionPolicy.NoRecursion);

    /// <summary>The family's descriptor says which inputs it reads (<see cref="FamilyInput"/>); they are prepared from the fold's training rows.</summary>
    public static FoldPrediction Fit(string family, FoldJob job, Func<MLContext, IDataView, ITransformer> train, CancellationToken cancellation) =>
        Run(family, FamilyDescriptors.Get(family).Input, job, train, keep: false, cancellation).Prediction;

    /// <param name="input">The inputs to prepare; MissingCellTests passes <see cref="FamilyInput.RawWithMissing"/> to see what a library does with NaN.</param>
    internal static FoldPrediction Fit(string family, FamilyInput input, FoldJob job, Func<MLContext, IDataView, ITransformer> train, CancellationToken cancellation) =>
        Run(family, input, job, train, keep: false, cancellation).Prediction;

    /// <summary>As <see cref="Fit(string, FoldJob, Func{MLContext, IDataView, ITransformer}, CancellationToken)"/>, with the trained model in ML.NET's own model format as the kept bytes.</summary>
    public static KeptFold FitAndKeep(string family, FoldJob job, Func<MLContext, IDataView, ITransformer> train, CancellationToken cancellation) =>
        Run(family, FamilyDescriptors.Get(family).Input, job, train, keep: true, cancellation);

    /// <summary>
    /// Scores every test row of <paramref name="job"/> with a model <see cref="FitAndKeep"/> kept for the same fold, on
    /// inputs prepared as for that fit (the family's inputs learnt from the same training rows, the same training mean added back).
    /// </summary>
    public static double[] PredictKept(string family, FoldJob job, byte[] model)
    {
        ArgumentNullException.ThrowIfNull(job);
        ArgumentNullException.ThrowIfNull(model);
        return PoolThreadFits.Run(() => PredictKeptHere(family, job, model));
    }

    private static double[] PredictKeptHere(string family, FoldJob job, byte[] model)
    {
        var ml = new MLContext(job.Seed);
        var inputs = job.Features.For(FamilyDescriptors.Get(family).Input, job.TrainRows);
        using var stream = new MemoryStream(model, writable: false);
        var loaded = ml.Model.Load(stream, out _);
        var rows = ScoresDenseRows(family)
            ? SparseViews.Dense(ml, inputs.Test)
            : SparseViews.Rows(ml, inputs.Test, [.. Enumerable.Range(0, inputs.Test.RowCount)], labels: null);
        return Score(loaded, rows, inputs.Test.RowCount, TrainingMean(job));
    }

    /// <summary>
    /// FastTree and forest models score kept rows written out densely: a tree only compares cell values, so the
    /// prediction is the same to the bit (KeptModelTests), and ML.NET's trees find a cell of a sparse row by a search
    /// among its non-zero cells at every split. GAM and linear models sum over the cells, where the order of the sum
    /// could differ between the forms, so they keep the sparse rows.
    /// </summary>
    private static bool ScoresDenseRows(string family) => family is FamilyNames.FastTree or FamilyNames.Forest;

    /// <summary>
    /// True only for ML.NET's LightGBM trainer, kept as a reference for the native learner. FastTree, forest, GAM and
    /// linear fits run side by side in one process and predict bit for bit what they predict alone (ConcurrentFitTests);
    /// behind a one-fit lock a worker's second slot waited for the first slot's fit (two 100-tree forest folds side by
    /// side finished at 0.40 s and 0.80 s against 0.36 s alone, seen 2026-12-05).
    /// </summary>
    private static bool FitsAlone(string family) => family is FamilyNames.LightGbm;

    /// <summary>Every ML.NET fit runs on a pool thread (<see cref="PoolThreadFits"/>).</summary>
    private static KeptFold Run(string family, FamilyInput input, FoldJob job, Func<MLContext, IDataView, ITransformer> train, bool keep, CancellationToken cancellation) =>
        PoolThreadFits.Run(() => RunHere(family, input, job, train, keep, cancellation));

    private static KeptFold RunHere(string family, FamilyInput input, FoldJob job, Func<MLContext, IDataView, ITransformer> train, bool keep, CancellationToken cancellation)
    {
        Check(family, job);
        cancellation.ThrowIfCancellationRequested();
        var ml = new MLContext(job.Seed);
        var data = job.Data;
        var inputs = job.Features.For(input, job.TrainRows);

        // Trees fit the target less its training mean: FastTree boosts from zero, so on a log1p target (mean ~8)
        // a low-budget rung would otherwise be scored on how far it got from zero, not on what it learned.
        double offset = TrainingMean(job);
        var centred = Array.ConvertAll(data.Target, y => y - offset);
        var trainView = SparseViews.Rows(ml, inputs.Train, job.TrainRows, centred);

        // ML.NET 5's public API offers no way to interrupt a fit, so cancellation is honoured around it.
        bool alone = FitsAlone(family);
        if (alone)
        {
            MlNetLightGbmAlone.EnterWriteLock();
        }
        else
        {
            MlNetLightGbmAlone.EnterReadLock();
        }

        try
        {
            var model = train(ml, trainView);
            cancellation.ThrowIfCancellationRequested();
            var validation = Score(model, SparseViews.Rows(ml, inputs.Train, job.ValidationRows, labels: null), job.ValidationRows.Length, offset);
            var test = job.PredictsTest ? Score(model, SparseViews.Test(inputs.Test), inputs.Test.RowCount, offset) : [];
            return new KeptFold(new FoldPrediction(validation, test), keep ? Save(ml, model, trainView.Schema) : []);
        }
        finally
        {
            if (alone)
            {
                MlNetLightGbmAlone.ExitWriteLock();
            }
            else
            {
                MlNetLightGbmAlone.ExitReadLock();
            }
        }
    }

    private static byte[] Save(MLContext ml, ITransformer model, DataViewSchema schema)
    {
        using var stream = new MemoryStream();
        ml.Model.Save(model, schema, stream);
        return stream.ToArray();
    }

    /// <summary>The training rows' mean target: every tree learner here fits the target less it.</summary>
    internal static double TrainingMean(FoldJob job) => job.TrainRows.Average(r => job.Data.Target[r]);

    /// <summary>Refuses a job before any training: the coordinator's values are checked, never trusted.</summary>
    internal static void Check(string family, FoldJob job)
    {
        var problems = new List<string>(ParameterChecks.Problems(family, job.Parameters));
        if (job.Budget < 1)
        {
            problems.Add($"budget {job.Budget} is below 1 round");
        }

        if (job.Threads < 1)
        {
            problems.Add($"threads {job.Threads} is below 1");
        }

        if (job.TrainRows.IsDefaultOrEmpty)
        {
            problems.Add("the fold has no training rows");
        }

        if (job.Data.Test.ColumnCount != job.Data.Train.ColumnCount)
        {
            problems.Add($"the test table has {job.Data.Test.ColumnCount} features but the training table {job.Data.Train.ColumnCount}");
        }

        if (job.Inputs is { } inputs && inputs.Train.RowCount != job.Data.Train.RowCount)
        {
            problems.Add($"the fold's inputs have {inputs.Train.RowCount} training rows but the table {job.Data.Train.RowCount}");
        }

        if (problems.Count > 0)
        {
            throw new ArgumentException($"{family} fold {job.Fold} refused: {string.Join("; ", problems)}", nameof(job));
        }
    }

    private static double[] Score(ITransformer model, IDataView rows, int expected, double offset)
    {
        var scores = new double[expected];
        int i = 0;
        foreach (float score in model.Transform(rows).GetColumn<float>("Score"))
        {
            scores[i++] = score + offset;
        }

        return i == expected ? scores : throw new InvalidOperationException($"scored {i} rows, expected {expected}");
    }
}
