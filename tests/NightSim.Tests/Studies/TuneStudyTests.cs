using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Studies;

namespace NightSim.Tests.Studies;

/// <summary>The tune's closed forms and searches against hand calculations, each with small searches.</summary>
public sealed class TuneStudyTests
{
    private static readonly double s_ln3 = Math.Log(3);

    private static NightRunRequest Request(string netlist, string? scenario = null)
    {
        string net = Path.Combine(RepoPaths.Netlists, netlist);
        string sc = scenario is null ? Path.ChangeExtension(net, null) + ".scenario.json" : Path.Combine(RepoPaths.Netlists, scenario);
        return new NightRunRequest { Netlist = NetlistLoader.Load(net), NetlistPath = net, Scenario = ScenarioLoader.LoadOrThrow(sc), ScenarioPath = sc };
    }

    private static SweepAxis Axis(NightRunRequest r, string spec) => TuneStudy.Axis(r.Netlist, spec, out string? e) ?? throw new InvalidOperationException(e);

    [Fact]
    public void Timing_R_And_C_For_Four_Hours_Match_Ln3_RC_At_The_Corner_Values()
    {
        NightRunRequest r = Request("garden-path-film-timer.json");
        var study = new TuneStudy(r, [Axis(r, "RTIM.value=E24:100M..180M"), Axis(r, "CTIM.value=68u,100u")], "2026-11-20", corners: true, confirm: 1);
        Assert.Equal(TuneMethod.ClosedForms, study.Method);
        foreach (TuneCandidate c in study.Candidates)
        {
            double rr = c.Values[0].Value, cc = c.Values[1].Value;
            // The 555 one-shot: t = ln 3·R·C = 1.1·R·C (P. Horowitz and W. Hill, The Art of Electronics, 3rd ed.,
            // ch. 7, the 555 monostable), at the corners of a 1 % resistor and a 5 % capacitor as the parts state.
            double low = s_ln3 * rr * 0.99 * cc * 0.95, high = s_ln3 * rr * 1.01 * cc * 1.05;
            TunePrediction p = c.Predictions.Single(x => x.Quantity == TunePhysics.OnTime);
            // The timer's input current and the discharge pin's off-state leakage across 100+ MΩ lengthen it by about
            // 1 %, which the plain relation leaves out; 2 % covers them.
            Assert.True(Math.Abs(low - p.Low) <= low * 0.02, $"R {rr} C {cc}: hand {low} tune {p.Low} corner {p.Corner}");
            Assert.True(Math.Abs(high - p.High) <= high * 0.02, $"R {rr} C {cc}: hand {high} tune {p.High} corner {p.Corner}");
            bool fits = low >= 3.6 * 3600 && high <= 4.4 * 3600;
            if (Math.Abs(low - 3.6 * 3600) > 0.02 * low && Math.Abs(high - 4.4 * 3600) > 0.02 * high) Assert.Equal(fits, p.Margin >= 0);
        }
        // Night runs at the nominal, shortest and longest on-time corners confirm the best prediction.
        var runs = Enumerable.Range(0, study.Total).Select(study.Run).ToList();
        var report = new TuneReport(study.Header("test"), study, runs, true, []);
        Assert.True(report.Met, string.Join("\n", report.Verdict()));
        TuneResult best = report.Best!;
        double rb = best.Values[0].Value, cb = best.Values[1].Value;
        Assert.InRange(s_ln3 * rb * 0.99 * cb * 0.95, 3.6 * 3600, 4.4 * 3600);
        Assert.InRange(s_ln3 * rb * 1.01 * cb * 1.05, 3.6 * 3600, 4.4 * 3600);
        // The simulated on-time margin agrees with the hand calculation at the bounding corner within 2 % of the on-time.
        TuneBound on = best.Bounds.Single(b => b.Target == "on-time");
        double hand = Math.Min(s_ln3 * rb * 0.99 * cb * 0.95 - 3.6 * 3600, 4.4 * 3600 - s_ln3 * rb * 1.01 * cb * 1.05);
        Assert.Equal(hand, on.Margin!.Value, 0.02 * 4 * 3600);
    }

    [Fact]
    public void Dusk_Trimmer_Switch_Level_Follows_The_Photoresistor_Law_And_Meets_2_To_10_Lux_In_June_And_December()
    {
        NightRunRequest r = Request("garden-path.json", "examples-tune/dusk-2-to-10-lux.scenario.json");
        var study = new TuneStudy(r, [Axis(r, "RV1.position=0.1,0.2,0.3,0.5,0.8")], "worst", corners: false, confirm: 1);
        Assert.Equal(TuneMethod.ClosedForms, study.Method);
        Assert.Equal([new DateOnly(2026, 12, 21), new DateOnly(2026, 6, 21)], study.Nights.Select(n => n.Date));
        foreach (TuneCandidate c in study.Candidates)
        {
            // Hand calculation: the comparator switches when the sensor node rises past the 6 V reference plus half the
            // 0.5 V hysteresis; the top of the divider is position·100 kΩ of the trimmer; the photoresistor follows
            // R = r10·(E/10 lx)^(−γ) (photoresistor gamma law, common practice) in parallel with its 2 MΩ dark resistance.
            double top = c.Values[0].Value * 100e3;
            double needed = top * 6.25 / 5.75;
            double law = 1 / (1 / needed - 1 / 2e6);
            double lux = 10 * Math.Pow(law / 15e3, -1 / 0.7);
            TunePrediction p = c.Predictions.Single();
            Assert.Equal(lux, p.Low, lux * 0.01);
        }
        var runs = Enumerable.Range(0, study.Total).Select(study.Run).ToList();
        var report = new TuneReport(study.Header("test"), study, runs, true, []);
        Assert.True(report.Met, string.Join("\n", report.Verdict()));
        Assert.All(runs, run => Assert.True(run.Pass, run.Night + ": " + string.Join("; ", run.Checks.Select(c => c.Detail))));
        Assert.Equal(2, runs.Select(x => x.Night).Distinct().Count());
    }

