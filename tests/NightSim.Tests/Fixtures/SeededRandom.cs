namespace NightSim.Tests.Fixtures;

/// <summary>SplitMix64 (Steele, Lea &amp; Flood 2014): a small deterministic generator for test data with a reported seed.</summary>
internal sealed class SeededRandom
{
    private ulong _state;

    public SeededRandom(ulong seed) => _state = seed;

    public ulong NextULong()
    {
        ulong z = _state += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>Uniform in [0, 1).</summary>
    public double NextDouble() => (NextULong() >> 11) * (1.0 / (1UL << 53));

    /// <summary>Uniform integer in [0, n).</summary>
    public ulong NextInt(int n) => NextULong() % (ulong)n;
}
