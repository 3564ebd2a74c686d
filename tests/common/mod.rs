//! Wings built in code for the tests.
#![allow(dead_code)]

use std::collections::BTreeMap;
use std::f64::consts::TAU;

use gammaline::wing::{Airfoil, Condition, Control, ControlKind, Station, Wing};

/// A thin-airfoil section (slope 2 pi, symmetric, no drag).
pub fn thin() -> Airfoil {
    Airfoil {
        lift_slope: TAU,
        alpha_zero_lift_deg: 0.0,
        cl_max: 1.5,
        cd0: 0.0,
        cd1: 0.0,
        cd2: 0.0,
        ..Airfoil::default()
    }
}

pub fn station(y: f64, chord: f64, twist_deg: f64) -> Station {
    Station {
        y,
        chord,
        twist_deg,
        airfoil: "a".into(),
        x_le: 0.0,
        z: 0.0,
    }
}

/// A symmetric wing from right-half stations, all of airfoil `a`.
pub fn wing(stations: Vec<Station>, airfoil: Airfoil) -> Wing {
    Wing {
        name: "test".into(),
        symmetric: true,
        stations,
        airfoils: BTreeMap::from([("a".to_string(), airfoil)]),
        controls: Vec::new(),
        condition: Condition::default(),
    }
}

/// Untwisted straight-tapered wing of span 2 (semispan 1) with the given AR and taper.
pub fn tapered(aspect_ratio: f64, taper: f64) -> Wing {
    let span = 2.0;
    let area = span * span / aspect_ratio;
    let root = 2.0 * area / (span * (1.0 + taper));
    wing(
        vec![station(0.0, root, 0.0), station(1.0, root * taper, 0.0)],
        thin(),
    )
}

pub fn rectangular(aspect_ratio: f64) -> Wing {
    tapered(aspect_ratio, 1.0)
}

/// An elliptic planform of span 2 and root chord `c0` with stations exactly at the
/// right-half collocation points of an `n`-term solve, the root and the tip, so the solver sees
/// the exact elliptic chord at every collocation point.
pub fn elliptic_at_collocation(c0: f64, n: usize) -> Wing {
    let mut ys: Vec<f64> = (1..=n)
        .map(|k| -(k as f64 * std::f64::consts::PI / (n as f64 + 1.0)).cos())
        .filter(|y| *y > 1e-12)
        .collect();
    ys.push(0.0);
    ys.push(1.0);
    ys.sort_by(f64::total_cmp);
    let stations = ys
        .into_iter()
        .map(|y| station(y, c0 * (1.0 - y * y).max(0.0).sqrt(), 0.0))
        .collect();
    wing(stations, thin())
}

pub fn aileron(y_inner: f64, y_outer: f64, fraction: f64, deflection_deg: f64) -> Control {
    Control {
        name: "aileron".into(),
        kind: ControlKind::Aileron,
        y_inner,
        y_outer,
        chord_fraction: fraction,
        deflection_deg,
        effectiveness: None,
    }
}

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

/// A rectangular AR-8 wing of span 2 with a part-span aileron from 60% to 95% semispan,
/// 25% chord, right side deflected 10 deg trailing edge down.
pub fn aileron_wing() -> Wing {
    let mut w = rectangular(8.0);
    w.controls.push(aileron(0.6, 0.95, 0.25, 10.0));
    w
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

/// A smooth tapered wing of span 2 and aspect ratio about 8: chord c0 (1 - 0.6 eta^2) and
/// twist -3 eta^2 deg, described by 81 stations: no kink at the root, unlike a straight taper,
/// and the kinks between stations too weak to matter (docs/theory.md, convergence study).
pub fn smooth_tapered() -> Wing {
    let stations = (0..=80)
        .map(|i| {
            let eta = f64::from(i) / 80.0;
            station(eta, 0.3125 * (1.0 - 0.6 * eta * eta), -3.0 * eta * eta)
        })
        .collect();
    wing(stations, with_drag(0.008, 0.0, 0.006))
}
