using NightSim.Analysis;
using NightSim.Runs;
using NightSim.Targets;

namespace NightSim.Tests.Runs;

/// <summary>Which nights of a long run get their own plots: the interesting ones, worst first, at most five.</summary>
public sealed class PlottedNightsTests
{
    private static readonly DateOnly s_first = new(2026, 11, 20);

    private static NightSummary Night(int day) => new() { Date = s_first.AddDays(day) };

    private static List<NightSummary> Quiet(int count) => [.. Enumerable.Range(0, count).Select(Night)];

    [Fact]
    public void A_Week_Plots_Every_Night()
    {
        List<NightSummary> week = Quiet(PlottedNights.AllUpTo);
        Assert.Equal(week.Select(n => n.Date), PlottedNights.Select(week, []));
    }

    [Fact]
    public void A_Quiet_Month_Plots_Its_First_Night_Only()
    {
        Assert.Equal([s_first], PlottedNights.Select(Quiet(30), []));
    }

    [Fact]
    public void A_Year_Plots_The_Worst_Five_In_Date_Order()
    {
        List<NightSummary> year = Quiet(365);
        year[200] = year[200] with { EarlyOffs = 1 };
        year[10] = year[10] with { FalseTriggers = 1 };
        year[11] = year[11] with { FalseTriggers = 3 };
        year[300] = year[300] with { ChatterBursts = 2 };
        year[150] = year[150] with { Missed = true };
        year[40] = year[40] with { OnAfterSunrise = true, FalseTriggers = 1 };
        year[41] = year[41] with { FalseTriggers = 1, EarlyOffs = 1 };
        NightTargets[] targets = [.. year.Select(n => new NightTargets(n.Date, [new TargetCheck("on-time", n.Date != year[250].Date, 10, "min", "")]))];
        // Gravest first: the lamp wrong all night (40: with a false trigger too, 150), a failed target (250), chatter
        // (300), then among the false triggers the one with two kinds of trouble (41); 11, 10 and the early off wait.
        IReadOnlyList<DateOnly> chosen = PlottedNights.Select(year, targets);
        Assert.Equal([year[40].Date, year[41].Date, year[150].Date, year[250].Date, year[300].Date], chosen);
    }

    [Fact]
    public void Among_Equals_The_Smaller_Target_Margin_And_Then_More_Events_Come_First()
    {
        List<NightSummary> month = Quiet(30);
        var targets = new List<NightTargets>();
        for (int i = 0; i < 30; i++)
        {
            month[i] = month[i] with { FalseTriggers = i % 3 + 1 }; // every night has a false trigger
            targets.Add(new NightTargets(month[i].Date, [new TargetCheck("switch-on-lux", true, i == 17 ? 0.01 : 5, "lx", "", Scale: 10)]));
        }
        IReadOnlyList<DateOnly> chosen = PlottedNights.Select(month, targets);
        Assert.Equal(PlottedNights.MostInteresting, chosen.Count);
        Assert.Contains(month[17].Date, chosen);   // the closest call
        Assert.Contains(month[2].Date, chosen);    // three false triggers, earliest of those
        Assert.DoesNotContain(month[0].Date, chosen); // one false trigger only
        Assert.Equal(chosen.Order(), chosen);
    }
}
