using NightSim.Cli;
using NightSim.Tests.Demos;

namespace NightSim.Tests.Cli;

/// <summary>A run of more than a week plots an overview of every night and the interesting nights only.</summary>
public sealed class MultiNightPlotsTests
{
    [Fact]
    public void Eight_Quiet_Nights_Give_The_Overview_And_The_First_Night()
    {
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-nights-" + Guid.NewGuid().ToString("N"));
        try
        {
            var output = new StringWriter();
            var error = new StringWriter();
            int exit = Program.CreateRoot().Parse(["simulate", DemoRuns.Netlist("garden-path"), "--nights", "8", "--out", dir, "--no-progress"])
                .Invoke(new System.CommandLine.InvocationConfiguration { Output = output, Error = error });
            Assert.True(exit == 0, error.ToString());
            // Nothing went wrong on any night: the overview shows all eight, and the first night is plotted as an example.
            string[] nights = [.. Directory.GetFiles(dir, "night-*.svg").Select(Path.GetFileName).OfType<string>()];
            Assert.Equal(["night-2026-11-20.svg"], nights);
            Assert.True(File.Exists(Path.Combine(dir, "nights.svg")));
            Assert.Contains("plotted 1 of 8 nights", output.ToString(), StringComparison.Ordinal);
            // Only the plotted night's zooms: its dusk switch-on and its timer's end, and the switch-on's detail (the
            // run captured the first twelve switching events, six switch-on details, over several nights).
            Assert.Equal(["zoom-01-lamp-on-dusk.svg", "zoom-02-lamp-off-timer-ran-out.svg"],
                Directory.GetFiles(dir, "zoom-*.svg").Select(Path.GetFileName).Order(StringComparer.Ordinal));
            Assert.Equal(["detail-01-lamp-on-dusk.svg"], Directory.GetFiles(dir, "detail-*.svg").Select(Path.GetFileName));
            // The page opens its plots with the overview.
            string html = File.ReadAllText(Path.Combine(dir, "report.html"));
            int overview = html.IndexOf("Every night: when the lamp was on (8 nights)", StringComparison.Ordinal);
            int first = html.IndexOf("night of 2026-11-20", StringComparison.Ordinal);
            Assert.True(overview > 0 && first > overview, "the overview figure comes first");
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }
}
