using NightSim.Devices;
using NightSim.Supply;

namespace NightSim.Tests.Supply;

/// <summary>
/// The supply budget (<c>nightsim supply</c>) against hand values. Sources of the hand formulas:
/// <list type="bullet">
/// <item>Dropper current I = V_rms·2πf·C: the capacitive reactance carries nearly the whole mains voltage while the rail
/// is small against it (any circuits textbook, e.g. Hambley, "Electrical Engineering: Principles and Applications",
/// ch. 5 on phasors).</item>
/// <item>Bridge dropper charge balance: each half cycle the dropper swings from −(V_pk − V_out − 2V_D) to
/// +(V_pk − V_out − 2V_D), so I_avg = 4·f·C·(V_pk − V_out − 2V_D) (charge conservation, Q = C·ΔV); with a Zener
/// shunt the Zener takes what the load leaves (Sedra &amp; Smith, "Microelectronic Circuits", 7th ed., ch. 4, Zener
/// shunt regulator).</item>
/// <item>Full-wave capacitor-input ripple ΔV ≈ I/(2fC) (Horowitz &amp; Hill, "The Art of Electronics", 3rd ed., §9.5,
/// from memory), shortened by the conduction interval ωΔt ≈ √(2ΔV/V_p) (Sedra &amp; Smith, 7th ed., §4.5, from memory).</item>
/// </list>
/// </summary>
public sealed class SupplyBudgetTests
{
    private const double F = 50, Cx = 470e-9, Vz = 12, Izt = 5e-3, Zzt = 10, Rl = 1000;
    private static readonly double s_vpk = 325.27, s_vrms = 325.27 / Math.Sqrt(2);

    /// <summary>Diode drop at the mean conduction current of the bridge: V_T·ln(I/I_S), I_S = 1e-14 A (Shockley), the
    /// current the mean of a half sine of peak 2πf·C·V_pk.</summary>
    private static double DiodeDrop(double f, double c, double vpk) =>
        Junction.ThermalVoltage(300.15) * Math.Log(2.0 / Math.PI * 2 * Math.PI * f * c * vpk / 1e-14);

    [Fact]
    public void Zener_Current_Matches_The_Budget_Worked_By_Hand()
    {
        // By hand (bridge-zener-load: 230 V 50 Hz, 470 nF, 12 V Zener with 10 Ω at 5 mA, 1 kΩ load):
        // V_D = V_T·ln(30.6 mA / 1e-14 A) = 0.744 V; I_in = 4·50·470n·(325.27 − 12 − 2·0.744) = 29.31 mA;
        // the load takes 12.06 V / 1 kΩ = 12.06 mA; the Zener the rest, 17.25 mA, at V_Z + Z·I_ZT·ln(I/I_ZT) = 12.06 V.
        SupplyBudget b = SupplyBudgets.Of("bridge-zener-load");
        SupplyState standby = b.State("standby-day")!;
        Assert.True(standby.Settled);
        double vd = DiodeDrop(F, Cx, s_vpk);
        double iIn = 4 * F * Cx * (s_vpk - Vz - 2 * vd);
        double vRail = Vz + Zzt * Izt * Math.Log((iIn - Vz / Rl) / Izt);
        double iZ = iIn - vRail / Rl;
        Assert.InRange(iZ, 17.0e-3, 17.5e-3); // the arithmetic above
        Assert.InRange(standby.Zeners[0].CurrentMean, 0.97 * iZ, 1.03 * iZ);
        Assert.InRange(standby.RailMean, 0.99 * vRail, 1.01 * vRail);
        // The Zener dissipates about V_Z·I_Z.
        Assert.InRange(standby.Zeners[0].Power, 0.95 * vRail * iZ, 1.05 * vRail * iZ);
        Assert.Equal("DZ", b.Section!.RailZener?.PartId);
        Assert.DoesNotContain(b.Warnings, w => w.Contains("cannot hold the rail", StringComparison.Ordinal));
    }

    [Fact]
    public void Dropper_Current_Matches_V_Times_2_Pi_F_C()
    {
        SupplyBudget b = SupplyBudgets.Of("bridge-zener-load");
        double hand = s_vrms * 2 * Math.PI * F * Cx;
        Assert.Equal(hand, b.HandDropperCurrent, 1e-9);
        foreach (SupplyState s in b.States)
            Assert.InRange(s.DropperCurrentRms, 0.98 * hand, 1.02 * hand);
    }

