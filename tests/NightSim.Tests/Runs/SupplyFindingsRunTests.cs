using NightSim.Analysis;
using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Tests.Demos;
using NightSim.Tests.Supply;

namespace NightSim.Tests.Runs;

/// <summary>
/// The supply findings from real runs: a 230 V / 50 Hz dropper whose relay coil is switched onto the rail at 1.2 s,
/// run for 2.5 s. 100 nF delivers about 4·f·C·(V_pk − V_Z − 2V_D) = 4·50·100n·(325 − 12 − 1.5) ≈ 6.2 mA (charge
/// balance of the dropper, Q = C·ΔV), a fifth of what the 400 Ω coil wants at 12 V (30 mA, Ohm's law), and its 4.7 µF
/// smoothing capacitor cannot carry the coil through its L/R rise (1.25 ms): the relay cannot pull in, the Zener stops
/// regulating, and the report says the supply is the cause. With 680 nF (42 mA) and 470 µF nothing is said; nor on
/// the demos, which run from an ideal rail.
/// </summary>
public sealed class SupplyFindingsRunTests
{
    private static NightRunResult Run(string name) => NightRun.Run(new NightRunRequest
    {
        Netlist = NetlistLoader.Load(SupplyBudgets.Netlist(name)),
        NetlistPath = name + ".json",
        Duration = 2.5,
    });

    [Fact]
    public void A_Small_Dropper_That_Cannot_Pull_In_Its_Relay_Is_Named_As_The_Cause()
    {
        NightRunResult r = Run("switched-small-dropper");
        Assert.True(r.Simulation.Succeeded, r.Simulation.Failure?.ToString());
        SupplyFacts s = r.Facts.Supply!;
        Assert.Equal(["CX"], s.Droppers);
        Assert.Equal("DZ", s.ZenerId);
        CoilAttempt a = Assert.Single(s.Attempts);
        Assert.InRange(a.Start, 1.2, 1.21);
        Assert.InRange(a.RailBefore, 11.7, 12.2); // near the Zener voltage before the drive (6.2 mA in, 2.6 mA into 4.7 kΩ)
        IReadOnlyList<Finding> findings = r.Analysis.Findings;
        Finding pull = Assert.Single(findings, f => f.Code == "supply-relay-cannot-pull-in");
        Assert.Equal("K1", pull.Part);
        Assert.Contains("Supply (the 100 nF dropper CX from 230 V 50 Hz): relay K1 could not pull in", pull.Message, StringComparison.Ordinal);
        Assert.Contains("against its 9 V pull-in", pull.Message, StringComparison.Ordinal);
        Assert.Contains("larger dropper capacitor", pull.Fix, StringComparison.Ordinal);
        // The Zener stops regulating with the relay driven (and, with only 4.7 µF, in the ripple troughs of standby).
        Finding regulation = Assert.Single(findings, f => f.Code == "supply-regulation-lost" && f.Message.Contains("while relay K1 was driven", StringComparison.Ordinal));
        Assert.Contains("its current fell to 0 A", regulation.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(findings, f => f.Code == "relay-not-pulling-in");
    }

    [Fact]
    public void A_Dropper_Large_Enough_For_Its_Relay_Gets_No_Supply_Finding()
    {
        NightRunResult r = Run("switched-dropper");
        Assert.True(r.Simulation.Succeeded, r.Simulation.Failure?.ToString());
        Assert.Contains(r.Simulation.Events, e => e.PartId == "K1" && e.Kind == NightSim.Results.DeviceEventKind.CoilPulledIn);
        Assert.NotNull(r.Facts.Supply);
        Assert.DoesNotContain(r.Analysis.Findings, f => f.Code.StartsWith("supply-", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("garden-path")]
    [InlineData("dusk-switch-self-lit")]
    public void Demos_On_An_Ideal_Rail_Get_No_Supply_Finding(string demo)
    {
        NightRunResult r = DemoRuns.Run(demo);
        Assert.Null(r.Facts.Supply);
        Assert.DoesNotContain(r.Analysis.Findings, f => f.Code.StartsWith("supply-", StringComparison.Ordinal) || f.Message.Contains("The supply causes it", StringComparison.Ordinal));
        Assert.All(r.Analysis.Intervals, iv => Assert.NotEqual(LoadCause.Supply, iv.Cause));
    }
}
