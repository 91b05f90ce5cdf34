using NightSim.Analysis;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Sky;

namespace NightSim.Tests.Demos;

/// <summary>
/// The six demo circuits through their own scenarios (invented sites and values). Each check is derived here, apart
/// from the simulation: the switching light level from the photoresistor law and the divider, the on-time from the
/// textbook 555 one-shot formula with a constant drain.
/// </summary>
public class NightDemoTests
{
    private static readonly string[] s_timerDemos =
        ["garden-path", "garden-path-driveway", "garden-path-latched", "trigger-filter-absent", "trigger-filter-present"];

    /// <summary>
    /// Illuminance at which the demo's comparator switches, lux. Photoresistor law R(E) = R10·(E/10 lx)^(−γ) in
    /// parallel with its dark resistance (textbook photoconductor power law, common practice); the comparator output goes high when
    /// V(sense) − V(ref) exceeds half its hysteresis; V(sense) = V_CC·R_ldr/(R_top + R_ldr) (divider rule).
    /// </summary>
    private static double SwitchingLux(NetlistDefinition net)
    {
        PartDefinition ldr = net.Part("LDR1")!, pot = net.Part("RV1")!, cmp = net.Part("U2")!;
        double vcc = net.Part("V1")!.Parameters.Number("constant");
        double vref = vcc * net.Part("R3")!.Parameters.Number("value") / (net.Part("R2")!.Parameters.Number("value") + net.Part("R3")!.Parameters.Number("value"));
        double vSwitch = vref + cmp.Parameters.Number("hysteresis") / 2;
        double rTop = pot.Parameters.Number("position") * pot.Parameters.Number("value");
        double rLdr = rTop * vSwitch / (vcc - vSwitch);
        double rDark = ldr.Parameters.Number("darkResistance");
        double rLaw = rLdr * rDark / (rDark - rLdr);
        return 10.0 * Math.Pow(ldr.Parameters.Number("r10") / rLaw, 1.0 / ldr.Parameters.Number("gamma"));
    }

    /// <summary>Run time at which the modelled sky at the sensor first falls through <paramref name="lux"/> after noon.</summary>
    private static double SkyCrossing(LightProfile profile, double lux)
    {
        int ch = profile.ChannelIndex(LightScenario.DefaultChannel);
        double t = 0;
        while (profile.Lux(ch, t) > lux) t += 1.0;
        return t;
    }

    [Theory]
    [MemberData(nameof(TimerDemos))]
    public void DuskSwitchOnComesWhenTheSkyCrossesTheDividersLevel(string demo)
    {
        NightRunResult r = DemoRuns.Run(demo);
        AttributedInterval dusk = Assert.Single(r.Analysis.Intervals, i => i.Expected);
        double expected = SkyCrossing(r.Profile!, SwitchingLux(NetlistLoader.Load(DemoRuns.Netlist(demo))));
        // Within a few minutes: the sensor's own lag and the trigger chain add seconds, not minutes.
        Assert.InRange(dusk.Start - expected, -180.0, 180.0);
        Assert.Equal(LoadCause.Dusk, dusk.Cause);
    }

    [Theory]
    [MemberData(nameof(TimerDemos))]
    public void OnTimeMatchesTheOneShotClosedForm(string demo)
    {
        NightRunResult r = DemoRuns.Run(demo);
        NetlistDefinition net = NetlistLoader.Load(DemoRuns.Netlist(demo));
        double rt = net.Part("RTIM")!.Parameters.Number("value"), ct = net.Part("CTIM")!.Parameters.Number("value");
        double drain = net.Part("CTIM")!.Parameters.Number("leakageCurrent");
        double vcc = net.Part("V1")!.Parameters.Number("constant");
        // 555 one-shot with a constant drain I_p: t = RC·ln(A/(A − 2V/3)), A = V − I_p·R (textbook RC charging with a constant drain).
        double a = vcc - drain * rt;
        double closedForm = rt * ct * Math.Log(a / (a - 2.0 * vcc / 3.0));
        AttributedInterval dusk = Assert.Single(r.Analysis.Intervals, i => i.Expected);
        Assert.NotNull(dusk.End);
        Assert.InRange((dusk.End!.Value - dusk.Start) / closedForm, 0.995, 1.005);
        Assert.True(dusk.EndedByTimer);
    }

    [Fact]
    public void CleanNightHasNoFalseTrigger()
    {
        NightSummary n = Assert.Single(DemoRuns.Run("garden-path").Report.Nights);
        Assert.Single(n.LoadOn);
        Assert.Equal(0, n.FalseTriggers);
        Assert.False(n.OnAfterSunrise);
    }

    [Fact]
    public void HeadlightAfterTimeoutRetriggersTheDrivewayTimer()
    {
        NightRunResult r = DemoRuns.Run("garden-path-driveway");
        NightSummary n = Assert.Single(r.Report.Nights);
        Assert.Equal(1, n.FalseTriggers);
        LoadInterval again = Assert.Single(n.LoadOn, i => !i.Expected);
        Assert.Equal(LoadCause.Headlight, again.Cause);
        Assert.Equal(23, again.Start.Hour);
        Assert.Contains(r.Report.Findings, f => f.Code == "false-trigger-headlight");
    }

