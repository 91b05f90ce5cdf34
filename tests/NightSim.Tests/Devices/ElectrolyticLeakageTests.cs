using NightSim.Devices;
using NightSim.Netlist;

namespace NightSim.Tests.Devices;

public sealed class ElectrolyticLeakageTests
{
    // IEC 60384-4 (fixed aluminium electrolytic capacitors), leakage current requirement after charging at rated
    // voltage: I ≤ 0.01·C·U_R (I in µA, C in µF, U_R in V) or 3 µA, whichever is the greater.
    [Theory]
    [InlineData(3300e-6, 16.0, 528e-6)]   // 0.01 × 3300 µF × 16 V = 528 µA
    [InlineData(100e-6, 25.0, 25e-6)]     // 0.01 × 100 µF × 25 V = 25 µA
    [InlineData(10e-6, 16.0, 3e-6)]       // 0.01 × 10 µF × 16 V = 1.6 µA, below the 3 µA floor
    public void Limit_Is_The_Larger_Of_0_01_CV_And_3_uA(double c, double v, double expected)
    {
        Assert.Equal(expected, ElectrolyticLeakage.Limit(c, v), 12);
    }

    [Fact]
    public void An_Electrolytic_Without_Stated_Leakage_Leaks_A_Typical_Value_And_Needs_Its_Rated_Voltage()
    {
        NetlistLoadResult ok = NetlistLoader.ReadText("""
            { "name": "t", "parts": [
              { "id": "R1", "kind": "resistor", "nodes": ["a", "gnd"], "value": "10k" },
              { "id": "C1", "kind": "capacitor", "nodes": ["a", "gnd"], "value": "1000u", "construction": "electrolytic", "ratedVoltage": "16V" },
              { "id": "C2", "kind": "capacitor", "nodes": ["a", "gnd"], "value": "1000u", "construction": "film" } ] }
            """);
        Assert.True(ok.IsValid, string.Join("\n", ok.Errors));
        PartDefinition c1 = ok.Definition!.Part("C1")!;
        // Typical = 2 % of the IEC 60384-4 limit 0.01 × 1000 µF × 16 V = 160 µA → 3.2 µA.
        Assert.Equal(3.2e-6, Capacitor.EffectiveLeakageCurrent(c1), 12);
        Assert.Equal(160e-6, Capacitor.LeakageLimit(c1), 12);
        Assert.Equal(0.0, Capacitor.EffectiveLeakageCurrent(ok.Definition.Part("C2")!));
        Assert.True(double.IsNaN(Capacitor.LeakageLimit(ok.Definition.Part("C2")!)));

        NetlistLoadResult bad = NetlistLoader.ReadText("""
            { "name": "t", "parts": [
              { "id": "R1", "kind": "resistor", "nodes": ["a", "gnd"], "value": "10k" },
              { "id": "C1", "kind": "capacitor", "nodes": ["a", "gnd"], "value": "1000u", "construction": "electrolytic" } ] }
            """, "bad.json");
        Assert.False(bad.IsValid);
        Assert.Contains(bad.Errors, e => e.ToString().Contains("ratedVoltage", StringComparison.Ordinal) && e.ToString().Contains("C1", StringComparison.Ordinal));
    }
}
