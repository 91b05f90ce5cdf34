using System.Text.Json;
using NightSim.Reporting;

namespace NightSim.Supply;

/// <summary>Writes supply.json, the budget of <c>nightsim supply</c>, with stable keys (documented by
/// docs/supply.schema.json). SI units: V, A, W, F, Ω, s, Hz, lux. A number that does not exist (no rating, an infinite
/// time) is null. Only <c>statistics.cpuSeconds</c> varies between identical runs.</summary>
public static class SupplyJson
{
    /// <summary>Writes <paramref name="budget"/> to <paramref name="path"/> atomically.</summary>
    public static void Write(SupplyBudget budget, string tool, string netlist, IReadOnlyList<string> plots, string path) =>
        AtomicFile.Write(path, s => Write(budget, tool, netlist, plots, s));

    /// <summary>Writes <paramref name="budget"/> as indented UTF-8 JSON to <paramref name="stream"/>.</summary>
    public static void Write(SupplyBudget budget, string tool, string netlist, IReadOnlyList<string> plots, Stream stream)
    {
        using var w = new Utf8JsonWriter(stream, new JsonWriterOptions
        {
            Indented = true,
            Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        });
        SupplySection? s = budget.Section;
        w.WriteStartObject();
        w.WriteString("tool", tool);
        w.WriteString("netlist", netlist);
        w.WriteString("circuit", budget.CircuitName);
        w.WriteBoolean("supplyFound", s is not null);
        Text(w, "message", budget.Message);

        if (s is null)
        {
            w.WriteNull("mains");
            w.WriteNull("section");
            w.WriteNull("method");
        }
        else
        {
            w.WriteStartObject("mains");
            w.WriteString("source", s.Source.PartId);
            Number(w, "rms", budget.MainsRms);
            Number(w, "peak", budget.MainsPeak);
            Number(w, "frequency", budget.Frequency);
            w.WriteBoolean("overridden", budget.Overridden);
            w.WriteEndObject();

            w.WriteStartObject("section");
            Ids(w, "droppers", s.Droppers.Select(d => d.PartId));
            Ids(w, "bleeders", s.Bleeders.Select(b => b.PartId));
            Ids(w, "seriesResistors", s.SeriesResistors.Select(r => r.PartId));
            if (s.Rail is { } rail)
            {
                w.WriteStartObject("rail");
                w.WriteString("plus", rail.Plus);
                w.WriteString("minus", rail.Minus);
                w.WriteString("reason", rail.Reason);
                w.WriteEndObject();
            }
            else
            {
                w.WriteNull("rail");
            }
            Text(w, "railZener", s.RailZener?.PartId);
            Text(w, "smoothingCapacitor", s.Reservoir?.PartId);
            Ids(w, "zeners", s.Zeners.Select(z => z.PartId));
            Ids(w, "relays", s.Relays.Select(r => r.PartId));
            Text(w, "timer", s.Timer?.PartId);
            w.WriteEndObject();

            w.WriteStartObject("method");
            Number(w, "dayLux", SupplyRun.DayLux);
            Number(w, "nightLux", SupplyRun.NightLux);
            w.WriteNumber("windowCycles", SupplyRun.WindowCycles);
            Number(w, "maxSettleSeconds", SupplyRun.MaxSettle);
            Number(w, "pressResistance", SupplyRun.PressResistance);
            Number(w, "pressSeconds", SupplyRun.PressDuration);
            w.WriteEndObject();
        }

        w.WriteStartArray("states");
        foreach (SupplyState st in budget.States) WriteState(w, st);
        w.WriteEndArray();

        Number(w, "handDropperCurrent", budget.HandDropperCurrent);

        w.WriteStartArray("ratings");
        foreach (PartStress p in budget.Parts)
        {
            w.WriteStartObject();
            w.WriteString("part", p.PartId);
            w.WriteString("title", p.Title);
            Number(w, "power", p.Power);
            Number(w, "powerRating", p.PowerRating);
            Number(w, "powerFraction", p.PowerFraction);
            Number(w, "voltage", p.Voltage);
            w.WriteBoolean("voltageIsRms", p.VoltageIsRms);
            Number(w, "voltageRating", p.VoltageRating);
            Number(w, "voltageFraction", p.VoltageFraction);
            w.WriteString("worstState", p.WorstState);
            w.WriteString("verdict", p.Verdict);
            w.WriteEndObject();
        }
        w.WriteEndArray();

        if (budget.Bleeder is { } b && s is not null)
        {
            w.WriteStartObject("bleeder");
            Ids(w, "parts", s.Bleeders.Select(x => x.PartId));
            Number(w, "resistance", b.Resistance);
            Number(w, "capacitance", b.Capacitance);
            Number(w, "timeConstant", b.TimeConstant);
            Number(w, "startVoltage", b.StartVoltage);
            Number(w, "safeVoltage", BleederDischarge.SafeVoltage);
            w.WriteString("safeVoltageSource", BleederDischarge.SafeVoltageSource);
            Number(w, "secondsToSafe", b.SecondsToSafe);
            Number(w, "voltageAfterOneSecond", b.VoltageAfterOneSecond);
            Number(w, "plugPinVoltage", BleederDischarge.PlugPinVoltage);
            w.WriteString("plugPinSource", BleederDischarge.PlugPinSource);
            w.WriteBoolean("meetsPlugPinLimit", b.MeetsPlugPinLimit);
            Number(w, "largestBleederForPlugPins", b.LargestBleederForPlugPins);
            w.WriteEndObject();
        }
        else
        {
            w.WriteNull("bleeder");
        }

        if (budget.PullIn is { } p2)
        {
            w.WriteStartObject("pullIn");
            w.WriteString("relay", p2.RelayId);
            Number(w, "start", p2.Start);
            Number(w, "pullInTime", p2.PullInTime);
            Number(w, "railBefore", p2.RailBefore);
            Number(w, "railMin", p2.RailMin);
            Number(w, "sag", p2.Sag);
            Number(w, "coilPeak", p2.CoilPeak);
            Number(w, "pullInVoltage", p2.PullIn);
            Number(w, "dropOutVoltage", p2.DropOut);
            w.WriteNumber("operations", p2.Operations);
            w.WriteEndObject();
        }
        else
        {
            w.WriteNull("pullIn");
        }

        Strings(w, "plots", plots);
        Strings(w, "warnings", budget.Warnings);
        Strings(w, "cautions", budget.Cautions);
        w.WriteStartObject("statistics");
        Number(w, "cpuSeconds", budget.CpuSeconds);
        Number(w, "simulatedSeconds", budget.SimulatedSeconds);
        w.WriteEndObject();
        w.WriteEndObject();
    }

