using System.CommandLine;
using NightSim.Netlist;
using NightSim.Reporting;
using NightSim.Sky;

namespace NightSim.Cli.Commands;

/// <summary>`nightsim init [--template NAME] [--lat --lon --tz] [--date] DIR`: write a commented starting netlist and
/// scenario (and the two JSON Schemas editors validate against) into DIR, ready for `check` and `simulate`.</summary>
internal static class InitCommand
{
    public static Command Create()
    {
        var dir = new Argument<DirectoryInfo>("DIR") { Description = "Folder to write the starting files into (created if missing)." };
        var template = new Option<string>("--template", "-t")
        {
            Description = "Starting design: " + string.Join("; ", StarterTemplates.All.Select(t => $"{t.Name} ({t.Summary})")) + ".",
            DefaultValueFactory = _ => StarterTemplates.All[0].Name,
            HelpName = "NAME",
        };
        template.AcceptOnlyFromAmong([.. StarterTemplates.All.Select(t => t.Name)]);
        var lat = new Option<double?>("--lat") { Description = "Site latitude, degrees (north positive). Give --lat, --lon and --tz together; default: an invented site at 51.3 N 9.5 E, Europe/Berlin.", HelpName = "DEG" };
        var lon = new Option<double?>("--lon") { Description = "Site longitude, degrees (east positive).", HelpName = "DEG" };
        var tz = new Option<string?>("--tz") { Description = "Site IANA time zone, e.g. Europe/Berlin.", HelpName = "ZONE" };
        var name = new Option<string?>("--site") { Description = "Site name written into the scenario.", HelpName = "TEXT" };
        var date = new Option<string>("--date")
        {
            Description = "Date of the first night, YYYY-MM-DD.",
            DefaultValueFactory = _ => StarterTemplates.DefaultDate,
            HelpName = "DATE",
        };
        var command = new Command("init", "Start a design: write a commented netlist and scenario for a usual arrangement into DIR, ready for `nightsim check` and `nightsim simulate`. Existing files are never overwritten.");
        command.Arguments.Add(dir);
        command.Options.Add(template);
        command.Options.Add(lat);
        command.Options.Add(lon);
        command.Options.Add(tz);
        command.Options.Add(name);
        command.Options.Add(date);
        command.SetAction(pr => CliErrors.Run(pr, (output, error) => Execute(pr.GetValue(dir)!, pr.GetValue(template)!,
            pr.GetValue(lat), pr.GetValue(lon), pr.GetValue(tz), pr.GetValue(name), pr.GetValue(date)!, output, error)));
        return command;
    }

    private static int Execute(DirectoryInfo dir, string templateName, double? lat, double? lon, string? tz, string? siteName, string date,
        TextWriter output, TextWriter error)
    {
        StarterTemplates.Template template = StarterTemplates.All.First(t => t.Name == templateName);
        var site = StarterTemplates.DefaultSite;
        int given = (lat is null ? 0 : 1) + (lon is null ? 0 : 1) + (tz is null ? 0 : 1);
        if (given is 1 or 2)
        {
            error.WriteLine("nightsim init: give --lat, --lon and --tz together (or none of them for the invented site), e.g. --lat 52.1 --lon 8.6 --tz Europe/Berlin");
            return CliErrors.Usage;
        }
        if (given == 3)
        {
            if (Site.ValidateCoordinates(lat!.Value, lon!.Value) is string coordError)
            {
                error.WriteLine($"nightsim init: {coordError}");
                return CliErrors.Usage;
            }
            if (!Site.TryFindTimeZone(tz!, out _, out string? tzError))
            {
                error.WriteLine($"nightsim init: --tz: {tzError}. hint: IANA zone names are case-sensitive, e.g. Europe/Berlin");
                return CliErrors.Usage;
            }
            site = (siteName ?? "my site", lat.Value, lon.Value, tz!);
        }
        else if (siteName is not null) site.Name = siteName;
        if (!DateOnly.TryParseExact(date, "yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture, System.Globalization.DateTimeStyles.None, out _))
        {
            error.WriteLine($"nightsim init: --date: \"{date}\" is not a date; write YYYY-MM-DD, e.g. 2026-11-20");
            return CliErrors.Usage;
        }
        if (File.Exists(dir.FullName))
        {
            error.WriteLine($"nightsim init: {dir} is a file, not a folder. hint: give a new folder name, e.g. nightsim init my-timer");
            return CliErrors.Usage;
        }

        string netlistPath = Path.Combine(dir.ToString(), template.Name + ".json");
        string scenarioPath = Path.Combine(dir.ToString(), template.Name + ".scenario.json");
        var files = new List<(string Path, string Text)>
        {
            (netlistPath, StarterTemplates.Netlist(template)),
            (scenarioPath, StarterTemplates.Scenario(template, site.Name, site.Latitude, site.Longitude, site.TimeZone, date)),
            (Path.Combine(dir.ToString(), "netlist.schema.json"), NetlistSchema.Generate()),
            (Path.Combine(dir.ToString(), "scenario.schema.json"), StarterTemplates.ScenarioSchema()),
        };
        List<string> existing = files.Take(2).Select(f => f.Path).Where(File.Exists).ToList();
        if (existing.Count > 0)
        {
            error.WriteLine($"nightsim init: {string.Join(" and ", existing)} already exist{(existing.Count == 1 ? "s" : "")}; nothing written. hint: choose another folder or --template, or move the files away");
            return CliErrors.Usage;
        }
        dir.Create();
        foreach ((string path, string text) in files) AtomicFile.WriteText(path, text);

        output.WriteLine($"wrote {netlistPath} ({template.Summary})");
        output.WriteLine($"wrote {scenarioPath} ({site.Name}, {date}, 1 night)");
        output.WriteLine($"wrote the schemas netlist.schema.json and scenario.schema.json beside them (editors validate and complete against them)");
        output.WriteLine("next:");
        output.WriteLine($"  nightsim check {netlistPath} {scenarioPath}");
        output.WriteLine($"  nightsim simulate {netlistPath} --out {Path.Combine(dir.ToString(), "out")}");
        output.WriteLine($"then open {Path.Combine(dir.ToString(), "out", "report.html")}; the formats are described in docs/netlist-format.md and docs/scenario-format.md.");
        return CliErrors.Success;
    }
}
