using NightSim.Analysis;
using NightSim.Devices;
using NightSim.Devices.Roles;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Results;
using NightSim.Sky;
using NightSim.Sky.Events;
using NightSim.Targets;
using NightSim.Transient;
using NightSim.Units;
using NightSim.Mna;

namespace NightSim.Runs;

/// <summary>
/// The night run, end to end: builds the circuit with the scenario's noise and lamp coupling, steps it through the
/// nights, then turns the result into facts, findings, a report, a trace table and plot data.
/// </summary>
/// <remarks>What must come first: devices are created before the light signal, because the lamp's light at its own
/// sensor reads the relay's state; the circuit is assembled after both.</remarks>
public static class NightRun
{
    /// <summary>Rows the zoom windows' store holds before it grows: twelve windows of 12 minutes of the busy bench night
    /// (a noise pulse every minute, headlights) fit.</summary>
    public const int ZoomStoreRows = 16384;

    /// <summary>Default run length of a plain transient, seconds.</summary>
    public const double DefaultDuration = 86400.0;

    public static NightRunResult Run(NightRunRequest request, IProgress<double>? progress = null)
    {
        NetlistDefinition net = request.Netlist;
        if (request.Scenario is not null)
        {
            IReadOnlyList<string> misfit = ScenarioFit.Problems(net, request.Scenario, request.NetlistPath, request.ScenarioPath ?? "scenario");
            if (misfit.Count > 0) throw new RunInputException(misfit);
        }
        LightProfile? profile = request.Scenario?.CreateProfile();
        double stop = profile?.Duration ?? request.Duration ?? DefaultDuration;

        List<Device> devices = CreateDevices(net);
        List<string> nodes = NetlistNodes(net);
        var problems = new List<string>();
        ILightSignal? light = profile;
        if (profile is not null)
        {
            AddNoise(profile, devices);
            light = Couple(request, profile, devices, problems);
        }
        if (problems.Count > 0) throw new RunInputException(problems);

        // A capacitive-dropper supply runs cycle-averaged between windows of full mains detail (docs/supply.md): its
        // averaged model joins the circuit as an engine-internal device (no part, never reported).
        if (request.Options.MainsAveraging && Supply.AveragedDropper.For(devices) is { } averaged) devices.Add(averaged);
        Circuit circuit = Circuit.FromDevices(net.Name, devices, light);
        // The nodes, plus each relay's coil current: the analysis compares the coil against its pull-in from it.
        List<string> recorded = [.. nodes, .. devices.Select(d => d.Role).OfType<RelayCoilRole>().Select(r => r.CoilCurrent)];
        TransientOptions options = request.Options with { RecordNodes = recorded, ConstantLux = request.ConstantLux };
        var solver = new TransientSolver(circuit, options, light) { Cancellation = request.Cancellation, TraceBuffers = request.TraceBuffers };

        List<ISwitchedLoad> loads = devices.OfType<ISwitchedLoad>().Where(l => l.LoadName is not null).ToList();
        bool capture = !request.SummaryOnly;
        var zoomIndices = nodes.Select(circuit.IndexOf).ToList();
        // Long enough for a dusk or a timer's end (minutes); faster events use a few seconds of it. Made only when
        // plots are, with their ring and store set up before the first step (ZoomStoreRows: about 2.9 MB for 20 nodes).
        ZoomCapture? zoom = capture
            ? new ZoomCapture(zoomIndices, storeRows: ZoomStoreRows) { Before = NightTraces.SlowZoomBefore, After = NightTraces.SlowZoomAfter, MergeWithin = NightTraces.FastZoomAfter }
            : null;
        // A narrow window around each switch-on: the trigger dip and the relay's pull-in take milliseconds.
        ZoomCapture? detail = capture ? new ZoomCapture(zoomIndices, ringSize: 1024, maxWindows: 6) { Before = 0.02, After = 0.06 } : null;
        bool[] lastOn = new bool[loads.Count];
        double nextReport = 0;
        // A mains-fed supply is watched at every accepted point (the rail Zener's current, the relay drives, the ripple).
        Supply.SupplyWatch? supplyWatch = Supply.SupplyWatch.Create(circuit);
        solver.Accepted = s =>
        {
            supplyWatch?.Observe(s.Time, s.Solution);
            zoom?.Add(s.Time, s.Solution);
            detail?.Add(s.Time, s.Solution);
            for (int i = 0; i < lastOn.Length; i++)
            {
                bool on = loads[i].LoadOn;
                if (on != lastOn[i])
                {
                    lastOn[i] = on;
                    zoom?.Mark(s.Time, on ? "load on" : "load off");
                    if (on) detail?.Mark(s.Time, "load on");
                }
            }
            if (progress is not null && s.Time >= nextReport)
            {
                progress.Report(Math.Clamp(s.Time / stop, 0, 1));
                // Fine enough that a slow run (every mains cycle in full detail: hours per night) still moves the bar
                // and its time estimate every few seconds.
                nextReport = s.Time + stop / 20000;
            }
        };
        SimulationResult sim = solver.Run(stop);
        progress?.Report(1.0);

        // Findings and report text are interpolated by many analysers: build them under the invariant culture.
        using InvariantCultureScope invariant = InvariantCultureScope.Enter();
        RunFacts facts = RunFactsBuilder.Build(request, profile, devices, sim, stop, supplyWatch);
        AnalysisResult analysis = NightAnalysis.Analyze(facts);
        NightReport report = BuildReport(request, profile, facts, analysis, sim);
        TraceTable table = request.SummaryOnly ? TraceTable.Empty : NightTraces.Table(facts, profile, sim, nodes);
        // A long run plots its interesting nights only (PlottedNights states the rule).
        IReadOnlyList<PlotData> plots = zoom is not null && detail is not null
            ? NightTraces.Plots(request, facts, analysis, profile, sim, [(zoom, "zoom"), (detail, "detail")], nodes,
                PlottedNights.Select(report.Nights, report.TargetResults).ToHashSet())
            : [];
        return new NightRunResult(sim, profile, facts, analysis, report, table, plots);
    }

