using System.Diagnostics;
using System.Globalization;

namespace NightSim.Reporting;

/// <summary>
/// The outputs of one run as one set. The run writes every file into a staging folder beside the output folder
/// (<c>.NAME.nightsim-PID-RANDOM</c>); <see cref="Commit"/> puts the complete set in place in one step, so a reader, a
/// full disk or a kill at any moment sees either the complete earlier set or the complete new one, never a mix and
/// never plots of an earlier run beside a new report. A run that fails or is killed before the commit leaves the
/// output folder as it was.
/// </summary>
/// <remarks>
/// <para>How the set goes in place. A folder that does not exist yet: the staging folder is renamed to it. A folder
/// that holds only files NightSim wrote (its <see cref="OutputManifest"/>; for an older folder, the names NightSim
/// used to write): the two folders are exchanged in one step (<see cref="DirectorySwap"/>), or, where the system
/// cannot, renamed one after the other, the earlier set kept beside as <c>….old</c> until the new one is in place
/// (a kill between the two renames is undone by the next run). A folder that also holds other files (the user's own),
/// or cannot be swapped (a mount point, a folder whose parent is read-only, this process's working folder): the files
/// are replaced one by one, each atomically, and the other files stay; <see cref="CommitResult.Foreign"/> names them
/// so the caller can say the set was not swapped whole.</para>
/// <para>Never deleted: anything NightSim did not write. The earlier set is removed by its manifest, file by file.</para>
/// <para>Left over by a killed run: its staging folder (marked by <see cref="StagingMarker"/>) or a swapped-out earlier
/// set. The next run into the same folder removes them once the process that made them has ended.</para>
/// </remarks>
public sealed class OutputSet : IDisposable
{
    /// <summary>Marks a folder as staging: everything in it was written by the run that made it.</summary>
    public const string StagingMarker = ".nightsim-staging";

    /// <summary>Prefix of a staging folder made inside the output folder (when its parent cannot be written).</summary>
    public const string InsidePrefix = ".nightsim-staging-";

    private bool _done;

    private OutputSet(string target, string staging, bool inside)
    {
        Target = target;
        Staging = staging;
        Inside = inside;
    }

    /// <summary>The output folder (full path; a symbolic link to a folder is followed).</summary>
    public string Target { get; }

    /// <summary>Where the run writes its files until <see cref="Commit"/>.</summary>
    public string Staging { get; }

    /// <summary>True when the staging folder is inside <see cref="Target"/> (its parent cannot be written): the commit
    /// then replaces files one by one.</summary>
    public bool Inside { get; }

    /// <summary>How a commit put the set in place.</summary>
    public enum CommitMode
    {
        /// <summary>The output folder did not exist: the staging folder became it.</summary>
        Created,
        /// <summary>The earlier set and the new one were swapped whole.</summary>
        Swapped,
        /// <summary>The folder also holds files NightSim did not write: NightSim's files were replaced one by one.</summary>
        FileByFile,
    }

    /// <summary>What a commit did.</summary>
    /// <param name="Mode">How the set went in place.</param>
    /// <param name="Files">The files of the new set (relative, '/'-separated).</param>
    /// <param name="Foreign">Entries of the folder NightSim did not write (left alone); empty unless <see cref="CommitMode.FileByFile"/>.</param>
    /// <param name="Warning">A leftover that could not be removed, or null.</param>
    public sealed record CommitResult(CommitMode Mode, IReadOnlyList<string> Files, IReadOnlyList<string> Foreign, string? Warning);

