using System.Globalization;
using NightSim.Reporting;
using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Legends;
using OxyPlot.Series;

namespace NightSim.Cli.Plotting;

/// <summary>
/// Turns engine-side <see cref="PlotData"/> into an OxyPlot model: three stacked panels (light on a log axis,
/// voltages, on/off states) sharing one local-clock-time axis, with vertical markers across all panels.
/// </summary>
public static class NightPlotBuilder
{
    /// <summary>Font used for every text of the plots (must be installed for PNG export: fonts-dejavu-core).</summary>
    public const string FontFamily = "DejaVu Sans";

    /// <summary>Lowest illuminance drawn on the log axis, lux; values at or below zero are drawn here.</summary>
    public const double LuxFloor = 1e-4;

    private const string XKey = "clock";
    private static readonly CultureInfo s_inv = CultureInfo.InvariantCulture;

    // Our palette: calm, distinguishable, readable on white and in grey print.
    private static readonly OxyColor s_text = OxyColor.FromRgb(0x1F, 0x29, 0x33);
    private static readonly OxyColor s_grid = OxyColor.FromRgb(0xE6, 0xE9, 0xEE);
    private static readonly OxyColor s_gridMinor = OxyColor.FromRgb(0xF2, 0xF4, 0xF7);
    private static readonly OxyColor s_axisLine = OxyColor.FromRgb(0x9A, 0xA5, 0xB1);
    private static readonly OxyColor s_reference = OxyColor.FromRgb(0x7D, 0x86, 0x91);
    private static readonly OxyColor s_marker = OxyColor.FromRgb(0x4F, 0x6D, 0x8F);
    private static readonly OxyColor s_emphasis = OxyColor.FromRgb(0xC0, 0x29, 0x1E);

    // Traces use the colour-blind-safe palette of Okabe, M. & Ito, K. (2008), "Color Universal Design (CUD): how to
    // make figures and presentations that are friendly to colorblind people": sensor blue, trigger vermillion,
    // timing capacitor bluish green, light orange; these stay distinct in the common colour-vision deficiencies.
    private static readonly OxyColor s_cudOrange = OxyColor.FromRgb(0xE6, 0x9F, 0x00);
    private static readonly OxyColor s_cudSkyBlue = OxyColor.FromRgb(0x56, 0xB4, 0xE9);
    private static readonly OxyColor s_cudGreen = OxyColor.FromRgb(0x00, 0x9E, 0x73);
    private static readonly OxyColor s_cudBlue = OxyColor.FromRgb(0x00, 0x72, 0xB2);
    private static readonly OxyColor s_cudVermillion = OxyColor.FromRgb(0xD5, 0x5E, 0x00);
    private static readonly OxyColor s_cudPurple = OxyColor.FromRgb(0xCC, 0x79, 0xA7);
    private static readonly OxyColor s_cudBlack = OxyColor.FromRgb(0x00, 0x00, 0x00);

    private static readonly OxyColor[] s_lightColors = [s_cudOrange, s_cudSkyBlue];
    private static readonly OxyColor[] s_voltColors = [s_cudPurple, s_cudSkyBlue, s_cudOrange];
    private static readonly OxyColor[] s_stateColors = [s_cudGreen, s_cudVermillion, s_cudBlue, s_cudPurple];

    /// <summary>The colour of a voltage trace by its role (the first word of its title), else the next spare colour.</summary>
    private static OxyColor? RoleColor(string title) =>
        title.StartsWith("sensor", StringComparison.Ordinal) ? s_cudBlue
        : title.StartsWith("trigger", StringComparison.Ordinal) ? s_cudVermillion
        : title.StartsWith("timing", StringComparison.Ordinal) ? s_cudGreen
        : title.StartsWith("switching level", StringComparison.Ordinal) ? s_cudBlack
        : null;

