using System.CommandLine;
using NightSim.Cli;

namespace NightSim.Tests.Cli;

/// <summary>The study verbs end to end: sharded runs joined by merge write the same bytes as one run.</summary>
public sealed class StudyCommandTests
{
    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    private static string TempDir() => Path.Combine(Path.GetTempPath(), "nightsim-study-" + Guid.NewGuid().ToString("N"));

    private static void AssertSameFiles(string expectedDir, string actualDir, params string[] names)
    {
        foreach (string name in names)
        {
            Assert.True(File.Exists(Path.Combine(actualDir, name)), name + " missing");
            Assert.True(File.ReadAllBytes(Path.Combine(expectedDir, name)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(actualDir, name))), name + " differs");
        }
    }

    [Fact]
    public void Spread_Shards_Merged_Equal_The_Unsharded_Run()
    {
        string root = TempDir();
        try
        {
            string net = Path.Combine(RepoPaths.Netlists, "garden-path.json");
            string whole = Path.Combine(root, "whole"), s1 = Path.Combine(root, "s1"), s2 = Path.Combine(root, "s2"), merged = Path.Combine(root, "merged");
            var a = Run("spread", net, "--runs", "5", "--seed", "4", "--out", whole, "--no-progress", "--workers", "2");
            Assert.True(a.Exit == 0, a.Err);
            var b = Run("spread", net, "--runs", "5", "--seed", "4", "--out", s1, "--no-progress", "--shard", "1/2", "--workers", "1");
            Assert.True(b.Exit == 0, b.Err);
            var c = Run("spread", net, "--runs", "5", "--seed", "4", "--out", s2, "--no-progress", "--shard", "2/2");
            Assert.True(c.Exit == 0, c.Err);
            Assert.True(File.Exists(Path.Combine(s2, "shard-2-of-2.json")));
            Assert.False(File.Exists(Path.Combine(s2, "spread.json")));
            var m = Run("merge", s1, s2, "--out", merged);
            Assert.True(m.Exit == 0, m.Err);
            AssertSameFiles(whole, merged, "spread.json", "spread.csv", "spread.html", "spread-on-time.svg");
            Studies.StudySchemas.AssertValid("spread", File.ReadAllBytes(Path.Combine(merged, "spread.json")));
            // The page is self-contained and well-formed (inline SVG, no scripts, no external files).
            string page = File.ReadAllText(Path.Combine(merged, "spread.html"));
            System.Xml.Linq.XDocument.Parse(page.Replace("<!DOCTYPE html>", "", StringComparison.Ordinal));
            Assert.DoesNotContain("<script", page, StringComparison.Ordinal);
            Assert.Contains("<svg", page, StringComparison.Ordinal);
            // The worst runs are written as netlists simulate takes, each with its scenario beside it.
            string rerun = Directory.GetFiles(Path.Combine(merged, "runs"), "run-*.json").First(f => !f.EndsWith(".scenario.json", StringComparison.Ordinal));
            var again = Run("simulate", rerun, "--out", Path.Combine(root, "again"), "--no-plots", "--no-progress");
            Assert.True(again.Exit == 0, again.Err);

            // A missing shard is bad input (exit 2) and names what is missing.
            var bad = Run("merge", s1, "--out", Path.Combine(root, "bad"));
            Assert.Equal(2, bad.Exit);
            Assert.Contains("2/2 missing", bad.Err, StringComparison.Ordinal);
        }
        finally
        {
            if (Directory.Exists(root)) Directory.Delete(root, recursive: true);
        }
    }

    [Fact]
    public void Sweep_Shards_Merged_Equal_The_Unsharded_Run_And_Bad_Vary_Is_A_Usage_Mistake()
    {
        string root = TempDir();
        try
        {
            string net = Path.Combine(RepoPaths.Netlists, "trigger-filter-present.json");
            string whole = Path.Combine(root, "whole"), s1 = Path.Combine(root, "s1"), s2 = Path.Combine(root, "s2"), merged = Path.Combine(root, "merged");
            string[] vary = ["--vary", "CF.value=47p,10n", "--no-progress"];
            var a = Run(["sweep", net, .. vary, "--out", whole, "--workers", "1"]);
            Assert.True(a.Exit == 0, a.Err);
            Assert.Contains("1 of 2 points pass", a.Out, StringComparison.Ordinal);
            Assert.True(Run(["sweep", net, .. vary, "--out", s1, "--shard", "1/2"]).Exit == 0);
            Assert.True(Run(["sweep", net, .. vary, "--out", s2, "--shard", "2/2"]).Exit == 0);
            var m = Run("merge", s1, s2, "--out", merged);
            Assert.True(m.Exit == 0, m.Err);
            AssertSameFiles(whole, merged, "sweep.json", "sweep.csv", "sweep.html", "sweep-on-time.svg");
            Studies.StudySchemas.AssertValid("sweep", File.ReadAllBytes(Path.Combine(merged, "sweep.json")));

            var bad = Run("sweep", net, "--vary", "CX.value=1n,2n", "--out", Path.Combine(root, "bad"));
            Assert.Equal(1, bad.Exit);
            Assert.Contains("no part 'CX'", bad.Err, StringComparison.Ordinal);
        }
        finally
        {
            if (Directory.Exists(root)) Directory.Delete(root, recursive: true);
        }
    }

    [Fact]
    public void Sweep_Over_A_Scenario_Number_And_Two_Scenarios_Merges_Like_The_Unsharded_Run()
    {
        string root = TempDir();
        try
        {
            string net = Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.json");
            string sc1 = Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.scenario.json"), sc2 = Path.Combine(RepoPaths.Netlists, "trigger-filter-present.scenario.json");
            string whole = Path.Combine(root, "whole"), s1 = Path.Combine(root, "s1"), s2 = Path.Combine(root, "s2"), merged = Path.Combine(root, "merged");
            string[] args = ["--vary", "scenario.events[0].amplitude=-0.2m,-1m", "--scenario", sc1, "--scenario", sc2, "--no-progress"];
            var a = Run(["sweep", net, .. args, "--out", whole, "--workers", "1"]);
            Assert.True(a.Exit == 0, a.Err);
            Assert.Contains("2 of 4 points pass", a.Out, StringComparison.Ordinal);
            Assert.True(Run(["sweep", net, .. args, "--out", s1, "--shard", "1/2"]).Exit == 0);
            Assert.True(Run(["sweep", net, .. args, "--out", s2, "--shard", "2/2"]).Exit == 0);
            var m = Run("merge", s1, s2, "--out", merged);
            Assert.True(m.Exit == 0, m.Err);
            AssertSameFiles(whole, merged, "sweep.json", "sweep.csv", "sweep.html", "sweep-map.svg");
            Studies.StudySchemas.AssertValid("sweep", File.ReadAllBytes(Path.Combine(merged, "sweep.json")));

            var once = Run("spread", net, "--scenario", sc1, "--scenario", sc2, "--out", Path.Combine(root, "bad"));
            Assert.Equal(1, once.Exit);
        }
        finally
        {
            if (Directory.Exists(root)) Directory.Delete(root, recursive: true);
        }
    }

    [Fact]
    public void Year_Plots_Its_Interesting_Nights_And_Merge_Writes_The_Same_Plots()
    {
        string root = TempDir();
        try
        {
            string net = Path.Combine(RepoPaths.Netlists, "garden-path.json");
            string whole = Path.Combine(root, "whole"), s1 = Path.Combine(root, "s1"), s2 = Path.Combine(root, "s2"), merged = Path.Combine(root, "merged");
            string[] dates = ["--from", "2026-11-18", "--to", "2026-11-25"]; // eight dates: more than a week, so a selection
            var a = Run(["year", net, .. dates, "--out", whole, "--no-progress"]);
            Assert.True(a.Exit == 0, a.Err);
            Assert.True(Run(["year", net, .. dates, "--out", s1, "--no-progress", "--shard", "1/2"]).Exit == 0);
            Assert.True(Run(["year", net, .. dates, "--out", s2, "--no-progress", "--shard", "2/2"]).Exit == 0);
            Assert.Empty(Directory.GetFiles(s1, "night-*")); // a shard writes no plots
            var m = Run("merge", s1, s2, "--out", merged);
            Assert.True(m.Exit == 0, m.Err);
            // The interesting nights by the rule of PlottedNights, each with its night plot; at most five of eight.
            using var doc = System.Text.Json.JsonDocument.Parse(File.ReadAllBytes(Path.Combine(whole, "year.json")));
            List<NightSim.Studies.YearNight> nights = [.. doc.RootElement.GetProperty("nights").EnumerateArray().Select(NightSim.Studies.YearNight.Read)];
            IReadOnlyList<DateOnly> expected = NightSim.Studies.YearStudy.PlottedDates(nights);
            string[] plotted = [.. expected.Select(d => $"night-{d:yyyy-MM-dd}.svg")];
            Assert.InRange(plotted.Length, 1, NightSim.Runs.PlottedNights.MostInteresting);
            Assert.Equal(plotted, Directory.GetFiles(whole, "night-*.svg").Select(Path.GetFileName).Order(StringComparer.Ordinal));
            Assert.Contains(plotted[0]["night-".Length..^".svg".Length], a.Out, StringComparison.Ordinal); // the terminal names the plotted dates
            AssertSameFiles(whole, merged, ["year.json", "year.html", .. plotted]);
        }
        finally
        {
            if (Directory.Exists(root)) Directory.Delete(root, recursive: true);
        }
    }

    [Fact]
    public void Bad_Shard_Is_A_Usage_Mistake()
    {
        var r = Run("spread", Path.Combine(RepoPaths.Netlists, "garden-path.json"), "--shard", "3/2", "--out", TempDir());
        Assert.Equal(1, r.Exit);
        Assert.Contains("--shard", r.Err, StringComparison.Ordinal);
    }
}
