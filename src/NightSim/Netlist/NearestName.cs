namespace NightSim.Netlist;

/// <summary>"Did you mean …?" suggestions by edit distance (Levenshtein, case-insensitive).</summary>
public static class NearestName
{
    /// <summary>Longest name that gets a suggestion: a longer one is no typing slip, and comparing long names costs
    /// time in the product of their lengths.</summary>
    public const int MaxLength = 64;

    /// <summary>The candidate closest to <paramref name="name"/>, or null when none is close enough
    /// (distance at most max(2, length / 3)) or the name is longer than <see cref="MaxLength"/>.</summary>
    public static string? Find(string name, IEnumerable<string> candidates)
    {
        if (name.Length > MaxLength) return null;
        string? best = null;
        int bestDistance = int.MaxValue;
        int limit = Math.Max(2, name.Length / 3);
        string lower = name.ToLowerInvariant();
        foreach (string c in candidates)
        {
            // The distance is at least the difference in length: such a candidate cannot be close enough.
            if (Math.Abs(c.Length - name.Length) > limit) continue;
            int d = Distance(lower, c.ToLowerInvariant());
            if (d < bestDistance)
            {
                best = c;
                bestDistance = d;
            }
        }
        return bestDistance <= limit ? best : null;
    }

    /// <summary>Levenshtein edit distance (insertions, deletions, substitutions each cost 1).</summary>
    public static int Distance(string a, string b)
    {
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++) previous[j] = j;
        for (int i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (int j = 1; j <= b.Length; j++)
            {
                int cost = a[i - 1] == b[j - 1] ? 0 : 1;
                current[j] = Math.Min(Math.Min(current[j - 1] + 1, previous[j] + 1), previous[j - 1] + cost);
            }
            (previous, current) = (current, previous);
        }
        return previous[b.Length];
    }
}
