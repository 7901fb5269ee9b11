using Foldwise.Core.Definition;

namespace Foldwise.Core.Blending;

/// <summary>
/// The Gram each fold's rows contribute, in the form the chosen mode solves on (the error Gram for the
/// simplex and greedy selection, the Gram of [P, y] for NNLS). Fitting without fold f sums the other
/// folds' parts, so no row of fold f reaches that fit and no column is copied or re-scanned.
/// </summary>
internal sealed class FoldGrams
{
    private readonly BlendMode mode;
    private readonly int greedyRounds;
    private readonly Gram[] parts;

    private FoldGrams(BlendMode mode, int greedyRounds, Gram[] parts)
    {
        this.mode = mode;
        this.greedyRounds = greedyRounds;
        this.parts = parts;
    }

    public static FoldGrams For(BlendMode mode, int greedyRounds, IReadOnlyList<double[]> columns, double[] target, IReadOnlyList<int[]> foldRows)
    {
        bool augmented = mode == BlendMode.NonNegative;
        IReadOnlyList<double[]> fitted = augmented ? [.. columns, target] : columns;
        var parts = foldRows.Select(rows => Gram.Of(fitted, augmented ? null : target, rows)).ToArray();
        return new FoldGrams(mode, greedyRounds, parts);
    }

    public double[] SolveAll() => Solve(Gram.Sum(parts));

    public double[] SolveWithout(int fold) => Solve(Gram.Sum(parts.Where((_, f) => f != fold)));

    private double[] Solve(Gram gram) => mode switch
    {
        BlendMode.Simplex => SimplexLeastSquares.SolveGram(gram),
        BlendMode.NonNegative => NonNegativeLeastSquares.SolveGram(gram),
        BlendMode.Greedy => GreedySelection.SolveGram(gram, greedyRounds),
        _ => throw new ArgumentOutOfRangeException(nameof(gram), mode, "unknown blend mode"),
    };
}
