namespace Foldwise.Learners.Native;

/// <summary>
/// A LightGBM Booster over one training Dataset, which it keeps alive for as long as it lives. Rounds are added one
/// at a time, so a fit can be stopped between rounds, continued later, and its validation scores read per round.
/// A booster loaded from a kept model's text (<see cref="Load"/>) has no training Dataset and only predicts.
/// </summary>
internal sealed class LightGbmBooster : IDisposable
{
    private readonly BoosterHandle handle;
    private readonly LightGbmDataset? train;
    private readonly string parameters;
    private readonly List<LightGbmDataset> validations = [];

    private LightGbmBooster(BoosterHandle handle, LightGbmDataset? train, string parameters)
    {
        this.handle = handle;
        this.train = train;
        this.parameters = parameters;
    }

    public static LightGbmBooster Create(LightGbmDataset train, string parameters)
    {
        NativeCall.Check(LightGbmNative.BoosterCreate(train.Handle, parameters, out var handle), $"the parameters '{parameters}'");
        return new LightGbmBooster(handle, train, parameters);
    }

    /// <summary>A booster from the text <see cref="Save"/> wrote (UTF-8), for predicting only.</summary>
    public static unsafe LightGbmBooster Load(byte[] model)
    {
        ArgumentNullException.ThrowIfNull(model);
        var text = new byte[model.Length + 1];
        model.CopyTo(text, 0);
        fixed (byte* start = text)
        {
            NativeCall.Check(LightGbmNative.BoosterLoadModelFromString(start, out _, out var handle), $"a kept model ({model.Length:N0} bytes)");
            return new LightGbmBooster(handle, train: null, "a kept model");
        }
    }

    /// <summary>The model's text (UTF-8, without its closing zero) of its first <paramref name="rounds"/> rounds (all when 0).</summary>
    public unsafe byte[] Save(int rounds)
    {
        NativeCall.Check(LightGbmNative.BoosterSaveModelToString(handle, 0, rounds, 0, 0, out long length, null), "to measure the model's text");
        var text = new byte[length];
        fixed (byte* into = text)
        {
            NativeCall.Check(LightGbmNative.BoosterSaveModelToString(handle, 0, rounds, 0, length, out long written, into), "to write the model's text");
            return written == length ? text[..^1] : throw new LightGbmException($"LightGBM wrote {written} bytes of model text after announcing {length}");
        }
    }

    /// <summary>Rounds trained so far.</summary>
    public int Rounds
    {
        get
        {
            NativeCall.Check(LightGbmNative.BoosterGetCurrentIteration(handle, out int rounds), "to count the rounds");
            return rounds;
        }
    }

    /// <summary>
    /// Adds held-out rows whose scores the booster keeps up to date round by round (<see cref="ValidationScores"/>).
    /// The booster owns them from here on, refused or not.
    /// </summary>
    public void AddValidation(LightGbmDataset validation)
    {
        validations.Add(validation);
        NativeCall.Check(LightGbmNative.BoosterAddValidData(handle, validation.Handle), $"validation rows ({validation.RowCount})");
    }

    /// <summary>Trains one more round; false when no leaf can be split any more (the model then stays as it was).</summary>
    public bool TrainOneRound()
    {
        NativeCall.Check(LightGbmNative.BoosterUpdateOneIter(handle, out int finished), $"a boosting round with parameters '{parameters}'");
        return finished == 0;
    }

    /// <summary>Changes parameters that may change between rounds (the learning rate, for one).</summary>
    public void Change(string changed) =>
        NativeCall.Check(LightGbmNative.BoosterResetParameter(handle, changed), $"the changed parameters '{changed}'");

    /// <summary>The current raw scores of the validation rows added <paramref name="index"/>-th (from 0).</summary>
    public double[] ValidationScores(int index)
    {
        var scores = new double[validations[index].RowCount];
        ValidationScores(index, scores);
        return scores;
    }

    /// <summary>The same, written into <paramref name="into"/>, which holds one entry per validation row.</summary>
    public unsafe void ValidationScores(int index, Span<double> into)
    {
        if (into.Length != validations[index].RowCount)
        {
            throw new ArgumentException($"{into.Length} places for {validations[index].RowCount} validation rows", nameof(into));
        }

        fixed (double* scores = into)
        {
            NativeCall.Check(LightGbmNative.BoosterGetPredict(handle, index + 1, out long length, scores), "the validation scores");
            if (length != into.Length)
            {
                throw new LightGbmException($"LightGBM gave {length} validation scores for {into.Length} rows");
            }
        }
    }

    /// <summary>Raw scores of <paramref name="rows"/> from the first <paramref name="rounds"/> rounds (all when 0).</summary>
    public unsafe double[] Predict(CsrRows rows, int rounds, int threads, string what)
    {
        var scores = new double[rows.RowCount];
        if (scores.Length == 0)
        {
            return scores;
        }

        fixed (double* into = scores)
        {
            // The thread count goes with every call: LightGBM keeps the last one given in a process-wide setting.
            NativeCall.Check(
                LightGbmNative.BoosterPredictForCsr(
                    handle, rows.Starts, LightGbmNative.Int32, rows.Columns, rows.Values, LightGbmNative.Float32, rows.StartCount, rows.CellCount, rows.ColumnCount,
                    LightGbmNative.PredictRawScore, 0, rounds, $"num_threads={threads}", out long length, into),
                $"to predict {what} ({rows.RowCount} rows x {rows.ColumnCount} columns)");
            GC.KeepAlive(rows);
            return length == scores.Length ? scores : throw new LightGbmException($"LightGBM gave {length} predictions for {scores.Length} rows of {what}");
        }
    }

    public void Dispose()
    {
        handle.Dispose();
        foreach (var validation in validations)
        {
            validation.Dispose();
        }

        train?.Dispose();
    }
}