    [Fact]
    public void LatchHoldsTheTriggerOffUntilDaylight()
    {
        NightRunResult r = DemoRuns.Run("garden-path-latched");
        NightSummary n = Assert.Single(r.Report.Nights);
        Assert.Equal(0, n.FalseTriggers);
        Assert.Single(n.LoadOn);
        Assert.DoesNotContain(r.Report.Findings, f => f.Code.StartsWith("false-trigger", StringComparison.Ordinal));
        // The scenario has the same 23:41 car as the driveway demo.
        Assert.Contains(r.Report.Events, e => e.Kind == "headlights" && e.Start.Hour == 23);
    }

    [Fact]
    public void SelfLitLampChattersAtDusk()
    {
        NightRunResult r = DemoRuns.Run("dusk-switch-self-lit");
        NightSummary n = Assert.Single(r.Report.Nights);
        Assert.True(n.ChatterBursts >= 1);
        Finding? chatter = r.Report.Findings.FirstOrDefault(f => f.Code == "relay-chatter");
        Assert.NotNull(chatter);
        Assert.Equal(Severity.Error, chatter.Severity);
        // The first burst starts at dusk, between sunset and an hour after civil dusk.
        Assert.InRange(chatter.At!.Value, n.Sunset!.Value, n.CivilDusk!.Value.AddHours(1));
        Assert.Contains(n.LoadOn, i => i.Cause == LoadCause.SelfIllumination);
    }

    [Fact]
    public void LeakyElectrolyticNeverEnds()
    {
        NightRunResult r = DemoRuns.Run("long-timer-leaky");
        NightSummary n = Assert.Single(r.Report.Nights);
        LoadInterval on = Assert.Single(n.LoadOn);
        Assert.Null(on.End);
        Assert.True(n.OnAfterSunrise);
        Assert.Contains(r.Report.Findings, f => f.Code == "timer-never-ends" && f.Severity == Severity.Error);
    }

    [Fact]
    public void NoiseFiresTheTimerOnlyWithoutTheTriggerPinCapacitor()
    {
        NightSummary without = Assert.Single(DemoRuns.Run("trigger-filter-absent").Report.Nights);
        NightSummary with = Assert.Single(DemoRuns.Run("trigger-filter-present").Report.Nights);
        LoadInterval noise = Assert.Single(without.LoadOn, i => !i.Expected);
        Assert.Equal(LoadCause.Noise, noise.Cause);
        Assert.Equal(0, with.FalseTriggers);
        Assert.Single(with.LoadOn);
    }

    [Fact]
    public void SameInputsGiveTheSameReport()
    {
        static string Json(NightReport report)
        {
            using var s = new MemoryStream();
            JsonReportWriter.Write(report with { Statistics = report.Statistics with { CpuSeconds = 0 } }, s);
            return System.Text.Encoding.UTF8.GetString(s.ToArray());
        }
        Assert.Equal(Json(DemoRuns.Fresh("garden-path-driveway").Report), Json(DemoRuns.Fresh("garden-path-driveway").Report));
    }

    [Fact]
    public void MainsCautionsAreInEveryRelayLampReport()
    {
        NightReport report = DemoRuns.Run("garden-path").Report;
        Assert.Contains(report.Cautions, c => c.Contains("NOT isolated", StringComparison.Ordinal));
        Assert.Contains(report.Cautions, c => c.Contains("X2", StringComparison.Ordinal) && c.Contains("bleeder", StringComparison.Ordinal) && c.Contains("fuse", StringComparison.Ordinal));
        Assert.Contains(report.Cautions, c => c.Contains("licensed electrician", StringComparison.Ordinal));
    }

    public static TheoryData<string> TimerDemos()
    {
        var data = new TheoryData<string>();
        foreach (string d in s_timerDemos) data.Add(d);
        return data;
    }
}

/// <summary>Reports read the same on every machine: a decimal-comma culture changes nothing.</summary>
public class NightReportCultureTests
{
    [Fact]
    public void DecimalCommaCultureGivesTheSameReport()
    {
        static string Json(NightSim.Reporting.NightReport report)
        {
            using var s = new MemoryStream();
            NightSim.Reporting.JsonReportWriter.Write(report with { Statistics = report.Statistics with { CpuSeconds = 0 } }, s);
            return System.Text.Encoding.UTF8.GetString(s.ToArray());
        }
        var saved = System.Globalization.CultureInfo.CurrentCulture;
        string invariant, german;
        try
        {
            System.Globalization.CultureInfo.CurrentCulture = System.Globalization.CultureInfo.InvariantCulture;
            invariant = Json(DemoRuns.Fresh("garden-path").Report);
            System.Globalization.CultureInfo.CurrentCulture = new System.Globalization.CultureInfo("de-DE");
            german = Json(DemoRuns.Fresh("garden-path").Report);
            Assert.Equal("de-DE", System.Globalization.CultureInfo.CurrentCulture.Name); // the run restored the caller's culture
        }
        finally
        {
            System.Globalization.CultureInfo.CurrentCulture = saved;
        }
        Assert.Equal(invariant, german);
        // The demo switches on at 1.39 lx (its sensor slows down in the dark); a decimal point, not a comma.
        Assert.Contains("1.39 lx", invariant, StringComparison.Ordinal);
    }
}
