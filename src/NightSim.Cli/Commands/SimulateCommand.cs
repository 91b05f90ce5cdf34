using System.CommandLine;
using System.Globalization;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Transient;
using NightSim.Units;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim simulate NETLIST --for DURATION [--lux VALUE] [--out DIR] [--nodes a,b]`: a plain transient run
/// from power-up; writes DIR/trace.csv and DIR/statistics.json.</summary>
internal static class SimulateCommand
{
    public static Command Create()
    {
        var netlist = new Argument<FileInfo>("NETLIST") { Description = "Netlist JSON file." };
        var duration = new Option<string>("--for")
        {
            Description = "Simulated time: a number with s, ms, us, min, h or d (e.g. 10s, 90min, 24h).",
            Required = true,
            HelpName = "DURATION",
        };
        var lux = new Option<string?>("--lux") { Description = "Constant illuminance on every light sensor, lux (default 0).", HelpName = "VALUE" };
        var outDir = new Option<DirectoryInfo>("--out")
        {
            Description = "Output folder for trace.csv and statistics.json (created if missing).",
            DefaultValueFactory = _ => new DirectoryInfo("nightsim-out"),
            HelpName = "DIR",
        };
        var nodes = new Option<string?>("--nodes") { Description = "Comma-separated nodes to record (default: every node).", HelpName = "a,b" };
        var command = new Command("simulate", "Run a transient simulation from power-up and write the traces (trace.csv) and solver statistics (statistics.json). Exit 2 on invalid input, 3 when the simulation fails.");
        command.Arguments.Add(netlist);
        command.Options.Add(duration);
        command.Options.Add(lux);
        command.Options.Add(outDir);
        command.Options.Add(nodes);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) => Execute(
            pr.GetValue(netlist)!, pr.GetValue(duration)!, pr.GetValue(lux), pr.GetValue(outDir)!, pr.GetValue(nodes), output, error)));
        return command;
    }

    private static int Execute(FileInfo netlistFile, string durationText, string? luxText, DirectoryInfo outDir, string? nodeList, TextWriter output, TextWriter error)
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
        if (TouchesMains(def)) MainsCaution(output);

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

        var options = TransientOptions.Default with { RecordNodes = record, ConstantLux = lux };
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
        WriteAtomically(tracePath, stream =>
        {
            using var writer = new StreamWriter(stream, leaveOpen: true);
            TraceCsv.Write(result.Traces, writer);
        });
        WriteAtomically(statsPath, stream => StatisticsJson.Write(result, stream));

        var inv = CultureInfo.InvariantCulture;
        output.WriteLine($"{def.Name}: simulated {EngineeringValue.Format(stop, "s")} from power-up");
        output.WriteLine(string.Create(inv, $"  steps: {s.AcceptedSteps} accepted, {s.RejectedSteps} rejected; Newton iterations {s.NewtonIterations}; factorisations {s.Factorizations}"));
        output.WriteLine(string.Create(inv, $"  step size: {EngineeringValue.Format(s.MinStep, "s")} … {EngineeringValue.Format(s.MaxStep, "s")}; events {s.Events}; CPU {s.CpuSeconds:F3} s"));
        foreach (Trace t in result.Traces.Take(8))
            output.WriteLine($"  {t.Name}: final {EngineeringValue.Format(t.Values.Count > 0 ? t.Values[^1] : double.NaN, t.Unit)}, min {EngineeringValue.Format(t.Min, t.Unit)}, max {EngineeringValue.Format(t.Max, t.Unit)}");
        output.WriteLine($"  wrote {tracePath} and {statsPath}");
        return CliErrors.Success;
    }

    private static bool TouchesMains(NetlistDefinition def) =>
        def.Parts.Any(p => p.Kind == "voltage-source" &&
            (Math.Abs(p.Parameters.Number("dc", 0)) >= 50 || Math.Abs(p.Parameters.Object("sine")?.Number("amplitude", 0) ?? 0) >= 50));

    private static void MainsCaution(TextWriter output)
    {
        output.WriteLine("CAUTION: this circuit carries mains-level voltage. A capacitive-dropper supply is NOT isolated from mains: every node");
        output.WriteLine("  is at a lethal voltage. Use a fuse, an X2-class series capacitor with a bleeder resistor, and a closed insulating");
        output.WriteLine("  enclosure. A simulation is not a safety assessment; follow local electrical codes and have a licensed electrician");
        output.WriteLine("  do the mains wiring.");
    }

    /// <summary>Write to a temporary file beside <paramref name="path"/>, then rename over it (no half-written file).</summary>
    private static void WriteAtomically(string path, Action<Stream> write)
    {
        string temp = path + ".tmp";
        try
        {
            using (var stream = new FileStream(temp, FileMode.Create, FileAccess.Write))
                write(stream);
            File.Move(temp, path, overwrite: true);
        }
        finally
        {
            if (File.Exists(temp)) File.Delete(temp);
        }
    }
}
