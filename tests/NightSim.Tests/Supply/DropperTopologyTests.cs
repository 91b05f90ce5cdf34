using NightSim.Mna;
using NightSim.Devices;
using NightSim.Netlist;

namespace NightSim.Tests.Supply;

/// <summary>
/// Capacitive-dropper supplies drawn every usual way, each run 2 s from power-up and its rail checked against a value
/// worked by hand. Hand formulas (derived in the comments from charge conservation on the dropper capacitor, Q = C·ΔV,
/// and the Shockley diode law; e.g. Sedra &amp; Smith, "Microelectronic Circuits", 7th ed., ch. 4 on rectifiers and
/// Zener shunt regulators):
/// <list type="bullet">
/// <item>Bridge: each half cycle the dropper capacitor swings from −(V_pk − V_out − 2V_D) to +(V_pk − V_out − 2V_D), so the
/// charge 2C(V_pk − V_out − 2V_D) passes the bridge twice per cycle: I_avg = 4·f·C·(V_pk − V_out − 2V_D).</item>
/// <item>Half-wave with a Zener shunt: the capacitor swings from −(V_pk − V_F) to +(V_pk − V_Z): I_avg = f·C·(2V_pk − V_Z − V_F).</item>
/// <item>Dropper current: with the rail small against the mains the capacitor sees nearly the whole mains voltage,
/// I_rms ≈ V_rms·2πfC (capacitive reactance, any circuits textbook).</item>
/// </list>
/// </summary>
public sealed class DropperTopologyTests
{
    private const double F = 50, Vrms = 230, Cx = 470e-9, Rf = 47, Bleeder = 1e6;
    private static readonly double s_vpk = Vrms * Math.Sqrt(2);
    private const double Vz = 12, Izt = 5e-3, Zzt = 10;

    /// <summary>Diode drop at the mean conduction current of a dropper bridge: the dropper current is close to a sine of
    /// peak 2πf·C·V_pk, whose mean over a half cycle is 2/π of its peak; V_D = V_T·ln(I/I_S) (Shockley), I_S = 1e-14 A.</summary>
    private static double DiodeDrop(double current) => Junction.ThermalVoltage(300.15) * Math.Log(current / 1e-14);

    private static double BridgeMeanCurrent => 2.0 / Math.PI * 2 * Math.PI * F * Cx * s_vpk;

    /// <summary>Zener voltage at current I in the model's exponential breakdown law: V_Z + Z_ZT·I_ZT·ln(I/I_ZT).</summary>
    private static double ZenerVoltage(double current) => Vz + Zzt * Izt * Math.Log(current / Izt);