    private static void WriteState(Utf8JsonWriter w, SupplyState st)
    {
        w.WriteStartObject();
        w.WriteString("state", st.Key);
        w.WriteString("description", st.Description);
        Number(w, "lux", st.Lux);
        w.WriteBoolean("settled", st.Settled);
        Number(w, "settleSeconds", st.SettleSeconds);
        Number(w, "from", st.From);
        Number(w, "to", st.To);
        if (double.IsNaN(st.RailMean))
        {
            w.WriteNull("rail");
        }
        else
        {
            w.WriteStartObject("rail");
            Number(w, "mean", st.RailMean);
            Number(w, "min", st.RailMin);
            Number(w, "max", st.RailMax);
            Number(w, "ripple", st.Ripple);
            w.WriteEndObject();
        }
        Number(w, "dropperCurrentRms", st.DropperCurrentRms);
        w.WriteStartArray("zeners");
        foreach (ZenerReading z in st.Zeners)
        {
            w.WriteStartObject();
            w.WriteString("part", z.PartId);
            Number(w, "currentMin", z.CurrentMin);
            Number(w, "currentMax", z.CurrentMax);
            Number(w, "currentMean", z.CurrentMean);
            Number(w, "power", z.Power);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("coils");
        foreach (CoilReading c in st.Coils)
        {
            w.WriteStartObject();
            w.WriteString("part", c.PartId);
            Number(w, "voltageMean", c.VoltageMean);
            Number(w, "voltageMin", c.VoltageMin);
            Number(w, "voltageMax", c.VoltageMax);
            Number(w, "pullInVoltage", c.PullIn);
            Number(w, "dropOutVoltage", c.DropOut);
            w.WriteBoolean("pulledIn", c.Energised);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteStartArray("parts");
        foreach (PartReading p in st.Parts)
        {
            w.WriteStartObject();
            w.WriteString("part", p.PartId);
            Number(w, "power", p.Power);
            Number(w, "peakVoltage", p.PeakVoltage);
            Number(w, "rmsVoltage", p.RmsVoltage);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        Text(w, "note", st.Note);
        w.WriteEndObject();
    }

    /// <summary>A finite number rounded to 6 significant digits, else null.</summary>
    private static void Number(Utf8JsonWriter w, string name, double? value)
    {
        if (value is double v && double.IsFinite(v)) w.WriteNumber(name, Round(v));
        else w.WriteNull(name);
    }

    private static double Round(double v) => v == 0 ? 0 : double.Parse(v.ToString("G6", System.Globalization.CultureInfo.InvariantCulture), System.Globalization.CultureInfo.InvariantCulture);

    private static void Text(Utf8JsonWriter w, string name, string? value)
    {
        if (value is null) w.WriteNull(name); else w.WriteString(name, value);
    }

    private static void Ids(Utf8JsonWriter w, string name, IEnumerable<string> ids) => Strings(w, name, ids);

    private static void Strings(Utf8JsonWriter w, string name, IEnumerable<string> items)
    {
        w.WriteStartArray(name);
        foreach (string i in items) w.WriteStringValue(i);
        w.WriteEndArray();
    }
}
