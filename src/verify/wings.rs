//! Wings built in code for the verification cases (and the tests, which share them): untwisted
//! straight-tapered wings of span 2 and the elliptic planform sampled at the collocation points.

use std::collections::BTreeMap;
use std::f64::consts::PI;

use crate::wing::{Airfoil, Condition, Control, ControlKind, Station, Wing};

/// A thin-airfoil section: slope 2 pi, no camber, no drag (thin-airfoil theory's a0).
#[must_use]
pub fn thin() -> Airfoil {
    Airfoil {
        cl_max: 1.5,
        ..Airfoil::default()
    }
}

/// One station of airfoil `a`, leading edge on the y axis, no dihedral.
#[must_use]
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
#[must_use]
pub fn wing(stations: Vec<Station>, airfoil: Airfoil) -> Wing {
    Wing {
        name: "test".into(),
        symmetric: true,
        stations,
        airfoils: BTreeMap::from([("a".to_string(), airfoil)]),
        controls: Vec::new(),
        condition: Condition::default(),
        reference: Default::default(),
    }
}

/// Untwisted straight-tapered wing of span 2 (semispan 1) with the given AR and taper.
#[must_use]
pub fn tapered(aspect_ratio: f64, taper: f64) -> Wing {
    let span = 2.0;
    let area = span * span / aspect_ratio;
    let root = 2.0 * area / (span * (1.0 + taper));
    wing(
        vec![station(0.0, root, 0.0), station(1.0, root * taper, 0.0)],
        thin(),
    )
}

/// Untwisted rectangular wing of span 2 with the given aspect ratio.
#[must_use]
pub fn rectangular(aspect_ratio: f64) -> Wing {
    tapered(aspect_ratio, 1.0)
}

/// The AR 6 rectangular wing of [`rectangular`] swept 30 deg back along its leading edge
/// (the swept wing of docs/theory.md's vortex-method grid study).
#[must_use]
pub fn swept_ar6() -> Wing {
    let mut w = rectangular(6.0);
    for s in &mut w.stations {
        s.x_le = s.y * 30.0_f64.to_radians().tan();
    }
    w
}

/// The right-half collocation points of an `n`-term symmetric solve of a span-2 wing,
/// `y = -cos(k pi/(n + 1))` for the positive ones, with the root and the tip, in order.
#[must_use]
pub fn collocation_stations_y(n: usize) -> Vec<f64> {
    let mut ys: Vec<f64> = (1..=n)
        .map(|k| -(k as f64 * PI / (n as f64 + 1.0)).cos())
        .filter(|y| *y > 1e-12)
        .collect();
    ys.extend([0.0, 1.0]);
    ys.sort_by(f64::total_cmp);
    ys
}

/// An elliptic planform of span 2 and root chord `c0` with stations exactly at the
/// right-half collocation points of an `n`-term solve, the root and the tip, so the solver sees
/// the exact elliptic chord at every collocation point.
#[must_use]
pub fn elliptic_at_collocation(c0: f64, n: usize) -> Wing {
    let stations = collocation_stations_y(n)
        .into_iter()
        .map(|y| station(y, c0 * (1.0 - y * y).max(0.0).sqrt(), 0.0))
        .collect();
    wing(stations, thin())
}

/// A rectangular wing of span 2 and chord `chord` whose twist, from Glauert's monoplane
/// equation, asks for Prandtl's bell loading Gamma = Gamma_0 (1 - eta^2)^(3/2) with
/// `A_1 = a1`, `A_3 = -a1/3`, stations at the collocation points of an `n`-term solve.
///
/// With A_3 = -A_1/3: sin(theta) - sin(3 theta)/3 = (4/3) sin^3(theta) and
/// 1 + 3 (A_3/A_1) sin(3 theta)/sin(theta) = 4 sin^2(theta) - 2, so the monoplane equation
/// alpha = (4b/(a0 c)) sum A_n sin(n theta) + sum n A_n sin(n theta)/sin(theta) (Glauert, *The
/// Elements of Aerofoil and Airscrew Theory*, 1926) asks for
/// alpha(theta) = A_1 ((4/3) mu sin^3(theta) + 4 sin^2(theta) - 2), mu = 4b/(a0 c).
#[must_use]
pub fn bell_loaded(chord: f64, a1: f64, n: usize) -> Wing {
    let mu = 4.0 * 2.0 / (thin().lift_slope * chord);
    let twist = |y: f64| {
        let s2 = 1.0 - y * y;
        a1 * (4.0 / 3.0 * mu * s2.powf(1.5) + 4.0 * s2 - 2.0)
    };
    let stations = collocation_stations_y(n)
        .into_iter()
        .map(|y| station(y, chord, twist(y).to_degrees()))
        .collect();
    wing(stations, thin())
}

/// A smooth tapered wing of span 2 and aspect ratio about 8: chord 0.3125 (1 - 0.6 eta^2) and
/// twist -3 eta^2 deg, described by 81 stations, with the profile-drag polar
/// cd = 0.008 + 0.006 cl^2: no kink at the root, unlike a straight taper, and the kinks between
/// stations too weak to matter (docs/theory.md, convergence study).
#[must_use]
pub fn smooth_tapered() -> Wing {
    let stations = (0..=80)
        .map(|i| {
            let eta = f64::from(i) / 80.0;
            station(eta, 0.3125 * (1.0 - 0.6 * eta * eta), -3.0 * eta * eta)
        })
        .collect();
    let airfoil = Airfoil {
        cd0: 0.008,
        cd2: 0.006,
        ..thin()
    };
    wing(stations, airfoil)
}

/// A part-span aileron from `y_inner` to `y_outer`, right side deflected `deflection_deg`
/// trailing edge down, with the thin-airfoil effectiveness.
#[must_use]
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

/// A rectangular AR-8 wing of span 2 with a part-span aileron from 60% to 95% semispan,
/// 25% chord, right side deflected 10 deg trailing edge down.
#[must_use]
pub fn aileron_wing() -> Wing {
    let mut w = rectangular(8.0);
    w.controls.push(aileron(0.6, 0.95, 0.25, 10.0));
    w
}
