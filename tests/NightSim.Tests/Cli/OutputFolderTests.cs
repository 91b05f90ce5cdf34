using System.CommandLine;
using NightSim.Cli;
using NightSim.Reporting;

namespace NightSim.Tests.Cli;

/// <summary>`simulate` replaces the outputs of the run before as one set: nothing of an earlier run stays beside a new
/// report, the user's own files stay, and nothing temporary is left beside the folder.</summary>
public sealed class OutputFolderTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "nightsim-outfolder-" + Guid.NewGuid().ToString("N"));

    public OutputFolderTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static (int Exit, string Out, string Err) Run(params string[] args) => CliRun.Invoke(args);

    private static string[] Names(string dir) => [.. Directory.GetFileSystemEntries(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal)!];

    private string Garden => Path.Combine(RepoPaths.Netlists, "garden-path.json");

    [Fact]
    public void A_Run_Without_Plots_Leaves_No_Plots_Of_The_Run_Before()
    {
        string outDir = Path.Combine(_dir, "out");
        (int exit, _, string err) = Run("simulate", Garden, "--out", outDir, "--no-progress");
        Assert.True(exit == 0, err);
        Assert.NotEmpty(Directory.GetFiles(outDir, "*.svg"));

        (exit, _, err) = Run("simulate", Garden, "--out", outDir, "--no-progress", "--no-plots");
        Assert.True(exit == 0, err);
        Assert.Equal([OutputManifest.FileName, "report.html", "report.json", "trace.csv"], Names(outDir));
        Assert.Equal(["out"], Names(_dir));

        // A plain transient into the same folder replaces the night run's set with its own two files.
        (exit, _, err) = Run("simulate", Path.Combine(RepoPaths.Netlists, "rc-step.json"), "--for", "0.2s", "--out", outDir);
        Assert.True(exit == 0, err);
        Assert.Equal([OutputManifest.FileName, "statistics.json", "trace.csv"], Names(outDir));
        Assert.Equal(["out"], Names(_dir));
    }

    [Fact]
    public void The_Users_Own_Files_In_The_Folder_Stay_And_A_Note_Says_Why_The_Set_Went_In_File_By_File()
    {
        string outDir = Path.Combine(_dir, "project");
        Directory.CreateDirectory(outDir);
        File.WriteAllText(Path.Combine(outDir, "notes.txt"), "my notes");
        (int exit, _, string err) = Run("simulate", Path.Combine(RepoPaths.Netlists, "rc-step.json"), "--for", "0.2s", "--out", outDir);
        Assert.True(exit == 0, err);
        (exit, _, err) = Run("simulate", Path.Combine(RepoPaths.Netlists, "rc-step.json"), "--for", "0.3s", "--out", outDir);
        Assert.True(exit == 0, err);
        Assert.Contains($"note: {outDir} also holds files NightSim did not write (notes.txt)", err, StringComparison.Ordinal);
        Assert.Equal("my notes", File.ReadAllText(Path.Combine(outDir, "notes.txt")));
        Assert.Equal([OutputManifest.FileName, "notes.txt", "statistics.json", "trace.csv"], Names(outDir));
        Assert.Equal(["project"], Names(_dir));
    }

    [Fact]
    public void A_Run_That_Fails_With_Bad_Input_Leaves_The_Earlier_Set_And_Nothing_Beside_It()
    {
        string outDir = Path.Combine(_dir, "out");
        (int exit, _, string err) = Run("simulate", Path.Combine(RepoPaths.Netlists, "rc-step.json"), "--for", "0.2s", "--out", outDir);
        Assert.True(exit == 0, err);
        byte[] before = File.ReadAllBytes(Path.Combine(outDir, "trace.csv"));
        // The scenario names a node the netlist lacks: found after the output set was begun.
        string scenario = File.ReadAllText(Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.scenario.json"))
            .Replace("\"node\": \"trig\"", "\"node\": \"nowhere\"", StringComparison.Ordinal);
        string scenarioPath = Path.Combine(_dir, "noise.scenario.json");
        File.WriteAllText(scenarioPath, scenario);
        (exit, _, _) = Run("simulate", Path.Combine(RepoPaths.Netlists, "trigger-filter-absent.json"), "--scenario", scenarioPath, "--out", outDir, "--no-progress", "--no-plots");
        Assert.Equal(2, exit);
        Assert.Equal(before, File.ReadAllBytes(Path.Combine(outDir, "trace.csv")));
        Assert.Equal([OutputManifest.FileName, "statistics.json", "trace.csv"], Names(outDir));
        Assert.Equal(["noise.scenario.json", "out"], Names(_dir));
    }
}