    [Fact]
    public void Mains_Override_Runs_The_Same_Dropper_At_120_V_60_Hz()
    {
        // --mains 120V --hz 60: peak √2·120 = 169.7 V; I = 120·2π·60·470n = 21.3 mA less the clamp (below); by the charge balance
        // the Zener keeps 4·60·470n·(169.7 − 12 − 2V_D) − 12 mA ≈ 5.6 mA.
        SupplyBudget b = SupplyBudgets.Of("bridge-zener-load", new MainsSetting(120, 60));
        Assert.True(b.Overridden);
        Assert.Equal(120 * Math.Sqrt(2), b.MainsPeak, 1e-6);
        Assert.Equal(60, b.Frequency);
        double hand = 120 * 2 * Math.PI * 60 * Cx;
        SupplyState s = b.State("standby-day")!;
        double vpk = 120 * Math.Sqrt(2);
        // At 120 V the bridge's clamp window 2·(V_Z + 2V_D) is 16 % of the peak: after each peak the dropper carries no
        // current until the source has swung across it (i = C·dv_s/dt only while the bridge conducts), which takes
        // 1.9 % off the RMS of V·2πfC. Worked here: the current stops from θ = π/2 to θ₁ = π − asin(1 − 2(V_Z + 2V_D)/V_pk);
        // RMS = V·2πfC·√(1 − ∫cos²θ dθ over [π/2, θ₁] / (π/2)) (calculus on the ideal clamp, common practice).
        double theta1 = Math.PI - Math.Asin(1 - 2 * (Vz + 2 * DiodeDrop(60, Cx, vpk)) / vpk);
        double off = (theta1 - Math.PI / 2) / 2 + Math.Sin(2 * theta1) / 4;
        double clamped = hand * Math.Sqrt(1 - off / (Math.PI / 2));
        Assert.InRange(hand, 1.015 * clamped, 1.025 * clamped);
        Assert.InRange(s.DropperCurrentRms, 0.98 * clamped, 1.02 * clamped);
        double iZ = 4 * 60 * Cx * (vpk - Vz - 2 * DiodeDrop(60, Cx, vpk)) - Vz / Rl;
        Assert.InRange(s.Zeners[0].CurrentMean, 0.95 * iZ, 1.05 * iZ);
    }

    [Fact]
    public void Ripple_Matches_The_Full_Wave_Approximation()
    {
        // secondary-bridge: 15 V peak into a bridge, 4700 µF, 100 Ω. ΔV ≈ I/(2fC)·(1 − ωΔt/π), ωΔt ≈ √(2ΔV/V_p),
        // within 10 %.
        SupplyBudget b = SupplyBudgets.Of("secondary-bridge");
        SupplyState s = b.State("standby-day")!;
        double simple = s.RailMean / 100 / (2 * F * 4700e-6);
        double predicted = simple * (1 - Math.Sqrt(2 * simple / s.RailMax) / Math.PI);
        Assert.InRange(s.Ripple, 0.9 * predicted, 1.1 * predicted);
        Assert.Empty(b.Section!.Droppers);
        Assert.Null(b.Bleeder);
        Assert.Empty(b.Cautions); // 15 V is extra-low voltage
    }

    [Fact]
    public void Relay_On_State_Puts_The_Rail_On_The_Coil_And_Standby_Leaves_It_Off()
    {
        // garden-path-dropper (680 nF): in standby the coil carries nothing; after the trigger press it sees the rail
        // less the driving transistor's saturation (a few tenths of a volt) and is pulled in above its 9 V pull-in.
        SupplyBudget b = SupplyBudgets.Of("garden-path-dropper");
        Assert.Equal(["standby-day", "standby-night", "relay-on"], b.States.Select(s => s.Key));
        Assert.All(b.States, s => Assert.True(s.Settled, s.Key));
        foreach (string standby in new[] { "standby-day", "standby-night" })
        {
            CoilReading off = b.State(standby)!.Coils.Single();
            Assert.False(off.Energised);
            Assert.True(off.VoltageMax < 0.01, $"{standby}: {off.VoltageMax} V");
        }
        SupplyState on = b.State("relay-on")!;
        CoilReading coil = on.Coils.Single();
        Assert.True(coil.Energised);
        Assert.InRange(coil.VoltageMean, on.RailMean - 0.4, on.RailMean);
        Assert.True(coil.VoltageMin > coil.DropOut);
        // The coil's 30 mA comes out of the Zener's share: I_Z falls by about V/R_coil from standby.
        double drop = b.State("standby-night")!.Zeners[0].CurrentMean - on.Zeners[0].CurrentMean;
        Assert.InRange(drop, 0.9 * coil.VoltageMean / 400, 1.1 * coil.VoltageMean / 400);
        PullInTransient p = b.PullIn!;
        Assert.NotNull(p.PullInTime);
        Assert.Equal(1, p.Operations);
        Assert.True(p.Times.Length > 100 && p.Times.Length == p.Rail.Length && p.Rail.Length == p.Coil.Length);
        Assert.DoesNotContain(b.Warnings, w => w.Contains("cannot", StringComparison.Ordinal));
    }

