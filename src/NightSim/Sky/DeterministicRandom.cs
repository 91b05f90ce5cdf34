namespace NightSim.Sky;

/// <summary>
/// Our own seeded generator: xoshiro256** seeded through SplitMix64 (Blackman &amp; Vigna, "Scrambled linear
/// pseudorandom number generators", 2018, public-domain reference algorithms). Every generator kind gets its own
/// independent stream derived from the scenario seed and a stable 64-bit FNV-1a hash of the stream name, so adding
/// a kind never shifts the draws of another kind.
/// </summary>
public sealed class DeterministicRandom
{
    private ulong _s0, _s1, _s2, _s3;

    /// <summary>Creates a generator from a 64-bit seed (expanded by SplitMix64).</summary>
    public DeterministicRandom(ulong seed)
    {
        ulong x = seed;
        _s0 = SplitMix64(ref x);
        _s1 = SplitMix64(ref x);
        _s2 = SplitMix64(ref x);
        _s3 = SplitMix64(ref x);
        if ((_s0 | _s1 | _s2 | _s3) == 0) _s0 = 1; // the all-zero state is the one forbidden state
    }

    /// <summary>An independent stream for <paramref name="streamName"/> (e.g. "headlights#0") under <paramref name="seed"/>.</summary>
    public static DeterministicRandom ForStream(ulong seed, string streamName)
    {
        ArgumentNullException.ThrowIfNull(streamName);
        ulong h = StableHash(streamName);
        ulong mixed = seed ^ h;
        ulong m = mixed;
        return new DeterministicRandom(SplitMix64(ref m) ^ h);
    }

    /// <summary>64-bit FNV-1a over the UTF-16 code units of <paramref name="text"/>: identical on every platform and run.</summary>
    public static ulong StableHash(string text)
    {
        ulong h = 14695981039346656037UL;
        foreach (char c in text)
        {
            h ^= (byte)(c & 0xFF);
            h *= 1099511628211UL;
            h ^= (byte)(c >> 8);
            h *= 1099511628211UL;
        }
        return h;
    }

    private static ulong SplitMix64(ref ulong x)
    {
        x += 0x9E3779B97F4A7C15UL;
        ulong z = x;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>Next raw 64-bit output of xoshiro256**.</summary>
    public ulong NextUInt64()
    {
        ulong result = ulong.RotateLeft(_s1 * 5, 7) * 9;
        ulong t = _s1 << 17;
        _s2 ^= _s0;
        _s3 ^= _s1;
        _s1 ^= _s2;
        _s0 ^= _s3;
        _s2 ^= t;
        _s3 = ulong.RotateLeft(_s3, 45);
        return result;
    }

    /// <summary>Uniform in [0, 1) with 53 random bits.</summary>
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / 9007199254740992.0);

    /// <summary>Uniform in [<paramref name="min"/>, <paramref name="max"/>).</summary>
    public double Uniform(double min, double max) => min + (max - min) * NextDouble();

    /// <summary>Uniform integer in [<paramref name="min"/>, <paramref name="max"/>] inclusive.</summary>
    public int NextInt(int min, int max)
    {
        if (max < min) throw new ArgumentOutOfRangeException(nameof(max));
        ulong span = (ulong)((long)max - min + 1);
        return (int)(min + (long)(NextUInt64() % span));
    }

    /// <summary>Exponentially distributed waiting time with the given <paramref name="rate"/> (events per unit).</summary>
    public double Exponential(double rate) => -Math.Log(1.0 - NextDouble()) / rate;

    /// <summary>
    /// Times of a homogeneous Poisson process with <paramref name="ratePerSecond"/> on [<paramref name="from"/>,
    /// <paramref name="to"/>), seconds, in increasing order.
    /// </summary>
    public List<double> PoissonTimes(double from, double to, double ratePerSecond)
    {
        var times = new List<double>();
        if (!(ratePerSecond > 0) || !(to > from)) return times;
        double t = from;
        while (true)
        {
            t += Exponential(ratePerSecond);
            if (t >= to) break;
            times.Add(t);
        }
        return times;
    }
}
