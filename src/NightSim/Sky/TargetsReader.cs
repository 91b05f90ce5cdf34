using System.Text.Json;
using NightSim.Units;

namespace NightSim.Sky;

/// <summary>Reads the scenario's "targets" object (what the design must do) into <see cref="DesignTargets"/>,
/// recording every problem with its JSON path.</summary>
public static class TargetsReader
{
    /// <summary>Property names allowed under "targets".</summary>
    public static readonly string[] Keys =
        ["switchOnLux", "switchOnMinutesAfterSunset", "onTime", "offBy", "noFalseTrigger", "noEarlyOff", "noChatter", "offAtSunrise"];

    /// <summary>The targets at <paramref name="t"/> (the value of "targets"), or null after recording errors.</summary>
    public static DesignTargets? Read(JsonElement t, string path, ScenarioParseContext ctx)
    {
        if (!ctx.ExpectObject(t, path)) return null;
        ctx.CheckProperties(t, path, Keys);
        int before = ctx.Errors.Count;
        double? luxMin = null, luxMax = null, onMin = null, onMax = null;
        if (t.TryGetProperty("switchOnLux", out JsonElement lux) && ctx.ExpectObject(lux, path + ".switchOnLux"))
        {
            ctx.CheckProperties(lux, path + ".switchOnLux", "min", "max");
            luxMin = ctx.Number(lux, path + ".switchOnLux", "min", "lx", min: 0);
            luxMax = ctx.Number(lux, path + ".switchOnLux", "max", "lx", min: 0);
            if (luxMin is null && luxMax is null)
                ctx.Error(path + ".switchOnLux", "give \"min\", \"max\" or both", "e.g. \"switchOnLux\": { \"min\": 1, \"max\": 10 }");
            if (luxMin > luxMax) ctx.Error(path + ".switchOnLux", "\"min\" is above \"max\"", "swap the two values");
        }
        double? after = ctx.Number(t, path, "switchOnMinutesAfterSunset", null, min: -600, max: 600);
        if (t.TryGetProperty("onTime", out JsonElement on) && ctx.ExpectObject(on, path + ".onTime"))
        {
            ctx.CheckProperties(on, path + ".onTime", "min", "max");
            onMin = DurationValue(on, path + ".onTime", "min", ctx);
            onMax = DurationValue(on, path + ".onTime", "max", ctx);
            if (onMin is null && onMax is null)
                ctx.Error(path + ".onTime", "give \"min\", \"max\" or both", "e.g. \"onTime\": { \"min\": \"3h\", \"max\": \"5h\" }");
            if (onMin > onMax) ctx.Error(path + ".onTime", "\"min\" is above \"max\"", "swap the two values");
        }
        TimeSpan? offBy = ctx.Clock(t, path, "offBy");
        var result = new DesignTargets
        {
            SwitchOnLuxMin = luxMin,
            SwitchOnLuxMax = luxMax,
            SwitchOnMinutesAfterSunset = after,
            OnTimeMin = onMin,
            OnTimeMax = onMax,
            OffBy = offBy,
            NoFalseTrigger = ctx.Bool(t, path, "noFalseTrigger") ?? false,
            NoEarlyOff = ctx.Bool(t, path, "noEarlyOff") ?? false,
            NoChatter = ctx.Bool(t, path, "noChatter") ?? false,
            OffAtSunrise = ctx.Bool(t, path, "offAtSunrise") ?? false,
        };
        return ctx.Errors.Count == before ? result : null;
    }

    private static double? DurationValue(JsonElement obj, string path, string name, ScenarioParseContext ctx)
    {
        if (!obj.TryGetProperty(name, out JsonElement v)) return null;
        if (v.ValueKind == JsonValueKind.Number && v.GetDouble() > 0) return v.GetDouble();
        if (v.ValueKind == JsonValueKind.String && Duration.TryParse(v.GetString(), out double s, out _) && s > 0) return s;
        ctx.Error($"{path}.{name}", $"{ScenarioParseContext.Describe(v)} is not a duration", "write seconds or a duration such as \"3.5h\" or \"210min\"");
        return null;
    }
}
