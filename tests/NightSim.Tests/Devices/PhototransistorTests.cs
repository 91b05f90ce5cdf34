using NightSim.Devices;
using NightSim.Devices.Light;
using NightSim.Results;

namespace NightSim.Tests.Devices;

public sealed class PhototransistorTests
{
    private static Phototransistor Make(double? lux, IReadOnlyList<(double, double)>? pwl = null) =>
        new("Q1", "Q1", "c", "e", 1e-9, 500.0, 10e-9, 0.1, 10e-12, new LightInput("sensor", 1.0, lux, pwl));

    // Collector current k·E + I_dark with k = β·base responsivity = 0.5 µA/lx (from memory) once
    // V_CE is well above the saturation knee.
    [Fact]
    public void Collector_Current_Is_Gain_Times_Base_Photocurrent_Plus_Dark()
    {
        var h = new StampHarness("c", "e");
        Phototransistor q = Make(100.0);
        q.Setup(h);
        LoadContext ctx = h.Load(q, [5.0, 0.0]);
        Assert.Equal(500.0 * 1e-9 * 100.0 + 10e-9 + 1e-12 * 5.0, ctx.J[0], 1e-15);   // + gmin·V_CE
        h.AssertJacobians(q, [5.0, 0.0]);
        h.AssertJacobians(q, [0.05, 0.0]);
        h.AssertJacobians(q, [-0.3, 0.0]);
    }

    // Into 10 kΩ from 12 V: 20 lx → ≈ 0.1 V, 100 lx → ≈ 0.5 V (Ohm's law: 0.5 µA/lx · 20 lx · 10 kΩ = 0.1 V); at 10 klx the 5 mA available
    // would need 50 V, so the transistor saturates and the resistor sees almost the whole supply.
    [Theory]
    [InlineData(20.0, 0.1, 0.01)]
    [InlineData(100.0, 0.5, 0.01)]
    [InlineData(10000.0, 11.8, 0.2)]
    public void Emitter_Resistor_Voltage_Follows_The_Light(double lux, double expected, double tolerance)
    {
        SimulationResult r = BlockBench.Run(
        [
            BlockBench.Dc("VCC", "v", 12.0),
            new Phototransistor("Q1", "Q1", "v", "e", 1e-9, 500.0, 10e-9, 0.1, 10e-12, new LightInput("sensor", 1.0, lux, null)),
            new Resistor("RE", "RE", "e", "gnd", 10e3),
        ], 0.01);
        Assert.Equal(expected, r.Trace("e")!.At(0.01), tolerance);
        Assert.True(r.Trace("e")!.At(0.01) < 12.0);
    }
}
