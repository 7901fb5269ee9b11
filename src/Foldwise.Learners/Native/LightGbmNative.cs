using System.Runtime.InteropServices;

namespace Foldwise.Learners.Native;

/// <summary>
/// The entry points of LightGBM's C API this project calls (c_api.h of LightGBM 4.6.0, the native library the LightGBM
/// package ships beside Microsoft.ML.LightGbm). Every call returns 0 on success and -1 on failure, with the reason
/// in <see cref="LastError"/>; <see cref="NativeCall"/> turns that into an exception.
/// </summary>
internal static unsafe partial class LightGbmNative
{
    private const string Library = "lib_lightgbm";

    /// <summary><c>C_API_DTYPE_FLOAT32</c>.</summary>
    public const int Float32 = 0;

    /// <summary><c>C_API_DTYPE_INT32</c>.</summary>
    public const int Int32 = 2;

    /// <summary><c>C_API_PREDICT_RAW_SCORE</c>: the sum of the trees (regression has no transform anyway).</summary>
    public const int PredictRawScore = 1;

    [LibraryImport(Library, EntryPoint = "LGBM_GetLastError")]
    public static partial nint LastError();

    [LibraryImport(Library, EntryPoint = "LGBM_DatasetCreateFromCSR", StringMarshalling = StringMarshalling.Utf8)]
    public static partial int DatasetCreateFromCsr(
        int* rowStarts, int rowStartsType, int* columns, float* values, int valuesType,
        long rowStartCount, long valueCount, long columnCount, string parameters, nint reference, out DatasetHandle dataset);

    [LibraryImport(Library, EntryPoint = "LGBM_DatasetSetField", StringMarshalling = StringMarshalling.Utf8)]
    public static partial int DatasetSetField(DatasetHandle dataset, string field, float* values, int count, int type);

    [LibraryImport(Library, EntryPoint = "LGBM_DatasetFree")]
    public static partial int DatasetFree(nint dataset);

    [LibraryImport(Library, EntryPoint = "LGBM_BoosterCreate", StringMarshalling = StringMarshalling.Utf8)]
    public static partial int BoosterCreate(DatasetHandle train, string parameters, out BoosterHandle booster);

    [LibraryImport(Library, EntryPoint = "LGBM_BoosterAddValidData")]
    public static partial int BoosterAddValidData(BoosterHandle booster, DatasetHandle validation);

    [LibraryImport(Library, EntryPoint = "LGBM_BoosterUpdateOneIter")]
    public static partial int BoosterUpdateOneIter(BoosterHandle booster, out int finished);

    [LibraryImport(Library, EntryPoint = "LGBM_BoosterGetCurrentIteration")]
    public static partial int BoosterGetCurrentIteration(BoosterHandle booster, out int iteration);

    [LibraryImport(Library, EntryPoint = "LGBM_BoosterResetParameter", StringMarshalling = StringMarshalling.Utf8)]
    public static partial int BoosterResetParameter(BoosterHandle booster, string parameters);

    /// <summary>The booster's current scores of its training (index 0) or validation data (1, 2, …).</summary>
    [LibraryImport(Library, EntryPoint = "LGBM_BoosterGetPredict")]
    public static partial int BoosterGetPredict(BoosterHandle booster, int dataIndex, out long length, double* scores);

    [LibraryImport(Library, EntryPoint = "LGBM_BoosterPredictForCSR", StringMarshalling = StringMarshalling.Utf8)]
    public static partial int BoosterPredictForCsr(
        BoosterHandle booster, int* rowStarts, int rowStartsType, int* columns, float* values, int valuesType,
        long rowStartCount, long valueCount, long columnCount, int predictType, int startIteration, int iterationCount,
        string parameters, out long length, double* scores);

    /// <summary>Writes the model's text into <paramref name="text"/> when <paramref name="bufferLength"/> holds it; <paramref name="length"/> counts its closing zero byte.</summary>
    [LibraryImport(Library, EntryPoint = "LGBM_BoosterSaveModelToString")]
    public static partial int BoosterSaveModelToString(
        BoosterHandle booster, int startIteration, int iterationCount, int featureImportanceType, long bufferLength, out long length, byte* text);

    [LibraryImport(Library, EntryPoint = "LGBM_BoosterLoadModelFromString")]
    public static partial int BoosterLoadModelFromString(byte* text, out int iterations, out BoosterHandle booster);

    [LibraryImport(Library, EntryPoint = "LGBM_BoosterFree")]
    public static partial int BoosterFree(nint booster);
}
