using System.Globalization;
using System.Text;
using System.Text.Json;
using NightSim.Sky.Events;
using NightSim.Text;

namespace NightSim.Sky;

/// <summary>
/// Reads a scenario JSON file (our format, netlists/scenario.schema.json). Comments and trailing commas are allowed.
/// Every problem is collected with file, line:column, JSON path and a hint; nothing is thrown for bad input unless
/// <see cref="LoadOrThrow"/> is used.
/// </summary>
public static class ScenarioLoader
{
    /// <summary>Shortest event length accepted in minutes (one second): shorter passes only multiply breakpoints.</summary>
    public const double MinEventMinutes = 1.0 / 60.0;

    /// <summary>Earliest year a scenario may start in.</summary>
    public const int FirstYear = 1900;

    /// <summary>Latest year a scenario may start in (its nights may run on into the next years).</summary>
    public const int LastYear = 2200;

    /// <summary>Longest headlight pass, rise or fall and longest noise pulse, seconds (one hour): longer is no pass or
    /// pulse but steady light or a supply fault, and would reach past the run.</summary>
    public const double MaxPulseSeconds = 3600;

    private static readonly string[] s_topLevel =
        ["$schema", "name", "description", "site", "start", "nights", "seed", "sensor", "channels", "weather", "events", "lightLog", "targets", "weatherMix"];

    /// <summary>Loads <paramref name="path"/>; the scenario or null with the errors.</summary>
    public static LightScenario? Load(string path, out IReadOnlyList<ScenarioError> errors, LightEventCatalog? catalog = null)
    {
        string name = path;
        byte[]? bytes;
        string? tooBig;
        try
        {
            bytes = Utf8Check.ReadBounded(path, InputLimits.MaxInputBytes, out tooBig);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            errors = [new ScenarioError(path, "$", $"cannot read the file: {ex.Message.TrimEnd('.')}", "check the path")];
            return null;
        }
        if (bytes is null)
        {
            errors = [new ScenarioError(path, "$", "the file " + tooBig, "give a scenario JSON file; an input file may hold at most 64 MB")];
            return null;
        }
        string dir = Path.GetDirectoryName(Path.GetFullPath(path)) ?? Directory.GetCurrentDirectory();
        return Parse(bytes, name, dir, out errors, catalog, path);
    }

    /// <summary>Loads <paramref name="path"/> or throws <see cref="ScenarioException"/> with every problem.</summary>
    public static LightScenario LoadOrThrow(string path, LightEventCatalog? catalog = null)
        => Load(path, out var errors, catalog) ?? throw new ScenarioException(errors);

    /// <summary>Parses scenario JSON text.</summary>
    /// <param name="fileName">Name used in messages.</param>
    /// <param name="baseDirectory">Directory for relative light-log paths.</param>
    public static LightScenario? Parse(string json, string fileName, string? baseDirectory, out IReadOnlyList<ScenarioError> errors,
        LightEventCatalog? catalog = null)
        => Parse(Encoding.UTF8.GetBytes(json), fileName, baseDirectory, out errors, catalog, null);

