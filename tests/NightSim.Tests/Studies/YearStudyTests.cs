using NightSim.Netlist;
using NightSim.Runs;
using NightSim.Sky;
using NightSim.Studies;

namespace NightSim.Tests.Studies;

public sealed class YearStudyTests
{
    private static readonly Lazy<(YearStudy Study, List<YearNight> Nights)> s_year = new(() =>
    {
        // The garden-path demo at its invented site (52.1° N) on six dates two months apart, fixed clear weather.
        LightScenario sc = ScenarioLoader.LoadOrThrow(Path.Combine(RepoPaths.Netlists, "garden-path.scenario.json")) with { WeatherMix = null };
        var request = new NightRunRequest
        {
            Netlist = NetlistLoader.Load(Path.Combine(RepoPaths.Netlists, "garden-path.json")),
            NetlistPath = "garden-path.json",
            Scenario = sc,
            ScenarioPath = "garden-path.scenario.json",
        };
        var study = new YearStudy(request, new DateOnly(2026, 1, 10), new DateOnly(2026, 12, 31), step: 61);
        var nights = StudyRunner.Run(Enumerable.Range(0, study.Total).ToList(), study.Run, 2, CancellationToken.None).Select(n => n!).ToList();
        return (study, nights);
    });

    [Fact]
    public void Switch_On_Follows_Sunset_Through_The_Year()
    {
        List<YearNight> nights = s_year.Value.Nights;
        Assert.Equal(6, nights.Count);
        var sunset = nights.Select(n => DateTimeOffset.Parse(n.Sunset!, System.Globalization.CultureInfo.InvariantCulture)).ToList();
        var on = nights.Select(n => DateTimeOffset.Parse(n.Outcome.SwitchOn!, System.Globalization.CultureInfo.InvariantCulture)).ToList();
        // At 52° N local sunset moves by hours through the year (about 16:20 in December to 21:40 in June local time;
        // NOAA solar calculator equations, from memory); a dusk switch sees the same sky light a fixed while after
        // sunset (civil dusk lies 35–50 min after sunset there), so its switch-on follows sunset with a near-constant lag.
        double sunsetSpreadHours = sunset.Max(s => s.TimeOfDay.TotalHours) - sunset.Min(s => s.TimeOfDay.TotalHours);
        Assert.True(sunsetSpreadHours > 3.5, $"sunset spread {sunsetSpreadHours:F2} h");
        var lag = on.Zip(sunset, (a, b) => (a - b).TotalMinutes).ToList();
        Assert.All(lag, l => Assert.InRange(l, 10, 90));
        Assert.True(lag.Max() - lag.Min() < 40, $"lag range {lag.Min():F0}…{lag.Max():F0} min");
        // The switch-on clock time moves with sunset: their correlation over the dates is close to 1.
        double[] x = [.. sunset.Select(s => s.TimeOfDay.TotalHours)], y = [.. on.Select(s => s.TimeOfDay.TotalHours)];
        double mx = x.Average(), my = y.Average();
        double r = x.Zip(y, (a, b) => (a - mx) * (b - my)).Sum() / Math.Sqrt(x.Sum(a => (a - mx) * (a - mx)) * y.Sum(b => (b - my) * (b - my)));
        Assert.True(r > 0.98, $"correlation {r:F3}");
    }

    [Fact]
    public void Yearly_Energy_Is_The_Sum_Of_On_Times_Times_The_Load_Power()
    {
        (YearStudy study, List<YearNight> nights) = s_year.Value;
        var report = new YearReport(study.Header("nightsim test"), nights, true, []);
        // E = P · Σ t_on with the relay's rated load power, 12 W (definition of energy; no false triggers on these nights).
        Assert.All(nights, n => Assert.Equal(0, n.Outcome.FalseTriggers));
        double expected = 12.0 * nights.Sum(n => n.Outcome.OnSeconds!.Value) / 3600.0;
        Assert.Equal(expected, report.EnergyWh, 2);
        Assert.Equal(expected, report.Months().Sum(m => m.EnergyWh), 2);
        StudySchemas.AssertValid("year", report.Json());
    }
}
