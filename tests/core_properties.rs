//! Properties every lifting-line solution must have whatever the wing: symmetry, mirror
//! images, agreement with an independent solution at any two angles of attack, and the sign conventions of docs/reference-values.md sec. 1.
//! (Consequences of the linear lifting-line equation; common practice, no single source.)

mod common;

use std::f64::consts::PI;

use approx::assert_relative_eq;
use common::*;
use gammaline::solver::series::{prepare, Options};
use gammaline::solver::Coefficients;
use gammaline::wing::{Airfoil, Station, Wing};
use proptest::prelude::*;

fn coefficients(w: &Wing, alpha_deg: f64, terms: usize) -> Coefficients {
    prepare(w, Options { terms })
        .expect("solvable")
        .coefficients(alpha_deg.to_radians())
}

/// A section with camber and drag, so every term of the polars is exercised.
fn cambered() -> Airfoil {
    Airfoil {
        lift_slope: 5.9,
        alpha_zero_lift_deg: -2.0,
        cl_max: 1.4,
        cd0: 0.009,
        cd1: -0.002,
        cd2: 0.006,
        ..Airfoil::default()
    }
}

/// An asymmetric wing described over the whole span: different chords and twists left and
/// right, so every moment is non-zero.
fn lopsided() -> Wing {
    let mut w = wing(
        vec![
            station(-1.1, 0.12, -1.0),
            station(0.0, 0.30, 0.0),
            station(0.4, 0.28, 0.5),
            station(1.0, 0.16, -2.5),
        ],
        cambered(),
    );
    w.symmetric = false;
    w.controls.push(aileron(0.5, 0.9, 0.25, 6.0));
    w
}

/// Mirroring a wing left to right flips the sign of the rolling and yawing moments and leaves
/// lift and drag alone. Moments are about y = 0 and the mirror is about y = 0, so the only
/// error is rounding: 1e-12 (relative to the coefficient's size).
#[test]
fn mirroring_flips_roll_and_yaw() {
    let w = lopsided();
    let a = coefficients(&w, 4.0, 40);
    let b = coefficients(&w.mirrored(), 4.0, 40);
    assert!(
        a.cl_roll.abs() > 1e-3 && a.cn.abs() > 1e-5,
        "test wing not asymmetric: {a:?}"
    );
    assert_relative_eq!(b.cl_roll, -a.cl_roll, max_relative = 1e-10);
    assert_relative_eq!(b.cn, -a.cn, max_relative = 1e-9);
    assert_relative_eq!(b.cl, a.cl, max_relative = 1e-12);
    assert_relative_eq!(b.cdi, a.cdi, max_relative = 1e-12);
    assert_relative_eq!(b.cdp, a.cdp, max_relative = 1e-12);
}

/// Right aileron trailing edge down (positive deflection) puts more lift on the right half:
/// negative Cl_roll (positive is right wing down, docs/reference-values.md sec. 1). The extra
/// lift on the right brings extra induced drag there, yawing the nose right, toward the
/// rising wing: positive Cn, the adverse yaw of ailerons. Antisymmetric, the deflection adds no
/// lift.
#[test]
fn aileron_signs() {
    let w = aileron_wing();
    let mut neutral = w.clone();
    neutral.controls[0].deflection_deg = 0.0;
    let c = coefficients(&w, 5.0, 60);
    let c0 = coefficients(&neutral, 5.0, 60);
    assert!(c.cl_roll < -0.01, "Cl_roll = {}", c.cl_roll);
    assert!(c.cn_induced > 1e-4, "Cn induced = {}", c.cn_induced);
    assert!(c0.cl_roll.abs() < 1e-14 && c0.cn.abs() < 1e-14, "{c0:?}");
    assert_relative_eq!(c.cl, c0.cl, max_relative = 1e-12);
    // With the deflection reversed everything about roll reverses too.
    let mut reversed = w.clone();
    reversed.controls[0].deflection_deg = -10.0;
    assert_relative_eq!(
        coefficients(&reversed, 5.0, 60).cl_roll,
        -c.cl_roll,
        max_relative = 1e-10
    );
}

