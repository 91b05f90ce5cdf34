using NightSim.Analysis;
using NightSim.Reporting;
using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Legends;
using OxyPlot.Series;

namespace NightSim.Cli.Plotting;

/// <summary>
/// Every night of a run on one picture: for each evening's date, the times the lamp was on (the dusk switch-on in blue,
/// anything else in vermillion) between sunset and sunrise, missed nights crossed, and the nights that have their own
/// plots marked at the top. The overview of a run of many nights, whose nights are plotted one by one only when they
/// are interesting (<see cref="Runs.PlottedNights"/>).
/// </summary>
public static class NightsOverviewPlot
{
    /// <summary>File stem of the overview plot.</summary>
    public const string FileStem = "nights";

    // Okabe & Ito (2008) colour-blind-safe palette, as the night plots.
    private static readonly OxyColor s_blue = OxyColor.FromRgb(0x00, 0x72, 0xB2);
    private static readonly OxyColor s_vermillion = OxyColor.FromRgb(0xD5, 0x5E, 0x00);
    private static readonly OxyColor s_orange = OxyColor.FromRgb(0xE6, 0x9F, 0x00);
    private static readonly OxyColor s_skyBlue = OxyColor.FromRgb(0x56, 0xB4, 0xE9);
    private static readonly OxyColor s_black = OxyColor.FromRgb(0x1F, 0x29, 0x33);
    private static readonly OxyColor s_grid = OxyColor.FromRgb(0xE6, 0xE9, 0xEE);

    /// <summary>Top of the y axis: noon of the next day, hours after the evening's midnight.</summary>
    private const double Noon = 12, NextNoon = 36;

    /// <summary>Two switch-ons that are not the dusk one and lie closer than this are drawn as one span (a chattering
    /// relay switches thousands of times a night).</summary>
    private const double JoinSeconds = 60;

