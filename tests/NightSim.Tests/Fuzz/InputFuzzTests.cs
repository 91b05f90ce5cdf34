using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using NightSim.Cli;
using NightSim.Inputs;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Sky;
using NightSim.Tests.Fixtures;
using Xunit.Abstractions;

namespace NightSim.Tests.Fuzz;

/// <summary>
/// 10 000 mutated netlists, scenarios and light logs (<see cref="JsonMutator"/>, <see cref="LightLogMutator"/>) through
/// `nightsim check`, in process; an input that checks valid goes on to build its circuit and its first night of light.
/// Every input must end in success or exit 2 with every problem located (file, and line:column, JSON path or line):
/// never another exit code, an unhandled exception, a stack trace, more than <see cref="CaseSeconds"/> s or more than
/// <see cref="CaseBytes"/> bytes allocated for one input. The seed is printed; NIGHTSIM_FUZZ_SEED and NIGHTSIM_FUZZ_CASES
/// set another seed or count (a failure prints the seed, the case number and the input, and keeps the input files).
/// </summary>
public sealed partial class InputFuzzTests(ITestOutputHelper log)
{
    /// <summary>The seed CI runs with (reproducible); set NIGHTSIM_FUZZ_SEED to explore others.</summary>
    private const ulong DefaultSeed = 0x6E5F_2026_1115UL;

    private const int DefaultCases = 10_000;

    /// <summary>Longest one input may take, seconds (generous: CI shares two cores with the rest of the suite).</summary>
    private const double CaseSeconds = 15;

    /// <summary>Most bytes one input may allocate: far above what a few hundred kilobytes of input needs.</summary>
    private const long CaseBytes = 1L << 30;

    private enum Target { Netlist, NetlistWithScenario, Scenario, Both, LightLog }

    private sealed record Seeds(List<(string Name, byte[] Bytes, string? Partner)> Netlists, List<(string Name, byte[] Bytes, string Partner)> Scenarios,
        List<(string Name, byte[] Bytes, string Log, byte[] LogBytes, string Partner)> Logged, List<byte[]> All);

    private sealed record Outcome(int Index, ulong CaseSeed, string Problem, string Description, string Files);