/// The angle of attack of the reference line is arbitrary: adding 2 deg to every station's
/// twist and solving 2 deg lower must give the same wing. This ties the twist path (the
/// right-hand side) to the alpha path (the per-alpha response) of the solver.
#[test]
fn reference_line_is_arbitrary() {
    let w = lopsided();
    let mut turned = w.clone();
    for s in &mut turned.stations {
        s.twist_deg += 2.0;
    }
    let a = coefficients(&w, 5.0, 40);
    let b = coefficients(&turned, 3.0, 40);
    for (x, y) in [
        (a.cl, b.cl),
        (a.cdi, b.cdi),
        (a.cdp, b.cdp),
        (a.cl_roll, b.cl_roll),
        (a.cn, b.cn),
    ] {
        assert_relative_eq!(x, y, max_relative = 1e-9);
    }
}

/// A random tapered, twisted, cambered half wing.
fn half_wing() -> impl Strategy<Value = Wing> {
    (
        4.0..20.0f64,
        0.2..1.0f64,
        -5.0..2.0f64,
        -3.0..1.0f64,
        0.3..0.7f64,
    )
        .prop_map(|(ar, taper, tip_twist, kink_twist, kink)| {
            let span = 2.0;
            let area = span * span / ar;
            let root = 2.0 * area / (span * (1.0 + taper));
            let mid_chord = root * (1.0 - (1.0 - taper) * kink);
            let stations = vec![
                station(0.0, root, 0.0),
                station(kink, mid_chord, kink_twist),
                station(1.0, root * taper, tip_twist),
            ];
            wing(stations, cambered())
        })
}

/// The same wing described over the whole span with an independent twist on each side and a
/// shorter left half (so the span's midpoint is off y = 0).
fn asymmetric_wing() -> impl Strategy<Value = Wing> {
    (half_wing(), -2.0..2.0f64, -2.0..2.0f64, 0.6..1.0f64).prop_map(|(w, dl, dr, left)| {
        let mut w = unmirrored(&w);
        let last = w.stations.len() - 1;
        w.stations[0].twist_deg += dl;
        w.stations[last].twist_deg += dr;
        for s in w.stations.iter_mut().filter(|s| s.y < 0.0) {
            s.y *= left;
        }
        w
    })
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 48, ..ProptestConfig::default() })]

    /// A symmetric wing has no rolling or yawing moment, whichever way it is described: the
    /// mirrored description (odd/even split) and the whole-span description (full system)
    /// must agree with each other and give zero moments (to rounding, 1e-12).
    #[test]
    fn symmetric_wing_has_no_roll_or_yaw(w in half_wing(), alpha in -4.0..10.0f64) {
        let a = coefficients(&w, alpha, 30);
        let b = coefficients(&unmirrored(&w), alpha, 30);
        for c in [&a, &b] {
            prop_assert!(c.cl_roll.abs() < 1e-12, "Cl_roll = {}", c.cl_roll);
            prop_assert!(c.cn.abs() < 1e-12, "Cn = {}", c.cn);
        }
        prop_assert!((a.cl - b.cl).abs() < 1e-12 * a.cl.abs().max(1.0));
        prop_assert!((a.cdi - b.cdi).abs() < 1e-10 * a.cdi.abs().max(1e-6));
    }

    /// Mirroring flips the moments of any asymmetric wing.
    #[test]
    fn mirroring_flips_moments(w in asymmetric_wing(), alpha in -4.0..10.0f64) {
        let a = coefficients(&w, alpha, 30);
        let b = coefficients(&w.mirrored(), alpha, 30);
        let scale = a.cl.abs().max(0.01);
        prop_assert!((a.cl_roll + b.cl_roll).abs() < 1e-12 * scale);
        prop_assert!((a.cn + b.cn).abs() < 1e-12 * scale);
        prop_assert!((a.cl - b.cl).abs() < 1e-12 * scale);
    }

    /// At any two angles of attack the solver's CL, CDi and Cl_roll equal those of an
    /// independent solution of Glauert's collocation system written out below
    /// ([`independent_glauert`]), for asymmetric wings with camber, twist and a varying
    /// chord: a check of the solver's matrix, right-hand side and integrals, not of its
    /// own linearity. Both solve the same 30 x 30 system: rounding only, 1e-9.
    #[test]
    fn matches_an_independent_collocation_at_two_alphas(
        w in asymmetric_wing(),
        alpha in -4.0..8.0f64,
        step in 0.5..3.0f64,
    ) {
        let p = prepare(&w, Options { terms: 30 }).expect("solvable");
        let ar = p.geometry().aspect_ratio;
        for alpha_deg in [alpha, alpha + step] {
            let c = p.solve(&at_alpha(alpha_deg)).expect("solves").coefficients;
            let [cl, cdi, cl_roll] = independent_glauert(&w, ar, alpha_deg.to_radians(), 30);
            let scale = cl.abs().max(0.1);
            prop_assert!((c.cl - cl).abs() < 1e-9 * scale, "CL {} vs {cl}", c.cl);
            prop_assert!((c.cdi - cdi).abs() < 1e-9 * scale * scale, "CDi {} vs {cdi}", c.cdi);
            prop_assert!((c.cl_roll - cl_roll).abs() < 1e-9 * scale, "Cl_roll {} vs {cl_roll}", c.cl_roll);
        }
    }
}