    /// <summary>Every node the netlist names, ground excluded, in first-use order.</summary>
    public static List<string> NetlistNodes(NetlistDefinition net)
    {
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var list = new List<string>();
        foreach (PartDefinition p in net.Parts)
        {
            PartKind? kind = PartCatalog.Find(p.Kind);
            IEnumerable<string> pins = kind is null ? p.Pins.Keys : kind.Pins.Where(p.Pins.ContainsKey);
            foreach (string pin in pins)
            {
                string node = p.Pins[pin];
                if (!Ground.Is(node) && seen.Add(node)) list.Add(node);
            }
        }
        return list;
    }

    /// <summary>The engine devices of a validated netlist, in netlist order.</summary>
    /// <exception cref="RunInputException">A part kind is not registered.</exception>
    public static List<Device> CreateDevices(NetlistDefinition net)
    {
        var devices = new List<Device>();
        foreach (PartDefinition part in net.Parts)
        {
            PartKind kind = PartCatalog.Find(part.Kind) ?? throw new RunInputException([$"{net.SourceFile}: part '{part.Id}': unknown kind '{part.Kind}'"]);
            devices.AddRange(kind.Create(part));
        }
        return devices;
    }

    private static void AddNoise(LightProfile profile, List<Device> devices)
    {
        foreach (IGrouping<(string Node, NoiseQuantity Quantity), NoiseInjection> g in
                 profile.NoiseInjections.GroupBy(n => (n.Node, n.Quantity)))
        {
            string node = g.Key.Node; // ScenarioFit has checked that the netlist has it
            NoiseInjection[] pulses = [.. g.OrderBy(n => n.Time)];
            devices.Add(new NoiseInjector($"noise.{node}.{(g.Key.Quantity == NoiseQuantity.Current ? "i" : "v")}", node,
                [.. pulses.Select(p => p.Time)], [.. pulses.Select(p => p.Width)], [.. pulses.Select(p => p.Amplitude)],
                g.Key.Quantity == NoiseQuantity.Current));
        }
    }

