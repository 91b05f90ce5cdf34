using NightSim.Devices;
using NightSim.Devices.Composite;
using NightSim.Results;
using NightSim.Transient;

namespace NightSim.Tests.Devices;

public sealed class Timer555Tests
{
    private static readonly Dictionary<string, string> s_pins = new()
    {
        ["vcc"] = "vcc", ["gnd"] = "gnd", ["trigger"] = "trig", ["threshold"] = "tc", ["discharge"] = "dis",
        ["output"] = "out", ["reset"] = "rst",
    };

    /// <summary>"Ideal-parameter" timer: no input currents, near-perfect discharge switch, 1 µV hysteresis, 1 ns
    /// transitions; thresholds exactly 1/3 and 2/3 of the supply from the internal divider.</summary>
    private static Dictionary<string, double> Ideal(Dictionary<string, double>? extra = null)
    {
        var p = new Dictionary<string, double>
        {
            ["thresholdCurrent"] = 0, ["triggerCurrent"] = 0, ["resetCurrent"] = 0, ["dischargeResistance"] = 0.01,
            ["dischargeOffResistance"] = 1e18, ["hysteresis"] = 1e-6, ["transition"] = 1e-9,
        };
        if (extra is not null) foreach (var kv in extra) p[kv.Key] = kv.Value;
        return p;
    }

    private static IEnumerable<Device> Timer(Dictionary<string, double> numbers, string variant = "cmos", Dictionary<string, string>? pins = null) =>
        Timer555.Expand(BlockBench.Part("U1", "timer-555", pins ?? s_pins, numbers, new() { ["variant"] = variant }));

    /// <summary>Trigger source: at supply until t0, a short low pulse of <paramref name="low"/> seconds (1 ns edges).</summary>
    private static VoltageSource TriggerPulse(double vcc, double t0, double low) =>
        BlockBench.Pwl("VT", "trig", (0, vcc), (t0, vcc), (t0 + 1e-9, 0), (t0 + 1e-9 + low, 0), (t0 + 2e-9 + low, vcc));

    private static List<Device> OneShot(double r, double c, double vcc, Dictionary<string, double> timer, double t0, double low)
    {
        var devices = new List<Device>
        {
            BlockBench.Dc("VCC", "vcc", vcc),
            BlockBench.Dc("VR", "rst", vcc),
            TriggerPulse(vcc, t0, low),
            new Resistor("RT", "RT", "vcc", "tc", r),
            new Capacitor("CT", "CT", "tc", "gnd", c),
            new Resistor("RD", "RD", "dis", "tc", 1e-3),
            new Resistor("RL", "RL", "out", "gnd", 10e3),
        };
        devices.AddRange(Timer(timer));
        return devices;
    }

    private static (double Set, double Reset) Pulse(SimulationResult r)
    {
        List<double> up = BlockBench.Times(r, "U1.latch", "q", "high");
        List<double> down = BlockBench.Times(r, "U1.latch", "q", "low");
        Assert.Single(up);
        Assert.Single(down);
        return (up[0], down[0]);
    }

    [Fact]
    public void Expands_Into_Named_Primitives_With_Internal_Nodes()
    {
        List<Device> devices = Timer(Ideal(), "bipolar").ToList();
        string[] names = [.. devices.Select(d => d.Name)];
        Assert.Contains("U1.trigger-comparator", names);
        Assert.Contains("U1.threshold-comparator", names);
        Assert.Contains("U1.reset-comparator", names);
        Assert.Contains("U1.latch", names);
        Assert.Contains("U1.discharge", names);
        Assert.Contains("U1.output-stage", names);
        Assert.All(devices, d => Assert.Equal("U1", d.PartId));
        Assert.Contains("U1.control", devices.SelectMany(d => d.Nodes));   // control pin left out: private node
        Assert.Contains("U1.q", devices.SelectMany(d => d.Nodes));
        // Bipolar defaults add the input currents (typical column, from memory): threshold 0.1 µA, trigger 0.5 µA.
        List<Device> bipolar = Timer([], "bipolar").ToList();
        Assert.Equal(0.1e-6, bipolar.OfType<BiasCurrent>().Single(b => b.Name == "U1.threshold-current").Current, 15);
        Assert.Equal(0.5e-6, bipolar.OfType<BiasCurrent>().Single(b => b.Name == "U1.trigger-current").Current, 15);
    }

