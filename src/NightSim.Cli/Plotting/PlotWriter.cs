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
    /// PNG compression: zlib level 3 with the "up" row filter. The library's default (level 6, every filter tried on
    /// every row) took 45–95 ms per 1200 × 780 plot; this takes 8–13 ms for files about a quarter larger. A plot is
    /// mostly white with thin lines, which the "up" filter turns into long runs of zeros.
    /// </summary>
    public static readonly SKPngEncoderOptions PngEncoding = new(SKPngEncoderFilterFlags.Up, 3);

    /// <summary>
    /// Write <paramref name="model"/> to <c>{directory}/{stem}.svg</c> and, when the font is available,
    /// <c>{directory}/{stem}.png</c>. Each file is written atomically.
    /// </summary>
    public static PlotFiles Write(PlotModel model, string directory, string stem, int width = DefaultWidth, int height = DefaultHeight) =>
        WriteFiles(model, directory, stem, width, height).Files;

    /// <summary>
    /// Write the plot's SVG and PNG files (as <see cref="Write"/>) and return its figure for a report page, made from
    /// the same SVG export: the model is laid out and exported to SVG once for both.
    /// </summary>
    /// <param name="model">The plot.</param>
    /// <param name="directory">Output folder.</param>
    /// <param name="stem">File name without extension.</param>
    /// <param name="caption">The figure's caption on the page (the page shows it instead of the plot's title).</param>
    /// <param name="idPrefix">Prefix for every id in the figure, unique per figure on the page (e.g. "fig1-").</param>
    /// <param name="width">Width in pixels and SVG user units.</param>
    /// <param name="height">Height in pixels and SVG user units.</param>
    public static (PlotFiles Files, HtmlFigure Figure) WriteWithFigure(PlotModel model, string directory, string stem, string caption, string idPrefix,
        int width = DefaultWidth, int height = DefaultHeight)
    {
        (PlotFiles files, string svg) = WriteFiles(model, directory, stem, width, height);
        return (files, new HtmlFigure(caption, InlineFromDocument(svg, model, idPrefix, width, height)));
    }

    private static (PlotFiles Files, string Svg) WriteFiles(PlotModel model, string directory, string stem, int width, int height)
    {
        string svgPath = Path.Combine(directory, stem + ".svg");
        string svg = DocumentSvg(model, width, height);
        AtomicFile.WriteText(svgPath, svg);
        if (!PngFontAvailable) return (new PlotFiles(svgPath, null, MissingFontWarning), svg);
        string pngPath = Path.Combine(directory, stem + ".png");
        WritePng(model, pngPath, width, height);
        return (new PlotFiles(svgPath, pngPath, null), svg);
    }

    /// <summary>Write a standalone SVG document (with XML prolog) atomically.</summary>
    public static void WriteSvg(PlotModel model, string path, int width = DefaultWidth, int height = DefaultHeight) =>
        AtomicFile.WriteText(path, DocumentSvg(model, width, height));

    private static string DocumentSvg(PlotModel model, int width, int height) =>
        AddViewBox(Export(model, width, height, isDocument: true), width, height);

    /// <summary>Write a PNG atomically. Throws <see cref="InvalidOperationException"/> when the plot font is missing.</summary>
    public static void WritePng(PlotModel model, string path, int width = DefaultWidth, int height = DefaultHeight)
    {
        if (!PngFontAvailable) throw new InvalidOperationException(MissingFontWarning);
        byte[] png = Png(model, width, height);
        AtomicFile.Write(path, s => s.Write(png));
    }

    /// <summary>The plot as PNG bytes: drawn by Skia at 96 dpi, compressed with <see cref="PngEncoding"/>.</summary>
    public static byte[] Png(PlotModel model, int width = DefaultWidth, int height = DefaultHeight)
    {
        using var bitmap = new SKBitmap(width, height);
        using (var canvas = new SKCanvas(bitmap))
        using (var context = new OxyPlot.SkiaSharp.SkiaRenderContext { RenderTarget = OxyPlot.SkiaSharp.RenderTarget.PixelGraphic, SkCanvas = canvas, UseTextShaping = true })
        {
            ((IPlotModel)model).Update(true);
            OxyColor b = model.Background;
            canvas.Clear(new SKColor(b.R, b.G, b.B, b.A));
            ((IPlotModel)model).Render(context, new OxyRect(0, 0, width, height));
        }
        using SKPixmap pixels = bitmap.PeekPixels();
        using SKData data = pixels.Encode(PngEncoding);
        return data.ToArray();
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
        string svg = DocumentSvg(model, width, height);
        return includeTitle ? PrefixIds(StripProlog(svg), idPrefix) : InlineFromDocument(svg, model, idPrefix, width, height);
    }

    /// <summary>
    /// The inline figure made from the exported document: the prolog dropped, the plot title's text removed and the
    /// band it occupied cut off the top of the view box (the page shows the caption instead), ids prefixed.
    /// </summary>
    private static string InlineFromDocument(string svg, PlotModel model, string idPrefix, int width, int height)
    {
        svg = StripProlog(svg);
        if (!string.IsNullOrEmpty(model.Title) && TitleElement(svg, model.Title) is (int start, int length, double top))
        {
            // Without a subtitle the plot starts below the title and its padding; with one, the subtitle stays.
            double cut = string.IsNullOrEmpty(model.Subtitle)
                ? model.PlotAndAxisArea.Top - model.Padding.Top
                : (TitleElement(svg, model.Subtitle) is (_, _, double subTop) ? subTop - top : 0);
            svg = svg.Remove(start, length);
            if (cut > 0 && cut < height / 2.0) svg = CropTop(svg, cut, width, height);
        }
        return PrefixIds(svg, idPrefix);
    }

    private static string StripProlog(string svg)
    {
        int start = svg.IndexOf("<svg", StringComparison.Ordinal);
        return start > 0 ? svg[start..] : svg;
    }

    /// <summary>The &lt;text&gt; element whose content is <paramref name="text"/>: its start, length (with the line's
    /// indentation and line end) and the y of its top (the exporter places text by a translate).</summary>
    private static (int Start, int Length, double Top)? TitleElement(string svg, string text)
    {
        string content = ">" + text.Replace("&", "&amp;", StringComparison.Ordinal).Replace("<", "&lt;", StringComparison.Ordinal).Replace(">", "&gt;", StringComparison.Ordinal) + "</text>";
        int end = svg.IndexOf(content, StringComparison.Ordinal);
        if (end < 0) return null;
        int start = svg.LastIndexOf("<text", end, StringComparison.Ordinal);
        if (start < 0) return null;
        Match m = Translate().Match(svg, start, end - start);
        double top = m.Success ? double.Parse(m.Groups[2].Value, System.Globalization.CultureInfo.InvariantCulture) : 0;
        int stop = end + content.Length;
        while (start > 0 && svg[start - 1] == ' ') start--;
        if (stop < svg.Length && svg[stop] == '\n') stop++;
        return (start, stop - start, top);
    }

    /// <summary>Cut <paramref name="cut"/> units off the top of the root element's view box and height.</summary>
    private static string CropTop(string svg, double cut, int width, int height)
    {
        string c = cut.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture);
        string h = (height - cut).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture);
        int rootEnd = svg.IndexOf('>');
        string root = svg[..rootEnd]
            .Replace($"viewBox=\"0 0 {width} {height}\"", $"viewBox=\"0 {c} {width} {h}\"", StringComparison.Ordinal)
            .Replace($" height=\"{height}\"", $" height=\"{h}\"", StringComparison.Ordinal);
        return root + svg[rootEnd..];
    }

    [GeneratedRegex(@"translate\(([-0-9.]+),([-0-9.]+)\)")]
    private static partial Regex Translate();

    private static string Export(PlotModel model, int width, int height, bool isDocument)
    {
        var exporter = new OxyPlot.SvgExporter { Width = width, Height = height, IsDocument = isDocument };
        // Measure text with the real font (as the PNG does); the exporter's built-in estimate is too narrow for it,
        // which lets legends and axis titles overprint in browsers.
        using OxyPlot.SkiaSharp.SkiaRenderContext? measurer = PngFontAvailable
            ? new OxyPlot.SkiaSharp.SkiaRenderContext { RenderTarget = OxyPlot.SkiaSharp.RenderTarget.VectorGraphic }
            : null;
        if (measurer is not null) exporter.TextMeasurer = measurer;
        using var ms = new MemoryStream();
        exporter.Export(model, ms);
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
