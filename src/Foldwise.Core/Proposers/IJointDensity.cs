namespace Foldwise.Core.Proposers;

/// <summary>A fitted density over all modelled parameters at once, in model coordinates, that TPE draws from and scores with.</summary>
internal interface IJointDensity
{
    double LogDensity(double[] x);

    /// <summary>Fills <paramref name="into"/> with one draw; whole-number and choice parameters come back snapped.</summary>
    void Sample(Random random, double[] into);
}
