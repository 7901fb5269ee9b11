namespace Foldwise.Core.Data;

/// <summary>
/// Bad input from the user: names the file and, for a cell, its 1-based line and column,
/// so the CLI can print one clear line and exit non-zero.
/// </summary>
public sealed class InputException : Exception
{
    public InputException(string file, string problem, long? line = null, int? column = null)
        : base(Format(file, problem, line, column))
    {
        File = file;
        Problem = problem;
        Line = line;
        Column = column;
    }

    public InputException()
        : this("(unknown)", "bad input")
    {
    }

    public InputException(string message)
        : this("(unknown)", message)
    {
    }

    public InputException(string message, Exception innerException)
        : base(message, innerException)
    {
        File = "(unknown)";
        Problem = message;
    }

    public string File { get; }

    public string Problem { get; }

    public long? Line { get; }

    public int? Column { get; }

    private static string Format(string file, string problem, long? line, int? column) => (line, column) switch
    {
        ({ } l, { } c) => $"{file}:{l}:{c}: {problem}",
        ({ } l, null) => $"{file}:{l}: {problem}",
        _ => $"{file}: {problem}",
    };
}
