using System.Collections.Immutable;

namespace Foldwise.Core.Data;

/// <summary>One feature column holding only its non-zero cells, by ascending row index; a missing cell is a stored NaN.</summary>
public sealed record SparseColumn(ImmutableArray<int> Rows, ImmutableArray<float> Values)
{
    /// <summary>A column of zeros.</summary>
    public static SparseColumn Empty { get; } = new([], []);

    /// <summary>How many cells are not zero.</summary>
    public int NonZeroCount => Rows.Length;

    /// <summary>How many cells are missing (NaN).</summary>
    public int MissingCount
    {
        get
        {
            int n = 0;
            foreach (float v in Values.AsSpan())
            {
                n += float.IsNaN(v) ? 1 : 0;
            }

            return n;
        }
    }
}