    [Fact]
    public void Ten_Thousand_Mutated_Inputs_End_In_Success_Or_A_Located_Error()
    {
        ulong seed = ulong.TryParse(Environment.GetEnvironmentVariable("NIGHTSIM_FUZZ_SEED"), NumberStyles.None, CultureInfo.InvariantCulture, out ulong s) ? s : DefaultSeed;
        int cases = int.TryParse(Environment.GetEnvironmentVariable("NIGHTSIM_FUZZ_CASES"), NumberStyles.None, CultureInfo.InvariantCulture, out int c) ? c : DefaultCases;
        log.WriteLine($"fuzz seed {seed} (NIGHTSIM_FUZZ_SEED={seed}), {cases} inputs");
        Seeds seeds = LoadSeeds();
        // Thousands of small files are written and read: in memory (tmpfs) where the system has it.
        string scratch = OperatingSystem.IsLinux() && Directory.Exists("/dev/shm") ? "/dev/shm" : Path.GetTempPath();
        string root = Path.Combine(scratch, $"nightsim-fuzz-{Environment.ProcessId}-{Guid.NewGuid():N}");
        Directory.CreateDirectory(root);
        bool hung = false;
        try
        {
            int workers = Math.Clamp(Environment.ProcessorCount, 1, 2);
            var failures = new List<Outcome>();
            var counts = new int[workers, 2];
            var current = new (int Index, long Started)[workers];
            var threads = new Thread[workers];
            var clock = Stopwatch.StartNew();
            bool stop = false;
            for (int w = 0; w < workers; w++)
            {
                int worker = w;
                string dir = Path.Combine(root, "w" + worker.ToString(CultureInfo.InvariantCulture));
                Directory.CreateDirectory(dir);
                threads[w] = new Thread(() =>
                {
                    for (int i = worker; i < cases && !Volatile.Read(ref stop); i += workers)
                    {
                        Volatile.Write(ref current[worker].Started, clock.ElapsedTicks);
                        Volatile.Write(ref current[worker].Index, i);
                        ulong caseSeed = CaseSeed(seed, i);
                        Outcome? bad;
                        bool valid = false;
                        try
                        {
                            bad = RunCase(i, caseSeed, seeds, dir, out valid);
                        }
                        catch (Exception ex)
                        {
                            bad = new Outcome(i, caseSeed, $"the harness failed: {ex}", "", "");
                        }
                        counts[worker, valid ? 0 : 1]++;
                        if (bad is not null)
                        {
                            lock (failures)
                            {
                                failures.Add(bad with { Files = Keep(dir, seed, i) });
                                if (failures.Count >= 3) return;
                            }
                        }
                    }
                    Volatile.Write(ref current[worker].Index, -1);
                }, 16 * 1024 * 1024) { IsBackground = true, Name = "fuzz " + worker.ToString(CultureInfo.InvariantCulture) };
                threads[w].Start();
            }
            // The watchdog: a case that runs too long is a hang (its thread is left behind; the test fails).
            while (threads.Any(t => t.IsAlive))
            {
                Thread.Sleep(100);
                for (int w = 0; w < workers; w++)
                {
                    int index = Volatile.Read(ref current[w].Index);
                    double seconds = (clock.ElapsedTicks - Volatile.Read(ref current[w].Started)) / (double)Stopwatch.Frequency;
                    if (index >= 0 && threads[w].IsAlive && seconds > CaseSeconds)
                    {
                        hung = true;
                        Volatile.Write(ref stop, true);
                        var (_, description) = Describe(index, CaseSeed(seed, index), seeds);
                        Assert.Fail(Report(seed, new Outcome(index, CaseSeed(seed, index), $"still running after {CaseSeconds} s (a hang)", description,
                            Keep(Path.Combine(root, "w" + w.ToString(CultureInfo.InvariantCulture)), seed, index))));
                    }
                }
            }
            int validCount = 0, errorCount = 0;
            for (int w = 0; w < workers; w++) { validCount += counts[w, 0]; errorCount += counts[w, 1]; }
            log.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{validCount + errorCount} inputs in {clock.Elapsed.TotalSeconds:F1} s on {workers} threads: {validCount} valid, {errorCount} located errors (exit 2), {failures.Count} failures"));
            if (failures.Count > 0) Assert.Fail(string.Join("\n\n", failures.OrderBy(f => f.Index).Select(f => Report(seed, f))));
            Assert.Equal(cases, validCount + errorCount);
            // The generator reaches both ends: some inputs stay valid, most are refused.
            Assert.True(validCount > cases / 50, $"only {validCount} of {cases} inputs were valid: the mutations are too coarse to reach the deeper checks");
            Assert.True(errorCount > cases / 2, $"only {errorCount} of {cases} inputs were refused");
        }
        finally
        {
            // After a hang the stuck thread still uses its folder: leave it (it is named in the failure).
            if (!hung) try { Directory.Delete(root, recursive: true); } catch (IOException) { } catch (UnauthorizedAccessException) { }
        }
    }

    /// <summary>The seed of case <paramref name="index"/>: every case can be rebuilt alone (SplitMix64 mixing).</summary>
    private static ulong CaseSeed(ulong seed, int index) => new SeededRandom(seed ^ ((ulong)index * 0x9E3779B97F4A7C15UL)).NextULong();

    private static string Report(ulong seed, Outcome o) =>
        $"fuzz case {o.Index} of seed {seed} (case seed {o.CaseSeed}; rerun with NIGHTSIM_FUZZ_SEED={seed}): {o.Problem}\n" +
        $"  mutation: {o.Description}\n  input kept in {o.Files}";

