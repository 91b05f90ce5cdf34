namespace NightSim.Results;

/// <summary>
/// Records selected unknowns at accepted points, in two stores:
/// <list type="bullet">
/// <item>Rows: accepted points as the solver computed them, every signal at the same time. Decimated by time: a point
/// is kept when at least duration/bucketCount has passed since the last kept row, and always when the solver marks it
/// (a switching event, the first point after it, a landed breakpoint), together with the accepted point just before
/// such a marked one, and the final point. No row is ever interpolated or mixed from different times.</item>
/// <item>Envelope: per signal and time bucket (width duration/bucketCount) the minimum and maximum point, in time order,
/// so no spike is lost in plots and in <see cref="Trace.Min"/>/<see cref="Trace.Max"/>.</item>
/// </list>
/// Storage is allocated up front; the row store doubles only if marked points outnumber its reserve (a chattering
/// relay), so steady stepping allocates nothing.
/// </summary>
public sealed class TraceRecorder
{
    private readonly int[] _indices;
    private readonly string[] _names;
    private readonly string[] _units;
    private readonly double _start;
    private readonly double _width;
    private readonly int _buckets;
    private readonly double[][] _times;
    private readonly double[][] _values;
    private readonly int[] _count;
    private readonly int[] _bucketStart; // index of the first point of the current bucket, per signal
    private readonly int[] _bucketPoints; // points seen in the current bucket, per signal
    private long _currentBucket = -1;

    private double[] _rowTimes;
    private double[][] _rowValues; // per signal
    private int _rows;
    private double _lastRowTime = double.NegativeInfinity;
    private readonly double[] _pendingValues;
    private double _pendingTime;
    private bool _hasPending;

    /// <param name="indices">Unknown indices to record.</param>
    /// <param name="names">Their names.</param>
    /// <param name="units">Their units.</param>
    /// <param name="start">Run start time, seconds.</param>
    /// <param name="stop">Run stop time, seconds.</param>
    /// <param name="bucketCount">Number of decimation buckets (points kept ≤ 2·bucketCount + 2 per signal).</param>
    /// <param name="buffers">Storage to take over from an earlier run on this thread (a study), or null for new arrays.</param>
    public TraceRecorder(IReadOnlyList<int> indices, IReadOnlyList<string> names, IReadOnlyList<string> units, double start, double stop, int bucketCount,
        TraceBuffers? buffers = null)
    {
        _indices = [.. indices];
        _names = [.. names];
        _units = [.. units];
        _start = start;
        _buckets = Math.Max(1, bucketCount);
        _width = Math.Max(stop - start, 1e-30) / _buckets;
        int capacity = 2 * _buckets + 4;
        int rowCapacity = _buckets + 4 + RowReserve;
        if (buffers is not null)
        {
            // Every array is written before it is read (counts start at zero), so old contents do no harm.
            _times = TraceBuffers.Take(ref buffers.Times, _indices.Length, capacity);
            _values = TraceBuffers.Take(ref buffers.Values, _indices.Length, capacity);
            if (buffers.RowTimes.Length != rowCapacity) buffers.RowTimes = new double[rowCapacity];
            _rowTimes = buffers.RowTimes;
            _rowValues = TraceBuffers.Take(ref buffers.RowValues, _indices.Length, rowCapacity);
        }
        else
        {
            _times = new double[_indices.Length][];
            _values = new double[_indices.Length][];
            for (int s = 0; s < _indices.Length; s++)
            {
                _times[s] = new double[capacity];
                _values[s] = new double[capacity];
            }
            _rowTimes = new double[rowCapacity];
            _rowValues = new double[_indices.Length][];
            for (int s = 0; s < _indices.Length; s++) _rowValues[s] = new double[rowCapacity];
        }
        _pendingValues = new double[_indices.Length];
        _count = new int[_indices.Length];
        _bucketStart = new int[_indices.Length];
        _bucketPoints = new int[_indices.Length];
    }

    /// <summary>Rows reserved beyond one per bucket for marked points (switching edges, breakpoints).</summary>
    public const int RowReserve = 4096;

