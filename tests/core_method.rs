//! The method seam: the prepared-wing interface, the roll-rate input and the Mach correction,
//! as any method sees them.

mod common;

use std::f64::consts::PI;

use common::{elliptic_at_collocation, rectangular, rel};
use gammaline::solver::{self, compressibility, Method, DEFAULT_TERMS};
use gammaline::wing::{file, Condition};

fn at(alpha_deg: f64, speed: f64, roll_rate: f64) -> Condition {
    Condition {
        alpha_deg,
        speed,
        roll_rate,
        ..Condition::default()
    }
}

#[test]
fn elliptic_wing_roll_damping_matches_the_closed_form() {
    // Clp = -(a0/8)/(1 + 2 a0/(pi AR)) = -(pi/4) AR/(AR + 4) for a0 = 2 pi: -0.4712 at AR 6
    // (lifting-line reference, sec. 3, roll damping of the elliptic wing; the antisymmetric
    // load of an elliptic planform under linear twist is A_2 alone, so the series is exact).
    let ar = 6.0;
    let mut w = elliptic_at_collocation(8.0 / (PI * ar), DEFAULT_TERMS);
    let rate = 0.05;
    w.condition = at(2.0, 20.0, rate);
    let rolling = solver::solve(&w, &w.condition, Method::default()).expect("solves");
    let still = solver::solve(&w, &at(2.0, 20.0, 0.0), Method::default()).expect("solves");
    let clp = (rolling.coefficients.cl_roll - still.coefficients.cl_roll) / rate;
    let expected = -(PI / 4.0) * ar / (ar + 4.0);
    assert!(rel(clp, expected) < 1e-3, "Clp {clp} vs {expected}");
    // Roll is antisymmetric: lift unchanged.
    assert!((rolling.coefficients.cl - still.coefficients.cl).abs() < 1e-12);
}

#[test]
fn roll_rate_right_wing_down_damps_itself() {
    // Right wing down positive: the right wing's angle rises, so Cl_roll opposes the roll
    // (negative by the convention of the reference, sec. 1).
    let w = rectangular(8.0);
    let s = solver::solve(&w, &at(3.0, 20.0, 0.02), Method::default()).expect("solves");
    assert!(s.coefficients.cl_roll < 0.0, "{}", s.coefficients.cl_roll);
    let right = s.spanwise.iter().find(|p| p.y > 0.5).expect("right point");
    let left = s
        .spanwise
        .iter()
        .rev()
        .find(|p| p.y < -0.5)
        .expect("left point");
    assert!((right.y + left.y).abs() < 1e-12);
    assert!(right.cl > left.cl, "{} {}", right.cl, left.cl);
}

#[test]
fn prandtl_glauert_divides_the_section_slope_above_mach_0_3() {
    // cl_alpha(M) = cl_alpha(0)/sqrt(1 - M^2) (Anderson, Fundamentals of Aerodynamics,
    // eq. 11.52): the compressible wing equals the incompressible one with the slope divided.
    let w = rectangular(6.0);
    let fast = at(4.0, 0.5 * 340.294, 0.0);
    let beta = compressibility::beta(&fast);
    assert!((beta - (1.0f64 - 0.25).sqrt()).abs() < 1e-4, "{beta}");
    let compressible = solver::solve(&w, &fast, Method::default()).expect("solves");
    let mut slow_wing = w.clone();
    for a in slow_wing.airfoils.values_mut() {
        a.lift_slope /= beta;
    }
    let slow = solver::solve(&slow_wing, &at(4.0, 20.0, 0.0), Method::default()).expect("solves");
    assert!(rel(compressible.coefficients.cl, slow.coefficients.cl) < 1e-12);
    assert!(
        compressible.coefficients.cl
            > 1.05 * {
                solver::solve(&w, &at(4.0, 20.0, 0.0), Method::default())
                    .expect("solves")
                    .coefficients
                    .cl
            }
    );
    // At Mach 0.2 nothing changes; at Mach 0.7 a warning; at Mach 1 an error.
    assert_eq!(compressibility::beta(&at(4.0, 0.2 * 340.294, 0.0)), 1.0);
    let high = solver::solve(&w, &at(4.0, 0.7 * 340.294, 0.0), Method::default()).expect("solves");
    assert!(
        high.warnings.iter().any(|m| m.contains("Prandtl-Glauert")),
        "{:?}",
        high.warnings
    );
    let err = solver::solve(&w, &at(4.0, 345.0, 0.0), Method::default()).unwrap_err();
    assert!(err.to_string().contains("Mach"), "{err}");
}

