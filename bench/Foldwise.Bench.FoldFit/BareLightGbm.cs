using System.Globalization;
using System.Runtime.InteropServices;
using Foldwise.Core.Data;
using Foldwise.Core.Learning;

namespace Foldwise.Bench.FoldFit;

/// <summary>
/// One fold through LightGBM's C API with nothing of Foldwise in between (the machine's limit for a fit): Dataset from
/// the fold's CSR rows, the rounds, raw predictions of the held-out rows and the test table. Same parameters as the learner.
/// </summary>
internal static unsafe partial class BareLightGbm
{
    public static void Fold(TrialData data, int fold, string parameters, int rounds)
    {
        var trainRows = data.Folds.TrainRows(fold);
        var (starts, columns, values) = Csr(data.Train, [.. trainRows]);
        double mean = trainRows.Average(r => data.Target[r]);
        var labels = trainRows.Select(r => (float)(data.Target[r] - mean)).ToArray();
        nint dataset, booster;
        fixed (int* s = starts)
        fixed (int* c = columns)
        fixed (float* v = values)
        {
            Check(DatasetCreateFromCsr(s, 2, c, v, 0, starts.Length, values.Length, data.Train.ColumnCount, parameters, 0, out dataset));
        }

        fixed (float* l = labels)
        {
            Check(DatasetSetField(dataset, "label", l, labels.Length, 0));
        }

        Check(BoosterCreate(dataset, parameters, out booster));
        for (int i = 0; i < rounds; i++)
        {
            Check(BoosterUpdateOneIter(booster, out _));
        }

        string threads = parameters.Split(' ').First(p => p.StartsWith("num_threads=", StringComparison.Ordinal));
        Predict(booster, Csr(data.Train, [.. data.Folds.ValidationRows(fold)]), data.Train.ColumnCount, threads);
        Predict(booster, (data.Test.RowStarts, data.Test.ColumnIndices, data.Test.Values), data.Test.ColumnCount, threads);
        Check(BoosterFree(booster));
        Check(DatasetFree(dataset));
    }

    /// <summary>One fold's native steps one after the other, <paramref name="report"/> told after each (for the memory probe).</summary>
    public static void Steps(TrialData data, int fold, string parameters, Action<string> report)
    {
        var trainRows = data.Folds.TrainRows(fold);
        var (starts, columns, values) = Csr(data.Train, [.. trainRows]);
        var labels = trainRows.Select(r => (float)data.Target[r]).ToArray();
        report("fold CSR copied (managed)");
        nint dataset, validation, booster;
        fixed (int* s = starts)
        fixed (int* c = columns)
        fixed (float* v = values)
        {
            Check(DatasetCreateFromCsr(s, 2, c, v, 0, starts.Length, values.Length, data.Train.ColumnCount, parameters, 0, out dataset));
        }

        fixed (float* l = labels)
        {
            Check(DatasetSetField(dataset, "label", l, labels.Length, 0));
        }

        report("training Dataset created");
        (starts, columns, values) = Csr(data.Train, [.. data.Folds.ValidationRows(fold)]);
        fixed (int* s = starts)
        fixed (int* c = columns)
        fixed (float* v = values)
        {
            Check(DatasetCreateFromCsr(s, 2, c, v, 0, starts.Length, values.Length, data.Train.ColumnCount, parameters, dataset, out validation));
        }

        report("held-out Dataset created");
        Check(BoosterCreate(dataset, parameters, out booster));
        report("booster created");
        Check(BoosterAddValidData(booster, validation));
        report("held-out rows added");
        Check(BoosterUpdateOneIter(booster, out _));
        report("one round");
        Check(BoosterFree(booster));
        report("booster freed");
        Check(DatasetFree(validation));
        Check(DatasetFree(dataset));
        report("Datasets freed");
    }

    public static string Parameters(IReadOnlyDictionary<string, double> p, int seed, int threads) => string.Create(CultureInfo.InvariantCulture,
        $"objective=regression metric=None verbosity=-1 deterministic=true seed={seed} num_threads={threads} min_sum_hessian_in_leaf=0.1 " +
        $"learning_rate={p["learning_rate"]} num_leaves={p["leaves"]} min_data_in_leaf={p["min_leaf_rows"]} feature_fraction={p["feature_fraction"]} " +
        $"bagging_fraction={p["row_fraction"]} bagging_freq={(p["row_fraction"] < 1 ? 1 : 0)} lambda_l2={p["l2"]}");

    private static void Predict(nint booster, (int[] Starts, int[] Columns, float[] Values) rows, int columnCount, string threads)
    {
        var scores = new double[rows.Starts.Length - 1];
        fixed (int* s = rows.Starts)
        fixed (int* c = rows.Columns)
        fixed (float* v = rows.Values)
        fixed (double* o = scores)
        {
            Check(BoosterPredictForCsr(booster, s, 2, c, v, 0, rows.Starts.Length, rows.Values.Length, columnCount, 1, 0, 0, threads, out _, o));
        }
    }

    private static (int[] Starts, int[] Columns, float[] Values) Csr(SparseRowMatrix matrix, int[] rows)
    {
        var starts = new int[rows.Length + 1];
        var columns = new List<int>();
        var values = new List<float>();
        for (int i = 0; i < rows.Length; i++)
        {
            columns.AddRange(matrix.RowColumns(rows[i]));
            values.AddRange(matrix.RowValues(rows[i]));
            starts[i + 1] = columns.Count;
        }

        return (starts, [.. columns], [.. values]);
    }

    private static void Check(int code)
    {
        if (code != 0)
        {
            throw new InvalidOperationException(Marshal.PtrToStringUTF8(LastError()));
        }
    }

    [LibraryImport("lib_lightgbm", EntryPoint = "LGBM_GetLastError")]
    private static partial nint LastError();

    [LibraryImport("lib_lightgbm", EntryPoint = "LGBM_DatasetCreateFromCSR", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int DatasetCreateFromCsr(int* indptr, int indptrType, int* indices, float* data, int dataType, long nindptr, long nelem, long numCol, string parameters, nint reference, out nint dataset);

    [LibraryImport("lib_lightgbm", EntryPoint = "LGBM_DatasetSetField", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int DatasetSetField(nint dataset, string field, float* values, int count, int type);

    [LibraryImport("lib_lightgbm", EntryPoint = "LGBM_BoosterCreate", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int BoosterCreate(nint dataset, string parameters, out nint booster);

    [LibraryImport("lib_lightgbm", EntryPoint = "LGBM_BoosterUpdateOneIter")]
    private static partial int BoosterUpdateOneIter(nint booster, out int finished);

    [LibraryImport("lib_lightgbm", EntryPoint = "LGBM_BoosterPredictForCSR", StringMarshalling = StringMarshalling.Utf8)]
    private static partial int BoosterPredictForCsr(nint booster, int* indptr, int indptrType, int* indices, float* data, int dataType, long nindptr, long nelem, long numCol,
        int predictType, int start, int count, string parameters, out long length, double* result);

    [LibraryImport("lib_lightgbm", EntryPoint = "LGBM_BoosterAddValidData")]
    private static partial int BoosterAddValidData(nint booster, nint dataset);

    [LibraryImport("lib_lightgbm", EntryPoint = "LGBM_BoosterFree")]
    private static partial int BoosterFree(nint booster);

    [LibraryImport("lib_lightgbm", EntryPoint = "LGBM_DatasetFree")]
    private static partial int DatasetFree(nint dataset);
}