    /// <summary>Record the solution <paramref name="x"/> at <paramref name="time"/> (non-decreasing).</summary>
    /// <param name="time">Time of the accepted point, s.</param>
    /// <param name="x">The solution.</param>
    /// <param name="keep">True to keep this point as a row whatever the decimation (a switching edge, a breakpoint).</param>
    public void Record(double time, ReadOnlySpan<double> x, bool keep = false)
    {
        RecordRow(time, x, keep);
        RecordEnvelope(time, x);
    }

    /// <summary>Add a point to the plots' envelope only, not to the rows (the accepted points of a skipped oscillation
    /// cycle, moved to where the cycle would lie). Times non-decreasing, as for <see cref="Record"/>.</summary>
    public void RecordEnvelopeOnly(double time, ReadOnlySpan<double> x) => RecordEnvelope(time, x);

    private void RecordRow(double time, ReadOnlySpan<double> x, bool keep)
    {
        if (keep || _rows == 0 || time - _lastRowTime >= _width)
        {
            if (keep && _hasPending) AppendRow(_pendingTime, _pendingValues);
            _hasPending = false;
            for (int s = 0; s < _indices.Length; s++) _pendingValues[s] = _indices[s] >= 0 ? x[_indices[s]] : 0.0;
            AppendRow(time, _pendingValues);
            return;
        }
        _pendingTime = time;
        for (int s = 0; s < _indices.Length; s++) _pendingValues[s] = _indices[s] >= 0 ? x[_indices[s]] : 0.0;
        _hasPending = true;
    }

    private void AppendRow(double time, double[] values)
    {
        if (_rows == _rowTimes.Length)
        {
            Array.Resize(ref _rowTimes, 2 * _rowTimes.Length);
            for (int s = 0; s < _rowValues.Length; s++) Array.Resize(ref _rowValues[s], _rowTimes.Length);
        }
        _rowTimes[_rows] = time;
        for (int s = 0; s < values.Length; s++) _rowValues[s][_rows] = values[s];
        _rows++;
        _lastRowTime = time;
    }

    private void RecordEnvelope(double time, ReadOnlySpan<double> x)
    {
        long bucket = (long)Math.Floor((time - _start) / _width);
        if (bucket >= _buckets) bucket = _buckets - 1;
        bool newBucket = bucket != _currentBucket;
        _currentBucket = bucket;
        for (int s = 0; s < _indices.Length; s++)
        {
            double v = _indices[s] >= 0 ? x[_indices[s]] : 0.0;
            double[] ts = _times[s], vs = _values[s];
            if (newBucket)
            {
                _bucketStart[s] = _count[s];
                _bucketPoints[s] = 0;
            }
            int b0 = _bucketStart[s];
            int inBucket = _count[s] - b0;
            _bucketPoints[s]++;
            if (inBucket < 2 && _count[s] < ts.Length)
            {
                ts[_count[s]] = time;
                vs[_count[s]] = v;
                _count[s]++;
                continue;
            }
            // Bucket holds two points: keep the min and the max of the bucket (they are its two stored points).
            int iMin = vs[b0] <= vs[b0 + 1] ? b0 : b0 + 1;
            int iMax = iMin == b0 ? b0 + 1 : b0;
            double tMin = ts[iMin], vMin = vs[iMin], tMax = ts[iMax], vMax = vs[iMax];
            if (v < vMin) { vMin = v; tMin = time; }
            else if (v > vMax) { vMax = v; tMax = time; }
            else if (_bucketPoints[s] == 3 && vMin == vMax) { vMax = v; tMax = time; }
            if (tMin <= tMax)
            {
                ts[b0] = tMin; vs[b0] = vMin; ts[b0 + 1] = tMax; vs[b0 + 1] = vMax;
            }
            else
            {
                ts[b0] = tMax; vs[b0] = vMax; ts[b0 + 1] = tMin; vs[b0 + 1] = vMin;
            }
        }
    }

    /// <summary>The recorded traces (the last accepted point is always a row).</summary>
    public IReadOnlyList<Trace> Build()
    {
        if (_hasPending)
        {
            AppendRow(_pendingTime, _pendingValues);
            _hasPending = false;
        }
        var traces = new Trace[_indices.Length];
        for (int s = 0; s < traces.Length; s++)
            traces[s] = new Trace(_names[s], _units[s], _rowTimes, _rowValues[s], _rows, _times[s], _values[s], _count[s]);
        return traces;
    }
}
