using System.Globalization;
using System.Text;

namespace NightSim.Reporting;

/// <summary>
/// Writes trace.csv: run time in seconds, ISO 8601 local clock time, then one column per traced quantity.
/// Comma-separated, '.' decimal point whatever the machine's culture, LF line ends, UTF-8 without BOM.
/// </summary>
public static class CsvTraceWriter
{
    /// <summary>Header of the run-time column (seconds since the run's origin).</summary>
    public const string TimeColumn = "time_s";

    /// <summary>Header of the local clock-time column.</summary>
    public const string ClockColumn = "clock";

    /// <summary>Write <paramref name="table"/> to <paramref name="path"/> atomically.</summary>
    public static void Write(TraceTable table, string path)
    {
        table.Validate();
        AtomicFile.Write(path, s =>
        {
            using var w = new StreamWriter(s, new UTF8Encoding(false), 1 << 16);
            Write(table, w);
        });
    }

    /// <summary>Write <paramref name="table"/> as CSV text to <paramref name="writer"/>.</summary>
    public static void Write(TraceTable table, TextWriter writer)
    {
        table.Validate();
        CultureInfo inv = CultureInfo.InvariantCulture;
        var line = new StringBuilder(256);
        line.Append(TimeColumn).Append(',').Append(ClockColumn);
        foreach (string name in table.Names) line.Append(',').Append(Quote(name));
        writer.Write(line.Append('\n'));

        for (int r = 0; r < table.Times.Length; r++)
        {
            line.Clear();
            double t = table.Times[r];
            // The run time exactly (round trip: a row 1 ns after a switching edge keeps its own time); the clock column to
            // the millisecond.
            line.Append(t.ToString("R", inv)).Append(',');
            line.Append(ClockTime.At(table.Origin, table.TimeZone, t).ToString("yyyy-MM-dd'T'HH:mm:ss.fffzzz", inv));
            for (int c = 0; c < table.Columns.Count; c++)
            {
                line.Append(',');
                double v = table.Columns[c][r];
                if (double.IsFinite(v)) line.Append(v.ToString("G9", inv));
            }
            writer.Write(line.Append('\n'));
        }
        writer.Flush();
    }

    /// <summary>RFC 4180 quoting: fields with a comma, quote or line break are quoted, quotes doubled.</summary>
    private static string Quote(string field) =>
        field.AsSpan().IndexOfAny(",\"\n\r") < 0 ? field : "\"" + field.Replace("\"", "\"\"") + "\"";
}
