using NightSim.Analysis;
using NightSim.Reporting;
using NightSim.Sky;

namespace NightSim.Targets;

/// <summary>Checks one night's summary against the design's targets, with the margin of each.</summary>
public static class TargetEvaluator
{
    /// <summary>The checks of every stated target for <paramref name="night"/>, in a fixed order.</summary>
    public static NightTargets Evaluate(DesignTargets targets, NightSummary night)
    {
        var checks = new List<TargetCheck>();
        LoadInterval? dusk = night.LoadOn.FirstOrDefault(l => l.Expected);
        const string none = "no dusk switch-on";

        if (targets.SwitchOnLuxMin is not null || targets.SwitchOnLuxMax is not null)
        {
            double lo = targets.SwitchOnLuxMin ?? 0, hi = targets.SwitchOnLuxMax ?? double.PositiveInfinity;
            string range = targets.SwitchOnLuxMax is null ? $"≥ {lo:0.###} lx" : targets.SwitchOnLuxMin is null ? $"≤ {hi:0.###} lx" : $"{lo:0.###}–{hi:0.###} lx";
            if (night.SwitchLevelLux is double lux)
            {
                double margin = Math.Min(lux - lo, hi - lux);
                double scale = double.IsInfinity(hi) ? Math.Max(lo, 1e-3) : Math.Max((hi - lo) / 2, 1e-3);
                checks.Add(new TargetCheck("switch-on-lux", margin >= 0, margin, "lx", $"switched on at {lux:0.###} lx (target {range})", scale));
            }
            else
            {
                checks.Add(new TargetCheck("switch-on-lux", false, null, "lx", $"{none} (target {range})"));
            }
        }

        if (targets.SwitchOnMinutesAfterSunset is double limit)
        {
            if (dusk is not null && night.Sunset is DateTimeOffset sunset)
            {
                double after = (dusk.Start - sunset).TotalMinutes;
                double margin = limit - after;
                checks.Add(new TargetCheck("switch-on-after-sunset", margin >= 0, margin, "min",
                    $"on {after:0} min after sunset (target ≤ {limit:0} min)", Math.Max(Math.Abs(limit), 10)));
            }
            else
            {
                checks.Add(new TargetCheck("switch-on-after-sunset", false, null, "min", $"{none} (target ≤ {limit:0} min after sunset)"));
            }
        }

        if (targets.OnTimeMin is not null || targets.OnTimeMax is not null)
        {
            double lo = targets.OnTimeMin ?? 0, hi = targets.OnTimeMax ?? double.PositiveInfinity;
            string range = targets.OnTimeMax is null ? $"≥ {ReportText.Duration(lo)}" : targets.OnTimeMin is null ? $"≤ {ReportText.Duration(hi)}" : $"{ReportText.Duration(lo)} to {ReportText.Duration(hi)}";
            if (dusk is not null)
            {
                double on = dusk.DurationSeconds;
                double margin = Math.Min(on - lo, hi - on);
                double scale = double.IsInfinity(hi) ? Math.Max(lo, 60) : Math.Max((hi - lo) / 2, 60);
                string still = dusk.End is null ? " and still on at the end of the run" : "";
                checks.Add(new TargetCheck("on-time", margin >= 0 && (dusk.End is not null || double.IsInfinity(hi)), margin, "s",
                    $"on for {ReportText.Duration(on)}{still} (target {range})", scale));
            }
            else
            {
                checks.Add(new TargetCheck("on-time", false, null, "s", $"{none} (target {range})"));
            }
        }

        if (targets.OffBy is TimeSpan offBy)
        {
            string clock = $"{(int)offBy.TotalHours:00}:{offBy.Minutes:00}";
            if (dusk is not null)
            {
                DateOnly day = offBy.TotalHours >= 12 ? night.Date : night.Date.AddDays(1);
                var localLimit = new DateTime(day.Year, day.Month, day.Day, 0, 0, 0, DateTimeKind.Unspecified) + offBy;
                DateTimeOffset limitAt = new(localLimit, dusk.Start.Offset);
                if (dusk.End is DateTimeOffset end)
                {
                    // Compare in absolute time; the limit takes the offset in force at the switch-off (daylight-saving nights).
                    limitAt = new DateTimeOffset(localLimit, end.Offset);
                    double margin = (limitAt - end).TotalMinutes;
                    checks.Add(new TargetCheck("off-by", margin >= 0, margin, "min", $"off at {ReportText.Clock(end)} (target by {clock})", 60));
                }
                else
                {
                    checks.Add(new TargetCheck("off-by", false, null, "min", $"still on at the end of the run (target off by {clock})"));
                }
            }
            else
            {
                checks.Add(new TargetCheck("off-by", false, null, "min", $"{none} (target off by {clock})"));
            }
        }

        if (targets.NoFalseTrigger)
        {
            checks.Add(new TargetCheck("no-false-trigger", night.FalseTriggers == 0, -night.FalseTriggers, "count",
                night.FalseTriggers == 0 ? "no false trigger" : $"{night.FalseTriggers} false trigger{(night.FalseTriggers == 1 ? "" : "s")}"));
        }
        if (targets.NoEarlyOff)
        {
            checks.Add(new TargetCheck("no-early-off", night.EarlyOffs == 0, -night.EarlyOffs, "count",
                night.EarlyOffs == 0 ? "no early off" : $"{night.EarlyOffs} on-time{(night.EarlyOffs == 1 ? "" : "s")} cut short"));
        }
        if (targets.NoChatter)
        {
            checks.Add(new TargetCheck("no-chatter", night.ChatterBursts == 0, -night.ChatterBursts, "count",
                night.ChatterBursts == 0 ? $"no chatter ({night.RelayOperations} relay operations)" : $"{night.ChatterBursts} chatter burst{(night.ChatterBursts == 1 ? "" : "s")} ({night.RelayOperations} relay operations)"));
        }
        if (targets.OffAtSunrise)
        {
            if (night.Sunrise is DateTimeOffset sunrise)
            {
                DateTimeOffset? lastOff = night.LoadOn.Count == 0 ? null : night.LoadOn.Max(l => l.End ?? DateTimeOffset.MaxValue);
                if (night.OnAfterSunrise || lastOff == DateTimeOffset.MaxValue)
                {
                    double margin = lastOff is DateTimeOffset lo && lo != DateTimeOffset.MaxValue ? (sunrise - lo).TotalMinutes : double.NaN;
                    checks.Add(new TargetCheck("off-at-sunrise", false, double.IsNaN(margin) ? null : margin, "min",
                        $"still on at sunrise ({ReportText.Clock(sunrise)})", 60));
                }
                else
                {
                    double? margin = lastOff is DateTimeOffset lo ? (sunrise - lo).TotalMinutes : null;
                    checks.Add(new TargetCheck("off-at-sunrise", true, margin, "min",
                        lastOff is DateTimeOffset l2 ? $"off at {ReportText.Clock(l2)}, before sunrise ({ReportText.Clock(sunrise)})" : "never on", 60));
                }
            }
        }
        return new NightTargets(night.Date, checks);
    }
}
