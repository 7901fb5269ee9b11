using Foldwise.Core.Data;
using Foldwise.Core.Encodings;

namespace Foldwise.Core.Screening;

/// <summary>Adds to a screening report how many levels of each kept category column the test table has that training lacks.</summary>
public static class TestLevelCount
{
    public static ScreeningReport Add(ScreeningReport report, FeatureTable train, FeatureTable alignedTest)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(train);
        ArgumentNullException.ThrowIfNull(alignedTest);
        return report with
        {
            Categories = [.. report.Categories.Select(note =>
            {
                int at = train.CategoryNames.IndexOf(note.Name);
                var (levels, rows) = TrialCategories.NewLevels(train.Categories[at], alignedTest.Categories[at]);
                return note with { NewTestLevels = levels, NewTestRows = rows };
            })],
        };
    }
}
