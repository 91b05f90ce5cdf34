using NightSim.Sky;
using NightSim.Sky.Events;

namespace NightSim.Tests.Sky;

public sealed class ScenarioLoaderTests
{
    [Fact]
    public void SyntaxError_NamesLineAndColumn()
    {
        string path = SkyTestFiles.Scenario("bad-syntax.scenario.json");
        LightScenario? s = ScenarioLoader.Load(path, out var errors);
        Assert.Null(s);
        ScenarioError e = Assert.Single(errors);
        Assert.Equal(path, e.File); // the path as given, not only the file name
        Assert.StartsWith($"{path}:4:", e.ToString(), StringComparison.Ordinal);
        Assert.Contains(": error at $: not valid JSON", e.ToString(), StringComparison.Ordinal);
        Assert.Equal(4, e.Line); // the missing comma after line 3 is detected at "nights" on line 4
        Assert.Contains("not valid JSON", e.Message);
        Assert.NotNull(e.Hint);
    }

    [Fact]
    public void ManyErrors_AllCollectedWithPathsAndLines()
    {
        LightScenario? s = ScenarioLoader.Load(SkyTestFiles.Scenario("many-errors.scenario.json"), out var errors);
        Assert.Null(s);
        string all = string.Join("\n", errors.Select(e => e.ToString()));
        void Has(string path, string text, int line)
        {
            ScenarioError? e = errors.FirstOrDefault(x => x.Path == path && x.Message.Contains(text, StringComparison.Ordinal));
            Assert.True(e is not null, $"no error at {path} containing \"{text}\" in:\n{all}");
            Assert.Equal(line, e!.Line);
        }
        Has("$.site.latitude", "too large", 3);
        Has("$.site.timeZone", "unknown time zone", 3);
        Has("$.start", "not a date", 4);
        Has("$.nights", "outside", 5);
        Has("$.sensor.exposur", "unknown property", 6);
        Has("$.events[0].times[0]", "clock time", 8);
        Has("$.events[1].kind", "unknown event kind", 9);
        Has("$.events[2].lux", "2.5q", 10);
        Has("$.events[3].as", "not a pulse type", 11);
        Has("$.events[4]", "not both", 12);
        Assert.All(errors, e => Assert.False(string.IsNullOrEmpty(e.Hint), $"no hint: {e}"));
        // Typo hint names the intended property.
        Assert.Contains(errors, e => e.Hint!.Contains("\"exposure\"", StringComparison.Ordinal));
        Assert.Contains(errors, e => e.Hint!.Contains("headlights", StringComparison.Ordinal) && e.Path == "$.events[1].kind");
    }

    [Fact]
    public void MissingSite_AndMissingStorms()
    {
        ScenarioLoader.Load(SkyTestFiles.Scenario("missing-site.scenario.json"), out var errors);
        Assert.Contains(errors, e => e.Message.Contains("\"site\"", StringComparison.Ordinal));
        Assert.Contains(errors, e => e.Path == "$.events[0]" && e.Message.Contains("storms", StringComparison.Ordinal));
    }

    [Fact]
    public void BadLog_ErrorsCarryCsvLineNumbers()
    {
        ScenarioLoader.Load(SkyTestFiles.Scenario("bad-log.scenario.json"), out var errors);
        Assert.Contains(errors, e => e.File == "bad-log.csv" && e.Line == 4 && e.Message.Contains("2 columns", StringComparison.Ordinal));
        Assert.Contains(errors, e => e.Line == 5 && e.Message.Contains("abc", StringComparison.Ordinal));
        Assert.Contains(errors, e => e.Line == 6 && e.Message.Contains("line 3", StringComparison.Ordinal));
        Assert.Contains(errors, e => e.Line == 7 && e.Message.Contains("time stamp", StringComparison.Ordinal));
        Assert.Contains(errors, e => e.Line == 8 && e.Message.Contains("negative", StringComparison.Ordinal));
        Assert.Equal(5, errors.Count);
    }

    [Fact]
    public void LoadOrThrow_CarriesEveryError()
    {
        var ex = Assert.Throws<ScenarioException>(() => ScenarioLoader.LoadOrThrow(SkyTestFiles.Scenario("many-errors.scenario.json")));
        Assert.True(ex.Errors.Count >= 10);
    }

    [Fact]
    public void Examples_LoadWithoutErrors()
    {
        foreach (string file in Directory.GetFiles(SkyTestFiles.RepoFile("netlists/examples-sky"), "*.scenario.json"))
        {
            LightScenario? s = ScenarioLoader.Load(file, out var errors);
            Assert.True(s is not null, string.Join("\n", errors));
        }
    }

    [Fact]
    public void GardenExample_Values()
    {
        LightScenario s = ScenarioLoader.LoadOrThrow(SkyTestFiles.RepoFile("netlists/examples-sky/garden-winter.scenario.json"));
        Assert.Equal(52.1, s.Site.Latitude);
        Assert.Equal(new DateOnly(2026, 11, 20), s.Start);
        Assert.Equal(2, s.Nights);
        Assert.Equal(42UL, s.Seed);
        Assert.True(s.SeedGiven);
        Assert.Equal(0.3, s.Channels[0].Exposure);
        Assert.Equal(4, s.Events.Count);
        Assert.NotNull(s.Weather.Clouds);
        var lamp = Assert.IsType<LampCoupling>(s.Events[3]);
        Assert.Equal("K1", lamp.Part);
        Assert.Equal(1.2, lamp.Lux);
    }

    [Fact]
    public void EngineeringStrings_AndDefaultSeed()
    {
        const string json = """
        { "site": { "latitude": "52.1", "longitude": 8.6, "timeZone": "UTC" }, "start": "2026-01-10",
          "events": [ { "kind": "noise", "node": "n1", "times": ["23:00"], "amplitude": "100m", "width": "300u", "as": "current" } ] }
        """;
        LightScenario? s = ScenarioLoader.Parse(json, "inline.json", null, out var errors);
        Assert.True(s is not null, string.Join("\n", errors));
        Assert.False(s!.SeedGiven);
        Assert.Equal(LightScenario.DefaultSeed, s.Seed);
        LightProfile p = s.CreateProfile();
        NoiseInjection n = Assert.Single(p.NoiseInjections);
        Assert.Equal(0.1, n.Amplitude, 12);
        Assert.Equal(300e-6, n.Width, 15);
        Assert.Equal(NoiseQuantity.Current, n.Quantity);
        Assert.Equal(11 * 3600.0, n.Time, 6); // 23:00 is 11 h after local noon (UTC zone)
    }
}