    /// <summary>Build the model for one window of a run. Panels without series are left out.</summary>
    public static PlotModel Build(PlotData data)
    {
        double span = data.To - data.From;
        if (!(span > 0)) throw new ArgumentException($"plot '{data.FileStem}': window end must be after its start");
        foreach (PlotSeries s in data.Series)
        {
            if (s.Times.Length != s.Values.Length)
                throw new ArgumentException($"plot '{data.FileStem}', series '{s.Title}': {s.Times.Length} times but {s.Values.Length} values");
        }

        // Axis coordinate = seconds since local midnight of the origin's day, so major ticks fall on round clock times.
        DateTimeOffset originClock = ClockTime.At(data.Origin, data.TimeZone, 0);
        double shift = originClock.TimeOfDay.TotalSeconds;
        double step = NiceStep(span, 12);
        string format = span > 30 * 3600 ? "MM-dd HH:mm"
            : step >= 60 ? "HH:mm" : step >= 1 ? "HH:mm:ss" : step >= 0.1 ? "HH:mm:ss.f" : step >= 0.01 ? "HH:mm:ss.ff" : "HH:mm:ss.fff";
        if (format.Length > 8)
        {
            // Long labels: fewer ticks so neighbours do not overprint.
            step = NiceStep(span, 8);
            if (span <= 30 * 3600) format = step >= 1 ? "HH:mm:ss" : step >= 0.1 ? "HH:mm:ss.f" : step >= 0.01 ? "HH:mm:ss.ff" : "HH:mm:ss.fff";
        }

        var model = new PlotModel
        {
            Title = data.Title,
            DefaultFont = FontFamily,
            DefaultFontSize = 12,
            TitleFontSize = 16,
            TitleFontWeight = FontWeights.Bold,
            TextColor = s_text,
            TitleColor = s_text,
            Background = OxyColors.White,
            PlotAreaBorderThickness = new OxyThickness(0),
            Padding = new OxyThickness(8, 8, 16, 8),
        };

        string zone = data.TimeZone is null ? "UTC" + originClock.ToString("zzz", s_inv) : data.TimeZone.Id;
        if (data.RunTimeAxis) shift = 0;
        string seconds = step >= 1 ? "0" : step >= 0.1 ? "0.0" : step >= 0.01 ? "0.00" : "0.000";
        var x = new LinearAxis
        {
            Key = XKey,
            Position = AxisPosition.Bottom,
            Title = data.RunTimeAxis ? "time since power-up (s)" : "local clock time (" + zone + ")",
            Minimum = data.From + shift,
            Maximum = data.To + shift,
            MajorStep = step,
            MinorStep = step / (step is 15 or 900 or 10800 ? 3 : step is 2 or 120 or 7200 or 0.2 or 0.02 or 0.002 or 20 ? 4 : 5),
            LabelFormatter = data.RunTimeAxis
                ? v => v.ToString(seconds, s_inv)
                : v => ClockTime.At(data.Origin, data.TimeZone, v - shift).ToString(format, s_inv),
            IsZoomEnabled = false,
            IsPanEnabled = false,
        };
        StyleAxis(x);
        model.Axes.Add(x);

        var panels = new List<PlotPanel>();
        foreach (PlotPanel p in new[] { PlotPanel.Light, PlotPanel.Voltages, PlotPanel.States })
            if (data.Series.Any(s => s.Panel == p)) panels.Add(p);
        if (panels.Count == 0) panels.Add(PlotPanel.Voltages);

        // Panel heights as weights: light and voltages get the room, states a slim strip.
        double[] weights = panels.Select(p => p == PlotPanel.States ? 0.55 : 1.0).ToArray();
        const double gap = 0.045;
        double usable = 1 - gap * (panels.Count - 1);
        double total = weights.Sum();
        double top = 1;
        var positions = new Dictionary<PlotPanel, (double Start, double End)>();
        for (int i = 0; i < panels.Count; i++)
        {
            double h = usable * weights[i] / total;
            positions[panels[i]] = (top - h, top);
            top -= h + gap;
        }

        foreach (PlotPanel p in panels)
        {
            (double start, double end) = positions[p];
            Axis y = MakeYAxis(p, data, start, end);
            model.Axes.Add(y);
            model.Legends.Add(new Legend
            {
                Key = p.ToString(),
                LegendPlacement = LegendPlacement.Outside,
                LegendPosition = p switch
                {
                    PlotPanel.Light => LegendPosition.RightTop,
                    PlotPanel.States => LegendPosition.RightBottom,
                    _ => LegendPosition.RightMiddle,
                },
                LegendOrientation = LegendOrientation.Vertical,
                LegendFont = FontFamily,
                LegendFontSize = 11.5,
                LegendTitle = PanelName(p),
                LegendTitleFontSize = 12,
                LegendBackground = OxyColor.FromArgb(0, 255, 255, 255),
                LegendBorder = OxyColors.Transparent,
                LegendMaxWidth = 230,
                LegendSymbolLength = 22,
            });
            AddSeries(model, data, p, shift);
        }

        AddMarkers(model, data, panels, shift);
        return model;
    }

