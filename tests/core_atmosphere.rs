//! The 1976 U.S. Standard Atmosphere against its own tables (U.S. Standard Atmosphere, 1976,
//! NOAA/NASA/USAF, table I, geopotential altitude; values as quoted in
//! lifting-line-reference.md sec. 5). Each tolerance is half a unit in the table's last digit.

use approx::assert_abs_diff_eq;
use gammaline::atmosphere::{at, geopotential_from_geometric, sutherland};

#[test]
fn sea_level() {
    let air = at(0.0);
    assert_abs_diff_eq!(air.temperature, 288.15, epsilon = 1e-9);
    assert_abs_diff_eq!(air.pressure, 101_325.0, epsilon = 1e-6);
    assert_abs_diff_eq!(air.density, 1.225, epsilon = 0.5e-3);
    // a0 = 340.29 m/s, mu0 = 1.7894e-5 Pa s
    assert_abs_diff_eq!(air.speed_of_sound, 340.29, epsilon = 0.005);
    assert_abs_diff_eq!(air.viscosity, 1.7894e-5, epsilon = 0.5e-9);
}

#[test]
fn table_values() {
    // (H m, T K, p Pa, rho kg/m^3)
    for (h, t, p, rho) in [
        (1000.0, 281.65, 89_874.6, 1.11164),
        (5000.0, 255.65, 54_019.9, 0.73612),
        (11_000.0, 216.65, 22_632.0, 0.36392),
    ] {
        let air = at(h);
        assert_abs_diff_eq!(air.temperature, t, epsilon = 0.005);
        // the tables print pressure to 0.1 Pa (1000, 5000 m) and 1 Pa (22632 at 11 km,
        // 22632.06 in full): allow 0.1 Pa throughout
        assert!(
            (air.pressure - p).abs() <= 0.1,
            "{h} m: p = {}",
            air.pressure
        );
        assert_abs_diff_eq!(air.density, rho, epsilon = 0.5e-5);
    }
}

/// Isothermal layer above 11 km: T stays 216.65 K and p falls exponentially, 20 km gives
/// 5474.89 Pa (1976 standard, table I; value from memory).
#[test]
fn stratosphere() {
    let air = at(20_000.0);
    assert_abs_diff_eq!(air.temperature, 216.65, epsilon = 1e-9);
    assert!(
        (air.pressure - 5474.89).abs() < 0.05,
        "p = {}",
        air.pressure
    );
}

/// Sutherland's law with the 1976 constants (eq. 51) at 216.65 K: 1.4216e-5 Pa s (table I;
/// value from memory).
#[test]
fn viscosity_at_the_tropopause() {
    assert_abs_diff_eq!(sutherland(216.65), 1.4216e-5, epsilon = 0.5e-9);
}

/// H = r0 Z/(r0 + Z), r0 = 6356.766 km (eq. 18): 11 km geometric is 10 981 m geopotential.
#[test]
fn geometric_to_geopotential() {
    assert!((geopotential_from_geometric(11_000.0) - 10_981.0).abs() < 0.5);
    assert_abs_diff_eq!(geopotential_from_geometric(0.0), 0.0);
}
