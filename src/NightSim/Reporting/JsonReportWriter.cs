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

        WriteTargets(w, report.Targets);
        w.WriteStartArray("nights");
        for (int ni = 0; ni < report.Nights.Count; ni++)
        {
            NightSummary n = report.Nights[ni];
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
            Targets.NightTargets? checks = ni < report.TargetResults.Count ? report.TargetResults[ni] : null;
            w.WriteBoolean("pass", Targets.NightsOverview.NightPasses(n, checks));
            w.WriteStartArray("targets");
            foreach (Targets.TargetCheck c in checks?.Checks ?? [])
            {
                w.WriteStartObject();
                w.WriteString("target", c.Target);
                w.WriteBoolean("pass", c.Pass);
                if (c.Margin is double m) w.WriteNumber("margin", Math.Round(m, 4)); else w.WriteNull("margin");
                w.WriteString("unit", c.Unit);
                w.WriteString("detail", c.Detail);
                w.WriteEndObject();
            }
            w.WriteEndArray();
            w.WriteEndObject();
        }
        w.WriteEndArray();

        WriteOverview(w, report.Overview);

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

        WriteContacts(w, report.Contacts);

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

    private static void WriteContacts(Utf8JsonWriter w, IReadOnlyList<ContactDuty> contacts)
    {
        w.WriteStartArray("contacts");
        foreach (ContactDuty d in contacts)
        {
            ContactFacts c = d.Facts;
            w.WriteStartObject();
            w.WriteString("part", c.PartId);
            w.WriteString("load", c.Load);
            if (c.Kind is null) w.WriteNull("loadKind"); else w.WriteString("loadKind", c.Kind);
            w.WriteNumber("loadPowerWatts", c.PowerWatts);
            w.WriteNumber("loadVoltage", c.Voltage);
            w.WriteNumber("powerFactor", c.PowerFactor);
            w.WriteBoolean("powerFactorStated", c.PowerFactorStated);
            w.WriteNumber("steadyCurrentAmps", Math.Round(c.SteadyCurrent, 6));
            WriteNumberOrNull(w, "inrushMultipleLow", double.IsNaN(c.InrushLow) ? null : c.InrushLow);
            WriteNumberOrNull(w, "inrushMultipleHigh", double.IsNaN(c.InrushHigh) ? null : c.InrushHigh);
            WriteNumberOrNull(w, "inrushSeconds", double.IsNaN(c.InrushSeconds) ? null : c.InrushSeconds);
            WriteNumberOrNull(w, "peakInrushAmps", c.PeakInrush is double p ? Math.Round(p, 6) : null);
            if (c.InrushSource is null) w.WriteNull("inrushSource"); else w.WriteString("inrushSource", c.InrushSource);
            WriteNumberOrNull(w, "contactCurrentAmps", c.ContactCurrent);
            WriteNumberOrNull(w, "contactVoltage", c.ContactVoltage);
            WriteNumberOrNull(w, "contactInrushLimitAmps", c.InrushLimit is double l ? Math.Round(l, 6) : null);
            w.WriteBoolean("contactInrushLimitStated", c.InrushLimitStated);
            WriteNumberOrNull(w, "contactLifeOperations", c.ContactLife);
            WriteFlagOrNull(w, "steadyWithinRating", d.SteadyWithinRating);
            WriteFlagOrNull(w, "inrushWithinRating", d.InrushWithinRating);
            WriteFlagOrNull(w, "voltageWithinRating", d.VoltageWithinRating);
            w.WriteBoolean("mayWeld", d.MayWeld);
            w.WriteNumber("operations", d.Operations);
            w.WriteNumber("chatterOperations", d.ChatterOperations);
            WriteNumberOrNull(w, "operationsPerNight", d.OperationsPerNight is double o ? Math.Round(o, 4) : null);
            WriteNumberOrNull(w, "lifeNights", d.LifeNights is double n ? Math.Round(n, 1) : null);
            WriteNumberOrNull(w, "lifeYears", d.LifeYears is double y ? Math.Round(y, 3) : null);
            WriteNumberOrNull(w, "lifeYearsWithoutChatter", d.LifeYearsWithoutChatter is double yw ? Math.Round(yw, 3) : null);
            w.WriteEndObject();
        }
        w.WriteEndArray();
    }

    private static void WriteFlagOrNull(Utf8JsonWriter w, string name, bool? v)
    {
        if (v is bool b) w.WriteBoolean(name, b); else w.WriteNull(name);
    }

    private static void WriteTargets(Utf8JsonWriter w, Sky.DesignTargets? t)
    {
        if (t is null)
        {
            w.WriteNull("targets");
            return;
        }
        w.WriteStartObject("targets");
        WriteNumberOrNull(w, "switchOnLuxMin", t.SwitchOnLuxMin);
        WriteNumberOrNull(w, "switchOnLuxMax", t.SwitchOnLuxMax);
        WriteNumberOrNull(w, "switchOnMinutesAfterSunset", t.SwitchOnMinutesAfterSunset);
        WriteNumberOrNull(w, "onTimeMinSeconds", t.OnTimeMin);
        WriteNumberOrNull(w, "onTimeMaxSeconds", t.OnTimeMax);
        if (t.OffBy is TimeSpan off) w.WriteString("offBy", $"{(int)off.TotalHours:00}:{off.Minutes:00}"); else w.WriteNull("offBy");
        w.WriteBoolean("noFalseTrigger", t.NoFalseTrigger);
        w.WriteBoolean("noEarlyOff", t.NoEarlyOff);
        w.WriteBoolean("noChatter", t.NoChatter);
        w.WriteBoolean("offAtSunrise", t.OffAtSunrise);
        w.WriteEndObject();
    }

    private static void WriteOverview(Utf8JsonWriter w, Targets.NightsOverview o)
    {
        w.WriteStartObject("summary");
        w.WriteNumber("nights", o.Nights);
        w.WriteNumber("nightsPassed", o.NightsPassed);
        w.WriteNumber("passRate", Math.Round(o.PassRate, 6));
        w.WriteNumber("missedNights", o.MissedNights);
        w.WriteNumber("falseTriggers", o.FalseTriggers);
        w.WriteNumber("earlyOffs", o.EarlyOffs);
        w.WriteNumber("chatterBursts", o.ChatterBursts);
        w.WriteNumber("nightsOnAfterSunrise", o.NightsOnAfterSunrise);
        WriteSwitchOn(w, "earliestSwitchOn", o.EarliestSwitchOn);
        WriteSwitchOn(w, "latestSwitchOn", o.LatestSwitchOn);
        WriteNumberOrNull(w, "onTimeMinSeconds", o.OnTimeMin is double a ? Math.Round(a, 3) : null);
        WriteNumberOrNull(w, "onTimeMaxSeconds", o.OnTimeMax is double b ? Math.Round(b, 3) : null);
        if (o.WorstNight is DateOnly d)
        {
            w.WriteString("worstNight", d.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture));
            w.WriteString("worstReason", o.WorstReason);
        }
        else
        {
            w.WriteNull("worstNight");
            w.WriteNull("worstReason");
        }
        w.WriteNumber("energyWh", Math.Round(o.EnergyWh, 4));
        w.WriteEndObject();
    }

    private static void WriteSwitchOn(Utf8JsonWriter w, string name, (DateTimeOffset At, double MinutesAfterSunset)? v)
    {
        if (v is null)
        {
            w.WriteNull(name);
            return;
        }
        w.WriteStartObject(name);
        w.WriteString("at", ReportText.Iso(v.Value.At));
        w.WriteNumber("minutesAfterSunset", Math.Round(v.Value.MinutesAfterSunset, 3));
        w.WriteEndObject();
    }

    private static void WriteNumberOrNull(Utf8JsonWriter w, string name, double? v)
    {
        if (v is double x) w.WriteNumber(name, x); else w.WriteNull(name);
    }

    private static void WriteTime(Utf8JsonWriter w, string name, DateTimeOffset? t)
    {
        if (t is null) w.WriteNull(name); else w.WriteString(name, ReportText.Iso(t.Value));
    }
}
