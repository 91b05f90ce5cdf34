using NightSim.Devices;
using NightSim.Mna;
using NightSim.Supply;
using NightSim.Transient;

namespace NightSim.Tests.Supply;

/// <summary>
/// The cycle-averaged dropper with windows of full mains detail (docs/supply.md, "Mains averaging") against full mains
/// detail. The cycle-average current of a capacitive dropper into a bridge, I = 4·f·C·(V_pk − V_dc − 2·V_D), is common
/// practice for capacitive-dropper design (from memory: the dropper's swing of 2(V_pk − V_dc − 2V_D) passes through the
/// bridge twice per cycle).
/// </summary>
public sealed class MainsAveragingTests
{
    private const double Peak = 230 * 1.4142135623730951, Hz = 50, Dropper = 470e-9;

    private static List<Device> RelayDropper(double switchAt) => RelayDropperCircuit.Devices(switchAt);

    /// <summary>The devices with the averaged model added, as a night run adds it.</summary>
    private static Circuit Averaged(List<Device> devices)
    {
        AveragedDropper model = AveragedDropper.For(devices) ?? throw new InvalidOperationException("no averaged model found");
        devices.Add(model);
        return Circuit.FromDevices("averaged", devices);
    }

    private sealed record Measured(double Average, double SagMin, double OperateTime, long Steps, long Windows);

    private static Measured RunRelay(bool averaged, double switchAt, double stop)
    {
        List<Device> devices = RelayDropper(switchAt);
        Circuit circuit = averaged ? Averaged(devices) : Circuit.FromDevices("full", devices);
        var options = TransientOptions.Default with { MainsAveraging = averaged };
        var meter = SupplyMeter.Run(circuit, stop, 0.5, "dcp", "gnd", options: options);
        Assert.True(meter.Result.Succeeded, meter.Result.Failure?.ToString());
        var pull = meter.Result.Events.First(e => e.PartId == "K1" && e.Signal == "coil" && e.To == "pulled in");
        var rail = meter.Result.Trace("dcp")!;
        double sag = double.PositiveInfinity;
        for (int i = 0; i < rail.Times.Count; i++)
            if (rail.Times[i] > switchAt) sag = Math.Min(sag, rail.Values[i]);
        var st = meter.Result.Statistics;
        return new Measured(meter.Average, sag, pull.Time - switchAt, st.AcceptedSteps, st.MainsDetailWindows);
    }

    /// <summary>
    /// Issue 12's accuracy bounds (average rail within 2 %, sag minimum within 5 %, relay operate time within 10 %)
    /// against full detail of the same 30 s, the coil switched on at 15 s (the 400 Ω coil and the 1 kΩ load draw more
    /// than the 470 nF dropper gives: the rail sags with τ ≈ 0.13 s to a new level).
    /// </summary>
    [Fact]
    public void Averaged_Run_Matches_Full_Detail_On_Rail_Sag_And_Operate_Time()
    {
        const double switchAt = 15.0, stop = 30.0;
        Measured full = RunRelay(averaged: false, switchAt, stop);
        Measured fast = RunRelay(averaged: true, switchAt, stop);
        Assert.True(fast.Windows >= 1, "the averaged run opened no window of full detail");
        Assert.InRange(fast.Average, 0.98 * full.Average, 1.02 * full.Average);
        Assert.InRange(fast.SagMin, 0.95 * full.SagMin, 1.05 * full.SagMin);
        Assert.InRange(fast.OperateTime, 0.9 * full.OperateTime, 1.1 * full.OperateTime);
    }

    /// <summary>Ten simulated minutes on the dropper with a relay switched on half way take far fewer steps averaged than
    /// full detail takes for one second (full detail: thousands of steps per simulated second).</summary>
    [Fact]
    public void Averaged_Run_Takes_Far_Fewer_Steps_Than_Full_Detail()
    {
        Measured full = RunRelay(averaged: false, switchAt: 0.4, stop: 0.6);
        Measured fast = RunRelay(averaged: true, switchAt: 300, stop: 600);
        double fullPerSecond = full.Steps / 0.6;
        Assert.True(fast.Steps < 0.01 * fullPerSecond * 600,
            $"averaged: {fast.Steps} steps for 600 s; full detail: {fullPerSecond:F0} steps per second");
    }

    /// <summary>
    /// A bridge dropper into a resistor, all averaged (no event opens a window): the rail carries the current
    /// 4·f·C·(V_pk − V_out − 2·V_D) (common practice, from memory), with V_D from the diode's Shockley law
    /// (Shockley, Bell Syst. Tech. J. 28, 1949) at that current, worked here; and the same rail as full detail within 2 %.
    /// </summary>
    [Fact]
    public void Averaged_Current_Matches_The_Cycle_Average_Formula_And_Full_Detail()
    {
        static List<Device> Load() =>
        [
            new VoltageSource("VM", "VM", "line", "neutral", Waveform.Sine(0, Peak, Hz, 0, 0)),
            new Resistor("RF", "RF", "line", "l1", 47),
            new Capacitor("CX", "CX", "l1", "ac1", Dropper),
            new Resistor("RBL", "RBL", "l1", "ac1", 1e6),
            new Diode("D1", "D1", "ac1", "dcp"),
            new Diode("D2", "D2", "neutral", "dcp"),
            new Diode("D3", "D3", "gnd", "ac1"),
            new Diode("D4", "D4", "gnd", "neutral"),
            new Capacitor("CS", "CS", "dcp", "gnd", 47e-6),
            new Resistor("RL", "RL", "dcp", "gnd", 2200),
        ];
        const double stop = 0.6, load = 2200;
        var averaged = SupplyMeter.Run(Averaged(Load()), stop, 0.5, "dcp", "gnd", options: TransientOptions.Default);
        var full = SupplyMeter.Run(Circuit.FromDevices("full", Load()), stop, 0.5, "dcp", "gnd",
            options: TransientOptions.Default with { MainsAveraging = false });
        Assert.True(averaged.Result.Succeeded && full.Result.Succeeded);
        Assert.Equal(0, averaged.Result.Statistics.MainsDetailWindows);

        double vOut = averaged.Average, current = vOut / load;
        // Shockley: V_D = n·V_T·ln(I/I_S + 1), I_S = 1e-14 A, n = 1, V_T = kT/q at 300.15 K.
        double vd = 1.380649e-23 * 300.15 / 1.602176634e-19 * Math.Log(current / 1e-14 + 1.0);
        double formula = 4 * Hz * Dropper * (Peak - vOut - 2 * vd);
        Assert.InRange(current, 0.98 * formula, 1.02 * formula);
        Assert.InRange(averaged.Average, 0.98 * full.Average, 1.02 * full.Average);
    }