#[test]
fn a_prepared_wing_fits_condition_changes_but_not_mach_roll_geometry_or_method() {
    let mut w = rectangular(7.0);
    w.condition = at(2.0, 20.0, 0.0);
    let p = solver::prepare(&w, Method::default()).expect("prepares");
    let mut edited = w.clone();
    edited.condition.alpha_deg = 6.0;
    edited.condition.speed = 40.0;
    assert!(p.fits(&edited, Method::default()));
    assert!(!p.fits(&edited, Method::series(30)));
    edited.condition.speed = 150.0; // above Mach 0.3: the slopes change
    assert!(!p.fits(&edited, Method::default()));
    edited.condition.speed = 40.0;
    edited.condition.roll_rate = 0.01;
    assert!(!p.fits(&edited, Method::default()));
    edited.condition.roll_rate = 0.0;
    edited.stations[1].chord *= 1.1;
    assert!(!p.fits(&edited, Method::default()));
    // A condition the preparation does not fit is still answered for that condition.
    let fast = at(2.0, 150.0, 0.01);
    let reused = p.solve(&fast).expect("solves");
    let fresh = solver::solve(&w, &fast, Method::default()).expect("solves");
    assert_eq!(reused.coefficients, fresh.coefficients);
}

#[test]
fn roll_rate_is_read_from_the_condition_and_written_back() {
    let mut w = rectangular(6.0);
    w.condition.roll_rate = -0.035;
    let text = file::to_toml(&w);
    assert!(text.contains("roll_rate = -0.035"), "{text}");
    let back = file::parse(&text, std::path::Path::new("roll.toml")).expect("parses");
    assert_eq!(back.condition.roll_rate, -0.035);
    let still = file::to_toml(&rectangular(6.0));
    assert!(!still.contains("roll_rate"), "the default is not written");
}

#[test]
fn the_solution_reports_its_method() {
    let w = rectangular(6.0);
    let s = solver::solve(&w, &at(3.0, 20.0, 0.0), Method::series(24)).expect("solves");
    assert_eq!(s.method.resolution_key, "terms");
    assert_eq!(s.method.resolution, 24);
    let fourier = &s
        .method
        .extras
        .iter()
        .find(|(k, _)| *k == "fourier")
        .expect("fourier")
        .1;
    assert_eq!(fourier.len(), 24);
    assert!(
        rel(PI * 6.0 * fourier[0], s.coefficients.cl) < 1e-12,
        "CL = pi AR A_1"
    );
}

#[test]
fn the_vortex_method_applies_the_same_prandtl_glauert_correction() {
    // Anderson, Fundamentals of Aerodynamics, eq. 11.52, as in the series test above: the
    // compressible wing equals the incompressible one with each section slope divided by beta.
    let w = rectangular(6.0);
    let fast = at(4.0, 0.5 * 340.294, 0.0);
    let beta = compressibility::beta(&fast);
    let compressible = solver::solve(&w, &fast, Method::vortex(40)).expect("solves");
    let mut slow_wing = w.clone();
    for a in slow_wing.airfoils.values_mut() {
        a.lift_slope /= beta;
    }
    let slow = solver::solve(&slow_wing, &at(4.0, 20.0, 0.0), Method::vortex(40)).expect("solves");
    assert!(rel(compressible.coefficients.cl, slow.coefficients.cl) < 1e-10);
    assert!(rel(compressible.coefficients.cdi, slow.coefficients.cdi) < 1e-10);
}
