namespace Foldwise.Learners.Native;

/// <summary>A LightGBM Dataset binned from sparse rows; a validation Dataset is binned like its reference.</summary>
internal sealed class LightGbmDataset : IDisposable
{
    private readonly bool borrowed;
    private int released;

    private LightGbmDataset(DatasetHandle handle, int rowCount, bool borrowed = false)
    {
        Handle = handle;
        RowCount = rowCount;
        this.borrowed = borrowed;
    }

    public DatasetHandle Handle { get; }

    public int RowCount { get; }

    public static unsafe LightGbmDataset FromRows(CsrRows rows, float[]? labels, string parameters, LightGbmDataset? reference, string what)
    {
        if (rows.RowCount == 0)
        {
            throw new LightGbmException($"LightGBM refused {what}: there are no rows");
        }

        bool added = false;
        try
        {
            reference?.Handle.DangerousAddRef(ref added);
            DatasetHandle handle;
            NativeCall.Check(
                LightGbmNative.DatasetCreateFromCsr(
                    rows.Starts, LightGbmNative.Int32, rows.Columns, rows.Values, LightGbmNative.Float32, rows.StartCount, rows.CellCount, rows.ColumnCount,
                    parameters, reference?.Handle.DangerousGetHandle() ?? 0, out handle),
                $"{what} ({rows.RowCount} rows x {rows.ColumnCount} columns) with parameters '{parameters}'");
            GC.KeepAlive(rows);
            var dataset = new LightGbmDataset(handle, rows.RowCount);
            if (labels is not null)
            {
                dataset.SetLabels(labels, what);
            }

            return dataset;
        }
        finally
        {
            if (added)
            {
                reference!.Handle.DangerousRelease();
            }
        }
    }

    /// <summary>
    /// The same Dataset for another owner (a booster): the native Dataset lives until this one and every borrowed
    /// one are disposed, whichever comes last.
    /// </summary>
    public LightGbmDataset Borrow()
    {
        bool added = false;
        Handle.DangerousAddRef(ref added);
        return new LightGbmDataset(Handle, RowCount, borrowed: true);
    }

    public void Dispose()
    {
        if (!borrowed)
        {
            Handle.Dispose();
        }
        else if (Interlocked.Exchange(ref released, 1) == 0)
        {
            Handle.DangerousRelease();
        }
    }

    private unsafe void SetLabels(float[] labels, string what)
    {
        try
        {
            fixed (float* values = labels)
            {
                NativeCall.Check(LightGbmNative.DatasetSetField(Handle, "label", values, labels.Length, LightGbmNative.Float32), $"the labels of {what}");
            }
        }
        catch
        {
            Handle.Dispose();
            throw;
        }
    }
}
