namespace NightSim.Devices.Roles;

/// <summary>Process family of a 555-class timer: it sets the input currents and leakage the timing network sees.</summary>
public enum TimerFamily
{
    Bipolar,
    Cmos,
}
