using Foldwise.Core.Blending;

namespace Foldwise.Core.Tests.Blending;

public sealed class GramTests
{
    [Theory]
    [InlineData(7, 1003, false)]
    [InlineData(9, 37, true)]
    [InlineData(20, 30_000, true)]
    [InlineData(1, 5, false)]
    public void Matches_plain_dot_products(int k, int n, bool subset)
    {
        // Given columns, a shift and (maybe) a scattered subset of rows; the last case is large enough to run in parallel
        var (columns, shift) = BlendFakes.Problem(k + n, k, n);
        int[]? rows = subset ? [.. Enumerable.Range(0, n).Where(r => r % 3 != 1).Reverse()] : null;

        // When
        var gram = Gram.Of(columns, shift, rows);

        // Then
        var used = rows ?? [.. Enumerable.Range(0, n)];
        for (int i = 0; i < k; i++)
        {
            for (int j = 0; j < k; j++)
            {
                double expected = used.Sum(r => (columns[i][r] - shift[r]) * (columns[j][r] - shift[r]));
                Assert.Equal(expected, gram[i, j], 1e-12 * Math.Abs(expected) + 1e-12);
                Assert.Equal(gram[i, j], gram[j, i]);
            }
        }
    }

    [Fact]
    public void Adds_up_over_folds_to_the_whole()
    {
        // Given
        var (columns, y) = BlendFakes.Problem(2, 6, 500);
        var plan = BlendFakes.RoundRobin(500, 5);

        // When
        var parts = Enumerable.Range(0, 5).Select(f => Gram.Of(columns, y, [.. plan.ValidationRows(f)]));
        var whole = Gram.Of(columns, y);
        var sum = Gram.Sum(parts);

        // Then
        for (int i = 0; i < whole.Values.Length; i++)
        {
            Assert.Equal(whole.Values[i], sum.Values[i], 1e-12 * Math.Abs(whole.Values[i]));
        }
    }
}
