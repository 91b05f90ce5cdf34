using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using NightSim.Cli.Plotting;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Studies;
using OxyPlot;

namespace NightSim.Cli.Commands;

/// <summary>What the study verbs (spread, sweep, year) share: options, loading, workers with progress and Ctrl+C,
/// shard files, and writing plots.</summary>
internal static class StudyCommon
{
    /// <summary>Exit code when Ctrl+C stopped a study (what finished was written).</summary>
    public const int Interrupted = 130;

    /// <summary>Writes one shard's file (refused when the shard was stopped before it finished) and says how to join
    /// the shards. <paramref name="noun"/> names the items ("runs", "points", "nights").</summary>
    public static int WriteShard<T>(ShardSpec shard, string dir, StudyHeader header, List<T> done, bool complete, int total,
        string noun, TextWriter output, TextWriter error) where T : IStudyItem
    {
        if (!complete)
        {
            error.WriteLine($"stopped: shard {shard.Index}/{shard.Count} incomplete ({done.Count} {noun} finished); no shard file written. Run the shard again.");
            return Interrupted;
        }
        string path = Path.Combine(dir, shard.FileName);
        OutputException.Guard(path, () => ShardFile.Write(path, header, shard, done.Cast<IStudyItem>()));
        output.WriteLine($"wrote {path} ({done.Count} of {total} {noun}); join the shards with: nightsim merge DIR... --out DIR");
        return CliErrors.Success;
    }

    public sealed record Options(
        Argument<FileInfo> Netlist,
        Option<FileInfo[]> Scenario,
        Option<int?> Workers,
        Option<string?> Shard,
        Option<DirectoryInfo?> Out,
        Option<string> Format,
        Option<bool> NoProgress);

    /// <summary>Adds the shared arguments and options to <paramref name="command"/>.</summary>
    /// <param name="severalScenarios">--scenario may be given more than once (the sweep runs every point in each).</param>
    public static Options Add(Command command, string defaultOut, bool severalScenarios = false)
    {
        var o = new Options(
            new Argument<FileInfo>("NETLIST") { Description = "Netlist JSON file." },
            new Option<FileInfo[]>("--scenario", "-s")
            {
                Description = severalScenarios
                    ? "Scenario JSON; repeat it to run every point in each scenario. Default: <netlist>.scenario.json beside the netlist."
                    : "Scenario JSON. Default: <netlist>.scenario.json beside the netlist.",
                HelpName = "FILE",
                Arity = severalScenarios ? ArgumentArity.ZeroOrMore : ArgumentArity.ZeroOrOne,
                AllowMultipleArgumentsPerToken = false,
            },
            new Option<int?>("--workers", "-j") { Description = "Worker threads (default: one per core). Results do not depend on it.", HelpName = "N" },
            new Option<string?>("--shard") { Description = "Run only shard i of n (1-based) and write shard-i-of-n.json; join with `nightsim merge`.", HelpName = "i/n" },
            new Option<DirectoryInfo?>("--out") { Description = $"Output folder (default {defaultOut}).", HelpName = "DIR" },
            new Option<string>("--format") { Description = "Terminal output: text or json.", DefaultValueFactory = _ => "text" },
            new Option<bool>("--no-progress") { Description = "No progress lines on standard error." });
        o.Format.AcceptOnlyFromAmong("text", "json");
        command.Arguments.Add(o.Netlist);
        command.Options.Add(o.Scenario);
        command.Options.Add(o.Workers);
        command.Options.Add(o.Shard);
        command.Options.Add(o.Out);
        command.Options.Add(o.Format);
        command.Options.Add(o.NoProgress);
        return o;
    }

    /// <summary>The one --scenario given, or null (a study that takes one scenario).</summary>
    public static string? ScenarioPath(ParseResult pr, Options o) => pr.GetValue(o.Scenario) is { Length: > 0 } f ? f[0].ToString() : null;

    public static string Tool => "nightsim " + typeof(StudyCommon).Assembly.GetName().Version?.ToString(3);

    /// <summary>Loads the netlist and scenario into a run request; input problems throw (exit 2).</summary>
    public static NightRunRequest Load(string netlistPath, string? scenarioPath, TextWriter error)
    {
        if (!File.Exists(netlistPath)) throw new StudyFileException([$"{netlistPath}: error at $: file not found. hint: check the path"]);
        NetlistLoadResult loaded = NetlistLoader.Read(netlistPath);
        foreach (NetlistError w in loaded.Warnings) error.WriteLine(w.ToString());
        if (!loaded.IsValid) throw new StudyFileException([.. loaded.Errors.Select(e => e.ToString())]);
        string? sc = scenarioPath ?? SimulateNight.CompanionScenario(netlistPath);
        if (sc is null) throw new StudyFileException([$"{netlistPath}: error: no scenario. hint: give --scenario FILE or put {Path.GetFileNameWithoutExtension(netlistPath)}.scenario.json beside the netlist"]);
        LightScenario scenario = ScenarioLoader.LoadOrThrow(sc);
        // A study keeps each run's outcome only: no night or zoom plot data is built for its runs.
        return new NightRunRequest { Netlist = loaded.Definition!, NetlistPath = netlistPath, Scenario = scenario, ScenarioPath = sc, Tool = Tool };
    }

