using Foldwise.Core.Definition;
using Foldwise.Core.Demo;
using Foldwise.Core.Spaces;

namespace Foldwise.Tuning.Tests;

/// <summary>
/// The quick demo's tables (seed 7) with a small search over them: both families, 3 folds, ASHA 10 → 30 rounds with
/// TPE, 10 trials. One slot trains them one after another, so every decision and result is repeatable.
/// </summary>
public static class QuickDemo
{
    public static SearchDefinition WriteTo(string folder)
    {
        var (train, test) = FreightDemo.Generate(DemoSize.Quick, 7);
        string trainPath = Path.Combine(folder, "train.csv");
        string testPath = Path.Combine(folder, "test.csv");
        DemoCsvWriter.Write(train, trainPath, "shipper_id", "q1_spend");
        DemoCsvWriter.Write(test, testPath, "shipper_id", null);
        return new SearchDefinition
        {
            Name = "pin",
            Data = new DataSource(trainPath, testPath, "shipper_id", "q1_spend"),
            Folds = 3,
            Seed = 7,
            Families = [.. new[] { FamilyNames.LightGbm, FamilyNames.FastTree }.Select(f => new FamilySearch(f, DefaultSpaces.For(f)))],
            Schedule = new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Tpe, FirstRung: 10, FullBudget: 30, Eta: 3),
            Budget = new SearchBudget(Trials: 10, Hours: null),
        };
    }
}
