namespace Foldwise.Core.Demo;

/// <summary>
/// The invented world behind the demo: which columns are real lanes, never-used lanes, lanes every member
/// uses once (onboarding), or copies of another lane (one lane listed under two codes); how popular each
/// lane is; and how a shipper's lane usage drives its first-quarter spend. Drawn once per seed, then
/// shared by the training and test shippers so both come from the same world.
/// </summary>
internal sealed class FreightScenario
{
    /// <summary>Share of a shipper's lanes taken from its home corridor rather than the whole network.</summary>
    private const double HomeShare = 0.5;

    private readonly int columnCount;
    private readonly int[] laneColumns;
    private readonly double[] cumulativePopularity;
    private readonly double[] laneIntensity;
    private readonly int[][] corridorLanes;
    private readonly double[][] corridorCumulative;
    private readonly double[] corridorEffect;
    private readonly int[] universalColumns;
    private readonly (int Column, int Source)[] copies;
    private readonly (int Column, double Weight)[] signal;
    private readonly (int A, int B, double Weight)[] pairs;
    private readonly double meanLanes;
    private readonly float[] scratch;
    private readonly double structureMean;
    private readonly double structureSpread;
    private readonly double[] sectorEffect;
    private readonly double[] sectorCumulative;
    private readonly double[] channelEffect;

    public FreightScenario(int columns, double density, Random random)
    {
        columnCount = columns;
        scratch = new float[columns];
        var order = Enumerable.Range(0, columns).ToArray();
        random.Shuffle(order);
        int unused = Math.Max(2, columns / 500);
        int copyCount = Math.Max(3, columns / 100);
        UnusedColumns = order[..unused];
        universalColumns = order[unused..(unused + 2)];
        var copyColumns = order[(unused + 2)..(unused + 2 + copyCount)];
        laneColumns = order[(unused + 2 + copyCount)..];
        copies = [.. copyColumns.Select(c => (c, laneColumns[random.Next(laneColumns.Length)]))];

        // Popularity falls off like a Zipf law over a random ranking of the lanes (from memory: lane traffic is long-tailed).
        var popularity = laneColumns.Select((_, rank) => Math.Pow(rank + 10, -0.9)).ToArray();
        cumulativePopularity = Cumulative(popularity);
        laneIntensity = [.. laneColumns.Select(_ => Math.Exp(0.5 * random.Normal()))];

        int corridors = Math.Clamp(columns / 400, 4, 12);
        var corridorOf = laneColumns.Select(_ => random.Next(corridors)).ToArray();
        corridorLanes = [.. Enumerable.Range(0, corridors).Select(k => Enumerable.Range(0, laneColumns.Length).Where(i => corridorOf[i] == k).ToArray())];
        corridorCumulative = [.. corridorLanes.Select(lanes => Cumulative([.. lanes.Select(i => popularity[i])]))];
        corridorEffect = [.. Enumerable.Range(0, corridors).Select(_ => 0.3 * random.Normal())];

        // A shipper's sector and how it signed up move its spend a little beyond what its lanes say.
        sectorEffect = [.. ShipperFacts.Sectors.Select(_ => 0.25 * random.Normal())];
        sectorCumulative = Cumulative([.. ShipperFacts.Sectors.Select((_, k) => 1.0 / (k + 2))]);
        channelEffect = [.. ShipperFacts.Channels.Select(_ => 0.1 * random.Normal())];

        // Spend is driven by a sparse subset of the busier lanes, a few of them in pairs.
        int signalCount = Math.Max(8, laneColumns.Length / 120);
        signal = [.. random.GetItems(Enumerable.Range(0, laneColumns.Length / 4).ToArray(), signalCount).Distinct()
            .Select(i => (laneColumns[i], (random.NextDouble() < 0.2 ? -1 : 1) * (0.15 + (0.5 * random.NextDouble()))))];
        pairs = [.. Enumerable.Range(0, signal.Length / 4).Select(_ =>
            (signal[random.Next(signal.Length)].Column, signal[random.Next(signal.Length)].Column, (random.NextDouble() < 0.3 ? -1 : 1) * (0.3 + (0.5 * random.NextDouble()))))
            .Where(p => p.Item1 != p.Item2)];

        // Non-zeros a shipper adds beyond the universal lanes and copies; E[activity] = exp(0.5²/2) ≈ 1.13.
        meanLanes = Math.Max(1, (density * columns) - 2) / Math.Exp(0.125);

        // Standardise the lane-driven part on pilot shippers from a stream of their own, so both sizes
        // get the same spend scale however many signal lanes a shipper touches.
        var pilot = new Random(random.Next());
        var touched = new List<int>();
        var raw = new double[400];
        for (int i = 0; i < raw.Length; i++)
        {
            raw[i] = Use(pilot, touched, out _);
            Clear(touched);
        }

        structureMean = raw.Average();
        structureSpread = Math.Max(1e-9, Math.Sqrt(raw.Average(x => (x - structureMean) * (x - structureMean))));
    }

