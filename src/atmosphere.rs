//! The 1976 U.S. Standard Atmosphere (identical to the ICAO standard atmosphere below 32 km),
//! by geopotential altitude.
//!
//! Source: U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF), layer table 4 and eqs. 23, 33a,
//! 33b; viscosity by Sutherland's law, eq. 51.

/// Lowest altitude accepted, m (the standard's table starts at -5 km).
pub const MIN_ALTITUDE: f64 = -5000.0;
/// Highest altitude accepted, m (top of the 32-47 km layer).
pub const MAX_ALTITUDE: f64 = 47000.0;

/// Sea-level temperature, K.
pub const T0: f64 = 288.15;
/// Sea-level pressure, Pa.
pub const P0: f64 = 101_325.0;
/// Specific gas constant of air, J/(kg K).
pub const R_AIR: f64 = 287.052_87;
/// Standard gravity, m/s^2.
pub const G0: f64 = 9.806_65;
/// Ratio of specific heats of air.
pub const GAMMA: f64 = 1.4;

/// Layer bases: geopotential altitude (m) and temperature lapse rate (K/m) above it.
const LAYERS: [(f64, f64); 4] = [
    (0.0, -0.0065),
    (11_000.0, 0.0),
    (20_000.0, 0.001),
    (32_000.0, 0.0028),
];

/// Air properties at one altitude.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Air {
    /// Temperature, K.
    pub temperature: f64,
    /// Pressure, Pa.
    pub pressure: f64,
    /// Density, kg/m^3.
    pub density: f64,
    /// Speed of sound, m/s.
    pub speed_of_sound: f64,
    /// Dynamic viscosity, Pa s.
    pub viscosity: f64,
}

/// Air at geopotential altitude `h` (m). Values outside
/// [`MIN_ALTITUDE`]..=[`MAX_ALTITUDE`] are clamped to that range.
#[must_use]
pub fn at(h: f64) -> Air {
    let h = h.clamp(MIN_ALTITUDE, MAX_ALTITUDE);
    let (mut base_t, mut base_p) = (T0, P0);
    let mut i = 0;
    while i + 1 < LAYERS.len() && h > LAYERS[i + 1].0 {
        let thickness = LAYERS[i + 1].0 - LAYERS[i].0;
        (base_t, base_p) = climb(base_t, base_p, LAYERS[i].1, thickness);
        i += 1;
    }
    let (temperature, pressure) = climb(base_t, base_p, LAYERS[i].1, h - LAYERS[i].0);
    Air {
        temperature,
        pressure,
        density: pressure / (R_AIR * temperature),
        speed_of_sound: (GAMMA * R_AIR * temperature).sqrt(),
        viscosity: sutherland(temperature),
    }
}

/// Temperature and pressure after climbing `dh` through a layer of lapse rate `lapse`
/// (hydrostatic equation with constant gravity; 1976 standard eqs. 33a and 33b).
fn climb(t: f64, p: f64, lapse: f64, dh: f64) -> (f64, f64) {
    if lapse == 0.0 {
        (t, p * (-G0 * dh / (R_AIR * t)).exp())
    } else {
        let t1 = t + lapse * dh;
        (t1, p * (t1 / t).powf(-G0 / (R_AIR * lapse)))
    }
}

/// Sutherland's law with the 1976 standard's constants: mu = 1.458e-6 T^1.5 / (T + 110.4).
#[must_use]
pub fn sutherland(temperature: f64) -> f64 {
    1.458e-6 * temperature.powf(1.5) / (temperature + 110.4)
}

/// Converts geometric altitude to geopotential altitude: H = r0 Z / (r0 + Z),
/// r0 = 6356.766 km (1976 standard, eq. 18).
#[must_use]
pub fn geopotential_from_geometric(z: f64) -> f64 {
    const R0: f64 = 6_356_766.0;
    R0 * z / (R0 + z)
}
