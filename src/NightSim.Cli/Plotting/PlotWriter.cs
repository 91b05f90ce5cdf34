using System.Text;
using System.Text.RegularExpressions;
using NightSim.Reporting;
using OxyPlot;
using SkiaSharp;

namespace NightSim.Cli.Plotting;

/// <summary>
/// Writes plot models as SVG and PNG files (atomically) and as inline SVG markup for report.html.
/// </summary>
public static partial class PlotWriter
{
    /// <summary>Default size of a plot, in SVG user units and PNG pixels.</summary>
    public const int DefaultWidth = 1200, DefaultHeight = 780;

    /// <summary>Message when the plot font is missing and PNG files are skipped.</summary>
    public const string MissingFontWarning =
        "PNG plots skipped: the font \"" + NightPlotBuilder.FontFamily + "\" is not installed (install fonts-dejavu-core); SVG plots were written.";

    private static readonly Lazy<bool> s_fontAvailable = new(CheckFont);

    /// <summary>True when Skia finds the plot font; without it PNG text would be missing or export would crash.</summary>
    public static bool PngFontAvailable => s_fontAvailable.Value;

    private static bool CheckFont()
    {
        try
        {
            using SKTypeface? face = SKTypeface.FromFamilyName(NightPlotBuilder.FontFamily);
            return string.Equals(face?.FamilyName, NightPlotBuilder.FontFamily, StringComparison.OrdinalIgnoreCase);
        }
        catch (Exception e) when (e is DllNotFoundException or TypeInitializationException)
        {
            return false;
        }
    }

    /// <summary>
    /// Write <paramref name="model"/> to <c>{directory}/{stem}.svg</c> and, when the font is available,
    /// <c>{directory}/{stem}.png</c>. Each file is written atomically.
    /// </summary>
    public static PlotFiles Write(PlotModel model, string directory, string stem, int width = DefaultWidth, int height = DefaultHeight)
    {
        string svgPath = Path.Combine(directory, stem + ".svg");
        WriteSvg(model, svgPath, width, height);
        if (!PngFontAvailable) return new PlotFiles(svgPath, null, MissingFontWarning);
        string pngPath = Path.Combine(directory, stem + ".png");
        WritePng(model, pngPath, width, height);
        return new PlotFiles(svgPath, pngPath, null);
    }

    /// <summary>Write a standalone SVG document (with XML prolog) atomically.</summary>
    public static void WriteSvg(PlotModel model, string path, int width = DefaultWidth, int height = DefaultHeight)
    {
        string svg = AddViewBox(Export(model, width, height, isDocument: true), width, height);
        AtomicFile.WriteText(path, svg);
    }

    /// <summary>Write a PNG atomically. Throws <see cref="InvalidOperationException"/> when the plot font is missing.</summary>
    public static void WritePng(PlotModel model, string path, int width = DefaultWidth, int height = DefaultHeight)
    {
        if (!PngFontAvailable) throw new InvalidOperationException(MissingFontWarning);
        AtomicFile.Write(path, s => new OxyPlot.SkiaSharp.PngExporter { Width = width, Height = height }.Export(model, s));
    }

    /// <summary>
    /// The plot as an &lt;svg&gt; element for inline use in HTML: no XML prolog or doctype, a viewBox so it scales
    /// to the page width, and every id made unique with <paramref name="idPrefix"/> (several plots share one page).
    /// </summary>
    /// <param name="model">The plot.</param>
    /// <param name="idPrefix">Prefix for every id, unique per figure on the page (e.g. "fig1-").</param>
    /// <param name="includeTitle">False to leave the plot title out (the page shows it as the figure caption).</param>
    /// <param name="width">Width in SVG user units.</param>
    /// <param name="height">Height in SVG user units.</param>
    public static string ToInlineSvg(PlotModel model, string idPrefix, bool includeTitle = true, int width = DefaultWidth, int height = DefaultHeight)
    {
        string svg = Export(model, width, height, isDocument: false, includeTitle);
        int start = svg.IndexOf("<svg", StringComparison.Ordinal);
        if (start > 0) svg = svg[start..];
        svg = AddViewBox(svg, width, height);
        return PrefixIds(svg, idPrefix);
    }

    private static string Export(PlotModel model, int width, int height, bool isDocument, bool includeTitle = true)
    {
        var exporter = new OxyPlot.SvgExporter { Width = width, Height = height, IsDocument = isDocument };
        // Measure text with the real font (as the PNG does); the exporter's built-in estimate is too narrow for it,
        // which lets legends and axis titles overprint in browsers.
        using OxyPlot.SkiaSharp.SkiaRenderContext? measurer = PngFontAvailable
            ? new OxyPlot.SkiaSharp.SkiaRenderContext { RenderTarget = OxyPlot.SkiaSharp.RenderTarget.VectorGraphic }
            : null;
        if (measurer is not null) exporter.TextMeasurer = measurer;
        using var ms = new MemoryStream();
        string? title = model.Title;
        try
        {
            if (!includeTitle) model.Title = null;
            exporter.Export(model, ms);
        }
        finally
        {
            model.Title = title;
        }
        // The exporter writes a byte-order mark; SVG files and inline markup are plain UTF-8.
        return Encoding.UTF8.GetString(ms.ToArray()).TrimStart('\uFEFF');
    }

    /// <summary>Add viewBox="0 0 w h" to the root svg element if it has none.</summary>
    private static string AddViewBox(string svg, int width, int height)
    {
        int start = svg.IndexOf("<svg", StringComparison.Ordinal);
        if (start < 0) return svg;
        int end = svg.IndexOf('>', start);
        if (svg.AsSpan(start, end - start).Contains("viewBox", StringComparison.Ordinal)) return svg;
        return svg.Insert(start + 4, $" viewBox=\"0 0 {width} {height}\" preserveAspectRatio=\"xMidYMid meet\"");
    }

    /// <summary>Rename id="x" to id="{prefix}x" and every reference to it (url(#x), href="#x").</summary>
    private static string PrefixIds(string svg, string prefix)
    {
        var ids = new HashSet<string>(StringComparer.Ordinal);
        foreach (Match m in IdAttribute().Matches(svg)) ids.Add(m.Groups[1].Value);
        if (ids.Count == 0) return svg;
        svg = IdAttribute().Replace(svg, m => $"id=\"{prefix}{m.Groups[1].Value}\"");
        svg = UrlReference().Replace(svg, m => ids.Contains(m.Groups[1].Value) ? $"url(#{prefix}{m.Groups[1].Value})" : m.Value);
        svg = HrefReference().Replace(svg, m => ids.Contains(m.Groups[2].Value) ? $"{m.Groups[1].Value}\"#{prefix}{m.Groups[2].Value}\"" : m.Value);
        return svg;
    }

    [GeneratedRegex("\\bid=\"([^\"]+)\"")]
    private static partial Regex IdAttribute();

    [GeneratedRegex("url\\(#([^)]+)\\)")]
    private static partial Regex UrlReference();

    [GeneratedRegex("((?:xlink:)?href=)\"#([^\"]+)\"")]
    private static partial Regex HrefReference();
}
