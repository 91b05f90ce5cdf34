using System.Diagnostics;
using System.Globalization;
using NightSim.Reporting;

namespace NightSim.Tests.Reporting;

/// <summary>
/// A run's outputs go in place as one set: a new folder is made whole, a folder of NightSim's files is swapped whole, a
/// folder that also holds other files keeps them, a run that never commits leaves nothing, and what killed runs left
/// behind is cleaned up by the next run without touching anything NightSim did not write.
/// </summary>
public sealed class OutputSetTests : IDisposable
{
    private readonly string _root = Path.Combine(Path.GetTempPath(), "nightsim-outset-" + Guid.NewGuid().ToString("N"));

    public OutputSetTests() => Directory.CreateDirectory(_root);

    public void Dispose() => Directory.Delete(_root, recursive: true);

    private string Out => Path.Combine(_root, "out");

    /// <summary>Commits a set of <paramref name="files"/> (name → text) into <paramref name="target"/>.</summary>
    private static OutputSet.CommitResult Write(string target, params (string Name, string Text)[] files)
    {
        using OutputSet set = OutputSet.Begin(target);
        foreach (var (name, text) in files)
        {
            string path = Path.Combine(set.Staging, name);
            Directory.CreateDirectory(Path.GetDirectoryName(path)!);
            File.WriteAllText(path, text);
        }
        return set.Commit();
    }

    private static string[] Names(string dir) => [.. Directory.GetFileSystemEntries(dir).Select(Path.GetFileName).Order(StringComparer.Ordinal)!];

    /// <summary>Nothing beside the output folder but the folder itself.</summary>
    private void AssertNoLeftovers() =>
        Assert.Equal(["out"], Names(_root).Where(n => n != "keep").ToArray());

    /// <summary>A process id no process has (for leftovers of a "killed" run).</summary>
    private static int DeadPid()
    {
        for (int pid = 4_000_000; ; pid--)
        {
            try
            {
                using Process p = Process.GetProcessById(pid);
            }
            catch (ArgumentException)
            {
                return pid;
            }
        }
    }

    [Fact]
    public void A_New_Folder_Is_Made_Whole_With_Its_Manifest()
    {
        OutputSet.CommitResult done = Write(Out, ("report.json", "{}"), ("plots/night-1.svg", "<svg/>"));
        Assert.Equal(OutputSet.CommitMode.Created, done.Mode);
        Assert.Equal([".nightsim-files.json", "plots", "report.json"], Names(Out));
        Assert.Equal(["plots/night-1.svg", "report.json"], OutputManifest.Read(Out)!.Order(StringComparer.Ordinal).ToArray());
        AssertNoLeftovers();
    }

    [Fact]
    public void A_Folder_Of_NightSims_Files_Is_Replaced_Whole_Without_Stale_Plots()
    {
        Write(Out, ("report.json", "old"), ("night-1.svg", "old"), ("night-2.svg", "old"), ("plots/zoom-1.png", "old"));
        OutputSet.CommitResult done = Write(Out, ("report.json", "new"), ("night-1.svg", "new"));
        Assert.Equal(OutputSet.CommitMode.Swapped, done.Mode);
        Assert.Equal([".nightsim-files.json", "night-1.svg", "report.json"], Names(Out));
        Assert.Equal("new", File.ReadAllText(Path.Combine(Out, "report.json")));
        AssertNoLeftovers();
    }

    [Fact]
    public void Without_An_Exchange_Call_The_Set_Is_Renamed_In_Whole()
    {
        Write(Out, ("report.json", "old"), ("night-2.svg", "old"));
        OutputSet.CommitResult done;
        DirectorySwap.Disabled = true;
        try
        {
            done = Write(Out, ("report.json", "new"));
        }
        finally
        {
            DirectorySwap.Disabled = false;
        }
        Assert.Equal(OutputSet.CommitMode.Swapped, done.Mode);
        Assert.Equal([".nightsim-files.json", "report.json"], Names(Out));
        Assert.Equal("new", File.ReadAllText(Path.Combine(Out, "report.json")));
        AssertNoLeftovers();
    }

