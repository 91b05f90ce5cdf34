using NightSim.Devices;
using NightSim.Analysis;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Results;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Transient;

namespace NightSim.Tests.Transient;

/// <summary>
/// Regenerative stages with default transistor models (no junction capacitance given) run through their switching
/// points. Each circuit is also run with the convergence aids switched off, so the test shows the aid is what carries
/// it. Thresholds are checked against the hand analysis of each stage (Horowitz &amp; Hill, The Art of Electronics,
/// 3rd ed., §2.2.7 "Schmitt trigger" and §10.1 on regenerative comparators; the numbers are worked here).
/// </summary>
public sealed class ConvergenceAidTests
{
    private static readonly TransientOptions s_noAids = TransientOptions.Default with { ContinuationCapacitance = 0, NewtonVoltageStepLimit = 0 };

    /// <summary>Input ramps 0 → peak over <paramref name="rise"/> s, holds, and falls back by 2·rise.</summary>
    private static VoltageSource Triangle(string node, double peak, double rise) =>
        new("VIN", "VIN", node, "gnd", Waveform.PiecewiseLinear([(0, 0), (rise, peak), (rise + 10, peak), (2 * rise + 10, 0)]));

    /// <summary>Run time at which the trace first crosses <paramref name="level"/> after <paramref name="from"/>.</summary>
    private static double FirstCrossing(Trace trace, double level, bool rising, double from)
    {
        for (int i = 1; i < trace.Times.Count; i++)
        {
            if (trace.Times[i] < from) continue;
            bool crossed = rising ? trace.Values[i - 1] < level && trace.Values[i] >= level : trace.Values[i - 1] > level && trace.Values[i] <= level;
            if (crossed) return trace.Times[i];
        }
        return double.NaN;
    }

    /// <summary>The demo netlist's stage without its sensor filter capacitor: nothing but default models and resistors
    /// around the two transistors, so every node of the pair is algebraic.</summary>
    private static NightRunResult SnapActionNight(TransientOptions options)
    {
        string net = Path.Combine(RepoPaths.Netlists, "snap-action-trigger.json");
        string scenario = Path.Combine(RepoPaths.Netlists, "snap-action-trigger.scenario.json");
        NetlistDefinition def = NetlistLoader.Read(net).Definition!;
        var request = new NightRunRequest
        {
            Netlist = def with { Parts = def.Parts.Where(p => p.Id != "CB1").ToList() },
            NetlistPath = net,
            Scenario = ScenarioLoader.LoadOrThrow(scenario),
            ScenarioPath = scenario,
            Options = options,
        };
        return NightRun.Run(request);
    }

    /// <summary>The bare snap-action pair (npn + pnp, 10 MΩ feedback, default transistor models, relay coil) through a
    /// whole night: it switches on at dusk, through pseudo-transient continuation.</summary>
    [Fact]
    public void Snap_Action_Stage_Runs_A_Whole_Night_With_Default_Models()
    {
        NightRunResult run = SnapActionNight(TransientOptions.Default);
        Assert.True(run.Simulation.Succeeded, run.Simulation.Failure?.ToString());
        Assert.True(run.Simulation.Statistics.Continuations > 0);
        Assert.Equal(LoadCause.Dusk, run.Analysis.Intervals[0].Cause);
    }

    [Fact]
    public void Snap_Action_Stage_Fails_At_Its_Switching_Point_Without_Continuation()
    {
        NightRunResult run = SnapActionNight(s_noAids);
        Assert.False(run.Simulation.Succeeded);
        SimulationFailure failure = run.Simulation.Failure!;
        Assert.Contains("did not converge", failure.Reason, StringComparison.Ordinal);
        // The failure keeps its work: the worst nodes with their last values and the parts on them, in a partial report.
        Assert.Equal(failure.WorstNodes.Count, failure.WorstValues.Count);
        Assert.Contains("RF", failure.Parts);
        Assert.Contains("--accuracy loose", failure.Hint, StringComparison.Ordinal);
        using var stream = new MemoryStream();
        PartialReportWriter.Write(new PartialReportWriter.Content("n.json", "s.json", run.Facts.Duration, failure.Time, "19:51:40",
            failure, run.Simulation.Statistics), stream);
        using var doc = System.Text.Json.JsonDocument.Parse(stream.ToArray());
        Assert.True(doc.RootElement.GetProperty("partial").GetBoolean());
        var worst = doc.RootElement.GetProperty("failure").GetProperty("worstNodes");
        Assert.Equal(failure.WorstNodes.Count, worst.GetArrayLength());
        Assert.Equal(failure.Time, doc.RootElement.GetProperty("failure").GetProperty("runSeconds").GetDouble());
    }

