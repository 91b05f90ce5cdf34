using System.CommandLine;
using NightSim.Analysis;
using NightSim.Cli;
using NightSim.Reporting;
using NightSim.Tests.Reporting;

namespace NightSim.Tests.Cli;

public sealed class CompareCommandTests
{
    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    [Fact]
    public void Names_The_Changed_Parts_And_The_Changed_Nights()
    {
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-compare-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        try
        {
            NightReport a = DemoReportData.Report();
            // B: one part value changed, one part gone, and the night without its false trigger.
            var parts = a.Parts.Where(p => p.Id != "CF")
                .Select(p => p.Id == "RTIM" ? p with { Values = [new("value", "2.7 MΩ")] } : p).ToList();
            NightSummary night = a.Nights[0];
            NightReport b = a with
            {
                Parts = parts,
                CircuitHash = new string('0', 64),
                Nights = [night with { FalseTriggers = 0, LoadOn = [.. night.LoadOn.Where(i => i.Expected)] }, .. a.Nights.Skip(1)],
            };
            string pa = Path.Combine(dir, "a.json"), pb = Path.Combine(dir, "b.json");
            JsonReportWriter.Write(a, pa);
            JsonReportWriter.Write(b, pb);

            (int exit, string output, string error) = Run("compare", pa, pb);
            Assert.True(exit == 0, error);
            Assert.Contains("2 changes", output, StringComparison.Ordinal);
            Assert.Contains("~ RTIM (resistor): value 3.3 MΩ → 2.7 MΩ", output, StringComparison.Ordinal);
            Assert.Contains("- CF (capacitor) removed", output, StringComparison.Ordinal);
            Assert.Contains("2026-11-20: false triggers 1 → 0", output, StringComparison.Ordinal);
            Assert.Contains($"1 of {a.Nights.Count} nights changed.", output, StringComparison.Ordinal);

            (exit, output, _) = Run("compare", pa, pa);
            Assert.Equal(0, exit);
            Assert.Contains("same circuit", output, StringComparison.Ordinal);
            Assert.Contains("No night's outcome changed.", output, StringComparison.Ordinal);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void A_File_That_Is_Not_A_Report_Exits_2_With_Its_Name()
    {
        string path = Path.Combine(RepoPaths.Netlists, "rc-step.json");
        (int exit, _, string error) = Run("compare", path, path);
        Assert.Equal(2, exit);
        Assert.Contains("rc-step.json: error at $: not a night-run report", error, StringComparison.Ordinal);
        (exit, _, error) = Run("compare", "no-such/report.json", path);
        Assert.Equal(2, exit);
        Assert.Contains("no-such/report.json: error: file not found", error, StringComparison.Ordinal);
    }
}
