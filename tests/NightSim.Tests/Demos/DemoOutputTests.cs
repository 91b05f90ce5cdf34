using System.Text.Json;
using System.Xml.Linq;
using Json.Schema;
using NightSim.Cli;

namespace NightSim.Tests.Demos;

/// <summary>The simulate verb on a demo, as a user runs it: every output file, valid and complete.</summary>
public class DemoOutputTests
{
    private static (int Exit, string Out, string Err, string Dir) Simulate(params string[] extra)
    {
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-demo-" + Guid.NewGuid().ToString("N"));
        var output = new StringWriter();
        var error = new StringWriter();
        string[] args = ["simulate", DemoRuns.Netlist("garden-path-driveway"), "--out", dir, "--no-progress", .. extra];
        int exit = Program.CreateRoot().Parse(args).Invoke(new System.CommandLine.InvocationConfiguration { Output = output, Error = error });
        return (exit, output.ToString(), error.ToString(), dir);
    }

    [Fact]
    public void WritesReportTracesPlotsAndPage()
    {
        (int exit, string output, string error, string dir) = Simulate();
        try
        {
            Assert.True(exit == 0, error);
            // The companion scenario was found beside the netlist.
            Assert.Contains("headlight", output, StringComparison.Ordinal);

            // report.json validates against its schema (JSON Schema draft 2020-12, JsonSchema.Net).
            var schema = JsonSchema.FromText(File.ReadAllText(Path.Combine(RepoPaths.Root, "docs", "report.schema.json")));
            using JsonDocument report = JsonDocument.Parse(File.ReadAllText(Path.Combine(dir, "report.json")));
            EvaluationResults result = schema.Evaluate(report.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
            Assert.True(result.IsValid, string.Join("; ", (result.Details ?? []).Where(d => d.Errors is not null).SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Value}"))));
            Assert.Equal("headlight", report.RootElement.GetProperty("nights")[0].GetProperty("loadOn")[1].GetProperty("cause").GetString());

            // Night plot and zooms, SVG and PNG.
            string[] svgs = Directory.GetFiles(dir, "*.svg");
            Assert.Contains(svgs, f => Path.GetFileName(f).StartsWith("night-", StringComparison.Ordinal));
            Assert.Contains(svgs, f => Path.GetFileName(f).StartsWith("zoom-", StringComparison.Ordinal));
            // One millisecond-scale detail per switch-on (dusk and the headlight): the trigger dip is drawn.
            string[] details = svgs.Where(f => Path.GetFileName(f).StartsWith("detail-", StringComparison.Ordinal)).ToArray();
            Assert.Equal(2, details.Length);
            Assert.Contains("trigger pin (node trig)", File.ReadAllText(details[0]), StringComparison.Ordinal);
            string nightSvg = File.ReadAllText(svgs.First(f => Path.GetFileName(f).StartsWith("night-", StringComparison.Ordinal)));
            foreach (string series in (string[])["illuminance at sensor", "sensor (node sense)", "trigger pin (node trig)", "timing capacitor (node tc)", "lamp on"])
                Assert.Contains(series, nightSvg, StringComparison.Ordinal);
            foreach (string png in Directory.GetFiles(dir, "*.png"))
                Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47 }, File.ReadAllBytes(png)[..4]); // PNG signature (ISO/IEC 15948)
            Assert.Equal(svgs.Length, Directory.GetFiles(dir, "*.png").Length);

            // trace.csv: header and rows.
            string[] csv = File.ReadAllLines(Path.Combine(dir, "trace.csv"));
            Assert.StartsWith("time_s,clock,", csv[0], StringComparison.Ordinal);
            Assert.True(csv.Length > 100);

            // report.html parses as XML (XHTML-compatible markup) and holds the nights table and inline plots.
            string html = File.ReadAllText(Path.Combine(dir, "report.html"));
            XDocument page = XDocument.Parse(html[html.IndexOf("<html", StringComparison.Ordinal)..]);
            XNamespace ns = page.Root!.Name.Namespace;
            Assert.Contains(page.Descendants(ns + "table"), t => (string?)t.Attribute("class") == "nights");
            Assert.True(page.Descendants().Count(e => e.Name.LocalName == "svg") >= 2);
            Assert.DoesNotContain(page.Descendants(), e => e.Name.LocalName == "script");
            Assert.Empty(Directory.GetFiles(dir, "*.tmp"));
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void JsonFormatPrintsTheReport()
    {
        (int exit, string output, string error, string dir) = Simulate("--format", "json", "--no-plots");
        try
        {
            Assert.True(exit == 0, error);
            using JsonDocument doc = JsonDocument.Parse(output);
            Assert.Equal(11UL, doc.RootElement.GetProperty("seed").GetUInt64());
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void FailOnWarningExitsFour()
    {
        (int exit, _, string error, string dir) = Simulate("--fail-on", "warning", "--no-plots");
        Directory.Delete(dir, recursive: true);
        Assert.True(exit == 4, error);
    }

    [Fact]
    public void ScenarioNamingAPartTheNetlistLacksIsBadInput()
    {
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-bad-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        try
        {
            string scenario = Path.Combine(dir, "bad.scenario.json");
            File.WriteAllText(scenario, File.ReadAllText(DemoRuns.Scenario("dusk-switch-self-lit")).Replace("\"K1\"", "\"K9\"", StringComparison.Ordinal));
            var output = new StringWriter();
            var error = new StringWriter();
            string outDir = Path.Combine(dir, "out");
            int exit = Program.CreateRoot().Parse(["simulate", DemoRuns.Netlist("dusk-switch-self-lit"), "--scenario", scenario, "--out", outDir, "--no-progress"])
                .Invoke(new System.CommandLine.InvocationConfiguration { Output = output, Error = error });
            Assert.Equal(2, exit);
            Assert.Contains("K9", error.ToString(), StringComparison.Ordinal);
            Assert.Contains("bad.scenario.json", error.ToString(), StringComparison.Ordinal);
            Assert.DoesNotContain("   at ", error.ToString(), StringComparison.Ordinal); // no stack trace
            Assert.False(Directory.Exists(outDir) && Directory.EnumerateFiles(outDir).Any()); // nothing half-written
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}
