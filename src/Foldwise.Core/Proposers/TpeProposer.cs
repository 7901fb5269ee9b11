using System.Runtime.CompilerServices;
using Foldwise.Core.Spaces;
using Foldwise.Core.Search;

namespace Foldwise.Core.Proposers;

/// <summary>
/// Tree-structured Parzen Estimator (Bergstra et al., NeurIPS 2011) with the defaults of <see cref="TpeOptions"/>.
/// By default it ranks every candidate of the family by the highest budget it reached, then by its score there (the
/// ladder, <see cref="TpeOptions.Ladder"/>); or, as in BOHB (Falkner et al., ICML 2018), it fits on the results at the
/// highest budget that has enough of them. It splits the ranked results at the γ-quantile into good and the rest, counts
/// unfinished new candidates among the rest at the worst observed score (constant liar, Ginsbourger et al. 2010) so
/// parallel proposals spread out, draws candidates from the good density l(x) and proposes the one with the largest
/// l(x)/g(x). Parameters are modelled one by one as in the paper by default, or jointly (one product kernel per result,
/// <see cref="ProductKernelDensity"/>, as BOHB's densities are): joint won on Branin and Hartmann-6 but lost on the
/// full-size demo bench (20 → 180, η 9), where it exploited the short rung's bias harder.
/// Until enough results are in it proposes at random and says so. A family's fitted densities are kept until a result
/// arrives that they were not fitted on; only the liars' density is fitted per proposal.
/// </summary>
public sealed class TpeProposer : IProposer
{
    public const string ProposerName = "tpe";

    private readonly TpeOptions _options;

    // Fitted models by family history; weak keys, so a history that is dropped takes its model with it.
    private readonly ConditionalWeakTable<FamilyHistory, TpeModel> _models = [];

    public TpeProposer(TpeOptions? options = null)
    {
        _options = options ?? new TpeOptions();
        _options.Validate();
    }

    public string Name => ProposerName;

    public Proposal Propose(FamilyHistory history, Random random)
    {
        var space = history.Space;
        var dimensions = Dimensions(space);
        int startup = _options.RandomStartFor(dimensions.Length);
        TrialReach? fitAt = dimensions.Length == 0 ? null : _options.Ladder ? LadderBudget(history, startup) : BudgetToFit(history, startup);
        if (fitAt is not { } budget)
        {
            return new Proposal(RandomProposer.Draw(space, random), RandomProposer.ProposerName);
        }

        int results = _options.Ladder ? history.Results : history.ResultsAt(budget).Count;
        if (!_models.TryGetValue(history, out var model) || model.Budget != budget || model.Results != results)
        {
            var (window, top) = _options.Ladder ? LadderWindow(history) : (Window(history.ResultsAt(budget), startup), 0);
            model = TpeModel.Fit(budget, results, dimensions, window, _options, top);
            _models.AddOrUpdate(history, model);
        }

        double[] best = model.BestCandidate(random, _options.DrawsPerProposal, history.Pending);
        return new Proposal(Assemble(space, dimensions, best), ProposerName);
    }

    /// <summary>The highest budget with at least <paramref name="startup"/> results, or null.</summary>
    private static TrialReach? BudgetToFit(FamilyHistory history, int startup)
    {
        var budgets = history.Budgets;
        for (int b = budgets.Count - 1; b >= 0; b--)
        {
            if (history.ResultsAt(budgets[b]).Count >= startup)
            {
                return budgets[b];
            }
        }

        return null;
    }

    /// <summary>Budget 0 (the model spans every budget) once enough candidates have a result, else null.</summary>
    private static TrialReach? LadderBudget(FamilyHistory history, int startup) => history.Furthest.Count >= startup ? default(TrialReach) : null;

    /// <summary>
    /// Every candidate once, best first in the order successive halving itself implies: further up the ladder first (a
    /// candidate promoted to a budget beat the ones stopped below it), then by score at that budget. The most recent
    /// <see cref="TpeOptions.Window"/> candidates, and how many of them share the highest reach.
    /// </summary>
    private (List<Observation> Window, int Top) LadderWindow(FamilyHistory history)
    {
        var all = history.Furthest;
        var recent = new List<(TrialReach Reach, Observation Result)>(Math.Min(all.Count, _options.Window));
        for (int i = Math.Max(0, all.Count - _options.Window); i < all.Count; i++)
        {
            recent.Add(all[i]);
        }

        recent.Sort(static (a, b) =>
            a.Reach != b.Reach ? b.Reach.CompareTo(a.Reach)
            : a.Result.Score != b.Result.Score ? a.Result.Score.CompareTo(b.Result.Score)
            : a.Result.TrialId.CompareTo(b.Result.TrialId));
        int top = recent.Count == 0 ? 0 : recent.FindIndex(f => f.Reach != recent[0].Reach) is var end and >= 0 ? end : recent.Count;
        return (recent.ConvertAll(static f => f.Result), top);
    }

    /// <summary>The most recent results the model is fitted on (a copy, which the model sorts).</summary>
    private List<Observation> Window(IReadOnlyList<Observation> all, int startup)
    {
        int take = Math.Min(all.Count, Math.Max(_options.Window, startup));
        var window = new List<Observation>(take);
        for (int i = all.Count - take; i < all.Count; i++)
        {
            window.Add(all[i]);
        }

        TpeModel.SortByScore(window);
        return window;
    }

    private static TpeDimension[] Dimensions(ParameterSpace space)
    {
        var list = new List<TpeDimension>(space.Ranges.Length);
        for (int i = 0; i < space.Ranges.Length; i++)
        {
            if (!space.Ranges[i].IsFixed)
            {
                list.Add(new TpeDimension(i, space.Ranges[i]));
            }
        }

        return [.. list];
    }

    private static ParameterSet Assemble(ParameterSpace space, TpeDimension[] dimensions, double[] model)
    {
        var values = new KeyValuePair<string, double>[space.Ranges.Length];
        for (int i = 0; i < values.Length; i++)
        {
            values[i] = new(space.Ranges[i].Name, space.Ranges[i].Low);
        }

        for (int d = 0; d < dimensions.Length; d++)
        {
            values[dimensions[d].Index] = new(dimensions[d].Range.Name, dimensions[d].ToValue(model[d]));
        }

        return ParameterSet.Of(values);
    }
}
