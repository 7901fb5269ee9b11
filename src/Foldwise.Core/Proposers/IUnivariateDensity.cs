namespace Foldwise.Core.Proposers;

/// <summary>A fitted one-parameter density in model coordinates that TPE can draw from and evaluate.</summary>
internal interface IUnivariateDensity
{
    double Density(double x);

    double Sample(Random random);
}
