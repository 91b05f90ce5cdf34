using System.CommandLine;
using System.Text.Json;
using NightSim.Cli;
using NightSim.Netlist;

namespace NightSim.Tests.Studies;

/// <summary>`nightsim tune` end to end on a small search: files, schema, the winning netlist, shards and merge, mistakes.</summary>
public sealed class TuneCommandTests
{
    private static (int Exit, string Out, string Err) Run(params string[] args) => Cli.CliRun.Invoke(args);

    [Fact]
    public void Tune_Writes_Every_Candidate_The_Winner_And_Merged_Shards_Equal_The_Whole()
    {
        string root = Path.Combine(Path.GetTempPath(), "nightsim-tune-" + Guid.NewGuid().ToString("N"));
        try
        {
            string net = Path.Combine(RepoPaths.Netlists, "garden-path-film-timer.json");
            string[] common = [net, "--vary", "RTIM.value=E12:82M..180M", "--vary", "CTIM.value=100u", "--nights", "2026-11-20", "--confirm", "2", "--no-progress"];
            string whole = Path.Combine(root, "whole");
            var a = Run(["tune", .. common, "--out", whole, "--workers", "2"]);
            Assert.True(a.Exit == 0, a.Err);
            Assert.Contains("closed forms judged 5 combinations", a.Out, StringComparison.Ordinal);
            byte[] json = File.ReadAllBytes(Path.Combine(whole, "tune.json"));
            StudySchemas.AssertValid("tune", json);
            using JsonDocument doc = JsonDocument.Parse(json);
            Assert.Equal(5, doc.RootElement.GetProperty("candidates").GetArrayLength());
            Assert.True(doc.RootElement.GetProperty("met").GetBoolean());
            // The winner is a new file beside the results, never the input, and loads as a netlist with the chosen value.
            string winner = Path.Combine(whole, "garden-path-film-timer-tuned.json");
            NetlistDefinition tuned = NetlistLoader.Load(winner);
            double chosen = doc.RootElement.GetProperty("best").GetProperty("values").GetProperty("RTIM.value").GetDouble();
            Assert.Equal(chosen, tuned.Part("RTIM")!.Parameters.Number("value"));
            // ln 3·R·100 µF nearest 4 h among 82…180 MΩ (E12): 120 MΩ gives 3.66 h, 150 MΩ 4.58 h; only 120 MΩ is within
            // 3.6–4.4 h at nominal (555 one-shot t = 1.1·R·C, P. Horowitz and W. Hill, The Art of Electronics, 3rd ed., ch. 7).
            Assert.Equal(120e6, chosen, 1.0);
            string page = File.ReadAllText(Path.Combine(whole, "tune.html"));
            System.Xml.Linq.XDocument.Parse(page.Replace("<!DOCTYPE html>", "", StringComparison.Ordinal));
            Assert.Contains("<svg", page, StringComparison.Ordinal);

            string s1 = Path.Combine(root, "s1"), s2 = Path.Combine(root, "s2"), merged = Path.Combine(root, "merged");
            Assert.Equal(0, Run(["tune", .. common, "--out", s1, "--shard", "1/2"]).Exit);
            Assert.Equal(0, Run(["tune", .. common, "--out", s2, "--shard", "2/2"]).Exit);
            var m = Run("merge", s1, s2, "--out", merged);
            Assert.True(m.Exit == 0, m.Err);
            Assert.True(json.AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(merged, "tune.json"))), "merged tune.json differs");
        }
        finally
        {
            if (Directory.Exists(root)) Directory.Delete(root, recursive: true);
        }
    }

    [Fact]
    public void Mistakes_Exit_With_Usage_Or_Input_Codes_And_Write_Nothing()
    {
        string root = Path.Combine(Path.GetTempPath(), "nightsim-tune-bad-" + Guid.NewGuid().ToString("N"));
        string net = Path.Combine(RepoPaths.Netlists, "garden-path-film-timer.json");
        var noPart = Run("tune", net, "--vary", "RX.value=E12", "--out", root);
        Assert.Equal(1, noPart.Exit);
        Assert.Contains("no part 'RX'", noPart.Err, StringComparison.Ordinal);
        var badNights = Run("tune", net, "--vary", "RTIM.value=E12", "--nights", "midsummer", "--out", root);
        Assert.Equal(1, badNights.Exit);
        Assert.Contains("--nights", badNights.Err, StringComparison.Ordinal);
        // A scenario without targets is bad input, named by its file and JSON path.
        var noTargets = Run("tune", Path.Combine(RepoPaths.Netlists, "trigger-filter-present.json"), "--vary", "CF.value=E6", "--out", root);
        Assert.Equal(2, noTargets.Exit);
        Assert.Contains("trigger-filter-present.scenario.json: error at $.targets", noTargets.Err, StringComparison.Ordinal);
        Assert.False(Directory.Exists(root) && Directory.EnumerateFiles(root).Any());
    }
}
