using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Results;
using NightSim.Transient;

namespace NightSim.Supply;

/// <summary>
/// Runs the supply into the rest of the circuit in each load state to its periodic steady state and measures it over
/// whole mains cycles (<see cref="SupplyBudget"/>). Two runs from power-up:
/// <list type="number">
/// <item>Day: every light sensor at <see cref="DayLux"/>; the circuit rests with its relay released. Measured when
/// the rail has settled: "standby-day".</item>
/// <item>Night: every sensor at <see cref="NightLux"/>. With a one-shot timer, its trigger pin is pulled to its ground
/// pin through <see cref="PressResistance"/> for <see cref="PressDuration"/> (a test button) once the rail has settled
/// as long as in the day run: the state before the press is "standby-night", the state after it, once the relay has
/// pulled in and the rail settled again, "relay-on". Without a timer the night itself drives the relay stage (a
/// comparator dusk switch) from power-up, and the settled state is "relay-on" when the relay pulled in.</item>
/// </list>
/// Nothing is forced: the trigger, the timer and the relay drive all work as they do at dusk, so the relay-on state
/// carries every current the circuit draws then, and a relay the supply cannot pull in stays out.
/// </summary>
public static class SupplyRun
{
    /// <summary>Light on the sensors in the day run, lux (overcast daylight, common practice).</summary>
    public const double DayLux = 1000.0;

    /// <summary>Light on the sensors in the night run, lux (a dark night without moon, common practice).</summary>
    public const double NightLux = 0.01;

    /// <summary>Longest simulated time a state may take to settle, s.</summary>
    public const double MaxSettle = 15.0;

    /// <summary>Whole mains cycles each state is measured over.</summary>
    public const int WindowCycles = 5;

    /// <summary>Cycles a state must last, after the last relay operation, before it counts as settled.</summary>
    public const int MinCycles = 10;

    /// <summary>Resistance of the test press from the trigger pin to the timer's ground pin, Ω.</summary>
    public const double PressResistance = 100.0;

    /// <summary>How long the test press holds the trigger pin down, s.</summary>
    public const double PressDuration = 2e-3;

    /// <summary>Recorded time before the press, for the pull-in plot, s.</summary>
    public const double PlotLead = 0.1;

