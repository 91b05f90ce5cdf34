using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using NightSim.Cli.Plotting;
using NightSim.Sky;

namespace NightSim.Cli.Commands;

/// <summary>
/// <c>nightsim sky</c>: sunset, twilight limits and sunrise of each night at a site, with the clock times at which
/// clear-sky illuminance (USNO Circular 171 model) crosses 100, 10 and 1 lux; optional plot.
/// </summary>
internal static class SkyCommand
{
    /// <summary>Levels whose crossing times are listed, lux.</summary>
    public static readonly double[] CrossingLevels = [100.0, 10.0, 1.0];

    /// <summary>Builds the verb. Output goes to <paramref name="output"/> / <paramref name="error"/> (console when null).</summary>
    public static Command Create(TextWriter? output = null, TextWriter? error = null)
    {
        var lat = CliNumbers.Real("--lat", "Latitude, degrees (north positive), -90 to 90 with a decimal point", -90, 90, "--lat 52.1");
        lat.Required = true;
        var lon = CliNumbers.Real("--lon", "Longitude, degrees (east positive), -180 to 180 with a decimal point", -180, 180, "--lon 8.6");
        lon.Required = true;
        var tz = new Option<string>("--tz") { Description = "IANA time zone, e.g. Europe/Berlin", Required = true };
        var date = new Option<string>("--date") { Description = "Date of the first night, YYYY-MM-DD", Required = true };
        var days = CliNumbers.Whole<int>("--days", "Number of nights, 1 to 3660", 1, 3660, "nights");
        days.DefaultValueFactory = _ => 1;
        var format = new Option<string>("--format") { Description = "Output format", DefaultValueFactory = _ => "text" };
        format.AcceptOnlyFromAmong("text", "json");
        var plot = new Option<string?>("--plot") { Description = "Draw illuminance against local time into an .svg or .png file" };

        var cmd = new Command("sky", "Sunset, twilight, sunrise and clear-sky illuminance crossings for a site and dates");
        cmd.Options.Add(lat);
        cmd.Options.Add(lon);
        cmd.Options.Add(tz);
        cmd.Options.Add(date);
        cmd.Options.Add(days);
        cmd.Options.Add(format);
        cmd.Options.Add(plot);
        cmd.SetAction(pr => CliErrors.Run(pr, (o, e) => Run(
            new SkySettings(pr.GetValue(lat), pr.GetValue(lon), pr.GetValue(tz)!, pr.GetValue(date)!, pr.GetValue(days),
                pr.GetValue(format) ?? "text", pr.GetValue(plot)),
            output ?? o, error ?? e)));
        return cmd;
    }

    /// <summary>Runs the verb; returns the exit code (0 ok, 1 a command-line mistake, 5 the plot could not be written).</summary>
    public static int Run(SkySettings s, TextWriter output, TextWriter error)
    {
        string? coordError = Site.ValidateCoordinates(s.Latitude, s.Longitude);
        if (coordError is not null) { error.WriteLine($"error: {coordError}"); return CliErrors.Usage; }
        if (!Site.TryFindTimeZone(s.TimeZone, out TimeZoneInfo zone, out string? tzError)) { error.WriteLine($"error: --tz: {tzError}"); return CliErrors.Usage; }
        if (!DateOnly.TryParseExact(s.Date, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out DateOnly first))
        {
            error.WriteLine($"error: --date: \"{CliNumbers.Clip(s.Date)}\" is not a date; write YYYY-MM-DD, e.g. 2026-12-21");
            return CliErrors.Usage;
        }
        if (s.Days < 1 || s.Days > 3660) { error.WriteLine("error: --days must be 1…3660"); return CliErrors.Usage; }
        if (first.Year < 1 + 1 || first.AddDays(s.Days + 1).Year > 9998)
        {
            error.WriteLine("error: --date: give a date between the years 2 and 9997");
            return CliErrors.Usage;
        }
        if (s.PlotFile is not null && !SkyPlot.IsSupported(s.PlotFile))
        {
            error.WriteLine($"error: --plot: \"{CliNumbers.Clip(s.PlotFile)}\" must end in .svg or .png");
            return CliErrors.Usage;
        }

        var site = new Site("site", s.Latitude, s.Longitude, zone);
        var nights = new List<(SolarEvents Events, IReadOnlyList<LuxCrossing> Crossings)>();
        for (int d = 0; d < s.Days; d++)
        {
            DateOnly date = first.AddDays(d);
            nights.Add((Twilight.ForNight(site, date), Twilight.LuxCrossings(site, date, CrossingLevels)));
        }

        if (s.PlotFile is not null)
        {
            string? plotError = SkyPlot.Write(s.PlotFile, site, first, s.Days, nights.Select(n => n.Events).ToList());
            if (plotError is not null) { error.WriteLine($"error: --plot: {plotError}. hint: check free disk space and that the folder exists and is writable"); return CliErrors.OutputFailed; }
        }

        if (s.Format == "json") output.Write(ToJson(nights));
        else output.Write(ToText(site, nights));
        if (s.PlotFile is not null && s.Format != "json") output.WriteLine($"plot written to {s.PlotFile}");
        return 0;
    }

