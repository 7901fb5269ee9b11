using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Encodings;
using Foldwise.Core.Preparation;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Learning;

/// <summary>
/// One fold's features as a learner reads them, with every category column already encoded from the fold's training
/// rows: <see cref="Train"/> holds all rows of the training table (index it with the fold's training and validation
/// rows), <see cref="Test"/> the test table, both with the same columns. A missing numeric cell is a stored NaN;
/// a family that cannot take NaN reads <see cref="Imputed"/> instead.
/// </summary>
public sealed class FoldInputs
{
    public FoldInputs(SparseRowMatrix train, SparseRowMatrix test)
    {
        ArgumentNullException.ThrowIfNull(train);
        ArgumentNullException.ThrowIfNull(test);
        if (train.ColumnCount != test.ColumnCount)
        {
            throw new ArgumentException($"the test rows have {test.ColumnCount} columns but the training rows {train.ColumnCount}", nameof(test));
        }

        Train = train;
        Test = test;
    }

    public SparseRowMatrix Train { get; }

    public SparseRowMatrix Test { get; }

    public int ColumnCount => Train.ColumnCount;

    /// <summary>
    /// Columns holding a category's slot code (<see cref="CategoryEncodingKind.LevelCodes"/>), ascending: the learner
    /// declares them categorical. Empty when every category column reached these inputs in another form.
    /// </summary>
    public ImmutableArray<int> LevelCodeColumns { get; init; } = [];

    /// <summary>
    /// The fold of its table's plan these inputs were encoded for by <see cref="TrialData.InputsFor(int, CategoryEncodingKind)"/>;
    /// null when built another way. Every trial of that fold reads inputs equal to these.
    /// </summary>
    public int? PlanFold { get; init; }

    /// <summary>These inputs, marked as encoded for <paramref name="fold"/> of the plan.</summary>
    internal FoldInputs OfPlanFold(int fold) => new(Train, Test) { LevelCodeColumns = LevelCodeColumns, PlanFold = fold };

    /// <summary>True when some cell of either table is missing (NaN).</summary>
    public bool HasMissing => ContainsNaN(Train.Values) || ContainsNaN(Test.Values);

    /// <summary>The table's own features, for a search without category columns: no copy is made.</summary>
    public static FoldInputs Plain(TrialData data)
    {
        ArgumentNullException.ThrowIfNull(data);
        return new FoldInputs(data.Train, data.Test);
    }

    /// <summary>
    /// The same inputs without NaN: each missing cell takes its column's median over <paramref name="trainRows"/>
    /// (implicit zeros included), and each column with a missing cell among those rows gains a 0/1 "was missing"
    /// column after all others. Returns this object when nothing is missing.
    /// </summary>
    public FoldInputs Imputed(ImmutableArray<int> trainRows) => HasMissing ? MedianImputation.Apply(this, trainRows) : this;

    /// <summary>
    /// The inputs a family reads (<see cref="FamilyDescriptor.Input"/>), each learnt from <paramref name="trainRows"/> only:
    /// these as they are, <see cref="Imputed"/>, or imputed and then scaled (<see cref="ColumnScaling"/>).
    /// </summary>
    public FoldInputs For(FamilyInput input, ImmutableArray<int> trainRows)
    {
        switch (input)
        {
            case FamilyInput.RawWithMissing:
                return this;
            case FamilyInput.Imputed:
                return Imputed(trainRows);
            case FamilyInput.Scaled:
                var imputed = Imputed(trainRows);
                var scaling = ColumnScaling.Learn(imputed.Train, trainRows);
                return new FoldInputs(scaling.Apply(imputed.Train), scaling.Apply(imputed.Test)) { LevelCodeColumns = imputed.LevelCodeColumns };
            default:
                throw new ArgumentOutOfRangeException(nameof(input), input, "unknown family input");
        }
    }

    private static bool ContainsNaN(float[] values)
    {
        foreach (float v in values)
        {
            if (float.IsNaN(v))
            {
                return true;
            }
        }

        return false;
    }
}
