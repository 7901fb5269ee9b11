using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Encodings;
using Foldwise.Core.Learning;

namespace Foldwise.Tuning;

/// <summary>
/// One fold's inputs for every kept member whose family reads few-level category columns in the same form (indicator
/// columns or level codes), with the table of new rows encoded once. The encoded cells of the new rows
/// depend on the fold's training rows only, not on the seed (it shuffles only the inner folds that give the training
/// rows' target means; pinned by <c>FoldEncoderTests.The_test_rows_cells_do_not_depend_on_the_seed</c>), so members
/// with other fold seeds share them and only the fold's training rows are encoded again for each seed.
/// </summary>
internal sealed class SharedFoldInputs
{
    private readonly TrialData data;
    private readonly ImmutableArray<int> trainRows;
    private readonly CategoryEncodingKind fewLevels;
    private readonly Dictionary<int, FoldInputs> bySeed = [];

    private SharedFoldInputs(TrialData data, ImmutableArray<int> trainRows, int seed, CategoryEncodingKind fewLevels)
    {
        this.data = data;
        this.trainRows = trainRows;
        this.fewLevels = fewLevels;
        bySeed[seed] = data.InputsFor(trainRows, seed, fewLevels);
        NewRows = bySeed[seed].Test;
    }

    /// <summary>The fold's encoded new rows, shared by every seed's inputs.</summary>
    public SparseRowMatrix NewRows { get; }

    /// <summary>Encodes the fold's inputs in <paramref name="fewLevels"/>' form for a first seed; other seeds reuse its encoded new rows.</summary>
    public static SharedFoldInputs Encode(TrialData data, ImmutableArray<int> trainRows, int seed, CategoryEncodingKind fewLevels) =>
        new(data, trainRows, seed, fewLevels);

    /// <summary>The fold's inputs as <see cref="TrialData.InputsFor"/> gives them for <paramref name="seed"/>.</summary>
    public FoldInputs For(int seed)
    {
        lock (bySeed)
        {
            if (!bySeed.TryGetValue(seed, out var inputs))
            {
                inputs = data.Categories.IsDefaultOrEmpty ? bySeed.Values.First() : WithNewRows(WithoutNewRows(data).InputsFor(trainRows, seed, fewLevels));
                bySeed[seed] = inputs;
            }

            return inputs;
        }
    }

    /// <summary>A seed's training rows with the shared new rows; the columns of level codes are the same for every seed.</summary>
    private FoldInputs WithNewRows(FoldInputs own) => new(own.Train, NewRows) { LevelCodeColumns = own.LevelCodeColumns };

    /// <summary>The same training rows and category columns with no new rows: encoding it costs only the training rows.</summary>
    private static TrialData WithoutNewRows(TrialData data) => data with
    {
        Test = new SparseRowMatrix(0, data.Test.ColumnCount, [0], [], []),
        Categories = [.. data.Categories.Select(c => c with { Test = [] })],
    };
}
