using NightSim.Sky;

namespace NightSim.Tests.Sky;

public sealed class DeterministicRandomTests
{
    [Fact]
    public void StableHash_IsFnv1a64()
    {
        // FNV-1a 64-bit (Fowler–Noll–Vo, IETF draft-eastlake-fnv): the empty input hashes to the offset basis.
        Assert.Equal(14695981039346656037UL, DeterministicRandom.StableHash(""));
        // One code unit 'a' (0x61, 0x00): two FNV-1a rounds, computed by hand from the published prime 1099511628211.
        ulong h = 14695981039346656037UL;
        h ^= 0x61; h *= 1099511628211UL; h ^= 0x00; h *= 1099511628211UL;
        Assert.Equal(h, DeterministicRandom.StableHash("a"));
    }

    [Fact]
    public void SplitMix64_FirstOutputOfSeedZero()
    {
        // SplitMix64 reference (Steele, Lea & Flood 2014; public-domain C code; values from memory): seed 0 → first output 0xE220A8397B1DCDAF.
        // Our generator's first state word is that value, so the xoshiro256** first output is rotl(s1*5,7)*9 of the
        // second SplitMix64 output 0x6E789E6AA1B965F4.
        var r = new DeterministicRandom(0);
        ulong s1 = 0x6E789E6AA1B965F4UL;
        Assert.Equal(ulong.RotateLeft(s1 * 5, 7) * 9, r.NextUInt64());
    }

    [Fact]
    public void SameSeedSameStream_DifferentNamesDiffer()
    {
        var a = DeterministicRandom.ForStream(42, "headlights#0");
        var b = DeterministicRandom.ForStream(42, "headlights#0");
        var c = DeterministicRandom.ForStream(42, "lightning#0");
        var d = DeterministicRandom.ForStream(43, "headlights#0");
        for (int i = 0; i < 100; i++)
        {
            ulong x = a.NextUInt64();
            Assert.Equal(x, b.NextUInt64());
            Assert.NotEqual(x, c.NextUInt64());
            Assert.NotEqual(x, d.NextUInt64());
        }
    }

    [Fact]
    public void Uniform_MeanAndRange()
    {
        var r = new DeterministicRandom(7);
        double sum = 0;
        const int n = 100_000;
        for (int i = 0; i < n; i++)
        {
            double u = r.NextDouble();
            Assert.InRange(u, 0.0, 1.0 - 1e-17);
            sum += u;
        }
        // Mean 1/2, standard error sqrt(1/12/n) ≈ 9.1e-4: 5σ band.
        Assert.InRange(sum / n, 0.5 - 0.0046, 0.5 + 0.0046);
    }

    [Fact]
    public void Poisson_CountMatchesRate()
    {
        // Poisson process: count over T has mean and variance λT. 2000 windows of 5 h at 3 per hour → mean 15, sd of the mean 0.087.
        var r = new DeterministicRandom(11);
        double total = 0, sq = 0;
        const int windows = 2000;
        for (int i = 0; i < windows; i++)
        {
            int k = r.PoissonTimes(0, 5 * 3600, 3.0 / 3600).Count;
            total += k; sq += (double)k * k;
        }
        double mean = total / windows, variance = sq / windows - mean * mean;
        Assert.InRange(mean, 15 - 0.5, 15 + 0.5);
        Assert.InRange(variance, 15 * 0.85, 15 * 1.15);
    }
}
