using System.Globalization;
using System.Text;
using NightSim.Tests.Fixtures;

namespace NightSim.Tests.Fuzz;

/// <summary>Turns a valid light log (CSV "time stamp,lux") into a hostile one: rows out of order, repeated, cut,
/// with odd time stamps or lux values, other separators, or raw byte damage (<see cref="JsonMutator.Raw"/>).</summary>
internal static class LightLogMutator
{
    private static readonly string[] s_lux = ["-1", "NaN", "Infinity", "1e999", "1e308", "", " ", "1,5", "0x10", "1e-400", "abc", "5e-324", "\"7\"", "1;2"];

    private static readonly string[] s_times =
    [
        "", "2026-11-20", "2026-11-20T25:00:00", "2026-02-30T12:00:00", "9999-12-31T23:59:59", "0001-01-01T00:00:00",
        "2026-11-20T15:00:00Z", "2026-11-20T15:00:00+14:00", "2026-11-20 15:00", "1763650800", "15:00", "yesterday",
        "2026-11-20T15:00:00.123456789", "2026-11-20T15:00:00-99:00",
    ];

    public static (byte[] Bytes, string Description) Mutate(byte[] seed, SeededRandom rng)
    {
        var inv = CultureInfo.InvariantCulture;
        if (rng.NextDouble() < 0.3) return JsonMutator.Raw(seed, rng);
        List<string> lines = [.. Encoding.UTF8.GetString(seed).ReplaceLineEndings("\n").Split('\n')];
        int Row() => lines.Count <= 2 ? lines.Count - 1 : 2 + (int)rng.NextInt(lines.Count - 2);
        string note;
        switch (rng.NextInt(9))
        {
            case 0:
            {
                int i = Row();
                string[] cells = lines[i].Split(',');
                string lux = s_lux[rng.NextInt(s_lux.Length)];
                lines[i] = cells[0] + "," + lux;
                note = $"row {i + 1} lux → \"{lux}\"";
                break;
            }
            case 1:
            {
                int i = Row();
                string[] cells = lines[i].Split(',');
                string time = s_times[rng.NextInt(s_times.Length)];
                lines[i] = time + "," + (cells.Length > 1 ? cells[1] : "1");
                note = $"row {i + 1} time → \"{time}\"";
                break;
            }
            case 2:
            {
                int a = Row(), b = Row();
                (lines[a], lines[b]) = (lines[b], lines[a]);
                note = string.Create(inv, $"rows {a + 1} and {b + 1} swapped");
                break;
            }
            case 3:
            {
                int i = Row();
                int times = (int)new long[] { 1, 10, 1000, 20_000 }[rng.NextInt(4)];
                lines.InsertRange(i, Enumerable.Repeat(lines[i], times));
                note = string.Create(inv, $"row {i + 1} repeated {times} times");
                break;
            }
            case 4:
                lines.Reverse();
                note = "rows reversed";
                break;
            case 5:
            {
                for (int i = 0; i < lines.Count; i++) lines[i] = lines[i].Replace(',', ';');
                note = "semicolons for commas";
                break;
            }
            case 6:
            {
                int i = Row();
                lines[i] += ",extra,cells";
                note = string.Create(inv, $"row {i + 1} has extra cells");
                break;
            }
            case 7:
            {
                int keep = (int)rng.NextInt(Math.Max(1, lines.Count));
                lines = lines.Take(keep).ToList();
                note = string.Create(inv, $"only the first {keep} lines");
                break;
            }
            default:
            {
                // Many rows at a fine spacing: a long log.
                int rows = (int)new long[] { 1000, 50_000 }[rng.NextInt(2)];
                var start = new DateTime(2026, 11, 20, 15, 0, 0);
                lines = ["time,lux", .. Enumerable.Range(0, rows).Select(k => string.Create(inv, $"{start.AddSeconds(k):yyyy-MM-ddTHH:mm:ss},{200.0 * Math.Exp(-k / 3000.0):0.###}"))];
                note = string.Create(inv, $"{rows} rows one second apart");
                break;
            }
        }
        return (Encoding.UTF8.GetBytes(string.Join("\n", lines)), note);
    }
}