    private static Seeds LoadSeeds()
    {
        string templates = Path.Combine(RepoPaths.Root, "src", "NightSim.Cli", "Templates");
        var netlists = RepoPaths.ExampleNetlists
            .Concat(Directory.GetFiles(templates, "*.json").Where(f => !f.EndsWith("scenario.json", StringComparison.Ordinal)))
            .Concat(Directory.GetFiles(Path.Combine(AppContext.BaseDirectory, "data", "mistakes"), "*.json").Where(f => !f.EndsWith(".scenario.json", StringComparison.Ordinal)))
            .Order(StringComparer.Ordinal)
            .Select(f => (Path.GetFileName(f), File.ReadAllBytes(f), Companion(f)))
            .ToList();
        string fallback = Path.Combine(RepoPaths.Netlists, "garden-path.json");
        var scenarios = Directory.GetFiles(RepoPaths.Netlists, "*.scenario.json")
            .Concat(Directory.GetFiles(Path.Combine(RepoPaths.Netlists, "examples-tune"), "*.scenario.json"))
            .Concat(Directory.GetFiles(Path.Combine(RepoPaths.Netlists, "examples-sky"), "*.scenario.json").Where(f => !f.Contains("log", StringComparison.Ordinal)))
            .Concat(Directory.GetFiles(Path.Combine(AppContext.BaseDirectory, "data", "mistakes"), "*.scenario.json"))
            .Append(Path.Combine(templates, "scenario.json"))
            .Order(StringComparer.Ordinal)
            .Select(f => (Path.GetFileName(f), File.ReadAllBytes(f), NetlistOf(f) ?? fallback))
            .ToList();
        var logged = new[] { Path.Combine(RepoPaths.Netlists, "examples-sky", "porch-log.scenario.json"), Path.Combine(AppContext.BaseDirectory, "data", "scenarios", "good-log.scenario.json") }
            .Select(f =>
            {
                string csv = Path.ChangeExtension(Path.ChangeExtension(f, null), ".csv");
                return (Path.GetFileName(f), File.ReadAllBytes(f), Path.GetFileName(csv), File.ReadAllBytes(csv), fallback);
            })
            .ToList();
        List<byte[]> all = [.. netlists.Select(n => n.Item2), .. scenarios.Select(n => n.Item2)];
        return new Seeds(netlists, scenarios, logged, all);
    }

    private static string? Companion(string netlist)
    {
        string scenario = Path.ChangeExtension(netlist, null) + ".scenario.json";
        return File.Exists(scenario) ? scenario : null;
    }

    private static string? NetlistOf(string scenario)
    {
        string netlist = scenario[..^".scenario.json".Length] + ".json";
        return File.Exists(netlist) && !scenario.EndsWith("/scenario.json", StringComparison.Ordinal) ? netlist : null;
    }

    private static Target Choose(SeededRandom rng)
    {
        double p = rng.NextDouble();
        return p < 0.50 ? Target.Netlist : p < 0.60 ? Target.NetlistWithScenario : p < 0.90 ? Target.Scenario : p < 0.93 ? Target.Both : Target.LightLog;
    }