    /// <summary>Creates the output folder; a file in its place, or a folder that cannot be made, is an output failure (exit 5).</summary>
    public static string OutDir(DirectoryInfo? given, string fallback)
    {
        string dir = (given ?? new DirectoryInfo(fallback)).FullName;
        if (File.Exists(dir)) throw new OutputException(dir, new IOException("it is a file, not a folder"));
        OutputException.Guard(dir, () => Directory.CreateDirectory(dir));
        return dir;
    }

    /// <summary>Runs the items with workers, progress lines on stderr and Ctrl+C; returns the finished items in index order
    /// and whether all finished.</summary>
    public static (List<T> Items, bool Complete) RunItems<T>(string what, IReadOnlyList<int> indices, Func<int, T> work, int? workers,
        bool progress, TextWriter error) where T : class
    {
        using var cts = new CancellationTokenSource();
        ConsoleCancelEventHandler handler = (_, e) =>
        {
            e.Cancel = true;
            if (!cts.IsCancellationRequested) error.WriteLine($"stopping: letting the {what} in progress finish, then writing what is done (Ctrl+C again to abort)");
            else Environment.Exit(Interrupted);
            cts.Cancel();
        };
        Console.CancelKeyPress += handler;
        try
        {
            var printer = progress ? new ProgressLines(what, error) : null;
            T?[] results = StudyRunner.Run(indices, work, workers ?? Environment.ProcessorCount, cts.Token, printer);
            var items = results.Where(r => r is not null).Select(r => r!).ToList();
            printer?.Done(items.Count == indices.Count);
            return (items, items.Count == indices.Count);
        }
        finally
        {
            Console.CancelKeyPress -= handler;
        }
    }

    /// <summary>Parses --shard; null for the whole study. A bad value is a usage mistake (thrown as <see cref="UsageException"/>).</summary>
    public static ShardSpec ParseShard(string? text)
    {
        if (text is null) return ShardSpec.All;
        return ShardSpec.Parse(text, out string? error) ?? throw new UsageException(error!);
    }

    /// <summary>Writes a plot as SVG and PNG, and returns its inline figure for the page.</summary>
    public static HtmlFigure Plot(PlotModel model, string dir, string stem, string caption, List<string> written, ref string? warning)
    {
        (PlotFiles files, HtmlFigure figure) = PlotWriter.WriteWithFigure(model, dir, stem, caption, stem + "-");
        written.Add(files.SvgPath);
        if (files.PngPath is not null) written.Add(files.PngPath);
        warning ??= files.Warning;
        return figure;
    }

    /// <summary>Round-trips an item through its JSON form, so a study written at once holds exactly what a joined one does.</summary>
    public static List<T> Normalise<T>(IEnumerable<T> items, Func<System.Text.Json.JsonElement, T> read) where T : IStudyItem
    {
        var list = new List<T>();
        foreach (T item in items)
        {
            byte[] bytes = StudyJson.Bytes(item.Write);
            using var doc = System.Text.Json.JsonDocument.Parse(bytes);
            list.Add(read(doc.RootElement));
        }
        return list;
    }

    /// <summary>Progress on stderr: at most one line every two seconds, after a quiet first second, with the time left.</summary>
    private sealed class ProgressLines(string what, TextWriter error) : IProgress<StudyProgress>
    {
        private readonly Stopwatch _clock = Stopwatch.StartNew();
        private readonly Lock _lock = new();
        private TimeSpan _last = TimeSpan.FromSeconds(-1);
        private bool _any;

        public void Report(StudyProgress p)
        {
            lock (_lock)
            {
                TimeSpan now = _clock.Elapsed;
                if (now < TimeSpan.FromSeconds(1) || now - _last < TimeSpan.FromSeconds(2)) return;
                _last = now;
                _any = true;
                double left = now.TotalSeconds / p.Done * (p.Total - p.Done);
                error.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{what}: {p.Done}/{p.Total} ({100.0 * p.Done / p.Total:0} %), about {ReportText.Duration(Math.Round(left))} left"));
            }
        }

        public void Done(bool complete)
        {
            if (_any) error.WriteLine(string.Create(CultureInfo.InvariantCulture, $"{what}: {(complete ? "done" : "stopped")} after {ReportText.Duration(Math.Round(_clock.Elapsed.TotalSeconds))}"));
        }
    }
}

/// <summary>A command-line mistake found after parsing (exit code 1).</summary>
internal sealed class UsageException(string message) : Exception(message);
