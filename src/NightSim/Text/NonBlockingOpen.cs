using System.Runtime.InteropServices;
using Microsoft.Win32.SafeHandles;

namespace NightSim.Text;

/// <summary>
/// Opens an input file for reading without waiting: opening a named pipe (FIFO) for reading waits until something
/// opens it for writing, which may be never. On Linux and macOS the file is opened with O_NONBLOCK (POSIX.1-2017,
/// open(): "O_NONBLOCK … an open() for reading-only shall return without delay"), the flag is then cleared, and the
/// caller sees through <see cref="FileStream.CanSeek"/> that it is no regular file. Elsewhere the usual open is used.
/// </summary>
public static class NonBlockingOpen
{
    // fcntl(2) command, the same number on Linux and macOS.
    private const int SetStatusFlags = 4;

    [DllImport("libc", EntryPoint = "open", SetLastError = true)]
    private static extern int Open([MarshalAs(UnmanagedType.LPUTF8Str)] string path, int flags);

    [DllImport("libc", EntryPoint = "fcntl", SetLastError = true)]
    private static extern int Fcntl(int fd, int command, int argument);

    /// <summary>O_RDONLY | O_NONBLOCK | O_CLOEXEC of this system, or null where this class does not know them.</summary>
    private static int? Flags()
    {
        if (OperatingSystem.IsLinux() && RuntimeInformation.ProcessArchitecture is Architecture.X64 or Architecture.Arm64 or Architecture.X86 or Architecture.Arm)
            return 0x800 | 0x80000; // asm-generic/fcntl.h: O_NONBLOCK 00004000, O_CLOEXEC 02000000 (octal)
        if (OperatingSystem.IsMacOS())
            return 0x4 | 0x1000000; // sys/fcntl.h: O_NONBLOCK 0x0004, O_CLOEXEC 0x01000000
        return null;
    }

    /// <summary>Opens <paramref name="path"/> for reading; never waits for a writer. Throws the usual exceptions
    /// (<see cref="FileNotFoundException"/>, <see cref="UnauthorizedAccessException"/>, …) when it cannot be opened.</summary>
    public static FileStream OpenRead(string path)
    {
        // A folder goes the usual way, which refuses it with the usual exception.
        if (Flags() is int flags && !Directory.Exists(path))
        {
            int fd = -1;
            try
            {
                fd = Open(path, flags);
            }
            catch (Exception ex) when (ex is DllNotFoundException or EntryPointNotFoundException)
            {
                fd = -1;
            }
            if (fd >= 0)
            {
                var handle = new SafeFileHandle(fd, ownsHandle: true);
                try
                {
                    // Back to blocking reads for a regular file; a pipe is refused by its caller before any read.
                    if (Fcntl(fd, SetStatusFlags, 0) < 0) throw new IOException($"{path}: cannot read the file");
                    return new FileStream(handle, FileAccess.Read, bufferSize: 1);
                }
                catch
                {
                    handle.Dispose();
                    throw;
                }
            }
            // Could not open: the usual open below fails too and says why (not found, no permission, a folder).
        }
        return new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1, FileOptions.SequentialScan);
    }
}
