using System.Globalization;
using System.Text;

namespace NightSim.Results;

/// <summary>
/// Writes traces as CSV: a header "time_s,&lt;name&gt;_volts|_amps…" and one row per time at which any trace has a point
/// (all traces of a run share their sample times until decimation; decimated traces are interpolated linearly between
/// their own kept points). Culture-invariant, round-trip precision ("R").
/// </summary>
public static class TraceCsv
{
    /// <summary>Write <paramref name="traces"/> to <paramref name="writer"/>.</summary>
    public static void Write(IReadOnlyList<Trace> traces, TextWriter writer)
    {
        var header = new StringBuilder("time_s");
        foreach (Trace t in traces) header.Append(',').Append(Column(t));
        writer.WriteLine(header.ToString());
        var times = new SortedSet<double>();
        foreach (Trace t in traces) times.UnionWith(t.Times);
        var cursor = new int[traces.Count];
        var row = new StringBuilder();
        foreach (double time in times)
        {
            row.Clear();
            row.Append(time.ToString("R", CultureInfo.InvariantCulture));
            for (int s = 0; s < traces.Count; s++)
            {
                Trace tr = traces[s];
                int i = cursor[s];
                while (i + 1 < tr.Times.Count && tr.Times[i + 1] <= time) i++;
                cursor[s] = i;
                double v;
                if (tr.Times.Count == 0) v = double.NaN;
                else if (tr.Times[i] == time || i + 1 >= tr.Times.Count || time < tr.Times[i]) v = tr.Values[i];
                else
                {
                    double t0 = tr.Times[i], t1 = tr.Times[i + 1];
                    v = tr.Values[i] + (tr.Values[i + 1] - tr.Values[i]) * (time - t0) / (t1 - t0);
                }
                row.Append(',').Append(v.ToString("R", CultureInfo.InvariantCulture));
            }
            writer.WriteLine(row.ToString());
        }
    }

    private static string Column(Trace t)
    {
        string name = t.Name.Replace(',', '_').Replace('"', '_');
        return t.Unit == "A" ? name + "_amps" : name + "_volts";
    }
}
