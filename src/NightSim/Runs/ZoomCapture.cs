namespace NightSim.Runs;

/// <summary>
/// Full-resolution windows around switching events, captured during the run so a zoom plot shows every accepted point
/// near the event (the night trace is decimated to min/max buckets). Keeps a ring of the last accepted points; when a
/// watched state changes, copies the ring's last <see cref="Before"/> seconds and keeps appending for
/// <see cref="After"/> seconds. Steady steps outside a window allocate nothing; a window allocates when it opens and
/// while it grows during its <see cref="After"/> seconds (at most a dozen windows a run).
/// </summary>
public sealed class ZoomCapture
{
    private readonly int _width;
    private readonly double[] _ringTimes;
    private readonly double[] _ringValues;
    private readonly int[] _indices;
    private readonly int _maxWindows;
    private int _head;
    private int _count;
    private readonly List<Window> _windows = [];
    private Window? _open;

    /// <param name="indices">Unknown indices to keep (−1 = ground, kept as 0 V).</param>
    /// <param name="ringSize">Accepted points kept before an event.</param>
    /// <param name="maxWindows">At most this many windows are captured (the rest are counted, not kept).</param>
    public ZoomCapture(IReadOnlyList<int> indices, int ringSize = 4096, int maxWindows = 12)
    {
        _indices = [.. indices];
        _width = _indices.Length;
        _ringTimes = new double[ringSize];
        _ringValues = new double[ringSize * _width];
        _maxWindows = maxWindows;
    }

    /// <summary>Seconds kept before the event.</summary>
    public double Before { get; init; } = 8.0;

    /// <summary>Seconds kept after the event.</summary>
    public double After { get; init; } = 4.0;

    /// <summary>A further event within this many seconds of the open window's event joins that window; a later one
    /// closes it and opens its own. Default: <see cref="After"/>.</summary>
    public double? MergeWithin { get; init; }

    /// <summary>Events seen, captured or not.</summary>
    public int EventsSeen { get; private set; }

    /// <summary>The captured windows.</summary>
    public IReadOnlyList<Window> Windows => _windows;

    /// <summary>Record an accepted point.</summary>
    public void Add(double time, ReadOnlySpan<double> x)
    {
        int slot = _head;
        _ringTimes[slot] = time;
        for (int k = 0; k < _width; k++) _ringValues[slot * _width + k] = _indices[k] < 0 ? 0.0 : x[_indices[k]];
        _head = (_head + 1) % _ringTimes.Length;
        if (_count < _ringTimes.Length) _count++;

        if (_open is not null)
        {
            if (time <= _open.EventTime + After) _open.Append(time, x, _indices);
            else _open = null;
        }
    }

    /// <summary>A watched state changed at <paramref name="time"/> (call after <see cref="Add"/> of that point).</summary>
    /// <param name="label">What happened, for the plot title ("lamp on").</param>
    public void Mark(double time, string label)
    {
        EventsSeen++;
        if (_open is not null)
        {
            if (time - _open.EventTime <= (MergeWithin ?? After))
            {
                _open.Labels.Add((time, label));
                return;
            }
            _open = null;
        }
        if (_windows.Count >= _maxWindows) return;
        var w = new Window(time, label, _width);
        // Copy the ring's points within Before seconds, oldest first.
        int start = (_head - _count + _ringTimes.Length) % _ringTimes.Length;
        for (int n = 0; n < _count; n++)
        {
            int slot = (start + n) % _ringTimes.Length;
            // Keep the last point before the window too, so the plot's lines enter from its left edge even when
            // the steps before the event were longer than the window.
            int nextSlot = (slot + 1) % _ringTimes.Length;
            bool lastBefore = n + 1 < _count && _ringTimes[nextSlot] >= time - Before;
            if (_ringTimes[slot] < time - Before && !lastBefore) continue;
            w.AppendRow(_ringTimes[slot], _ringValues.AsSpan(slot * _width, _width));
        }
        _windows.Add(w);
        _open = w;
    }

    /// <summary>One captured window: times and one column per kept unknown.</summary>
    public sealed class Window
    {
        private readonly int _width;

        internal Window(double eventTime, string label, int width)
        {
            EventTime = eventTime;
            _width = width;
            Labels.Add((eventTime, label));
            Columns = new List<double>[width];
            for (int k = 0; k < width; k++) Columns[k] = [];
        }

        /// <summary>Run time of the event that opened the window, seconds.</summary>
        public double EventTime { get; }

        /// <summary>Events inside the window: time and label.</summary>
        public List<(double Time, string Label)> Labels { get; } = [];

        public List<double> Times { get; } = [];

        public List<double>[] Columns { get; }

        internal void AppendRow(double time, ReadOnlySpan<double> row)
        {
            Times.Add(time);
            for (int k = 0; k < _width; k++) Columns[k].Add(row[k]);
        }

        internal void Append(double time, ReadOnlySpan<double> x, int[] indices)
        {
            Times.Add(time);
            for (int k = 0; k < _width; k++) Columns[k].Add(indices[k] < 0 ? 0.0 : x[indices[k]]);
        }
    }
}
