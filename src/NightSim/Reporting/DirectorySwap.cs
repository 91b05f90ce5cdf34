using System.Runtime.InteropServices;

namespace NightSim.Reporting;

/// <summary>
/// Exchanges two directories in one step, so that no reader and no crash ever sees neither or half of either: on Linux
/// renameat2 with RENAME_EXCHANGE (Linux 3.15, man 2 rename), on macOS renamex_np with RENAME_SWAP (macOS 10.12,
/// man 2 rename). False where the system or the file system cannot do it; the caller then takes a slower way.
/// </summary>
internal static class DirectorySwap
{
    private const int CurrentDirectory = -100;  // AT_FDCWD (Linux)
    private const uint Exchange = 2;             // RENAME_EXCHANGE (Linux), RENAME_SWAP (macOS): both 1 << 1

    [DllImport("libc", EntryPoint = "renameat2", SetLastError = true)]
    private static extern int RenameAt2(int oldDirectory, [MarshalAs(UnmanagedType.LPUTF8Str)] string oldPath,
        int newDirectory, [MarshalAs(UnmanagedType.LPUTF8Str)] string newPath, uint flags);

    // For a C library older than glibc 2.28, which has no renameat2 wrapper: the system call itself.
    [DllImport("libc", EntryPoint = "syscall", SetLastError = true)]
    private static extern long SystemCall(long number, long oldDirectory, [MarshalAs(UnmanagedType.LPUTF8Str)] string oldPath,
        long newDirectory, [MarshalAs(UnmanagedType.LPUTF8Str)] string newPath, long flags);

    [DllImport("libc", EntryPoint = "renamex_np", SetLastError = true)]
    private static extern int RenameX([MarshalAs(UnmanagedType.LPUTF8Str)] string from, [MarshalAs(UnmanagedType.LPUTF8Str)] string to, uint flags);

    [ThreadStatic]
    private static bool t_disabled;

    /// <summary>For tests, on the calling thread only: pretend the system cannot exchange, to exercise the other way.</summary>
    internal static bool Disabled
    {
        get => t_disabled;
        set => t_disabled = value;
    }

    /// <summary>Exchanges <paramref name="a"/> and <paramref name="b"/> (both existing directories on one file
    /// system); true when done, false when this system or file system cannot (nothing changed then).</summary>
    public static bool TryExchange(string a, string b)
    {
        if (Disabled) return false;
        try
        {
            if (OperatingSystem.IsLinux())
            {
                try
                {
                    return RenameAt2(CurrentDirectory, a, CurrentDirectory, b, Exchange) == 0;
                }
                catch (EntryPointNotFoundException)
                {
                    // asm-generic/unistd.h and arch/x86/entry/syscalls/syscall_64.tbl: __NR_renameat2.
                    long number = RuntimeInformation.ProcessArchitecture switch
                    {
                        Architecture.X64 => 316,
                        Architecture.Arm64 => 276,
                        _ => -1,
                    };
                    return number > 0 && SystemCall(number, CurrentDirectory, a, CurrentDirectory, b, Exchange) == 0;
                }
            }
            if (OperatingSystem.IsMacOS()) return RenameX(a, b, Exchange) == 0;
        }
        catch (Exception ex) when (ex is DllNotFoundException or EntryPointNotFoundException)
        {
            // No such call here: the caller swaps another way.
        }
        return false;
    }
}
