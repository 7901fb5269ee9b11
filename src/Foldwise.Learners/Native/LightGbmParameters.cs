using System.Collections.Immutable;
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
    /// The settings a fold's rows are binned with, picked from the job's own: a trial whose settings are equal reuses
    /// the fold's Datasets (<see cref="FoldDatasets"/>). Besides the bins and the category columns, they hold
    /// <c>min_data_in_leaf</c>, since LightGBM drops the features that cannot split under it while binning (keeping
    /// them measured 45 % slower fits on the quick demo); the rows sampled for bin bounds of a table over 200,000 rows
    /// follow the fold plan's seed. <paramref name="withThreads"/> false leaves out the thread count, which changes
    /// only how fast rows are binned.
    /// </summary>
    public static string ForDataset(FoldJob job, bool withThreads = true)
    {
        ArgumentNullException.ThrowIfNull(job);
        var all = Settings(job);
        var parameters = new SortedDictionary<string, string>(StringComparer.Ordinal)
        {
            ["data_random_seed"] = Text(job.Data.Folds.Seed),
        };
        foreach (string key in BinKeys.Where(k => all.ContainsKey(k) && (withThreads || k != "num_threads")))
        {
            parameters[key] = all[key];
        }

        return Join(parameters);
    }

    /// <summary>The parameter string of a job: <c>key=value</c> pairs, sorted, separated by spaces.</summary>
    public static string For(FoldJob job) => Join(Settings(job));

    private static readonly string[] BinKeys = ["verbosity", "num_threads", "max_bin", "use_missing", "zero_as_missing", "min_data_in_leaf", "categorical_feature"];

    private static SortedDictionary<string, string> Settings(FoldJob job)
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
            ["max_bin"] = "255",

            // A NaN cell is missing and goes its own way at a split; an absent (zero) cell is the value zero.
            ["use_missing"] = "true",
            ["zero_as_missing"] = "false",

            // ML.NET's default (its min_child_weight); LightGBM's own is 1e-3.
            ["min_sum_hessian_in_leaf"] = "0.1",

            // Histograms feature by feature. Left to itself LightGBM times both layouts when a booster is made and keeps
            // the faster: on a fold of 800,000 rows x 40 columns that test took about 1 s of the fold's 4.5 s preparation
            // and built a row-wise copy of the binned rows, and its choice changed from fold to fold with the timing. At
            // one thread both layouts sum each bin's gradients in row order, so the model is the same
            // (NativeLightGbmTests; the same predictions to the bit on that table, bench/Foldwise.Bench.FoldFit --memory).
            ["force_col_wise"] = "true",
        };
        Table.Apply(job.Parameters, parameters);
        Categories(job.Features.LevelCodeColumns, parameters);
        return parameters;
    }

    private static string Join(SortedDictionary<string, string> parameters) => string.Join(' ', parameters.Select(p => $"{p.Key}={p.Value}"));

    /// <summary>
    /// Declares the columns of level codes categorical (LightGBM's <c>categorical_feature</c>: zero-based column indices
    /// of the rows given), so LightGBM groups their levels inside a split. A group of levels needs as many rows as a leaf
    /// (<c>min_data_per_group</c> = <c>min_data_in_leaf</c>; LightGBM's default of 100 scored OOF RMSLE 0.12089 against
    /// 0.11361 on the 2,000-row diamonds extract, bench/Foldwise.Bench.Tables, 2026-12-05) and the category split's L2
    /// term is the leaves' (<c>cat_l2</c> = <c>lambda_l2</c>), so both follow the candidate; <c>cat_smooth</c> (10),
    /// <c>max_cat_to_onehot</c> (4) and <c>max_cat_threshold</c> (32) keep LightGBM 4.6's defaults (Parameters page).
    /// </summary>
    private static void Categories(ImmutableArray<int> columns, SortedDictionary<string, string> parameters)
    {
        if (columns.IsDefaultOrEmpty)
        {
            return;
        }

        parameters["categorical_feature"] = string.Join(',', columns.Select(Text));
        parameters["min_data_per_group"] = parameters.GetValueOrDefault("min_data_in_leaf", "20");
        parameters["cat_l2"] = parameters.GetValueOrDefault("lambda_l2", "0");
    }

    private static string Text(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static string Text(int value) => value.ToString(CultureInfo.InvariantCulture);
}