    private static string PanelName(PlotPanel p) => p switch
    {
        PlotPanel.Light => "Light at the sensor",
        PlotPanel.States => "Relay and load",
        _ => "Voltages",
    };

    private static Axis MakeYAxis(PlotPanel panel, PlotData data, double start, double end)
    {
        Axis y;
        switch (panel)
        {
            case PlotPanel.Light:
            {
                (double lo, double hi) = LuxRange(data);
                y = new LogarithmicAxis
                {
                    Title = "illuminance", Unit = "lx", Minimum = lo, Maximum = hi, Base = 10, LabelFormatter = LuxLabel,
                    IntervalLength = 24, // short panel: still one label per decade
                    MinorGridlineStyle = LineStyle.None,
                };
                break;
            }
            case PlotPanel.States:
            {
                int lanes = Math.Max(1, data.Series.Count(s => s.Panel == PlotPanel.States));
                // Each lane k draws off at k and on at k + 0.7: one tick label for each (0.7 = LaneOn).
                y = new LinearAxis
                {
                    Title = "state",
                    Minimum = -0.25,
                    Maximum = lanes - 0.05,
                    MajorStep = lanes == 1 ? LaneOn : 1,
                    MinorStep = lanes == 1 ? LaneOn : 1,
                    LabelFormatter = v => Math.Abs(v - Math.Round(v)) < 1e-6 ? "off" : Math.Abs(v - Math.Floor(v) - LaneOn) < 1e-6 ? "on" : "",
                    MajorGridlineStyle = LineStyle.None,
                    TickStyle = TickStyle.Outside,
                };
                break;
            }
            default:
            {
                y = new LinearAxis { Title = "voltage", Unit = "V", MinimumPadding = 0.05, MaximumPadding = 0.08 };
                break;
            }
        }
        y.Key = panel.ToString();
        y.Position = AxisPosition.Left;
        y.StartPosition = start;
        y.EndPosition = end;
        y.IsZoomEnabled = false;
        y.IsPanEnabled = false;
        StyleAxis(y);
        return y;
    }

    /// <summary>Height of "on" within a state lane.</summary>
    private const double LaneOn = 0.7;

    private static void StyleAxis(Axis a)
    {
        a.TitleFontSize = 12;
        a.FontSize = 11.5;
        a.AxislineStyle = LineStyle.Solid;
        a.AxislineColor = s_axisLine;
        a.TicklineColor = s_axisLine;
        a.TextColor = s_text;
        a.TitleColor = s_text;
        a.TitleFormatString = "{0} ({1})";
        if (a.MajorGridlineStyle != LineStyle.None || a is LogarithmicAxis)
        {
            a.MajorGridlineStyle = LineStyle.Solid;
            a.MajorGridlineColor = s_grid;
        }
        if (a.Position == AxisPosition.Bottom)
        {
            a.MinorGridlineStyle = LineStyle.Solid;
            a.MinorGridlineColor = s_gridMinor;
        }
    }

