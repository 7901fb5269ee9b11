namespace Foldwise.Core.Demo;

/// <summary>How big the invented freight demo is.</summary>
public enum DemoSize
{
    /// <summary>800 training rows × 400 columns, 2,000 test rows: a whole small search runs in about a minute.</summary>
    Quick,

    /// <summary>4,500 training rows × 5,000 columns at ~97% zeros, 45,000 test rows: the field's full character.</summary>
    Full,
}
