namespace NightSim.Cli;

/// <summary>An output file or folder could not be written (disk full, read-only, no permission, bad path): exit 5.</summary>
internal sealed class OutputException(string path, Exception inner)
    : Exception($"{path}: cannot write: {inner.Message.TrimEnd('.')}", inner)
{
    /// <summary>The file or folder that could not be written.</summary>
    public string Path { get; } = path;

    /// <summary>Runs <paramref name="write"/>, turning an I/O failure into an <see cref="OutputException"/> for <paramref name="path"/>.</summary>
    public static T Guard<T>(string path, Func<T> write)
    {
        try
        {
            return write();
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or NotSupportedException or ArgumentException)
        {
            throw new OutputException(path, ex);
        }
    }

    /// <summary>Runs <paramref name="write"/>, turning an I/O failure into an <see cref="OutputException"/> for <paramref name="path"/>.</summary>
    public static void Guard(string path, Action write) => Guard(path, () => { write(); return 0; });
}