    [Fact]
    public void Effective_Parameters_Follow_The_Variant_Unless_Overridden()
    {
        var bipolar = BlockBench.Part("U1", "timer-555", s_pins, new() { ["triggerCurrent"] = 1e-6 }, new() { ["variant"] = "bipolar" });
        Assert.Equal(0.1e-6, Timer555.EffectiveNumber(bipolar, "thresholdCurrent"));
        Assert.Equal(1e-6, Timer555.EffectiveNumber(bipolar, "triggerCurrent"));
        Assert.Equal(1e-6, Timer555.EffectiveNumber(bipolar, "transition"));
        var cmos = BlockBench.Part("U2", "timer-555", s_pins, texts: new() { ["variant"] = "cmos" });
        Assert.Equal(10e-12, Timer555.EffectiveNumber(cmos, "thresholdCurrent"));
        Assert.Throws<KeyNotFoundException>(() => Timer555.EffectiveNumber(cmos, "nonsense"));
        // No variant: bipolar, typical column; the maximum column on request.
        var plain = BlockBench.Part("U3", "timer-555", s_pins);
        Assert.Equal(0.1e-6, Timer555.EffectiveNumber(plain, "thresholdCurrent"));
        Assert.Equal(0.1e-3, Timer555.EffectiveNumber(plain, "resetCurrent"));
        var worst = BlockBench.Part("U4", "timer-555", s_pins, texts: new() { ["inputCurrents"] = "maximum" });
        Assert.Equal(0.25e-6, Timer555.EffectiveNumber(worst, "thresholdCurrent"));
        Assert.Equal(0.9e-6, Timer555.EffectiveNumber(worst, "triggerCurrent"));
        Assert.Equal(0.4e-3, Timer555.EffectiveNumber(worst, "resetCurrent"));
    }

    // One-shot width t_w = ln 3 · R · C (the 555 monostable relation, Horowitz & Hill, The Art of Electronics, 3rd ed., ch. 7), within 0.2 % for an ideal-parameter
    // timer, R from 10 kΩ to 10 MΩ and C from 1 nF to 3300 µF, at default options. Width = latch set → latch reset.
    [Theory]
    [InlineData(10e3, 1e-9)]
    [InlineData(10e3, 3300e-6)]
    [InlineData(1e6, 100e-6)]
    [InlineData(10e6, 1e-9)]
    [InlineData(10e6, 3300e-6)]
    [InlineData(100e3, 10e-6)]
    public void OneShot_Width_Is_Ln3_RC(double r, double c)
    {
        double tw = Math.Log(3.0) * r * c;
        double t0 = 2e-3;
        SimulationResult result = BlockBench.Run(OneShot(r, c, 12.0, Ideal(), t0, Math.Min(1e-6, 0.05 * tw)), t0 + 1.5 * tw + 1e-3);
        var (set, reset) = Pulse(result);
        Assert.Equal(t0, set, 1e-6 + 1e-9 * t0);
        Assert.True(Math.Abs((reset - set) / tw - 1.0) < 0.002, $"width {reset - set} s, expected {tw} s");
    }

    // Constant 1 µA drain on the timing capacitor, 12 V, 1 MΩ, 100 µF: t = RC·ln(A/(A − 2V/3)), A = V − I·R
    // (textbook RC charging with a constant drain; 129.93 s computed from that formula, ±0.1 %).
    [Fact]
    public void Constant_1uA_Drain_Stretches_The_Pulse_To_129_93_s()
    {
        List<Device> devices = OneShot(1e6, 100e-6, 12.0, Ideal(), 1.0, 1e-3);
        devices.Add(new CurrentSource("IL", "IL", "tc", "gnd", Waveform.Dc(1e-6)));
        SimulationResult r = BlockBench.Run(devices, 200.0);
        var (set, reset) = Pulse(r);
        Assert.Equal(129.93, reset - set, 129.93 * 1e-3);
    }

