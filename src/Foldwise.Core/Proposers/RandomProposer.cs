using Foldwise.Core.Spaces;

namespace Foldwise.Core.Proposers;

/// <summary>
/// Draws every parameter independently: reals evenly, log-reals evenly in log space, whole numbers and
/// choices evenly over their inclusive range; a fixed range gives its value.
/// </summary>
public sealed class RandomProposer : IProposer
{
    public const string ProposerName = "random";

    public string Name => ProposerName;

    public Proposal Propose(FamilyHistory history, Random random) => new(Draw(history.Space, random), ProposerName);

    public static ParameterSet Draw(ParameterSpace space, Random random)
    {
        var values = new KeyValuePair<string, double>[space.Ranges.Length];
        for (int i = 0; i < values.Length; i++)
        {
            var range = space.Ranges[i];
            values[i] = new(range.Name, Draw(range, random));
        }

        return ParameterSet.Of(values);
    }

    public static double Draw(ParameterRange range, Random random)
    {
        if (range.IsFixed)
        {
            return range.Low;
        }

        return range.Kind switch
        {
            ParameterKind.Whole or ParameterKind.OneOf => random.NextInt64((long)range.Low, (long)range.High + 1),
            ParameterKind.Log => Math.Clamp(
                Math.Exp(Math.Log(range.Low) + (random.NextDouble() * (Math.Log(range.High) - Math.Log(range.Low)))),
                range.Low,
                range.High),
            _ => Math.Clamp(range.Low + (random.NextDouble() * (range.High - range.Low)), range.Low, range.High),
        };
    }
}
