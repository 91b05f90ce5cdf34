using System.CommandLine;
using System.Globalization;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Results;
using NightSim.Transient;
using NightSim.Units;
using NightSim.Cli.Rendering;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim simulate NETLIST --for DURATION [--lux VALUE] [--out DIR] [--nodes a,b]`: a plain transient run
/// from power-up; writes DIR/trace.csv and DIR/statistics.json.</summary>
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
        var nights = new Option<int?>("--nights", "-n") { Description = "Number of nights (overrides the scenario).", HelpName = "N" };
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
        var noPlots = new Option<bool>("--no-plots") { Description = "Skip the SVG/PNG plots (faster; report.html then has no figures)." };
        var lux = new Option<string?>("--lux") { Description = "Constant illuminance on every light sensor, lux (default 0).", HelpName = "VALUE" };
        var outDir = new Option<DirectoryInfo>("--out")
        {
            Description = "Output folder for trace.csv and statistics.json (created if missing).",
            DefaultValueFactory = _ => new DirectoryInfo("nightsim-out"),
            HelpName = "DIR",
        };
        var nodes = new Option<string?>("--nodes") { Description = "Comma-separated nodes to record (default: every node).", HelpName = "a,b" };
        var command = new Command("simulate",
            "Run a netlist through the nights of a scenario and report when the load switched on, for how long and why " +
            "(report.json, report.html, trace.csv, plots). Without a scenario, --for [--lux] runs a plain transient " +
            "(trace.csv, statistics.json). Exit 2 on invalid input, 3 when the simulation fails, 4 with --fail-on.");
        command.Arguments.Add(netlist);
        command.Options.Add(duration);
        command.Options.Add(lux);
        command.Options.Add(outDir);
        command.Options.Add(nodes);
        command.Options.Add(scenario);
        command.Options.Add(nights);
        command.Options.Add(format);
        command.Options.Add(noProgress);
        command.Options.Add(failOn);
        command.Options.Add(noPlots);
        command.Options.Add(accuracy);
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
                if (pr.GetValue(nights) is int n && n is < 1 or > 3660)
                {
                    error.WriteLine("--nights: give 1 to 3660 nights (ten years)");
                    return CliErrors.InvalidInput;
                }
                var settings = new SimulateNight.Settings(net.ToString(), scenarioPath, pr.GetValue(nights), pr.GetValue(outDir)!,
                    pr.GetValue(format)!, pr.GetValue(noProgress), pr.GetValue(failOn), pr.GetValue(noPlots), pr.GetValue(accuracy)!);
                return SimulateNight.Execute(settings, Terminal.For(output), output, error);
            }
            if (durationText is null)
            {
                error.WriteLine($"{net}: no scenario given and no {Path.GetFileNameWithoutExtension(net.Name)}.scenario.json beside it. hint: add --scenario FILE for a night run, or --for DURATION (e.g. --for 10s) for a plain transient");
                return CliErrors.InvalidInput;
            }
            return Execute(net, durationText, pr.GetValue(lux), pr.GetValue(outDir)!, pr.GetValue(nodes), pr.GetValue(accuracy)!, output, error);
        }));
        return command;
    }

    private static int Execute(FileInfo netlistFile, string durationText, string? luxText, DirectoryInfo outDir, string? nodeList, string accuracy, TextWriter output, TextWriter error)
    {
        if (!Duration.TryParse(durationText, out double stop, out string? durationError))
        {
            error.WriteLine($"--for: {durationError}");
            return CliErrors.InvalidInput;
        }
        double lux = 0;
        if (luxText is not null && (!EngineeringValue.TryParse(luxText, "lx", out lux, out string? luxError) || lux < 0))
        {
            error.WriteLine($"--lux: {(lux < 0 ? "illuminance must be ≥ 0 lx" : luxError)}");
            return CliErrors.InvalidInput;
        }

        string path = netlistFile.ToString();
        NetlistLoadResult loaded = NetlistLoader.Read(path);
        foreach (NetlistError w in loaded.Warnings) error.WriteLine(w.ToString());
        if (!loaded.IsValid)
        {
            foreach (NetlistError e in loaded.Errors) error.WriteLine(e.ToString());
            error.WriteLine(loaded.Errors.Count == 1 ? "1 error." : $"{loaded.Errors.Count} errors.");
            return CliErrors.InvalidInput;
        }
        NetlistDefinition def = loaded.Definition!;
        if (NightRun.TouchesMains(def))
        {
            foreach (string caution in ReportText.MainsCautions) output.WriteLine("CAUTION: " + caution);
        }

        Circuit circuit = Circuit.Build(def);
        IReadOnlyList<string>? record = null;
        if (!string.IsNullOrWhiteSpace(nodeList))
        {
            record = nodeList.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            var unknown = record.Where(n => circuit.IndexOf(n) < 0).ToList();
            if (unknown.Count > 0)
            {
                var known = circuit.Labels.Where((_, i) => circuit.Kinds[i] == Mna.UnknownKind.Node);
                error.WriteLine($"--nodes: {string.Join(", ", unknown.Select(u => $"'{u}'"))} not in {path}. hint: nodes are {string.Join(", ", known)}");
                return CliErrors.InvalidInput;
            }
        }

        var options = (TransientOptions.ForAccuracy(accuracy) ?? TransientOptions.Default) with { RecordNodes = record, ConstantLux = lux };
        SimulationResult result = TransientSolver.Run(circuit, stop, options);
        SolverStatistics s = result.Statistics;
        if (result.Failure is { } failure)
        {
            error.WriteLine(failure.ToString());
            return CliErrors.Unexpected;
        }

        outDir.Create();
        string tracePath = Path.Combine(outDir.FullName, "trace.csv");
        string statsPath = Path.Combine(outDir.FullName, "statistics.json");
        AtomicFile.Write(tracePath, stream =>
        {
            using var writer = new StreamWriter(stream, leaveOpen: true);
            TraceCsv.Write(result.Traces, writer);
        });
        AtomicFile.Write(statsPath, stream => StatisticsJson.Write(result, stream));

        var inv = CultureInfo.InvariantCulture;
        output.WriteLine($"{def.Name}: simulated {EngineeringValue.Format(stop, "s")} from power-up");
        output.WriteLine(string.Create(inv, $"  steps: {s.AcceptedSteps} accepted, {s.RejectedSteps} rejected; Newton iterations {s.NewtonIterations}; factorisations {s.Factorizations}"));
        output.WriteLine(string.Create(inv, $"  step size: {EngineeringValue.Format(s.MinStep, "s")} … {EngineeringValue.Format(s.MaxStep, "s")}; events {s.Events}; CPU {s.CpuSeconds:F3} s"));
        foreach (Trace t in result.Traces.Take(8))
            output.WriteLine($"  {t.Name}: final {EngineeringValue.Format(t.Values.Count > 0 ? t.Values[^1] : double.NaN, t.Unit)}, min {EngineeringValue.Format(t.Min, t.Unit)}, max {EngineeringValue.Format(t.Max, t.Unit)}");
        output.WriteLine($"  wrote {tracePath} and {statsPath}");
        return CliErrors.Success;
    }
}
