namespace NightSim.Reporting;

/// <summary>
/// Writes output files so that a reader never sees half a file: write a temporary file beside the target, then
/// rename it over the target (a rename within one directory is atomic on POSIX file systems).
/// </summary>
public static class AtomicFile
{
    /// <summary>Write through <paramref name="write"/> into a temporary file and move it to <paramref name="path"/>.
    /// On any exception the temporary file is deleted and the target is left as it was.</summary>
    public static void Write(string path, Action<Stream> write)
    {
        string full = Path.GetFullPath(path);
        string dir = Path.GetDirectoryName(full)!;
        Directory.CreateDirectory(dir);
        string temp = Path.Combine(dir, "." + Path.GetFileName(full) + "." + Environment.ProcessId + ".tmp");
        try
        {
            using (var stream = new FileStream(temp, FileMode.Create, FileAccess.Write, FileShare.None))
            {
                write(stream);
            }
            File.Move(temp, full, overwrite: true);
        }
        catch
        {
            try { File.Delete(temp); } catch (IOException) { }
            throw;
        }
    }

    /// <summary>Write text (UTF-8, no BOM) atomically.</summary>
    public static void WriteText(string path, string text) =>
        Write(path, s =>
        {
            byte[] bytes = new System.Text.UTF8Encoding(false).GetBytes(text);
            s.Write(bytes, 0, bytes.Length);
        });
}