    /// <summary>The overview of <paramref name="report"/>'s nights; <paramref name="plotted"/> are the nights drawn one by one.</summary>
    public static PlotModel Build(NightReport report, IReadOnlySet<DateOnly> plotted)
    {
        var model = new PlotModel
        {
            Title = $"{report.CircuitName}: {report.Nights.Count} nights" + (report.SiteName is null ? "" : $" at {report.SiteName}"),
            Subtitle = "when the lamp was on, night by night; ▲ marks the nights plotted on their own",
            DefaultFont = NightPlotBuilder.FontFamily,
            DefaultFontSize = 12,
            TitleFontSize = 16,
            TitleFontWeight = FontWeights.Bold,
            SubtitleFontSize = 12,
            TextColor = s_black,
            TitleColor = s_black,
            Background = OxyColors.White,
            PlotAreaBorderThickness = new OxyThickness(0),
            Padding = new OxyThickness(8, 8, 16, 8),
        };
        DateOnly first = report.Nights.Count > 0 ? report.Nights[0].Date : DateOnly.FromDateTime(DateTime.Today);
        DateOnly last = report.Nights.Count > 0 ? report.Nights[^1].Date : first;
        double span = Math.Max(1, last.DayNumber - first.DayNumber);
        model.Axes.Add(new DateTimeAxis
        {
            Position = AxisPosition.Bottom,
            Title = "date of the evening",
            StringFormat = span > 92 ? "MMM" : "MM-dd",
            IntervalType = span > 92 ? DateTimeIntervalType.Months : span > 21 ? DateTimeIntervalType.Weeks : DateTimeIntervalType.Days,
            Minimum = X(first) - 0.7,
            Maximum = X(last) + 0.7,
            MajorGridlineStyle = LineStyle.Solid,
            MajorGridlineColor = s_grid,
            IsZoomEnabled = false,
            IsPanEnabled = false,
        });
        model.Axes.Add(new LinearAxis
        {
            Position = AxisPosition.Left,
            Title = "local clock time",
            Minimum = Noon,
            Maximum = NextNoon + 1.5,
            MajorStep = 3,
            MinorStep = 1,
            LabelFormatter = h => h > NextNoon ? "" : $"{(int)Math.Round(h) % 24:00}:00",
            MajorGridlineStyle = LineStyle.Solid,
            MajorGridlineColor = s_grid,
            IsZoomEnabled = false,
            IsPanEnabled = false,
        });

        var sunset = new LineSeries { Title = "sunset", Color = s_orange, StrokeThickness = 1.6 };
        var sunrise = new LineSeries { Title = "sunrise", Color = s_skyBlue, StrokeThickness = 1.6 };
        var dusk = new LineSeries { Title = "lamp on (dusk switch-on)", Color = s_blue, StrokeThickness = Thickness(report.Nights.Count) };
        var other = new LineSeries { Title = "lamp on (anything else)", Color = s_vermillion, StrokeThickness = Thickness(report.Nights.Count) };
        var missed = new ScatterSeries { Title = "missed night", MarkerType = MarkerType.Cross, MarkerSize = 5, MarkerStroke = s_vermillion, MarkerStrokeThickness = 1.6 };
        var own = new ScatterSeries { Title = "plotted on its own", MarkerType = MarkerType.Triangle, MarkerSize = 4, MarkerFill = s_black };
        foreach (NightSummary n in report.Nights)
        {
            double x = X(n.Date);
            if (Hours(n.Sunset, n.Date) is double ss) sunset.Points.Add(new DataPoint(x, ss));
            if (Hours(n.Sunrise, n.Date) is double sr) sunrise.Points.Add(new DataPoint(x, sr));
            double spanStart = double.NaN, spanEnd = double.NaN;
            foreach (LoadInterval iv in n.LoadOn)
            {
                double a = Math.Clamp(Hours(iv.Start, n.Date) ?? Noon, Noon, NextNoon);
                double b = Math.Clamp(Hours(iv.End, n.Date) ?? NextNoon, Noon, NextNoon);
                if (iv.Expected)
                {
                    Add(dusk, x, a, b);
                    continue;
                }
                if (!double.IsNaN(spanEnd) && a - spanEnd <= JoinSeconds / 3600)
                {
                    spanEnd = Math.Max(spanEnd, b);
                    continue;
                }
                if (!double.IsNaN(spanStart)) Add(other, x, spanStart, spanEnd);
                (spanStart, spanEnd) = (a, b);
            }
            if (!double.IsNaN(spanStart)) Add(other, x, spanStart, spanEnd);
            if (n.Missed) missed.Points.Add(new ScatterPoint(x, Hours(n.SwitchLevelCrossing, n.Date) ?? Hours(n.Sunset, n.Date) ?? 18));
            if (plotted.Contains(n.Date)) own.Points.Add(new ScatterPoint(x, NextNoon + 0.8));
        }
        foreach (Series s in (Series[])[sunset, sunrise, dusk, other, missed, own]) model.Series.Add(s);
        model.Legends.Add(new Legend
        {
            LegendPlacement = LegendPlacement.Outside,
            LegendPosition = LegendPosition.BottomCenter,
            LegendOrientation = LegendOrientation.Horizontal,
            LegendFont = NightPlotBuilder.FontFamily,
            LegendFontSize = 11.5,
            LegendBorder = OxyColors.Transparent,
        });
        return model;
    }

    /// <summary>Bars thin enough that neighbouring nights stay apart on a 1200-pixel plot, thick enough to see.</summary>
    private static double Thickness(int nights) => Math.Clamp(700.0 / Math.Max(1, nights), 1.0, 6.0);

    private static void Add(LineSeries s, double x, double a, double b)
    {
        if (!(b > a)) b = a + 0.05; // a very short switch-on still shows
        s.Points.Add(new DataPoint(x, a));
        s.Points.Add(new DataPoint(x, b));
        s.Points.Add(DataPoint.Undefined);
    }

    private static double X(DateOnly date) => DateTimeAxis.ToDouble(date.ToDateTime(TimeOnly.MinValue));

    /// <summary>Hours after local midnight at the start of the evening's date (06:00 next morning is 30).</summary>
    private static double? Hours(DateTimeOffset? at, DateOnly evening) =>
        at is DateTimeOffset t ? (t.DateTime - evening.ToDateTime(TimeOnly.MinValue)).TotalHours : null;
}
