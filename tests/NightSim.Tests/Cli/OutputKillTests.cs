using System.Diagnostics;
using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using NightSim.Reporting;
using NightSim.Tests.Fixtures;
using Xunit.Abstractions;

namespace NightSim.Tests.Cli;

/// <summary>
/// The real `nightsim simulate`, killed with SIGKILL at seeded random moments while it runs into a folder holding the
/// outputs of an earlier run: after every kill the folder holds exactly one complete set, the earlier one or the new
/// one, never a mix; and after the next complete run nothing a killed run left behind remains beside the folder.
/// </summary>
public sealed partial class OutputKillTests(ITestOutputHelper log)
{
    private const ulong Seed = 20_251_202;

    private const int Trials = 7;

    /// <summary>Two runs whose sets differ in every file: one night with plots, two nights without.</summary>
    private static readonly string[][] s_settings = [["--nights", "1"], ["--nights", "2", "--no-plots"]];

    [GeneratedRegex(@"""cpuSeconds"":\s*[-+0-9.eE]+")]
    private static partial Regex CpuSeconds();

    [GeneratedRegex(@"[0-9]+")]
    private static partial Regex Digits();

    [Fact]
    public void Sigkill_At_Any_Moment_Leaves_The_Earlier_Set_Or_The_New_One_Whole()
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS()) return; // SIGKILL is a POSIX signal
        string root = Path.Combine(Path.GetTempPath(), "nightsim-kill-" + Guid.NewGuid().ToString("N"));
        string outDir = Path.Combine(root, "out");
        Directory.CreateDirectory(root);
        try
        {
            // The two complete sets, and how long each run takes here.
            var sets = new Dictionary<string, byte[]>[2];
            var seconds = new double[2];
            for (int k = 0; k < 2; k++)
            {
                string reference = Path.Combine(root, "reference-" + k.ToString(CultureInfo.InvariantCulture));
                var clock = Stopwatch.StartNew();
                var err = new StringBuilder();
                using (Process p = Start(reference, s_settings[k], err))
                {
                    p.WaitForExit();
                    Assert.True(p.ExitCode == 0, $"reference run {k} exited {p.ExitCode}: {err}");
                }
                seconds[k] = clock.Elapsed.TotalSeconds;
                sets[k] = Fingerprint(reference);
                if (k == 0) Directory.Move(reference, outDir); // the folder starts with a complete earlier set
                else Directory.Delete(reference, recursive: true);
            }
            Assert.NotEqual(sets[0].Keys.Order(), sets[1].Keys.Order());

            int current = Which(outDir, sets, "start");
            var rng = new SeededRandom(Seed);
            var lines = new List<string>();
            for (int trial = 0; trial < Trials; trial++)
            {
                int next = 1 - current;
                // Most kills fall late, where the outputs are written and put in place.
                double delay = seconds[next] * (0.25 + 0.85 * rng.NextDouble());
                using Process p = Start(outDir, s_settings[next], new StringBuilder());
                bool finished = p.WaitForExit(TimeSpan.FromSeconds(delay));
                if (!finished) p.Kill(); // SIGKILL on Unix
                p.WaitForExit();
                current = Which(outDir, sets, string.Create(CultureInfo.InvariantCulture, $"trial {trial} (kill after {delay:F2} s, seed {Seed})"));
                lines.Add(string.Create(CultureInfo.InvariantCulture,
                    $"trial {trial}: {(finished ? "finished before" : "killed")} at {delay:F2} s → the {(current == next ? "new" : "earlier")} set"));
            }
            // One more complete run: no staging folder or earlier set of a killed run outlives it.
            var last = new StringBuilder();
            using (Process p = Start(outDir, s_settings[1 - current], last))
            {
                p.WaitForExit();
                Assert.True(p.ExitCode == 0, $"the last run exited {p.ExitCode}: {last}");
            }
            Assert.Equal(1 - current, Which(outDir, sets, "after the last run"));
            Assert.Equal(["out"], Directory.GetFileSystemEntries(root).Select(f => Path.GetFileName(f)!).ToArray());
            log.WriteLine($"seed {Seed}; runs took {seconds[0]:F1} s and {seconds[1]:F1} s");
            foreach (string l in lines) log.WriteLine(l);
        }
        finally
        {
            Directory.Delete(root, recursive: true);
        }
    }

    private static Process Start(string outDir, string[] settings, StringBuilder error)
    {
        var start = new ProcessStartInfo("dotnet")
        {
            RedirectStandardError = true,
            RedirectStandardOutput = true,
        };
        foreach (string a in (string[])[Path.Combine(AppContext.BaseDirectory, "nightsim.dll"), "simulate",
            Path.Combine(RepoPaths.Netlists, "garden-path.json"), "--out", outDir, "--no-progress", .. settings])
            start.ArgumentList.Add(a);
        Process p = Process.Start(start)!;
        // Drain the pipes so the run never waits on them.
        p.OutputDataReceived += (_, _) => { };
        p.ErrorDataReceived += (_, e) =>
        {
            lock (error) error.AppendLine(e.Data);
        };
        p.BeginOutputReadLine();
        p.BeginErrorReadLine();
        return p;
    }

    /// <summary>Every file of a folder except the manifest, with the run's CPU time (which differs run to run) masked.</summary>
    private static Dictionary<string, byte[]> Fingerprint(string dir)
    {
        var files = new Dictionary<string, byte[]>(StringComparer.Ordinal);
        foreach (string f in Directory.GetFiles(dir, "*", SearchOption.AllDirectories))
        {
            string rel = Path.GetRelativePath(dir, f).Replace(Path.DirectorySeparatorChar, '/');
            if (rel == OutputManifest.FileName) continue;
            byte[] bytes = File.ReadAllBytes(f);
            if (rel == "report.json") bytes = Encoding.UTF8.GetBytes(CpuSeconds().Replace(Encoding.UTF8.GetString(bytes), "cpu"));
            else if (rel == "report.html") bytes = Encoding.UTF8.GetBytes(Digits().Replace(Encoding.UTF8.GetString(bytes), "#"));
            files[rel] = bytes;
        }
        return files;
    }

    /// <summary>Which of the two complete sets the folder holds (its manifest listing exactly those files); fails when
    /// it holds neither whole.</summary>
    private static int Which(string dir, Dictionary<string, byte[]>[] sets, string when)
    {
        Dictionary<string, byte[]> now = Fingerprint(dir);
        for (int k = 0; k < sets.Length; k++)
        {
            if (now.Count == sets[k].Count && now.All(f => sets[k].TryGetValue(f.Key, out byte[]? b) && b.AsSpan().SequenceEqual(f.Value)))
            {
                Assert.Equal(sets[k].Keys.Order(StringComparer.Ordinal), OutputManifest.Read(dir)!.Order(StringComparer.Ordinal));
                return k;
            }
        }
        string Describe(int k) => string.Join(", ", now.Keys.Order(StringComparer.Ordinal).Select(f =>
            f + (!sets[k].TryGetValue(f, out byte[]? b) ? " (not in it)" : b.AsSpan().SequenceEqual(now[f]) ? "" : " (differs)")));
        Assert.Fail($"{when}: the folder holds neither complete set.\n  against the earlier set: {Describe(0)}\n  against the new set: {Describe(1)}");
        return -1;
    }
}
