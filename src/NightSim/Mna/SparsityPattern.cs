namespace NightSim.Mna;

/// <summary>
/// The fixed set of matrix positions (row, column) a circuit ever touches, numbered as slots 0…Count−1.
/// Built once during device setup; a slot's value array is what devices stamp into.
/// </summary>
public sealed class SparsityPattern
{
    private readonly Dictionary<long, int> _slotOf = [];
    private readonly List<int> _rows = [];
    private readonly List<int> _cols = [];

    /// <summary>Number of unknowns (matrix order); grows while unknowns are reserved.</summary>
    public int Size { get; internal set; }

    /// <summary>Number of slots.</summary>
    public int Count => _rows.Count;

    /// <summary>Row of each slot.</summary>
    public IReadOnlyList<int> Rows => _rows;

    /// <summary>Column of each slot.</summary>
    public IReadOnlyList<int> Cols => _cols;

    /// <summary>The slot of (row, col), reserving it when new; -1 if either index is ground (-1).</summary>
    public int Reserve(int row, int col)
    {
        if (row < 0 || col < 0) return -1;
        if (row >= Size || col >= Size) throw new ArgumentOutOfRangeException(nameof(row), $"position ({row}, {col}) outside a {Size}-unknown system");
        long key = ((long)row << 32) | (uint)col;
        if (_slotOf.TryGetValue(key, out int slot)) return slot;
        slot = _rows.Count;
        _slotOf.Add(key, slot);
        _rows.Add(row);
        _cols.Add(col);
        return slot;
    }

    /// <summary>The slot of (row, col) or -1 when not reserved.</summary>
    public int Find(int row, int col) =>
        row >= 0 && col >= 0 && _slotOf.TryGetValue(((long)row << 32) | (uint)col, out int slot) ? slot : -1;

    /// <summary>Builds a pattern from explicit positions (tests and tools).</summary>
    public static SparsityPattern From(int size, IEnumerable<(int Row, int Col)> positions)
    {
        var p = new SparsityPattern { Size = size };
        foreach (var (r, c) in positions) p.Reserve(r, c);
        return p;
    }
}
