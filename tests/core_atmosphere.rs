//! The standard atmosphere against its published table.

use gammaline::atmosphere;

/// U.S. Standard Atmosphere 1976, geopotential altitude (values as quoted in the shared
/// lifting-line reference, sec. 5): (H m, T K, p Pa, rho kg/m^3).
const TABLE: [(f64, f64, f64, f64); 4] = [
    (0.0, 288.15, 101_325.0, 1.225),
    (1000.0, 281.65, 89_874.6, 1.11164),
    (5000.0, 255.65, 54_019.9, 0.73612),
    (11_000.0, 216.65, 22_632.0, 0.36392),
];

#[test]
fn table_values_to_printed_precision() {
    for (h, t, p, rho) in TABLE {
        let air = atmosphere::at(h);
        assert!(
            (air.temperature - t).abs() < 0.005,
            "T at {h}: {}",
            air.temperature
        );
        assert!(
            (air.pressure - p).abs() / p < 2e-5,
            "p at {h}: {}",
            air.pressure
        );
        assert!(
            (air.density - rho).abs() < 1e-4,
            "rho at {h}: {}",
            air.density
        );
    }
}

#[test]
fn sea_level_sound_speed_and_viscosity() {
    // a0 = 340.29 m/s, mu0 = 1.7894e-5 Pa s (1976 standard, sea-level values).
    let air = atmosphere::at(0.0);
    assert!((air.speed_of_sound - 340.29).abs() < 0.01);
    assert!((air.viscosity - 1.7894e-5).abs() < 1e-9);
}

#[test]
fn isothermal_layer_above_11_km() {
    // 216.65 K from 11 to 20 km (1976 standard, layer table).
    assert!((atmosphere::at(15_000.0).temperature - 216.65).abs() < 1e-9);
    assert!(atmosphere::at(15_000.0).pressure < atmosphere::at(11_000.0).pressure);
}
