using Foldwise.Core.Spaces;

namespace Foldwise.Core.Proposers;

/// <summary>
/// Tree-structured Parzen Estimator (Bergstra et al., NeurIPS 2011) with the defaults of <see cref="TpeOptions"/>.
/// It fits on the highest budget that has enough results (Falkner et al., BOHB, ICML 2018), splits them at the
/// γ-quantile into good and the rest, counts unfinished new candidates among the rest at the worst observed score
/// (constant liar, Ginsbourger et al. 2010) so parallel proposals spread out, draws candidates from the good density
/// l(x) and proposes the one with the largest l(x)/g(x). Parameters are modelled independently, as in the paper.
/// Until some budget has enough results it proposes at random and says so.
/// </summary>
public sealed class TpeProposer : IProposer
{
    public const string ProposerName = "tpe";

    private readonly TpeOptions _options;

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
        var results = dimensions.Length == 0 ? null : ResultsToFit(history, startup);
        if (results is null)
        {
            return new Proposal(RandomProposer.Draw(space, random), RandomProposer.ProposerName);
        }

        var model = TpeModel.Fit(dimensions, results, history.Pending, _options);
        double[] best = model.BestCandidate(random, _options.Candidates);
        return new Proposal(Assemble(space, dimensions, best), ProposerName);
    }

    /// <summary>The most recent results of the highest budget that has at least <paramref name="startup"/> of them.</summary>
    private List<Observation>? ResultsToFit(FamilyHistory history, int startup)
    {
        var budgets = history.Budgets;
        for (int b = budgets.Count - 1; b >= 0; b--)
        {
            var all = history.ResultsAt(budgets[b]);
            if (all.Count >= startup)
            {
                int take = Math.Min(all.Count, Math.Max(_options.Window, startup));
                var window = new List<Observation>(take);
                for (int i = all.Count - take; i < all.Count; i++)
                {
                    window.Add(all[i]);
                }

                return window;
            }
        }

        return null;
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
