using System.Buffers;
using System.Globalization;
using System.Text;
using System.Text.Unicode;

namespace NightSim.Text;

/// <summary>
/// Checks that a file's bytes are UTF-8 text before it is parsed as JSON, so a binary file, a file saved in a legacy
/// 8-bit or UTF-16 encoding, or a file read cut short gives a located message (byte offset, line:column) and a hint.
/// </summary>
public static class Utf8Check
{
    /// <summary>What is wrong and where.</summary>
    public sealed record Finding(long ByteOffset, int Line, int Column, string Message, string Hint);

    /// <summary>Null when <paramref name="bytes"/> are UTF-8 text (a leading byte-order mark allowed), else the first problem.</summary>
    public static Finding? Problem(ReadOnlySpan<byte> bytes)
    {
        var inv = CultureInfo.InvariantCulture;
        if (bytes.Length >= 2 && ((bytes[0] == 0xFF && bytes[1] == 0xFE) || (bytes[0] == 0xFE && bytes[1] == 0xFF)))
            return new Finding(0, 1, 1, "the file is UTF-16 text, not UTF-8", "save it as UTF-8 (\"UTF-8\" in the editor's save dialogue)");
        int nul = bytes.IndexOf((byte)0);
        int start = bytes.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]) ? 3 : 0;
        int bad = -1;
        ReadOnlySpan<byte> rest = bytes[start..];
        Span<char> sink = stackalloc char[256];
        int done = 0;
        while (done < rest.Length)
        {
            OperationStatus status = Utf8.ToUtf16(rest[done..], sink, out int read, out _, replaceInvalidSequences: false, isFinalBlock: true);
            done += read;
            if (status == OperationStatus.Done) break;
            if (status == OperationStatus.DestinationTooSmall) continue;
            bad = start + done;
            break;
        }
        if (nul >= 0 && (bad < 0 || nul <= bad))
        {
            (int l, int c) = new Utf8Positions(bytes).At(nul);
            return new Finding(nul, l, c, string.Create(inv, $"the file holds a NUL byte at byte offset {nul}: it looks like a binary file, not JSON text"),
                "give the JSON file itself (check the path), and save it as plain UTF-8 text");
        }
        if (bad < 0) return null;
        (int line, int column) = new Utf8Positions(bytes).At(bad);
        bool atEnd = bytes.Length - bad < 4 && IsLeadByte(bytes[bad]);
        return new Finding(bad, line, column,
            string.Create(inv, $"the file is not valid UTF-8: byte 0x{bytes[bad]:X2} at byte offset {bad}{(atEnd ? " starts a character that the file ends in the middle of" : "")}"),
            atEnd ? "the file looks cut short; copy or save it again"
                  : "save the file as UTF-8; an 8-bit encoding such as Latin-1 writes µ, Ω or ° as a single byte");
    }

    private static bool IsLeadByte(byte b) => b >= 0xC2 && b <= 0xF4;

    /// <summary>Reads at most <paramref name="limit"/> bytes of <paramref name="path"/>; null with a reason when the file
    /// is larger, or is no regular file: a named pipe (refused at once, without waiting for a writer), a socket, a
    /// terminal or a device such as /dev/zero that gives bytes without end.</summary>
    public static byte[]? ReadBounded(string path, long limit, out string? problem)
    {
        problem = null;
        using FileStream fs = NonBlockingOpen.OpenRead(path);
        if (!fs.CanSeek)
        {
            problem = "is not a regular file (a named pipe, socket or terminal)";
            return null;
        }
        long size = fs.Length;
        if (size > limit)
        {
            problem = TooLarge(limit);
            return null;
        }
        var buffer = new MemoryStream((int)Math.Min(size + 1, limit + 1));
        byte[] chunk = new byte[81920];
        int n;
        while ((n = fs.Read(chunk, 0, chunk.Length)) > 0)
        {
            buffer.Write(chunk, 0, n);
            // A device such as /dev/zero reports no size and gives bytes without end.
            if (size == 0)
            {
                problem = "is not a regular file (a device)";
                return null;
            }
            if (buffer.Length > limit)
            {
                problem = TooLarge(limit);
                return null;
            }
        }
        return buffer.ToArray();
    }

    /// <summary>The whole of <paramref name="path"/> through <see cref="ReadBounded"/>; an <see cref="IOException"/>
    /// naming the file and the reason when it is no regular file or is larger than <paramref name="limit"/>.</summary>
    public static byte[] ReadAllBounded(string path, long limit) =>
        ReadBounded(path, limit, out string? problem) ?? throw new IOException($"{path}: the file {problem}");

    private static string TooLarge(long limit) =>
        string.Create(CultureInfo.InvariantCulture, $"is larger than the limit of {limit / (1024 * 1024)} MB of input");

    /// <summary>The UTF-8 text of <paramref name="bytes"/> without a leading byte-order mark.</summary>
    public static string Decode(byte[] bytes)
    {
        int start = bytes.AsSpan().StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]) ? 3 : 0;
        return Encoding.UTF8.GetString(bytes, start, bytes.Length - start);
    }
}
