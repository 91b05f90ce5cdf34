using System.Globalization;
using NightSim.Reporting;

namespace NightSim.Tests.Reporting;

/// <summary>trace.csv: culture-independent output (RFC 4180 layout), round trip of values, clock column (invented demo data).</summary>
public sealed class CsvTraceWriterTests
{
    private static string Render(TraceTable t)
    {
        var sw = new StringWriter(CultureInfo.InvariantCulture);
        CsvTraceWriter.Write(t, sw);
        return sw.ToString();
    }

    private static string RenderUnder(string culture, TraceTable t)
    {
        CultureInfo saved = CultureInfo.CurrentCulture, savedUi = CultureInfo.CurrentUICulture;
        try
        {
            CultureInfo.CurrentCulture = CultureInfo.CurrentUICulture = CultureInfo.GetCultureInfo(culture);
            return Render(t);
        }
        finally
        {
            CultureInfo.CurrentCulture = saved;
            CultureInfo.CurrentUICulture = savedUi;
        }
    }

    [Fact]
    public void OutputIsIdenticalUnderDecimalCommaCulture()
    {
        TraceTable t = DemoReportData.Trace();
        string invariant = RenderUnder("", t);
        string german = RenderUnder("de-DE", t);
        Assert.Equal(invariant, german);
        Assert.Contains("0.01", invariant, StringComparison.Ordinal); // the night floor, with a decimal point
    }

    [Fact]
    public void ValuesRoundTripAndHeaderNamesColumns()
    {
        TraceTable t = DemoReportData.Trace();
        string[] lines = Render(t).Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(t.Times.Length + 1, lines.Length);
        Assert.Equal("time_s,clock,illuminance_lux,sens_volts,tc_volts,load_on", lines[0]);
        for (int r = 0; r < t.Times.Length; r += 97)
        {
            string[] cells = lines[r + 1].Split(',');
            Assert.Equal(2 + t.Columns.Count, cells.Length);
            Assert.Equal(t.Times[r], double.Parse(cells[0], CultureInfo.InvariantCulture), 6);
            for (int c = 0; c < t.Columns.Count; c++)
            {
                double back = double.Parse(cells[2 + c], CultureInfo.InvariantCulture);
                double want = t.Columns[c][r];
                Assert.True(Math.Abs(back - want) <= 1e-8 * Math.Max(1, Math.Abs(want)), $"row {r} col {c}: {back} vs {want}");
            }
        }
    }

    [Fact]
    public void ClockColumnCrossesMidnight()
    {
        // Origin 12:00 +01:00; run time 12 h is midnight of the next calendar day.
        var t = new TraceTable(DemoReportData.Origin, null, [43199.5, 43200, 43200.25], ["x"], [[1, 2, 3]]);
        string[] lines = Render(t).Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.StartsWith("43199.5,2026-11-20T23:59:59.500+01:00,", lines[1], StringComparison.Ordinal);
        Assert.StartsWith("43200,2026-11-21T00:00:00.000+01:00,", lines[2], StringComparison.Ordinal);
        Assert.StartsWith("43200.25,2026-11-21T00:00:00.250+01:00,", lines[3], StringComparison.Ordinal);
    }

    [Fact]
    public void NaNIsEmptyCellAndOddNamesAreQuoted()
    {
        var t = new TraceTable(DemoReportData.Origin, null, [0, 1], ["a,b", "say \"hi\""], [[double.NaN, 1], [2, double.PositiveInfinity]]);
        string[] lines = Render(t).Split('\n', StringSplitOptions.RemoveEmptyEntries);
        // RFC 4180 section 2: fields containing commas or quotes are enclosed in quotes, inner quotes doubled.
        Assert.Equal("time_s,clock,\"a,b\",\"say \"\"hi\"\"\"", lines[0]);
        Assert.EndsWith(",,2", lines[1], StringComparison.Ordinal);
        Assert.EndsWith(",1,", lines[2], StringComparison.Ordinal);
    }

    [Fact]
    public void MismatchedColumnIsRejectedAndNoFileIsWritten()
    {
        string dir = Directory.CreateTempSubdirectory("nightsim-csv-").FullName;
        try
        {
            var t = new TraceTable(DemoReportData.Origin, null, [0, 1, 2], ["a"], [[1, 2]]);
            var e = Assert.Throws<ArgumentException>(() => CsvTraceWriter.Write(t, Path.Combine(dir, "trace.csv")));
            Assert.Contains("'a'", e.Message, StringComparison.Ordinal);
            Assert.Empty(Directory.GetFiles(dir));
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void FileIsWrittenAtomicallyWithoutBom()
    {
        string dir = Directory.CreateTempSubdirectory("nightsim-csv-").FullName;
        try
        {
            string path = Path.Combine(dir, "trace.csv");
            CsvTraceWriter.Write(DemoReportData.Trace(), path);
            byte[] bytes = File.ReadAllBytes(path);
            Assert.Equal((byte)'t', bytes[0]);
            Assert.Equal(Render(DemoReportData.Trace()), System.Text.Encoding.UTF8.GetString(bytes));
            Assert.Single(Directory.GetFiles(dir));
        }
        finally { Directory.Delete(dir, true); }
    }
}
