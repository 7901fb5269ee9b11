using Foldwise.Core.Blending;
using Foldwise.Core.Screening;
using Foldwise.Core.Search;
using LiteDB;
using static Foldwise.Storage.BsonFields;

namespace Foldwise.Storage;

/// <summary>The records a search keeps: header, trials, vectors, screening, blend and the record of kept models.</summary>
public sealed partial class SearchStore
{
    private const string VectorCollection = "vectors";

    /// <summary>Trials per read of <see cref="LoadTrials"/>: 256 took 10–20 ms on a busy 2-core machine.</summary>
    internal const int TrialPage = 256;

    /// <summary>Stores the search header (replacing any earlier one), with its spent time and finished flag.</summary>
    public void SaveHeader(SearchHeader header) => Write(db => InTransaction(db, () =>
    {
        // One transaction, so a reader never sees a header without its chunks or progress, or the other way round.
        var search = db.GetCollection(HeaderDocuments.Collection);
        search.Upsert(HeaderDocuments.ToHeader(db, header));
        search.Upsert(HeaderDocuments.ToProgress(header.SpentSeconds, header.Finished));
    }));

    /// <summary>The search header, or null before <see cref="SaveHeader"/>.</summary>
    public SearchHeader? LoadHeader()
    {
        var (header, progress) = Read(db =>
        {
            var search = db.GetCollection(HeaderDocuments.Collection);
            return (search.FindById(HeaderDocuments.HeaderId), search.FindById(HeaderDocuments.ProgressId));
        });
        return header is null ? null : HeaderDocuments.FromDocuments(header, progress, FetchChunk);
    }

    /// <summary>Rewrites only the small progress record, not the header with its row ids.</summary>
    public void UpdateSpent(double spentSeconds, bool finished) => Write(db =>
        db.GetCollection(HeaderDocuments.Collection).Upsert(HeaderDocuments.ToProgress(spentSeconds, finished)));

    /// <summary>Inserts or replaces the trial with this id; durable when it returns.</summary>
    public void Save(TrialRecord trial) => Write(db =>
        db.GetCollection(TrialDocuments.Collection).Upsert(TrialDocuments.ToDocument(trial)));

    /// <summary>
    /// Every trial, by ascending id. Read in pages of <see cref="TrialPage"/> ids, each its own call on the file,
    /// so a reader of a long search holds the writer up for one page at a time; ids only grow and trials
    /// are never deleted, so the pages join into a whole, each trial as it was when its page was read.
    /// </summary>
    public IReadOnlyList<TrialRecord> LoadTrials()
    {
        var trials = new List<TrialRecord>();
        int after = int.MinValue;
        while (true)
        {
            // Documents are fetched first and mapped after, so the file's mutex is held only for the fetch.
            var page = Read(db => db.GetCollection(TrialDocuments.Collection).Query()
                .Where(BsonExpression.Create("_id > @0", after))
                .OrderBy("_id")
                .Limit(TrialPage)
                .ToList());
            trials.AddRange(page.Select(TrialDocuments.FromDocument));
            if (page.Count < TrialPage)
            {
                return trials;
            }

            after = trials[^1].Id;
        }
    }

    /// <summary>The trial with this id, or null.</summary>
    public TrialRecord? LoadTrial(int id)
    {
        var doc = Read(db => db.GetCollection(TrialDocuments.Collection).FindById(id));
        return doc is null ? null : TrialDocuments.FromDocument(doc);
    }

    /// <summary>
    /// Inserts or replaces a trial's pooled out-of-fold and test predictions (raw doubles, bit-exact), in chunks
    /// of at most a mebibyte, in one transaction: a reader sees all of them or none.
    /// </summary>
    public void SaveVectors(int trialId, double[] outOfFold, double[] test)
    {
        ArgumentNullException.ThrowIfNull(outOfFold);
        ArgumentNullException.ThrowIfNull(test);
        Write(db => InTransaction(db, () => db.GetCollection(VectorCollection).Upsert(new BsonDocument
        {
            ["_id"] = trialId,
            ["outOfFold"] = ChunkWriter.Doubles(db, $"trial.{trialId}.outOfFold", outOfFold),
            ["test"] = ChunkWriter.Doubles(db, $"trial.{trialId}.test", test),
        })));
    }

    /// <summary>A trial's prediction vectors, or null when none were saved.</summary>
    public (double[] OutOfFold, double[] Test)? LoadVectors(int trialId)
    {
        var doc = Read(db => db.GetCollection(VectorCollection).FindById(trialId));
        if (doc is null)
        {
            return null;
        }

        string owner = $"vectors of trial {trialId}";
        return (ChunkReader.Doubles(doc, "outOfFold", FetchChunk, owner), ChunkReader.Doubles(doc, "test", FetchChunk, owner));
    }

    /// <summary>Stores the screening report, replacing any earlier one.</summary>
    public void SaveScreening(ScreeningReport report) => Write(db =>
        db.GetCollection(HeaderDocuments.Collection).Upsert(ScreeningDocuments.ToDocument(report)));

    /// <summary>The screening report, or null before <see cref="SaveScreening"/>.</summary>
    public ScreeningReport? LoadScreening()
    {
        var doc = Read(db => db.GetCollection(HeaderDocuments.Collection).FindById(ScreeningDocuments.Id));
        return doc is null ? null : ScreeningDocuments.FromDocument(doc);
    }

    /// <summary>Stores the chosen blend, replacing any earlier one.</summary>
    public void SaveBlend(BlendSummary blend) => Write(db =>
        db.GetCollection(HeaderDocuments.Collection).Upsert(BlendDocuments.ToDocument(blend)));

    /// <summary>The stored blend, or null before <see cref="SaveBlend"/>.</summary>
    public BlendSummary? LoadBlend()
    {
        var doc = Read(db => db.GetCollection(HeaderDocuments.Collection).FindById(BlendDocuments.Id));
        return doc is null ? null : BlendDocuments.FromDocument(doc);
    }

    /// <summary>Records which blend members' models are kept beside the store (replacing any earlier record).</summary>
    public void SaveKept(KeptModels kept) => Write(db =>
        db.GetCollection(HeaderDocuments.Collection).Upsert(KeptDocuments.ToDocument(kept)));

    /// <summary>Removes the record of kept models: the blend changed and its members' models could not be kept.</summary>
    public void ForgetKept() => Write(db => db.GetCollection(HeaderDocuments.Collection).Delete(KeptDocuments.Id));

    /// <summary>The kept models' record, or null when the search kept none.</summary>
    public KeptModels? LoadKept()
    {
        var doc = Read(db => db.GetCollection(HeaderDocuments.Collection).FindById(KeptDocuments.Id));
        return doc is null ? null : KeptDocuments.FromDocument(doc);
    }

    private static void InTransaction(LiteDatabase db, Action action)
    {
        db.BeginTrans();
        try
        {
            action();
            db.Commit();
        }
        catch
        {
            db.Rollback();
            throw;
        }
    }

    // One chunk per call on the file, so a long vector holds the writer up for one chunk at a time.
    private byte[]? FetchChunk(string id) =>
        Read(db => db.GetCollection(Chunks.Collection).FindById(id)?["data"] is { IsBinary: true } data ? data.AsBinary : null);
}
