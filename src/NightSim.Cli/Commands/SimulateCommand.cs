using System.CommandLine;
using System.Globalization;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Runs;

using NightSim.Results;
using NightSim.Transient;
using NightSim.Units;
using NightSim.Cli.Rendering;
using NightSim.Devices;
using NightSim.Devices.Light;
using NightSim.Mna;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim simulate NETLIST --for DURATION [--lux VALUE] [--start ramp|operating-point] [--out DIR] [--nodes a,b]`:
/// a plain transient run from power-up (or the operating point); writes DIR/trace.csv and DIR/statistics.json.</summary>
internal static class SimulateCommand
{
    public static Command Create()
    {
        var netlist = new Argument<FileInfo>("NETLIST") { Description = "Netlist JSON file." };
        var duration = new Option<string?>("--for")
        {
            Description = "Plain transient without a scenario: simulated time with s, ms, us, min, h or d (e.g. 10s, 90min, 24h).",
            HelpName = "DURATION",
        };
        var scenario = new Option<FileInfo?>("--scenario", "-s")
        {
            Description = "Scenario JSON (site, dates, weather, light events). Default: <netlist>.scenario.json beside the netlist, if present.",
            HelpName = "FILE",
        };
        var nights = CliNumbers.Whole<int?>("--nights", "Number of nights, 1 to 3660 (overrides the scenario).", 1, InputLimits.MaxNights, "nights", "-n");
        nights.HelpName = "N";
        var format = new Option<string>("--format") { Description = "Terminal output: text (table of nights) or json (report.json).", DefaultValueFactory = _ => "text" };
        format.AcceptOnlyFromAmong("text", "json");
        var noProgress = new Option<bool>("--no-progress") { Description = "No progress bar or progress lines." };
        var failOn = new Option<string?>("--fail-on") { Description = "Exit with code 4 when a finding is at or above this severity.", HelpName = "warning|error" };
        failOn.AcceptOnlyFromAmong("warning", "error");
        var accuracy = new Option<string>("--accuracy")
        {
            Description = "Solver tolerances: loose (faster; a way past a stage that will not settle), normal, or tight.",
            DefaultValueFactory = _ => "normal",
        };
        accuracy.AcceptOnlyFromAmong("loose", "normal", "tight");
        var mainsDetail = new Option<string>("--mains-detail")
        {
            Description = "Night runs of a mains-fed (capacitive-dropper) design: windows (the supply cycle-averaged, with full mains detail around every event, before every light event and in one standby sample; fast) or full (every mains cycle simulated, for comparison: several CPU-hours per night).",
            DefaultValueFactory = _ => "windows",
        };
        mainsDetail.AcceptOnlyFromAmong("windows", "full");
        var noPlots = new Option<bool>("--no-plots") { Description = "Skip the SVG/PNG plots (faster; report.html then has no figures)." };
        var lux = new Option<string?>("--lux")
        {
            Description = "Constant illuminance, lux (default 0), for --for runs: applies to every light sensor without its own lux or lux points; a sensor with its own keeps them (a warning names it).",
            HelpName = "VALUE",
        };
        var outDir = new Option<DirectoryInfo>("--out")
        {
            Description = "Output folder for trace.csv and statistics.json (created if missing).",
            DefaultValueFactory = _ => new DirectoryInfo("nightsim-out"),
            HelpName = "DIR",
        };
        var start = new Option<string>("--start")
        {
            Description = "How a --for run starts: ramp (power-up: capacitors at 0 V, every source scaled from 0 to full over the first 1 ms) or operating-point (from the DC operating point at t = 0, no ramp).",
            DefaultValueFactory = _ => "ramp",
            HelpName = "ramp|operating-point",
        };
        start.AcceptOnlyFromAmong("ramp", "operating-point");
        var nodes = new Option<string?>("--nodes") { Description = "Comma-separated nodes to record (default: every node).", HelpName = "a,b" };
        var command = new Command("simulate",
            "Run a netlist through the nights of a scenario and report when the load switched on, for how long and why " +
            "(report.json, report.html, trace.csv, plots). Without a scenario, --for [--lux] runs a plain transient " +
            "(trace.csv, statistics.json). Exit 1 on a command-line mistake, 2 on invalid input, 3 when the simulation fails, 4 with --fail-on, 5 when an output cannot be written.");
        command.Arguments.Add(netlist);
        command.Options.Add(duration);
        command.Options.Add(lux);
        command.Options.Add(outDir);
        command.Options.Add(nodes);
        command.Options.Add(start);
        command.Options.Add(scenario);
        command.Options.Add(nights);
        command.Options.Add(format);
        command.Options.Add(noProgress);
        command.Options.Add(failOn);
        command.Options.Add(noPlots);
        command.Options.Add(accuracy);
        command.Options.Add(mainsDetail);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) =>
        {
            FileInfo net = pr.GetValue(netlist)!;
            if (!net.Exists)
            {
                error.WriteLine($"{net}: error at $: file not found. hint: check the path");
                return CliErrors.InvalidInput;
            }
            string? durationText = pr.GetValue(duration);
            string? scenarioPath = pr.GetValue(scenario)?.ToString()
                ?? (durationText is null ? SimulateNight.CompanionScenario(net.ToString()) : null);
            if (scenarioPath is not null)
            {
                if (pr.GetValue(lux) is not null)
                    error.WriteLine($"warning: --lux does not apply to a night run: the scenario {scenarioPath} lights the sensors. hint: use --for DURATION for a plain transient under constant light");
                var settings = new SimulateNight.Settings(net.ToString(), scenarioPath, pr.GetValue(nights), pr.GetValue(outDir)!,
                    pr.GetValue(format)!, pr.GetValue(noProgress), pr.GetValue(failOn), pr.GetValue(noPlots), pr.GetValue(accuracy)!, pr.GetValue(mainsDetail)!);
                return SimulateNight.Execute(settings, Terminal.For(output), output, error);
            }
            if (durationText is null)
            {
                error.WriteLine($"{net}: no scenario given and no {Path.GetFileNameWithoutExtension(net.Name)}.scenario.json beside it. hint: add --scenario FILE for a night run, or --for DURATION (e.g. --for 10s) for a plain transient");
                return CliErrors.Usage;
            }
            StartMode startMode = pr.GetValue(start) == "operating-point" ? StartMode.OperatingPoint : StartMode.PowerUp;
            return Execute(net, durationText, pr.GetValue(lux), pr.GetValue(outDir)!, pr.GetValue(nodes), startMode, pr.GetValue(accuracy)!, output, error);
        }));
        return command;
    }

    /// <summary>Traces the terminal summary of a plain transient lists.</summary>
    private const int SummaryTraces = 8;

    private static int Execute(FileInfo netlistFile, string durationText, string? luxText, DirectoryInfo outDir, string? nodeList,
        StartMode startMode, string accuracy, TextWriter output, TextWriter error)
    {
        if (CliNumbers.DecimalComma(durationText))
        {
            error.WriteLine($"--for: \"{CliNumbers.Clip(durationText)}\" has a decimal comma. hint: write a decimal point, e.g. --for 1.5h");
            return CliErrors.Usage;
        }
        if (!Duration.TryParse(durationText, out double stop, out string? durationError))
        {
            error.WriteLine($"--for: {durationError}");
            return CliErrors.Usage;
        }
        if (!(stop > 0) || !double.IsFinite(stop))
        {
            error.WriteLine($"--for: \"{CliNumbers.Clip(durationText)}\" is not a positive duration. hint: write e.g. --for 10s, --for 90min or --for 24h");
            return CliErrors.Usage;
        }
        double lux = 0;
        if (luxText is not null)
        {
            if (CliNumbers.DecimalComma(luxText))
            {
                error.WriteLine($"--lux: \"{CliNumbers.Clip(luxText)}\" has a decimal comma. hint: write a decimal point, e.g. --lux 2.5");
                return CliErrors.Usage;
            }
            if (!EngineeringValue.TryParse(luxText, "lx", out lux, out string? luxError) || !double.IsFinite(lux) || lux < 0)
            {
                error.WriteLine($"--lux: {(luxError ?? $"\"{CliNumbers.Clip(luxText)}\" is not an illuminance of 0 lx or more")}. hint: write e.g. --lux 2.5");
                return CliErrors.Usage;
            }
        }

        string path = netlistFile.ToString();
        NetlistLoadResult loaded = NetlistLoader.Read(path);
        foreach (NetlistError w in loaded.Warnings) error.WriteLine(w.ToString());
        if (!loaded.IsValid)
        {
            CliErrors.WriteProblems([.. loaded.Errors.Select(e => e.ToString())], error);
            return CliErrors.InvalidInput;
        }
        NetlistDefinition def = loaded.Definition!;
        foreach (string caution in NightSim.Supply.MainsExposure.Cautions(def)) output.WriteLine("CAUTION: " + caution);

        Circuit circuit = Circuit.Build(def);
        if (luxText is not null)
        {
            var sensors = circuit.Devices.OfType<ILightSensor>().Select(d => (Id: ((Device)d).PartId, d.Light.HasOwnLight)).Distinct().ToList();
            foreach (var (id, _) in sensors.Where(s => s.HasOwnLight))
                error.WriteLine($"warning: --lux does not apply to {id}: it has its own lux or lux points in {path}, which it keeps. hint: remove them from the part to drive it with --lux");
            if (sensors.Count == 0)
                error.WriteLine($"warning: --lux has no effect: {path} has no light sensor");
        }
        IReadOnlyList<string>? record = null;
        if (!string.IsNullOrWhiteSpace(nodeList))
        {
            record = nodeList.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            var unknown = record.Where(n => circuit.IndexOf(n) < 0).ToList();
            if (unknown.Count > 0)
            {
                var known = circuit.Labels.Where((_, i) => circuit.Kinds[i] == Mna.UnknownKind.Node);
                int total = known.Count();
                error.WriteLine($"--nodes: {string.Join(", ", unknown.Take(5).Select(u => $"'{CliNumbers.Clip(u)}'"))} not in {path}. hint: nodes are {string.Join(", ", known.Take(20))}{(total > 20 ? $" and {total - 20} more" : "")}");
                return CliErrors.Usage;
            }
        }

        var options = (TransientOptions.ForAccuracy(accuracy) ?? TransientOptions.Default) with { RecordNodes = record, ConstantLux = lux, Start = startMode };
        foreach ((string id, double corner) in PowerUpRamp.SourceCornersInside(circuit, options))
        {
            error.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"warning: {id} changes at {EngineeringValue.Format(corner, "s")}, inside the {EngineeringValue.Format(options.SupplyRamp, "s")} power-up ramp that scales every source from 0: its waveform there is shaped by the ramp (a step at 0 s becomes a {EngineeringValue.Format(options.SupplyRamp, "s")} ramp). hint: --start operating-point, or move the change after {EngineeringValue.Format(options.SupplyRamp, "s")}"));
        }
        SimulationResult result = TransientSolver.Run(circuit, stop, options);
        SolverStatistics s = result.Statistics;
        if (result.Failure is { } failure)
        {
            error.WriteLine(failure.ToString());
            return CliErrors.Unexpected;
        }

        // The two files go in as one set, replacing every file an earlier run wrote into the folder (OutputSet).
        using (OutputSet set = OutputException.Guard(outDir.FullName, () => OutputSet.Begin(outDir.FullName)))
        {
            OutputException.Guard(Path.Combine(outDir.FullName, "trace.csv"), () => AtomicFile.Write(Path.Combine(set.Staging, "trace.csv"), stream =>
            {
                using var writer = new StreamWriter(stream, leaveOpen: true);
                TraceCsv.Write(result.Traces, writer);
            }));
            OutputException.Guard(Path.Combine(outDir.FullName, "statistics.json"), () => AtomicFile.Write(Path.Combine(set.Staging, "statistics.json"), stream => StatisticsJson.Write(result, stream)));
            SimulateNight.Commit(set, error);
        }
        string tracePath = Path.Combine(outDir.FullName, "trace.csv");
        string statsPath = Path.Combine(outDir.FullName, "statistics.json");

        var inv = CultureInfo.InvariantCulture;
        output.WriteLine($"{def.Name}: simulated {EngineeringValue.Format(stop, "s")} from " +
            (startMode == StartMode.OperatingPoint ? "the operating point" : $"power-up ({EngineeringValue.Format(options.SupplyRamp, "s")} source ramp)"));
        output.WriteLine(string.Create(inv, $"  steps: {s.AcceptedSteps} accepted, {s.RejectedSteps} rejected; Newton iterations {s.NewtonIterations}; factorisations {s.Factorizations}"));
        output.WriteLine(string.Create(inv, $"  step size: {EngineeringValue.Format(s.MinStep, "s")} … {EngineeringValue.Format(s.MaxStep, "s")}; events {s.Events}; CPU {s.CpuSeconds:F3} s"));
        foreach (Trace t in result.Traces.Take(SummaryTraces))
            output.WriteLine($"  {t.Name}: final {EngineeringValue.Format(t.Values.Count > 0 ? t.Values[^1] : double.NaN, t.Unit)}, min {EngineeringValue.Format(t.Min, t.Unit)}, max {EngineeringValue.Format(t.Max, t.Unit)}");
        if (result.Traces.Count > SummaryTraces)
            output.WriteLine($"  (the first {SummaryTraces} of {result.Traces.Count} traces; every one is in trace.csv, or pick some with --nodes a,b)");
        output.WriteLine($"  wrote {tracePath} and {statsPath}");
        return CliErrors.Success;
    }
}
