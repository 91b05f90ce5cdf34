using System.Buffers.Binary;
using System.Text.RegularExpressions;
using System.Xml.Linq;
using NightSim.Cli.Plotting;
using NightSim.Reporting;
using NightSim.Tests.Reporting;
using SkiaSharp;

namespace NightSim.Tests.Cli.Plotting;

/// <summary>SVG and PNG files of a night plot (invented demo data): the files exist, hold the plotted series,
/// and the PNG is a real, non-blank image.</summary>
public sealed class PlotWriterTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("nightsim-plot-").FullName;

    public void Dispose() => Directory.Delete(_dir, true);

    [Fact]
    public void SvgFileHoldsEverySeriesAndLongPolylines()
    {
        PlotData data = DemoReportData.NightPlot();
        PlotFiles files = PlotWriter.Write(NightPlotBuilder.Build(data), _dir, data.FileStem);
        Assert.Equal(Path.Combine(_dir, "night-2026-11-20.svg"), files.SvgPath);
        string svg = File.ReadAllText(files.SvgPath);
        XDocument doc = XDocument.Parse(svg); // well-formed XML
        XNamespace ns = "http://www.w3.org/2000/svg";
        Assert.Equal(ns + "svg", doc.Root!.Name);
        string text = string.Join("\n", doc.Descendants(ns + "text").Select(t => t.Value));
        foreach (PlotSeries s in data.Series) Assert.Contains(s.Title, text, StringComparison.Ordinal);
        foreach (PlotMarker k in data.Markers) Assert.Contains(k.Label, text, StringComparison.Ordinal);
        Assert.Contains("16:00", text, StringComparison.Ordinal);
        Assert.Contains("00:00", text, StringComparison.Ordinal);
        int longest = doc.Descendants(ns + "polyline")
            .Select(p => ((string?)p.Attribute("points") ?? "").Split(' ', StringSplitOptions.RemoveEmptyEntries).Length).Max();
        Assert.True(longest > 200, $"longest polyline has {longest} points");
        Assert.DoesNotContain("\uFEFF", svg, StringComparison.Ordinal);
    }

    [Fact]
    public void PngFileIsARealNonBlankImage()
    {
        Assert.True(PlotWriter.PngFontAvailable, PlotWriter.MissingFontWarning);
        PlotData data = DemoReportData.NightPlot();
        PlotFiles files = PlotWriter.Write(NightPlotBuilder.Build(data), _dir, data.FileStem, 1000, 640);
        Assert.Null(files.Warning);
        byte[] png = File.ReadAllBytes(files.PngPath!);
        // PNG signature and IHDR layout: ISO/IEC 15948 (PNG specification), sections 5.2 and 11.2.2.
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, png[..8]);
        Assert.Equal("IHDR", System.Text.Encoding.ASCII.GetString(png, 12, 4));
        Assert.Equal(1000, BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(16)));
        Assert.Equal(640, BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(20)));

        using SKBitmap bmp = SKBitmap.Decode(files.PngPath)!;
        Assert.NotNull(bmp);
        int coloured = 0, dark = 0;
        for (int y = 0; y < bmp.Height; y += 2)
        {
            for (int x = 0; x < bmp.Width; x += 2)
            {
                SKColor c = bmp.GetPixel(x, y);
                if (c.Red < 235 || c.Green < 235 || c.Blue < 235) coloured++;
                if (c.Red + c.Green + c.Blue < 200) dark++; // text and axis labels
            }
        }
        Assert.True(coloured > 2000, $"{coloured} non-white samples");
        Assert.True(dark > 200, $"{dark} dark samples (text)");
    }

    [Fact]
    public void InlineSvgHasNoPrologAndPrefixedIds()
    {
        string a = PlotWriter.ToInlineSvg(NightPlotBuilder.Build(DemoReportData.NightPlot()), "n1-");
        string b = PlotWriter.ToInlineSvg(NightPlotBuilder.Build(DemoReportData.ZoomPlot()), "z1-");
        Assert.StartsWith("<svg", a, StringComparison.Ordinal);
        Assert.DoesNotContain("<?xml", a, StringComparison.Ordinal);
        Assert.DoesNotContain("<!DOCTYPE", a, StringComparison.Ordinal);
        Assert.Contains("viewBox=\"0 0 1200 780\"", a, StringComparison.Ordinal);
        var idsA = Regex.Matches(a, "id=\"([^\"]+)\"").Select(m => m.Groups[1].Value).ToList();
        var idsB = Regex.Matches(b, "id=\"([^\"]+)\"").Select(m => m.Groups[1].Value).ToList();
        Assert.NotEmpty(idsA);
        Assert.All(idsA, id => Assert.StartsWith("n1-", id, StringComparison.Ordinal));
        Assert.Empty(idsA.Intersect(idsB));
        // Every url(#…) reference points at an id of the same figure.
        foreach (Match m in Regex.Matches(a, "url\\(#([^)]+)\\)")) Assert.Contains(m.Groups[1].Value, idsA);
        XDocument.Parse(a);
    }

    [Fact]
    public void FilesAreReplacedAtomically()
    {
        PlotData data = DemoReportData.ZoomPlot();
        PlotWriter.Write(NightPlotBuilder.Build(data), _dir, data.FileStem);
        PlotWriter.Write(NightPlotBuilder.Build(data), _dir, data.FileStem);
        Assert.Equal(["zoom-01-headlight.png", "zoom-01-headlight.svg"],
            Directory.GetFiles(_dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }
}
