using NightSim.Analysis;
using System.Text.Json;
using NightSim.Reporting;
using NightSim.Runs;
using NightSim.Targets;

namespace NightSim.Studies;

/// <summary>
/// What one night run of a study did, reduced to the numbers studies compare: the first night's dusk switch-on and
/// on-time, and counts over all nights. Values are rounded when made, so a study written at once and one joined from
/// shards hold the same numbers.
/// </summary>
public sealed record StudyOutcome
{
    /// <summary>Clock time of the first night's dusk switch-on (ISO 8601 with offset), or null.</summary>
    public string? SwitchOn { get; init; }
    public double? SwitchOnMinutesAfterSunset { get; init; }
    public double? SwitchOnLux { get; init; }
    /// <summary>Clock time the first dusk switch-on ended, or null (never on, or still on at the end of the run).</summary>
    public string? SwitchOff { get; init; }
    /// <summary>On-time of the first dusk switch-on, seconds (to the end of the run when it never ended), or null.</summary>
    public double? OnSeconds { get; init; }
    public bool Missed { get; init; }
    /// <summary>A dusk switch-on still on at the end of the run (the timer never ended).</summary>
    public bool NeverEnds { get; init; }
    public int FalseTriggers { get; init; }
    public int EarlyOffs { get; init; }
    public int ChatterBursts { get; init; }
    public int TargetsChecked { get; init; }
    public int TargetsFailed { get; init; }
    /// <summary>Codes of the missed targets, comma-separated in a fixed order ("" when none).</summary>
    public string FailedTargets { get; init; } = "";
    /// <summary>Every night met every target (without targets: nothing went wrong).</summary>
    public bool Pass { get; init; }
    /// <summary>Smallest target margin relative to its target's size (negative: missed), or null without targets.</summary>
    public double? WorstMargin { get; init; }
    /// <summary>Energy to the load over the run, Wh, without the power-up firing.</summary>
    public double EnergyWh { get; init; }
    /// <summary>Why the simulation failed, or null.</summary>
    public string? Failure { get; init; }

    /// <summary>The outcome of a finished night run.</summary>
    public static StudyOutcome From(NightRunResult r)
    {
        NightReport rep = r.Report;
        NightSummary? first = rep.Nights.Count > 0 ? rep.Nights[0] : null;
        LoadInterval? dusk = first?.LoadOn.FirstOrDefault(l => l.Expected);
        double? after = dusk is not null && first!.Sunset is DateTimeOffset ss ? Math.Round((dusk.Start - ss).TotalMinutes, 3) : null;
        var checks = rep.TargetResults.SelectMany(t => t.Checks).ToList();
        return new StudyOutcome
        {
            SwitchOn = dusk is null ? null : ReportText.Iso(dusk.Start),
            SwitchOnMinutesAfterSunset = after,
            SwitchOnLux = first?.SwitchLevelLux is double lux ? Math.Round(lux, 4) : null,
            SwitchOff = dusk?.End is DateTimeOffset end ? ReportText.Iso(end) : null,
            OnSeconds = dusk is null ? null : Math.Round(dusk.DurationSeconds, 3),
            Missed = rep.Nights.Any(n => n.Missed),
            NeverEnds = dusk is not null && dusk.End is null,
            FalseTriggers = rep.Nights.Sum(n => n.FalseTriggers),
            EarlyOffs = rep.Nights.Sum(n => n.EarlyOffs),
            ChatterBursts = rep.Nights.Sum(n => n.ChatterBursts),
            TargetsChecked = checks.Count,
            TargetsFailed = checks.Count(c => !c.Pass),
            FailedTargets = string.Join(",", checks.Where(c => !c.Pass).Select(c => c.Target).Distinct()),
            Pass = r.Simulation.Failure is null && rep.Overview.NightsPassed == rep.Overview.Nights && rep.Nights.Count > 0,
            WorstMargin = checks.Count == 0 ? null : Math.Round(checks.Min(c => c.RelativeMargin), 4),
            EnergyWh = Math.Round(EnergyWithoutPowerUp(rep.Nights), 4),
            Failure = r.Simulation.Failure?.ToString(),
        };
    }

