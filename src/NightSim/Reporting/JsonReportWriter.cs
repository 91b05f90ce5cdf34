using System.Text.Json;
using NightSim.Analysis;

namespace NightSim.Reporting;

/// <summary>
/// Writes report.json with stable keys (documented by docs/report.schema.json). Times are ISO 8601 local time with
/// offset. Only <c>statistics.cpuSeconds</c> varies between identical runs.
/// </summary>
public static class JsonReportWriter
{
    /// <summary>Write <paramref name="report"/> to <paramref name="path"/> atomically.</summary>
    public static void Write(NightReport report, string path) => AtomicFile.Write(path, s => Write(report, s));

    /// <summary>Write <paramref name="report"/> as indented UTF-8 JSON to <paramref name="stream"/>.</summary>
    public static void Write(NightReport report, Stream stream)
    {
        using var w = new Utf8JsonWriter(stream, new JsonWriterOptions
        {
            Indented = true,
            // Readable '+' in time offsets and plain Unicode in messages; the file is data, never embedded in HTML.
            Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        });
        w.WriteStartObject();
        w.WriteString("tool", report.Tool);
        w.WriteString("netlist", report.Netlist);
        if (report.Scenario is null) w.WriteNull("scenario"); else w.WriteString("scenario", report.Scenario);
        w.WriteString("circuit", report.CircuitName);
        if (report.SiteName is null) w.WriteNull("site"); else w.WriteString("site", report.SiteName);
        if (report.TimeZone is null) w.WriteNull("timeZone"); else w.WriteString("timeZone", report.TimeZone);
        w.WriteNumber("seed", report.Seed);
        w.WriteString("circuitHash", report.CircuitHash);

        w.WriteStartArray("nights");
        foreach (NightSummary n in report.Nights)
        {
            w.WriteStartObject();
            w.WriteString("date", n.Date.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture));
            w.WriteString("verdict", ReportText.Verdict(n));
            WriteTime(w, "sunset", n.Sunset);
            WriteTime(w, "civilDusk", n.CivilDusk);
            WriteTime(w, "civilDawn", n.CivilDawn);
            WriteTime(w, "sunrise", n.Sunrise);
            WriteTime(w, "switchLevelCrossing", n.SwitchLevelCrossing);
            if (n.SwitchLevelLux is double lux) w.WriteNumber("switchLevelLux", Math.Round(lux, 4)); else w.WriteNull("switchLevelLux");
            w.WriteStartArray("loadOn");
            foreach (LoadInterval on in n.LoadOn)
            {
                w.WriteStartObject();
                w.WriteString("start", ReportText.Iso(on.Start));
                WriteTime(w, "end", on.End);
                w.WriteNumber("durationSeconds", Math.Round(on.DurationSeconds, 3));
                w.WriteString("cause", ReportText.Cause(on.Cause));
                w.WriteBoolean("expected", on.Expected);
                w.WriteString("explanation", on.Explanation);
                w.WriteString("endedBy", on.EndedBy);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteNumber("falseTriggers", n.FalseTriggers);
            w.WriteNumber("earlyOffs", n.EarlyOffs);
            w.WriteNumber("chatterBursts", n.ChatterBursts);
            w.WriteNumber("relayOperations", n.RelayOperations);
            w.WriteBoolean("missed", n.Missed);
            w.WriteBoolean("onAfterSunrise", n.OnAfterSunrise);
            w.WriteNumber("loadEnergyWh", Math.Round(n.LoadEnergyWh, 4));
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("findings");
        foreach (Analysis.Finding f in report.Findings)
        {
            w.WriteStartObject();
            w.WriteString("severity", ReportText.Severity(f.Severity));
            w.WriteString("code", f.Code);
            w.WriteString("message", f.Message);
            if (f.Fix is null) w.WriteNull("fix"); else w.WriteString("fix", f.Fix);
            WriteTime(w, "at", f.At);
            if (f.Part is null) w.WriteNull("part"); else w.WriteString("part", f.Part);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("events");
        foreach (ReportEvent e in report.Events)
        {
            w.WriteStartObject();
            w.WriteString("kind", e.Kind);
            w.WriteString("start", ReportText.Iso(e.Start));
            w.WriteString("end", ReportText.Iso(e.End));
            w.WriteNumber("peak", e.Peak);
            w.WriteBoolean("drawnFromSeed", e.DrawnFromSeed);
            w.WriteString("description", e.Description);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartArray("parts");
        foreach (ReportPart p in report.Parts)
        {
            w.WriteStartObject();
            w.WriteString("id", p.Id);
            w.WriteString("kind", p.Kind);
            w.WriteStartObject("connections");
            foreach (KeyValuePair<string, string> c in p.Connections) w.WriteString(c.Key, c.Value);
            w.WriteEndObject();
            w.WriteStartObject("values");
            foreach (KeyValuePair<string, string> v in p.Values) w.WriteString(v.Key, v.Value);
            w.WriteEndObject();
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartObject("statistics");
        w.WriteNumber("acceptedSteps", report.Statistics.AcceptedSteps);
        w.WriteNumber("rejectedSteps", report.Statistics.RejectedSteps);
        w.WriteNumber("newtonIterations", report.Statistics.NewtonIterations);
        w.WriteNumber("events", report.Statistics.Events);
        w.WriteNumber("cpuSeconds", Math.Round(report.Statistics.CpuSeconds, 4));
        w.WriteEndObject();

        w.WriteStartArray("cautions");
        foreach (string c in report.Cautions) w.WriteStringValue(c);
        w.WriteEndArray();
        w.WriteEndObject();
    }

    private static void WriteTime(Utf8JsonWriter w, string name, DateTimeOffset? t)
    {
        if (t is null) w.WriteNull(name); else w.WriteString(name, ReportText.Iso(t.Value));
    }
}