    /// <summary>Mains into a bridge (ac1, neutral) → dcp/dcn; the front end is line → [R_F] → C_X ∥ bleeder → ac1.</summary>
    private static List<Device> Bridge(string neutral, string dcMinus, bool seriesResistor)
    {
        string front = seriesResistor ? "l1" : "line";
        var parts = new List<Device>
        {
            new VoltageSource("VM", "VM", "line", neutral, Waveform.Sine(0, s_vpk, F, 0, 0)),
            new Capacitor("CX", "CX", front, "ac1", Cx),
            new Resistor("RBL", "RBL", front, "ac1", Bleeder),
            new Diode("D1", "D1", "ac1", "dcp"),
            new Diode("D2", "D2", neutral, "dcp"),
            new Diode("D3", "D3", dcMinus, "ac1"),
            new Diode("D4", "D4", dcMinus, neutral),
        };
        if (seriesResistor) parts.Add(new Resistor("RF", "RF", "line", "l1", Rf));
        return parts;
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void Bridge_With_Neutral_As_Ground_And_A_Floating_DC_Side_Regulates_At_The_Zener_Voltage(bool seriesResistor)
    {
        // Neutral is ground; dcp/dcn reach ground only through the bridge diodes, which are all off near every zero
        // crossing. Load 1 kΩ. Zener budget by hand: I_in = 4fC(V_pk − V_Z − 2V_D) = 4·50·470n·(325.3 − 12 − 1.49)
        // = 29.3 mA; load 12 V / 1 kΩ = 12 mA; Zener 17.3 mA > 0, so the rail is V_Z(17.3 mA) = 12.06 V.
        var parts = Bridge("gnd", "dcn", seriesResistor);
        parts.Add(new Capacitor("CS", "CS", "dcp", "dcn", 470e-6));
        parts.Add(Zener.Create("DZ", "DZ", "dcn", "dcp", Vz, Izt, Zzt));
        parts.Add(new Resistor("RL", "RL", "dcp", "dcn", 1000));
        var meter = SupplyMeter.Run(Circuit.FromDevices("bridge-neutral", parts), 2.0, 1.6, "dcp", "dcn");
        Assert.True(meter.Result.Succeeded, meter.Result.Failure?.ToString());

        double vd = DiodeDrop(BridgeMeanCurrent);
        double iIn = 4 * F * Cx * (s_vpk - Vz - 2 * vd);
        double iZ = iIn - Vz / 1000;
        Assert.True(iZ > 0);
        double expected = ZenerVoltage(iZ);
        Assert.InRange(meter.Average, 0.99 * expected, 1.01 * expected);
    }

    [Theory]
    [InlineData("gnd", "dcn", true)]
    [InlineData("gnd", "dcn", false)]
    [InlineData("neutral", "gnd", true)]
    [InlineData("neutral", "gnd", false)]
    public void Bridge_Into_A_Resistor_Delivers_The_Charge_Balance_Current(string neutral, string dcMinus, bool seriesResistor)
    {
        // No Zener: the rail settles where the load takes what the dropper delivers. Measured: mean load current
        // V_avg/R_L against I = 4fC(V_pk − V_top − 2V_D) with the rail's top V_top (the bridge hands over charge at the
        // rail's peak), within 2 %; dropper RMS current against V_rms·2πfC within 2 %.
        const double rl = 220, cs = 1000e-6;
        var parts = Bridge(neutral, dcMinus, seriesResistor);
        parts.Add(new Capacitor("CS", "CS", "dcp", dcMinus, cs));
        parts.Add(new Resistor("RL", "RL", "dcp", dcMinus, rl));
        // Dropper current through the bleeder-free path is measured on a 1 Ω sense resistor in the neutral.
        var circuit = Circuit.FromDevices("bridge-load", SenseNeutral(parts, neutral));
        var meter = SupplyMeter.Run(circuit, 2.0, 1.6, "dcp", dcMinus, neutral, neutral + ".s", 1.0);
        Assert.True(meter.Result.Succeeded, meter.Result.Failure?.ToString());

        double vd = DiodeDrop(BridgeMeanCurrent);
        double predicted = 4 * F * Cx * (s_vpk - meter.Max - 2 * vd);
        double measured = meter.Average / rl;
        Assert.InRange(measured, 0.98 * predicted, 1.02 * predicted);

        double reactive = Vrms * 2 * Math.PI * F * Cx;
        Assert.InRange(meter.CurrentRms, 0.98 * reactive, 1.02 * reactive);
    }

    /// <summary>Moves the mains source's neutral end behind a 1 Ω sense resistor: VM → neutral.s —1 Ω— neutral.</summary>
    private static List<Device> SenseNeutral(List<Device> parts, string neutral)
    {
        var list = parts.Where(d => d.Name != "VM").ToList();
        list.Add(new VoltageSource("VM", "VM", "line", neutral + ".s", Waveform.Sine(0, s_vpk, F, 0, 0)));
        list.Add(new Resistor("RSENSE", "RSENSE", neutral, neutral + ".s", 1.0));
        return list;
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void Half_Wave_With_A_Zener_Shunt_Gives_The_Zener_Voltage_Less_One_Diode(bool seriesResistor)
    {
        // line → [R_F] → C_X → a; Zener a→neutral (cathode at a) clamps the positive half and conducts forward on the
        // negative half; D from a to the rail; 470 µF and 1 kΩ on the rail, neutral = DC minus = ground.
        // Budget by hand: I_in = fC(2V_pk − V_Z − V_F) = 50·470n·(650.5 − 12 − 0.75) = 15.0 mA; load ≈ 11.3 mA,
        // so the Zener keeps ≈ 3.7 mA and the rail is V_Z − V_D ≈ 12 − 0.7 V; within 3 % (the diode's drop at its
        // pulse current is not worked more closely).
        string front = seriesResistor ? "l1" : "line";
        var parts = new List<Device>
        {
            new VoltageSource("VM", "VM", "line", "gnd", Waveform.Sine(0, s_vpk, F, 0, 0)),
            new Capacitor("CX", "CX", front, "a", Cx),
            new Resistor("RBL", "RBL", front, "a", Bleeder),
            Zener.Create("DZ", "DZ", "gnd", "a", Vz, Izt, Zzt),
            new Diode("D1", "D1", "a", "vcc"),
            new Capacitor("CS", "CS", "vcc", "gnd", 470e-6),
            new Resistor("RL", "RL", "vcc", "gnd", 1000),
        };
        if (seriesResistor) parts.Add(new Resistor("RF", "RF", "line", "l1", Rf));
        var meter = SupplyMeter.Run(Circuit.FromDevices("half-wave", parts), 2.0, 1.6, "vcc", "gnd");
        Assert.True(meter.Result.Succeeded, meter.Result.Failure?.ToString());
        double iIn = F * Cx * (2 * s_vpk - Vz - 0.75);
        Assert.True(iIn > 11.3e-3);
        double expected = Vz - 0.7;
        Assert.InRange(meter.Average, 0.97 * expected, 1.03 * expected);
    }

    [Fact]
    public void Voltage_Fed_Bridge_Ripple_Matches_The_Full_Wave_Approximation()
    {
        // A low-voltage secondary (15 V peak, 0.05 Ω) into a bridge, 4700 µF, 100 Ω: peak-to-peak ripple
        // ΔV ≈ I/(2fC) (full-wave capacitor-input filter; Horowitz & Hill, "The Art of Electronics", 3rd ed., §9.5,
        // from memory), shortened by the conduction interval ωΔt ≈ √(2ΔV/V_p) during which the capacitor charges
        // instead of discharging (Sedra & Smith, "Microelectronic Circuits", 7th ed., §4.5, peak rectifier, from
        // memory): ΔV ≈ I/(2fC)·(1 − ωΔt/π), within 10 %.
        const double cs = 4700e-6, rl = 100;
        var parts = new List<Device>
        {
            new VoltageSource("VS", "VS", "s1", "gnd", Waveform.Sine(0, 15, F, 0, 0)),
            new Resistor("RW", "RW", "s1", "ac1", 0.05),
            new Diode("D1", "D1", "ac1", "dcp"),
            new Diode("D2", "D2", "gnd", "dcp"),
            new Diode("D3", "D3", "dcn", "ac1"),
            new Diode("D4", "D4", "dcn", "gnd"),
            new Capacitor("CS", "CS", "dcp", "dcn", cs),
            new Resistor("RL", "RL", "dcp", "dcn", rl),
        };
        var meter = SupplyMeter.Run(Circuit.FromDevices("secondary-bridge", parts), 2.0, 1.6, "dcp", "dcn");
        Assert.True(meter.Result.Succeeded, meter.Result.Failure?.ToString());
        // The DC side floats behind the bridge (the secondary's return is ground): at every zero crossing all four
        // diodes are off and the side's potential against ground is held only by the floor capacitance. That common
        // mode is not a circuit quantity; once it drove the error estimate to picosecond steps for millions of steps.
        // 100 cycles need a few thousand steps (measured 6 568).
        Assert.True(meter.Result.Statistics.AcceptedSteps < 30_000, $"{meter.Result.Statistics.AcceptedSteps} steps");
        double simple = meter.Average / rl / (2 * F * cs);
        double conduction = Math.Sqrt(2 * simple / meter.Max);
        double predicted = simple * (1 - conduction / Math.PI);
        Assert.InRange(meter.Max - meter.Min, 0.9 * predicted, 1.1 * predicted);
    }
}