    /// <summary>ISO 8601 local time with offset, or null.</summary>
    public static string? Iso(DateTimeOffset? t) => t?.ToString("yyyy-MM-dd'T'HH:mm:sszzz", CultureInfo.InvariantCulture);

    internal static string ToJson(IReadOnlyList<(SolarEvents Events, IReadOnlyList<LuxCrossing> Crossings)> nights)
    {
        using var ms = new MemoryStream();
        using (var w = new Utf8JsonWriter(ms, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartArray();
            foreach (var (e, crossings) in nights)
            {
                w.WriteStartObject();
                w.WriteString("date", e.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
                WriteTime(w, "sunset", e.Sunset);
                WriteTime(w, "sunrise", e.Sunrise);
                WriteTime(w, "civilDusk", e.CivilDusk);
                WriteTime(w, "civilDawn", e.CivilDawn);
                WriteTime(w, "nauticalDusk", e.NauticalDusk);
                WriteTime(w, "nauticalDawn", e.NauticalDawn);
                WriteTime(w, "astronomicalDusk", e.AstronomicalDusk);
                WriteTime(w, "astronomicalDawn", e.AstronomicalDawn);
                w.WriteStartArray("luxCrossings");
                foreach (LuxCrossing c in crossings)
                {
                    w.WriteStartObject();
                    w.WriteNumber("lux", c.Lux);
                    WriteTime(w, "dusk", c.Dusk);
                    WriteTime(w, "dawn", c.Dawn);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
                w.WriteEndObject();
            }
            w.WriteEndArray();
        }
        return Encoding.UTF8.GetString(ms.ToArray()) + Environment.NewLine;
    }

    private static void WriteTime(Utf8JsonWriter w, string name, DateTimeOffset? t)
    {
        if (t is null) w.WriteNull(name); else w.WriteString(name, Iso(t));
    }

    internal static string ToText(Site site, IReadOnlyList<(SolarEvents Events, IReadOnlyList<LuxCrossing> Crossings)> nights)
    {
        var sb = new StringBuilder();
        var ic = CultureInfo.InvariantCulture;
        sb.AppendLine(string.Create(ic, $"Site {Math.Abs(site.Latitude):F4}° {(site.Latitude >= 0 ? "N" : "S")}, {Math.Abs(site.Longitude):F4}° {(site.Longitude >= 0 ? "E" : "W")}, zone {site.TimeZone.Id}"));
        sb.AppendLine("Sun: NOAA/Meeus equations; illuminance: USNO Circular 171 model, clear sky, no Moon. \"none\" = does not happen that night.");
        foreach (var (e, crossings) in nights)
        {
            sb.AppendLine();
            sb.AppendLine($"Night of {e.Date.ToString("yyyy-MM-dd", ic)} ({e.Date.DayOfWeek.ToString()[..3]}), local noon to local noon");
            var (noon, nextNoon) = Twilight.NightWindow(site, e.Date);
            double hours = (nextNoon - noon).TotalHours;
            if (Math.Abs(hours - 24) > 1e-9)
                sb.AppendLine(string.Create(ic, $"  clocks change this night: {hours:G3} h from noon to noon (UTC{noon:zzz} → UTC{nextNoon:zzz})"));
            void Row(string label, DateTimeOffset? t) => sb.AppendLine($"  {label,-20} {Clock(e.Date, t)}");
            Row("sunset", e.Sunset);
            Row("civil dusk", e.CivilDusk);
            Row("nautical dusk", e.NauticalDusk);
            Row("astronomical dusk", e.AstronomicalDusk);
            Row("astronomical dawn", e.AstronomicalDawn);
            Row("nautical dawn", e.NauticalDawn);
            Row("civil dawn", e.CivilDawn);
            Row("sunrise", e.Sunrise);
            sb.AppendLine("  clear-sky illuminance crossings:");
            foreach (LuxCrossing c in crossings)
                sb.AppendLine(string.Create(ic, $"    {c.Lux,5:G4} lx   falls {Clock(e.Date, c.Dusk)}   rises {Clock(e.Date, c.Dawn)}"));
        }
        return sb.ToString();
    }

    private static string Clock(DateOnly night, DateTimeOffset? t)
    {
        if (t is not DateTimeOffset v) return "none".PadRight(25);
        string day = DateOnly.FromDateTime(v.DateTime) == night ? "      " : "(+1 d)";
        return $"{v.ToString("HH:mm:ss", CultureInfo.InvariantCulture)} {day} UTC{v.ToString("zzz", CultureInfo.InvariantCulture)}";
    }
}
