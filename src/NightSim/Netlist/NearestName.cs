namespace NightSim.Netlist;

/// <summary>"Did you mean …?" suggestions by edit distance (Levenshtein, case-insensitive).</summary>
public static class NearestName
{
    /// <summary>The candidate closest to <paramref name="name"/>, or null when none is close enough
    /// (distance at most max(2, length / 3)).</summary>
    public static string? Find(string name, IEnumerable<string> candidates)
    {
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (string c in candidates)
        {
            int d = Distance(name.ToLowerInvariant(), c.ToLowerInvariant());
            if (d < bestDistance)
            {
                best = c;
                bestDistance = d;
            }
        }
        int limit = Math.Max(2, name.Length / 3);
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
