using System.Collections.Immutable;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Learning;

/// <summary>
/// Runs one trial: encodes each fold's inputs from its training rows, fits every fold of the plan in turn, pools the out-of-fold predictions and
/// averages the fold models' test predictions (DESIGN: test prediction = mean over fold models).
/// </summary>
public sealed class TrialExecutor(IFoldLearner learner)
{
    public TrialOutcome Run(TrialData data, ParameterSet parameters, int budget, int seed, int threads, CancellationToken cancellation, Action<int>? foldDone = null)
    {
        var folds = data.Folds;
        if (folds.RowCount != data.Train.RowCount)
        {
            throw new InvalidOperationException($"fold plan covers {folds.RowCount} rows but the table has {data.Train.RowCount}");
        }

        var oof = new double[data.Train.RowCount];
        var test = new double[data.Test.RowCount];
        var foldScores = ImmutableArray.CreateBuilder<double>(folds.FoldCount);
        for (int f = 0; f < folds.FoldCount; f++)
        {
            cancellation.ThrowIfCancellationRequested();
            var validation = folds.ValidationRows(f);
            var trainRows = folds.TrainRows(f);
            int foldSeed = SearchSeeds.Fold(seed, f);
            var job = new FoldJob(data, f, trainRows, validation, parameters, budget, foldSeed, threads, data.InputsFor(trainRows, foldSeed));
            var prediction = learner.Fit(job, cancellation);
            if (prediction.Validation.Length != validation.Length || prediction.Test.Length != test.Length)
            {
                throw new InvalidOperationException($"{learner.Family} returned {prediction.Validation.Length} held-out and {prediction.Test.Length} test predictions; expected {validation.Length} and {test.Length}");
            }

            var actual = new double[validation.Length];
            for (int i = 0; i < validation.Length; i++)
            {
                oof[validation[i]] = prediction.Validation[i];
                actual[i] = data.Target[validation[i]];
            }

            for (int i = 0; i < test.Length; i++)
            {
                test[i] += prediction.Test[i] / folds.FoldCount;
            }

            foldScores.Add(data.Metric.Score(actual, prediction.Validation));
            foldDone?.Invoke(f);
        }

        return new TrialOutcome(data.Metric.Score(data.Target, oof), foldScores.MoveToImmutable(), oof, test);
    }
}
