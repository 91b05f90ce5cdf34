using NightSim.Devices;
using NightSim.Netlist;
using NightSim.Transient;
using NightSim.Mna;

namespace NightSim.Tests.Transient;

/// <summary>RC charge and discharge against the exponential closed form v = V(1 − e^(−t/RC)) (any circuits textbook;
/// docs/numerics.md §9).</summary>
public sealed class RcTests
{
    private const double R = 1e3, C = 1e-6, V = 5.0, Tau = R * C;

    private static Circuit ChargeCircuit() => Circuit.FromDevices("rc",
    [
        new VoltageSource("V1", "V1", "in", "gnd", Waveform.Dc(V)),
        new Resistor("R1", "R1", "in", "out", R),
        new Capacitor("C1", "C1", "out", "gnd", C),
    ]);

    [Fact]
    public void Should_Follow_The_Charging_Exponential_Within_1e4_At_Default_Tolerances()
    {
        var options = TransientOptions.Default with { SupplyRamp = 0 };
        var result = TransientSolver.Run(ChargeCircuit(), 8 * Tau, options);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        var trace = result.Trace("out")!;
        Assert.True(trace.Times.Count > 20);
        double worst = 0;
        for (int i = 0; i < trace.Times.Count; i++)
        {
            double exact = V * (1 - Math.Exp(-trace.Times[i] / Tau));
            worst = Math.Max(worst, Math.Abs(trace.Values[i] - exact) / V);
        }
        Assert.True(worst <= 1e-4, $"max relative error {worst:E3}");
        Assert.InRange(trace.Values[^1] - V * (1 - Math.Exp(-8)), -1e-4 * V, 1e-4 * V);
        Assert.Equal(8 * Tau, trace.Times[^1], 15);
    }

    [Fact]
    public void Should_Follow_The_Discharging_Exponential_From_An_Initial_Voltage()
    {
        var circuit = Circuit.FromDevices("rc-discharge",
        [
            new Resistor("R1", "R1", "out", "gnd", R),
            new Capacitor("C1", "C1", "out", "gnd", C, initialVoltage: V),
        ]);
        var result = TransientSolver.Run(circuit, 8 * Tau);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        var trace = result.Trace("out")!;
        double worst = 0;
        for (int i = 0; i < trace.Times.Count; i++)
            worst = Math.Max(worst, Math.Abs(trace.Values[i] - V * Math.Exp(-trace.Times[i] / Tau)) / V);
        Assert.True(worst <= 1e-4, $"max relative error {worst:E3}");
    }

    [Fact]
    public void Should_Ramp_Supplies_From_Zero_At_Power_Up()
    {
        // Power-up: the source ramps linearly over 1 ms, so v_in(0.5 ms) = V/2 exactly.
        var result = TransientSolver.Run(ChargeCircuit(), 2e-3);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        var vin = result.Trace("in")!;
        Assert.Equal(0.0, vin.Values[0], 12);
        Assert.Equal(V / 2, vin.At(0.5e-3), 3);
        Assert.Equal(V, vin.Values[^1], 9);
        // Closed form of an RC driven by a ramp V·t/T: v = (V/T)(t − τ(1 − e^(−t/τ))) for t ≤ T (textbook).
        double t = 1e-3, T = 1e-3;
        double exact = V / T * (t - Tau * (1 - Math.Exp(-t / Tau)));
        Assert.Equal(exact, result.Trace("out")!.At(t), 3);
    }
}
