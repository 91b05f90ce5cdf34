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