    [Fact]
    public void Small_Dropper_Cannot_Pull_The_Relay_In_And_Says_Why()
    {
        // small-dropper: 100 nF delivers about 4·50·100n·(325 − 12) ≈ 6 mA, a fifth of the 400 Ω coil's 30 mA; the
        // 10 µF smoothing capacitor empties within milliseconds into the coil, whose current rises with L/R = 1.25 ms.
        SupplyBudget b = SupplyBudgets.Of("small-dropper");
        PullInTransient p = b.PullIn!;
        Assert.Null(p.PullInTime);
        Assert.True(p.CoilPeak < p.PullIn);
        Assert.True(p.Sag > 5, $"sag {p.Sag} V");
        SupplyState on = b.State("relay-on")!;
        Assert.False(on.Coils.Single().Energised);
        Assert.True(on.Zeners[0].CurrentMax < SupplyThresholds.RegulationLost * Izt);
        Assert.Contains(b.Warnings, w => w.StartsWith("Supply: relay K1 cannot pull in", StringComparison.Ordinal) && w.Contains("larger dropper capacitor", StringComparison.Ordinal));
        Assert.Contains(b.Warnings, w => w.Contains("cannot hold the rail in the relay-on state", StringComparison.Ordinal));
    }

    [Fact]
    public void Ratings_Are_Judged_At_The_Worst_State()
    {
        // bridge-zener-load: the 1 kΩ load dissipates 12.06²/1000 = 145 mW of its 250 mW (above half: common-practice
        // derating); the 1 MΩ bleeder sees the dropper's peak, about V_pk − V_rail − 2V_D ≈ 312 V, over its 250 V;
        // the X2 dropper sees about V_rms ≈ 227 V RMS of its 275 V AC rating.
        SupplyBudget b = SupplyBudgets.Of("bridge-zener-load");
        PartStress load = b.Parts.Single(p => p.PartId == "RL");
        Assert.InRange(load.Power, 0.98 * 12.06 * 12.06 / 1000, 1.02 * 12.06 * 12.06 / 1000);
        Assert.Equal("above half its rating", load.Verdict);
        PartStress bleeder = b.Parts.Single(p => p.PartId == "RBL");
        Assert.Equal("bleeder", bleeder.Title);
        Assert.InRange(bleeder.Voltage, 305, 318);
        Assert.Equal("over rating", bleeder.Verdict);
        PartStress dropper = b.Parts.Single(p => p.PartId == "CX");
        Assert.True(dropper.VoltageIsRms);
        Assert.InRange(dropper.Voltage, 220, 232);
        Assert.Equal("ok", dropper.Verdict);
        Assert.Contains(b.Warnings, w => w.Contains("bleeder RBL sees", StringComparison.Ordinal));
    }

    [Fact]
    public void Bleeder_Time_Is_Worked_From_The_Dropper_Peak()
    {
        // t = R·C·ln(V0/60 V) with V0 the dropper's measured peak: 1 MΩ·470 nF·ln(312/60) ≈ 0.78 s.
        SupplyBudget b = SupplyBudgets.Of("bridge-zener-load");
        BleederDischarge d = b.Bleeder!;
        Assert.Equal(1e6, d.Resistance, 1e-6);
        Assert.Equal(470e-9, d.Capacitance, 1e-15);
        double v0 = b.States.Max(s => s.Parts.Single(p => p.PartId == "CX").PeakVoltage);
        Assert.Equal(v0, d.StartVoltage);
        Assert.Equal(0.47 * Math.Log(v0 / 60), d.SecondsToSafe, 1e-9);
    }

    [Fact]
    public void A_Netlist_On_An_Ideal_Rail_Has_No_Budget()
    {
        SupplyBudget b = SupplyRun.Measure(NightSim.Netlist.NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, "garden-path.json")));
        Assert.Null(b.Section);
        Assert.StartsWith("no mains-fed supply found", b.Message, StringComparison.Ordinal);
        Assert.Empty(b.States);
    }
}
