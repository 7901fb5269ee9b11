using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Spaces;
using Foldwise.Storage;

namespace Foldwise.Tuning.Tests;

/// <summary>Stores written by earlier versions stay readable: each format version has a fixture written by that version.</summary>
public sealed class StoreFormatTests
{
    [Fact]
    public void A_store_of_format_1_opens_with_its_definition_and_blends_as_it_did()
    {
        // Given a store written by the build of format 1 (Fixtures/StoreFormat1/README.md says how), copied to a folder
        using var folder = new TempFolder();
        string store = folder.PathOf(StoreFile.FileName);
        File.Copy(Path.Combine(AppContext.BaseDirectory, "Fixtures", "StoreFormat1", StoreFile.FileName), store);

        // When it is opened and its blend solved again
        using var opened = SearchStore.Open(store);
        var header = opened.LoadHeader()!;
        var blend = BlendStep.Run(opened, header, header.Definition, folder.Root, NoEvents.Instance);

        // Then its definition reads as it was written
        var definition = header.Definition;
        Assert.Equal("tiny", definition.Name);
        Assert.Equal((3, 7, 3), (definition.Folds, definition.Seed, definition.Screening.MinNonZero));
        Assert.Equal(new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Tpe, FirstRung: 10, FullBudget: 30, Eta: 3, RateScaling: 0.5, Brackets: 1), definition.Schedule);
        Assert.Equal(new SearchBudget(Trials: 10, Hours: null), definition.Budget);
        Assert.Equal(new BlendOptions(BlendMode.Simplex, Pool: 3), definition.Blend);
        Assert.Equal(["lightgbm", "fasttree"], definition.Families.Select(f => f.Family));
        Assert.All(definition.Families, f => Assert.True(DefinitionComparer.SameSpace(DefaultSpaces.For(f.Family), f.Space), f.Family));

        // And its ten trials blend as that build blended them (README: trial 8 alone, in-sample 1.0818607317576616)
        Assert.Equal(10, opened.LoadTrials().Count);
        Assert.Equal(1.0818607317576616, blend.InSampleScore);
        Assert.Equal(8, Assert.Single(blend.Members, m => m.Weight > 0).TrialId);
        Assert.Equal(51, File.ReadAllLines(Path.Combine(folder.Root, BlendStep.PredictionFileName)).Length);
    }
}
