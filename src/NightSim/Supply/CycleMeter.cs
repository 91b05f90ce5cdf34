namespace NightSim.Supply;

/// <summary>Mean, RMS, minimum and maximum of each measured quantity over a span of whole mains cycles.</summary>
public sealed class CycleStats
{
    internal CycleStats(int quantities)
    {
        Mean = new double[quantities];
        Rms = new double[quantities];
        Min = new double[quantities];
        Max = new double[quantities];
    }

    /// <summary>Time average of each quantity.</summary>
    public double[] Mean { get; }

    /// <summary>Root mean square of each quantity.</summary>
    public double[] Rms { get; }

    /// <summary>Smallest value at an accepted point.</summary>
    public double[] Min { get; }

    /// <summary>Largest value at an accepted point.</summary>
    public double[] Max { get; }

    /// <summary>Run time the span starts and ends, seconds.</summary>
    public double From { get; internal set; }
    public double To { get; internal set; }
}

/// <summary>
/// Integrates quantities sampled at every accepted point over whole cycles of the mains (the trapezoidal rule between
/// points, each segment split at a cycle boundary by linear interpolation), keeps the last few cycles, and says when
/// the first quantity (the rail) has reached its periodic steady state: its cycle mean changes by less than a
/// tolerance per cycle, and the changes, extrapolated as a geometric series, add up to less than the tolerance.
/// </summary>
public sealed class CycleMeter
{
    private readonly int _n;
    private readonly double _period;
    private readonly double _origin;
    private readonly int _keep;
    private readonly double[] _sum, _sum2, _min, _max, _last;
    private readonly double[][] _ringMean, _ringRms, _ringMin, _ringMax;
    private readonly double[] _ringFrom;
    private double _lastTime = double.NaN;
    private double _cycleStart;
    private long _current;   // index of the cycle in progress
    private bool _counts;    // it started on its boundary and nothing was forgotten since
    private int _stored;
    private int _head;

    /// <param name="quantities">How many quantities each sample holds.</param>
    /// <param name="period">Mains period, s.</param>
    /// <param name="origin">Run time of a cycle boundary (the sine's start), s.</param>
    /// <param name="keep">Cycles remembered.</param>
    public CycleMeter(int quantities, double period, double origin, int keep = 16)
    {
        if (!(period > 0)) throw new ArgumentOutOfRangeException(nameof(period), period, "the period must be positive");
        _n = quantities;
        _period = period;
        _origin = origin;
        _keep = keep;
        _sum = new double[_n];
        _sum2 = new double[_n];
        _min = new double[_n];
        _max = new double[_n];
        _last = new double[_n];
        _ringMean = new double[keep][];
        _ringRms = new double[keep][];
        _ringMin = new double[keep][];
        _ringMax = new double[keep][];
        _ringFrom = new double[keep];
        for (int k = 0; k < keep; k++)
        {
            _ringMean[k] = new double[_n];
            _ringRms[k] = new double[_n];
            _ringMin[k] = new double[_n];
            _ringMax[k] = new double[_n];
        }
        ResetCycle();
    }

    /// <summary>Whole cycles completed since the last <see cref="Forget"/>.</summary>
    public int Cycles { get; private set; }

    /// <summary>Mains period, s.</summary>
    public double Period => _period;

    /// <summary>Forget the cycles so far (a state change: the next steady state is a new one). The cycle in progress
    /// is dropped too.</summary>
    public void Forget()
    {
        Cycles = 0;
        _stored = 0;
        _counts = false; // the cycle in progress does not count
    }

    /// <summary>Adds the accepted point (<paramref name="time"/>, <paramref name="values"/>). Allocation-free.</summary>
    public void Add(double time, ReadOnlySpan<double> values)
    {
        if (double.IsNaN(_lastTime))
        {
            _lastTime = time;
            values.CopyTo(_last);
            double at = (time - _origin) / _period;
            _current = (long)Math.Floor(at + 1e-9);
            _counts = Math.Abs(at - Math.Round(at)) < 1e-9; // a first point on a boundary starts a whole cycle
            _cycleStart = time;
            IncludeBounds(values);
            return;
        }
        if (!(time > _lastTime)) return;
        double t0 = _lastTime;
        while (true)
        {
            double boundary = _origin + (_current + 1) * _period;
            if (time < boundary)
            {
                Integrate(t0, time, values, _lastTime, time);
                break;
            }
            // Split at the boundary: interpolate the values there, close the cycle, open the next.
            Integrate(t0, boundary, values, _lastTime, time);
            CloseCycle(boundary, values, _lastTime, time);
            t0 = boundary;
        }
        _lastTime = time;
        values.CopyTo(_last);
        IncludeBounds(values);
    }

    /// <summary>Adds the trapezoid over [a, b] of the segment from (<paramref name="tA"/>, last) to (<paramref name="tB"/>, v).</summary>
    private void Integrate(double a, double b, ReadOnlySpan<double> v, double tA, double tB)
    {
        double span = tB - tA;
        double wa = (a - tA) / span, wb = (b - tA) / span, dt = b - a;
        for (int i = 0; i < _n; i++)
        {
            double va = _last[i] + (v[i] - _last[i]) * wa;
            double vb = _last[i] + (v[i] - _last[i]) * wb;
            _sum[i] += 0.5 * (va + vb) * dt;
            // Exact integral of the square of a straight line.
            _sum2[i] += (va * va + va * vb + vb * vb) / 3.0 * dt;
        }
    }