    /// <summary>What case <paramref name="index"/> does, rebuilt from its seed (for the hang report).</summary>
    private static (Target Target, string Description) Describe(int index, ulong caseSeed, Seeds seeds)
    {
        string dir = Path.Combine(Path.GetTempPath(), $"nightsim-fuzz-describe-{Environment.ProcessId}-{index}");
        Directory.CreateDirectory(dir);
        try
        {
            var rng = new SeededRandom(caseSeed);
            Target target = Choose(rng);
            (_, _, string description, _) = Build(target, rng, seeds, dir, index);
            return (target, description);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    /// <summary>Writes the case's input files into <paramref name="dir"/>: the netlist path, the scenario path (or null), what was mutated.</summary>
    private static (string Netlist, string? Scenario, string Description, string? LogName) Build(Target target, SeededRandom rng, Seeds seeds, string dir, int index)
    {
        string tag = "case";
        foreach (string log in Directory.GetFiles(dir, "*.csv")) File.Delete(log); // a light log belongs to its case only
        string netPath = Path.Combine(dir, tag + ".json");
        string scenPath = Path.Combine(dir, tag + ".scenario.json");
        switch (target)
        {
            case Target.Netlist or Target.NetlistWithScenario:
            {
                var (name, bytes, partner) = seeds.Netlists[(int)rng.NextInt(seeds.Netlists.Count)];
                var (mutated, what) = JsonMutator.Mutate(bytes, rng, seeds.All);
                File.WriteAllBytes(netPath, mutated);
                if (target == Target.NetlistWithScenario && partner is not null)
                {
                    File.Copy(partner, scenPath, overwrite: true);
                    return (netPath, scenPath, $"netlist {name}: {what} (with its scenario)", null);
                }
                return (netPath, null, $"netlist {name}: {what}", null);
            }
            case Target.Scenario or Target.Both:
            {
                var (name, bytes, partner) = seeds.Scenarios[(int)rng.NextInt(seeds.Scenarios.Count)];
                var (mutated, what) = JsonMutator.Mutate(bytes, rng, seeds.All);
                File.WriteAllBytes(scenPath, mutated);
                if (target == Target.Both)
                {
                    var (netMutated, netWhat) = JsonMutator.Mutate(File.ReadAllBytes(partner), rng, seeds.All);
                    File.WriteAllBytes(netPath, netMutated);
                    return (netPath, scenPath, $"scenario {name}: {what}; netlist {Path.GetFileName(partner)}: {netWhat}", null);
                }
                File.Copy(partner, netPath, overwrite: true);
                return (netPath, scenPath, $"scenario {name}: {what}", null);
            }
            default:
            {
                var (name, bytes, logName, logBytes, partner) = seeds.Logged[(int)rng.NextInt(seeds.Logged.Count)];
                File.Copy(partner, netPath, overwrite: true);
                string scenario = Encoding.UTF8.GetString(bytes);
                string logPath = Path.Combine(dir, logName);
                string what;
                double p = rng.NextDouble();
                if (p < 0.15)
                {
                    // The log is something other than a file: a device, a folder, a pipe.
                    string other = new[] { "/dev/zero", "/dev/urandom", "/dev/null", dir, Fifo(dir) }[rng.NextInt(5)];
                    if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS()) other = dir;
                    scenario = scenario.Replace($"\"{logName}\"", System.Text.Json.JsonSerializer.Serialize(other), StringComparison.Ordinal);
                    what = $"light log of {name} → {other}";
                }
                else
                {
                    (byte[] mutated, string note) = LightLogMutator.Mutate(logBytes, rng);
                    File.WriteAllBytes(logPath, mutated);
                    what = $"light log {logName} of {name}: {note}";
                }
                File.WriteAllText(scenPath, scenario);
                return (netPath, scenPath, what, logName);
            }
        }
    }

    /// <summary>A named pipe in <paramref name="dir"/> that nothing writes to (made once per folder).</summary>
    private static string Fifo(string dir)
    {
        string path = Path.Combine(dir, "pipe");
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS()) return dir;
        if (!File.Exists(path))
        {
            using Process p = Process.Start("mkfifo", [path])!;
            p.WaitForExit();
        }
        return path;
    }

    [GeneratedRegex(@"^(?<file>.+?)(:\d+:\d+)?: (error|warning) at \S")]
    private static partial Regex LocatedLine();

    [GeneratedRegex(@"^(\d+ (errors?|problems found)\.|… and \d+ more \(not shown\)\.)$")]
    private static partial Regex SummaryLine();

