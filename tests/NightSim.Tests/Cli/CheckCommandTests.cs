using System.CommandLine;
using NightSim.Cli;

namespace NightSim.Tests.Cli;

public sealed class CheckCommandTests
{
    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    [Fact]
    public void Valid_Example_Prints_A_Summary_And_Exits_0()
    {
        (int exit, string output, string error) = Run("check", Path.Combine(RepoPaths.Netlists, "rc-step.json"));
        Assert.Equal(0, exit);
        Assert.Equal("", error);
        Assert.Contains("rc-step: valid", output, StringComparison.Ordinal);
        Assert.Contains("parts:    3 (resistor 1, capacitor 1, voltage-source 1)", output, StringComparison.Ordinal);
        Assert.Contains("nodes:    2 + ground (in, out)", output, StringComparison.Ordinal);
        Assert.Contains("warnings: none", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Malformed_File_Prints_Every_Error_And_Exits_2_Without_A_Stack_Trace()
    {
        string file = RepoPaths.BadNetlist("bad-many.json");
        (int exit, string output, string error) = Run("check", file);
        Assert.Equal(2, exit);
        Assert.Equal("", output);
        Assert.Contains($"{file}:5:73: error at $.parts[1].value (part R1)", error, StringComparison.Ordinal);
        Assert.Contains("(part C1)", error, StringComparison.Ordinal);
        Assert.Contains("(part Q1)", error, StringComparison.Ordinal);
        Assert.Contains("3 errors.", error, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Missing_File_Exits_2()
    {
        (int exit, _, string error) = Run("check", "does-not-exist.json");
        Assert.Equal(2, exit);
        Assert.Contains("does-not-exist.json: error at $: file not found", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Scenario_That_Is_Not_Json_Exits_2_With_Its_Position()
    {
        string scenario = Path.Combine(Path.GetTempPath(), $"nightsim-check-{Environment.ProcessId}.scenario.json");
        File.WriteAllText(scenario, "{\n  \"site\": \n}\n");
        try
        {
            (int exit, _, string error) = Run("check", Path.Combine(RepoPaths.Netlists, "divider.json"), scenario);
            Assert.Equal(2, exit);
            Assert.Contains($"{scenario}:3:1: error at $: invalid JSON", error, StringComparison.Ordinal);
        }
        finally
        {
            File.Delete(scenario);
        }
    }

    [Fact]
    public void Demo_With_Its_Scenario_Is_Valid_And_Summarised()
    {
        (int exit, string output, string error) = Run("check", Path.Combine(RepoPaths.Netlists, "garden-path-driveway.json"),
            Path.Combine(RepoPaths.Netlists, "garden-path-driveway.scenario.json"));
        Assert.True(exit == 0, error);
        Assert.Contains("scenario: driveway-headlights", output, StringComparison.Ordinal);
        Assert.Contains("seed 11", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Scenario_That_Does_Not_Fit_The_Netlist_Exits_2_Naming_Both()
    {
        string scenario = Path.Combine(Path.GetTempPath(), $"nightsim-misfit-{Environment.ProcessId}.scenario.json");
        File.WriteAllText(scenario, File.ReadAllText(Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.scenario.json"))
            .Replace("\"node\": \"trig\"", "\"node\": \"trg\"", StringComparison.Ordinal));
        try
        {
            (int exit, _, string error) = Run("check", Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.json"), scenario);
            Assert.Equal(2, exit);
            Assert.Contains($"{scenario}:", error, StringComparison.Ordinal);
            Assert.Contains(": error at $.events[0].node: noise at node 'trg'", error, StringComparison.Ordinal);
            Assert.Contains("trigger-filter-absent.json", error, StringComparison.Ordinal);
        }
        finally
        {
            File.Delete(scenario);
        }
    }

    [Fact]
    public void Write_Schema_Writes_The_Generated_Schema()
    {
        string target = Path.Combine(Path.GetTempPath(), $"nightsim-schema-{Environment.ProcessId}.json");
        try
        {
            (int exit, string output, _) = Run("check", "--write-schema", target);
            Assert.Equal(0, exit);
            Assert.Contains("wrote", output, StringComparison.Ordinal);
            Assert.Equal(NightSim.Netlist.NetlistSchema.Generate(), File.ReadAllText(target));
        }
        finally
        {
            File.Delete(target);
        }
    }

    [Fact]
    public void Help_Describes_The_Verb()
    {
        (int exit, string output, _) = Run("check", "--help");
        Assert.Equal(0, exit);
        Assert.Contains("NETLIST", output, StringComparison.Ordinal);
        Assert.Contains("--write-schema", output, StringComparison.Ordinal);
    }

    [Fact]
    public void No_Netlist_Is_A_Usage_Error()
    {
        (int exit, _, string error) = Run("check");
        Assert.Equal(1, exit);
        Assert.Contains("give a NETLIST file", error, StringComparison.Ordinal);
    }
}