    /// <summary>Emitter-coupled Schmitt trigger: Q1 and Q2 share RE; Q1's collector drives Q2's base through a 47k/47k
    /// divider. No capacitance anywhere.</summary>
    private static Circuit Schmitt() => Circuit.FromDevices("schmitt",
    [
        new VoltageSource("VCC", "VCC", "vcc", "gnd", Waveform.Dc(12)),
        Triangle("in", 8.0, 100),
        new Resistor("RIN", "RIN", "in", "b1", 10e3),
        new Bjt("Q1", "Q1", "c1", "b1", "emit"),
        new Resistor("RC1", "RC1", "vcc", "c1", 10e3),
        new Resistor("RB2", "RB2", "c1", "b2", 47e3),
        new Resistor("RB2G", "RB2G", "b2", "gnd", 47e3),
        new Bjt("Q2", "Q2", "c2", "b2", "emit"),
        new Resistor("RC2", "RC2", "vcc", "c2", 1e3),
        new Resistor("RE", "RE", "emit", "gnd", 1e3),
    ]);

    [Fact]
    public void Schmitt_Trigger_Of_Two_Transistors_Shows_Its_Hysteresis()
    {
        SimulationResult result = TransientSolver.Run(Schmitt(), 220);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        Trace c2 = result.Trace("c2")!;
        Trace input = result.Trace("in")!;
        // At rest Q2 conducts alone: its base divider gives 12·47/104 = 5.42 V behind 25.8 kΩ, so with β = 200 the
        // emitter sits at (5.42 − 0.65)/(1 + 25.8k/(201·1k)) ≈ 4.23 V. Q1 takes over (c2 goes high) as soon as the input
        // passes that emitter level plus the little V_BE of a barely conducting Q1; once Q1 conducts, c1 falls, Q2 is off
        // and the emitter follows Q1, so the input must fall well below 4.2 V before Q2 takes back.
        double up = FirstCrossing(c2, 10, rising: true, from: 0);
        double down = FirstCrossing(c2, 10, rising: false, from: up);
        Assert.False(double.IsNaN(up), $"c2 never rose past 10 V: min {c2.Min} V, max {c2.Max} V");
        Assert.False(double.IsNaN(down), $"c2 never fell back below 10 V after {up} s; at the end {c2.Values[^1]} V");
        double vUp = input.At(up), vDown = input.At(down);
        Assert.InRange(vUp, 4.2, 5.0);
        Assert.True(vDown < vUp - 0.5, $"switch-off at {vDown:F2} V should lie well below switch-on at {vUp:F2} V");
    }

    /// <summary>Latch of two cross-coupled npn transistors (10k collector loads, 47k base resistors from the other's
    /// collector); "set" and "reset" pulses of 5 V reach the bases through 22k.</summary>
    private static Circuit Latch() => Circuit.FromDevices("latch",
    [
        new VoltageSource("VCC", "VCC", "vcc", "gnd", Waveform.Dc(12)),
        new VoltageSource("VSET", "VSET", "set", "gnd", Waveform.Pulse(0, 5, 1.0, 1e-6, 1e-6, 1e-3, double.PositiveInfinity)),
        new VoltageSource("VRST", "VRST", "rst", "gnd", Waveform.Pulse(0, 5, 2.0, 1e-6, 1e-6, 1e-3, double.PositiveInfinity)),
        new Resistor("RC1", "RC1", "vcc", "q", 10e3),
        new Resistor("RC2", "RC2", "vcc", "qn", 10e3),
        new Resistor("RB1", "RB1", "qn", "b1", 47e3),
        new Resistor("RB2", "RB2", "q", "b2", 47e3),
        new Bjt("Q1", "Q1", "q", "b1", "gnd"),
        new Bjt("Q2", "Q2", "qn", "b2", "gnd"),
        new Resistor("RS", "RS", "set", "b2", 22e3),
        new Resistor("RR", "RR", "rst", "b1", 22e3),
    ]);

    [Fact]
    public void Transistor_Latch_Sets_And_Resets()
    {
        SimulationResult result = TransientSolver.Run(Latch(), 3.0);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        Trace q = result.Trace("q")!;
        // "set" turns Q2 on, so qn falls, Q1 loses its base drive and q rises to near 12 V·(47k + b-e)/(57k) ≈ 10 V;
        // "reset" turns Q1 on: q falls to a saturated transistor's few tens of millivolts.
        Assert.True(q.At(1.5) > 9.0, $"q after set: {q.At(1.5)} V");
        Assert.True(q.At(2.5) < 0.3, $"q after reset: {q.At(2.5)} V");
    }
}
