namespace Foldwise.Core.Events;

/// <summary>
/// Something a search reports while it runs: preparation steps, trials started, scored or failed, promotions, the
/// stop and the blend. Renderers (the command line, tests, a worker's screen) read these, never log text.
/// </summary>
public abstract record SearchEvent;
