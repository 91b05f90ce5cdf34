using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Studies;

namespace NightSim.Tests.Studies;

/// <summary>The spread on the garden-path demo with tolerances and weather variation switched off except where a test
/// switches them on.</summary>
public sealed class SpreadStudyTests
{
    private static readonly string[] s_toleranceNames = ["tolerance", "toleranceAbove", "r10Tolerance", "gammaTolerance", "offsetTolerance", "inputCurrentTolerance", "thresholdTolerance"];

    /// <summary>The demo with every tolerance 0 and the timing capacitor's leakage removed (so the closed form is ln 3·R·C).</summary>
    private static NightRunRequest Request(double timingCapacitorTolerance, double timingResistorTolerance = 0)
    {
        NetlistDefinition net = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, "garden-path.json"));
        var parts = net.Parts.Select(p =>
        {
            PartParameters q = p.Parameters;
            foreach (string name in s_toleranceNames)
            {
                if (q.Has(name) || (p.Kind == "capacitor" && name == "tolerance")) q = q.WithNumber(name, 0);
            }
            if (p.Id == "CTIM") q = q.WithNumber("leakageCurrent", 0).WithNumber("tolerance", timingCapacitorTolerance);
            if (p.Id == "RTIM") q = q.WithNumber("tolerance", timingResistorTolerance);
            return p with { Parameters = q };
        }).ToList();
        return new NightRunRequest
        {
            Netlist = net with { Parts = parts },
            NetlistPath = "garden-path.json",
            // Fixed weather: scenario variation off too, so only the drawn part values differ between runs.
            Scenario = ScenarioLoader.LoadOrThrow(Path.Combine(RepoPaths.Netlists, "garden-path.scenario.json")) with { WeatherMix = null },
            ScenarioPath = "garden-path.scenario.json",
        };
    }

    private static List<SpreadRun> Run(SpreadStudy study, int workers) =>
        StudyRunner.Run(Enumerable.Range(0, study.Total).ToList(), study.Run, workers, CancellationToken.None).Select(r => r!).ToList();

    [Fact]
    public void Zero_Tolerances_Give_Zero_Spread()
    {
        var study = new SpreadStudy(Request(0), runs: 4, corners: false, seed: 7);
        Assert.Empty(study.Variations);
        List<SpreadRun> runs = Run(study, 2);
        Assert.All(runs, r => Assert.Equal(runs[0].Outcome.OnSeconds, r.Outcome.OnSeconds));
        Assert.All(runs, r => Assert.Equal(runs[0].Outcome.SwitchOn, r.Outcome.SwitchOn));
        SpreadSummary s = SpreadSummary.Of(runs);
        Assert.Equal(0.0, s.OnTimeSeconds!.StandardDeviation);
        Assert.Equal(s.OnTimeSeconds.P5, s.OnTimeSeconds.P95);
    }

    [Fact]
    public void Timing_Capacitor_At_20_Percent_Gives_The_Mean_On_Time_Of_Ln3_R_Mean_C()
    {
        // 555 monostable: t = ln 3 · R · C (threshold at 2/3 of the supply; common practice, the textbook 1.1·R·C).
        // C uniform within ±20 %: the mean on-time is ln 3 · R · mean(C), and with the nominal C it agrees within
        // the sampling error (3 standard errors of the mean).
        var study = new SpreadStudy(Request(0.2), runs: 24, corners: false, seed: 3);
        Assert.Equal("CTIM.value", Assert.Single(study.Variations).Key);
        List<SpreadRun> runs = Run(study, 2);
        Assert.All(runs, r => Assert.False(r.Outcome.NeverEnds));
        const double r = 3.3e6, cNominal = 3300e-6;
        double[] c = runs.Select(x => x.Values.Single().Value).ToArray();
        Assert.All(c, v => Assert.InRange(v, 0.8 * cNominal, 1.2 * cNominal));
        double[] on = runs.Select(x => x.Outcome.OnSeconds!.Value).ToArray();
        double mean = on.Average();
        double sampleMeanForm = Math.Log(3) * r * c.Average();
        Assert.True(Math.Abs(mean - sampleMeanForm) / sampleMeanForm < 0.01, $"mean {mean:F0} s vs ln3·R·mean(C) {sampleMeanForm:F0} s");
        double sd = Math.Sqrt(on.Sum(x => (x - mean) * (x - mean)) / (on.Length - 1));
        double nominalForm = Math.Log(3) * r * cNominal;
        Assert.True(Math.Abs(mean - nominalForm) < 3 * sd / Math.Sqrt(on.Length) + 0.005 * nominalForm,
            $"mean {mean:F0} s vs ln3·R·C {nominalForm:F0} s, standard error {sd / Math.Sqrt(on.Length):F0} s");
        Assert.True(sd > 0.05 * nominalForm, "the draws must spread the on-time");
    }

    [Fact]
    public void One_And_Two_Workers_Give_Identical_Files()
    {
        NightRunRequest req = Request(0.2);
        byte[] Json(int workers)
        {
            var study = new SpreadStudy(req, runs: 6, corners: false, seed: 11);
            return new SpreadReport(study.Header("nightsim test"), study.Variations, Run(study, workers), true, []).Json();
        }
        Assert.Equal(Json(1), Json(2));
    }

    [Fact]
    public void Corners_Put_Each_Variation_At_Its_Extremes_One_At_A_Time()
    {
        var study = new SpreadStudy(Request(0.2), runs: 1, corners: true, seed: 1);
        Assert.Equal(3, study.Total);
        Assert.Equal(3300e-6, study.Draw(0).Values.Single().Value, 12);
        Assert.Equal(0.8 * 3300e-6, study.Draw(1).Values.Single().Value, 12);
        Assert.Equal(1.2 * 3300e-6, study.Draw(2).Values.Single().Value, 12);
        Assert.Equal("CTIM.value low", study.Draw(1).Label);
    }

    [Fact]
    public void Corners_Add_The_Combined_Worst_Cases_Of_The_On_Time()
    {
        // 555 monostable: t = ln 3 · R · C (common practice, the textbook 1.1·R·C). Both bands lengthen the on-time
        // when they rise, so the combined short corner is R and C both at their low ends, the long one both high:
        // ln 3 · 0.95 R · 0.8 C and ln 3 · 1.05 R · 1.2 C (worst-case analysis by sensitivity signs: common practice).
        var study = new SpreadStudy(Request(0.2, 0.05), runs: 1, corners: true, seed: 1);
        Assert.Equal(2, study.Variations.Count);
        Assert.Equal(1 + 2 * 2 + 2, study.Total);
        const double r = 3.3e6, c = 3300e-6;
        var low = study.Draw(5);
        var high = study.Draw(6);
        Assert.Equal("all bands: on-time low", low.Label);
        Assert.Equal("all bands: on-time high", high.Label);
        Assert.Equal(0.95 * r, low.Values.Single(v => v.Key == "RTIM.value").Value, 6);
        Assert.Equal(0.8 * c, low.Values.Single(v => v.Key == "CTIM.value").Value, 12);
        Assert.Equal(1.05 * r, high.Values.Single(v => v.Key == "RTIM.value").Value, 6);
        Assert.Equal(1.2 * c, high.Values.Single(v => v.Key == "CTIM.value").Value, 12);
        double shortest = study.Run(5).Outcome.OnSeconds!.Value;
        double expected = Math.Log(3) * 0.95 * r * 0.8 * c;
        Assert.True(Math.Abs(shortest - expected) / expected < 0.01, $"combined low corner on for {shortest:F0} s, ln3·R·C at the low ends {expected:F0} s");
        // Shorter than either band's own low corner (ln 3 · 0.95 R · C and ln 3 · R · 0.8 C).
        Assert.True(shortest < Math.Log(3) * r * 0.8 * c * 0.99);
    }
}