    /// <summary>The supply budget of a validated netlist, at <paramref name="mains"/> when given.</summary>
    /// <exception cref="SupplyRunException">A run failed (the failure says when, where and what to try).</exception>
    /// <exception cref="OperationCanceledException"><paramref name="cancel"/> asked to stop.</exception>
    public static SupplyBudget Measure(NetlistDefinition net, MainsSetting? mains = null, TransientOptions? options = null, CancellationToken cancel = default)
    {
        // The problems are interpolated text: build them under the invariant culture.
        using Units.InvariantCultureScope invariant = Units.InvariantCultureScope.Enter();
        IReadOnlyList<Device> Build()
        {
            List<Device> devices = net.Parts.SelectMany(p => (PartCatalog.Find(p.Kind) ?? throw new InvalidOperationException($"unknown kind '{p.Kind}'")).Create(p)).ToList();
            return mains?.Apply(devices) ?? devices;
        }
        IReadOnlyList<Device> probe = Build();
        SupplySection? section = SupplySection.Find(probe);
        IReadOnlyList<string> cautions = MainsExposure.Cautions(MainsExposure.Classify(probe));
        if (section is null)
        {
            return new SupplyBudget
            {
                CircuitName = net.Name,
                Cautions = cautions,
                Message = $"no mains-fed supply found in {net.SourceFile}: it has no sine voltage source (a constant or pulse source is an ideal rail, with nothing to budget). Add the mains as a voltage-source with \"sine\" to judge a dropper supply.",
            };
        }
        options = (options ?? TransientOptions.Default) with { RecordNodes = [] };

        long cpuStart = Environment.CpuUsage.TotalTime.Ticks;
        Pass day = RunPass(net.Name, Build(), options with { ConstantLux = DayLux }, pressAt: null, cancel);
        Pass night;
        double? pressAt = null;
        if (section.Timer is not null)
        {
            // Press once the rail has had as long as the day run needed, plus some, on a whole cycle.
            double period = 1.0 / section.Source.Frequency;
            double wait = Math.Max(0.5, 1.25 * day.Final.To + 0.2);
            pressAt = section.Source.Start + Math.Ceiling((wait - section.Source.Start) / period) * period + 0.1 * period;
        }
        night = RunPass(net.Name, Build(), options with { ConstantLux = NightLux }, pressAt, cancel);
        double cpu = (Environment.CpuUsage.TotalTime.Ticks - cpuStart) / (double)TimeSpan.TicksPerSecond;

        var states = new List<SupplyState>
        {
            State(section, day.Probes, "standby-day", "day light on the sensors; the circuit at rest", DayLux, day.Final, day.FinalSettled,
                day.FinalStart, day.Coils, day.CoilsOn)
                with { Note = day.CoilsOn.Any(on => on) ? "a relay pulled in during the day run: the circuit does not rest in daylight (or the one-shot fired at power-up)" : null },
        };
        string onKey = section.Relays.Count > 0 ? "relay-on" : "timer-on";
        if (pressAt is double press)
        {
            if (night.BeforePress is { } before)
            {
                states.Add(State(section, night.Probes, "standby-night", "dark on the sensors before the one-shot fired", NightLux, before,
                    night.BeforePressSettled, night.BeforePressStart, night.CoilsBeforePress, night.CoilsOnBeforePress)
                    with { Note = night.CoilsOnBeforePress.Any(on => on) ? "a relay was already pulled in before the trigger press (the one-shot fired when the supply came up)" : null });
            }
            states.Add(State(section, night.Probes, onKey, $"dark; the one-shot's trigger pin pressed to its ground for {PressDuration * 1e3:0.#} ms at {press:0.###} s", NightLux,
                night.Final, night.FinalSettled, night.FinalStart, night.Coils, night.CoilsOn) with { Note = OnNote(section, night) });
        }
        else
        {
            bool on = night.CoilsOn.Any(o => o);
            states.Add(State(section, night.Probes, on ? onKey : "standby-night",
                on ? "dark on the sensors from power-up; the relay stage switched on by itself" : "dark on the sensors from power-up", NightLux,
                night.Final, night.FinalSettled, night.FinalStart, night.Coils, night.CoilsOn) with { Note = on ? null : OnNote(section, night) });
        }

        return SupplyBudget.From(net.Name, section, states, night.PullIn, cautions, mains is not null, cpu, day.Simulated + night.Simulated);
    }

    private static string? OnNote(SupplySection section, Pass night)
    {
        if (section.Relays.Count == 0) return null;
        PullInTransient? p = night.PullIn;
        if (p is null) return null;
        if (p.PullInTime is null)
        {
            return p.CoilPeak < 0.5 * p.DropOut
                ? $"the relay-on state was not reached: the coil of {p.RelayId} saw at most {p.CoilPeak:0.##} V (the stage in front of it did not drive it); check the drive with `nightsim simulate`"
                : $"relay {p.RelayId} never pulled in: its coil reached {p.CoilPeak:0.##} V against its {p.PullIn:0.##} V pull-in";
        }
        if (!night.FinalSettled) return $"the rail did not settle within {MaxSettle:0} s after the drive ({p.Operations} relay operations)";
        return p.Operations > 1 ? $"relay {p.RelayId} operated {p.Operations} times before it settled" : null;
    }

