using System.CommandLine;
using NightSim.Cli;
using NightSim.Netlist;

namespace NightSim.Tests.Cli;

/// <summary>Hints that point the user at the real mistake.</summary>
public sealed class CliHintTests
{
    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    [Theory]
    [InlineData("0x"), InlineData("gdn"), InlineData("GND1"), InlineData("ground"), InlineData("gn")]
    public void A_Ground_Typo_Suggests_Gnd_Not_The_Nearest_Node(string typo)
    {
        // "a" and "gd" would be the nearest ordinary names by edit distance for some typos; ground is what was meant.
        string json = "{ \"name\": \"g\", \"parts\": [" +
            "{ \"id\": \"V1\", \"kind\": \"voltage-source\", \"nodes\": [\"a\", \"" + typo + "\"], \"constant\": \"5V\" }," +
            "{ \"id\": \"R1\", \"kind\": \"resistor\", \"nodes\": [\"a\", \"gd0\"], \"value\": \"1k\" }," +
            "{ \"id\": \"R2\", \"kind\": \"resistor\", \"nodes\": [\"gd0\", \"gnd\"], \"value\": \"1k\" } ] }";
        NetlistLoadResult r = NetlistLoader.ReadText(json, "g.json");
        NetlistError e = Assert.Single(r.Errors);
        Assert.Contains($"node \"{typo}\" has a single connection", e.ToString(), StringComparison.Ordinal);
        Assert.Contains("did you mean \"gnd\"", e.ToString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("in"), InlineData("en"), InlineData("vcc")]
    public void Ordinary_Short_Names_Are_Not_Taken_For_Ground(string name) => Assert.False(Ground.LooksLike(name));

    [Fact]
    public void A_Misspelt_Pin_Does_Not_Also_Suggest_Wiring_Its_Node_Elsewhere()
    {
        string json = """
            { "name": "p", "parts": [
              { "id": "V1", "kind": "voltage-source", "nodes": ["vcc", "gnd"], "constant": "12V" },
              { "id": "R1", "kind": "resistor", "nodes": ["vcc", "wip"], "value": "1k" },
              { "id": "P1", "kind": "potentiometer", "pins": { "a": "vcc", "wipe": "wipr", "b": "gnd" }, "value": "10k" } ] }
            """;
        NetlistLoadResult r = NetlistLoader.ReadText(json, "p.json");
        Assert.Contains(r.Errors, e => e.ToString().Contains("extra pin \"wipe\"", StringComparison.Ordinal) && e.ToString().Contains("did you mean \"wiper\"", StringComparison.Ordinal));
        Assert.DoesNotContain(r.Errors, e => e.ToString().Contains("node \"wipr\"", StringComparison.Ordinal));
    }

    [Fact]
    public void Fail_On_Names_The_Finding_That_Tripped_It()
    {
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-failon-" + Guid.NewGuid().ToString("N"));
        try
        {
            (int exit, _, string error) = Run("simulate", Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.json"), "--out", dir,
                "--no-plots", "--no-progress", "--fail-on", "warning");
            Assert.Equal(4, exit);
            Assert.Contains("--fail-on warning: ", error, StringComparison.Ordinal);
            Assert.Contains("at or above warning: ", error, StringComparison.Ordinal);
            Assert.Contains("warning false-trigger-noise at 22:30:00", error, StringComparison.Ordinal);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void A_Plain_Transient_Summary_Says_When_It_Lists_Only_Some_Traces()
    {
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-for-" + Guid.NewGuid().ToString("N"));
        try
        {
            (int exit, string output, string error) = Run("simulate", Path.Combine(RepoPaths.Netlists, "garden-path.json"), "--for", "1s", "--out", dir);
            Assert.True(exit == 0, error);
            Assert.Matches(@"\(the first 8 of \d+ traces; every one is in trace.csv", output);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }
}
