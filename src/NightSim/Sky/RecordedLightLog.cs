using System.Globalization;

namespace NightSim.Sky;

/// <summary>How a recorded light log combines with the synthetic sky.</summary>
public enum LightLogMode
{
    /// <summary>The log replaces the synthetic sky inside its time span.</summary>
    Replace,
    /// <summary>The log is added to the synthetic sky.</summary>
    Add,
}

/// <summary>
/// A recorded light log: CSV lines "timestamp,lux". Time stamps are ISO 8601 ("2026-11-20T18:05:00", "2026-11-20
/// 18:05", optionally with an offset or "Z"); without an offset they are read as local time of the site's zone, or
/// as UTC when the log is declared UTC. A header line, blank lines and lines starting with '#' are skipped. Bad rows
/// and times that are not increasing are errors; gaps longer than <see cref="GapFactor"/> × the median spacing (and
/// at least 2 minutes) are warnings. Every message names its line number.
/// </summary>
public sealed class RecordedLightLog
{
    /// <summary>A spacing this many times the median spacing is reported as a gap.</summary>
    public const double GapFactor = 5.0;

    private RecordedLightLog(DateTimeOffset[] times, double[] lux, IReadOnlyList<ScenarioError> warnings)
    {
        Times = times; LuxValues = lux; Warnings = warnings;
    }

    /// <summary>Sample instants, increasing.</summary>
    public IReadOnlyList<DateTimeOffset> Times { get; }
    /// <summary>Lux at each sample.</summary>
    public IReadOnlyList<double> LuxValues { get; }
    /// <summary>Gaps and other notes, each with a line number.</summary>
    public IReadOnlyList<ScenarioError> Warnings { get; }

    /// <summary>Parses <paramref name="text"/>; returns null with <paramref name="errors"/> when any row is bad.</summary>
    /// <param name="fileName">Name used in messages.</param>
    /// <param name="zone">Zone for time stamps without offset (ignored when <paramref name="utc"/>).</param>
    public static RecordedLightLog? Parse(string text, string fileName, TimeZoneInfo zone, bool utc, out IReadOnlyList<ScenarioError> errors)
    {
        ArgumentNullException.ThrowIfNull(text);
        var errs = new List<ScenarioError>();
        var times = new List<DateTimeOffset>();
        var lux = new List<double>();
        var lines = new List<int>();
        string[] rows = text.Split('\n');
        if (rows.Length > InputLimits.MaxLightLogRows)
        {
            errors = [new ScenarioError(fileName, "line " + (InputLimits.MaxLightLogRows + 1).ToString(CultureInfo.InvariantCulture),
                $"the light log has {rows.Length} lines, more than the limit of {InputLimits.MaxLightLogRows} rows",
                "thin the log (one row a minute is plenty) or split it", InputLimits.MaxLightLogRows + 1, 1)];
            return null;
        }
        bool firstContent = true;
        for (int i = 0; i < rows.Length; i++)
        {
            int lineNo = i + 1;
            string row = rows[i].TrimEnd('\r').Trim();
            if (row.Length == 0 || row.StartsWith('#')) continue;
            string[] cells = row.Split(row.Contains(';') && !row.Contains(',') ? ';' : ',');
            bool isHeader = firstContent && cells.Length >= 1 && !char.IsAsciiDigit(cells[0].Trim().FirstOrDefault());
            firstContent = false;
            if (isHeader) continue;
            void Err(string message, string hint, int column) =>
                errs.Add(new ScenarioError(fileName, $"line {lineNo}", message, hint, lineNo, column));
            if (cells.Length != 2)
            {
                Err($"expected 2 columns (time stamp, lux), found {cells.Length}", "write e.g. 2026-11-20T18:05:00,12.5", 1);
                continue;
            }
            string ts = cells[0].Trim(), lx = cells[1].Trim();
            if (!TryParseStamp(ts, zone, utc, out DateTimeOffset when))
            {
                Err($"\"{ts}\" is not a time stamp", "ISO 8601: 2026-11-20T18:05:00 (local), …Z or …+01:00", 1);
                continue;
            }
            if (!double.TryParse(lx, NumberStyles.Float, CultureInfo.InvariantCulture, out double value) || !double.IsFinite(value))
            {
                Err($"\"{lx}\" is not a number of lux", "write a plain number with a decimal point, e.g. 12.5", cells[0].Length + 2);
                continue;
            }
            if (value < 0)
            {
                Err($"negative illuminance {lx} lx", "illuminance is never below 0 lx", cells[0].Length + 2);
                continue;
            }
            if (times.Count > 0 && when <= times[^1])
            {
                Err($"time {ts} is not after the previous sample on line {lines[^1]}", "sort the log by time; remove duplicate stamps", 1);
                continue;
            }
            times.Add(when);
            lux.Add(value);
            lines.Add(lineNo);
        }
        if (errs.Count == 0 && times.Count < 2)
            errs.Add(new ScenarioError(fileName, "line 1", $"the log has {times.Count} usable samples", "at least two rows \"time stamp,lux\" are needed", 1, 1));
        errors = errs;
        if (errs.Count > 0) return null;

        var warnings = new List<ScenarioError>();
        var spacing = new double[times.Count - 1];
        for (int i = 0; i + 1 < times.Count; i++) spacing[i] = (times[i + 1] - times[i]).TotalSeconds;
        double[] sorted = [.. spacing.Order()];
        double median = sorted[sorted.Length / 2];
        double gapLimit = Math.Max(GapFactor * median, 120.0);
        for (int i = 0; i < spacing.Length; i++)
        {
            if (spacing[i] > gapLimit)
                warnings.Add(new ScenarioError(fileName, $"line {lines[i + 1]}",
                    string.Create(CultureInfo.InvariantCulture, $"gap of {spacing[i] / 60:F1} min after line {lines[i]} (median spacing {median:G3} s); values are interpolated across it"),
                    "check the logger for lost samples", lines[i + 1], 1));
        }
        return new RecordedLightLog([.. times], [.. lux], warnings);
    }

    private static bool TryParseStamp(string text, TimeZoneInfo zone, bool utc, out DateTimeOffset when)
    {
        when = default;
        bool hasOffset = text.EndsWith('Z') || text.EndsWith('z') || HasNumericOffset(text);
        if (hasOffset)
            return DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.None, out when);
        string[] formats = ["yyyy-MM-dd'T'HH:mm:ss.FFFFFFF", "yyyy-MM-dd'T'HH:mm", "yyyy-MM-dd HH:mm:ss.FFFFFFF", "yyyy-MM-dd HH:mm"];
        if (!DateTime.TryParseExact(text, formats, CultureInfo.InvariantCulture, DateTimeStyles.None, out DateTime local)) return false;
        when = utc ? new DateTimeOffset(DateTime.SpecifyKind(local, DateTimeKind.Unspecified), TimeSpan.Zero) : LocalClock.ToInstant(zone, local);
        return true;
    }

    private static bool HasNumericOffset(string text)
    {
        int t = text.IndexOfAny(['T', ' ']);
        if (t < 0) return false;
        string time = text[(t + 1)..];
        return time.Contains('+') || time.Contains('-');
    }
}