    private static LightScenario? Parse(byte[] utf8, string fileName, string? baseDirectory, out IReadOnlyList<ScenarioError> errors,
        LightEventCatalog? catalog, string? sourceFile)
    {
        catalog ??= LightEventCatalog.Default;
        if ((Utf8Check.Problem(utf8) ?? JsonEscapeCheck.Problem(utf8)) is { } bad)
        {
            errors = [new ScenarioError(fileName, "$", bad.Message, bad.Hint, bad.Line, bad.Column)];
            return null;
        }
        var locator = new JsonLocator(utf8);
        var ctx = new ScenarioParseContext(fileName, locator, baseDirectory);
        JsonDocument doc;
        try
        {
            ReadOnlySpan<byte> span = utf8;
            if (span.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF])) span = span[3..];
            doc = JsonDocument.Parse(span.ToArray(), new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
        }
        catch (JsonException ex)
        {
            int line = (int)(ex.LineNumber ?? -1) + 1, col = (int)(ex.BytePositionInLine ?? -1) + 1;
            string what = FirstSentence(ex.Message);
            int cut = what.IndexOf(" LineNumber:", StringComparison.Ordinal);
            if (cut > 0) what = what[..cut].TrimEnd('.', ' ');
            bool early = what.Contains("end of data", StringComparison.Ordinal) || what.Contains("depth to be zero", StringComparison.Ordinal);
            errors = [new ScenarioError(fileName, "$", $"not valid JSON: {what}",
                early ? "the file ends before the JSON does: is it complete (cut short while copying or saving)? else check the closing brackets"
                      : "check brackets, commas and quotes near this place", line, col)];
            return null;
        }
        using (doc)
        {
            LightScenario? s = Read(doc.RootElement, ctx, catalog, sourceFile);
            errors = ctx.Errors;
            return errors.Count == 0 ? s : null;
        }
    }

    private static string FirstSentence(string message)
    {
        int i = message.IndexOf(" Path:", StringComparison.Ordinal);
        return i > 0 ? message[..i].Trim() : message.Trim();
    }

    private static LightScenario? Read(JsonElement root, ScenarioParseContext ctx, LightEventCatalog catalog, string? sourceFile)
    {
        if (!ctx.ExpectObject(root, "$")) return null;
        ctx.CheckProperties(root, "$", s_topLevel);
        string name = DisplayText.Clean(ctx.String(root, "$", "name") ?? Path.GetFileNameWithoutExtension(ctx.FileName));
        string description = DisplayText.Clean(ctx.String(root, "$", "description") ?? "");

        Site? site = ReadSite(root, ctx);

        DateOnly start = default;
        string? startText = ctx.String(root, "$", "start", required: true);
        if (startText is not null && !DateOnly.TryParseExact(startText, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out start))
            ctx.Error("$.start", $"\"{startText}\" is not a date", "write the date of the first night as \"YYYY-MM-DD\"");
        else if (startText is not null && (start.Year < FirstYear || start.Year > LastYear))
            ctx.Error("$.start", string.Create(CultureInfo.InvariantCulture, $"the year {start.Year} is outside {FirstYear}…{LastYear}"),
                "the sun and moon positions are computed for those years; write a date in them, e.g. \"2026-11-20\"");
        int nights = (int)(ctx.Integer(root, "$", "nights", min: 1, max: InputLimits.MaxNights) ?? 1);
        long? seedValue = ctx.Integer(root, "$", "seed", min: 0);
        ulong seed = seedValue is long sv ? (ulong)sv : LightScenario.DefaultSeed;

        var channels = ReadChannels(root, ctx);
        Weather weather = ReadWeather(root, ctx);

        var events = new List<IEventDefinition>();
        if (root.TryGetProperty("events", out JsonElement evs))
        {
            if (evs.ValueKind != JsonValueKind.Array) ctx.Error("$.events", "expected an array of events", "write \"events\": [ { \"kind\": \"headlights\", … } ]");
            else
            {
                int i = 0;
                foreach (JsonElement e in evs.EnumerateArray())
                {
                    string path = $"$.events[{i++}]";
                    if (!ctx.ExpectObject(e, path)) continue;
                    string? kind = ctx.String(e, path, "kind", required: true);
                    if (kind is null) continue;
                    EventParser? parser = catalog.Find(kind);
                    if (parser is null)
                    {
                        ctx.Error($"{path}.kind", $"unknown event kind \"{kind}\"", $"known kinds: {string.Join(", ", catalog.Kinds)}");
                        continue;
                    }
                    IEventDefinition? def = parser(e, path, ctx);
                    if (def is null) continue;
                    if (def.Channel is string ch && !channels.Any(c => c.Name == ch))
                    {
                        ctx.Error($"{path}.channel", $"unknown channel \"{ch}\"", $"channels: {string.Join(", ", channels.Select(c => c.Name))}");
                        continue;
                    }
                    events.Add(def);
                }
            }
        }

        RecordedLightLog? log = null;
        LightLogMode mode = LightLogMode.Replace;
        bool atSensor = false;
        var warnings = new List<ScenarioError>();
        if (root.TryGetProperty("lightLog", out JsonElement ll) && ctx.ExpectObject(ll, "$.lightLog"))
        {
            ctx.CheckProperties(ll, "$.lightLog", "file", "mode", "timeZone", "atSensor");
            string? file = ctx.String(ll, "$.lightLog", "file", required: true);
            string modeText = ctx.String(ll, "$.lightLog", "mode") ?? "replace";
            if (modeText == "add") mode = LightLogMode.Add;
            else if (modeText != "replace") ctx.Error("$.lightLog.mode", $"\"{modeText}\" is not a log mode", "write \"replace\" or \"add\"");
            string tzText = ctx.String(ll, "$.lightLog", "timeZone") ?? "local";
            if (tzText is not ("local" or "utc")) ctx.Error("$.lightLog.timeZone", $"\"{tzText}\" is not a log time base", "write \"local\" (the site's zone) or \"utc\"");
            atSensor = ctx.Bool(ll, "$.lightLog", "atSensor") ?? false;
            if (file is not null && site is not null)
            {
                string full = Path.IsPathRooted(file) ? file : Path.Combine(ctx.BaseDirectory, file);
                if (!File.Exists(full)) ctx.Error("$.lightLog.file", $"light log \"{file}\" not found", $"looked in {ctx.BaseDirectory}; paths are relative to the scenario file");
                else
                {
                    byte[]? logBytes = null;
                    string? logProblem;
                    try
                    {
                        logBytes = Utf8Check.ReadBounded(full, InputLimits.MaxLightLogBytes, out logProblem);
                    }
                    catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
                    {
                        logProblem = "cannot be read: " + ex.Message.TrimEnd('.');
                    }
                    Utf8Check.Finding? badText = logBytes is null ? null : Utf8Check.Problem(logBytes);
                    if (logBytes is null)
                        ctx.Error("$.lightLog.file", $"light log \"{file}\" {logProblem}", "a light log is a regular CSV file of at most 64 MB and 1 000 000 rows");
                    else if (badText is not null)
                        ctx.AddRange([new ScenarioError(file, "$", badText.Message, badText.Hint, badText.Line, badText.Column)]);
                    else
                    {
                        log = RecordedLightLog.Parse(Utf8Check.Decode(logBytes), file, site.TimeZone, tzText == "utc", out var logErrors);
                        ctx.AddRange(logErrors);
                        if (log is not null) warnings.AddRange(log.Warnings);
                    }
                }
            }
        }

        DesignTargets? targets = root.TryGetProperty("targets", out JsonElement tg) ? TargetsReader.Read(tg, "$.targets", ctx) : null;
        WeatherMix? mix = root.TryGetProperty("weatherMix", out JsonElement wm) ? WeatherMix.Read(wm, "$.weatherMix", ctx) : null;

        if (site is null || startText is null || ctx.Errors.Count > 0) return null;
        return new LightScenario
        {
            Name = name, Description = description, Site = site, Start = start, Nights = nights,
            Seed = seed, SeedGiven = seedValue is not null, Channels = channels, Weather = weather, Events = events,
            LightLog = log, LightLogMode = mode, LightLogAtSensor = atSensor, SourceFile = sourceFile, Warnings = warnings,
            Targets = targets, WeatherMix = mix,
        };
    }

    private static Site? ReadSite(JsonElement root, ScenarioParseContext ctx)
    {
        if (!root.TryGetProperty("site", out JsonElement s))
        {
            ctx.Error("$", "missing required property \"site\"", "\"site\": { \"latitude\": 52.1, \"longitude\": 8.6, \"timeZone\": \"Europe/Berlin\" }");
            return null;
        }
        if (!ctx.ExpectObject(s, "$.site")) return null;
        ctx.CheckProperties(s, "$.site", "name", "latitude", "longitude", "timeZone", "elevation");
        string siteName = DisplayText.Clean(ctx.String(s, "$.site", "name") ?? "site");
        double? lat = ctx.Number(s, "$.site", "latitude", "deg", required: true, min: -90, max: 90);
        double? lon = ctx.Number(s, "$.site", "longitude", "deg", required: true, min: -180, max: 180);
        double elevation = ctx.Number(s, "$.site", "elevation", null) ?? 0.0;
        string? tz = ctx.String(s, "$.site", "timeZone", required: true);
        TimeZoneInfo? zone = null;
        if (tz is not null)
        {
            if (Site.TryFindTimeZone(tz, out TimeZoneInfo z, out string? err)) zone = z;
            else ctx.Error("$.site.timeZone", err!, "IANA zone names are case-sensitive, e.g. \"Europe/Berlin\"");
        }
        if (lat is null || lon is null || zone is null) return null;
        return new Site(siteName, lat.Value, lon.Value, zone, elevation);
    }

    private static List<LightChannel> ReadChannels(JsonElement root, ScenarioParseContext ctx)
    {
        double exposure = 1.0;
        if (root.TryGetProperty("sensor", out JsonElement sensor) && ctx.ExpectObject(sensor, "$.sensor"))
        {
            ctx.CheckProperties(sensor, "$.sensor", "exposure");
            exposure = ctx.Number(sensor, "$.sensor", "exposure", null, min: 0, max: 10) ?? 1.0;
        }
        var list = new List<LightChannel> { new(LightScenario.DefaultChannel, exposure) };
        if (root.TryGetProperty("channels", out JsonElement chans) && ctx.ExpectObject(chans, "$.channels"))
        {
            foreach (JsonProperty p in chans.EnumerateObject())
            {
                string path = $"$.channels.{p.Name}";
                if (p.Name == LightScenario.DefaultChannel) { ctx.Error(path, "\"sensor\" is the default channel", "set its exposure under the top-level \"sensor\""); continue; }
                if (!ctx.ExpectObject(p.Value, path)) continue;
                ctx.CheckProperties(p.Value, path, "exposure");
                double? e = ctx.Number(p.Value, path, "exposure", null, required: true, min: 0, max: 10);
                if (e is not null) list.Add(new LightChannel(p.Name, e.Value));
            }
        }
        return list;
    }

    private static Weather ReadWeather(JsonElement root, ScenarioParseContext ctx)
    {
        if (!root.TryGetProperty("weather", out JsonElement w) || !ctx.ExpectObject(w, "$.weather")) return Weather.Clear;
        ctx.CheckProperties(w, "$.weather", "sky", "clouds", "moon", "moonLux", "floorLux");
        double sky = 1.0;
        if (w.TryGetProperty("sky", out JsonElement sk))
        {
            if (sk.ValueKind == JsonValueKind.String && !double.IsNaN(Weather.NamedSkyFactor(sk.GetString()!))) sky = Weather.NamedSkyFactor(sk.GetString()!);
            else if (sk.ValueKind == JsonValueKind.Number && sk.TryGetDouble(out double factor) && double.IsFinite(factor) && factor >= 1.0) sky = factor;
            else ctx.Error("$.weather.sky", $"{ScenarioParseContext.Describe(sk)} is not a sky", "write \"clear\", \"thin\", \"cloudy\", \"overcast\" or a factor ≥ 1 (10 = dark stratus)");
        }
        CloudDefinition? clouds = null;
        if (w.TryGetProperty("clouds", out JsonElement c) && ctx.ExpectObject(c, "$.weather.clouds"))
        {
            ctx.CheckProperties(c, "$.weather.clouds", "perHour", "depth", "minutes");
            double? perHour = ctx.Number(c, "$.weather.clouds", "perHour", null, required: true, min: 0);
            double depth = ctx.Number(c, "$.weather.clouds", "depth", null, min: 0, max: 1) ?? 0.5;
            double minutes = ctx.Number(c, "$.weather.clouds", "minutes", null, min: MinEventMinutes, max: 24 * 60) ?? 10.0;
            if (perHour is not null && perHour.Value * 24 > InputLimits.MaxEventsPerNight)
            {
                ctx.Error("$.weather.clouds.perHour", $"{perHour.Value.ToString("G4", CultureInfo.InvariantCulture)} clouds per hour would be more than the limit of {InputLimits.MaxEventsPerNight} events per night",
                    "passing clouds come a few to a few dozen per hour, e.g. \"perHour\": 6");
                perHour = null;
            }
            if (perHour is not null) clouds = new CloudDefinition(perHour.Value, depth, minutes);
        }
        bool modeledMoon = false;
        if (w.TryGetProperty("moon", out JsonElement m))
        {
            if (m.ValueKind == JsonValueKind.True) modeledMoon = true;
            else if (m.ValueKind != JsonValueKind.False) ctx.Error("$.weather.moon", "expected true or false", "true = the real Moon for the site and dates; or give a constant \"moonLux\"");
        }
        double moon = ctx.Number(w, "$.weather", "moonLux", "lx", min: 0, max: 1) ?? 0.0;
        if (modeledMoon && moon > 0)
            ctx.Error("$.weather.moonLux", "give either \"moon\": true or a constant \"moonLux\", not both", "\"moon\": true computes the Moon's position and phase");
        double floor = ctx.Number(w, "$.weather", "floorLux", "lx", min: 0) ?? 0.0;
        return new Weather(sky, clouds, moon, floor, modeledMoon);
    }
}
