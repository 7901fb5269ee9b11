using System.Globalization;
using Foldwise.Core.Definition;
using Foldwise.Core.Demo;
using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;

internal sealed record BenchArgs(
    string Part, DemoSize Size, int[] SeedList, int RandomTrials, int AshaTrials, ScheduleKind Schedule,
    int FirstRung, int FullBudget, int Eta, int Threads, string Family, string Out, string Tag, double RateExponent, int ProbeBudget, double[] ProbeExponents, bool JointTpe, ProposerKind Proposer, bool Ladder, int DrawOffset, int Brackets, RoundStopping? Stopping, CsvPair? Csv, RoundStopping? RandomStopping, string Screen, int FirstFolds, double? GoodFromTop)
{
    /// <summary>The table's name in traces and headings: the demo's size, or the CSV training file's name.</summary>
    /// <summary>
    /// True when the scheduled search's rungs count folds (racing: a new candidate trains the plan's first
    /// <see cref="FirstFolds"/> folds at the full rounds, a promotion all of them) rather than boosting rounds.
    /// </summary>
    public bool ByFolds => Screen == "folds";

    /// <summary>The scheduled search's top rung in its own unit: the fold count when racing, else the full rounds.</summary>
    public int TopBudget => ByFolds ? FoldCount : FullBudget;

    /// <summary>Folds of every plan this bench makes.</summary>
    public const int FoldCount = 5;

    public string TableLabel => Csv is { } csv ? Path.GetFileNameWithoutExtension(csv.Train) : Size.ToString();

    public string RandomFile(int seed) => $"random-{TableLabel}-{Family}-r{FullBudget}{Label(RandomStopping)}-seed{seed}.tsv".ToLowerInvariant();

    /// <summary>Part of a trace's name: empty without stopping (the older traces' names), else the stopping rule.</summary>
    public string StopLabel => Label(Stopping);

    private static string Label(RoundStopping? stopping) => stopping is { } s ? string.Create(CultureInfo.InvariantCulture, $"-stop{s.MinimumPatience}p{s.PatienceShare}") : "";

    /// <summary>What proposes the scheduled search's new candidates: TPE, independent or joint, or random draws (a control).</summary>
    public string ProposerLabel => Proposer == ProposerKind.Random ? "random" : $"TPE {(JointTpe ? "joint" : "independent")}, {(Ladder ? "ladder" : "top budget")}{(GoodFromTop is double t ? $", good: the best {t.ToString(CultureInfo.InvariantCulture)} of the top" : "")}";

    public string AshaFile(int seed) => $"{Schedule}-{(Proposer == ProposerKind.Random ? "random" : (JointTpe ? "tpejoint" : "tpe1d") + (Ladder ? "ladder" : "") + (GoodFromTop is double g ? $"top{g.ToString(CultureInfo.InvariantCulture)}" : ""))}-{TableLabel}-{Family}-r{FirstRung}-{FullBudget}-e{Eta}-x{RateExponent.ToString(CultureInfo.InvariantCulture)}{(Tag.Length > 0 ? "-" + Tag : "")}{(DrawOffset != 0 ? $"-d{DrawOffset}" : "")}{(Brackets > 1 ? $"-b{Brackets}" : "")}{(ByFolds ? $"-folds{FirstFolds}" : "")}{StopLabel}-seed{seed}.tsv".ToLowerInvariant();

    public static BenchArgs Parse(string[] args)
    {
        string Get(string name, string fallback)
        {
            int at = Array.IndexOf(args, name);
            return at >= 0 && at + 1 < args.Length ? args[at + 1] : fallback;
        }

        int Int(string name, string fallback) => int.Parse(Get(name, fallback), CultureInfo.InvariantCulture);

        // --seeds 5 means seeds 1..5; --seed-list 2,5 picks some.
        int[] seeds = Get("--seed-list", "") is { Length: > 0 } list
            ? [.. list.Split(',').Select(s => int.Parse(s, CultureInfo.InvariantCulture))]
            : [.. Enumerable.Range(1, Int("--seeds", "5"))];
        string part = Get("--part", "both");
        if (part is not ("both" or "random" or "asha" or "report" or "probe" or "costs"))
        {
            throw new ArgumentException($"--part must be both, random, asha, report, probe or costs, not '{part}'");
        }

        return new BenchArgs(
            part,
            Enum.Parse<DemoSize>(Get("--size", "Quick"), ignoreCase: true),
            seeds,
            Int("--random-trials", "16"),
            Int("--asha-trials", "10000"),
            Enum.Parse<ScheduleKind>(Get("--schedule", "asha"), ignoreCase: true),
            Int("--first-rung", "20"),
            Int("--full-budget", "180"),
            Int("--eta", "3"),
            Int("--threads", "2"),
            Get("--family", FamilyNames.LightGbm),
            Get("--out", Path.Combine("bench", "results", "search")),
            Get("--tag", ""),
            double.Parse(Get("--rate-exponent", "0.5"), CultureInfo.InvariantCulture),
            Int("--probe-rounds", "20"),
            [.. Get("--probe-exponents", "0,0.5,1").Split(',').Select(s => double.Parse(s, CultureInfo.InvariantCulture))],
            Get("--tpe", "independent") switch
            {
                "joint" => true,
                "independent" => false,
                var other => throw new ArgumentException($"--tpe must be joint or independent, not '{other}'"),
            },
            Enum.Parse<ProposerKind>(Get("--proposer", "tpe"), ignoreCase: true),
            Get("--fit", "ladder") switch
            {
                "ladder" => true,
                "top" => false,
                var other => throw new ArgumentException($"--fit must be ladder or top, not '{other}'"),
            },
            Int("--draw-offset", "1000"),
            Int("--brackets", "1"),
            StoppingOf(Get("--stopping", "on"), "--stopping"),
            Get("--train", "") is { Length: > 0 } train ? new CsvPair(train, Get("--test", ""), Get("--id", "id"), Get("--target", "")) : null,
            StoppingOf(Get("--random-stopping", Get("--stopping", "on")), "--random-stopping"),
            Get("--screen", "rounds") is "rounds" or "folds" ? Get("--screen", "rounds") : throw new ArgumentException($"--screen must be rounds or folds, not '{Get("--screen", "")}'"),
            Int("--first-folds", "1"),
            Get("--good", "ladder") switch
            {
                "ladder" => null,
                var share when double.TryParse(share, CultureInfo.InvariantCulture, out double s) && s is > 0 and < 1 => s,
                var other => throw new ArgumentException($"--good must be ladder or a share of the top rung between 0 and 1, not '{other}'"),
            });
    }

    private static RoundStopping? StoppingOf(string value, string option) => value switch
    {
        "on" => RoundStopping.Default,
        "off" => null,
        _ => throw new ArgumentException($"{option} must be on or off, not '{value}'"),
    };
}
