using NightSim.Cli;
using NightSim.Netlist;

namespace NightSim.Tests.Cli;

public sealed class CliErrorsTests
{
    [Fact]
    public void Input_Errors_Exit_2_With_Every_Line()
    {
        var error = new StringWriter();
        var ex = new NetlistException([
            new NetlistError("a.json", 1, 2, "$.parts[0]", "R1", "first", null),
            new NetlistError("a.json", 3, 4, "$.parts[1]", "R2", "second", "hint text"),
        ]);
        Assert.Equal(CliErrors.InvalidInput, CliErrors.Report(ex, error));
        Assert.Equal(
            "a.json:1:2: error at $.parts[0] (part R1): first\na.json:3:4: error at $.parts[1] (part R2): second. hint: hint text\n2 problems found.\n",
            error.ToString().ReplaceLineEndings("\n"));
    }

    [Fact]
    public void Unexpected_Failures_Exit_3_With_One_Line()
    {
        var error = new StringWriter();
        Assert.Equal(CliErrors.Unexpected, CliErrors.Report(new InvalidOperationException("broken\nstate"), error));
        Assert.Equal("nightsim: unexpected failure (InvalidOperationException): broken state", error.ToString().TrimEnd());
    }
}
