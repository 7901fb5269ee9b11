using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace Foldwise.Core.Blending;

/// <summary>
/// Computes PᵀP in row chunks: each chunk of every column is copied (shifted, gathered, zero-padded)
/// into one contiguous buffer small enough to stay in cache, then 4 × 4 tiles of column pairs are
/// accumulated with fused multiply-adds, in parallel over tiles. A tile always sums its rows in the
/// same order, so the result does not depend on the number of threads.
/// </summary>
internal static class GramKernel
{
    private const int Tile = 4;

    // Below this many multiply-adds a parallel loop costs more than it saves.
    private const long ParallelWork = 1L << 22;

    // Bytes of buffered chunk: about half of one core's L2 on the machines this runs on.
    private const int ChunkBytes = 1 << 20;

    public static double[] Compute(IReadOnlyList<double[]> columns, double[]? shift, int[]? rows)
    {
        int k = columns.Count;
        int n = rows?.Length ?? (k == 0 ? 0 : columns[0].Length);
        var gram = new double[k * k];
        if (k == 0 || n == 0)
        {
            return gram;
        }

        int width = Vector<double>.Count;
        int chunk = Math.Clamp(ChunkBytes / (sizeof(double) * k) / width * width, 16 * width, 64 * 1024);
        chunk = Math.Min(chunk, (n + width - 1) / width * width);
        var buffer = new double[k * chunk];
        var tiles = TilesOf(k);
        bool parallel = (long)k * k * n / 2 >= ParallelWork && Environment.ProcessorCount > 1;
        for (int start = 0; start < n; start += chunk)
        {
            int length = Math.Min(chunk, n - start);
            int vectors = (length + width - 1) / width;
            if (parallel)
            {
                Parallel.For(0, k, c => Fill(buffer.AsSpan(c * chunk, chunk), columns[c], shift, rows, start, length));
                Parallel.For(0, tiles.Length, t => Accumulate(gram, k, buffer, chunk, vectors, tiles[t]));
            }
            else
            {
                for (int c = 0; c < k; c++)
                {
                    Fill(buffer.AsSpan(c * chunk, chunk), columns[c], shift, rows, start, length);
                }

                foreach (var tile in tiles)
                {
                    Accumulate(gram, k, buffer, chunk, vectors, tile);
                }
            }
        }

        for (int i = 0; i < k; i++)
        {
            for (int j = i + 1; j < k; j++)
            {
                gram[(j * k) + i] = gram[(i * k) + j];
            }
        }

        return gram;
    }

