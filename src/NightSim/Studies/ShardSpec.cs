using System.Globalization;

namespace NightSim.Studies;

/// <summary>
/// One slice of a study for running on several machines: shard <see cref="Index"/> of <see cref="Count"/> (1-based)
/// takes the items whose index modulo <see cref="Count"/> is <see cref="Index"/> − 1, so every shard gets a fair mix.
/// </summary>
public sealed record ShardSpec(int Index, int Count)
{
    /// <summary>The whole study.</summary>
    public static ShardSpec All { get; } = new(1, 1);

    public bool IsWhole => Count == 1;

    /// <summary>The item indices of this shard among <paramref name="total"/>.</summary>
    public IReadOnlyList<int> Indices(int total) => Enumerable.Range(0, total).Where(i => i % Count == Index - 1).ToList();

    /// <summary>File name of this shard's result: "shard-2-of-4.json".</summary>
    public string FileName => string.Create(CultureInfo.InvariantCulture, $"shard-{Index}-of-{Count}.json");

    /// <summary>Parses "i/n" (1 ≤ i ≤ n); null with <paramref name="error"/> otherwise.</summary>
    public static ShardSpec? Parse(string text, out string? error)
    {
        error = null;
        string[] parts = text.Split('/');
        if (parts.Length == 2 && int.TryParse(parts[0], NumberStyles.None, CultureInfo.InvariantCulture, out int i)
            && int.TryParse(parts[1], NumberStyles.None, CultureInfo.InvariantCulture, out int n) && n >= 1 && i >= 1 && i <= n)
            return new ShardSpec(i, n);
        error = $"--shard: '{text}' is not a shard; write i/n with 1 ≤ i ≤ n, e.g. --shard 2/4";
        return null;
    }
}
