namespace Foldwise.Core.Definition;

/// <summary>The words a definition file uses for one enum's values, in one table for reading and writing.</summary>
internal sealed class NameTable<T>(params (string Name, T Value)[] entries)
    where T : struct, Enum
{
    public IReadOnlyList<string> Names { get; } = [.. entries.Select(e => e.Name)];

    public string NameOf(T value) => entries.First(e => e.Value.Equals(value)).Name;

    public bool TryParse(string name, out T value)
    {
        foreach (var (n, v) in entries)
        {
            if (n == name)
            {
                value = v;
                return true;
            }
        }

        value = default;
        return false;
    }
}
