using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;

namespace Foldwise.Learners.Native;

/// <summary>
/// One fold's LightGBM model through the native library: trained round by round, optionally scoring the held-out
/// rows after every round (on the fitting scale, with the search's metric), and able to train further rounds later.
/// Disposing it frees the booster and its Datasets.
/// </summary>
public sealed class LightGbmFoldModel : IRoundFit
{
    private readonly FoldJob job;
    private readonly NativeFoldRows inputs;
    private readonly LightGbmBooster booster;
    private readonly double[]? actual;
    private readonly List<double> roundScores = [];

    private LightGbmFoldModel(FoldJob job, NativeFoldRows inputs, LightGbmBooster booster, double[]? actual)
    {
        this.job = job;
        this.inputs = inputs;
        this.booster = booster;
        this.actual = actual;
    }

    /// <summary>Rounds trained so far: the job's budget unless no leaf could be split any more.</summary>
    public int Rounds { get; private set; }

    /// <summary>True once a round could split no leaf: the model trains no further (a later round's bag might split again, which a whole fit never tries).</summary>
    public bool Finished { get; private set; }

    /// <summary>The held-out rows' score after each round (index 0 = after round 1); empty unless asked for at training.</summary>
    public IReadOnlyList<double> ValidationScores => roundScores;

    /// <summary>Trains <see cref="FoldJob.Budget"/> rounds; cancellation is honoured between rounds.</summary>
    public static LightGbmFoldModel Train(FoldJob job, bool scoreEachRound, CancellationToken cancellation)
    {
        var model = Start(job, scoreEachRound, cancellation);
        try
        {
            model.Continue(job.Budget, cancellation);
            return model;
        }
        catch
        {
            model.Dispose();
            throw;
        }
    }

    /// <summary>
    /// Bins the fold's rows and creates the booster with no round trained. The held-out rows are always added to the
    /// booster (it keeps their scores up to date, <see cref="HeldOutPredictions"/>); <paramref name="scoreEachRound"/>
    /// also scores them after every round into <see cref="ValidationScores"/>.
    /// </summary>
    public static LightGbmFoldModel Start(FoldJob job, bool scoreEachRound, CancellationToken cancellation)
    {
        FoldFitter.Check(FamilyNames.LightGbm, job);
        cancellation.ThrowIfCancellationRequested();
        using var gate = ThreadCountGate.Enter(job.Threads);
        var inputs = NativeFoldRows.From(job);
        string parameters = LightGbmParameters.For(job);
        var (train, validation) = FoldDatasets.Borrow(job, inputs);
        LightGbmBooster booster;
        try
        {
            booster = LightGbmBooster.Create(train, parameters);
        }
        catch
        {
            validation.Dispose();
            train.Dispose();
            throw;
        }

        LightGbmFoldModel? model = null;
        try
        {
            booster.AddValidation(validation);
            double[]? actual = scoreEachRound ? [.. job.ValidationRows.Select(r => job.Data.Target[r])] : null;
            model = new LightGbmFoldModel(job, inputs, booster, actual);
            return model;
        }
        catch
        {
            if (model is null)
            {
                booster.Dispose();
            }
            else
            {
                model.Dispose();
            }

            throw;
        }
    }

    /// <summary>Trains one more round; false when no leaf can be split any more.</summary>
    public bool TrainRound()
    {
        var rounds = Rounds;
        Continue(1, CancellationToken.None);
        return Rounds > rounds;
    }

    /// <summary>The held-out rows' predictions after the rounds trained so far, on the fitting scale.</summary>
    public double[] HeldOutPredictions() => Shift(booster.ValidationScores(0));

    /// <summary>The same, written into <paramref name="into"/>: no vector is made per round.</summary>
    public void HeldOutPredictions(Span<double> into)
    {
        booster.ValidationScores(0, into);
        Shift(into);
    }