    /// <summary>Starts a set for <paramref name="target"/>: removes what killed runs left there, then makes the staging
    /// folder. Throws <see cref="IOException"/> or <see cref="UnauthorizedAccessException"/> when it cannot.</summary>
    public static OutputSet Begin(string target)
    {
        string full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(target));
        if (File.Exists(full) && !Directory.Exists(full)) throw new IOException("it is a file, not a folder");
        if (Directory.Exists(full) && new DirectoryInfo(full).LinkTarget is not null)
            full = Path.TrimEndingDirectorySeparator(Directory.ResolveLinkTarget(full, returnFinalTarget: true)?.FullName ?? full);
        string? parent = Path.GetDirectoryName(full);
        string name = Path.GetFileName(full);
        if (parent is null || name.Length == 0)
        {
            // The root of a file system has no parent to stage beside.
            return BeginInside(full);
        }
        Directory.CreateDirectory(parent);
        CleanLeftovers(parent, name, full);
        string staging = Path.Combine(parent, SiblingPrefix(name) + Tag());
        try
        {
            Directory.CreateDirectory(staging);
            File.WriteAllBytes(Path.Combine(staging, StagingMarker), []);
            return new OutputSet(full, staging, inside: false);
        }
        catch (Exception ex) when ((ex is IOException or UnauthorizedAccessException) && Directory.Exists(full))
        {
            TryDelete(staging);
            return BeginInside(full);
        }
    }

    private static OutputSet BeginInside(string full)
    {
        Directory.CreateDirectory(full);
        string staging = Path.Combine(full, InsidePrefix + Tag());
        Directory.CreateDirectory(staging);
        File.WriteAllBytes(Path.Combine(staging, StagingMarker), []);
        return new OutputSet(full, staging, inside: true);
    }

    /// <summary>"PID-RANDOM": names the process that made a folder (see <see cref="OwnerAlive"/>).</summary>
    private static string Tag() =>
        Environment.ProcessId.ToString(CultureInfo.InvariantCulture) + "-" + Convert.ToHexStringLower(Guid.NewGuid().ToByteArray().AsSpan(0, 4));

    /// <summary>".NAME.nightsim-" with the name cut so that the whole stays a valid file name.</summary>
    private static string SiblingPrefix(string name) => "." + (name.Length > 100 ? name[..100] : name) + ".nightsim-";

    /// <summary>Keeps the earlier set's files for which <paramref name="keep"/> is true (relative names) in the new set,
    /// unless the run wrote a file of that name: a failed run adds its partial outputs beside the complete ones of the
    /// run before. Hard links where the file system has them, else copies.</summary>
    public void CarryOver(Func<string, bool> keep)
    {
        if (Inside || !Directory.Exists(Target)) return;
        Ownership own = Ownership.Of(Target);
        foreach (string f in own.Files)
        {
            if (!keep(f)) continue;
            string to = Local(Staging, f);
            if (File.Exists(to)) continue;
            Directory.CreateDirectory(Path.GetDirectoryName(to)!);
            if (!HardLink.TryCreate(Local(Target, f), to)) File.Copy(Local(Target, f), to);
        }
    }

    /// <summary>Puts the complete set in place (see the remarks). Throws an I/O exception when it cannot; the output
    /// folder then holds the earlier set (or, for <see cref="CommitMode.FileByFile"/>, as much as was replaced, each file whole).</summary>
    public CommitResult Commit()
    {
        if (_done) throw new InvalidOperationException("this output set was already committed");
        List<string> files = ListFiles(Staging);
        OutputManifest.Write(Staging, files);
        if (!Inside)
        {
            if (!Directory.Exists(Target))
            {
                try
                {
                    Directory.Move(Staging, Target);
                    _done = true;
                    TryDeleteFile(Path.Combine(Target, StagingMarker));
                    return new CommitResult(CommitMode.Created, files, [], null);
                }
                catch (IOException) when (Directory.Exists(Target))
                {
                    // Made meanwhile by someone else: go on as for a folder that was there.
                }
            }
            Ownership own = Ownership.Of(Target);
            // Swapping the folder this process works in would leave it in the removed earlier folder.
            if (own.Foreign.Count == 0 && !HoldsWorkingDirectory(Target))
            {
                // A marker left by a run killed just after its swap: the earlier set must not look like staging.
                TryDeleteFile(Path.Combine(Target, StagingMarker));
                if (DirectorySwap.TryExchange(Staging, Target))
                {
                    _done = true;
                    TryDeleteFile(Path.Combine(Target, StagingMarker));
                    return new CommitResult(CommitMode.Swapped, files, [], Retire(Staging));
                }
                string old = Staging + ".old";
                if (TwoStep(old)) return new CommitResult(CommitMode.Swapped, files, [], Retire(old));
            }
            return FileByFile(files, Ownership.Of(Target));
        }
        return FileByFile(files, Ownership.Of(Target));
    }

    private static bool HoldsWorkingDirectory(string folder)
    {
        string cwd = Path.TrimEndingDirectorySeparator(Directory.GetCurrentDirectory());
        return cwd == folder || cwd.StartsWith(folder + Path.DirectorySeparatorChar, StringComparison.Ordinal);
    }

    /// <summary>Rename the earlier set aside, then the new one in; undo the first rename when the second fails.</summary>
    private bool TwoStep(string old)
    {
        try
        {
            Directory.Move(Target, old);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return false;
        }
        try
        {
            Directory.Move(Staging, Target);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            Directory.Move(old, Target);
            return false;
        }
        _done = true;
        TryDeleteFile(Path.Combine(Target, StagingMarker));
        return true;
    }

    /// <summary>Replaces NightSim's files in a folder that also holds other files, each file atomically. The manifest
    /// lists the union while files move, so a kill midway leaves nothing of NightSim's unlisted.</summary>
    private CommitResult FileByFile(List<string> files, Ownership own)
    {
        var incoming = new HashSet<string>(files, StringComparer.Ordinal);
        OutputManifest.Write(Target, own.Files.Union(files, StringComparer.Ordinal));
        foreach (string f in own.Files.Where(f => !incoming.Contains(f))) DeleteWithEmptyParents(Target, f);
        foreach (string f in own.Temporary) DeleteWithEmptyParents(Target, f);
        // The reports last: whoever reads them finds the files they point to.
        foreach (string f in files.OrderBy(f => f.StartsWith("report", StringComparison.Ordinal) ? 1 : 0).ThenBy(f => f, StringComparer.Ordinal))
        {
            string to = Local(Target, f);
            Directory.CreateDirectory(Path.GetDirectoryName(to)!);
            // Through a temporary name in the target folder: a move from another file system copies, and the copy
            // must not be seen half-written under the real name.
            string temp = Path.Combine(Path.GetDirectoryName(to)!, "." + Path.GetFileName(to) + "." + Environment.ProcessId.ToString(CultureInfo.InvariantCulture) + ".tmp");
            File.Move(Local(Staging, f), temp, overwrite: true);
            File.Move(temp, to, overwrite: true);
        }
        OutputManifest.Write(Target, files);
        _done = true;
        TryDelete(Staging);
        return new CommitResult(CommitMode.FileByFile, files, own.Foreign, null);
    }

    /// <summary>Removes a swapped-out earlier set by its manifest. Anything else found in it (a file the user put into
    /// the folder at the very moment of the swap) is moved back into the output folder. Null, or what was left.</summary>
    private string? Retire(string old)
    {
        try
        {
            Ownership own = Ownership.Of(old);
            foreach (string f in own.Files.Concat(own.Temporary)) DeleteWithEmptyParents(old, f);
            TryDeleteFile(Path.Combine(old, OutputManifest.FileName));
            foreach (string f in own.Foreign.Where(f => !f.Contains('/')))
            {
                string from = Path.Combine(old, f), to = Path.Combine(Target, f);
                if (File.Exists(to) || Directory.Exists(to)) continue;
                if (Directory.Exists(from)) Directory.Move(from, to); else File.Move(from, to);
            }
            if (!Directory.EnumerateFileSystemEntries(old).Any())
            {
                Directory.Delete(old);
                return null;
            }
            return $"{old} holds files NightSim did not write; it was left in place";
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return $"{old}: could not remove the earlier outputs ({ex.Message.TrimEnd('.')}); the next run into {Target} removes them";
        }
    }

    /// <summary>Discards the staging folder unless the set was committed.</summary>
    public void Dispose()
    {
        if (_done) return;
        _done = true;
        TryDelete(Staging);
    }

    /// <summary>Removes what runs into <paramref name="full"/> left beside it (or inside it) when they were killed:
    /// staging folders, and earlier sets swapped out but not yet removed. A set renamed aside by a run killed before it
    /// renamed the new one in is put back first.</summary>
    private static void CleanLeftovers(string parent, string name, string full)
    {
        string prefix = SiblingPrefix(name);
        IEnumerable<string> candidates;
        try
        {
            candidates = Directory.EnumerateDirectories(parent).Where(d => Path.GetFileName(d).StartsWith(prefix, StringComparison.Ordinal)).ToList();
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return;
        }
        foreach (string dir in candidates)
        {
            string rest = Path.GetFileName(dir)[prefix.Length..];
            bool old = rest.EndsWith(".old", StringComparison.Ordinal);
            if (!TryOwner(old ? rest[..^4] : rest, out int pid) || OwnerAlive(pid, dir)) continue;
            try
            {
                if (old && !Directory.Exists(full)) Directory.Move(dir, full);
                else RemoveLeftover(dir);
            }
            catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
            {
                // Tried again by the next run.
            }
        }
        if (!Directory.Exists(full)) return;
        try
        {
            foreach (string dir in Directory.EnumerateDirectories(full, InsidePrefix + "*").ToList())
            {
                if (TryOwner(Path.GetFileName(dir)[InsidePrefix.Length..], out int pid) && !OwnerAlive(pid, dir)) RemoveLeftover(dir);
            }
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // Tried again by the next run.
        }
    }

    private static void RemoveLeftover(string dir)
    {
        if (File.Exists(Path.Combine(dir, StagingMarker)))
        {
            Directory.Delete(dir, recursive: true);
            return;
        }
        Ownership own = Ownership.Of(dir);
        foreach (string f in own.Files.Concat(own.Temporary)) DeleteWithEmptyParents(dir, f);
        TryDeleteFile(Path.Combine(dir, OutputManifest.FileName));
        if (!Directory.EnumerateFileSystemEntries(dir).Any()) Directory.Delete(dir);
    }

    private static bool TryOwner(string tag, out int pid)
    {
        int dash = tag.IndexOf('-', StringComparison.Ordinal);
        pid = 0;
        return dash > 0 && int.TryParse(tag.AsSpan(0, dash), NumberStyles.None, CultureInfo.InvariantCulture, out pid);
    }

    /// <summary>True while the process that made <paramref name="dir"/> may still be running: a process of that id that
    /// started before the folder was made. This process counts as running (another set of it may be in progress).</summary>
    private static bool OwnerAlive(int pid, string dir)
    {
        if (pid == Environment.ProcessId) return true;
        try
        {
            using Process p = Process.GetProcessById(pid);
            if (p.HasExited) return false;
            DateTime made = Directory.GetCreationTimeUtc(dir);
            DateTime written = Directory.GetLastWriteTimeUtc(dir);
            if (written < made) made = written;
            return p.StartTime.ToUniversalTime() <= made.AddSeconds(2);
        }
        catch (ArgumentException)
        {
            return false; // no such process
        }
        catch (Exception ex) when (ex is InvalidOperationException or System.ComponentModel.Win32Exception or NotSupportedException)
        {
            return true; // cannot tell: leave it
        }
    }

    /// <summary>Every file under <paramref name="root"/> (relative, '/'-separated), without the marker and the manifest.</summary>
    private static List<string> ListFiles(string root)
    {
        var files = new List<string>();
        foreach (string f in Directory.EnumerateFiles(root, "*", new EnumerationOptions { RecurseSubdirectories = true, AttributesToSkip = 0 }))
        {
            string rel = Path.GetRelativePath(root, f).Replace(Path.DirectorySeparatorChar, '/');
            if (rel is StagingMarker or OutputManifest.FileName) continue;
            files.Add(rel);
        }
        files.Sort(StringComparer.Ordinal);
        return files;
    }

    private static string Local(string root, string relative) => Path.Combine(root, relative.Replace('/', Path.DirectorySeparatorChar));

    /// <summary>Deletes one file and then its parent folders up to <paramref name="root"/> while they are empty.</summary>
    private static void DeleteWithEmptyParents(string root, string relative)
    {
        string path = Local(root, relative);
        if (File.Exists(path) || new FileInfo(path).LinkTarget is not null) File.Delete(path);
        string? dir = Path.GetDirectoryName(path);
        string top = Path.TrimEndingDirectorySeparator(root);
        while (dir is not null && dir.Length > top.Length && Directory.Exists(dir) && !Directory.EnumerateFileSystemEntries(dir).Any())
        {
            Directory.Delete(dir);
            dir = Path.GetDirectoryName(dir);
        }
    }

    private static void TryDelete(string dir)
    {
        try
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // Named as NightSim's: the next run removes it.
        }
    }

    private static void TryDeleteFile(string path)
    {
        try
        {
            File.Delete(path);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            // Harmless where it is; removed with the folder's next set.
        }
    }

    /// <summary>Which entries of a folder NightSim wrote: the files its manifest lists (or, without one, the names
    /// earlier versions wrote), temporary files of those, and everything else.</summary>
    private sealed record Ownership(List<string> Files, List<string> Temporary, List<string> Foreign)
    {
        public static Ownership Of(string folder)
        {
            IReadOnlySet<string>? listed = OutputManifest.Read(folder);
            var own = new Ownership([], [], []);
            Walk(folder, "", listed, own);
            return own;
        }

        private static void Walk(string dir, string prefix, IReadOnlySet<string>? listed, Ownership own)
        {
            foreach (string entry in Directory.EnumerateFileSystemEntries(dir).Order(StringComparer.Ordinal))
            {
                string name = Path.GetFileName(entry);
                string rel = prefix + name;
                var info = new FileInfo(entry);
                bool isLink = info.LinkTarget is not null;
                if (!isLink && Directory.Exists(entry))
                {
                    // NightSim's own staging folder inside the output folder is not part of any set.
                    if (prefix.Length == 0 && name.StartsWith(InsidePrefix, StringComparison.Ordinal)) continue;
                    int before = own.Files.Count + own.Temporary.Count + own.Foreign.Count;
                    Walk(entry, rel + "/", listed, own);
                    bool empty = own.Files.Count + own.Temporary.Count + own.Foreign.Count == before;
                    if (empty && !(listed?.Any(f => f.StartsWith(rel + "/", StringComparison.Ordinal)) ?? false)) own.Foreign.Add(rel + "/");
                    continue;
                }
                if (prefix.Length == 0 && name is OutputManifest.FileName or StagingMarker) continue;
                if (listed is not null ? listed.Contains(rel) : OutputManifest.IsEarlierOutput(rel) && OutputManifest.TemporaryOf(rel) is null)
                    own.Files.Add(rel);
                else if (OutputManifest.TemporaryOf(rel) is { } of && (listed?.Contains(of) ?? OutputManifest.IsEarlierOutput(of)))
                    own.Temporary.Add(rel);
                else
                    own.Foreign.Add(rel);
            }
        }
    }
}