    // With a drain of 4 µA or more the capacitor never reaches 2/3 of 12 V through 1 MΩ (I·R ≥ V/3: the charging current
    // left at the threshold is (V/3)/R = 4 µA): the output stays high to the end of the run, the latch is never reset.
    // Exactly 4 µA is a tie (the asymptote is the threshold itself) that a solver within its tolerance (rtol 1e-4 of 8 V) may decide either way once its
    // steps are long against τ = 100 s; 4.01 µA leaves the asymptote 10 mV below the threshold.
    [Theory]
    [InlineData(4.01e-6)]
    [InlineData(16e-6)]
    public void Drain_Of_4uA_Or_More_Never_Ends(double drain)
    {
        List<Device> devices = OneShot(1e6, 100e-6, 12.0, Ideal(), 1.0, 1e-3);
        devices.Add(new CurrentSource("IL", "IL", "tc", "gnd", Waveform.Dc(drain)));
        SimulationResult r = BlockBench.Run(devices, 2000.0);
        Assert.Single(BlockBench.Times(r, "U1.latch", "q", "high"));
        Assert.Empty(BlockBench.Times(r, "U1.latch", "q", "low"));
        Assert.DoesNotContain(r.Events, e => e.Device == "U1.threshold-comparator");
        Assert.True(r.Trace("out")!.At(2000.0) > 11.5, "output must still be high at the end of the run");
        Assert.True(r.Trace("tc")!.Max < 8.0, "the timing capacitor must stay below 2/3 of the supply");
    }

    // Largest threshold current 0.25 µA at 15 V with 10 MΩ: t = RC·ln 5 = 1.6094·RC (constant drain: A = 15 − 2.5 = 12.5 V,
    // t = RC·ln(12.5/(12.5 − 10)), computed by hand).
    [Fact]
    public void Threshold_Current_Of_0_25uA_At_15V_With_10MOhm_Gives_1_6094_RC()
    {
        SimulationResult r = BlockBench.Run(OneShot(10e6, 1e-6, 15.0, Ideal(new() { ["thresholdCurrent"] = 0.25e-6 }), 2e-3, 1e-6), 30.0);
        var (set, reset) = Pulse(r);
        Assert.Equal(Math.Log(5.0) * 10.0, reset - set, 10.0 * Math.Log(5.0) * 2e-3);
    }

    // Bipolar defaults (typical threshold current 0.1 µA, from memory; leakage common practice): 0.1 µA into THRES and ≈ 16 nA of discharge leakage
    // (500 MΩ) drain the timing capacitor: V∞ = (V/R − I)/(1/R + 1/R_L), τ = C·(R ∥ R_L), t = τ·ln(V∞/(V∞ − 2V/3))
    // (textbook RC charging with a constant drain and a leakage resistance, combined by hand) = 110.55 s for 1 MΩ, 100 µF, 12 V.
    [Fact]
    public void Bipolar_Input_Current_And_Discharge_Leakage_Lengthen_The_Pulse()
    {
        var devices = new List<Device>
        {
            BlockBench.Dc("VCC", "vcc", 12.0),
            BlockBench.Dc("VR", "rst", 12.0),
            TriggerPulse(12.0, 2e-3, 1e-3),
            new Resistor("RT", "RT", "vcc", "tc", 1e6),
            new Capacitor("CT", "CT", "tc", "gnd", 100e-6),
            new Resistor("RD", "RD", "dis", "tc", 1e-3),
            new Resistor("RL", "RL", "out", "gnd", 10e3),
        };
        devices.AddRange(Timer(new() { ["dischargeResistance"] = 0.01 }, "bipolar"));
        SimulationResult r = BlockBench.Run(devices, 200.0);
        var (set, reset) = Pulse(r);
        double g = 1.0 / 1e6 + 1.0 / 500e6;
        double vInf = (12.0 / 1e6 - 0.1e-6) / g;
        double expected = 100e-6 / g * Math.Log(vInf / (vInf - 8.0));
        Assert.Equal(expected, reset - set, expected * 2e-3);
        Assert.True(reset - set > Math.Log(3.0) * 100.0 * 1.005, "the drain must lengthen the pulse beyond ln 3·RC");
    }

