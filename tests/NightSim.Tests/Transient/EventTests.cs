using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Tests.Fixtures;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Transient;

/// <summary>Event location in the step loop: crossing times, logic passes, scheduled switching.</summary>
public sealed class EventTests
{
    private const double R = 1e6, C = 1e-6, V = 12;

    private static (Circuit Circuit, ThresholdSwitch First, ThresholdSwitch Second) Timer()
    {
        // RC charging to 12 V; a threshold at 2/3 of the supply (8 V) is crossed at t* = RC·ln 3 = 1.0986 s
        // (RC closed form v = V(1 − e^(−t/RC)) solved for 2V/3). The first switch then
        // loads node "out"; the second follows the first in the same logic pass.
        var first = new ThresholdSwitch("U1", "cap", "out", "gnd", 2.0 / 3.0 * V, 1e3);
        var second = new ThresholdSwitch("U2", "cap", "out2", "gnd", 0, 1e3, follow: first);
        var circuit = Circuit.FromDevices("timer",
        [
            new VoltageSource("V1", "V1", "vcc", "gnd", Waveform.Dc(V)),
            new Resistor("R1", "R1", "vcc", "cap", R),
            new Capacitor("C1", "C1", "cap", "gnd", C),
            new Resistor("R2", "R2", "vcc", "out", 1e3),
            new Resistor("R3", "R3", "vcc", "out2", 1e3),
            first,
            second,
        ]);
        return (circuit, first, second);
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(1e-3)]
    [InlineData(60)]
    public void Crossing_Time_Is_Located_Within_1us_Whatever_The_Step_Size(double maxStep)
    {
        var (circuit, first, second) = Timer();
        // Tight integration tolerance so that the integration error (≈ steps × local tolerance) stays far below the
        // 1 µs location tolerance being tested.
        var options = TransientOptions.Verification with { SupplyRamp = 0, MaxStep = maxStep, RelativeTolerance = 1e-10, VoltageTolerance = 1e-12 };
        var result = TransientSolver.Run(circuit, 2.0, options);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        double exact = R * C * Math.Log(3);
        Assert.Equal(2, result.Events.Count);
        Assert.Equal("U1", result.Events[0].Device);
        Assert.Equal("on", result.Events[0].To);
        Assert.True(Math.Abs(result.Events[0].Time - exact) <= 1e-6, $"event at {result.Events[0].Time:R} s, exact {exact:R} s");
        // Logic pass: the follower fires at the same time.
        Assert.Equal("U2", result.Events[1].Device);
        Assert.Equal(result.Events[0].Time, result.Events[1].Time);
        Assert.True(first.IsOn && second.IsOn);
        // After the event the load is connected: out = 12 V · 1k/(1k + 1k) = 6 V.
        Assert.Equal(6.0, result.Trace("out")!.Values[^1], 6);
        Assert.Equal(V, result.Trace("out")!.At(exact - 1e-3), 6);
        Assert.Equal(2, result.Statistics.Events);
    }

    [Fact]
    public void Scheduled_Switch_Changes_State_Exactly_At_Its_Time()
    {
        // Switch closes at 0.25 s and opens at 0.75 s: it discharges an RC through 1 kΩ only in between.
        var circuit = Circuit.FromDevices("switched",
        [
            new Capacitor("C1", "C1", "a", "gnd", 1e-3, initialVoltage: 10),
            new Resistor("R1", "R1", "a", "gnd", 1e9),
            new Switch("S1", "S1", "a", "gnd", 1e3, 1e12, false, [(0.25, 1), (0.75, 0)]),
        ]);
        var result = TransientSolver.Run(circuit, 1.0, TransientOptions.Verification with { RelativeTolerance = 1e-10, VoltageTolerance = 1e-12 });
        Assert.True(result.Succeeded, result.Failure?.ToString());
        Assert.Equal(2, result.Events.Count);
        Assert.Equal(0.25, result.Events[0].Time, 12);
        Assert.Equal(0.75, result.Events[1].Time, 12);
        // 10 V·e^(−0.5 s / 1 s) after the closed interval (τ = 1 kΩ·1 mF = 1 s), times e^(−1 s / 1e6 s) for the 1 GΩ
        // leak over the whole second (RC closed form).
        double exact = 10 * Math.Exp(-0.5 * (1 + 1e3 / 1e9 + 1e3 / 1e12)) * Math.Exp(-0.5 / 1e6 * (1 + 1e9 / 1e12));
        Assert.True(Math.Abs(result.Trace("a")!.Values[^1] - exact) <= 1e-6, $"{result.Trace("a")!.Values[^1]:R} V, exact {exact:R} V");
    }
}