    private static ILightSignal Couple(NightRunRequest request, LightProfile profile, List<Device> devices, List<string> problems)
    {
        var couplings = new List<(int, Func<bool>, double)>();
        foreach (LampCoupling c in profile.LampCouplings)
        {
            int channel = profile.ChannelIndex(c.Channel);
            // ScenarioFit has checked that the part is a relay and the channel exists.
            Device part = devices.First(d => d.PartId == c.Part && d is ISwitchedLoad);
            var load = (ISwitchedLoad)part;
            Func<bool> isOn = c.Contact is string contact && part is Relay relay
                ? ContactQuery(relay, contact, problems, request)
                : () => load.LoadName is not null ? load.LoadOn : part is Relay r && r.IsOperated;
            couplings.Add((channel, isOn, c.Lux));
        }
        return couplings.Count == 0 ? profile : new CoupledLightSignal(profile, couplings);
    }

    private static Func<bool> ContactQuery(Relay relay, string contact, List<string> problems, NightRunRequest request)
    {
        for (int k = 0; k < relay.Contacts.Count; k++)
        {
            if (relay.Contacts[k].Label == contact)
            {
                int index = k;
                return () => relay.IsContactClosed(index);
            }
        }
        problems.Add($"{request.ScenarioPath ?? "scenario"}: error: relay '{relay.PartId}' has no contact '{contact}'. hint: contacts: {string.Join(", ", relay.Contacts.Select(c => c.Label))}");
        return () => false;
    }

    private static NightReport BuildReport(NightRunRequest request, LightProfile? profile, RunFacts facts, AnalysisResult analysis, SimulationResult sim)
    {
        var events = new List<ReportEvent>();
        if (profile is not null)
        {
            foreach (ScheduledLightEvent e in profile.ScheduledEvents)
            {
                if (e.Kind is "lamp-coupling" or "noise") continue; // noise is listed below with its amplitude
                events.Add(new ReportEvent(e.Kind, e.Start, e.End, e.PeakLux, e.Description) { DrawnFromSeed = e.DrawnFromSeed });
            }
            foreach (NoiseInjection n in profile.NoiseInjections)
            {
                events.Add(new ReportEvent("noise", n.Instant, facts.Clock(n.Time + n.Width), n.Amplitude, n.Description) { DrawnFromSeed = profile.IsDrawnFromSeed(n) });
            }
            events.Sort((a, b) => a.Start.CompareTo(b.Start));
        }
        var findings = analysis.Findings.ToList();
        if (sim.Failure is SimulationFailure f)
        {
            findings.Insert(0, new Finding(Severity.Error, "simulation-failed", $"The simulation stopped at {ReportText.Clock(facts.Clock(f.Time))}: {f.Reason}", f.Hint));
        }
        SolverStatistics st = sim.Statistics;
        DesignTargets? targets = request.Scenario?.Targets;
        IReadOnlyList<NightTargets> checks = targets is null ? [] : analysis.Nights.Select(n => TargetEvaluator.Evaluate(targets, n)).ToList();
        return new NightReport
        {
            Tool = request.Tool,
            Netlist = request.NetlistPath,
            Scenario = request.ScenarioPath,
            CircuitName = request.Netlist.Name,
            SiteName = profile?.Scenario.Site.Name,
            TimeZone = profile?.Scenario.Site.TimeZone.Id,
            Seed = profile?.Seed ?? 0,
            Nights = analysis.Nights,
            Findings = findings,
            Events = events,
            Statistics = new ReportStatistics(st.AcceptedSteps, st.RejectedSteps, st.NewtonIterations, st.Events, st.CpuSeconds),
            Parts = ReportPart.List(request.Netlist),
            CircuitHash = ReportPart.Hash(request.Netlist),
            Contacts = ContactDuty.All(facts),
            Cautions = Supply.MainsExposure.Cautions(request.Netlist),
            Targets = targets,
            TargetResults = checks,
            Overview = NightsOverview.Build(analysis.Nights, checks),
        };
    }
}
