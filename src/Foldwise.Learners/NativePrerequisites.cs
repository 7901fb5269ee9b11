using System.Runtime.InteropServices;

namespace Foldwise.Learners;

/// <summary>
/// The system libraries LightGBM's native code needs beside itself: OpenMP's runtime (libgomp) on Linux, and the
/// Visual C++ runtime with its OpenMP library on Windows. Neither ships with Foldwise; a worker names the missing one.
/// </summary>
public static class NativePrerequisites
{
    private static readonly (string Library, string Remedy)[] Linux =
    [
        ("libgomp.so.1", "OpenMP's runtime; on Debian or Ubuntu: sudo apt-get install libgomp1, on Fedora: sudo dnf install libgomp"),
    ];

    private static readonly (string Library, string Remedy)[] Windows =
    [
        ("vcruntime140.dll", "the Visual C++ runtime; install the Microsoft Visual C++ Redistributable (x64)"),
        ("vcomp140.dll", "the Visual C++ OpenMP runtime; install the Microsoft Visual C++ Redistributable (x64)"),
    ];

    /// <summary>One line per library this machine cannot load, naming it and how to install it; empty when all load.</summary>
    public static IReadOnlyList<string> Missing()
    {
        var needed = OperatingSystem.IsLinux() ? Linux : OperatingSystem.IsWindows() ? Windows : [];
        var missing = new List<string>();
        foreach (var (library, remedy) in needed)
        {
            if (NativeLibrary.TryLoad(library, out var handle))
            {
                NativeLibrary.Free(handle);
            }
            else
            {
                missing.Add($"{library} is missing ({remedy})");
            }
        }

        return missing;
    }
}