    /// <summary>Runs one case; null when it ended well, else what went wrong.</summary>
    private static Outcome? RunCase(int index, ulong caseSeed, Seeds seeds, string dir, out bool valid)
    {
        valid = false;
        var rng = new SeededRandom(caseSeed);
        Target target = Choose(rng);
        var (netPath, scenPath, description, _) = Build(target, rng, seeds, dir, index);
        Outcome Bad(string problem) => new(index, caseSeed, problem, description, "");
        long allocated = GC.GetAllocatedBytesForCurrentThread();
        var output = new StringWriter();
        var error = new StringWriter();
        int exit;
        try
        {
            string[] args = scenPath is null ? ["check", netPath] : ["check", netPath, scenPath];
            exit = Program.CreateRoot().Parse(args).Invoke(new InvocationConfiguration { Output = output, Error = error });
        }
        catch (Exception ex)
        {
            return Bad($"unhandled {ex.GetType().Name}: {ex.Message}");
        }
        string err = error.ToString();
        if (err.Contains("unexpected failure", StringComparison.Ordinal) || err.Contains("   at ", StringComparison.Ordinal))
            return Bad($"exit {exit}, not a located input error:\n{Excerpt(err)}");
        if (exit == 2)
        {
            string[] lines = err.ReplaceLineEndings("\n").TrimEnd('\n').Split('\n');
            if (!lines.Any(l => LocatedLine().IsMatch(l) && l.Contains(": error at ", StringComparison.Ordinal)))
                return Bad($"exit 2 without a located error:\n{Excerpt(err)}");
            foreach (string line in lines)
            {
                if (!LocatedLine().IsMatch(line) && !SummaryLine().IsMatch(line))
                    return Bad($"exit 2 with a line that names no place:\n  {Excerpt(line)}\nin\n{Excerpt(err)}");
            }
        }
        else if (exit != 0)
        {
            return Bad($"exit {exit} (expected 0 or 2):\n{Excerpt(err)}");
        }
        else
        {
            // Valid: go on as a run would, as far as building the circuit and drawing the first night's light.
            try
            {
                NetlistDefinition def = NetlistLoader.Load(netPath);
                Circuit.Build(def);
                if (scenPath is not null)
                {
                    LightScenario scenario = ScenarioLoader.LoadOrThrow(scenPath);
                    LightProfile.Create(scenario with { Nights = 1 });
                }
                valid = true;
            }
            catch (InputFileException ex) when (ex.Lines.All(l => LocatedLine().IsMatch(l)))
            {
                // Refused with located messages at run time: still an exit-2 outcome.
            }
            catch (Exception ex)
            {
                return Bad($"checked valid, then {ex.GetType().Name}: {ex.Message}");
            }
        }
        long used = GC.GetAllocatedBytesForCurrentThread() - allocated;
        if (used > CaseBytes) return Bad(string.Create(CultureInfo.InvariantCulture, $"allocated {used / 1e6:F0} MB for one input"));
        return null;
    }

    private static string Excerpt(string text)
    {
        string flat = text.Length > 2000 ? text[..2000] + "…" : text;
        return string.Concat(flat.Select(ch => char.IsControl(ch) && ch != '\n' ? $"\\u{(int)ch:X4}" : ch.ToString()));
    }

    /// <summary>Copies case <paramref name="index"/>'s files out of the work folder and prints the input (escaped, cut).</summary>
    private static string Keep(string dir, ulong seed, int index)
    {
        try
        {
            return KeepFiles(dir, seed, index);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return $"{dir} (could not copy the input: {ex.Message})";
        }
    }

    private static string KeepFiles(string dir, ulong seed, int index)
    {
        string keep = Path.Combine(Path.GetTempPath(), $"nightsim-fuzz-failure-{seed}-{index}");
        Directory.CreateDirectory(keep);
        var shown = new StringBuilder();
        string tag = "case";
        foreach (string f in Directory.GetFiles(dir).Where(f => Path.GetFileName(f).StartsWith(tag + ".", StringComparison.Ordinal) || f.EndsWith(".csv", StringComparison.Ordinal)))
        {
            File.Copy(f, Path.Combine(keep, Path.GetFileName(f)), overwrite: true);
            string text = Encoding.UTF8.GetString(File.ReadAllBytes(f).AsSpan(0, (int)Math.Min(new FileInfo(f).Length, 1500)));
            shown.Append("\n  --- ").Append(Path.GetFileName(f)).Append(" ---\n").Append(Excerpt(text));
        }
        return keep + shown;
    }
}