    // The one-shot with the default part (no variant, no overrides: bipolar, typical input currents) against the
    // closed form with its input currents: the timing capacitor charges through R towards V while the threshold pin
    // draws I_th and the discharge transistor leaks through R_L, so V∞ = (V/R − I_th)/(1/R + 1/R_L), τ = C·(R ∥ R_L),
    // t = τ·ln(V∞/(V∞ − 2V/3)) (RC charging with a constant drain, combined by hand; the 555 thresholds at 1/3 and 2/3
    // of the supply, Horowitz & Hill, The Art of Electronics, 3rd ed., ch. 7). The trigger and reset currents flow into
    // ideal sources and do not touch the timing. With the maximum column (0.25 µA) the pulse is longer again.
    [Theory]
    [InlineData(null, 0.1e-6)]
    [InlineData("maximum", 0.25e-6)]
    public void Default_Part_OneShot_Matches_The_Closed_Form_With_Its_Input_Currents(string? column, double thresholdCurrent)
    {
        var devices = new List<Device>
        {
            BlockBench.Dc("VCC", "vcc", 12.0),
            BlockBench.Dc("VR", "rst", 12.0),
            TriggerPulse(12.0, 2e-3, 1e-3),
            new Resistor("RT", "RT", "vcc", "tc", 1e6),
            new Capacitor("CT", "CT", "tc", "gnd", 100e-6),
            new Resistor("RD", "RD", "dis", "tc", 1e-3),
            new Resistor("RL", "RL", "out", "gnd", 10e3),
        };
        var texts = column is null ? null : new Dictionary<string, string> { ["inputCurrents"] = column };
        devices.AddRange(Timer555.Expand(BlockBench.Part("U1", "timer-555", s_pins, texts: texts)));
        SimulationResult r = BlockBench.Run(devices, 200.0);
        var (set, reset) = Pulse(r);
        double g = 1.0 / 1e6 + 1.0 / 500e6;
        double vInf = (12.0 / 1e6 - thresholdCurrent) / g;
        double expected = 100e-6 / g * Math.Log(vInf / (vInf - 8.0));
        Assert.Equal(expected, reset - set, expected * 2e-3);
    }

    // Astable: f = 1.44/((Ra + 2Rb)·C) within 1 % (the 555 astable relation, Horowitz & Hill, The Art of Electronics, 3rd ed., ch. 7); 1 kΩ / 10 kΩ / 100 nF → 685.7 Hz
    // (t_H = ln2·(Ra + Rb)C = 0.7625 ms, t_L = ln2·Rb·C = 0.6931 ms, 687.0 Hz, duty 52.4 %, computed from those).
    [Fact]
    public void Astable_Frequency_Is_1_44_Over_Ra_Plus_2Rb_C()
    {
        var devices = new List<Device>
        {
            BlockBench.Dc("VCC", "vcc", 12.0),
            new Resistor("RA", "RA", "vcc", "dis", 1e3),
            new Resistor("RB", "RB", "dis", "tc", 10e3),
            new Capacitor("CT", "CT", "tc", "gnd", 100e-9),
            new Resistor("RL", "RL", "out", "gnd", 10e3),
        };
        var pins = new Dictionary<string, string>(s_pins) { ["trigger"] = "tc", ["reset"] = "vcc" };
        devices.AddRange(Timer(Ideal(), pins: pins));
        SimulationResult r = BlockBench.Run(devices, 0.02);
        List<double> up = BlockBench.Times(r, "U1.latch", "q", "high");
        List<double> down = BlockBench.Times(r, "U1.latch", "q", "low");
        Assert.True(up.Count > 10);
        double period = (up[^1] - up[2]) / (up.Count - 3);
        Assert.Equal(1.44 / (21e3 * 100e-9), 1.0 / period, 1.44 / (21e3 * 100e-9) * 0.01);
        double high = down.First(t => t > up[2]) - up[2];
        Assert.Equal(Math.Log(2.0) * 11e3 * 100e-9, high, Math.Log(2.0) * 11e3 * 100e-9 * 1e-3);
        Assert.Equal(Math.Log(2.0) * 10e3 * 100e-9, period - high, Math.Log(2.0) * 10e3 * 100e-9 * 1e-3);
    }

    // Engine check: the one-shot of ln 3 · 1 MΩ · 100 µF = 109.861 s (555 monostable relation) with default step control. The
    // threshold crossing lies inside a step of several seconds; the engine must locate it on re-taken steps rather than
    // fire at the end of the step (that gave 110.91 s, +1 %).
    [Fact]
    public void Engine_Locates_Threshold_Crossing_With_Default_Steps()
    {
        double tw = Math.Log(3.0) * 100.0;
        SimulationResult result = BlockBench.Run(OneShot(1e6, 100e-6, 12.0, Ideal(), 1.0, 1e-6), 150.0);
        var (set, reset) = Pulse(result);
        Assert.True(Math.Abs((reset - set) / tw - 1.0) < 0.002, $"width {reset - set} s, expected {tw} s");
    }

    // Trigger held low 300 s with t_w = 110 s: the output stays high until the trigger is released (555 logic,
    // common practice: a trigger below V_CC/3 keeps the latch set whatever the threshold input).
    [Fact]
    public void Trigger_Held_Low_Keeps_The_Output_High_Until_Released()
    {
        SimulationResult r = BlockBench.Run(OneShot(1e6, 100e-6, 12.0, Ideal(), 1.0, 300.0), 400.0);
        var (set, reset) = Pulse(r);
        Assert.Equal(1.0, set, 1e-6);
        Assert.Equal(301.0, reset, 1e-6);
        Assert.True(r.Trace("out")!.At(200.0) > 11.5);
        Assert.True(r.Trace("out")!.At(302.0) < 0.1);
    }

