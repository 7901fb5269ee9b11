namespace Foldwise.Core.Definition;

/// <summary>How new candidates' parameters are chosen. The default is <see cref="Tpe"/>.</summary>
public enum ProposerKind
{
    Random,

    /// <summary>Tree-structured Parzen Estimator (Bergstra et al., NeurIPS 2011), after a random start.</summary>
    Tpe,
}
