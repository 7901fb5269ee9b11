using System.Diagnostics;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests.Resume;

[Trait(Lane.Key, Lane.Slow)]
[Collection(ResumeProcesses.Name)]
public sealed class SoakTests
{
    [Fact]
    public async Task Three_kill_and_resume_cycles_at_random_moments_lose_and_repeat_nothing()
    {
        // Given the soak script (bench/soak/soak.sh) pointed at the foldwise.dll beside these tests
        string script = FindScript();
        var info = new ProcessStartInfo("bash") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (string arg in new[] { script, "3", "20", "--no-reference" })
        {
            info.ArgumentList.Add(arg);
        }

        info.Environment["FOLDWISE_DLL"] = Path.Combine(AppContext.BaseDirectory, "foldwise.dll");

        // When it kills and resumes a 20-trial search three times, then finishes it
        using var soak = Process.Start(info)!;
        var stderr = soak.StandardError.ReadToEndAsync();
        string output = await soak.StandardOutput.ReadToEndAsync();
        await soak.WaitForExitAsync().WaitAsync(TimeSpan.FromSeconds(180));

        // Then the store opened after every kill, no trial was lost or done twice, and the search completed
        string all = output + await stderr;
        Assert.True(soak.ExitCode == 0, all);
        Assert.Contains("store opened every time: yes", all);
        Assert.Contains("trials lost: 0", all);
        Assert.Contains("duplicates: 0", all);
        Assert.Contains("final resume: exit 0, 20 of 20 trials done, predictions.csv rows: 20 of 20", all);
    }

    private static string FindScript()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            string candidate = Path.Combine(dir.FullName, "bench", "soak", "soak.sh");
            if (File.Exists(candidate))
            {
                return candidate;
            }
        }

        throw new FileNotFoundException("bench/soak/soak.sh not found above the test folder");
    }
}
