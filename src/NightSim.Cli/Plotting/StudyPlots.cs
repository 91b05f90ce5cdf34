using System.Globalization;
using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;

namespace NightSim.Cli.Plotting;

/// <summary>Plots of the studies: histograms (spread), a line plot or heat map (sweep), the year plot.</summary>
public static class StudyPlots
{
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;
    private static readonly OxyColor s_grid = OxyColor.FromRgb(0xE4, 0xE4, 0xE4);
    private static readonly OxyColor s_bar = OxyColor.FromRgb(0x3A, 0x6E, 0xC0);
    private static readonly OxyColor s_target = OxyColor.FromRgb(0xC0, 0x39, 0x2B);

    /// <summary>A new plot with the house style.</summary>
    public static PlotModel Model(string title, string subtitle) => new()
    {
        Title = title,
        Subtitle = subtitle,
        DefaultFont = NightPlotBuilder.FontFamily,
        Background = OxyColors.White,
        PlotAreaBorderColor = OxyColor.FromRgb(0x88, 0x88, 0x88),
    };

    /// <summary>A histogram of <paramref name="values"/> with vertical target lines (label, x).</summary>
    public static PlotModel Histogram(string title, string subtitle, string xTitle, IReadOnlyList<double> values,
        IReadOnlyList<(string Label, double X)> targets, int bins = 30)
    {
        PlotModel model = Model(title, subtitle);
        double lo = values.Count > 0 ? values.Min() : 0, hi = values.Count > 0 ? values.Max() : 1;
        foreach ((_, double x) in targets) { lo = Math.Min(lo, x); hi = Math.Max(hi, x); }
        if (!(hi > lo)) { lo -= 0.5; hi += 0.5; }
        double pad = (hi - lo) * 0.04;
        lo -= pad; hi += pad;
        double width = (hi - lo) / bins;
        var counts = new int[bins];
        foreach (double v in values) counts[Math.Clamp((int)((v - lo) / width), 0, bins - 1)]++;
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Bottom, Title = xTitle, Minimum = lo, Maximum = hi, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = s_grid });
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Left, Title = "runs", Minimum = 0, MaximumPadding = 0.1, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = s_grid });
        var bars = new RectangleBarSeries { FillColor = s_bar, StrokeColor = OxyColors.White, StrokeThickness = 0.5 };
        for (int i = 0; i < bins; i++)
        {
            if (counts[i] > 0) bars.Items.Add(new RectangleBarItem(lo + i * width, 0, lo + (i + 1) * width, counts[i]));
        }
        model.Series.Add(bars);
        foreach ((string label, double x) in targets) model.Annotations.Add(Vertical(x, label));
        return model;
    }

    /// <summary>One outcome against one swept value, with target lines (horizontal) and failing points marked.</summary>
    public static PlotModel Line(string title, string subtitle, string xTitle, string xUnit, bool logX, string yTitle,
        IReadOnlyList<(double X, double? Y, bool Pass)> points, IReadOnlyList<(string Label, double Y)> targets)
    {
        PlotModel model = Model(title, subtitle);
        model.Axes.Add(logX
            ? new LogarithmicAxis { Position = AxisPosition.Bottom, Title = xTitle, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = s_grid, LabelFormatter = v => Eng(v, xUnit) }
            : new LinearAxis { Position = AxisPosition.Bottom, Title = xTitle, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = s_grid, LabelFormatter = v => Eng(v, xUnit) });
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Left, Title = yTitle, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = s_grid, MinimumPadding = 0.1, MaximumPadding = 0.1 });
        var line = new LineSeries { Color = s_bar, StrokeThickness = 1.5, MarkerType = MarkerType.Circle, MarkerSize = 4, MarkerFill = s_bar, Title = "pass" };
        var fail = new ScatterSeries { MarkerType = MarkerType.Cross, MarkerSize = 7, MarkerStroke = s_target, MarkerStrokeThickness = 2, Title = "fails a target" };
        foreach ((double x, double? y, bool pass) in points)
        {
            line.Points.Add(y is double v ? new DataPoint(x, v) : DataPoint.Undefined);
            if (!pass) fail.Points.Add(new ScatterPoint(x, y ?? 0));
        }
        model.Series.Add(line);
        model.Series.Add(fail);
        foreach ((string label, double y) in targets)
        {
            model.Annotations.Add(new LineAnnotation { Type = LineAnnotationType.Horizontal, Y = y, Color = s_target, LineStyle = LineStyle.Dash, Text = label, StrokeThickness = 1.5 });
        }
        model.Legends.Add(new OxyPlot.Legends.Legend { LegendPosition = OxyPlot.Legends.LegendPosition.TopRight, LegendFont = NightPlotBuilder.FontFamily });
        return model;
    }

    /// <summary>A heat map of pass (green) / fail (red) cells over two swept values, shaded by an outcome, with the
    /// boundary between passing and failing cells drawn.</summary>
    public static PlotModel HeatMap(string title, string subtitle, string xTitle, IReadOnlyList<string> xs, string yTitle,
        IReadOnlyList<string> ys, Func<int, int, (bool Pass, string Text)> cell)
    {
        PlotModel model = Model(title, subtitle);
        model.Axes.Add(new CategoryAxis { Position = AxisPosition.Bottom, Title = xTitle, ItemsSource = xs.ToList(), GapWidth = 0 });
        model.Axes.Add(new CategoryAxis { Position = AxisPosition.Left, Title = yTitle, ItemsSource = ys.ToList(), GapWidth = 0 });
        var pass = OxyColor.FromRgb(0x7F, 0xC9, 0x7F);
        var failc = OxyColor.FromRgb(0xF4, 0x8F, 0x8F);
        for (int i = 0; i < xs.Count; i++)
        {
            for (int j = 0; j < ys.Count; j++)
            {
                (bool ok, string text) = cell(i, j);
                model.Annotations.Add(new RectangleAnnotation
                {
                    MinimumX = i - 0.5, MaximumX = i + 0.5, MinimumY = j - 0.5, MaximumY = j + 0.5,
                    Fill = ok ? pass : failc, Stroke = OxyColors.White, StrokeThickness = 1, Text = text, FontSize = 11,
                });
            }
        }
        // The target boundary: edges between a passing and a failing cell.
        for (int i = 0; i < xs.Count; i++)
        {
            for (int j = 0; j < ys.Count; j++)
            {
                bool ok = cell(i, j).Pass;
                if (i + 1 < xs.Count && cell(i + 1, j).Pass != ok) model.Annotations.Add(Edge(i + 0.5, j - 0.5, i + 0.5, j + 0.5));
                if (j + 1 < ys.Count && cell(i, j + 1).Pass != ok) model.Annotations.Add(Edge(i - 0.5, j + 0.5, i + 0.5, j + 0.5));
            }
        }
        return model;
    }

    /// <summary>Engineering notation for axis labels ("4.7 kΩ", "100 nF").</summary>
    public static string Eng(double v, string unit) => Units.EngineeringValue.Format(v, unit, 3);

    private static PolylineAnnotation Edge(double x1, double y1, double x2, double y2)
    {
        var a = new PolylineAnnotation { Color = OxyColors.Black, StrokeThickness = 3, LineStyle = LineStyle.Solid };
        a.Points.Add(new DataPoint(x1, y1));
        a.Points.Add(new DataPoint(x2, y2));
        return a;
    }

    private static LineAnnotation Vertical(double x, string label) => new()
    {
        Type = LineAnnotationType.Vertical, X = x, Color = s_target, LineStyle = LineStyle.Dash, StrokeThickness = 1.5,
        Text = label, TextOrientation = AnnotationTextOrientation.Vertical,
    };

    /// <summary>"3.5 h" style number for labels.</summary>
    public static string N(double v, string format = "0.##") => v.ToString(format, s_inv);
}

