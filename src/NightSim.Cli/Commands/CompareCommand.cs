using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using NightSim.Reporting;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim compare A/report.json B/report.json`: what changed in the parts and in the outcomes, night by night.</summary>
internal static class CompareCommand
{
    public static Command Create()
    {
        var a = new Argument<FileInfo>("A") { Description = "The first report.json (e.g. out/before/report.json)." };
        var b = new Argument<FileInfo>("B") { Description = "The second report.json (e.g. out/after/report.json)." };
        var command = new Command("compare", "Compare two night-run reports (report.json): the parts that changed, then each night's switch-on, switch-off and problems side by side. Exit 2 when a file is not a report.");
        command.Arguments.Add(a);
        command.Arguments.Add(b);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) => Execute(pr.GetValue(a)!, pr.GetValue(b)!, output, error)));
        return command;
    }

    private sealed record Part(string Id, string Kind, string Connections, Dictionary<string, string> Values);

    private sealed record Night(string Date, string Verdict, DateTimeOffset? On, DateTimeOffset? Off, double? Duration, int FalseTriggers,
        int EarlyOffs, int Chatter, bool Missed, bool OnAfterSunrise, double EnergyWh, double? SwitchLux);

    private sealed record Report(string Path, string Circuit, string Netlist, string? Scenario, ulong Seed, string Hash, List<Part>? Parts, List<Night> Nights);

    private static int Execute(FileInfo a, FileInfo b, TextWriter output, TextWriter error)
    {
        var problems = new List<string>();
        Report? ra = Read(a.ToString(), problems), rb = Read(b.ToString(), problems);
        if (ra is null || rb is null)
        {
            foreach (string p in problems) error.WriteLine(p);
            return CliErrors.InvalidInput;
        }

        output.WriteLine($"A: {ra.Path}  ({ra.Circuit}, netlist {ra.Netlist}, seed {ra.Seed})");
        output.WriteLine($"B: {rb.Path}  ({rb.Circuit}, netlist {rb.Netlist}, seed {rb.Seed})");
        if (ra.Scenario != rb.Scenario || ra.Seed != rb.Seed)
            output.WriteLine($"note: different scenario files or seeds ({ra.Scenario ?? "none"}, seed {ra.Seed} → {rb.Scenario ?? "none"}, seed {rb.Seed}): outcomes may also differ because of them");
        output.WriteLine();

        output.WriteLine("Parts");
        if (ra.Hash.Length > 0 && ra.Hash == rb.Hash) output.WriteLine($"  same circuit (hash {Short(ra.Hash)})");
        else if (ra.Parts is null || rb.Parts is null) output.WriteLine("  one of the reports lists no parts (written by an older nightsim): run it again to compare parts");
        else
        {
            List<string> lines = PartChanges(ra.Parts, rb.Parts);
            output.WriteLine($"  circuit hash {Short(ra.Hash)} → {Short(rb.Hash)}: {lines.Count} change{(lines.Count == 1 ? "" : "s")}");
            foreach (string l in lines) output.WriteLine("  " + l);
        }
        output.WriteLine();

        output.WriteLine("Nights");
        var dates = ra.Nights.Select(n => n.Date).Union(rb.Nights.Select(n => n.Date)).Order(StringComparer.Ordinal).ToList();
        int changed = 0;
        foreach (string date in dates)
        {
            Night? na = ra.Nights.FirstOrDefault(n => n.Date == date), nb = rb.Nights.FirstOrDefault(n => n.Date == date);
            if (na is null || nb is null)
            {
                output.WriteLine($"  {date}: only in {(na is null ? "B" : "A")}: {(na ?? nb)!.Verdict}");
                continue;
            }
            List<string> diffs = NightChanges(na, nb);
            if (diffs.Count == 0)
            {
                output.WriteLine($"  {date}: unchanged: {na.Verdict}");
                continue;
            }
            changed++;
            output.WriteLine($"  {date}: {string.Join("; ", diffs)}");
            output.WriteLine($"    A: {na.Verdict}");
            output.WriteLine($"    B: {nb.Verdict}");
        }
        output.WriteLine();
        output.WriteLine(changed == 0 ? "No night's outcome changed." : $"{changed} of {dates.Count} night{(dates.Count == 1 ? "" : "s")} changed.");
        return CliErrors.Success;
    }

    private static string Short(string hash) => hash.Length > 12 ? hash[..12] : hash.Length == 0 ? "(none)" : hash;

    private static List<string> PartChanges(List<Part> a, List<Part> b)
    {
        var lines = new List<string>();
        var byIdB = b.ToDictionary(p => p.Id, StringComparer.Ordinal);
        var byIdA = a.ToDictionary(p => p.Id, StringComparer.Ordinal);
        foreach (Part pa in a)
        {
            if (!byIdB.TryGetValue(pa.Id, out Part? pb))
            {
                lines.Add($"- {pa.Id} ({pa.Kind}) removed; was {pa.Connections}{Values(pa)}");
                continue;
            }
            if (pa.Kind != pb.Kind) lines.Add($"~ {pa.Id}: kind {pa.Kind} → {pb.Kind}");
            if (pa.Connections != pb.Connections) lines.Add($"~ {pa.Id}: connections {pa.Connections} → {pb.Connections}");
            foreach (string name in pa.Values.Keys.Union(pb.Values.Keys))
            {
                string va = pa.Values.GetValueOrDefault(name) ?? "default", vb = pb.Values.GetValueOrDefault(name) ?? "default";
                if (va != vb) lines.Add($"~ {pa.Id} ({pa.Kind}): {name} {va} → {vb}");
            }
        }
        foreach (Part pb in b.Where(p => !byIdA.ContainsKey(p.Id)))
            lines.Add($"+ {pb.Id} ({pb.Kind}) added: {pb.Connections}{Values(pb)}");
        return lines;
    }

    private static string Values(Part p) => p.Values.Count == 0 ? "" : "; " + string.Join(", ", p.Values.Select(v => v.Key + " " + v.Value));

    private static List<string> NightChanges(Night a, Night b)
    {
        var d = new List<string>();
        if (a.Missed != b.Missed) d.Add(b.Missed ? "now MISSED" : "no longer missed");
        if (a.On != b.On) d.Add($"on {Clock(a.On)} → {Clock(b.On)}{Shift(a.On, b.On)}");
        if (a.Off != b.Off) d.Add($"off {Clock(a.Off)} → {Clock(b.Off)}{Shift(a.Off, b.Off)}");
        if (a.Duration is double da && b.Duration is double db && Math.Abs(da - db) >= 1)
            d.Add($"on-time {ReportText.Duration(da)} → {ReportText.Duration(db)}");
        if (a.SwitchLux != b.SwitchLux && a.SwitchLux is double la && b.SwitchLux is double lb)
            d.Add($"switching level {ReportText.Lux(la)} → {ReportText.Lux(lb)} lx");
        if (a.FalseTriggers != b.FalseTriggers) d.Add($"false triggers {a.FalseTriggers} → {b.FalseTriggers}");
        if (a.EarlyOffs != b.EarlyOffs) d.Add($"early offs {a.EarlyOffs} → {b.EarlyOffs}");
        if (a.Chatter != b.Chatter) d.Add($"chatter bursts {a.Chatter} → {b.Chatter}");
        if (a.OnAfterSunrise != b.OnAfterSunrise) d.Add(b.OnAfterSunrise ? "now still on at sunrise" : "no longer on at sunrise");
        if (d.Count == 0 && Math.Abs(a.EnergyWh - b.EnergyWh) >= 0.01)
            d.Add($"energy {a.EnergyWh.ToString("0.00", CultureInfo.InvariantCulture)} → {b.EnergyWh.ToString("0.00", CultureInfo.InvariantCulture)} Wh");
        return d;
    }

    private static string Clock(DateTimeOffset? t) => t is null ? "never" : ReportText.Clock(t);

    private static string Shift(DateTimeOffset? a, DateTimeOffset? b)
    {
        if (a is null || b is null) return "";
        double s = (b.Value - a.Value).TotalSeconds;
        return $" ({(s >= 0 ? "+" : "−")}{ReportText.Duration(Math.Abs(s))})";
    }

    private static Report? Read(string path, List<string> problems)
    {
        if (!File.Exists(path))
        {
            problems.Add($"{path}: error: file not found. hint: give the report.json a `nightsim simulate … --out DIR` wrote, e.g. DIR/report.json");
            return null;
        }
        try
        {
            using JsonDocument doc = JsonDocument.Parse(NightSim.Text.Utf8Check.ReadAllBounded(path, InputLimits.MaxReportBytes), new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
            JsonElement r = doc.RootElement;
            if (r.ValueKind != JsonValueKind.Object || !r.TryGetProperty("nights", out JsonElement nights) || nights.ValueKind != JsonValueKind.Array)
            {
                problems.Add($"{path}: error at $: not a night-run report (no \"nights\" list). hint: give the report.json of `nightsim simulate`");
                return null;
            }
            List<Part>? parts = null;
            if (r.TryGetProperty("parts", out JsonElement ps) && ps.ValueKind == JsonValueKind.Array)
            {
                parts = [.. ps.EnumerateArray().Select(p => new Part(
                    p.GetProperty("id").GetString()!, p.GetProperty("kind").GetString()!,
                    string.Join(", ", p.GetProperty("connections").EnumerateObject().Select(c => c.Name + " " + c.Value.GetString())),
                    p.GetProperty("values").EnumerateObject().ToDictionary(v => v.Name, v => v.Value.GetString() ?? "", StringComparer.Ordinal)))];
            }
            var list = new List<Night>();
            foreach (JsonElement n in nights.EnumerateArray())
            {
                JsonElement[] on = [.. n.GetProperty("loadOn").EnumerateArray()];
                JsonElement? first = on.Cast<JsonElement?>().FirstOrDefault(i => i!.Value.GetProperty("expected").GetBoolean()) ?? (on.Length > 0 ? on[0] : null);
                list.Add(new Night(
                    n.GetProperty("date").GetString()!,
                    n.TryGetProperty("verdict", out JsonElement v) ? v.GetString()! : $"{on.Length} switch-on(s)",
                    Time(first, "start"), Time(first, "end"),
                    first?.GetProperty("durationSeconds").GetDouble(),
                    Int(n, "falseTriggers"), Int(n, "earlyOffs"), Int(n, "chatterBursts"),
                    Bool(n, "missed"), Bool(n, "onAfterSunrise"),
                    n.TryGetProperty("loadEnergyWh", out JsonElement e) ? e.GetDouble() : 0,
                    n.TryGetProperty("switchLevelLux", out JsonElement l) && l.ValueKind == JsonValueKind.Number ? l.GetDouble() : null));
            }
            return new Report(path, Str(r, "circuit") ?? "?", Str(r, "netlist") ?? "?", Str(r, "scenario"),
                r.TryGetProperty("seed", out JsonElement seed) ? seed.GetUInt64() : 0, Str(r, "circuitHash") ?? "", parts, list);
        }
        catch (JsonException ex)
        {
            problems.Add($"{path}:{(ex.LineNumber ?? 0) + 1}:{(ex.BytePositionInLine ?? 0) + 1}: error at $: not JSON. hint: give the report.json of `nightsim simulate`, not trace.csv or a netlist");
            return null;
        }
        catch (Exception ex) when (ex is InvalidOperationException or KeyNotFoundException or FormatException)
        {
            problems.Add($"{path}: error: not a readable night-run report ({ex.Message.ReplaceLineEndings(" ")}). hint: give the report.json of `nightsim simulate`");
            return null;
        }
    }

    private static string? Str(JsonElement e, string name) => e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.String ? v.GetString() : null;
    private static int Int(JsonElement e, string name) => e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.Number ? v.GetInt32() : 0;
    private static bool Bool(JsonElement e, string name) => e.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.True;

    private static DateTimeOffset? Time(JsonElement? interval, string name) =>
        interval is JsonElement i && i.TryGetProperty(name, out JsonElement v) && v.ValueKind == JsonValueKind.String ? v.GetDateTimeOffset() : null;
}
