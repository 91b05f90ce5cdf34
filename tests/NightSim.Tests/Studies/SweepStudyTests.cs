using System.Globalization;
using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Studies;

namespace NightSim.Tests.Studies;

public sealed class SweepStudyTests
{
    /// <summary>
    /// Peak dip of the trigger pin under a trapezoidal current pulse (10 % rise, 80 % top, 10 % fall) into C to ground
    /// with R back to a stiff line: a first-order RC driven by a sum of four current ramps, each giving
    /// u(t) = k·R·(t − τ(1 − e^(−t/τ))) (textbook step and ramp response of an RC network, τ = R·C).
    /// </summary>
    private static double PeakDip(double c, double r = 10e3, double i = 1e-3, double width = 2e-6)
    {
        double edge = 0.1 * width, k = i / edge, tau = r * c;
        double Ramp(double t, double t0) => t <= t0 ? 0 : k * r * (t - t0 - tau * (1 - Math.Exp(-(t - t0) / tau)));
        double peak = 0;
        for (int n = 0; n <= 4000; n++)
        {
            double t = 1.5 * width * n / 4000;
            peak = Math.Max(peak, Ramp(t, 0) - Ramp(t, edge) - Ramp(t, width - edge) + Ramp(t, width));
        }
        return peak;
    }