/// <summary>The year plot: switch-on and switch-off clock times against sunset and sunrise, date by date.</summary>
public static class YearPlot
{
    /// <summary>Hours after local midnight of the evening's date (so 06:00 next morning is 30).</summary>
    private static double? Hours(string? iso, DateOnly evening)
    {
        if (iso is null) return null;
        DateTimeOffset t = DateTimeOffset.Parse(iso, System.Globalization.CultureInfo.InvariantCulture);
        return (t.DateTime - evening.ToDateTime(TimeOnly.MinValue)).TotalHours;
    }

    public static PlotModel Build(string title, string subtitle, IReadOnlyList<Studies.YearNight> nights)
    {
        PlotModel model = StudyPlots.Model(title, subtitle);
        var grid = OxyColor.FromRgb(0xE4, 0xE4, 0xE4);
        model.Axes.Add(new DateTimeAxis { Position = AxisPosition.Bottom, StringFormat = "MMM", Title = "date of the evening", MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = grid, IntervalType = DateTimeIntervalType.Months });
        model.Axes.Add(new LinearAxis
        {
            Position = AxisPosition.Left, Title = "local time", Minimum = 15, Maximum = 33, MajorStep = 2, MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = grid,
            LabelFormatter = h => $"{((int)Math.Round(h) % 24):00}:00",
        });
        var sunset = new LineSeries { Title = "sunset", Color = OxyColor.FromRgb(0xD9, 0x7A, 0x00), StrokeThickness = 2 };
        var sunrise = new LineSeries { Title = "sunrise", Color = OxyColor.FromRgb(0xE0, 0xB0, 0x00), StrokeThickness = 2 };
        var on = new ScatterSeries { Title = "switch-on", MarkerType = MarkerType.Circle, MarkerSize = 2.5, MarkerFill = OxyColor.FromRgb(0x3A, 0x6E, 0xC0) };
        var off = new ScatterSeries { Title = "switch-off", MarkerType = MarkerType.Circle, MarkerSize = 2.5, MarkerFill = OxyColor.FromRgb(0x1F, 0x3A, 0x60) };
        var fail = new ScatterSeries { Title = "night failing a target", MarkerType = MarkerType.Cross, MarkerSize = 5, MarkerStroke = OxyColor.FromRgb(0xC0, 0x39, 0x2B), MarkerStrokeThickness = 1.5 };
        foreach (Studies.YearNight n in nights)
        {
            double x = DateTimeAxis.ToDouble(n.Date.ToDateTime(TimeOnly.MinValue));
            if (Hours(n.Sunset, n.Date) is double ss) sunset.Points.Add(new DataPoint(x, ss));
            if (Hours(n.Sunrise, n.Date) is double sr) sunrise.Points.Add(new DataPoint(x, sr));
            double? o = Hours(n.Outcome.SwitchOn, n.Date);
            if (o is double a) on.Points.Add(new ScatterPoint(x, a));
            if (Hours(n.Outcome.SwitchOff, n.Date) is double b) off.Points.Add(new ScatterPoint(x, b));
            if (!n.Outcome.Pass) fail.Points.Add(new ScatterPoint(x, o ?? Hours(n.Sunset, n.Date) ?? 18));
        }
        model.Series.Add(sunset);
        model.Series.Add(sunrise);
        model.Series.Add(on);
        model.Series.Add(off);
        model.Series.Add(fail);
        model.Legends.Add(new OxyPlot.Legends.Legend
        {
            LegendPlacement = OxyPlot.Legends.LegendPlacement.Outside, LegendPosition = OxyPlot.Legends.LegendPosition.BottomCenter,
            LegendOrientation = OxyPlot.Legends.LegendOrientation.Horizontal, LegendFont = NightPlotBuilder.FontFamily,
        });
        return model;
    }

