using NightSim.Sky.Events;

namespace NightSim.Sky;

/// <summary>
/// Light events sorted by start with a running maximum of their ends, so the events active at a time are found by
/// one binary search and a short backward walk: O(log n + active). Allocation-free queries.
/// </summary>
internal sealed class LightEventIndex
{
    private readonly double[] _starts;
    private readonly double[] _prefixMaxEnd;
    private readonly ILightEvent[] _events;
    private readonly int[] _channels;

    /// <param name="channelOf">Channel index of each event (−1 = every channel).</param>
    public LightEventIndex(IEnumerable<ILightEvent> events, Func<ILightEvent, int> channelOf)
    {
        _events = [.. events.OrderBy(e => e.Start).ThenBy(e => e.End)];
        _starts = new double[_events.Length];
        _prefixMaxEnd = new double[_events.Length];
        _channels = new int[_events.Length];
        double max = double.NegativeInfinity;
        for (int i = 0; i < _events.Length; i++)
        {
            _starts[i] = _events[i].Start;
            max = Math.Max(max, _events[i].End);
            _prefixMaxEnd[i] = max;
            _channels[i] = channelOf(_events[i]);
        }
    }

    public int Count => _events.Length;

    private int LastStartingAtOrBefore(double time)
    {
        int lo = 0, hi = _starts.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (_starts[mid] <= time) lo = mid + 1; else hi = mid;
        }
        return lo - 1;
    }

    /// <summary>Sum of lux added on <paramref name="channel"/> at <paramref name="time"/>.</summary>
    public double Sum(double time, int channel)
    {
        double sum = 0.0;
        for (int i = LastStartingAtOrBefore(time); i >= 0 && _prefixMaxEnd[i] >= time; i--)
        {
            if (_channels[i] == channel || _channels[i] < 0) sum += _events[i].Value(time);
        }
        return sum;
    }

    /// <summary>Product of the sky factors of all events active at <paramref name="time"/>.</summary>
    public double Product(double time)
    {
        double p = 1.0;
        for (int i = LastStartingAtOrBefore(time); i >= 0 && _prefixMaxEnd[i] >= time; i--) p *= _events[i].Value(time);
        return p;
    }
}
