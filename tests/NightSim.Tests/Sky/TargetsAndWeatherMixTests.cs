using NightSim.Sky;

namespace NightSim.Tests.Sky;

public sealed class TargetsAndWeatherMixTests
{
    private const string Head = """
        { "name": "t", "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin" }, "start": "2026-01-01",
        """;

    [Fact]
    public void Targets_Parse_With_Durations_And_Clock_Times()
    {
        LightScenario? s = ScenarioLoader.Parse(Head + """
             "targets": { "switchOnLux": { "min": 1, "max": "5lx" }, "onTime": { "min": "3.5h", "max": 16200 }, "offBy": "23:30", "noChatter": true } }
            """, "t.json", null, out var errors);
        Assert.Empty(errors);
        DesignTargets t = s!.Targets!;
        Assert.Equal(12600.0, t.OnTimeMin);
        Assert.Equal(16200.0, t.OnTimeMax);
        Assert.Equal(5.0, t.SwitchOnLuxMax);
        Assert.Equal(new TimeSpan(23, 30, 0), t.OffBy);
        Assert.True(t.NoChatter);
        Assert.False(t.NoFalseTrigger);
    }

    [Fact]
    public void Bad_Targets_Name_The_Json_Path()
    {
        ScenarioLoader.Parse(Head + """ "targets": { "onTime": { "min": "5h", "max": "3h" }, "noChatter": "yes", "offby": "23:00" } }""",
            "t.json", null, out var errors);
        Assert.Contains(errors, e => e.Path == "$.targets.onTime" && e.Message.Contains("above", StringComparison.Ordinal));
        Assert.Contains(errors, e => e.Path == "$.targets.noChatter");
        Assert.Contains(errors, e => e.ToString().Contains("offby", StringComparison.Ordinal));
    }

    [Fact]
    public void Weather_Mix_Draws_Each_Sky_At_Its_Weight_And_Repeats_Per_Date()
    {
        LightScenario s = ScenarioLoader.Parse(Head + """ "weatherMix": { "clear": 1, "cloudy": 1, "overcast": 2 } }""", "t.json", null, out var errors)!;
        Assert.Empty(errors);
        WeatherMix mix = s.WeatherMix!;
        var first = new DateOnly(2026, 1, 1);
        int n = 4000, overcast = 0;
        for (int d = 0; d < n; d++) if (mix.Draw(first.AddDays(d), 5) == "overcast") overcast++;
        // Binomial: mean n·p = 2000, standard deviation √(n·p(1−p)) ≈ 31.6; allow four of them.
        Assert.InRange(overcast, 2000 - 127, 2000 + 127);
        Assert.Equal(mix.Draw(first.AddDays(17), 5), mix.Draw(first.AddDays(17), 5));
        ScenarioLoader.Parse(Head + """ "weatherMix": [ { "clear": 1 } ] }""", "t.json", null, out errors);
        Assert.Contains(errors, e => e.Path == "$.weatherMix");
    }
}