    // Reset dominates (555 logic, common practice: RESET low → output low, discharge on): a reset pulse in the middle of the
    // one-shot ends it at once, and a trigger while reset is held low does not set the output.
    [Fact]
    public void Reset_Dominates_Trigger_And_Ends_The_Pulse()
    {
        var devices = new List<Device>
        {
            BlockBench.Dc("VCC", "vcc", 12.0),
            BlockBench.Pwl("VR", "rst", (0, 12), (20, 12), (20 + 1e-6, 0), (30, 0), (30 + 1e-6, 12)),
            BlockBench.Pwl("VT", "trig", (0, 12), (1, 12), (1 + 1e-9, 0), (1.001, 0), (1.001 + 1e-9, 12),
                (25, 12), (25 + 1e-9, 0), (26, 0), (26 + 1e-9, 12)),
            new Resistor("RT", "RT", "vcc", "tc", 1e6),
            new Capacitor("CT", "CT", "tc", "gnd", 100e-6),
            new Resistor("RD", "RD", "dis", "tc", 1e-3),
            new Resistor("RL", "RL", "out", "gnd", 10e3),
        };
        devices.AddRange(Timer(Ideal()));
        SimulationResult r = BlockBench.Run(devices, 60.0);
        var (set, reset) = Pulse(r);
        Assert.Equal(1.0, set, 1e-6);
        // RESET falls 12 → 0 V in 1 µs and crosses the 0.7 V reset threshold 0.9417 µs after 20 s.
        Assert.Equal(20.0 + 1e-6 * (12 - 0.7) / 12, reset, 1e-7);
        Assert.True(r.Trace("out")!.At(25.5) < 0.1, "trigger while reset is low must not set the output");
        Assert.True(r.Trace("tc")!.At(25.5) < 0.01, "discharge is on while reset is low");
    }

    // Output levels (common practice): bipolar V_OH ≈ V_CC − 1.4…1.7 V; CMOS near rail to rail.
    // Supply current: bipolar 3–10 mA, CMOS 0.1–0.4 mA (common practice bands), at 15 V, output low and unloaded.
    [Theory]
    [InlineData("bipolar", 1e3, 10.3, 10.6, 3e-3, 10e-3)]
    [InlineData("cmos", 100e3, 11.95, 12.0, 0.1e-3, 0.4e-3)]
    public void Output_Level_And_Supply_Current_Follow_The_Family(string variant, double load, double vohMin, double vohMax, double iqMin, double iqMax)
    {
        // Output high at 12 V (bipolar into 1 kΩ ≈ 10 mA; CMOS lightly loaded): trigger held low.
        var high = new List<Device>
        {
            BlockBench.Dc("VCC", "vcc", 12.0), BlockBench.Dc("VR", "rst", 12.0), BlockBench.Dc("VT", "trig", 0.0),
            new Resistor("RT", "RT", "vcc", "tc", 1e6), new Capacitor("CT", "CT", "tc", "gnd", 1e-6),
            new Resistor("RD", "RD", "dis", "tc", 1e-3), new Resistor("RL", "RL", "out", "gnd", load),
        };
        high.AddRange(Timer([], variant));
        double voh = BlockBench.Run(high, 0.01).Trace("out")!.At(0.01);
        Assert.InRange(voh, vohMin, vohMax);

        // Quiescent current at 15 V, output low (not triggered), no load.
        var quiet = new List<Device>
        {
            BlockBench.Dc("VCC", "vcc", 15.0), BlockBench.Dc("VR", "rst", 15.0), BlockBench.Dc("VT", "trig", 15.0),
            new Resistor("RT", "RT", "vcc", "tc", 1e6), new Capacitor("CT", "CT", "tc", "gnd", 1e-6),
            new Resistor("RD", "RD", "dis", "tc", 1e-3),
        };
        quiet.AddRange(Timer([], variant));
        SimulationResult q = BlockBench.Run(quiet, 0.01, TransientOptions.Default with { RecordNodes = ["VCC.i", "out"] });
        double supply = -q.Trace("VCC.i")!.At(0.01) - 15.0 / 1e6;  // minus the timing resistor into the discharge pin
        Assert.InRange(supply, iqMin, iqMax);
        Assert.True(q.Trace("out")!.At(0.01) < 0.1);
    }
}
