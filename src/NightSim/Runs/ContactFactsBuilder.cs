using NightSim.Analysis;
using NightSim.Devices;

namespace NightSim.Runs;

/// <summary>Reads the switched-load role of every device that switches a named load into the <see cref="ContactFacts"/>
/// the analysis uses, with the load kind's typical inrush and power factor from <see cref="LoadInrushTable"/>.</summary>
public static class ContactFactsBuilder
{
    /// <summary>The contact facts of <paramref name="devices"/>, one per device with a named load, in device order.</summary>
    public static IReadOnlyList<ContactFacts> Build(IEnumerable<Device> devices)
    {
        var list = new List<ContactFacts>();
        foreach (Device d in devices)
        {
            if (d is not ISwitchedLoad { LoadName: string name } load) continue;
            LoadInrush? row = load.LoadKind is LoadKind kind ? LoadInrushTable.For(kind) : null;
            ContactRating rating = load.ContactRating;
            list.Add(new ContactFacts(d.PartId, name, load.LoadPower, load.LoadVoltage)
            {
                Kind = row?.Word,
                KindTitle = row?.Title,
                PowerFactor = load.LoadPowerFactor ?? row?.PowerFactor ?? 1.0,
                PowerFactorStated = load.LoadPowerFactor is not null,
                InrushLow = row?.MultipleLow ?? double.NaN,
                InrushHigh = row?.MultipleHigh ?? double.NaN,
                InrushSeconds = row?.Duration ?? double.NaN,
                InrushDuration = row?.DurationText,
                InrushSource = row?.Source,
                ContactCurrent = rating.Current,
                ContactVoltage = rating.Voltage,
                ContactLife = rating.Life,
                InrushLimit = rating.InrushLimit,
                InrushLimitStated = rating.InrushStated,
                InrushLimitMultiple = ContactRating.GeneralPurposeInrushMultiple,
            });
        }
        return list;
    }
}
