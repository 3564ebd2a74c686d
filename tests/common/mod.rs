//! Wings built in code for the tests.
#![allow(dead_code)]

use gammaline::wing::{Airfoil, Condition, Station, Wing};

// Each test file uses a different subset of the shared builders.
#[allow(unused_imports)]
pub use gammaline::verify::wings::{
    aileron, aileron_wing, elliptic_at_collocation, rectangular, smooth_tapered, station, tapered,
    thin, wing,
};

pub fn at_alpha(alpha_deg: f64) -> Condition {
    Condition {
        alpha_deg,
        ..Condition::default()
    }
}

/// Straight-tapered wing of span 2 with linear twist from 0 at the root to `tip_twist_deg`.
pub fn tapered_twisted(aspect_ratio: f64, taper: f64, tip_twist_deg: f64) -> Wing {
    let mut w = tapered(aspect_ratio, taper);
    w.stations[1].twist_deg = tip_twist_deg;
    w
}

/// A section with a profile-drag polar cd = cd0 + cd1 cl + cd2 cl^2 (slope 2 pi, no camber).
pub fn with_drag(cd0: f64, cd1: f64, cd2: f64) -> Airfoil {
    Airfoil {
        cd0,
        cd1,
        cd2,
        ..thin()
    }
}

/// A pointed-tip (taper 0) untwisted wing of span 2 and aspect ratio 6.
pub fn pointed(aspect_ratio: f64) -> Wing {
    tapered(aspect_ratio, 0.0)
}

/// The same wing described over its whole span (symmetric = false), stations from -b/2 to b/2.
pub fn unmirrored(w: &Wing) -> Wing {
    assert!(w.symmetric, "unmirrored: wing must be symmetric");
    let mut out = w.clone();
    out.symmetric = false;
    let mut stations: Vec<Station> = w
        .stations
        .iter()
        .rev()
        .filter(|s| s.y > 0.0)
        .map(|s| Station {
            y: -s.y,
            ..s.clone()
        })
        .collect();
    stations.extend(w.stations.iter().cloned());
    out.stations = stations;
    out
}

/// Relative difference |a - b| / |b|.
pub fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}