    public int[] UnusedColumns { get; }

    public int ColumnCount => columnCount;

    /// <summary>Number of regions: one per home corridor.</summary>
    public int RegionCount => corridorLanes.Length;

    /// <summary>
    /// One new member: its non-zero lane counts (columns ascending), the facts its signing form records (region,
    /// sector, channel; <see cref="ShipperFacts.Blank"/> where the form left it empty) and its first-quarter spend.
    /// </summary>
    public (int[] Columns, float[] Counts, ShipperFacts Facts, double Spend) Shipper(Random random)
    {
        var touched = new List<int>();
        double structure = (Use(random, touched, out int home) - structureMean) / structureSpread;
        int sector = random.Pick(sectorCumulative);
        int channel = random.Next(ShipperFacts.Channels.Length);

        // Median spend e^8.3 ≈ 4,000; the lanes explain a log-scale spread of 1, sector and channel a little more, the rest is noise.
        double spend = Math.Round(Math.Exp(8.3 + structure + sectorEffect[sector] + channelEffect[channel] + (0.45 * random.Normal())), 2);
        var facts = new ShipperFacts(
            Region: random.NextDouble() < ShipperFacts.RegionBlankShare ? ShipperFacts.Blank : home,
            Sector: random.NextDouble() < ShipperFacts.SectorBlankShare ? ShipperFacts.Blank : sector,
            Channel: random.NextDouble() < ShipperFacts.ChannelBlankShare ? ShipperFacts.Blank : channel);
        touched.Sort();
        int[] columns = [.. touched];
        var counts = columns.Select(c => scratch[c]).ToArray();
        Clear(touched);
        return (columns, counts, facts, spend);
    }

    /// <summary>Draws a shipper's lane usage into the scratch row and returns its unscaled log spend and home corridor.</summary>
    private double Use(Random random, List<int> touched, out int home)
    {
        home = random.Next(corridorLanes.Length);
        double activity = Math.Exp(0.5 * random.Normal());
        int wanted = Math.Clamp(random.Poisson(meanLanes * activity), 1, laneColumns.Length / 2);
        double trips = 0;
        for (int attempts = 0; touched.Count < wanted && attempts < wanted * 20; attempts++)
        {
            int lane = random.NextDouble() < HomeShare && corridorLanes[home].Length > 0
                ? corridorLanes[home][random.Pick(corridorCumulative[home])]
                : random.Pick(cumulativePopularity);
            int column = laneColumns[lane];
            if (scratch[column] == 0)
            {
                scratch[column] = 1 + random.Poisson(1.5 * activity * laneIntensity[lane]);
                trips += scratch[column];
                touched.Add(column);
            }
        }

        foreach (int column in universalColumns)
        {
            scratch[column] = 1;
            touched.Add(column);
        }

        foreach (var (column, source) in copies)
        {
            if (scratch[source] != 0)
            {
                scratch[column] = scratch[source];
                touched.Add(column);
            }
        }

        return LogSpend(home, trips);
    }

    private void Clear(List<int> touched)
    {
        foreach (int column in touched)
        {
            scratch[column] = 0;
        }

        touched.Clear();
    }

    private double LogSpend(int home, double trips)
    {
        double log = 0.45 * Math.Log(1 + trips) + corridorEffect[home];
        foreach (var (column, weight) in signal)
        {
            log += weight * Math.Log(1 + scratch[column]);
        }

        foreach (var (a, b, weight) in pairs)
        {
            log += scratch[a] > 0 && scratch[b] > 0 ? weight : 0;
        }

        return log;
    }

    private static double[] Cumulative(double[] weights)
    {
        var cumulative = new double[weights.Length];
        double sum = 0;
        for (int i = 0; i < weights.Length; i++)
        {
            sum += weights[i];
            cumulative[i] = sum;
        }

        return cumulative;
    }
}
