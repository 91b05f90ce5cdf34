using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using System.Text.RegularExpressions;
using NightSim.Cli;

namespace NightSim.Tests.Cli;

/// <summary>
/// The demo report pages in a real headless browser (Debian's chromium; .ci/run installs it): they load without
/// script errors, the plots have a visible size, and the verdict and the findings start on the first screen
/// (1280 × 800 CSS pixels, a common laptop window). A small probe script is added to a copy of each page; it writes
/// what it measured into the DOM, which the browser dumps. Skipped, with a message, only when chromium is missing.
/// </summary>
public sealed partial class BrowserReportTests
{
    private const int ScreenWidth = 1280, ScreenHeight = 800;

    internal static string? Chromium() =>
        new[] { "/usr/bin/chromium", "/usr/bin/chromium-browser", "/usr/lib/chromium/chromium" }.FirstOrDefault(File.Exists);

    private const string Probe = """
        <script>
        var errors = [];
        window.addEventListener('error', function (e) { errors.push(String(e.message)); });
        var oldError = console.error; console.error = function () { errors.push(Array.prototype.join.call(arguments, ' ')); oldError.apply(console, arguments); };
        window.addEventListener('load', function () {
          function top(id) { var e = document.getElementById(id); return e ? Math.round(e.getBoundingClientRect().top) : -1; }
          var svgs = Array.prototype.slice.call(document.querySelectorAll('figure svg'));
          var visible = svgs.filter(function (s) { var r = s.getBoundingClientRect(); return r.width > 600 && r.height > 300; }).length;
          var p = document.createElement('pre'); p.id = 'probe';
          p.textContent = 'verdict=' + top('verdict') + ';findings=' + top('findings') + ';svgs=' + svgs.length + ';visible=' + visible + ';errors=' + errors.length + ':' + errors.join('|');
          document.body.appendChild(p);
        });
        </script>
        """;

    [GeneratedRegex(@"verdict=(-?\d+);findings=(-?\d+);svgs=(\d+);visible=(\d+);errors=(\d+):(.*)")]
    private static partial Regex ProbeLine();

    [ChromiumTheory]
    [InlineData("garden-path-driveway")]
    [InlineData("trigger-filter-absent")]
    [InlineData("dusk-switch-self-lit")] // 24 000 relay operations: every plot is thinned to what its pixels can show
    public void Demo_Report_Loads_Cleanly_With_Verdict_And_Findings_On_The_First_Screen(string demo)
    {
        string? chromium = Chromium();
        string dir = Path.Combine(Path.GetTempPath(), "nightsim-browser-" + Guid.NewGuid().ToString("N"));
        try
        {
            var output = new StringWriter();
            var error = new StringWriter();
            int exit = Program.CreateRoot().Parse(["simulate", Path.Combine(RepoPaths.Netlists, demo + ".json"), "--out", dir, "--no-progress"])
                .Invoke(new InvocationConfiguration { Output = output, Error = error });
            Assert.True(exit == 0, error.ToString());
            string page = File.ReadAllText(Path.Combine(dir, "report.html"));
            Assert.DoesNotContain("<script", page, StringComparison.Ordinal); // the page itself runs nothing
            string probed = Path.Combine(dir, "probed.html");
            File.WriteAllText(probed, page.Replace("</body>", Probe + "</body>", StringComparison.Ordinal));

            string dom = RunChromium(chromium!, dir, "--dump-dom", new Uri(probed).AbsoluteUri);
            Match m = ProbeLine().Match(dom);
            Assert.True(m.Success, "no probe result in the dumped page: " + dom[..Math.Min(400, dom.Length)]);
            int verdict = int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture), findings = int.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture);
            int svgs = int.Parse(m.Groups[3].Value, CultureInfo.InvariantCulture), visible = int.Parse(m.Groups[4].Value, CultureInfo.InvariantCulture);
            Assert.True(m.Groups[5].Value == "0", "script errors: " + m.Groups[6].Value);
            Assert.InRange(verdict, 0, ScreenHeight / 2);
            Assert.InRange(findings, 0, ScreenHeight - 60); // the findings heading and its first lines are on screen
            Assert.True(svgs > 0 && visible == svgs, $"{visible} of {svgs} plots visible");

            // A screenshot of the first screen, kept beside the report for a person to look at.
            RunChromium(chromium!, dir, "--screenshot=" + Path.Combine(dir, "first-screen.png"), new Uri(Path.Combine(dir, "report.html")).AbsoluteUri);
            Assert.True(new FileInfo(Path.Combine(dir, "first-screen.png")).Length > 10_000);
        }
        finally
        {
            if (Directory.Exists(dir)) Directory.Delete(dir, recursive: true);
        }
    }

    private static string RunChromium(string chromium, string dir, string action, string url)
    {
        var psi = new ProcessStartInfo(chromium)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (string a in (string[])["--headless", "--no-sandbox", "--disable-gpu", "--hide-scrollbars", "--allow-file-access-from-files",
                     $"--window-size={ScreenWidth},{ScreenHeight}", $"--user-data-dir={Path.Combine(dir, "profile")}", action, url])
            psi.ArgumentList.Add(a);
        using Process p = Process.Start(psi)!;
        Task<string> stdout = p.StandardOutput.ReadToEndAsync();
        Task<string> stderr = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(120_000))
        {
            p.Kill(entireProcessTree: true);
            Assert.Fail("chromium did not finish within 2 minutes");
        }
        Assert.True(p.ExitCode == 0, $"chromium exit {p.ExitCode}: {stderr.Result}");
        return stdout.Result;
    }
}

/// <summary>A theory that is skipped, saying why, when chromium is not installed.</summary>
public sealed class ChromiumTheoryAttribute : TheoryAttribute
{
    public ChromiumTheoryAttribute()
    {
        if (BrowserReportTests.Chromium() is null)
            Skip = "chromium is not installed here (apt-get install chromium); .ci/run installs it, so CI runs this test";
    }
}
