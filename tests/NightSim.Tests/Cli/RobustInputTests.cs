using System.CommandLine;
using System.Globalization;
using System.Text;
using NightSim.Cli;
using NightSim.Netlist;
using NightSim.Tests.Fixtures;

namespace NightSim.Tests.Cli;

/// <summary>Bad bytes, bad option values and unwritable outputs give located messages and their own exit codes.</summary>
public sealed class RobustInputTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "nightsim-robust-" + Guid.NewGuid().ToString("N"));

    public RobustInputTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    private string Write(string name, byte[] bytes)
    {
        string path = Path.Combine(_dir, name);
        File.WriteAllBytes(path, bytes);
        return path;
    }

    private static string Rc => Path.Combine(RepoPaths.Netlists, "rc-step.json");

    [Fact]
    public void Invalid_Utf8_Is_Located_By_Byte_Offset_And_Line_Column()
    {
        // 0xFF never occurs in UTF-8 (The Unicode Standard, ch. 3, Table 3-7, well-formed UTF-8 byte sequences).
        string path = Write("latin1.json", [.. "{ \"name\": \"a"u8, 0xFF, .. "b\", \"parts\": [] }"u8]);
        (int exit, _, string err) = Run("check", path);
        Assert.Equal(2, exit);
        Assert.Contains($"{path}:1:13: error at $: the file is not valid UTF-8: byte 0xFF at byte offset 12", err, StringComparison.Ordinal);
        Assert.Contains("hint: save the file as UTF-8", err, StringComparison.Ordinal);
        Assert.DoesNotContain("unexpected failure", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Binary_File_And_Utf16_And_Cut_Short_Files_Exit_2_With_A_Hint()
    {
        (int exit, _, string err) = Run("check", Write("bin.json", [0x7F, 0x45, 0x4C, 0x46, 0x02, 0x01, 0x01, 0x00, 0x00]));
        Assert.Equal(2, exit);
        Assert.Contains("NUL byte at byte offset 7", err, StringComparison.Ordinal);

        (exit, _, err) = Run("check", Write("utf16.json", Encoding.Unicode.GetPreamble().Concat(Encoding.Unicode.GetBytes("{ }")).ToArray()));
        Assert.Equal(2, exit);
        Assert.Contains("UTF-16", err, StringComparison.Ordinal);

        byte[] whole = File.ReadAllBytes(Rc);
        (exit, _, err) = Run("check", Write("cut.json", whole[..(whole.Length / 2)]));
        Assert.Equal(2, exit);
        Assert.Contains("the file ends before the JSON does", err, StringComparison.Ordinal);

        // A multi-byte character cut in half at the very end: "µ" is C2 B5 in UTF-8.
        (exit, _, err) = Run("check", Write("cut-char.json", [.. "{ \"name\": \""u8, 0xC2]));
        Assert.Equal(2, exit);
        Assert.Contains("cut short", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Scenario_With_Invalid_Utf8_Exits_2_Naming_The_Path_Given()
    {
        string scenario = Write("bad.scenario.json", [.. "{ \"name\": \"x"u8, 0xE9, .. "\" }"u8]);
        string outDir = Path.Combine(_dir, "out");
        (int exit, _, string err) = Run("simulate", Path.Combine(RepoPaths.Netlists, "garden-path.json"), "--scenario", scenario, "--out", outDir, "--no-progress");
        Assert.Equal(2, exit);
        Assert.Contains($"{scenario}:1:13: error at $: the file is not valid UTF-8", err, StringComparison.Ordinal);
        Assert.DoesNotContain("unexpected failure", err, StringComparison.Ordinal);
        Assert.False(Directory.Exists(outDir));
    }

    [Theory]
    [InlineData("--nights", "0")]
    [InlineData("--nights", "-1")]
    [InlineData("--nights", "3661")]
    [InlineData("--nights", "abc")]
    public void Bad_Night_Counts_Are_Command_Line_Mistakes(string option, string value)
    {
        (int exit, _, string err) = Run("simulate", Path.Combine(RepoPaths.Netlists, "garden-path.json"), option, value, "--out", Path.Combine(_dir, "o"));
        Assert.Equal(1, exit);
        Assert.Contains("--nights: ", err, StringComparison.Ordinal);
        Assert.Contains("give 1 to 3660 nights", err, StringComparison.Ordinal);
        Assert.DoesNotContain("System.", err, StringComparison.Ordinal);
        Assert.DoesNotContain("Int32", err, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("--for", "-1s")]
    [InlineData("--for", "NaN")]
    [InlineData("--for", "1,5s")]
    [InlineData("--lux", "NaN")]
    [InlineData("--lux", "-3")]
    public void Bad_Transient_Values_Are_Command_Line_Mistakes(string option, string value)
    {
        string[] args = option == "--for"
            ? ["simulate", Rc, "--for", value, "--out", Path.Combine(_dir, "o")]
            : ["simulate", Rc, "--for", "1s", "--lux", value, "--out", Path.Combine(_dir, "o")];
        (int exit, _, string err) = Run(args);
        Assert.Equal(1, exit);
        Assert.StartsWith(option + ": ", err, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(_dir, "o")));
    }

    [Fact]
    public void Numbers_Read_The_Same_Under_A_Decimal_Comma_Culture()
    {
        CultureInfo before = CultureInfo.CurrentCulture;
        try
        {
            CultureInfo.CurrentCulture = CultureInfo.GetCultureInfo("de-DE"); // writes 8,6 for 8.6
            (int exit, string output, string err) = Run("sky", "--lat", "52.1", "--lon", "8.6", "--tz", "UTC", "--date", "2026-12-21", "--format", "json");
            Assert.True(exit == 0, err);
            Assert.Contains("\"sunset\"", output, StringComparison.Ordinal);

            (exit, _, err) = Run("sky", "--lat", "52.1", "--lon", "8,6", "--tz", "UTC", "--date", "2026-12-21");
            Assert.Equal(1, exit);
            Assert.Contains("--lon: \"8,6\" has a decimal comma. hint: write a decimal point", err, StringComparison.Ordinal);

            (exit, _, err) = Run("sky", "--lat", "52.1", "--lon", "8.6", "--tz", "UTC", "--date", "2026-12-21", "--days", "2,5");
            Assert.Equal(1, exit);
            Assert.Contains("--days: \"2,5\" is not a whole number", err, StringComparison.Ordinal);

            (exit, _, err) = Run("simulate", Rc, "--for", "1s", "--lux", "2,5", "--out", Path.Combine(_dir, "o"));
            Assert.Equal(1, exit);
            Assert.Contains("decimal comma", err, StringComparison.Ordinal);

            // A decimal point works under the same culture: 0.5 s, not 5 s.
            (exit, output, err) = Run("simulate", Rc, "--for", "0.5s", "--out", Path.Combine(_dir, "ok"));
            Assert.True(exit == 0, err);
            Assert.Contains("simulated 500 ms", output, StringComparison.Ordinal);
        }
        finally
        {
            CultureInfo.CurrentCulture = before;
        }
    }

    [Fact]
    public void Unwritable_Output_Exits_5_Naming_The_Path()
    {
        string blocker = Write("a-file", [1]);
        string outDir = Path.Combine(blocker, "sub");
        (int exit, _, string err) = Run("simulate", Rc, "--for", "0.2s", "--out", outDir);
        Assert.Equal(CliErrors.OutputFailed, exit);
        Assert.Equal(5, exit);
        Assert.Contains($"{outDir}: cannot write", err, StringComparison.Ordinal);
        Assert.Contains("hint: check free disk space", err, StringComparison.Ordinal);

        (exit, _, err) = Run("simulate", Path.Combine(RepoPaths.Netlists, "garden-path.json"), "--out", blocker, "--no-progress");
        Assert.Equal(5, exit);
        Assert.Contains("it is a file, not a folder", err, StringComparison.Ordinal);
    }

    [Fact]
    public void Error_Output_Shows_The_First_20_Problems_And_Counts_The_Rest()
    {
        var parts = Enumerable.Range(0, 30).Select(i => $"{{ \"id\": \"X{i}\", \"kind\": \"{new string('q', 500)}\", \"nodes\": [\"a\", \"gnd\"] }}");
        string path = Write("many.json", Encoding.UTF8.GetBytes($"{{ \"name\": \"many\", \"parts\": [{string.Join(",\n", parts)}] }}"));
        (int exit, _, string err) = Run("check", path);
        Assert.Equal(2, exit);
        string[] lines = err.ReplaceLineEndings("\n").TrimEnd().Split('\n');
        Assert.Equal(20, lines.Count(l => l.Contains("unknown kind", StringComparison.Ordinal)));
        Assert.Contains("… and 10 more (not shown).", lines);
        Assert.Equal("30 errors.", lines[^1]);
        Assert.All(lines, l => Assert.True(l.Length <= CliErrors.MaxLineLength + 1, l));
        Assert.DoesNotContain(new string('q', 100), err, StringComparison.Ordinal);
    }

    [Fact]
    public void Night_Run_That_Fails_Removes_The_Folder_It_Created()
    {
        // The scenario injects noise at a node the netlist lacks: found once the run starts, after the folder exists.
        string scenario = File.ReadAllText(Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.scenario.json"))
            .Replace("\"node\": \"trig\"", "\"node\": \"nowhere\"", StringComparison.Ordinal);
        string scenarioPath = Write("noise.scenario.json", Encoding.UTF8.GetBytes(scenario));
        string outDir = Path.Combine(_dir, "night");
        (int exit, _, string err) = Run("simulate", Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.json"), "--scenario", scenarioPath, "--out", outDir, "--no-progress", "--no-plots");
        Assert.Equal(2, exit);
        Assert.Contains("nowhere", err, StringComparison.Ordinal);
        Assert.False(Directory.Exists(outDir));
    }

    [Fact]
    public void An_Escape_Character_In_Names_Does_Not_Break_Plots_Or_The_Page()
    {
        string netlist = File.ReadAllText(Path.Combine(RepoPaths.Netlists, "garden-path.json"));
        int at = netlist.IndexOf("\"name\": \"", StringComparison.Ordinal) + "\"name\": \"".Length;
        netlist = netlist[..at] + "drive\\u001bway " + netlist[at..];
        string scenario = File.ReadAllText(Path.Combine(RepoPaths.Netlists, "garden-path.scenario.json"));
        at = scenario.IndexOf("\"name\": \"Invented", StringComparison.Ordinal) + "\"name\": \"".Length;
        scenario = scenario[..at] + "drive\\u001bway " + scenario[at..];
        string net = Write("esc.json", Encoding.UTF8.GetBytes(netlist));
        string scen = Write("esc.scenario.json", Encoding.UTF8.GetBytes(scenario));
        string outDir = Path.Combine(_dir, "esc-out");
        (int exit, string output, string err) = Run("simulate", net, "--scenario", scen, "--out", outDir, "--no-progress");
        Assert.True(exit == 0, err);
        Assert.DoesNotContain('\u001b', output);
        string html = File.ReadAllText(Path.Combine(outDir, "report.html"));
        Assert.Contains("drive\uFFFDway", html, StringComparison.Ordinal);
        Assert.DoesNotContain('\u001b', html);
        foreach (string svg in Directory.GetFiles(outDir, "*.svg"))
        {
            string text = File.ReadAllText(svg);
            Assert.DoesNotContain('\u001b', text);
            System.Xml.Linq.XDocument.Parse(text); // well-formed XML (W3C XML 1.0 §2.2 forbids U+001B in a document)
        }
    }

    [Fact]
    public void Fit_Errors_Give_Line_And_Column_In_The_Scenario()
    {
        string scenario = File.ReadAllText(Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.scenario.json"))
            .Replace("\"node\": \"trig\"", "\"node\": \"nowhere\"", StringComparison.Ordinal);
        string scenarioPath = Write("fit.scenario.json", Encoding.UTF8.GetBytes(scenario));
        string[] lines = scenario.ReplaceLineEndings("\n").Split('\n');
        int line = Array.FindIndex(lines, l => l.Contains("\"nowhere\"", StringComparison.Ordinal)) + 1;
        int column = lines[line - 1].IndexOf("\"nowhere\"", StringComparison.Ordinal) + 1;
        (int exit, _, string err) = Run("check", Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.json"), scenarioPath);
        Assert.Equal(2, exit);
        Assert.Contains($"{scenarioPath}:{line}:{column}: error at $.events[0].node", err, StringComparison.Ordinal);
    }

    /// <summary>Runs the command on another thread; a run still going after 60 s is a hang (the test fails).</summary>
    private static (int Exit, string Out, string Err) RunWithin(params string[] args)
    {
        Task<(int, string, string)> run = Task.Run(() => Run(args));
        Assert.True(run.Wait(TimeSpan.FromSeconds(60)), $"nightsim {string.Join(' ', args)} did not end: it waits on its input");
        return run.Result;
    }

    [Fact]
    public void A_Named_Pipe_Or_A_Device_As_Input_Is_Refused_At_Once()
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS()) return; // named pipes and /dev/zero are POSIX
        string pipe = Path.Combine(_dir, "pipe.json");
        using (var mk = System.Diagnostics.Process.Start("mkfifo", [pipe])!) mk.WaitForExit();
        Assert.True(File.Exists(pipe));

        // Nothing ever writes to the pipe: opening it to read the usual way would wait for ever.
        (int exit, _, string err) = RunWithin("check", pipe);
        Assert.Equal(2, exit);
        Assert.Contains($"{pipe}: error at $: the file is not a regular file (a named pipe", err, StringComparison.Ordinal);

        (exit, _, err) = RunWithin("check", Rc, pipe);
        Assert.Equal(2, exit);
        Assert.Contains($"{pipe}: error at $: the file is not a regular file", err, StringComparison.Ordinal);

        (exit, _, err) = RunWithin("simulate", Path.Combine(RepoPaths.Netlists, "garden-path.json"), "--scenario", pipe, "--out", Path.Combine(_dir, "o"), "--no-progress");
        Assert.Equal(2, exit);
        Assert.Contains("not a regular file", err, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(_dir, "o")));

        // A device gives bytes without end (/dev/zero) and says it has none: refused at the first bytes, not after 64 MB.
        (exit, _, err) = RunWithin("check", "/dev/zero");
        Assert.Equal(2, exit);
        Assert.Contains("/dev/zero: error at $: the file is not a regular file (a device)", err, StringComparison.Ordinal);

        // A light log read from a pipe or a device.
        string scenario = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "data", "scenarios", "good-log.scenario.json"));
        foreach (string log in (string[])[pipe, "/dev/urandom"])
        {
            string path = Write("log.scenario.json", Encoding.UTF8.GetBytes(scenario.Replace("\"good-log.csv\"", System.Text.Json.JsonSerializer.Serialize(log), StringComparison.Ordinal)));
            (exit, _, err) = RunWithin("check", Rc, path);
            Assert.Equal(2, exit);
            Assert.Contains($"error at $.lightLog.file: light log \"{log}\" is not a regular file", err, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Half_A_Surrogate_Pair_In_A_String_Is_Located()
    {
        // RFC 8259 §8.2: "\ud800" alone is allowed by the JSON grammar but is no Unicode character.
        string netlist = File.ReadAllText(Rc).Replace("\"name\": \"rc-step\"", "\"name\": \"rc\\ud800step\"", StringComparison.Ordinal);
        string path = Write("surrogate.json", Encoding.UTF8.GetBytes(netlist));
        string[] lines = netlist.ReplaceLineEndings("\n").Split('\n');
        int line = Array.FindIndex(lines, l => l.Contains("\\ud800", StringComparison.Ordinal)) + 1;
        int column = lines[line - 1].IndexOf("\"rc\\ud800", StringComparison.Ordinal) + 1;
        (int exit, _, string err) = Run("check", path);
        Assert.Equal(2, exit);
        Assert.Contains($"{path}:{line}:{column}: error at $: the string here holds a \\u escape between \\ud800 and \\udfff without its other half", err, StringComparison.Ordinal);

        string scenario = File.ReadAllText(Path.Combine(RepoPaths.Netlists, "garden-path.scenario.json"))
            .Replace("\"sky\": \"clear\"", "\"sky\": \"clear\\udc00\"", StringComparison.Ordinal);
        string scenarioPath = Write("surrogate.scenario.json", Encoding.UTF8.GetBytes(scenario));
        (exit, _, err) = Run("check", Path.Combine(RepoPaths.Netlists, "garden-path.json"), scenarioPath);
        Assert.Equal(2, exit);
        Assert.Contains($"{scenarioPath}:", err, StringComparison.Ordinal);
        Assert.Contains("without its other half", err, StringComparison.Ordinal);
        Assert.DoesNotContain("unexpected failure", err, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("\"seconds\": 4", "\"seconds\": 1e308", "$.events[0].seconds")]
    [InlineData("\"start\": \"2026-11-20\"", "\"start\": \"9999-12-31\"", "$.start")]
    public void Values_That_Would_Reach_Past_The_Calendar_Are_Refused(string from, string to, string jsonPath)
    {
        string scenario = File.ReadAllText(Path.Combine(RepoPaths.Netlists, "garden-path-driveway.scenario.json")).Replace(from, to, StringComparison.Ordinal);
        Assert.Contains(to, scenario, StringComparison.Ordinal);
        string path = Write("far.scenario.json", Encoding.UTF8.GetBytes(scenario));
        (int exit, _, string err) = Run("check", Path.Combine(RepoPaths.Netlists, "garden-path-driveway.json"), path);
        Assert.Equal(2, exit);
        Assert.Contains($"error at {jsonPath}: ", err, StringComparison.Ordinal);
    }
}