    private static SupplyState State(SupplySection section, SupplyProbes probes, string key, string description, double lux, CycleStats s,
        bool settled, double start, CycleStats coils, bool[] coilsOn)
    {
        var zeners = section.Zeners.Select((z, k) => new ZenerReading(z.PartId, s.Min[probes.ZenerCurrent(k)], s.Max[probes.ZenerCurrent(k)],
            s.Mean[probes.ZenerCurrent(k)], s.Mean[probes.ZenerPower(k)])).ToList();
        var relays = section.Relays.Select((r, k) => new CoilReading(r.PartId, coils.Mean[probes.Coil(k)], coils.Min[probes.Coil(k)],
            coils.Max[probes.Coil(k)], r.PullIn, r.DropOut, coilsOn[k])).ToList();
        var parts = new List<PartReading>();
        for (int k = 0; k < section.Resistors.Count; k++)
        {
            int q = probes.Resistor(k);
            double rms = s.Rms[q];
            parts.Add(new PartReading(section.Resistors[k].PartId, rms * rms / section.Resistors[k].Resistance, Math.Max(Math.Abs(s.Min[q]), Math.Abs(s.Max[q])), rms));
        }
        for (int k = 0; k < section.Capacitors.Count; k++)
        {
            int q = probes.Capacitor(k);
            parts.Add(new PartReading(section.Capacitors[k].PartId, double.NaN, Math.Max(Math.Abs(s.Min[q]), Math.Abs(s.Max[q])), s.Rms[q]));
        }
        bool hasRail = section.Rail is not null;
        return new SupplyState(key, description, lux, settled, s.To - start, s.From, s.To)
        {
            RailMean = hasRail ? s.Mean[SupplyProbes.Rail] : double.NaN,
            RailMin = hasRail ? s.Min[SupplyProbes.Rail] : double.NaN,
            RailMax = hasRail ? s.Max[SupplyProbes.Rail] : double.NaN,
            DropperCurrentRms = s.Rms[SupplyProbes.Line],
            Zeners = zeners,
            Coils = relays,
            Parts = parts,
        };
    }

    /// <summary>What one run from power-up measured.</summary>
    private sealed class Pass
    {
        public required SupplyProbes Probes { get; init; }
        public CycleStats Final { get; set; } = null!;
        public CycleStats Coils { get; set; } = null!;
        public bool FinalSettled { get; set; }
        public double FinalStart { get; set; }
        public bool[] CoilsOn { get; set; } = [];
        public CycleStats? BeforePress { get; set; }
        public CycleStats CoilsBeforePress { get; set; } = null!;
        public bool BeforePressSettled { get; set; }
        public double BeforePressStart { get; set; }
        public bool[] CoilsOnBeforePress { get; set; } = [];
        public PullInTransient? PullIn { get; set; }
        public double Simulated { get; set; }
    }