    [Fact]
    public void Filter_Capacitor_Sweep_Flips_The_Noise_Outcome_Where_The_RC_Calculation_Predicts()
    {
        // The demo's burst: 1 mA for 2 µs into the trigger pin, which sits at the 12 V line behind RS = 10 kΩ. The
        // one-shot fires when the pin falls below a third of the supply, a dip of 8 V (555 trigger level V_CC/3,
        // common practice). Bisect the hand calculation for the capacitance whose peak dip is exactly 8 V.
        double lo = 10e-12, hi = 1e-9;
        for (int n = 0; n < 60; n++)
        {
            double mid = 0.5 * (lo + hi);
            if (PeakDip(mid) > 8.0) lo = mid; else hi = mid;
        }
        double flip = 0.5 * (lo + hi); // ≈ 107 pF
        Assert.InRange(flip, 90e-12, 130e-12);

        string name = "trigger-filter-present";
        NetlistDefinition net = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, name + ".json"));
        var request = new NightRunRequest
        {
            Netlist = net,
            NetlistPath = name + ".json",
            Scenario = ScenarioLoader.LoadOrThrow(Path.Combine(RepoPaths.Netlists, name + ".scenario.json")),
            ScenarioPath = name + ".scenario.json",
        };
        string below = (0.9 * flip).ToString("R", CultureInfo.InvariantCulture), above = (1.1 * flip).ToString("R", CultureInfo.InvariantCulture);
        // A fast trigger comparator (10 ns), so the pin's RC alone decides; the default 1 µs response ignores
        // excursions shorter than itself and moves the flip to a smaller capacitor.
        SweepAxis cf = SweepStudy.Axis(net, $"CF.value={below},{above}", out string? e1) ?? throw new InvalidOperationException(e1);
        SweepAxis speed = SweepStudy.Axis(net, "U1.transition=10n", out string? e2) ?? throw new InvalidOperationException(e2);
        var study = new SweepStudy(request, [cf, speed]);
        Assert.Equal(2, study.Total);
        SweepPoint small = study.Run(0), large = study.Run(1);
        Assert.Equal(0.9, small.Values[0].Value / flip, 12);
        Assert.True(small.Outcome.FalseTriggers >= 1, "10 % below the predicted capacitance the burst must fire the one-shot");
        Assert.Equal(0, large.Outcome.FalseTriggers);
        Assert.NotNull(large.Outcome.SwitchOn); // the dusk edge still gets through
    }

    [Fact]
    public void Noise_Amplitude_Sweep_In_The_Scenario_Flips_The_Outcome_Where_The_RC_Calculation_Predicts()
    {
        // The same RC calculation, read the other way: with the filter capacitor fixed at 470 pF the peak dip is
        // proportional to the pulse current, so the one-shot fires above the current whose dip is 8 V (555 trigger
        // level V_CC/3, common practice). The current is a number in the scenario, swept there.
        const double c = 470e-12;
        double flip = 8.0 / (PeakDip(c) / 1e-3); // ≈ 2.55 mA (charge alone, 8 V · 470 pF / 2 µs, would say 1.9 mA)
        Assert.InRange(flip, 2e-3, 3.5e-3);

        string name = "trigger-filter-present";
        string scenarioPath = Path.Combine(RepoPaths.Netlists, name + ".scenario.json");
        NetlistDefinition net = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, name + ".json"));
        var request = new NightRunRequest { Netlist = net, NetlistPath = name + ".json", Scenario = ScenarioLoader.LoadOrThrow(scenarioPath), ScenarioPath = scenarioPath };
        ScenarioVariants variants = ScenarioVariants.Read([scenarioPath]);
        string below = (-0.9 * flip).ToString("R", CultureInfo.InvariantCulture), above = (-1.1 * flip).ToString("R", CultureInfo.InvariantCulture);
        SweepAxis amplitude = SweepStudy.Axis(net, $"scenario.events[0].amplitude={below},{above}", out string? e0, variants) ?? throw new InvalidOperationException(e0);
        Assert.Equal(SweepTarget.ScenarioField, amplitude.Target);
        Assert.Equal("scenario.events[0].amplitude", amplitude.Key);
        SweepAxis cf = SweepStudy.Axis(net, "CF.value=470p", out string? e1) ?? throw new InvalidOperationException(e1);
        SweepAxis speed = SweepStudy.Axis(net, "U1.transition=10n", out string? e2) ?? throw new InvalidOperationException(e2);
        var study = new SweepStudy(request, [amplitude, cf, speed], variants);
        Assert.Equal(2, study.Total);
        SweepPoint small = study.Run(0), large = study.Run(1);
        Assert.Equal(-0.9 * flip, small.Values[0].Value, 12);
        Assert.Equal(0, small.Outcome.FalseTriggers);
        Assert.True(large.Outcome.FalseTriggers >= 1, "10 % above the predicted current the burst must fire the one-shot");
    }

    [Fact]
    public void Several_Scenario_Files_Are_An_Axis_And_Each_Point_Runs_Its_Own_File()
    {
        string first = Path.Combine(RepoPaths.Netlists, "garden-path.scenario.json");
        string second = Path.Combine(RepoPaths.Netlists, "examples-sky", "garden-winter.scenario.json");
        NetlistDefinition net = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, "garden-path.json"));
        var request = new NightRunRequest { Netlist = net, NetlistPath = "garden-path.json", Scenario = ScenarioLoader.LoadOrThrow(first), ScenarioPath = first };
        ScenarioVariants variants = ScenarioVariants.Read([first, second]);
        SweepAxis files = SweepStudy.Axis(net, "scenario=" + first + "," + second, out string? e0, variants) ?? throw new InvalidOperationException(e0);
        Assert.Equal(["garden-path", "garden-winter"], files.Labels);
        SweepAxis ctim = SweepStudy.Axis(net, "CTIM.value=2200u,3300u", out string? e1) ?? throw new InvalidOperationException(e1);
        var study = new SweepStudy(request, [ctim, files], variants);
        Assert.Equal(4, study.Total);
        LightScenario winter = ScenarioLoader.LoadOrThrow(second);
        NightRunRequest p3 = study.Request(3); // CTIM 3300u in the second file
        Assert.Equal(second, p3.ScenarioPath);
        Assert.Equal(winter.Start, p3.Scenario!.Start);
        Assert.Equal(winter.Site.Latitude, p3.Scenario.Site.Latitude);
        Assert.Equal(3300e-6, study.ValuesOf(3)[0].Value, 12);
        Assert.Equal(first, study.Request(0).ScenarioPath);
    }

    [Fact]
    public void A_Scenario_Axis_That_Names_Nothing_Or_Text_Or_An_Impossible_Value_Says_Which()
    {
        string path = Path.Combine(RepoPaths.Netlists, "trigger-filter-present.scenario.json");
        NetlistDefinition net = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, "trigger-filter-present.json"));
        ScenarioVariants variants = ScenarioVariants.Read([path]);
        Assert.Null(SweepStudy.Axis(net, "scenario.events[3].amplitude=1m,2m", out string? missing, variants));
        Assert.Contains("nothing at $.events[3].amplitude", missing, StringComparison.Ordinal);
        Assert.Null(SweepStudy.Axis(net, "scenario.events[0].times[0]=1,2", out string? text, variants));
        Assert.Contains("\"22:30:00\", not a number", text, StringComparison.Ordinal);
        Assert.Null(SweepStudy.Axis(net, "scenario.nights=1,0", out string? bad, variants));
        Assert.Contains("does not fit the scenario", bad, StringComparison.Ordinal);
        Assert.Contains("nights", bad, StringComparison.Ordinal);
        Assert.False(ScenarioVariants.TryParsePath("events[x].peak", out _, out string? form));
        Assert.Contains("[0]", form, StringComparison.Ordinal);
    }

    // IEC 60063 preferred numbers: E12 from 1 n to 100 n is 1.0 … 8.2 in two decades plus 100 n (25 values).
    [Fact]
    public void Values_Parse_As_List_Range_And_Series()
    {
        IReadOnlyList<double> e12 = SweepAxis.ParseValues("E12:1n..100n", "F", out bool log, out string? err)!;
        Assert.Null(err);
        Assert.True(log);
        Assert.Equal(25, e12.Count);
        Assert.Equal(1.0, e12[0] * 1e9, 12);
        Assert.Equal(4.7, e12[8] * 1e9, 12);
        Assert.Equal(100.0, e12[^1] * 1e9, 12);

        IReadOnlyList<double> range = SweepAxis.ParseValues("1n..100n/5", "F", out log, out _)!;
        Assert.True(log); // two decades: log-spaced, 1, 3.16, 10, 31.6, 100 n
        Assert.Equal(10.0, range[2] * 1e9, 12);
        Assert.Equal(Math.Sqrt(10), range[1] * 1e9, 12);

        IReadOnlyList<double> linear = SweepAxis.ParseValues("0.2..0.8/4", "", out log, out _)!;
        Assert.False(log);
        Assert.Equal(0.4, linear[1], 12);

        IReadOnlyList<double> list = SweepAxis.ParseValues("10n,22n,4k7", "", out _, out _)!;
        Assert.Equal(3, list.Count);
        Assert.Equal(22.0, list[1] * 1e9, 12);
        Assert.Equal(4700.0, list[2], 12);

        Assert.Null(SweepAxis.ParseValues("E7:1n..10n", "F", out _, out err));
        Assert.Contains("E6, E12 or E24", err, StringComparison.Ordinal);
        Assert.Null(SweepAxis.ParseValues("1n..100n", "F", out _, out err));
        Assert.Contains("count", err, StringComparison.Ordinal);
    }
}
