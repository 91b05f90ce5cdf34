namespace NightSim.Text;

/// <summary>
/// Byte offset in a UTF-8 text → 1-based line and column (columns count characters, not bytes). Line starts are
/// found once; a column is counted from the previous answer when the offsets come in increasing order on the same
/// line (a reader walking the tokens), else from the start of the line, so a whole file costs time linear in its
/// length even when it is all on one line.
/// </summary>
public sealed class Utf8Positions
{
    private readonly byte[] _text;
    private readonly int[] _lineStarts;
    private int _lastOffset;
    private int _lastLine;
    private int _lastColumn = 1;

    /// <summary>Indexes <paramref name="utf8"/> (copied).</summary>
    public Utf8Positions(ReadOnlySpan<byte> utf8)
    {
        _text = utf8.ToArray();
        var starts = new List<int> { 0 };
        for (int i = 0; i < utf8.Length; i++)
        {
            if (utf8[i] == (byte)'\n') starts.Add(i + 1);
        }
        _lineStarts = [.. starts];
    }

    /// <summary>Bytes examined to count columns so far (a work counter for tests: linear, not quadratic).</summary>
    public long BytesScanned { get; private set; }

    /// <summary>Line and column of the character starting at byte <paramref name="offset"/>.</summary>
    public (int Line, int Column) At(long offset)
    {
        int off = (int)Math.Clamp(offset, 0, _text.Length);
        int index = Array.BinarySearch(_lineStarts, off);
        int line = index >= 0 ? index : ~index - 1;
        int from, column;
        if (line == _lastLine && off >= _lastOffset)
        {
            from = _lastOffset;
            column = _lastColumn;
        }
        else
        {
            from = _lineStarts[line];
            column = 1;
        }
        for (int i = from; i < off; i++)
        {
            if ((_text[i] & 0xC0) != 0x80) column++;
        }
        BytesScanned += off - from;
        _lastOffset = off;
        _lastLine = line;
        _lastColumn = column;
        return (line + 1, column);
    }
}