    [Fact]
    public void The_Users_Own_Files_Stay_And_The_Set_Goes_In_File_By_File()
    {
        Write(Out, ("report.json", "old"), ("night-2.svg", "old"));
        File.WriteAllText(Path.Combine(Out, "notes.txt"), "mine");
        Directory.CreateDirectory(Path.Combine(Out, "photos"));
        File.WriteAllText(Path.Combine(Out, "photos", "board.jpg"), "mine");
        OutputSet.CommitResult done = Write(Out, ("report.json", "new"), ("night-1.svg", "new"));
        Assert.Equal(OutputSet.CommitMode.FileByFile, done.Mode);
        Assert.Equal(["notes.txt", "photos/board.jpg"], done.Foreign);
        Assert.Equal([".nightsim-files.json", "night-1.svg", "notes.txt", "photos", "report.json"], Names(Out));
        Assert.Equal("mine", File.ReadAllText(Path.Combine(Out, "photos", "board.jpg")));
        Assert.Equal(["night-1.svg", "report.json"], OutputManifest.Read(Out)!.Order(StringComparer.Ordinal).ToArray());
        AssertNoLeftovers();
    }

    [Fact]
    public void A_Folder_From_Before_The_Manifest_Loses_Only_The_Names_NightSim_Wrote()
    {
        Directory.CreateDirectory(Out);
        foreach (string f in (string[])["report.json", "report.html", "trace.csv", "zoom-01-lamp-on-dusk.png", ".report.json.4242.tmp", "my-notes.md"])
            File.WriteAllText(Path.Combine(Out, f), "old");
        OutputSet.CommitResult done = Write(Out, ("report.json", "new"), ("trace.csv", "new"));
        Assert.Equal(OutputSet.CommitMode.FileByFile, done.Mode);
        Assert.Equal([".nightsim-files.json", "my-notes.md", "report.json", "trace.csv"], Names(Out));
    }

    [Fact]
    public void A_Run_That_Never_Commits_Leaves_The_Folder_As_It_Was()
    {
        Write(Out, ("report.json", "old"));
        using (OutputSet set = OutputSet.Begin(Out))
        {
            File.WriteAllText(Path.Combine(set.Staging, "report.json"), "half");
        }
        Assert.Equal("old", File.ReadAllText(Path.Combine(Out, "report.json")));
        AssertNoLeftovers();
    }

    [Fact]
    public void Partial_Outputs_Join_The_Complete_Ones_Of_The_Run_Before()
    {
        Write(Out, ("report.json", "complete"), ("trace.csv", "complete"), ("report-partial.json", "older failure"));
        using (OutputSet set = OutputSet.Begin(Out))
        {
            File.WriteAllText(Path.Combine(set.Staging, "trace-partial.csv"), "failure");
            set.CarryOver(name => !name.Contains("-partial.", StringComparison.Ordinal));
            set.Commit();
        }
        Assert.Equal([".nightsim-files.json", "report.json", "trace-partial.csv", "trace.csv"], Names(Out));
        Assert.Equal("complete", File.ReadAllText(Path.Combine(Out, "report.json")));
        // The next complete run removes the partial outputs with the rest of the earlier set.
        Write(Out, ("report.json", "next"));
        Assert.Equal([".nightsim-files.json", "report.json"], Names(Out));
    }

