namespace Foldwise.Core.Proposers;

/// <summary>
/// One density per parameter, multiplied: the TPE of Bergstra et al. (NeurIPS 2011), which models each parameter
/// on its own and so cannot see that, say, a high learning rate is good only with few leaves.
/// </summary>
internal sealed class IndependentDensity : IJointDensity
{
    private readonly TpeDimension[] _dimensions;
    private readonly IUnivariateDensity[] _densities;

    private IndependentDensity(TpeDimension[] dimensions, IUnivariateDensity[] densities)
    {
        _dimensions = dimensions;
        _densities = densities;
    }

    /// <summary>Fits every parameter on its column of <paramref name="points"/>; a prior weight of 0 leaves the prior out.</summary>
    public static IndependentDensity Fit(TpeDimension[] dimensions, IReadOnlyList<double[]> points, double wideKernelWeight)
    {
        var densities = new IUnivariateDensity[dimensions.Length];
        var column = new double[points.Count];
        for (int d = 0; d < dimensions.Length; d++)
        {
            for (int i = 0; i < points.Count; i++)
            {
                column[i] = points[i][d];
            }

            var dim = dimensions[d];
            densities[d] = dim.IsChoice
                ? CategoricalEstimator.Fit(column, dim.Choices, wideKernelWeight)
                : ParzenEstimator.Fit(column, dim.Low, dim.High, wideKernelWeight);
        }

        return new IndependentDensity(dimensions, densities);
    }

    public double LogDensity(double[] x)
    {
        double sum = 0;
        for (int d = 0; d < _densities.Length; d++)
        {
            sum += Math.Log(_densities[d].Density(x[d]));
        }

        return sum;
    }

    public void Sample(Random random, double[] into)
    {
        for (int d = 0; d < _densities.Length; d++)
        {
            double x = _densities[d].Sample(random);

            // Evaluate whole numbers where they will actually be tried.
            into[d] = _dimensions[d].Range.Kind is Spaces.ParameterKind.Whole ? _dimensions[d].ToValue(x) : x;
        }
    }
}
