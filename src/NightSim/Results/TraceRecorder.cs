namespace NightSim.Results;

/// <summary>
/// Records selected unknowns at every accepted point with min/max decimation per time bucket. All storage is
/// allocated up front (at most two points per bucket and signal), so recording allocates nothing in the step loop.
/// </summary>
/// <remarks>
/// Buckets have width duration/bucketCount. While a bucket holds at most two points they are kept as they are;
/// from the third point on the bucket keeps only its minimum and maximum point, in time order.
/// </remarks>
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

    /// <param name="indices">Unknown indices to record.</param>
    /// <param name="names">Their names.</param>
    /// <param name="units">Their units.</param>
    /// <param name="start">Run start time, seconds.</param>
    /// <param name="stop">Run stop time, seconds.</param>
    /// <param name="bucketCount">Number of decimation buckets (points kept ≤ 2·bucketCount + 2 per signal).</param>
    public TraceRecorder(IReadOnlyList<int> indices, IReadOnlyList<string> names, IReadOnlyList<string> units, double start, double stop, int bucketCount)
    {
        _indices = [.. indices];
        _names = [.. names];
        _units = [.. units];
        _start = start;
        _buckets = Math.Max(1, bucketCount);
        _width = Math.Max(stop - start, 1e-30) / _buckets;
        int capacity = 2 * _buckets + 4;
        _times = new double[_indices.Length][];
        _values = new double[_indices.Length][];
        for (int s = 0; s < _indices.Length; s++)
        {
            _times[s] = new double[capacity];
            _values[s] = new double[capacity];
        }
        _count = new int[_indices.Length];
        _bucketStart = new int[_indices.Length];
        _bucketPoints = new int[_indices.Length];
    }

    /// <summary>Record the solution <paramref name="x"/> at <paramref name="time"/> (non-decreasing).</summary>
    public void Record(double time, ReadOnlySpan<double> x)
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

    /// <summary>The recorded traces.</summary>
    public IReadOnlyList<Trace> Build()
    {
        var traces = new Trace[_indices.Length];
        for (int s = 0; s < traces.Length; s++) traces[s] = new Trace(_names[s], _units[s], _times[s], _values[s], _count[s]);
        return traces;
    }
}