    private static string LuxLabel(double v)
    {
        if (v >= 1) return v.ToString("#,0", s_inv);
        return v.ToString("0.####", s_inv);
    }

    /// <summary>Decades that cover the light data inside the window, floored at <see cref="LuxFloor"/>.</summary>
    private static (double Lo, double Hi) LuxRange(PlotData data)
    {
        double lo = double.PositiveInfinity, hi = 0;
        bool anyFloor = false;
        foreach (PlotSeries s in data.Series)
        {
            if (s.Panel != PlotPanel.Light) continue;
            (int a, int b) = Window(s.Times, data.From, data.To);
            for (int i = a; i < b; i++)
            {
                double v = s.Values[i];
                if (!double.IsFinite(v)) continue;
                if (v <= LuxFloor) { anyFloor = true; continue; }
                lo = Math.Min(lo, v);
                hi = Math.Max(hi, v);
            }
        }
        if (hi <= 0) return (LuxFloor, 1);
        if (anyFloor) lo = LuxFloor;
        // A data minimum on (or just above) a decade gets one more decade below it, so the trace clears the frame.
        double dLo = Math.Floor(Math.Log10(lo) - 0.05);
        double dHi = Math.Ceiling(Math.Log10(hi) + 1e-9);
        if (dHi - dLo < 1) dHi = dLo + 1;
        return (Math.Max(LuxFloor, Math.Pow(10, dLo)), Math.Pow(10, dHi));
    }

    private static void AddSeries(PlotModel model, PlotData data, PlotPanel panel, double shift)
    {
        int colour = 0, lane = 0, dashed = 0;
        foreach (PlotSeries s in data.Series)
        {
            if (s.Panel != panel) continue;
            // Only what the window shows: the points inside, one just outside each edge, at most four per pixel column.
            (double[] ct, double[] cv) = SeriesClip.Clip(s.Times, s.Values, data.From, data.To, panel == PlotPanel.States ? SeriesShape.Steps : SeriesShape.Line);
            (ct, cv) = SeriesDecimator.Decimate(ct, cv, data.From, data.To);
            string key = panel.ToString();
            if (panel == PlotPanel.States)
            {
                OxyColor c = s_stateColors[colour++ % s_stateColors.Length];
                var st = new StairStepSeries
                {
                    Title = s.Title,
                    Color = c,
                    StrokeThickness = 2,
                    VerticalStrokeThickness = 1.4,
                    XAxisKey = XKey,
                    YAxisKey = key,
                    LegendKey = key,
                };
                double baseLine = lane++;
                for (int i = 0; i < ct.Length; i++)
                    if (double.IsFinite(cv[i])) st.Points.Add(new DataPoint(ct[i] + shift, baseLine + LaneOn * Math.Clamp(cv[i], 0, 1)));
                model.Series.Add(st);
                model.Annotations.Add(new TextAnnotation
                {
                    Text = LaneLabel(s.Title),
                    TextPosition = new DataPoint(data.From + shift, baseLine + 0.35),
                    TextHorizontalAlignment = HorizontalAlignment.Left,
                    TextVerticalAlignment = VerticalAlignment.Middle,
                    Offset = new ScreenVector(6, 0),
                    Stroke = OxyColors.Transparent,
                    Background = OxyColors.Transparent,
                    TextColor = c,
                    FontSize = 11,
                    FontWeight = FontWeights.Bold,
                    ClipByXAxis = false,
                    ClipByYAxis = false,
                    XAxisKey = XKey,
                    YAxisKey = key,
                    Layer = AnnotationLayer.AboveSeries,
                });
                continue;
            }

            // Reference lines that belong to a trace (the sensor at switch-on, the switching level) take its colour.
            OxyColor? role = RoleColor(s.Title);
            LineStyle style = !s.Dashed ? LineStyle.Solid : role is not null ? LineStyle.Dash : dashed++ % 2 == 0 ? LineStyle.Dash : LineStyle.DashDot;
            OxyColor color = s.Dashed ? role ?? s_reference
                : panel == PlotPanel.Light ? s_lightColors[colour++ % s_lightColors.Length]
                : role ?? s_voltColors[colour++ % s_voltColors.Length];
            var line = new LineSeries
            {
                Title = s.Title,
                Color = color,
                StrokeThickness = s.Dashed ? 1.2 : 1.8,
                LineStyle = style,
                XAxisKey = XKey,
                YAxisKey = key,
                LegendKey = key,
                CanTrackerInterpolatePoints = false,
            };
            bool light = panel == PlotPanel.Light;
            line.Points.Capacity = ct.Length;
            for (int i = 0; i < ct.Length; i++)
            {
                double v = cv[i];
                if (!double.IsFinite(v)) { line.Points.Add(DataPoint.Undefined); continue; }
                if (light && v < LuxFloor) v = LuxFloor;
                line.Points.Add(new DataPoint(ct[i] + shift, v));
            }
            model.Series.Add(line);
        }
    }

