using NightSim.Analysis;
using NightSim.Mna;
using NightSim.Netlist;
using NightSim.Supply;
using NightSim.Transient;

namespace NightSim.Tests.Supply;

/// <summary>The supply watch of a night run: what it measures on a dropper with a Zener and a resistive load (no
/// relay), against the same charge-balance budget as <see cref="SupplyBudgetTests"/> (Sedra &amp; Smith,
/// "Microelectronic Circuits", 7th ed., ch. 4, Zener shunt regulator), and that watching allocates nothing per step.</summary>
public sealed class SupplyWatchTests
{
    [Fact]
    public void Watches_The_Standby_Rail_Without_Allocating()
    {
        Circuit circuit = Circuit.Build(NetlistLoader.Load(SupplyBudgets.Netlist("bridge-zener-load")));
        SupplyWatch watch = SupplyWatch.Create(circuit)!;
        var solver = new TransientSolver(circuit, TransientOptions.Default with { RecordNodes = ["dcp"] });
        long allocated = 0, steps = 0;
        solver.Accepted = s =>
        {
            long before = GC.GetAllocatedBytesForCurrentThread();
            watch.Observe(s.Time, s.Solution);
            if (++steps > 200) allocated += GC.GetAllocatedBytesForCurrentThread() - before;
        };
        var result = solver.Run(2.5);
        Assert.True(result.Succeeded, result.Failure?.ToString());
        Assert.True(steps > 1000);
        Assert.Equal(0, allocated);

        SupplyFacts f = watch.Facts(watch.RailFrom(result));
        Assert.Equal("DZ", f.ZenerId);
        Assert.Empty(f.Attempts);
        Assert.Null(f.Ripple); // no timer
        // The rail regulates at the Zener voltage at 17.3 mA (12 V + 10 Ω·5 mA·ln(17.3/5) = 12.06 V), the Zener takes
        // 4fC(V_pk − V_Z − 2V_D) − V_Z/R_L ≈ 17.3 mA (worked in SupplyBudgetTests), and the mains current is V·2πfC.
        Assert.InRange(f.StandbyRail, 12.0, 12.12);
        Assert.InRange(f.StandbyZenerCurrent, 0.97 * 17.25e-3, 1.03 * 17.25e-3);
        double hand = 230 * 2 * Math.PI * 50 * 470e-9;
        Assert.InRange(f.StandbyMainsCurrent, 0.98 * hand, 1.02 * hand);
        Assert.DoesNotContain(f.Losses, l => l.Seconds >= SupplyRegulationAnalyzer.MinSeconds);
        Assert.InRange(f.RailAt!(2.0), 11.9, 12.2);
    }
}