    /// <summary>Energy of the nights' switch-ons, Wh, leaving out the firing at power-up (each study run starts from
    /// power-up, which a built controller does once).</summary>
    public static double EnergyWithoutPowerUp(IReadOnlyList<NightSummary> nights)
    {
        double total = 0;
        foreach (NightSummary n in nights)
        {
            double all = n.LoadOn.Sum(l => l.DurationSeconds);
            double powerUp = n.LoadOn.Where(l => l.Cause == LoadCause.PowerUp).Sum(l => l.DurationSeconds);
            if (all > 0) total += n.LoadEnergyWh * (all - powerUp) / all;
        }
        return total;
    }

    /// <summary>Writes the outcome's properties into the current JSON object.</summary>
    public void WriteProperties(Utf8JsonWriter w)
    {
        StudyJson.StringOrNull(w, "switchOn", SwitchOn);
        StudyJson.NumberOrNull(w, "switchOnMinutesAfterSunset", SwitchOnMinutesAfterSunset);
        StudyJson.NumberOrNull(w, "switchOnLux", SwitchOnLux);
        StudyJson.StringOrNull(w, "switchOff", SwitchOff);
        StudyJson.NumberOrNull(w, "onSeconds", OnSeconds);
        w.WriteBoolean("missed", Missed);
        w.WriteBoolean("neverEnds", NeverEnds);
        w.WriteNumber("falseTriggers", FalseTriggers);
        w.WriteNumber("earlyOffs", EarlyOffs);
        w.WriteNumber("chatterBursts", ChatterBursts);
        w.WriteNumber("targetsChecked", TargetsChecked);
        w.WriteNumber("targetsFailed", TargetsFailed);
        w.WriteString("failedTargets", FailedTargets);
        w.WriteBoolean("pass", Pass);
        StudyJson.NumberOrNull(w, "worstMargin", WorstMargin);
        w.WriteNumber("energyWh", EnergyWh);
        StudyJson.StringOrNull(w, "failure", Failure);
    }

    /// <summary>Reads the properties written by <see cref="WriteProperties"/>.</summary>
    public static StudyOutcome Read(JsonElement e) => new()
    {
        SwitchOn = StudyJson.OptString(e, "switchOn"),
        SwitchOnMinutesAfterSunset = StudyJson.OptNumber(e, "switchOnMinutesAfterSunset"),
        SwitchOnLux = StudyJson.OptNumber(e, "switchOnLux"),
        SwitchOff = StudyJson.OptString(e, "switchOff"),
        OnSeconds = StudyJson.OptNumber(e, "onSeconds"),
        Missed = e.GetProperty("missed").GetBoolean(),
        NeverEnds = e.GetProperty("neverEnds").GetBoolean(),
        FalseTriggers = e.GetProperty("falseTriggers").GetInt32(),
        EarlyOffs = e.GetProperty("earlyOffs").GetInt32(),
        ChatterBursts = e.GetProperty("chatterBursts").GetInt32(),
        TargetsChecked = e.GetProperty("targetsChecked").GetInt32(),
        TargetsFailed = e.GetProperty("targetsFailed").GetInt32(),
        FailedTargets = e.GetProperty("failedTargets").GetString() ?? "",
        Pass = e.GetProperty("pass").GetBoolean(),
        WorstMargin = StudyJson.OptNumber(e, "worstMargin"),
        EnergyWh = e.GetProperty("energyWh").GetDouble(),
        Failure = StudyJson.OptString(e, "failure"),
    };

    /// <summary>Column names of <see cref="CsvCells"/>.</summary>
    public static readonly string[] CsvHeader =
        ["switchOn", "switchOnMinutesAfterSunset", "switchOnLux", "switchOff", "onSeconds", "missed", "neverEnds",
         "falseTriggers", "earlyOffs", "chatterBursts", "targetsChecked", "targetsFailed", "failedTargets", "pass", "energyWh", "failure"];

    /// <summary>The outcome as CSV cells (invariant culture; empty for null).</summary>
    public IEnumerable<string> CsvCells() =>
    [
        SwitchOn ?? "", StudyJson.Csv(SwitchOnMinutesAfterSunset), StudyJson.Csv(SwitchOnLux), SwitchOff ?? "", StudyJson.Csv(OnSeconds),
        Missed ? "true" : "false", NeverEnds ? "true" : "false", StudyJson.Csv(FalseTriggers), StudyJson.Csv(EarlyOffs),
        StudyJson.Csv(ChatterBursts), StudyJson.Csv(TargetsChecked), StudyJson.Csv(TargetsFailed), FailedTargets, Pass ? "true" : "false",
        StudyJson.Csv(EnergyWh), Failure ?? "",
    ];
}
