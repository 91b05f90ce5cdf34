using System.Text.Json;
using System.Xml.Linq;
using NightSim.Cli.Rendering;
using NightSim.Reporting;
using Spectre.Console.Testing;

namespace NightSim.Tests.Reporting;

/// <summary>
/// The contacts-against-the-lamp summary in report.json, on the page and in the terminal (invented demo data: a 300 W
/// filament lamp on 1 A contacts, and a load of unstated kind). Numbers worked here: 300 W / 230 V = 1.304 A steady
/// (P = V·I for a resistance), 15 × 1.304 = 19.57 A at switch-on (common practice, from memory), against 3 × 1 A.
/// </summary>
public sealed class ContactReportTests
{
    [Fact]
    public void Json_Holds_The_Numbers_And_Nulls_For_What_Is_Not_Stated()
    {
        using var ms = new MemoryStream();
        JsonReportWriter.Write(DemoReportData.Report(), ms);
        JsonElement contacts = JsonDocument.Parse(ms.ToArray()).RootElement.GetProperty("contacts");
        Assert.Equal(2, contacts.GetArrayLength());
        JsonElement k1 = contacts[0];
        Assert.Equal("K1", k1.GetProperty("part").GetString());
        Assert.Equal("incandescent", k1.GetProperty("loadKind").GetString());
        Assert.Equal(300 / 230.0, k1.GetProperty("steadyCurrentAmps").GetDouble(), 6);
        Assert.Equal(15 * 300 / 230.0, k1.GetProperty("peakInrushAmps").GetDouble(), 6);
        Assert.Equal(3.0, k1.GetProperty("contactInrushLimitAmps").GetDouble());
        Assert.False(k1.GetProperty("inrushWithinRating").GetBoolean());
        Assert.False(k1.GetProperty("steadyWithinRating").GetBoolean()); // 1.304 A > 1 A
        Assert.True(k1.GetProperty("mayWeld").GetBoolean());
        Assert.Equal(1.0, k1.GetProperty("operationsPerNight").GetDouble());
        Assert.Equal(1e5 / 365.2425, k1.GetProperty("lifeYears").GetDouble(), 3);
        JsonElement k2 = contacts[1];
        Assert.Equal(JsonValueKind.Null, k2.GetProperty("loadKind").ValueKind);
        Assert.Equal(JsonValueKind.Null, k2.GetProperty("peakInrushAmps").ValueKind);
        Assert.Equal(JsonValueKind.Null, k2.GetProperty("contactCurrentAmps").ValueKind);
        Assert.Equal(JsonValueKind.Null, k2.GetProperty("steadyWithinRating").ValueKind);
        Assert.False(k2.GetProperty("mayWeld").GetBoolean()); // nothing stated, nothing judged
    }

    [Fact]
    public void Page_Shows_Each_Relay_With_The_Problem_Rows_Marked()
    {
        string html = HtmlReportWriter.Render(DemoReportData.Report(), []);
        XDocument d = XDocument.Parse(html["<!DOCTYPE html>\n".Length..]);
        XElement section = d.Descendants("section").Single(s => (string?)s.Attribute("id") == "contacts");
        List<XElement> tables = [.. section.Descendants("table")];
        Assert.Equal(["K1 → lamp", "K2 → porch <light> & 'sign'"], tables.Select(t => t.Element("caption")!.Value));
        XElement rating = tables[0].Descendants("tr").Single(r => r.Element("th")!.Value == "contact rating");
        Assert.Equal("fail", (string?)rating.Attribute("class"));
        Assert.Contains("the contacts may weld", rating.Value, StringComparison.Ordinal);
        XElement peak = tables[0].Descendants("tr").Single(r => r.Element("th")!.Value == "switch-on peak");
        Assert.Contains("up to 19.6 A", peak.Value, StringComparison.Ordinal);
        Assert.Contains("common practice, from memory", peak.Value, StringComparison.Ordinal);
        Assert.Contains(tables[1].Descendants("td"), td => td.Value.StartsWith("not stated: give the relay's contactCurrent", StringComparison.Ordinal));
        Assert.Contains(tables[1].Descendants("td"), td => td.Value.StartsWith("not known: state the load's loadKind", StringComparison.Ordinal));
        // After the nights and before the events.
        List<string?> ids = [.. d.Descendants("section").Select(s => (string?)s.Attribute("id"))];
        Assert.True(ids.IndexOf("nights") < ids.IndexOf("contacts") && ids.IndexOf("contacts") < ids.IndexOf("events"));
    }

    [Fact]
    public void Terminal_Lists_The_Contacts_Before_The_Findings()
    {
        var console = new TestConsole();
        TerminalReport.Render(DemoReportData.Report(), console);
        // Long lines wrap at the console width: compare with the whitespace folded.
        string output = System.Text.RegularExpressions.Regex.Replace(console.Output, @"\s+", " ");
        int contacts = output.IndexOf("Relay contacts", StringComparison.Ordinal);
        Assert.True(contacts > output.IndexOf("Nights", StringComparison.Ordinal) && contacts < output.IndexOf("Findings", StringComparison.Ordinal), output);
        Assert.Contains("K1 → lamp", output, StringComparison.Ordinal);
        Assert.Contains("1.3 A = 300 W / 230 V", output, StringComparison.Ordinal);
        Assert.Contains("the contacts may weld", output, StringComparison.Ordinal);
        Assert.Contains("K2 → porch <light> & 'sign'", output, StringComparison.Ordinal);
    }
}