    public static PlotModel Energy(string title, IReadOnlyList<Studies.YearMonth> months)
    {
        PlotModel model = StudyPlots.Model(title, "energy to the lamp per month (kWh) and the share of nights meeting every target");
        model.Axes.Add(new CategoryAxis { Position = AxisPosition.Bottom, ItemsSource = months.Select(m => $"{m.Year:0000}-{m.Month:00}").ToList(), Angle = -45 });
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Left, Title = "kWh", Minimum = 0, MaximumPadding = 0.15 });
        // Columns as rectangles on the category positions (0, 1, 2, …).
        var cols = new RectangleBarSeries { FillColor = OxyColor.FromRgb(0x3A, 0x6E, 0xC0), StrokeColor = OxyColors.White };
        for (int i = 0; i < months.Count; i++)
        {
            cols.Items.Add(new RectangleBarItem(i - 0.35, 0, i + 0.35, months[i].EnergyWh / 1000));
        }
        model.Series.Add(cols);
        for (int i = 0; i < months.Count; i++)
        {
            model.Annotations.Add(new TextAnnotation
            {
                Text = $"{months[i].PassRate * 100:0} % pass", TextPosition = new DataPoint(i, months[i].EnergyWh / 1000), FontSize = 10,
                TextVerticalAlignment = VerticalAlignment.Bottom, Stroke = OxyColors.Transparent,
            });
        }
        return model;
    }
}
