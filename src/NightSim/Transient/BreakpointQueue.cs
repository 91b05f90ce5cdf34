namespace NightSim.Transient;

/// <summary>Min-heap of requested breakpoint times (seconds). Allocation-free until it must grow.</summary>
public sealed class BreakpointQueue
{
    private double[] _heap = new double[64];

    /// <summary>Number of queued times.</summary>
    public int Count { get; private set; }

    /// <summary>Queue a time.</summary>
    public void Add(double time)
    {
        if (!double.IsFinite(time)) return;
        if (Count == _heap.Length) Array.Resize(ref _heap, _heap.Length * 2);
        int i = Count++;
        _heap[i] = time;
        while (i > 0)
        {
            int parent = (i - 1) / 2;
            if (_heap[parent] <= _heap[i]) break;
            (_heap[parent], _heap[i]) = (_heap[i], _heap[parent]);
            i = parent;
        }
    }

    /// <summary>Drop every time ≤ <paramref name="time"/>; return the earliest remaining one, or +∞.</summary>
    public double NextAfter(double time)
    {
        while (Count > 0 && _heap[0] <= time) RemoveTop();
        return Count > 0 ? _heap[0] : double.PositiveInfinity;
    }

    /// <summary>Remove all times.</summary>
    public void Clear() => Count = 0;

    private void RemoveTop()
    {
        _heap[0] = _heap[--Count];
        int i = 0;
        while (true)
        {
            int l = 2 * i + 1, r = l + 1, m = i;
            if (l < Count && _heap[l] < _heap[m]) m = l;
            if (r < Count && _heap[r] < _heap[m]) m = r;
            if (m == i) break;
            (_heap[m], _heap[i]) = (_heap[i], _heap[m]);
            i = m;
        }
    }
}
