namespace Foldwise.Core.Proposers;

/// <summary>
/// Settings of the TPE proposer. Defaults: the best quarter of the results count as good; 24 draws from the good
/// density per proposal; random proposals until dims + 1 candidates have a result; the model sees at most the 128
/// most recent candidates, ranked on the ladder; wide kernel weight 1; parameters modelled one by one.
/// </summary>
/// <param name="GoodFraction">
/// Fraction of results (best first) that make up the good density l(x). Bergstra et al. (NeurIPS 2011) leave the
/// quantile γ free; 0.25 was measured best (with the earlier start-up of 12) of 0.10, 0.15, 0.25 and 0.35 here (median best
/// over 10 seeds on Branin, 60 evaluations, and Hartmann-6, 100 evaluations; see TpeProposerTests).
/// </param>
/// <param name="DrawsPerProposal">Draws from l(x) among which the one with the largest l(x)/g(x) is proposed.</param>
/// <param name="RandomStart">
/// Results a budget needs before the model is used there; null means dims + 1, the smallest number BOHB (Falkner et al.,
/// ICML 2018) fits a model on (from memory). Measured against the earlier max(10, 2·dims) over 40 seeds here (median best;
/// Branin at 15/25/40/60 evaluations, Hartmann-6 at 20/30/50/100): better in 7 of the 8 (Branin 0.681 against 0.861 at
/// 25, Hartmann-6 −1.906 against −1.538 at 20), worse only at Hartmann-6 50 (−2.735 against −2.796). A short search,
/// where a few dozen results are all there is, gains most.
/// </param>
/// <param name="Window">Most recent results at the chosen budget the model is fitted on (bounds the cost of a decision).</param>
/// <param name="WideKernelWeight">Weight of the wide kernel spanning the whole range (the prior), and the pseudo-count of every named value.</param>
/// <param name="Joint">
/// Model the parameters jointly (<see cref="ProductKernelDensity"/>) rather than one by one (<see cref="IndependentDensity"/>).
/// </param>
/// <param name="Ladder">
/// Fit on every candidate at once, ranked by the highest budget it reached and then by its score there, rather than on the
/// results at the highest budget with enough of them (BOHB's rule, <c>false</c>). Under ASHA a higher rung holds only
/// promoted candidates, a selected sample: fitted there, the rest density g describes good-but-not-best points and l/g
/// pulls proposals into unexplored corners, and the low-rung population is ignored. The ladder keeps the higher budget's
/// word first (a candidate promoted further ranks above every one stopped below it, as successive halving itself
/// decided) and the whole population in g. Measured here on the multi-fidelity Branin and Hartmann-6 (ASHA, 41 seeds,
/// target random search's best of 48 full-budget trials; MultiFidelitySearchTests): seeds that missed the target within
/// random search's compute fell from 9, 14, 12 to 0, 4, 2 (Branin; budgets 1–9 η 9, 1–9 η 3, 1–27 η 3) and from 5, 7, 6
/// to 2, 2, 3 (Hartmann-6), at equal or better medians. Those runs shared random search's draws; with draws of its own
/// (as the checks now run) the misses at 1–9 η 9 and η 3 fell from 11, 15 to 0, 1 (Branin) and from 3, 14 to 0, 1
/// (Hartmann-6). With one budget the two rules are the same; under Hyperband a candidate that started at a higher
/// budget ranks with those promoted there (there fewer seeds missed too: 16 against 27 of the same six runs).
/// </param>
/// <param name="GoodFromTop">
/// With the ladder, take the good density from the candidates at the highest budget only: the best share of them given
/// here (at least two), never more than γ of all; null keeps the ladder's γ of all. Without it, once about γ of the
/// candidates have been promoted to the top, every one of them is "good" whatever its score there. A benchmark option:
/// under racing over folds its best quarter missed more seeds than the ladder on two of three tables (README, Schedules).
/// </param>
public sealed record TpeOptions(
    double GoodFraction = 0.25,
    int DrawsPerProposal = 24,
    int? RandomStart = null,
    int Window = 128,
    double WideKernelWeight = 1.0,
    bool Joint = false,
    bool Ladder = true,
    double? GoodFromTop = null)
{
    public int RandomStartFor(int dimensions) => RandomStart ?? Math.Max(2, dimensions + 1);

    public void Validate()
    {
        if (GoodFraction is not (> 0 and < 1))
        {
            throw new ArgumentOutOfRangeException(nameof(GoodFraction), GoodFraction, "the good fraction must lie strictly between 0 and 1");
        }

        if (DrawsPerProposal < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(DrawsPerProposal), DrawsPerProposal, "at least one candidate is needed");
        }

        if (RandomStart is < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(RandomStart), RandomStart, "the model needs at least two results");
        }

        if (Window < 2 || (RandomStart is int s && Window < s))
        {
            throw new ArgumentOutOfRangeException(nameof(Window), Window, "the window must hold at least the start-up results");
        }

        if (GoodFromTop is not (null or (> 0 and < 1)))
        {
            throw new ArgumentOutOfRangeException(nameof(GoodFromTop), GoodFromTop, "the good share of the top must lie strictly between 0 and 1");
        }

        if (!(WideKernelWeight > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(WideKernelWeight), WideKernelWeight, "the wide kernel weight must be positive");
        }
    }
}
