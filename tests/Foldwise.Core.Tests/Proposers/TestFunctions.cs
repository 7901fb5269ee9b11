using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Proposers;

/// <summary>Standard global-optimisation test functions (Dixon &amp; Szegő, "Towards Global Optimisation 2", 1978).</summary>
internal static class TestFunctions
{
    public static ParameterSpace BraninSpace { get; } = new([ParameterRange.Linear("x1", -5, 10), ParameterRange.Linear("x2", 0, 15)]);

    public static ParameterSpace HartmannSpace { get; } = new(
        [.. Enumerable.Range(1, 6).Select(i => ParameterRange.Linear($"x{i}", 0, 1))]);

    // Branin–Hoo with a = 1, b = 5.1/(4π²), c = 5/π, r = 6, s = 10, t = 1/(8π); minimum 5/(4π) = 0.397887
    // at (−π, 12.275), (π, 2.275), (9.42478, 2.475) — Dixon & Szegő 1978.
    public static double Branin(ParameterSet p)
    {
        double x1 = p["x1"], x2 = p["x2"];
        double b = 5.1 / (4 * Math.PI * Math.PI), c = 5 / Math.PI, t = 1 / (8 * Math.PI);
        double u = x2 - (b * x1 * x1) + (c * x1) - 6;
        return (u * u) + (10 * (1 - t) * Math.Cos(x1)) + 10;
    }

    public const double BraninMinimum = 0.397887; // 5/(4π) — Dixon & Szegő 1978

    // Multi-fidelity Branin of Kandasamy et al., "Multi-fidelity Bayesian Optimisation with Continuous Approximations"
    // (ICML 2017), from memory: b, c and t move with fidelities z₁, z₂, z₃ ∈ [0, 1] as b − 0.01(1 − z₁), c − 0.1(1 − z₂),
    // t + 0.05(1 − z₃); z = 1 is Branin itself. Here one fidelity, budget / full budget, drives all three.
    public static double BraninAt(ParameterSet p, int budget, int fullBudget)
    {
        double x1 = p["x1"], x2 = p["x2"], missing = 1 - ((double)budget / fullBudget);
        double b = (5.1 / (4 * Math.PI * Math.PI)) - (0.01 * missing), c = (5 / Math.PI) - (0.1 * missing), t = (1 / (8 * Math.PI)) + (0.05 * missing);
        double u = x2 - (b * x1 * x1) + (c * x1) - 6;
        return (u * u) + (10 * (1 - t) * Math.Cos(x1)) + 10;
    }

    // Hartmann 6-D coefficients α, A, P of Dixon & Szegő 1978 as tabulated by Surjanovic & Bingham,
    // Virtual Library of Simulation Experiments (sfu.ca/~ssurjano/hart6.html); minimum −3.32237 at
    // (0.20169, 0.150011, 0.476874, 0.275332, 0.311652, 0.6573) on [0, 1]^6.
    private static readonly double[] Alpha = [1.0, 1.2, 3.0, 3.2];

    private static readonly double[,] A =
    {
        { 10, 3, 17, 3.5, 1.7, 8 },
        { 0.05, 10, 17, 0.1, 8, 14 },
        { 3, 3.5, 1.7, 10, 17, 8 },
        { 17, 8, 0.05, 10, 0.1, 14 },
    };

    private static readonly double[,] P =
    {
        { 0.1312, 0.1696, 0.5569, 0.0124, 0.8283, 0.5886 },
        { 0.2329, 0.4135, 0.8307, 0.3736, 0.1004, 0.9991 },
        { 0.2348, 0.1451, 0.3522, 0.2883, 0.3047, 0.6650 },
        { 0.4047, 0.8828, 0.8732, 0.5743, 0.1091, 0.0381 },
    };

    public const double HartmannMinimum = -3.32237; // Surjanovic & Bingham, after Dixon & Szegő 1978

    public static readonly double[] HartmannArgMin = [0.20169, 0.150011, 0.476874, 0.275332, 0.311652, 0.6573];

    public static double Hartmann(ParameterSet p) => Hartmann(Enumerable.Range(1, 6).Select(i => p[$"x{i}"]).ToArray());

    public static double Hartmann(double[] x) => Hartmann(x, 0);

    // Multi-fidelity Hartmann-6 of Kandasamy et al. (ICML 2017), from memory: every αᵢ becomes αᵢ − 0.1(1 − z); here
    // z = budget / full budget, and z = 1 is Hartmann-6 itself.
    public static double HartmannAt(ParameterSet p, int budget, int fullBudget) =>
        Hartmann(Enumerable.Range(1, 6).Select(i => p[$"x{i}"]).ToArray(), 0.1 * (1 - ((double)budget / fullBudget)));

    private static double Hartmann(double[] x, double alphaShift)
    {
        double sum = 0;
        for (int i = 0; i < 4; i++)
        {
            double inner = 0;
            for (int j = 0; j < 6; j++)
            {
                double d = x[j] - P[i, j];
                inner += A[i, j] * d * d;
            }

            sum += (Alpha[i] - alphaShift) * Math.Exp(-inner);
        }

        return -sum;
    }
}
