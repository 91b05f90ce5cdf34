namespace NightSim.Runs;

/// <summary>
/// Full-resolution windows around switching events, captured during the run so a zoom plot shows every accepted point
/// near the event (the night trace is decimated to min/max buckets). Keeps a ring of the last accepted points; when a
/// watched state changes, copies the ring's last <see cref="Before"/> seconds and keeps appending for
/// <see cref="After"/> seconds. All storage is made up front: the windows' rows go one after another into one store
/// (only one window is open at a time), so accepted points allocate nothing, inside a window or not. The store doubles
/// only when the windows of a run hold more rows than it has (a long chattering burst), once per doubling.
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
    private readonly List<Window> _windows;
    private readonly Window[] _pool;
    private Window? _open;

    // The rows of every window, in the order they were captured.
    private double[] _times;
    private double[] _values;
    private int _rows;

    /// <param name="indices">Unknown indices to keep (−1 = ground, kept as 0 V).</param>
    /// <param name="ringSize">Accepted points kept before an event.</param>
    /// <param name="maxWindows">At most this many windows are captured (the rest are counted, not kept).</param>
    /// <param name="storeRows">Rows the windows' store holds before it has to grow (default: the ring's size).</param>
    public ZoomCapture(IReadOnlyList<int> indices, int ringSize = 4096, int maxWindows = 12, int? storeRows = null)
    {
        _indices = [.. indices];
        _width = _indices.Length;
        _ringTimes = new double[ringSize];
        _ringValues = new double[ringSize * _width];
        _maxWindows = maxWindows;
        _windows = new List<Window>(maxWindows);
        _pool = new Window[maxWindows];
        for (int i = 0; i < maxWindows; i++) _pool[i] = new Window(this);
        int rows = Math.Max(16, storeRows ?? ringSize);
        _times = new double[rows];
        _values = new double[rows * _width];
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
            if (time <= _open.EventTime + After) AppendRow(_open, time, _ringValues.AsSpan(slot * _width, _width));
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
        Window w = _pool[_windows.Count];
        w.Open(time, label, _rows);
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
            AppendRow(w, _ringTimes[slot], _ringValues.AsSpan(slot * _width, _width));
        }
        _windows.Add(w);
        _open = w;
    }

    private void AppendRow(Window w, double time, ReadOnlySpan<double> row)
    {
        if (_rows == _times.Length)
        {
            Array.Resize(ref _times, 2 * _times.Length);
            Array.Resize(ref _values, 2 * _values.Length);
        }
        _times[_rows] = time;
        row.CopyTo(_values.AsSpan(_rows * _width, _width));
        _rows++;
        w.Count++;
    }

    /// <summary>One captured window: times and one column per kept unknown (arrays made when first read, after the
    /// run).</summary>
    public sealed class Window
    {
        private readonly ZoomCapture _owner;
        private double[]? _timesCopy;

        internal Window(ZoomCapture owner) => _owner = owner;

        internal void Open(double eventTime, string label, int first)
        {
            EventTime = eventTime;
            First = first;
            Count = 0;
            Labels.Clear();
            Labels.Add((eventTime, label));
            _timesCopy = null;
        }

        /// <summary>Run time of the event that opened the window, seconds.</summary>
        public double EventTime { get; private set; }

        /// <summary>Events inside the window: time and label.</summary>
        public List<(double Time, string Label)> Labels { get; } = new(16);

        private int First { get; set; }

        /// <summary>Rows in the window.</summary>
        public int Count { get; internal set; }

        /// <summary>Times of the window's rows, seconds.</summary>
        public double[] Times => _timesCopy ??= _owner._times.AsSpan(First, Count).ToArray();

        /// <summary>Values of kept unknown <paramref name="k"/> (in the order of the indices given) at each row.</summary>
        public double[] Column(int k)
        {
            int width = _owner._width;
            var column = new double[Count];
            for (int r = 0; r < Count; r++) column[r] = _owner._values[(First + r) * width + k];
            return column;
        }
    }
}
