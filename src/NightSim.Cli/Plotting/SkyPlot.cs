using System.Globalization;
using NightSim.Sky;
using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;

namespace NightSim.Cli.Plotting;

/// <summary>Draws clear-sky illuminance (log axis) against local clock time for the <c>sky</c> verb; SVG or PNG by extension.</summary>
internal static class SkyPlot
{
    /// <summary>True for .svg and .png file names.</summary>
    public static bool IsSupported(string path)
    {
        string ext = Path.GetExtension(path).ToLowerInvariant();
        return ext is ".svg" or ".png";
    }

    /// <summary>Builds the plot model; x is hours since local noon of <paramref name="first"/>, labelled in local clock time.</summary>
    public static PlotModel Build(Site site, DateOnly first, int days, IReadOnlyList<SolarEvents> nights)
    {
        DateTimeOffset origin = site.LocalNoon(first);
        DateTimeOffset end = site.LocalNoon(first.AddDays(days));
        double hours = (end - origin).TotalHours;
        var ic = CultureInfo.InvariantCulture;
        var model = new PlotModel
        {
            Title = string.Create(ic, $"Clear-sky illuminance, {site.Latitude:F2}° {(site.Latitude >= 0 ? "N" : "S")} {Math.Abs(site.Longitude):F2}° {(site.Longitude >= 0 ? "E" : "W")}, {site.TimeZone.Id}"),
            Subtitle = string.Create(ic, $"nights of {first:yyyy-MM-dd}{(days > 1 ? $" to {first.AddDays(days - 1):yyyy-MM-dd}" : "")}; USNO Circular 171 model with 0.0005 lx night floor"),
            DefaultFont = "DejaVu Sans",
            Background = OxyColors.White,
            PlotAreaBorderColor = OxyColor.FromRgb(0x88, 0x88, 0x88),
        };
        string Label(double h)
        {
            DateTimeOffset t = LocalClock.ToLocal(site.TimeZone, origin.AddHours(h));
            return t.Hour == 0 && t.Minute == 0 || Math.Abs(h) < 1e-9
                ? t.ToString("HH:mm'\n'dd MMM", ic)
                : t.ToString("HH:mm", ic);
        }
        double major = hours <= 30 ? 2 : hours <= 80 ? 6 : hours <= 200 ? 12 : 24;
        model.Axes.Add(new LinearAxis
        {
            Position = AxisPosition.Bottom, Minimum = 0, Maximum = hours, MajorStep = major, MinorStep = major / 2,
            Title = $"local time ({site.TimeZone.Id})", LabelFormatter = Label,
            MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromRgb(0xE4, 0xE4, 0xE4),
        });
        model.Axes.Add(new LogarithmicAxis
        {
            Position = AxisPosition.Left, Minimum = 1e-4, Maximum = 2e5, Title = "illuminance", Unit = "lx",
            MajorGridlineStyle = LineStyle.Solid, MajorGridlineColor = OxyColor.FromRgb(0xE4, 0xE4, 0xE4),
            LabelFormatter = v => v.ToString("#,0.####", CultureInfo.InvariantCulture),
        });

        foreach (double level in new[] { 100.0, 10.0, 1.0 })
        {
            model.Annotations.Add(new LineAnnotation
            {
                Type = LineAnnotationType.Horizontal, Y = level, Color = OxyColor.FromRgb(0x90, 0x90, 0x90),
                LineStyle = LineStyle.Dash, Text = string.Create(ic, $"{level:G3} lx"), TextHorizontalAlignment = HorizontalAlignment.Left,
                TextLinePosition = 0.005,
            });
        }
        void Mark(DateTimeOffset? t, string text, OxyColor color)
        {
            if (t is not DateTimeOffset v) return;
            model.Annotations.Add(new LineAnnotation
            {
                Type = LineAnnotationType.Vertical, X = (v - origin).TotalHours, Color = color, LineStyle = LineStyle.Dot,
                Text = text, TextOrientation = AnnotationTextOrientation.Vertical, FontSize = 10,
            });
        }
        bool label = days <= 3;
        foreach (SolarEvents e in nights)
        {
            Mark(e.Sunset, label ? "sunset" : "", OxyColor.FromRgb(0xD9, 0x7A, 0x00));
            Mark(e.CivilDusk, label ? "civil dusk" : "", OxyColor.FromRgb(0x3A, 0x6E, 0xC0));
            Mark(e.CivilDawn, label ? "civil dawn" : "", OxyColor.FromRgb(0x3A, 0x6E, 0xC0));
            Mark(e.Sunrise, label ? "sunrise" : "", OxyColor.FromRgb(0xD9, 0x7A, 0x00));
        }

        var series = new LineSeries { Title = "clear sky", Color = OxyColor.FromRgb(0x1F, 0x3A, 0x60), StrokeThickness = 1.8 };
        int points = (int)Math.Min(20000, Math.Max(200, hours * 30));
        double jd0 = SunPosition.JulianDay(origin);
        for (int i = 0; i <= points; i++)
        {
            double h = hours * i / points;
            double elev = SunPosition.Elevation(jd0 + h / 24.0, site.Latitude, site.Longitude);
            series.Points.Add(new DataPoint(h, IlluminanceModel.SkyLux(elev)));
        }
        model.Series.Add(series);
        return model;
    }

    /// <summary>Writes the plot atomically (temp file, then move); returns null or an error message.</summary>
    public static string? Write(string path, Site site, DateOnly first, int days, IReadOnlyList<SolarEvents> nights)
    {
        PlotModel model = Build(site, first, days, nights);
        string full = Path.GetFullPath(path);
        string dir = Path.GetDirectoryName(full) ?? ".";
        if (!Directory.Exists(dir)) return $"folder \"{dir}\" does not exist";
        string temp = Path.Combine(dir, $".{Path.GetFileName(full)}.{Environment.ProcessId}.tmp");
        try
        {
            using (FileStream fs = File.Create(temp))
            {
                if (Path.GetExtension(full).Equals(".png", StringComparison.OrdinalIgnoreCase))
                {
                    string? family = SkiaSharp.SKTypeface.FromFamilyName("DejaVu Sans")?.FamilyName;
                    if (string.IsNullOrEmpty(family)) return "no DejaVu Sans font found for PNG text; install fonts-dejavu-core or write .svg";
                    new OxyPlot.SkiaSharp.PngExporter { Width = 1400, Height = 700 }.Export(model, fs);
                }
                else
                {
                    new OxyPlot.SvgExporter { Width = 1400, Height = 700 }.Export(model, fs);
                }
            }
            File.Move(temp, full, overwrite: true);
            return null;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return $"cannot write \"{path}\": {ex.Message}";
        }
        finally
        {
            if (File.Exists(temp)) File.Delete(temp);
        }
    }
}
