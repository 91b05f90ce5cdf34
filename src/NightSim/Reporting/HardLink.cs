using System.Runtime.InteropServices;

namespace NightSim.Reporting;

/// <summary>A second name for an existing file (link(2), POSIX.1-2017): the same bytes in two folders without copying them.</summary>
internal static class HardLink
{
    [DllImport("libc", EntryPoint = "link", SetLastError = true)]
    private static extern int Link([MarshalAs(UnmanagedType.LPUTF8Str)] string existing, [MarshalAs(UnmanagedType.LPUTF8Str)] string added);

    /// <summary>Makes <paramref name="added"/> a hard link to <paramref name="existing"/>; false where the system or the
    /// file system cannot (then nothing was made and the caller copies).</summary>
    public static bool TryCreate(string existing, string added)
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS()) return false;
        try
        {
            return Link(existing, added) == 0;
        }
        catch (Exception ex) when (ex is DllNotFoundException or EntryPointNotFoundException)
        {
            return false;
        }
    }
}
