using NightSim.Cli.Rendering;
using NightSim.Tests.Reporting;
using Spectre.Console.Testing;

namespace NightSim.Tests.Cli.Rendering;

/// <summary>The terminal summary, rendered into Spectre.Console's test console (invented demo data).</summary>
public sealed class TerminalReportTests
{
    private static string Render(TestConsole console)
    {
        TerminalReport.Render(DemoReportData.Report(), console);
        return console.Output;
    }

    [Fact]
    public void ShowsCautionFirstThenTableFindingsAndStatistics()
    {
        var console = new TestConsole();
        string output = Render(console);
        int caution = output.IndexOf("CAUTION", StringComparison.Ordinal);
        int table = output.IndexOf("Nights", StringComparison.Ordinal);
        int findings = output.IndexOf("Findings", StringComparison.Ordinal);
        int solver = output.IndexOf("solver:", StringComparison.Ordinal);
        Assert.True(caution >= 0 && caution < table && table < findings && findings < solver, output);
        Assert.Contains("licensed electrician", output, StringComparison.Ordinal);
        Assert.Contains("2026-11-20", output, StringComparison.Ordinal);
        Assert.Contains("2026-11-21", output, StringComparison.Ordinal);
        Assert.Contains("17:12:00", output, StringComparison.Ordinal);
        Assert.Contains("23:41:07", output, StringComparison.Ordinal);
        Assert.Contains("headlight", output, StringComparison.Ordinal);
        Assert.Contains("still on", output, StringComparison.Ordinal);
        Assert.Contains("80.00", output, StringComparison.Ordinal);
        Assert.Contains("false-trigger-headlight", output, StringComparison.Ordinal);
        Assert.Contains("fix:", output, StringComparison.Ordinal);
        Assert.Contains("184220 steps accepted", output, StringComparison.Ordinal);
        // Markup characters in names are printed, not interpreted.
        Assert.Contains("Demo night light <4 h timer> & relay", output, StringComparison.Ordinal);
    }

    [Fact]
    public void ErrorsAreListedBeforeWarningsAndInformation()
    {
        string output = Render(new TestConsole());
        int error = output.IndexOf("false-trigger-headlight", StringComparison.Ordinal);
        int warning = output.IndexOf("timer-tolerance", StringComparison.Ordinal);
        int info = output.IndexOf("dusk-switch-level", StringComparison.Ordinal);
        Assert.True(error < warning && warning < info, output);
    }

    [Fact]
    public void RedirectedOutputIsWidenedSoTheTableIsNotSqueezed()
    {
        var console = new TestConsole();
        console.Profile.Capabilities.Interactive = false;
        console.Profile.Width = 80;
        string output = Render(console);
        Assert.Equal(TerminalReport.RedirectedWidth, console.Profile.Width);
        // At 160 columns each night row fits on one line: the date and the energy share a line.
        Assert.Contains(output.Split('\n'), l => l.Contains("2026-11-20", StringComparison.Ordinal) && l.Contains("80.00", StringComparison.Ordinal));
    }

    [Fact]
    public void NoCautionPanelWhenNothingTouchesMains()
    {
        var console = new TestConsole();
        TerminalReport.Render(DemoReportData.Report() with { Cautions = [], Findings = [] }, console);
        Assert.DoesNotContain("CAUTION", console.Output, StringComparison.Ordinal);
        Assert.Contains("none: every night behaved as intended", console.Output, StringComparison.Ordinal);
    }
}