    [Fact]
    public void Leftovers_Of_A_Killed_Run_Are_Removed_By_The_Next_Run_But_Not_The_Users_Files()
    {
        Write(Out, ("report.json", "old"));
        int dead = DeadPid();
        string tag = dead.ToString(CultureInfo.InvariantCulture);
        // A staging folder of a run killed while writing: everything in it is NightSim's.
        string staging = Path.Combine(_root, $".out.nightsim-{tag}-0badf00d");
        Directory.CreateDirectory(staging);
        File.WriteAllText(Path.Combine(staging, OutputSet.StagingMarker), "");
        File.WriteAllText(Path.Combine(staging, ".trace.csv.1234.tmp"), "half");
        // An earlier set swapped out by a run killed before it removed it, with a file someone put there meanwhile.
        string swapped = Path.Combine(_root, $".out.nightsim-{tag}-12345678");
        Directory.CreateDirectory(swapped);
        File.WriteAllText(Path.Combine(swapped, "report.json"), "older");
        OutputManifest.Write(swapped, ["report.json"]);
        File.WriteAllText(Path.Combine(swapped, "not-ours.txt"), "keep me");
        // Another tool's folder that only looks alike, and a folder of a process that is still running.
        string alike = Path.Combine(_root, ".out.nightsim-notes");
        Directory.CreateDirectory(alike);
        string running = Path.Combine(_root, $".out.nightsim-{Environment.ProcessId}-abcdef01");
        Directory.CreateDirectory(running);
        File.WriteAllText(Path.Combine(running, OutputSet.StagingMarker), "");

        Write(Out, ("report.json", "new"));

        Assert.False(Directory.Exists(staging));
        Assert.Equal(["not-ours.txt"], Names(swapped));
        Assert.True(Directory.Exists(alike));
        Assert.True(Directory.Exists(running));
        Assert.Equal("new", File.ReadAllText(Path.Combine(Out, "report.json")));
    }

    [Fact]
    public void A_Set_Renamed_Aside_By_A_Run_Killed_Midway_Is_Put_Back()
    {
        // The two-rename way was killed after the first rename: no output folder, the earlier set beside it.
        string aside = Path.Combine(_root, $".out.nightsim-{DeadPid().ToString(CultureInfo.InvariantCulture)}-00c0ffee.old");
        Directory.CreateDirectory(aside);
        File.WriteAllText(Path.Combine(aside, "report.json"), "old");
        OutputManifest.Write(aside, ["report.json"]);
        using (OutputSet set = OutputSet.Begin(Out))
        {
            Assert.Equal("old", File.ReadAllText(Path.Combine(Out, "report.json")));
        }
        AssertNoLeftovers();
    }

    [Fact]
    public void A_Manifest_Never_Reaches_Outside_Its_Folder()
    {
        Directory.CreateDirectory(Path.Combine(_root, "keep"));
        File.WriteAllText(Path.Combine(_root, "keep", "precious.txt"), "mine");
        Write(Out, ("report.json", "old"));
        OutputManifest.Write(Out, ["report.json", "../keep/precious.txt", "/etc/hostname", "a/../../keep/precious.txt"]);
        Assert.Equal(["report.json"], OutputManifest.Read(Out)!.ToArray());
        Write(Out, ("trace.csv", "new"));
        Assert.Equal("mine", File.ReadAllText(Path.Combine(_root, "keep", "precious.txt")));
        Assert.Equal([".nightsim-files.json", "trace.csv"], Names(Out));
    }

    [Fact]
    public void A_Linked_Output_Folder_Stays_A_Link_To_The_New_Set()
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS()) return; // symbolic links need no rights there
        string real = Path.Combine(_root, "real");
        Write(real, ("report.json", "old"));
        Directory.CreateSymbolicLink(Out, real);
        Write(Out, ("report.json", "new"));
        Assert.NotNull(new DirectoryInfo(Out).LinkTarget);
        Assert.Equal("new", File.ReadAllText(Path.Combine(Out, "report.json")));
        Assert.Equal(["out", "real"], Names(_root));
    }

    [Fact]
    public void A_File_Where_The_Folder_Should_Be_Is_Refused()
    {
        File.WriteAllText(Out, "a file");
        Assert.Throws<IOException>(() => OutputSet.Begin(Out));
    }
}
