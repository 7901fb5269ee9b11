namespace Foldwise.Core.Demo;

/// <summary>How big the invented freight demo is.</summary>
public enum DemoSize
{
    /// <summary>800 training rows × 400 columns, 3,200 test rows: a whole small search runs in about a minute.</summary>
    Quick,

    /// <summary>3,000 training rows × 7,000 columns at ~94 % zeros, 12,000 test rows: wide, sparse and skewed, as the tables Foldwise is for.</summary>
    Full,
}
