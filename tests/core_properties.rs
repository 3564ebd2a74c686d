//! Properties of the solver on random valid wings (proptest): symmetry, mirroring and
//! linearity in alpha (consequences of the linear lifting-line equation; common practice,
//! no source).

mod common;

use gammaline::solver::{self, Options};
use proptest::prelude::*;

/// A random full-span wing: three stations each side of the root, random chords and twists.
fn full_span_wing(chords: &[f64], twists: &[f64]) -> gammaline::wing::Wing {
    let ys = [-1.0, -0.6, -0.25, 0.0, 0.3, 0.7, 1.0];
    let stations = ys
        .iter()
        .zip(chords.iter().zip(twists))
        .map(|(&y, (&c, &t))| common::station(y, c, t))
        .collect();
    let mut wing = common::wing(stations, common::thin());
    wing.symmetric = false;
    wing
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(24))]

    #[test]
    fn mirrored_wings_have_no_roll_or_yaw(root in 0.1..0.5f64, taper in 0.2..1.0f64, washout in -4.0..2.0f64) {
        let mut wing = common::tapered(6.0, taper);
        wing.stations[0].chord = root;
        wing.stations[1].twist_deg = washout;
        let c = common::solve(&wing, 4.0).coefficients;
        prop_assert!(c.cl_roll.abs() < 1e-12 && c.cn.abs() < 1e-12);
    }

    #[test]
    fn mirroring_reverses_roll_and_yaw(
        chords in prop::collection::vec(0.05..0.4f64, 7),
        twists in prop::collection::vec(-4.0..4.0f64, 7),
        alpha in -4.0..10.0f64,
    ) {
        let wing = full_span_wing(&chords, &twists);
        let a = common::solve(&wing, alpha).coefficients;
        let b = common::solve(&wing.mirrored(), alpha).coefficients;
        let scale = a.cl.abs().max(1e-3);
        prop_assert!((a.cl - b.cl).abs() < 1e-10 * scale);
        prop_assert!((a.cl_roll + b.cl_roll).abs() < 1e-10 * scale);
        prop_assert!((a.cn + b.cn).abs() < 1e-10 * scale);
    }

    #[test]
    fn coefficients_are_linear_in_alpha(
        chords in prop::collection::vec(0.05..0.4f64, 7),
        twists in prop::collection::vec(-4.0..4.0f64, 7),
        a1 in -5.0..10.0f64,
        a2 in -5.0..10.0f64,
    ) {
        let wing = full_span_wing(&chords, &twists);
        let p = solver::prepare(&wing, Options::default()).expect("valid wing");
        let (x, y) = (a1.to_radians(), a2.to_radians());
        let mid = p.fourier_at(0.5 * (x + y));
        let (fx, fy) = (p.fourier_at(x), p.fourier_at(y));
        for ((m, u), v) in mid.iter().zip(&fx).zip(&fy) {
            prop_assert!((m - 0.5 * (u + v)).abs() < 1e-12);
        }
        let cl = |a: f64| p.coefficients(a).cl;
        prop_assert!((cl(0.5 * (x + y)) - 0.5 * (cl(x) + cl(y))).abs() < 1e-12);
    }
}
