using NightSim.Sky;

namespace NightSim.Tests.Sky;

/// <summary>A scenario cannot ask for unbounded work: every event source is limited per night, with the limit named.</summary>
public sealed class ScenarioLimitsTests
{
    private static string Scenario(string events, string weather = "{ \"sky\": \"clear\" }", string extra = "") => $$"""
        { "name": "limits", "site": { "name": "Invented Lane", "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin" },
          "start": "2026-11-20", "nights": 1, "seed": 3, "weather": {{weather}}, "events": [ {{events}} ] {{extra}} }
        """;

    private static IReadOnlyList<ScenarioError> Errors(string json)
    {
        LightScenario? s = ScenarioLoader.Parse(json, "limits.scenario.json", Path.GetTempPath(), out IReadOnlyList<ScenarioError> errors);
        Assert.Null(s);
        return errors;
    }

    [Fact]
    public void A_Reasonable_Scenario_Still_Loads()
    {
        string json = Scenario("""{ "kind": "headlights", "perHour": 3, "from": "18:00", "to": "23:00", "peakLux": 20, "seconds": 8 }""",
            """{ "sky": "clear", "clouds": { "perHour": 6, "minutes": 10 } }""");
        Assert.NotNull(ScenarioLoader.Parse(json, "ok.scenario.json", Path.GetTempPath(), out var errors));
        Assert.Empty(errors);
    }

    [Theory]
    [InlineData("""{ "kind": "headlights", "perHour": 1e308, "from": "18:00", "to": "23:00", "peakLux": 20, "seconds": 8 }""", "$.events[0].perHour")]
    [InlineData("""{ "kind": "lightning", "peakLux": 500, "storms": [ { "from": "22:00", "minutes": 1e9, "flashesPerMinute": 2 } ] }""", "$.events[0].storms[0].minutes")]
    [InlineData("""{ "kind": "lightning", "peakLux": 500, "storms": [ { "from": "22:00", "minutes": 600, "flashesPerMinute": 1000 } ] }""", "$.events[0].storms[0].flashesPerMinute")]
    public void Event_Rates_Beyond_The_Limit_Are_Refused(string ev, string path)
    {
        ScenarioError e = Assert.Single(Errors(Scenario(ev)));
        Assert.Equal(path, e.Path);
        Assert.True(e.Message.Contains("limit of 100000 events per night", StringComparison.Ordinal) || e.Message.Contains("too large", StringComparison.Ordinal), e.ToString());
    }

    [Fact]
    public void Clouds_Too_Many_Or_Too_Short_Are_Refused()
    {
        ScenarioError e = Assert.Single(Errors(Scenario("", """{ "sky": "clear", "clouds": { "perHour": 1e6, "minutes": 10 } }""")));
        Assert.Equal("$.weather.clouds.perHour", e.Path);
        Assert.Contains("limit of 100000 events per night", e.Message, StringComparison.Ordinal);

        e = Assert.Single(Errors(Scenario("", """{ "sky": "clear", "clouds": { "perHour": 6, "minutes": 1e-9 } }""")));
        Assert.Equal("$.weather.clouds.minutes", e.Path);
    }

    [Fact]
    public void Explicit_Times_Beyond_The_Limit_Are_Refused()
    {
        string times = string.Join(",", Enumerable.Range(0, 100_001).Select(i => "\"20:00\""));
        ScenarioError e = Assert.Single(Errors(Scenario($$"""{ "kind": "headlights", "times": [{{times}}], "peakLux": 20, "seconds": 8 }""")));
        Assert.Equal("$.events[0].times", e.Path);
        Assert.Contains("limit of 100000 events per night", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_Number_Beyond_The_Double_Range_Is_An_Error()
    {
        ScenarioError e = Assert.Single(Errors(Scenario("""{ "kind": "headlights", "times": ["20:00"], "peakLux": 1e999, "seconds": 8 }""")));
        Assert.Equal("$.events[0].peakLux", e.Path);
        Assert.Contains("too large to be a number", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_Light_Log_That_Is_A_Device_Is_Refused_With_The_Limit()
    {
        if (!File.Exists("/dev/zero")) return; // a Unix device file; nothing to check elsewhere
        ScenarioError e = Assert.Single(Errors(Scenario("", extra: """, "lightLog": { "file": "/dev/zero" }""")));
        Assert.Equal("$.lightLog.file", e.Path);
        Assert.Contains("64 MB", e.Message + e.Hint, StringComparison.Ordinal);
    }

    [Fact]
    public void Control_Characters_In_Names_Are_Shown_As_Replacement_Characters()
    {
        string json = Scenario("").Replace("\"Invented Lane\"", "\"drive\\u001bway\"", StringComparison.Ordinal);
        LightScenario? s = ScenarioLoader.Parse(json, "esc.scenario.json", Path.GetTempPath(), out var errors);
        Assert.True(s is not null, string.Join("\n", errors));
        Assert.Equal("drive\uFFFDway", s.Site.Name);
    }
}
