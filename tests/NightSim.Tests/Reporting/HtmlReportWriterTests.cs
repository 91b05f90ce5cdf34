using System.Xml.Linq;
using NightSim.Cli.Plotting;
using NightSim.Reporting;

namespace NightSim.Tests.Reporting;

/// <summary>report.html: parses as XML (XHTML-compatible markup), holds cautions, findings, nights, events and inline
/// SVG plots; self-contained (no scripts, no external files). Invented demo data.</summary>
public sealed class HtmlReportWriterTests
{
    private static readonly XNamespace s_svg = "http://www.w3.org/2000/svg";

    private static IReadOnlyList<HtmlFigure> Figures() =>
    [
        new(DemoReportData.NightPlot().Title, PlotWriter.ToInlineSvg(NightPlotBuilder.Build(DemoReportData.NightPlot()), "p1-")),
        new(DemoReportData.ZoomPlot().Title, PlotWriter.ToInlineSvg(NightPlotBuilder.Build(DemoReportData.ZoomPlot()), "p2-")),
    ];

    private static string s_page = "";

    private static string Page()
    {
        if (s_page.Length == 0) s_page = HtmlReportWriter.Render(DemoReportData.Report(), Figures());
        return s_page;
    }

    /// <summary>Parse with System.Xml.Linq after removing the HTML5 doctype (XML parsers do not take it).</summary>
    private static XDocument Parse(string html)
    {
        Assert.StartsWith("<!DOCTYPE html>\n", html, StringComparison.Ordinal);
        return XDocument.Parse(html["<!DOCTYPE html>\n".Length..]);
    }

    private static IEnumerable<XElement> ByClass(XDocument d, string name, string cls) =>
        d.Descendants(name).Where(e => ((string?)e.Attribute("class"))?.Split(' ').Contains(cls) == true);

    [Fact]
    public void PageParsesAndHoldsTheNightsTable()
    {
        XDocument d = Parse(Page());
        XElement table = ByClass(d, "table", "nights").Single();
        List<XElement> nights = table.Elements("tbody").ToList();
        Assert.Equal(2, nights.Count);
        // Night 1 has two load-on intervals (two rows), night 2 one.
        Assert.Equal(2, nights[0].Elements("tr").Count());
        Assert.Single(nights[1].Elements("tr"));
        string first = nights[0].Value;
        Assert.Contains("2026-11-20", first, StringComparison.Ordinal);
        Assert.Contains("16:31:00", first, StringComparison.Ordinal);        // sunset
        Assert.Contains("17:12:00", first, StringComparison.Ordinal);        // dusk switch-on
        Assert.Contains("23:41:07", first, StringComparison.Ordinal);        // headlight switch-on
        Assert.Contains("3.2 lx", first, StringComparison.Ordinal);
        Assert.Contains("4 h", first, StringComparison.Ordinal);
        Assert.Contains("80.00", first, StringComparison.Ordinal);
        Assert.Single(nights[0].Elements("tr"), tr => (string?)tr.Attribute("class") == "unexpected");
        Assert.Contains("still on", nights[1].Value, StringComparison.Ordinal);
        Assert.Equal(15, table.Element("thead")!.Descendants("th").Count());
    }

    [Fact]
    public void FindingsAreListedErrorsFirstWithBadgesAndFixes()
    {
        XDocument d = Parse(Page());
        List<XElement> items = ByClass(d, "li", "finding").ToList();
        Assert.Equal(3, items.Count);
        Assert.Equal(["error", "warning", "info"], items.Select(i => ByClassIn(i, "span", "badge").Single().Value));
        Assert.Contains("false-trigger-headlight", items[0].Value, StringComparison.Ordinal);
        Assert.Contains("Fix:", items[0].Value, StringComparison.Ordinal);
        Assert.Contains("LDR1", items[0].Value, StringComparison.Ordinal);
    }

    private static IEnumerable<XElement> ByClassIn(XElement root, string name, string cls) =>
        root.Descendants(name).Where(e => ((string?)e.Attribute("class"))?.Split(' ').Contains(cls) == true);

    [Fact]
    public void VerdictComesFirstThenTheCautionBoxAndTextIsEscaped()
    {
        XDocument d = Parse(Page());
        XElement main = d.Root!.Element("body")!.Element("main")!;
        List<XElement> sections = main.Elements("section").ToList();
        // One line per night: on at, off at, and the headlight's false trigger of the invented night.
        Assert.Equal("verdict", (string?)sections[0].Attribute("id"));
        Assert.Equal(DemoReportData.Report().Nights.Count, sections[0].Descendants("li").Count());
        XElement verdict = sections[0].Descendants("li").First();
        Assert.Contains("on 17:12:00", verdict.Value, StringComparison.Ordinal);
        Assert.Contains("1 FALSE TRIGGER (headlight 23:41:07)", verdict.Value, StringComparison.Ordinal);
        Assert.Contains("problem", (string?)verdict.Attribute("class"), StringComparison.Ordinal);
        Assert.Equal("cautions", (string?)sections[1].Attribute("id"));
        Assert.Equal(ReportText.MainsCautions.Count, sections[1].Descendants("li").Count());
        Assert.Equal("findings", (string?)sections[2].Attribute("id"));
        // Markup characters in names come back as the same text after parsing.
        Assert.Equal("Demo night light <4 h timer> & relay", main.Element("header")!.Element("h1")!.Value);
        Assert.Contains("<dimmer> & 'grey'", d.Descendants("details").Last().Value, StringComparison.Ordinal);
    }