    private void CloseCycle(double boundary, ReadOnlySpan<double> v, double tA, double tB)
    {
        double w = (boundary - tA) / (tB - tA);
        if (_counts)
        {
            int slot = _head;
            for (int i = 0; i < _n; i++)
            {
                double atBoundary = _last[i] + (v[i] - _last[i]) * w;
                _ringMean[slot][i] = _sum[i] / _period;
                _ringRms[slot][i] = Math.Sqrt(Math.Max(0, _sum2[i] / _period));
                _ringMin[slot][i] = Math.Min(_min[i], atBoundary);
                _ringMax[slot][i] = Math.Max(_max[i], atBoundary);
            }
            _ringFrom[slot] = _cycleStart;
            _head = (_head + 1) % _keep;
            _stored = Math.Min(_stored + 1, _keep);
            Cycles++;
        }
        ResetCycle();
        _current++;
        _counts = true;
        _cycleStart = boundary;
        for (int i = 0; i < _n; i++)
        {
            double atBoundary = _last[i] + (v[i] - _last[i]) * w;
            _min[i] = atBoundary;
            _max[i] = atBoundary;
        }
    }

    private void ResetCycle()
    {
        Array.Clear(_sum);
        Array.Clear(_sum2);
        Array.Fill(_min, double.PositiveInfinity);
        Array.Fill(_max, double.NegativeInfinity);
    }

    private void IncludeBounds(ReadOnlySpan<double> v)
    {
        for (int i = 0; i < _n; i++)
        {
            if (v[i] < _min[i]) _min[i] = v[i];
            if (v[i] > _max[i]) _max[i] = v[i];
        }
    }

    /// <summary>Cycle mean of quantity <paramref name="quantity"/> in the cycle <paramref name="back"/> cycles before the
    /// last completed one (0 = the last).</summary>
    public double CycleMean(int quantity, int back = 0) => _ringMean[Slot(back)][quantity];

    private int Slot(int back)
    {
        if (back < 0 || back >= _stored) throw new ArgumentOutOfRangeException(nameof(back), back, $"only {_stored} cycles are kept");
        return ((_head - 1 - back) % _keep + _keep) % _keep;
    }

    /// <summary>True when quantity 0 has settled: at least <paramref name="minCycles"/> cycles since the last
    /// <see cref="Forget"/>, the means of the last <paramref name="window"/> + 1 cycles all within the tolerance of the
    /// last one, and the sum of the changes still to come (the last change carried on at the ratio of the last two)
    /// within it too; the tolerance is <paramref name="relative"/> of the mean plus <paramref name="absolute"/>.</summary>
    public bool Settled(int minCycles = 10, double relative = 1e-3, double absolute = 1e-3, int window = 5)
    {
        if (Cycles < Math.Max(Math.Max(3, window + 1), minCycles) || _stored < Math.Max(3, window + 1)) return false;
        double m0 = CycleMean(0, 0), m1 = CycleMean(0, 1), m2 = CycleMean(0, 2);
        double d1 = m0 - m1, d2 = m1 - m2;
        double tol = relative * Math.Abs(m0) + absolute;
        // Every cycle of the measured window (and the one before it) within the tolerance of the last one.
        for (int back = 1; back <= window; back++)
            if (Math.Abs(CycleMean(0, back) - m0) > tol) return false;
        if (Math.Abs(d1) <= 0.01 * tol) return true;
        // Changes of one sign shrinking geometrically leave |d1|·ρ/(1 − ρ) to come; anything else is not settled yet.
        if (d2 == 0 || Math.Sign(d1) != Math.Sign(d2)) return Math.Abs(d1) <= 0.1 * tol;
        double rho = d1 / d2;
        if (rho >= 0.98) return false;
        return Math.Abs(d1) * rho / (1 - rho) <= tol;
    }

    /// <summary>Statistics over the last <paramref name="cycles"/> completed cycles (fewer when fewer are kept).</summary>
    public CycleStats Window(int cycles)
    {
        int count = Math.Min(cycles, _stored);
        if (count == 0) throw new InvalidOperationException("no whole cycle has been measured yet");
        var s = new CycleStats(_n);
        Array.Fill(s.Min, double.PositiveInfinity);
        Array.Fill(s.Max, double.NegativeInfinity);
        var squares = new double[_n];
        for (int b = 0; b < count; b++)
        {
            int slot = Slot(b);
            for (int i = 0; i < _n; i++)
            {
                s.Mean[i] += _ringMean[slot][i] / count;
                squares[i] += _ringRms[slot][i] * _ringRms[slot][i] / count;
                s.Min[i] = Math.Min(s.Min[i], _ringMin[slot][i]);
                s.Max[i] = Math.Max(s.Max[i], _ringMax[slot][i]);
            }
        }
        for (int i = 0; i < _n; i++) s.Rms[i] = Math.Sqrt(squares[i]);
        s.From = _ringFrom[Slot(count - 1)];
        s.To = s.From + count * _period;
        return s;
    }
}
