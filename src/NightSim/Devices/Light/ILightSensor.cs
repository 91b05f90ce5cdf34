namespace NightSim.Devices.Light;

/// <summary>A device that reads light: what it sees is described by its <see cref="LightInput"/>.</summary>
public interface ILightSensor
{
    /// <summary>The sensor's light input (channel, gain, own constant or piecewise-linear lux).</summary>
    LightInput Light { get; }

    /// <summary>Time constant of the sensor's response to falling light at illuminance <paramref name="lux"/> (at the
    /// sensor), seconds; 0 for a sensor that follows its light at once.</summary>
    double FallTimeConstant(double lux);
}