    /// <summary>One run from power-up at constant light: until the rail settles (after the press, when there is one),
    /// or <see cref="MaxSettle"/> after the last state began.</summary>
    private static Pass RunPass(string name, IReadOnlyList<Device> devices, TransientOptions options, double? pressAt, CancellationToken cancel)
    {
        var list = devices.ToList();
        SupplySection section = SupplySection.Find(devices)!;
        if (pressAt is double at && section.Timer is { } timer)
        {
            list.Add(new Switch("supply.press", "supply.press", timer.Trigger, timer.Ground, PressResistance, 1e15, false,
                [(at, 1.0), (at + PressDuration, 0.0)]));
        }
        Circuit circuit = Circuit.FromDevices(name, list);
        var probes = new SupplyProbes(circuit, section);
        double period = 1.0 / section.Source.Frequency;
        var meter = new CycleMeter(probes.Count, period, section.Source.Start);
        var coils = new CoilTracker(section.Relays);
        var values = new double[probes.Count];
        var pass = new Pass { Probes = probes };
        int relayCount = section.Relays.Count;
        int watched = relayCount > 0 ? 0 : -1;

        double stateStart = 0;
        bool pressed = pressAt is null;
        // With a press the drive starts at the press; without one, when the watched coil first draws half its
        // drop-out current (the stage in front of it switched on).
        double driveStart = pressAt ?? double.PositiveInfinity;
        double railBefore = double.NaN, railMin = double.PositiveInfinity, coilPeak = 0;
        double? pullInTime = null;
        int operations = 0;
        var changes = new List<(double, bool)>();
        var times = new List<double>();
        var rail = new List<double>();
        var coil = new List<double>();
        double recordFrom = pressAt is double p0 ? p0 - PlotLead : 0.0;
        double hardStop = (pressAt ?? 0.0) + MaxSettle + (pressAt is null ? 0.0 : 1.0);

        using var stop = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        var solver = new TransientSolver(circuit, options) { Cancellation = stop.Token };
        solver.Accepted = s =>
        {
            double t = s.Time;
            probes.Sample(s.Solution, values);
            if (!pressed && t >= pressAt!.Value - 1e-12)
            {
                // The state before the press: the last whole cycles, before the press takes effect at this point.
                pressed = true;
                pass.BeforePress = meter.Cycles > 0 ? meter.Window(WindowCycles) : null;
                pass.CoilsBeforePress = pass.BeforePress ?? new CycleStats(probes.Count);
                pass.BeforePressSettled = meter.Settled(MinCycles, window: WindowCycles);
                pass.BeforePressStart = stateStart;
                pass.CoilsOnBeforePress = [.. Enumerable.Range(0, relayCount).Select(coils.IsOn)];
                railBefore = meter.Cycles > 0 ? meter.CycleMean(SupplyProbes.Rail) : double.NaN;
                meter.Forget();
                stateStart = t;
            }
            if (pressAt is null && watched >= 0 && double.IsPositiveInfinity(driveStart) && values[probes.Coil(watched)] >= 0.5 * section.Relays[watched].DropOut)
            {
                driveStart = t;
                railBefore = meter.Cycles > 0 ? meter.CycleMean(SupplyProbes.Rail) : double.NaN;
            }
            meter.Add(t, values);
            for (int k = 0; k < relayCount; k++)
            {
                if (!coils.Update(k, values[probes.Coil(k)])) continue;
                meter.Forget();
                if (k == watched && pressed && t >= driveStart)
                {
                    operations++;
                    changes.Add((t, coils.IsOn(k)));
                    if (coils.IsOn(k)) pullInTime ??= t;
                }
            }
            if (pressed && t >= driveStart)
            {
                if (section.Rail is not null) railMin = Math.Min(railMin, values[SupplyProbes.Rail]);
                if (watched >= 0) coilPeak = Math.Max(coilPeak, values[probes.Coil(watched)]);
            }
            if (t >= recordFrom)
            {
                times.Add(t);
                rail.Add(values[SupplyProbes.Rail]);
                coil.Add(watched >= 0 ? values[probes.Coil(watched)] : double.NaN);
            }
            // Done: settled in the final state, and long enough after the drive for the stage to act.
            bool driveDone = pressAt is null ? t >= 0.5 && (watched < 0 || t >= driveStart + 0.5 || double.IsPositiveInfinity(driveStart)) : t >= driveStart + 0.5;
            if (driveDone && meter.Settled(MinCycles, window: WindowCycles)) stop.Cancel();
        };
        SimulationResult result = solver.Run(hardStop);
        cancel.ThrowIfCancellationRequested();
        if (result.Failure is SimulationFailure failure) throw new SupplyRunException(failure, options.ConstantLux);
        if (meter.Cycles == 0) throw new SupplyRunException(new SimulationFailure(result.StopTime, "the run ended before a whole mains cycle was measured", [], "check the sine source's frequency"), options.ConstantLux);

        pass.Final = meter.Window(WindowCycles);
        pass.Coils = pass.Final;
        pass.FinalSettled = meter.Settled(MinCycles, window: WindowCycles);
        pass.FinalStart = stateStart;
        pass.CoilsOn = [.. Enumerable.Range(0, relayCount).Select(coils.IsOn)];
        pass.Simulated = result.StopTime;
        if (watched >= 0)
        {
            RelayCoilRole r = section.Relays[watched];
            // Keep the points from a little before the drive (all of them when the coil was never driven).
            int from = double.IsFinite(driveStart) ? Math.Max(0, times.FindIndex(x => x >= driveStart - PlotLead)) : 0;
            if (from < 0) from = 0;
            pass.PullIn = new PullInTransient(r.PartId, double.IsFinite(driveStart) ? driveStart : 0.0, pullInTime, railBefore, double.IsFinite(railMin) ? railMin : double.NaN,
                coilPeak, r.PullIn, r.DropOut, operations)
            {
                Times = [.. times.Skip(from)],
                Rail = [.. rail.Skip(from)],
                Coil = [.. coil.Skip(from)],
                Changes = changes,
            };
        }
        return pass;
    }
}