    [Fact]
    public void EventsGivenByTimeAreListedApartFromThoseDrawnFromTheSeed()
    {
        XDocument d = Parse(Page());
        List<XElement> details = d.Descendants("section").Single(s => (string?)s.Attribute("id") == "events").Elements("details").ToList();
        Assert.Equal(2, details.Count);
        Assert.StartsWith("1 event at the times the scenario gives", details[0].Element("summary")!.Value, StringComparison.Ordinal);
        Assert.Contains("headlights", details[0].Value, StringComparison.Ordinal);
        Assert.StartsWith("1 event drawn from the seed", details[1].Element("summary")!.Value, StringComparison.Ordinal);
        Assert.Contains("cloud", details[1].Value, StringComparison.Ordinal);
    }

    [Fact]
    public void PartsTableListsEveryPartWithTheCircuitHash()
    {
        XDocument d = Parse(Page());
        XElement parts = d.Descendants("section").Single(s => (string?)s.Attribute("id") == "parts");
        List<XElement> rows = parts.Descendants("tbody").Single().Elements("tr").ToList();
        Assert.Equal(DemoReportData.Report().Parts.Count, rows.Count);
        // garden-path.json: RTIM is 3.3 MΩ from vcc to tc.
        XElement rtim = rows.Single(r => r.Elements("td").First().Value == "RTIM");
        Assert.Equal("a vcc, b tc", rtim.Elements("td").ElementAt(2).Value);
        Assert.Equal("value 3.3 MΩ", rtim.Elements("td").ElementAt(3).Value);
        Assert.Contains(DemoReportData.Report().CircuitHash[..16], parts.Element("p")!.Value, StringComparison.Ordinal);
    }

    [Fact]
    public void PlotsAreInlineSvgWithUniqueIds()
    {
        XDocument d = Parse(Page());
        List<XElement> svgs = d.Descendants(s_svg + "svg").ToList();
        Assert.Equal(2, svgs.Count);
        Assert.All(svgs, s => Assert.Equal("0 0 1200 780", (string?)s.Attribute("viewBox")));
        Assert.All(svgs, s => Assert.True(s.Descendants(s_svg + "polyline").Count() > 20));
        Assert.Contains("timing capacitor (node tc)", svgs[0].Value, StringComparison.Ordinal);
        List<string> ids = d.Descendants().Select(e => (string?)e.Attribute("id")).OfType<string>().ToList();
        Assert.Equal(ids.Count, ids.Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void PageIsSelfContained()
    {
        string page = Page();
        XDocument d = Parse(page);
        Assert.Empty(d.Descendants("script"));
        Assert.Empty(d.Descendants("link"));
        Assert.DoesNotContain(d.Descendants(), e => e.Attribute("src") is not null);
        // Only in-page references: href / xlink:href must start with '#'.
        Assert.All(d.Descendants().SelectMany(e => e.Attributes()).Where(a => a.Name.LocalName == "href"),
            a => Assert.StartsWith("#", a.Value, StringComparison.Ordinal));
        Assert.DoesNotContain("url(http", page, StringComparison.Ordinal);
        Assert.DoesNotContain("@import", page, StringComparison.Ordinal);
    }

    [Fact]
    public void NoFindingsAndNoEventsReadPlainly()
    {
        var report = DemoReportData.Report() with { Findings = [], Events = [], Cautions = [] };
        XDocument d = Parse(HtmlReportWriter.Render(report, []));
        Assert.DoesNotContain(d.Descendants("section"), s => (string?)s.Attribute("id") == "cautions");
        Assert.DoesNotContain(d.Descendants("section"), s => (string?)s.Attribute("id") == "plots");
        Assert.Contains("No findings", d.Descendants("section").Single(s => (string?)s.Attribute("id") == "findings").Value, StringComparison.Ordinal);
    }

    [Fact]
    public void WriteIsAtomicAndUtf8()
    {
        string dir = Directory.CreateTempSubdirectory("nightsim-html-").FullName;
        try
        {
            string path = Path.Combine(dir, "report.html");
            HtmlReportWriter.Write(DemoReportData.Report(), [], path);
            Assert.Equal(HtmlReportWriter.Render(DemoReportData.Report(), []), File.ReadAllText(path));
            Assert.Single(Directory.GetFiles(dir));
        }
        finally { Directory.Delete(dir, true); }
    }
}