    /// <summary>A short lane label: the first word of the series title ("relay", "load").</summary>
    private static string LaneLabel(string title)
    {
        int space = title.IndexOf(' ');
        return space > 0 ? title[..space] : title;
    }

    private static void AddMarkers(PlotModel model, PlotData data, List<PlotPanel> panels, double shift)
    {
        var labels = new List<MarkerLabel>();
        foreach (PlotMarker m in data.Markers)
        {
            if (m.Time < data.From || m.Time > data.To) continue;
            foreach (PlotPanel p in panels)
            {
                model.Annotations.Add(new LineAnnotation
                {
                    Type = LineAnnotationType.Vertical,
                    X = m.Time + shift,
                    Color = m.Emphasis ? s_emphasis : s_marker,
                    StrokeThickness = m.Emphasis ? 1.6 : 1.1,
                    LineStyle = m.Emphasis ? LineStyle.Solid : LineStyle.Dash,
                    XAxisKey = XKey,
                    YAxisKey = p.ToString(),
                    Layer = AnnotationLayer.BelowSeries,
                });
            }
            labels.Add(new MarkerLabel(m.Time + shift, m.Label, m.Emphasis ? s_emphasis : s_marker, m.Emphasis));
        }
        // The labels go where they cover no curve: placed when the plot is drawn, the top panel tried first.
        if (labels.Count > 0) model.Annotations.Add(new MarkerLabels(labels, XKey, [.. panels.Select(p => p.ToString())]));
    }

    /// <summary>Index range [a, b) of the samples inside [from, to], widened by one sample each side.</summary>
    private static (int A, int B) Window(double[] times, double from, double to)
    {
        int a = Array.BinarySearch(times, from);
        if (a < 0) a = ~a;
        a = Math.Max(0, a - 1);
        int b = Array.BinarySearch(times, to);
        if (b < 0) b = ~b; else b++;
        b = Math.Min(times.Length, b + 1);
        return (a, Math.Max(a, b));
    }

    private static readonly double[] s_steps =
    [
        0.001, 0.002, 0.005, 0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2, 5, 10, 15, 30, 60, 120, 300, 600, 900, 1800,
        3600, 7200, 10800, 21600, 43200, 86400,
    ];

    /// <summary>The smallest round clock step giving at most <paramref name="maxTicks"/> labelled ticks over <paramref name="span"/> seconds.</summary>
    private static double NiceStep(double span, int maxTicks)
    {
        foreach (double step in s_steps)
            if (span / step <= maxTicks) return step;
        return s_steps[^1];
    }
}