    [Fact]
    public void Trigger_Filter_Window_Matches_The_RC_Hand_Calculation_And_The_Best_Passes()
    {
        NightRunRequest r = Request("trigger-filter-present.json", "examples-tune/trigger-burst.scenario.json");
        var study = new TuneStudy(r, [Axis(r, "CF.value=E6:100p..1u")], "2026-11-20", corners: false, confirm: 1);
        Assert.Equal([TunePhysics.NoiseLow, TunePhysics.DuskLow], study.Quantities);
        // Noise: 1 mA for 2 µs into CF behind RS = 10 kΩ dips the pin by I·R·(1 − e^(−w/RC)) (first-order RC step
        // response); it fires below V_CC/3 = 4 V, a dip of 8 V (555 trigger level, common practice): C_min solves
        // 10 V·(1 − e^(−w/RC)) = 8 V, i.e. C = w / (R·ln 5).
        double cMin = 2e-6 / (10e3 * Math.Log(5));
        // Dusk: the collector falls 12 V through CT = 100 nF with RT = 100 kΩ (τ₁ = 10 ms) and reaches the pin through
        // RS·CF (τ₂); the pin's dip peaks at r^(r/(1−r)) of 12 V with r = τ₂/τ₁ (the difference of two exponentials at
        // its maximum), and must exceed 8 V. Bisect r for a peak of 2/3.
        double lo = 1e-6, hi = 0.99;
        for (int k = 0; k < 100; k++)
        {
            double mid = 0.5 * (lo + hi);
            if (Math.Pow(mid, mid / (1 - mid)) > 2.0 / 3.0) lo = mid; else hi = mid;
        }
        double cMax = lo * 10e-3 / 10e3;
        Assert.InRange(cMin, 120e-12, 130e-12);
        Assert.InRange(cMax, 190e-9, 210e-9);
        foreach (TuneCandidate c in study.Candidates)
        {
            double cf = c.Values[0].Value;
            if (cf < cMin * 0.9 || cf > cMax * 1.1 || (cf > cMin * 1.1 && cf < cMax * 0.9))
                Assert.Equal(cf > cMin && cf < cMax, c.PredictedMargin >= 0);
        }
        var runs = Enumerable.Range(0, study.Total).Select(study.Run).ToList();
        var report = new TuneReport(study.Header("test"), study, runs, true, []);
        Assert.True(report.Met, string.Join("\n", report.Verdict()));
        double best = report.Best!.Values[0].Value;
        // The best lies well inside the window, near its geometric middle (≈ 5 nF).
        Assert.InRange(best, 1e-9, 22e-9);
    }

    [Fact]
    public void An_Unreachable_On_Time_Gives_The_Closest_Miss_And_Says_Which_Range_To_Widen()
    {
        NightRunRequest r = Request("garden-path-film-timer.json");
        var study = new TuneStudy(r, [Axis(r, "RTIM.value=E6:1M..4.7M"), Axis(r, "CTIM.value=E6:22u..100u")], "2026-11-20", corners: false, confirm: 1);
        var runs = Enumerable.Range(0, study.Total).Select(study.Run).ToList();
        var report = new TuneReport(study.Header("test"), study, runs, true, []);
        Assert.False(report.Met);
        TuneResult closest = report.Best!;
        Assert.Equal(4.7e6, closest.Values[0].Value, 1.0);
        Assert.Equal(100e-6, closest.Values[1].Value, 1e-9);
        // ln 3·4.7 MΩ·100 µF = 516 s (555 one-shot, as above): short of 3.6 h by about 12 444 s.
        TuneBound miss = closest.Bounds.Single(b => b.Target == "on-time");
        Assert.False(miss.Pass);
        Assert.Equal(s_ln3 * 4.7e6 * 100e-6 - 3.6 * 3600, miss.Margin!.Value, 60.0);
        Assert.Contains(report.Advice, a => a.Contains("RTIM.value upward", StringComparison.Ordinal));
        Assert.Contains(report.Advice, a => a.Contains("CTIM.value upward", StringComparison.Ordinal));
    }

    [Fact]
    public void Tolerances_Wider_Than_The_Target_Are_Named_In_The_Advice()
    {
        // A 3300 µF capacitor of unstated construction is bought at ±20 % (common practice for electrolytics): the corners
        // alone spread ln 3·R·C by 0.95·0.8 to 1.05·1.2, far wider than 3.6 h to 4.4 h.
        NightRunRequest r = Request("garden-path.json", "examples-tune/four-hours.scenario.json");
        var study = new TuneStudy(r, [Axis(r, "RTIM.value=E12:2.7M..4.7M")], "2026-11-20", corners: true, confirm: 1);
        List<string> advice = study.Advice(study.Candidates.MaxBy(c => c.PredictedMargin)!.Index);
        Assert.Contains(advice, a => a.Contains("tolerances alone", StringComparison.Ordinal) && a.Contains("CTIM.value", StringComparison.Ordinal));
        Assert.All(study.Candidates, c => Assert.True(c.PredictedMargin < 0));
    }
}
