using System.Collections.Immutable;
using Foldwise.Core.Data;

namespace Foldwise.Core.Demo;

/// <summary>
/// The invented demo: a regional freight co-operative predicting the first-quarter shipping spend
/// (<c>q1_spend</c>) of newly signed member shippers (<c>shipper_id</c>) from anonymised, mostly-zero
/// lane-usage counts (<c>lane_0001</c>…) and three facts from the signing form as text (<c>region</c>,
/// <c>sector</c>, <c>signing_channel</c>; some left blank). The same seed always gives the same tables; the test
/// table is drawn from the same world and has no target.
/// </summary>
public static class FreightDemo
{
    public const string IdColumn = "shipper_id";

    public const string TargetColumn = "q1_spend";

    /// <summary>Non-zero cells over all cells that the generator aims for (94 % zeros).</summary>
    public const double TargetDensity = 0.06;

    /// <summary>Rows and columns of each size: the test table is four times longer than the training table.</summary>
    public static (int TrainRows, int TestRows, int Columns) Shape(DemoSize size) => size switch
    {
        DemoSize.Quick => (800, 3_200, 400),
        DemoSize.Full => (3_000, 12_000, 7_000),
        _ => throw new ArgumentOutOfRangeException(nameof(size), size, "unknown demo size"),
    };

    public static (FeatureTable Train, FeatureTable Test) Generate(DemoSize size, int seed)
    {
        var (trainRows, testRows, columns) = Shape(size);
        var random = new Random(seed);
        var scenario = new FreightScenario(columns, TargetDensity, random);
        var names = Names(columns);
        var train = Draw(scenario, random, trainRows, firstId: 1, names, $"freight demo train ({size}, seed {seed})", withTarget: true);
        var test = Draw(scenario, random, testRows, firstId: trainRows + 1, names, $"freight demo test ({size}, seed {seed})", withTarget: false);
        return (train, test);
    }

    /// <summary>
    /// <paramref name="rows"/> further shippers of the world <see cref="Generate"/> draws for the same size and seed,
    /// signed after its test table (their ids follow its last), without a target: new rows to score with a search's
    /// kept models.
    /// </summary>
    public static FeatureTable NewRows(DemoSize size, int seed, int rows)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(rows);
        var (trainRows, testRows, columns) = Shape(size);
        var random = new Random(seed);
        var scenario = new FreightScenario(columns, TargetDensity, random);

        // The training and test shippers are drawn first, as Generate draws them, so the new ones follow them.
        for (int r = 0; r < trainRows + testRows; r++)
        {
            scenario.Shipper(random);
        }

        return Draw(scenario, random, rows, firstId: trainRows + testRows + 1, Names(columns), $"freight demo new rows ({size}, seed {seed})", withTarget: false);
    }

    private static ImmutableArray<string> Names(int columns)
    {
        int width = Math.Max(4, columns.ToString().Length);
        return [.. Enumerable.Range(1, columns).Select(c => "lane_" + c.ToString("D" + width))];
    }

    private static FeatureTable Draw(FreightScenario scenario, Random random, int rows, int firstId, ImmutableArray<string> names, string source, bool withTarget)
    {
        var builder = new ColumnBuilder(scenario.ColumnCount);
        var ids = ImmutableArray.CreateBuilder<string>(rows);
        var target = ImmutableArray.CreateBuilder<double>(rows);
        var facts = new int[ShipperFacts.ColumnNames.Length][];
        for (int f = 0; f < facts.Length; f++)
        {
            facts[f] = new int[rows];
        }

        for (int r = 0; r < rows; r++)
        {
            var (columns, counts, fact, spend) = scenario.Shipper(random);
            (facts[0][r], facts[1][r], facts[2][r]) = (fact.Region, fact.Sector, fact.Channel);
            for (int k = 0; k < columns.Length; k++)
            {
                builder.Add(r, columns[k], counts[k]);
            }

            ids.Add("S" + (firstId + r).ToString("D6"));
            target.Add(spend);
        }

        string[][] levelNames = [ShipperFacts.Regions[..scenario.RegionCount], ShipperFacts.Sectors, ShipperFacts.Channels];
        ImmutableArray<CategoryColumn> categories = [.. facts.Select((codes, f) => InOrderOfAppearance(codes, levelNames[f]))];
        return new FeatureTable(
            source, ids.MoveToImmutable(), names, builder.BuildAll(), withTarget ? target.MoveToImmutable() : [],
            [.. ShipperFacts.ColumnNames], categories);
    }

    /// <summary>A category column whose levels are listed in order of first appearance, as a CSV reader would list them.</summary>
    private static CategoryColumn InOrderOfAppearance(int[] codes, string[] names)
    {
        var order = new Dictionary<int, int>();
        var recoded = codes.Select(c => c == ShipperFacts.Blank ? CategoryColumn.Missing : order.TryGetValue(c, out int at) ? at : order[c] = order.Count).ToImmutableArray();
        return new CategoryColumn([.. order.OrderBy(p => p.Value).Select(p => names[p.Key])], recoded);
    }
}
