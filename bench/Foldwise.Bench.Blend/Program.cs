// Times the blend solvers on a pool the size of a long search: 200 trials × 100,000 rows of made-up,
// correlated out-of-fold predictions. Run: dotnet run -c Release --project bench/Foldwise.Bench.Blend [trials] [rows] [shared|independent]
// "independent" shrinks the shared error factors so most columns carry their own information and the
// optimal support is large — the hard case for the active set.
using System.Diagnostics;
using System.Numerics;
using Foldwise.Core.Blending;
using Foldwise.Core.Definition;
using Foldwise.Core.Folds;
using Foldwise.Core.Metrics;

int trials = args.Length > 0 ? int.Parse(args[0]) : 200;
int rows = args.Length > 1 ? int.Parse(args[1]) : 100_000;
bool independent = args.Length > 2 && args[2] == "independent";
var (columns, target) = Generate(trials, rows, seed: 20261201, independent ? 0.01 : 0.3);
Console.WriteLine(
    $"{trials} trials x {rows:N0} rows, {(independent ? "mostly independent" : "shared")} errors, " +
    $"{Environment.ProcessorCount} cores, Vector<double>.Count = {Vector<double>.Count}; no warm-up, so run 1 includes JIT");

for (int repeat = 0; repeat < 3; repeat++)
{
    var clock = Stopwatch.StartNew();
    var simplex = SimplexLeastSquares.Solve(columns, target);
    double simplexSeconds = clock.Elapsed.TotalSeconds;
    clock.Restart();
    var nnls = NonNegativeLeastSquares.Solve(columns, target);
    double nnlsSeconds = clock.Elapsed.TotalSeconds;
    Console.WriteLine(
        $"run {repeat + 1}: simplex (Gram + solve) {simplexSeconds:F3} s, support {simplex.Weights.Count(w => w > 0)}, " +
        $"objective {simplex.Objective:R}, sum w {simplex.Weights.Sum():R} | " +
        $"NNLS (Gram + solve) {nnlsSeconds:F3} s, support {nnls.Weights.Count(w => w > 0)}, objective {nnls.Objective:R}");
}

var folds = new FoldPlan(5, 0, [.. Enumerable.Range(0, rows).Select(r => r % 5)]);
var pool = columns.Select((c, j) => new BlendCandidate(j + 1, j % 2 == 0 ? "lightgbm" : "fasttree", c)).ToArray();
var stageClock = Stopwatch.StartNew();
var result = BlendStage.Run(new BlendInput(new BlendOptions(), pool, target, folds, Metric.Rmse));
var s = result.Summary;
Console.WriteLine(
    $"blend stage, 5 folds (fold Grams + 1 + 5 nested solves + scoring): {stageClock.Elapsed.TotalSeconds:F3} s; " +
    $"in-sample {s.InSampleScore:F5}, nested {s.NestedScore:F5}, best single {s.BestSingleScore:F5} (trial {s.BestSingleTrialId})");

static (double[][] Columns, double[] Target) Generate(int k, int n, int seed, double loading)
{
    // Columns share a few latent error factors with random loadings, so they are strongly correlated
    // (pairwise correlations mostly 0.6–0.95), as predictions of tuned models of one data set are.
    const int factors = 6;
    var random = new Random(seed);
    var truth = new double[n];
    var target = new double[n];
    var latent = new double[factors][];
    for (int i = 0; i < n; i++)
    {
        truth[i] = 3 + (2 * random.NextDouble());
        target[i] = truth[i] + (0.3 * Normal(random));
    }

    for (int f = 0; f < factors; f++)
    {
        latent[f] = [.. Enumerable.Range(0, n).Select(_ => Normal(random))];
    }

    var columns = new double[k][];
    for (int j = 0; j < k; j++)
    {
        var load = Enumerable.Range(0, factors).Select(_ => loading * random.NextDouble()).ToArray();
        double bias = 0.1 * Normal(random);
        double noise = 0.05 + (0.3 * random.NextDouble());
        var column = columns[j] = new double[n];
        for (int i = 0; i < n; i++)
        {
            double value = truth[i] + bias + (noise * Normal(random));
            for (int f = 0; f < factors; f++)
            {
                value += load[f] * latent[f][i];
            }

            column[i] = value;
        }
    }

    return (columns, target);
}

static double Normal(Random random) =>
    Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
