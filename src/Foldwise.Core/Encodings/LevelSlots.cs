namespace Foldwise.Core.Encodings;

/// <summary>
/// A category column's slots as fitted on a fold's training rows: each level seen at least the minimum count keeps a
/// slot; missing has its own slot when the fold's training rows have missing cells; everything else (rare levels,
/// levels unseen in training, missing when training had none) shares the "other" slot, which is always last.
/// </summary>
internal sealed class LevelSlots
{
    private readonly int[] slotOfLevel;
    private readonly int missingSlot;

    private LevelSlots(int[] slotOfLevel, int missingSlot, int count)
    {
        this.slotOfLevel = slotOfLevel;
        this.missingSlot = missingSlot;
        Count = count;
    }

    public int Count { get; }

    public int Other => Count - 1;

    public static LevelSlots Fit(TrialCategory category, IReadOnlyList<int> trainRows, int minCount)
    {
        var (counts, missing) = LevelCounts.Of(category.Train, category.LevelCount, trainRows);
        var slotOf = new int[category.LevelCount];
        int next = 0;
        for (int level = 0; level < counts.Length; level++)
        {
            slotOf[level] = counts[level] >= minCount ? next++ : -1;
        }

        int missingSlot = missing > 0 ? next++ : -1;
        int other = next++;
        for (int level = 0; level < slotOf.Length; level++)
        {
            slotOf[level] = slotOf[level] < 0 ? other : slotOf[level];
        }

        return new LevelSlots(slotOf, missingSlot < 0 ? other : missingSlot, next);
    }

    public int Of(int code) => code switch
    {
        >= 0 => slotOfLevel[code],
        Data.CategoryColumn.Missing => missingSlot,
        _ => Other,
    };
}