    /// <summary>
    /// Half-wave with a Zener shunt on the AC side (the averaged current f·C·(2·V_pk − V_dc − 2·V_D), worked out in
    /// docs/supply.md from the charge balance of the clamped AC node; the existing hand budget for this topology is
    /// f·C·(2V_pk − V_Z − V_F), DropperTopologyTests): all averaged, the rail matches full detail within 1 %, both with the
    /// Zener regulating (1 kΩ load: rail V_Z − V_D) and with the load taking more than the dropper gives (680 Ω).
    /// </summary>
    [Theory]
    [InlineData(1000.0)]
    [InlineData(680.0)]
    public void Half_Wave_Averaged_Rail_Matches_Full_Detail(double load)
    {
        List<Device> Parts() =>
        [
            new VoltageSource("VM", "VM", "line", "gnd", Waveform.Sine(0, Peak, Hz, 0, 0)),
            new Resistor("RF", "RF", "line", "l1", 47),
            new Capacitor("CX", "CX", "l1", "a", Dropper),
            new Resistor("RBL", "RBL", "l1", "a", 1e6),
            Zener.Create("DZ", "DZ", "gnd", "a", 12, 5e-3, 10),
            new Diode("D1", "D1", "a", "vcc"),
            new Capacitor("CS", "CS", "vcc", "gnd", 470e-6),
            new Resistor("RL", "RL", "vcc", "gnd", load),
        ];
        List<Device> averagedParts = Parts();
        Assert.Equal(RectifierShape.HalfWave, AveragedDropper.For(averagedParts)!.Shape);
        var averaged = SupplyMeter.Run(Averaged(averagedParts), 2.0, 1.5, "vcc", "gnd", options: TransientOptions.Default);
        var full = SupplyMeter.Run(Circuit.FromDevices("full", Parts()), 2.0, 1.5, "vcc", "gnd",
            options: TransientOptions.Default with { MainsAveraging = false });
        Assert.True(averaged.Result.Succeeded && full.Result.Succeeded);
        Assert.InRange(averaged.Average, 0.99 * full.Average, 1.01 * full.Average);
    }

    /// <summary>
    /// Entering full detail part-way through a mains cycle (three cycles before the coil's scheduled switch, at a phase
    /// the switch sets) gives the dropper its steady-state charge: the mains current in the first cycle stays within the
    /// steady peak V_pk·2πf·C (I = V·2πfC for a capacitor, common practice) plus 30 %, and the rail does not jump. Without
    /// that charge the dropper would meet the mains at up to V_pk through 47 Ω: an inrush of amperes.
    /// </summary>
    [Fact]
    public void Entering_Detail_Mid_Cycle_Has_No_Inrush()
    {
        const double switchAt = 0.9137, stop = 1.0;
        List<Device> devices = RelayDropper(switchAt);
        Circuit circuit = Averaged(devices);
        int line = circuit.IndexOf("line"), l1 = circuit.IndexOf("l1"), rail = circuit.IndexOf("dcp");
        var solver = new TransientSolver(circuit, TransientOptions.Default);
        double entry = double.NaN, railAtEntry = 0, peakCurrent = 0, railSwing = 0;
        solver.Accepted = s =>
        {
            if (double.IsNaN(entry) && !s.MainsAveraged && s.Time > 0.5)
            {
                entry = s.Time;
                railAtEntry = s.Solution[rail];
            }
            if (!double.IsNaN(entry) && s.Time <= entry + 1.0 / Hz)
            {
                peakCurrent = Math.Max(peakCurrent, Math.Abs(s.Solution[line] - s.Solution[l1]) / 47.0);
                railSwing = Math.Max(railSwing, Math.Abs(s.Solution[rail] - railAtEntry));
            }
        };
        var result = solver.Run(stop);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        Assert.False(double.IsNaN(entry), "no window of full detail was entered");
        double phase = (entry * Hz) % 1.0;
        Assert.InRange(phase, 0.1, 0.9); // part-way through a cycle, not at a zero crossing
        double steady = Peak * 2 * Math.PI * Hz * Dropper;
        Assert.True(peakCurrent <= 1.3 * steady, $"mains current {peakCurrent * 1e3:F1} mA in the first cycle against {steady * 1e3:F1} mA steady");
        Assert.True(railSwing < 0.3, $"the rail moved {railSwing:F3} V in the first cycle");
    }
}
