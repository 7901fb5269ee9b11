namespace Foldwise.Core.Proposers;

/// <summary>The standard normal pieces the Parzen estimators need; the BCL has no erf.</summary>
internal static class Gaussian
{
    public static readonly double InverseSqrtTwoPi = 1.0 / Math.Sqrt(2 * Math.PI);

    /// <summary>Φ(z), through the complementary error function.</summary>
    public static double Cdf(double z) => z switch
    {
        < -9 => 0, // Φ(−9) ≈ 1e-19
        > 9 => 1,
        _ => 0.5 * Erfc(-z / Math.Sqrt(2)),
    };

    /// <summary>
    /// erfc by the Chebyshev-fitted form of Press et al., Numerical Recipes (2nd ed., §6.2, erfcc; coefficients from
    /// memory, checked against Abramowitz &amp; Stegun's table in GaussianTests), fractional error below 1.2e-7.
    /// </summary>
    public static double Erfc(double x)
    {
        double z = Math.Abs(x);
        double t = 1.0 / (1.0 + (0.5 * z));
        double poly = -1.26551223 + (t * (1.00002368 + (t * (0.37409196 + (t * (0.09678418 + (t * (-0.18628806 +
            (t * (0.27886807 + (t * (-1.13520398 + (t * (1.48851587 + (t * (-0.82215223 + (t * 0.17087277)))))))))))))))));
        double ans = t * Math.Exp((-z * z) + poly);
        return x >= 0 ? ans : 2.0 - ans;
    }

    /// <summary>A standard normal draw (Box–Muller).</summary>
    public static double Sample(Random random)
    {
        double u1 = 1.0 - random.NextDouble();
        double u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}
