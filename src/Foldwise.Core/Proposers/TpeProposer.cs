using System.Runtime.CompilerServices;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Proposers;

/// <summary>
/// Tree-structured Parzen Estimator (Bergstra et al., NeurIPS 2011) with the defaults of <see cref="TpeOptions"/>.
/// It fits on the highest budget that has enough results (Falkner et al., BOHB, ICML 2018), splits them at the
/// γ-quantile into good and the rest, counts unfinished new candidates among the rest at the worst observed score
/// (constant liar, Ginsbourger et al. 2010) so parallel proposals spread out, draws candidates from the good density
/// l(x) and proposes the one with the largest l(x)/g(x). Parameters are modelled one by one as in the paper by default, or jointly
/// (one product kernel per result, <see cref="ProductKernelDensity"/>, as BOHB's densities are): joint won on Branin and
/// Hartmann-6 but lost on the full-size demo bench (20 → 180, η 9), where it exploited the short rung's bias harder.
/// Until some budget has enough results it proposes at random and says so. A family's fitted densities are kept
/// until a result arrives at the budget they were fitted on; only the liars' density is fitted per proposal.
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
        int startup = _options.StartupFor(dimensions.Length);
        int budget = dimensions.Length == 0 ? -1 : BudgetToFit(history, startup);
        if (budget < 0)
        {
            return new Proposal(RandomProposer.Draw(space, random), RandomProposer.ProposerName);
        }

        int results = history.ResultsAt(budget).Count;
        if (!_models.TryGetValue(history, out var model) || model.Budget != budget || model.Results != results)
        {
            model = TpeModel.Fit(budget, results, dimensions, Window(history.ResultsAt(budget), startup), _options);
            _models.AddOrUpdate(history, model);
        }

        double[] best = model.BestCandidate(random, _options.Candidates, history.Pending);
        return new Proposal(Assemble(space, dimensions, best), ProposerName);
    }

    /// <summary>The highest budget with at least <paramref name="startup"/> results, or −1.</summary>
    private static int BudgetToFit(FamilyHistory history, int startup)
    {
        var budgets = history.Budgets;
        for (int b = budgets.Count - 1; b >= 0; b--)
        {
            if (history.ResultsAt(budgets[b]).Count >= startup)
            {
                return budgets[b];
            }
        }

        return -1;
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
