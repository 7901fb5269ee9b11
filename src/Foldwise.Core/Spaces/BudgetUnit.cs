namespace Foldwise.Core.Spaces;

/// <summary>What one unit of a family's budget buys (a boosting round, a tree, a pass over the rows), for people to read.</summary>
public sealed record BudgetUnit(string One, string Many)
{
    public static BudgetUnit Rounds { get; } = new("round", "rounds");

    public static BudgetUnit Trees { get; } = new("tree", "trees");

    public static BudgetUnit Iterations { get; } = new("iteration", "iterations");

    public static BudgetUnit Passes { get; } = new("pass", "passes");

    /// <summary>E.g. "1 tree", "300 trees".</summary>
    public string Count(int budget) => string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{budget} {(budget == 1 ? One : Many)}");
}
