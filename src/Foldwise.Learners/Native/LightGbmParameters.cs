using System.Globalization;
using Foldwise.Core.Learning;

namespace Foldwise.Learners.Native;

/// <summary>
/// The one mapping from the project's parameter names to LightGBM's documented parameter names (LightGBM 4.6
/// Parameters page), and the settings every fit shares. Where LightGBM's default differs from the ML.NET trainer
/// that tests compare against, the ML.NET value is set (read from its trainer's options for the same job).
/// </summary>
internal static class LightGbmParameters
{
    public static readonly OptionTable<SortedDictionary<string, string>> Table = new(
        new Dictionary<string, Action<SortedDictionary<string, string>, double>>
        {
            ["learning_rate"] = (p, v) => p["learning_rate"] = Text(v),
            ["leaves"] = (p, v) => p["num_leaves"] = Text((int)v),
            ["min_leaf_rows"] = (p, v) => p["min_data_in_leaf"] = Text((int)v),
            ["feature_fraction"] = (p, v) => p["feature_fraction"] = Text(v),
            ["row_fraction"] = (p, v) =>
            {
                p["bagging_fraction"] = Text(v);
                p["bagging_freq"] = v < 1 ? "1" : "0";
            },
            ["l2"] = (p, v) => p["lambda_l2"] = Text(v),
        });

    /// <summary>
    /// The settings a fold's rows are binned with: the same for every trial of a search, so its Datasets can be
    /// reused (<see cref="FoldDatasets"/>). Unsplittable features are kept (<c>feature_pre_filter</c>), since which
    /// ones cannot split depends on a trial's <c>min_data_in_leaf</c>; the rows sampled for bin bounds of a large
    /// table follow the fold plan's seed. <paramref name="withThreads"/> false leaves out the thread count, which
    /// changes only how fast the rows are binned.
    /// </summary>
    public static string ForDataset(FoldJob job, bool withThreads = true)
    {
        ArgumentNullException.ThrowIfNull(job);
        var parameters = new SortedDictionary<string, string>(BinSettings, StringComparer.Ordinal)
        {
            ["data_random_seed"] = Text(job.Data.Folds.Seed),
        };
        if (withThreads)
        {
            parameters["num_threads"] = Text(job.Threads);
        }

        return string.Join(' ', parameters.Select(p => $"{p.Key}={p.Value}"));
    }

    private static readonly SortedDictionary<string, string> BinSettings = new(StringComparer.Ordinal)
    {
        ["verbosity"] = "-1",
        ["max_bin"] = "255",
        ["feature_pre_filter"] = "false",

        // A NaN cell is missing and goes its own way at a split; an absent (zero) cell is the value zero.
        ["use_missing"] = "true",
        ["zero_as_missing"] = "false",
    };

    /// <summary>The parameter string of a job: <c>key=value</c> pairs, sorted, separated by spaces.</summary>
    public static string For(FoldJob job)
    {
        var parameters = new SortedDictionary<string, string>(StringComparer.Ordinal)
        {
            ["objective"] = "regression",
            ["boosting"] = "gbdt",
            ["metric"] = "None",
            ["verbosity"] = "-1",
            ["num_threads"] = Text(job.Threads),
            ["seed"] = Text(job.Seed),
            ["deterministic"] = "true",

            // ML.NET's default (its min_child_weight); LightGBM's own is 1e-3.
            ["min_sum_hessian_in_leaf"] = "0.1",
        };
        foreach (var (key, value) in BinSettings)
        {
            parameters[key] = value;
        }

        Table.Apply(job.Parameters, parameters);
        return string.Join(' ', parameters.Select(p => $"{p.Key}={p.Value}"));
    }

    private static string Text(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static string Text(int value) => value.ToString(CultureInfo.InvariantCulture);
}
