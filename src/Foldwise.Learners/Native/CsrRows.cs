using System.Buffers;
using System.Collections.Immutable;
using System.Runtime.InteropServices;
using Foldwise.Core.Data;

namespace Foldwise.Learners.Native;

/// <summary>
/// Rows in compressed sparse row form, as LightGBM's C API reads them (32-bit starts and columns, 32-bit values),
/// held only for the call that reads them: a whole table pinned where it lies, or chosen rows copied outside the
/// managed heap and freed on <see cref="Dispose"/>. A fold's training rows of a 1,000,000-row table take about 80 MB;
/// as managed arrays each fold's copy stayed on the heap until a full collection, which with two slots preparing
/// folds side by side let the heap grow by about 0.7 GB (bench/Foldwise.Bench.FoldFit --memory, 2026-12-05).
/// </summary>
internal sealed unsafe class CsrRows : IDisposable
{
    private readonly MemoryHandle[] pins;
    private readonly bool native;
    private bool disposed;

    private CsrRows(int* starts, int* columns, float* values, int rowCount, int columnCount, MemoryHandle[] pins, bool native)
    {
        Starts = starts;
        Columns = columns;
        Values = values;
        RowCount = rowCount;
        ColumnCount = columnCount;
        this.pins = pins;
        this.native = native;
    }

    ~CsrRows() => Release();

    public int* Starts { get; }

    public int* Columns { get; }

    public float* Values { get; }

    public int RowCount { get; }

    public int ColumnCount { get; }

    /// <summary>Entries in <see cref="Starts"/>: one more than the rows.</summary>
    public int StartCount => RowCount + 1;

    public int CellCount => Starts[RowCount];

    /// <summary>Row <paramref name="row"/>'s columns, valid until disposed.</summary>
    public ReadOnlySpan<int> RowColumns(int row) => new(Columns + Starts[row], Starts[row + 1] - Starts[row]);

    /// <summary>Row <paramref name="row"/>'s values, valid until disposed.</summary>
    public ReadOnlySpan<float> RowValues(int row) => new(Values + Starts[row], Starts[row + 1] - Starts[row]);

    /// <summary>The whole matrix, pinned, without copying.</summary>
    public static CsrRows All(SparseRowMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        var starts = matrix.RowStarts.AsMemory().Pin();
        var columns = matrix.ColumnIndices.AsMemory().Pin();
        var values = matrix.Values.AsMemory().Pin();
        return new CsrRows((int*)starts.Pointer, (int*)columns.Pointer, (float*)values.Pointer, matrix.RowCount, matrix.ColumnCount, [starts, columns, values], native: false);
    }

    /// <summary>The chosen rows in the given order, copied outside the managed heap.</summary>
    public static CsrRows Select(SparseRowMatrix matrix, ImmutableArray<int> rows)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        long cells = Cells(matrix, rows);
        var starts = (int*)NativeMemory.Alloc((nuint)(rows.Length + 1), sizeof(int));
        var columns = (int*)NativeMemory.Alloc((nuint)Math.Max(cells, 1), sizeof(int));
        var values = (float*)NativeMemory.Alloc((nuint)Math.Max(cells, 1), sizeof(float));
        int at = 0;
        starts[0] = 0;
        for (int i = 0; i < rows.Length; i++)
        {
            var rowColumns = matrix.RowColumns(rows[i]);
            rowColumns.CopyTo(new Span<int>(columns + at, rowColumns.Length));
            matrix.RowValues(rows[i]).CopyTo(new Span<float>(values + at, rowColumns.Length));
            at += rowColumns.Length;
            starts[i + 1] = at;
        }

        return new CsrRows(starts, columns, values, rows.Length, matrix.ColumnCount, [], native: true);
    }

    /// <summary>The stored cells of the chosen rows, counted without copying them.</summary>
    public static long Cells(SparseRowMatrix matrix, ImmutableArray<int> rows)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        long cells = 0;
        foreach (int row in rows)
        {
            cells += matrix.RowStarts[row + 1] - matrix.RowStarts[row];
        }

        return cells <= int.MaxValue ? cells : throw new LightGbmException($"{rows.Length:N0} rows hold {cells:N0} stored cells, more than LightGBM's 32-bit row starts can index");
    }

    public void Dispose()
    {
        Release();
        GC.SuppressFinalize(this);
    }

    private void Release()
    {
        if (disposed)
        {
            return;
        }

        disposed = true;
        if (native)
        {
            NativeMemory.Free(Starts);
            NativeMemory.Free(Columns);
            NativeMemory.Free(Values);
        }

        foreach (var pin in pins)
        {
            pin.Dispose();
        }
    }
}