    /// <summary>Trains up to <paramref name="rounds"/> more rounds on the same booster (bagging and all), as if the first fit had been longer.</summary>
    public void Continue(int rounds, CancellationToken cancellation)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(rounds);
        using var gate = ThreadCountGate.Enter(job.Threads);
        for (int i = 0; i < rounds && !Finished; i++)
        {
            cancellation.ThrowIfCancellationRequested();
            if (!booster.TrainOneRound())
            {
                Finished = true;
                break;
            }

            Rounds++;
            if (actual is not null)
            {
                roundScores.Add(job.Data.Metric.Score(actual, HeldOutPredictions()));
            }
        }
    }

    /// <summary>Sets the learning rate of the rounds still to come (a promoted trial may run at another rate than its short rung).</summary>
    public void ChangeLearningRate(double rate)
    {
        if (!(rate is > 0 and <= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(rate), rate, "a learning rate lies in (0, 1]");
        }

        booster.Change($"learning_rate={rate.ToString("R", System.Globalization.CultureInfo.InvariantCulture)}");
    }

    /// <summary>Predictions of the held-out rows and the test table, on the fitting scale, from the first <paramref name="rounds"/> rounds (all by default).</summary>
    public FoldPrediction Predict(int? rounds = null) => Predict(rounds ?? Rounds, withTest: true);

    /// <summary>
    /// Predictions from the first <paramref name="rounds"/> rounds (0 only when none was trained): the held-out rows,
    /// and the test table when <paramref name="withTest"/> (else an empty test vector: scoring it is skipped).
    /// </summary>
    public FoldPrediction Predict(int rounds, bool withTest)
    {
        if (rounds < (Rounds == 0 ? 0 : 1) || rounds > Rounds)
        {
            throw new ArgumentOutOfRangeException(nameof(rounds), rounds, $"the model has {Rounds} rounds");
        }

        // LightGBM reads 0 as "every round": the same as the model's own when it has none.
        using var gate = ThreadCountGate.Enter(job.Threads);
        double[] heldOut;
        using (var rows = inputs.CopyValidation())
        {
            heldOut = Shift(booster.Predict(rows, rounds, job.Threads, $"the held-out rows of fold {job.Fold}"));
        }

        if (!withTest)
        {
            return new FoldPrediction(heldOut, []);
        }

        using var test = inputs.PinTest();
        return new FoldPrediction(heldOut, Shift(booster.Predict(test, rounds, job.Threads, "the test table")));
    }

    /// <summary>The model's text of its first <paramref name="rounds"/> rounds (all by default), for <see cref="PredictKept"/>.</summary>
    public byte[] Save(int? rounds = null)
    {
        if (rounds is < 1 || rounds > Rounds)
        {
            throw new ArgumentOutOfRangeException(nameof(rounds), rounds, $"the model has {Rounds} rounds");
        }

        return booster.Save(rounds ?? 0);
    }

    /// <summary>
    /// Predictions of the job's test rows, on the fitting scale, from a model <see cref="Save"/> wrote for the same fold:
    /// the job's inputs and its training mean are derived exactly as in training.
    /// </summary>
    public static double[] PredictKept(FoldJob job, byte[] model)
    {
        ArgumentNullException.ThrowIfNull(job);
        using var gate = ThreadCountGate.Enter(job.Threads);
        using var booster = LightGbmBooster.Load(model);
        using var rows = CsrRows.All(job.Features.Test);
        var scores = booster.Predict(rows, 0, job.Threads, "the new rows");
        double offset = FoldFitter.TrainingMean(job);
        for (int i = 0; i < scores.Length; i++)
        {
            scores[i] += offset;
        }

        return scores;
    }

    public void Dispose() => booster.Dispose();

    private double[] Shift(double[] raw)
    {
        Shift(raw.AsSpan());
        return raw;
    }

    private void Shift(Span<double> raw)
    {
        for (int i = 0; i < raw.Length; i++)
        {
            raw[i] += inputs.Offset;
        }
    }
}
