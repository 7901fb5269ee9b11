using System.Diagnostics;
using Foldwise.Core.Blending;
using Foldwise.Core.Data;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Foldwise.Csv;
using Foldwise.Learners;
using Foldwise.Storage;

namespace Foldwise.Tuning;

/// <summary>
/// Scores a table of new rows with a search's kept blend: each member's fold models predict the rows, prepared per fold
/// from the stored training table exactly as in the search (the same encodings, imputation and scaling, learnt from
/// the fold's training rows), the fold models are averaged and the members weighted as the blend said (see
/// <see cref="KeptFoldScoring"/> for how the work is shared out). The file is
/// written under the search's prediction header; nothing is written when any input is wrong.
/// </summary>
public static class KeptScoring
{
    public static ScoringSummary Predict(string storeOrFolder, string rowsPath, string outPath, int threads)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(threads, 1);
        var clock = Stopwatch.StartNew();
        string storePath = Path.GetFullPath(StoreFile.Resolve(storeOrFolder));
        string outDir = Path.GetDirectoryName(storePath)!;
        using var store = SearchStore.OpenReadOnly(storePath);
        var header = store.LoadHeader() ?? throw new StoreException($"{storePath} holds no search header: no trial ran, so nothing can predict.");
        var definition = header.Definition;
        var kept = store.LoadKept() ?? throw new InputException(
            storePath,
            "this search kept no models to score new rows with (it ended before models were kept); run 'foldwise blend STORE' to re-fit and keep the blend's members");
        if (kept.SearchId != header.SearchId)
        {
            throw new InputException(storePath, $"the record of kept models names search {kept.SearchId}, but the store holds search {header.SearchId}; run 'foldwise blend STORE' to keep this search's models");
        }

        // Every model file is checked before the (possibly large) table of new rows is read.
        var models = kept.Members.Select(m => KeptModelFiles.Read(outDir, header.SearchId, m)).ToList();
        var stored = TableFiles.Read(outDir, header.TrainHash, "training");

        // Named as the search's training file, so a refused column points at the file a person knows.
        var train = new FeatureTable(
            $"the search's training table ({Path.GetFileName(definition.Data.Train)}, screened)", stored.Ids, stored.FeatureNames, stored.Columns, stored.Target, stored.CategoryNames, stored.Categories);
        var raw = CsvTableReader.ReadTest(rowsPath, definition.Data.IdColumn, definition.Data.TargetColumn, definition.Data.Rules, train);
        var rows = TableAlignment.AlignTest(train, raw).Table;
        var read = clock.Elapsed;

        var metric = Metric.For(definition.Metric);
        var data = TrialData.From(train, rows, header.Folds, metric) with { LevelCodeFamilies = definition.LevelCodeFamilies() };
        var trials = store.LoadTrials().ToDictionary(t => t.Id);
        var scorers = kept.Members.Select((member, i) => Scorer(trials, definition, member, models[i], data.Folds.FoldCount, data.FewLevelsFor(member.Family))).ToList();
        var prepared = clock.Elapsed;

        var (predictions, work) = KeptFoldScoring.Predict(data, scorers, threads);
        var scored = clock.Elapsed;

        var blended = BlendStage.Combine([.. kept.Members.Select(m => m.Weight)], predictions);
        PredictionFile.Write(outPath, definition.Data.IdColumn, definition.Data.TargetColumn, rows.Ids, [.. blended.Select(metric.Inverse)]);
        var took = clock.Elapsed;
        return new ScoringSummary(Path.GetFullPath(outPath), rows.RowCount, kept, read, prepared - read, scored - prepared, took - scored, took, work);
    }

    private static KeptScorer Scorer(Dictionary<int, TrialRecord> trials, Core.Definition.SearchDefinition definition, KeptMember member, IReadOnlyList<byte[]> models, int folds, Core.Encodings.CategoryEncodingKind fewLevels)
    {
        var keeper = LearnerCatalog.BuiltIn.Get(member.Family) as IKeepsModels
            ?? throw new InvalidOperationException($"the {member.Family} family cannot use kept models");
        var trial = trials.GetValueOrDefault(member.TrialId) ?? throw new StoreException($"the kept trial {member.TrialId} is missing from the store");
        return models.Count == folds
            ? new KeptScorer(keeper, TrialFit.Refit(trial, trials, definition), models, fewLevels)
            : throw new InvalidOperationException($"trial {member.TrialId} kept {models.Count} fold models for {folds} folds");
    }
}
