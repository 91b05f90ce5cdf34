using System.CommandLine;
using System.Globalization;
using System.Text;
using NightSim.Cli.Plotting;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Supply;
using NightSim.Units;

namespace NightSim.Cli.Commands;

/// <summary>
/// `nightsim supply NETLIST [--mains 230V] [--hz 50] [--out DIR] [--format text|json]`: the budget of a mains-fed
/// (capacitive-dropper) supply in each load state (<see cref="SupplyRun"/>): rail and ripple, dropper current, Zener
/// current, dissipation and voltage against ratings, the bleeder's discharge, coil voltage against pull-in, and a plot
/// of the rail through the relay's pull-in. A netlist without a sine source gets "no mains-fed supply found" and exit 0.
/// </summary>
internal static class SupplyCommand
{
    /// <summary>File stem of the pull-in plot.</summary>
    public const string PlotStem = "rail-pull-in";

    public static Command Create()
    {
        var netlist = new Argument<FileInfo>("NETLIST") { Description = "Netlist JSON file with the mains as a sine voltage source." };
        var mains = new Option<string?>("--mains")
        {
            Description = "Mains RMS voltage, e.g. 230V or 120V (replaces the sine source's amplitude with √2 times it). Default: the netlist's.",
            HelpName = "VOLTS",
        };
        var hz = CliNumbers.Real("--hz", "Mains frequency, Hz, e.g. 50 or 60 (replaces the sine source's frequency). Default: the netlist's.", 1, 1000, "--hz 50");
        var outDir = new Option<DirectoryInfo>("--out")
        {
            Description = "Output folder for supply.json and the pull-in plot (created if missing).",
            DefaultValueFactory = _ => new DirectoryInfo("nightsim-out"),
            HelpName = "DIR",
        };
        var format = new Option<string>("--format") { Description = "Terminal output: text (the budget) or json (supply.json).", DefaultValueFactory = _ => "text" };
        format.AcceptOnlyFromAmong("text", "json");
        var command = new Command("supply",
            "Budget a mains-fed supply (capacitive dropper) in each load state: rail and ripple, dropper current, Zener current, " +
            "dissipation and voltage against ratings, bleeder discharge after unplugging, coil voltage against pull-in, and a plot of the " +
            "rail through the relay's pull-in. Exit 1 on a command-line mistake, 2 on invalid input, 3 when a run fails, 5 when an output cannot be written.");
        command.Arguments.Add(netlist);
        command.Options.Add(mains);
        command.Options.Add(hz);
        command.Options.Add(outDir);
        command.Options.Add(format);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) =>
        {
            double? frequency = pr.GetResult(hz) is { Implicit: false } ? pr.GetValue(hz) : null;
            return Execute(pr.GetValue(netlist)!, pr.GetValue(mains), frequency, pr.GetValue(outDir)!, pr.GetValue(format)!, output, error);
        }));
        return command;
    }

    private static int Execute(FileInfo net, string? mainsText, double? frequency, DirectoryInfo outDir, string format, TextWriter output, TextWriter error)
    {
        double? rms = null;
        if (mainsText is not null)
        {
            if (CliNumbers.DecimalComma(mainsText))
            {
                error.WriteLine($"--mains: \"{CliNumbers.Clip(mainsText)}\" has a decimal comma. hint: write a decimal point, e.g. --mains 230V");
                return CliErrors.Usage;
            }
            if (!EngineeringValue.TryParse(mainsText, "V", out double v, out string? problem) || !double.IsFinite(v) || v < 1 || v > 1000)
            {
                error.WriteLine($"--mains: {problem ?? $"\"{CliNumbers.Clip(mainsText)}\" is not an RMS voltage from 1 V to 1000 V"}. hint: write e.g. --mains 230V or --mains 120V");
                return CliErrors.Usage;
            }
            rms = v;
        }
        if (!net.Exists)
        {
            error.WriteLine($"{net}: error at $: file not found. hint: check the path");
            return CliErrors.InvalidInput;
        }
        string path = net.ToString();
        NetlistLoadResult loaded = NetlistLoader.Read(path);
        foreach (NetlistError w in loaded.Warnings) error.WriteLine(w.ToString());
        if (!loaded.IsValid)
        {
            CliErrors.WriteProblems([.. loaded.Errors.Select(e => e.ToString())], error);
            return CliErrors.InvalidInput;
        }

        using InvariantCultureScope invariant = InvariantCultureScope.Enter();
        MainsSetting? setting = rms is not null || frequency is not null ? new MainsSetting(rms, frequency) : null;
        SupplyBudget budget;
        try
        {
            budget = SupplyRun.Measure(loaded.Definition!, setting);
        }
        catch (SupplyRunException failed)
        {
            error.WriteLine($"{path}: {failed.Message}");
            return CliErrors.Unexpected;
        }

        string tool = "nightsim " + typeof(SupplyCommand).Assembly.GetName().Version?.ToString(3);
        var written = new List<string>();
        var plotWarnings = new List<string>();
        if (budget.Section is not null)
        {
            OutputException.Guard(outDir.FullName, () => outDir.Create());
            if (budget.PullIn is { Times.Length: > 1 } pullIn)
            {
                PlotFiles files = OutputException.Guard(outDir.FullName, () =>
                    PlotWriter.Write(NightPlotBuilder.Build(PlotOf(budget, pullIn)), outDir.FullName, PlotStem));
                written.Add(files.SvgPath);
                if (files.PngPath is not null) written.Add(files.PngPath);
                if (files.Warning is not null) plotWarnings.Add(files.Warning);
            }
            string jsonPath = Path.Combine(outDir.FullName, "supply.json");
            OutputException.Guard(jsonPath, () => SupplyJson.Write(budget, tool, path, [.. written.Select(Path.GetFileName).OfType<string>()], jsonPath));
            written.Insert(0, jsonPath);
        }

        if (format == "json")
        {
            using var ms = new MemoryStream();
            SupplyJson.Write(budget, tool, path, [.. written.Skip(1).Select(Path.GetFileName).OfType<string>()], ms);
            output.WriteLine(Encoding.UTF8.GetString(ms.ToArray()));
        }
        else
        {
            output.Write(Text(budget, path));
            if (written.Count > 0) output.WriteLine($"wrote {string.Join(", ", written)}");
        }
        foreach (string w in plotWarnings) error.WriteLine("warning: " + w);
        return CliErrors.Success;
    }

    /// <summary>A value with its unit; currents below 1 nA and voltages below 1 µV read as 0 (a non-conducting
    /// junction's leakage is noise to a budget).</summary>
    private static string F(double value, string unit) =>
        !double.IsFinite(value) ? "—"
        : unit == "A" && Math.Abs(value) < 1e-9 || unit == "V" && Math.Abs(value) < 1e-6 ? "0 " + unit
        : EngineeringValue.Format(value, unit, 3);

    /// <summary>The budget as the terminal shows it.</summary>
    internal static string Text(SupplyBudget b, string path)
    {
        var sb = new StringBuilder();
        var inv = CultureInfo.InvariantCulture;
        if (b.Section is not { } s)
        {
            sb.AppendLine(b.Message);
            foreach (string c in b.Cautions) sb.AppendLine("CAUTION: " + c);
            return sb.ToString();
        }
        sb.AppendLine(string.Create(inv, $"{b.CircuitName}: supply budget at {F(b.MainsRms, "V")} RMS {b.Frequency:0.##} Hz ({F(b.MainsPeak, "V")} peak; {(b.Overridden ? "--mains/--hz" : "as in " + path)})"));
        var parts = new List<string> { $"source {s.Source.PartId}" };
        if (s.Droppers.Count > 0) parts.Add($"dropper {string.Join("+", s.Droppers.Select(d => $"{d.PartId} {F(d.Capacitance, "F")}"))}");
        else parts.Add("no dropper capacitor in series with the source");
        if (s.Bleeders.Count > 0) parts.Add($"bleeder {string.Join("+", s.Bleeders.Select(r => $"{r.PartId} {F(r.Resistance, "Ω")}"))}");
        foreach (var r in s.SeriesResistors) parts.Add($"series resistor {r.PartId} {F(r.Resistance, "Ω")}");
        if (s.Rail is { } rail) parts.Add($"rail {rail.Plus}–{rail.Minus} ({rail.Reason})");
        if (s.RailZener is { } z) parts.Add($"rail Zener {z.PartId} {F(z.BreakdownVoltage, "V")}");
        if (s.Reservoir is { } cs) parts.Add($"smoothing {cs.PartId} {F(cs.Capacitance, "F")}");
        sb.AppendLine("  supply: " + string.Join("; ", parts));
        if (double.IsFinite(b.HandDropperCurrent))
            sb.AppendLine($"  dropper current by hand V·2πf·C = {F(b.HandDropperCurrent, "A")} RMS");
        sb.AppendLine();

        string zenerHead = s.RailZener is { } rz ? $"Zener {rz.PartId} min / max (mean)" : s.Zeners.Count > 0 ? $"Zener {s.Zeners[0].PartId} min / max (mean)" : "";
        int zi = s.RailZener is { } rz2 ? s.Zeners.ToList().IndexOf(rz2) : s.Zeners.Count > 0 ? 0 : -1;
        string coilHead = s.Relays.Count > 0 ? $"coil {s.Relays[0].PartId} (pull-in {F(s.Relays[0].PullIn, "V")})" : "";
        string current = s.Droppers.Count > 0 ? "dropper" : "source";
        sb.AppendLine(string.Create(inv, $"  {"state",-14} {"rail mean",10} {"ripple",9} {current,9}  {zenerHead,-32} {coilHead}"));
        foreach (SupplyState st in b.States)
        {
            string zener = zi >= 0 ? $"{F(st.Zeners[zi].CurrentMin, "A")} / {F(st.Zeners[zi].CurrentMax, "A")} ({F(st.Zeners[zi].CurrentMean, "A")})" : "";
            string coil = st.Coils.Count > 0 ? $"{F(st.Coils[0].VoltageMean, "V")}{(st.Coils[0].Energised ? " pulled in" : "")}" : "";
            sb.AppendLine(string.Create(inv, $"  {st.Key,-14} {F(st.RailMean, "V"),10} {F(st.Ripple, "V"),9} {F(st.DropperCurrentRms, "A"),9}  {zener,-32} {coil}"));
            if (!st.Settled) sb.AppendLine($"  {"",-14} (not settled: measured after {F(st.SettleSeconds, "s")})");
            if (st.Note is not null) sb.AppendLine($"  {"",-14} note: {st.Note}");
        }
        sb.AppendLine($"  ({current}: RMS current from the source{(zi >= 0 ? "; Zener: reverse current over the measured cycles" : "")}; ripple: peak to peak)");
        sb.AppendLine();

        sb.AppendLine("  ratings at the worst state:");
        foreach (PartStress p in b.Parts)
        {
            string power = double.IsFinite(p.Power) ? $"{F(p.Power, "W")}{(p.PowerRating is double pr ? $" of {F(pr, "W")} ({p.PowerFraction * 100:0} %)" : "")}" : "";
            string volts = $"{F(p.Voltage, "V")}{(p.VoltageIsRms ? " RMS" : " peak")}{(p.VoltageRating is double vr ? $" of {F(vr, "V")} ({p.VoltageFraction * 100:0} %)" : "")}";
            sb.AppendLine(string.Create(inv, $"    {p.PartId,-6} {p.Title,-20} {power,-26} {volts,-30} {p.Verdict}"));
        }
        if (b.Bleeder is { } bl)
        {
            sb.AppendLine();
            if (double.IsPositiveInfinity(bl.Resistance))
            {
                sb.AppendLine($"  bleeder: none across the dropper; it keeps up to {F(bl.StartVoltage, "V")} after unplugging");
            }
            else
            {
                sb.AppendLine($"  bleeder: {F(bl.Resistance, "Ω")} across {F(bl.Capacitance, "F")}, τ = R·C = {F(bl.TimeConstant, "s")}; from {F(bl.StartVoltage, "V")} (the dropper's peak) " +
                    $"below {F(BleederDischarge.SafeVoltage, "V")} ({BleederDischarge.SafeVoltageSource}) after {F(bl.SecondsToSafe, "s")}: t = R·C·ln(V0/Vsafe)");
                sb.AppendLine($"           {F(bl.VoltageAfterOneSecond, "V")} left one second after unplugging: {(bl.MeetsPlugPinLimit ? "within" : "above")} the {F(BleederDischarge.PlugPinVoltage, "V")} plug-pin limit ({BleederDischarge.PlugPinSource})");
            }
        }
        if (b.PullIn is { } p2)
        {
            sb.AppendLine();
            string when = p2.PullInTime is double t ? $"pulled in at {t:0.###} s, {F(t - p2.Start, "s")} after the drive began" : "never pulled in";
            sb.AppendLine($"  pull-in: relay {p2.RelayId} {when}; rail {F(p2.RailBefore, "V")} before, {F(p2.RailMin, "V")} at its lowest (sag {F(p2.Sag, "V")}); " +
                $"coil peak {F(p2.CoilPeak, "V")} against {F(p2.PullIn, "V")} pull-in; {p2.Operations} operation{(p2.Operations == 1 ? "" : "s")}");
        }
        if (b.Warnings.Count > 0)
        {
            sb.AppendLine();
            sb.AppendLine("  problems:");
            foreach (string w in b.Warnings) sb.AppendLine("  - " + w);
        }
        sb.AppendLine();
        foreach (string c in b.Cautions) sb.AppendLine("CAUTION: " + c);
        sb.AppendLine(string.Create(inv, $"  ({b.SimulatedSeconds:0.0} s of mains simulated in {b.CpuSeconds:0.0} s of CPU)"));
        return sb.ToString();
    }

    /// <summary>The rail and the coil through the pull-in, with the pull-in and drop-out levels and the relay's state.</summary>
    internal static PlotData PlotOf(SupplyBudget b, PullInTransient p)
    {
        double from = p.Times[0], to = p.Times[^1];
        // Show the drive and the recovery: up to a second after the drive, or the whole record when shorter.
        to = Math.Min(to, Math.Max(p.Start + 1.0, (p.PullInTime ?? p.Start) + 0.5));
        double[] times = p.Times, rail = p.Rail, coil = p.Coil;
        double[] ends = [from, to];
        var states = new List<double>();
        var stateTimes = new List<double>();
        bool on = false;
        stateTimes.Add(from);
        states.Add(0);
        foreach ((double t, bool e) in p.Changes)
        {
            stateTimes.Add(t);
            states.Add(on ? 1 : 0);
            stateTimes.Add(t);
            states.Add(e ? 1 : 0);
            on = e;
        }
        stateTimes.Add(to);
        states.Add(on ? 1 : 0);
        SupplySection s = b.Section!;
        string railName = s.Rail is { } r ? $"rail ({r.Plus}–{r.Minus})" : "rail";
        var series = new List<PlotSeries>
        {
            new(railName, "V", PlotPanel.Voltages, times, rail),
            new($"coil {p.RelayId} (current × resistance)", "V", PlotPanel.Voltages, times, coil),
            new($"pull-in {F(p.PullIn, "V")}", "V", PlotPanel.Voltages, ends, [p.PullIn, p.PullIn], Dashed: true),
            new($"drop-out {F(p.DropOut, "V")}", "V", PlotPanel.Voltages, ends, [p.DropOut, p.DropOut], Dashed: true),
            new($"relay {p.RelayId} pulled in", "", PlotPanel.States, [.. stateTimes], [.. states]),
        };
        var markers = new List<PlotMarker> { new(p.Start, s.Timer is not null ? "trigger pressed" : "coil driven") };
        if (p.PullInTime is double pin) markers.Add(new PlotMarker(pin, "pull-in", false));
        return new PlotData
        {
            Title = p.PullInTime is null
                ? $"{b.CircuitName}: rail as relay {p.RelayId} is driven; it never pulls in ({F(b.MainsRms, "V")} {b.Frequency:0.##} Hz)"
                : $"{b.CircuitName}: rail through the pull-in of relay {p.RelayId} ({F(b.MainsRms, "V")} {b.Frequency:0.##} Hz)",
            Origin = Runs.RunFactsBuilder.PlainOrigin,
            TimeZone = TimeZoneInfo.Utc,
            From = from,
            To = to,
            Series = series,
            Markers = markers,
            FileStem = PlotStem,
            RunTimeAxis = true,
        };
    }
}