    private static (int I, int J)[] TilesOf(int k)
    {
        var tiles = new List<(int, int)>();
        for (int i = 0; i < k; i += Tile)
        {
            for (int j = i; j < k; j += Tile)
            {
                tiles.Add((i, j));
            }
        }

        return [.. tiles];
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Fill(Span<double> target, double[] column, double[]? shift, int[]? rows, int start, int length)
    {
        if (rows is not null)
        {
            var picked = rows.AsSpan(start, length);
            for (int t = 0; t < picked.Length; t++)
            {
                target[t] = shift is null ? column[picked[t]] : column[picked[t]] - shift[picked[t]];
            }
        }
        else if (shift is null)
        {
            column.AsSpan(start, length).CopyTo(target);
        }
        else
        {
            Subtract(column.AsSpan(start, length), shift.AsSpan(start, length), target[..length]);
        }

        // Zero padding contributes nothing, so the kernel needs no scalar tail.
        target[length..].Clear();
    }

    private static void Subtract(ReadOnlySpan<double> a, ReadOnlySpan<double> b, Span<double> result)
    {
        int width = Vector<double>.Count;
        int i = 0;
        for (; i <= a.Length - width; i += width)
        {
            (new Vector<double>(a[i..]) - new Vector<double>(b[i..])).CopyTo(result[i..]);
        }

        for (; i < a.Length; i++)
        {
            result[i] = a[i] - b[i];
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Accumulate(double[] gram, int k, double[] buffer, int stride, int vectors, (int I, int J) tile)
    {
        int rowsInTile = Math.Min(Tile, k - tile.I);
        int colsInTile = Math.Min(Tile, k - tile.J);
        if (rowsInTile == Tile && colsInTile == Tile)
        {
            Full(gram, k, buffer, stride, vectors, tile);
            return;
        }

        var all = MemoryMarshal.Cast<double, Vector<double>>(buffer.AsSpan());
        int perColumn = stride / Vector<double>.Count;
        for (int i = tile.I; i < tile.I + rowsInTile; i++)
        {
            var a = all.Slice(i * perColumn, vectors);
            for (int j = Math.Max(tile.J, i); j < tile.J + colsInTile; j++)
            {
                var b = all.Slice(j * perColumn, vectors);
                var sum = Vector<double>.Zero;
                for (int v = 0; v < a.Length; v++)
                {
                    sum = Vector.FusedMultiplyAdd(a[v], b[v], sum);
                }

                gram[(i * k) + j] += Vector.Sum(sum);
            }
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Full(double[] gram, int k, double[] buffer, int stride, int vectors, (int I, int J) tile)
    {
        int perColumn = stride / Vector<double>.Count;
        ref var origin = ref Unsafe.As<double, Vector<double>>(ref MemoryMarshal.GetArrayDataReference(buffer));
        ref var a0 = ref Unsafe.Add(ref origin, tile.I * perColumn);
        ref var a1 = ref Unsafe.Add(ref a0, perColumn);
        ref var a2 = ref Unsafe.Add(ref a1, perColumn);
        ref var a3 = ref Unsafe.Add(ref a2, perColumn);
        ref var b0 = ref Unsafe.Add(ref origin, tile.J * perColumn);
        ref var b1 = ref Unsafe.Add(ref b0, perColumn);
        ref var b2 = ref Unsafe.Add(ref b1, perColumn);
        ref var b3 = ref Unsafe.Add(ref b2, perColumn);
        Vector<double> s00 = default, s01 = default, s02 = default, s03 = default;
        Vector<double> s10 = default, s11 = default, s12 = default, s13 = default;
        Vector<double> s20 = default, s21 = default, s22 = default, s23 = default;
        Vector<double> s30 = default, s31 = default, s32 = default, s33 = default;
        for (int v = 0; v < vectors; v++)
        {
            var y0 = Unsafe.Add(ref b0, v);
            var y1 = Unsafe.Add(ref b1, v);
            var y2 = Unsafe.Add(ref b2, v);
            var y3 = Unsafe.Add(ref b3, v);
            var x = Unsafe.Add(ref a0, v);
            s00 = Vector.FusedMultiplyAdd(x, y0, s00);
            s01 = Vector.FusedMultiplyAdd(x, y1, s01);
            s02 = Vector.FusedMultiplyAdd(x, y2, s02);
            s03 = Vector.FusedMultiplyAdd(x, y3, s03);
            x = Unsafe.Add(ref a1, v);
            s10 = Vector.FusedMultiplyAdd(x, y0, s10);
            s11 = Vector.FusedMultiplyAdd(x, y1, s11);
            s12 = Vector.FusedMultiplyAdd(x, y2, s12);
            s13 = Vector.FusedMultiplyAdd(x, y3, s13);
            x = Unsafe.Add(ref a2, v);
            s20 = Vector.FusedMultiplyAdd(x, y0, s20);
            s21 = Vector.FusedMultiplyAdd(x, y1, s21);
            s22 = Vector.FusedMultiplyAdd(x, y2, s22);
            s23 = Vector.FusedMultiplyAdd(x, y3, s23);
            x = Unsafe.Add(ref a3, v);
            s30 = Vector.FusedMultiplyAdd(x, y0, s30);
            s31 = Vector.FusedMultiplyAdd(x, y1, s31);
            s32 = Vector.FusedMultiplyAdd(x, y2, s32);
            s33 = Vector.FusedMultiplyAdd(x, y3, s33);
        }

        // On a diagonal tile only the upper triangle is kept; the lower half is mirrored at the end.
        bool diagonal = tile.I == tile.J;
        Span<double> sums =
        [
            Vector.Sum(s00), Vector.Sum(s01), Vector.Sum(s02), Vector.Sum(s03),
            Vector.Sum(s10), Vector.Sum(s11), Vector.Sum(s12), Vector.Sum(s13),
            Vector.Sum(s20), Vector.Sum(s21), Vector.Sum(s22), Vector.Sum(s23),
            Vector.Sum(s30), Vector.Sum(s31), Vector.Sum(s32), Vector.Sum(s33),
        ];
        for (int i = 0; i < Tile; i++)
        {
            for (int j = diagonal ? i : 0; j < Tile; j++)
            {
                gram[((tile.I + i) * k) + tile.J + j] += sums[(i * Tile) + j];
            }
        }
    }
}
