using System.Diagnostics;

namespace Foldwise.Cli.Tests.Inspection;

/// <summary>
/// Opens a local page in headless Chromium (Debian package <c>chromium</c>) with every background fetch off,
/// and returns its screenshot, its DOM and the console messages it logged. A missing browser is a failure,
/// not a skip: CI installs it (.ci/run).
/// </summary>
public static class HeadlessChromium
{
    public const string Binary = "/usr/bin/chromium";

    public sealed record Result(int ExitCode, string Stderr, string Dom, IReadOnlyList<string> ConsoleLines);

    public static Result Open(string htmlPath, string screenshotPath, int width = 1280, int height = 2400)
    {
        Assert.True(File.Exists(Binary), $"{Binary} is missing: install it with 'apt-get update && apt-get install -y chromium' (.ci/run does this).");
        string profile = Path.Combine(Path.GetTempPath(), "foldwise-chromium-" + Guid.NewGuid().ToString("N"));
        try
        {
            string url = new Uri(Path.GetFullPath(htmlPath)).AbsoluteUri;
            var shot = Run(profile, $"--enable-logging=stderr --v=0 --screenshot={screenshotPath} --window-size={width},{height}", url);
            var dom = Run(profile + "-dom", "--dump-dom", url);

            // The page runs no script, so any console message at all (an uncaught error, a refused load) is a defect.
            var console = (shot.Stderr + "\n" + dom.Stderr).Split('\n')
                .Where(l => l.Contains(":CONSOLE", StringComparison.Ordinal) || l.Contains("Uncaught", StringComparison.Ordinal))
                .ToList();
            return new Result(shot.ExitCode != 0 ? shot.ExitCode : dom.ExitCode, shot.Stderr, dom.Stdout, console);
        }
        finally
        {
            foreach (string dir in new[] { profile, profile + "-dom" })
            {
                try
                {
                    Directory.Delete(dir, recursive: true);
                }
                catch (IOException)
                {
                    // Best effort: a temp profile.
                }
                catch (UnauthorizedAccessException)
                {
                    // Same.
                }
            }
        }
    }

    private static (int ExitCode, string Stdout, string Stderr) Run(string profile, string flags, string url)
    {
        var info = new ProcessStartInfo(Binary,
            $"--headless --no-sandbox --disable-gpu --disable-quic --no-first-run --disable-background-networking " +
            $"--disable-component-update --disable-sync --user-data-dir={profile} {flags} {url}")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        using var process = Process.Start(info)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromSeconds(90)))
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail($"chromium did not finish within 90 s: {flags}");
        }

        return (process.ExitCode, stdout.Result, stderr.Result);
    }
}
