using System.Globalization;
using System.Text;

namespace NightSim.Results;

/// <summary>
/// Writes the traces of a plain transient as CSV: a header "time_s,&lt;name&gt;_volts|_amps…" (the same column names as a
/// night run's trace.csv, without its clock and light columns) and one row per kept accepted point: every value in a row
/// is the solver's solution at that row's time (see <see cref="TraceRecorder"/> for which points are kept).
/// Culture-invariant, round-trip precision ("R").
/// </summary>
public static class TraceCsv
{
    /// <summary>Write <paramref name="traces"/> (all from one run, so with the same row times) to <paramref name="writer"/>.</summary>
    public static void Write(IReadOnlyList<Trace> traces, TextWriter writer)
    {
        var header = new StringBuilder("time_s");
        foreach (Trace t in traces) header.Append(',').Append(Column(t));
        writer.WriteLine(header.ToString());
        if (traces.Count == 0) return;
        IReadOnlyList<double> times = traces[0].Times;
        foreach (Trace t in traces)
        {
            if (t.Times.Count != times.Count) throw new ArgumentException($"trace '{t.Name}' has {t.Times.Count} rows but '{traces[0].Name}' has {times.Count}: traces of different runs", nameof(traces));
        }
        var row = new StringBuilder();
        for (int r = 0; r < times.Count; r++)
        {
            row.Clear();
            row.Append(times[r].ToString("R", CultureInfo.InvariantCulture));
            foreach (Trace t in traces) row.Append(',').Append(t.Values[r].ToString("R", CultureInfo.InvariantCulture));
            writer.WriteLine(row.ToString());
        }
    }

    /// <summary>Column name of a trace: &lt;name&gt;_volts or &lt;name&gt;_amps (commas and quotes replaced).</summary>
    public static string Column(Trace t)
    {
        string name = t.Name.Replace(',', '_').Replace('"', '_');
        return t.Unit == "A" ? name + "_amps" : name + "_volts";
    }
}