/// Glauert's solution of Prandtl's equation for a whole-span wing without controls, written
/// straight from the monoplane equation (Glauert, *The Elements of Aerofoil and Airscrew
/// Theory*, 1926; Anderson, *Fundamentals of Aerodynamics*, 6th ed., sec. 5.3.4): with
/// y = y_mid - (b/2) cos(theta) at theta_k = k pi/(N + 1),
///   sum_n A_n sin(n theta_k) (4 b/(a0 c) + n/sin(theta_k)) = alpha + twist - alpha_L0,
/// then CL = pi AR A_1, CDi = pi AR sum n A_n^2 and Cl_roll = (pi AR/4) A_2 about the span
/// midpoint, moved to y = 0 by - CL y_mid/b (docs/reference-values.md sec. 2).
fn independent_glauert(w: &Wing, aspect_ratio: f64, alpha: f64, n: usize) -> [f64; 3] {
    let (left, right) = w.span_ends();
    let (b, y_mid) = (right - left, 0.5 * (left + right));
    let mut m = nalgebra::DMatrix::zeros(n, n);
    let mut rhs = nalgebra::DVector::zeros(n);
    for k in 0..n {
        let theta = (k + 1) as f64 * std::f64::consts::PI / (n + 1) as f64;
        let section = w.section_at(y_mid - 0.5 * b * theta.cos());
        let mu = 4.0 * b / (section.airfoil.lift_slope * section.chord);
        for j in 0..n {
            let order = (j + 1) as f64;
            m[(k, j)] = (order * theta).sin() * (mu + order / theta.sin());
        }
        rhs[k] = alpha + section.twist - section.airfoil.alpha_zero_lift_deg.to_radians();
    }
    let a = m.lu().solve(&rhs).expect("regular");
    let cl = PI * aspect_ratio * a[0];
    let cdi = PI
        * aspect_ratio
        * a.iter()
            .enumerate()
            .map(|(j, an)| (j + 1) as f64 * an * an)
            .sum::<f64>();
    let cl_roll = PI * aspect_ratio / 4.0 * a[1] - cl * y_mid / b;
    [cl, cdi, cl_roll]
}

/// A station list helper must keep stations strictly increasing (guards the generators).
#[test]
fn generators_build_valid_wings() {
    let w = unmirrored(&tapered(6.0, 0.5));
    let ys: Vec<f64> = w.stations.iter().map(|s: &Station| s.y).collect();
    assert!(ys.windows(2).all(|p| p[0] < p[1]), "{ys:?}");
    assert!(prepare(&w, Options::default()).is_ok());
}
