using System.Text.RegularExpressions;
using NightSim.Sky;

namespace NightSim.Tests.Sky;

/// <summary>docs/scenario-format.md stays true: its examples load, and every key the loader accepts is documented.</summary>
public sealed partial class ScenarioFormatDocTests
{
    private static string Doc => File.ReadAllText(Path.Combine(RepoPaths.Root, "docs", "scenario-format.md"));

    [GeneratedRegex("```jsonc\\n(.*?)```", RegexOptions.Singleline)]
    private static partial Regex Block();

    private const string Shell = """
        { "site": { "latitude": 52.1, "longitude": 8.6, "timeZone": "Europe/Berlin" }, "start": "2026-11-20", BODY }
        """;

    [Fact]
    public void Every_Example_Loads_Without_Errors()
    {
        List<string> blocks = Block().Matches(Doc).Select(m => m.Groups[1].Value.Trim()).ToList();
        Assert.True(blocks.Count >= 9, $"{blocks.Count} examples");
        foreach (string block in blocks)
        {
            string json = block.StartsWith('{') && block.Contains("\"kind\"", StringComparison.Ordinal) && !block.Contains("\"site\"", StringComparison.Ordinal)
                ? Shell.Replace("BODY", "\"events\": [" + block + "]", StringComparison.Ordinal)
                : block.StartsWith('{') ? block
                : Shell.Replace("BODY", block, StringComparison.Ordinal);
            // The channel example needs no netlist; the light log example needs its CSV beside the scenario.
            LightScenario? s = ScenarioLoader.Parse(json, "doc.scenario.json", Path.Combine(RepoPaths.Netlists, "examples-sky"), out var errors);
            Assert.True(s is not null, block + "\n" + string.Join("\n", errors));
        }
    }

    [Theory]
    [InlineData("name"), InlineData("description"), InlineData("site"), InlineData("start"), InlineData("nights"), InlineData("seed")]
    [InlineData("sensor"), InlineData("channels"), InlineData("weather"), InlineData("events"), InlineData("lightLog")]
    [InlineData("latitude"), InlineData("longitude"), InlineData("timeZone"), InlineData("elevation"), InlineData("sensor.exposure")]
    [InlineData("sky"), InlineData("clouds.perHour"), InlineData("clouds.depth"), InlineData("clouds.minutes"), InlineData("moon"), InlineData("moonLux"), InlineData("floorLux")]
    [InlineData("times"), InlineData("perHour"), InlineData("peakLux"), InlineData("seconds"), InlineData("riseSeconds"), InlineData("fallSeconds"), InlineData("channel")]
    [InlineData("storms"), InlineData("on"), InlineData("off"), InlineData("lux"), InlineData("part"), InlineData("contact")]
    [InlineData("node"), InlineData("amplitude"), InlineData("width"), InlineData("as"), InlineData("file"), InlineData("mode"), InlineData("atSensor")]
    public void Every_Key_The_Loader_Reads_Has_A_Table_Row(string key)
    {
        Assert.Contains("| `" + key, Doc, StringComparison.Ordinal);
    }
}
