//! Twist design: the designed wings solved again, and the closed-form optimum.

mod common;

use common::{station, tapered, thin, wing};
use gammaline::design::twist::{self, Loading};
use gammaline::design::DesignError;
use gammaline::solver::{self, Method, Solution, SolveError};
use gammaline::wing::{Condition, Wing};

fn solve(w: &Wing, c: &Condition) -> Result<Solution, SolveError> {
    solver::solve(w, c, Method::default())
}

fn solved_at(w: &Wing, cl: f64) -> Solution {
    solve(w, &gammaline::design::at_cl(w, cl)).expect("solves")
}

/// A tapered wing with a cambered section and 2 deg of washout to start from.
fn trainer_like() -> Wing {
    let mut airfoil = thin();
    airfoil.lift_slope = 6.0;
    airfoil.alpha_zero_lift_deg = -2.0;
    wing(
        vec![
            station(0.0, 1.5, 1.0),
            station(2.0, 1.3, 0.5),
            station(5.0, 0.75, -1.0),
        ],
        airfoil,
    )
}

#[test]
fn elliptic_design_solves_to_e_above_0_999() {
    // Prandtl: the elliptic loading has delta = 0, e = 1 (shared reference, section 3);
    // the issue asks for e > 0.999 once the designed wing is solved again.
    for w in [trainer_like(), tapered(8.0, 0.45), tapered(6.0, 1.0)] {
        let d = twist::design_twist(&w, 0.6, Loading::Elliptic).expect("designs");
        let s = solved_at(&d.wing, 0.6);
        let e = s.coefficients.e.expect("lifting");
        assert!(e > 0.999, "e = {e}");
        assert!((s.coefficients.alpha_deg - d.alpha_deg).abs() < 0.01);
        assert!(d.wing.stations.len() > w.stations.len(), "stations added");
    }
}

#[test]
fn bell_design_solves_to_e_near_0_75() {
    // Prandtl's 1933 bell loading: A_3/A_1 = -1/3, so e = 0.75 at the same span
    // (shared reference, section 3).
    let d = twist::design_twist(&trainer_like(), 0.5, Loading::Bell).expect("designs");
    let e = solved_at(&d.wing, 0.5).coefficients.e.expect("lifting");
    assert!((e - 0.75).abs() < 0.002, "e = {e}");
    // A blend halfway: A_3/A_1 = -1/6, e = 1/(1 + 3/36) = 0.923 (same series algebra).
    let d = twist::design_twist(&trainer_like(), 0.5, Loading::Blend(0.5)).expect("designs");
    let e = solved_at(&d.wing, 0.5).coefficients.e.expect("lifting");
    assert!((e - 12.0 / 13.0).abs() < 0.002, "e = {e}");
}

#[test]
fn designed_twist_of_a_tapered_wing_matches_the_closed_form_optimum() {
    // Phillips, "Lifting-line analysis for twisted wings and washout-optimized wings",
    // J. Aircraft 41(1), 2004: optimum washout distribution omega = 1 - sqrt(1 - eta^2)/(c/c_root)
    // and amount Omega = 4 b CL / (pi AR a0 c_root), written out here by hand.
    let w = tapered(7.0, 0.4);
    let (cl, a0) = (0.7, std::f64::consts::TAU);
    let d = twist::design_twist(&w, cl, Loading::Elliptic).expect("designs");
    let (b, c_root) = (2.0, w.stations[0].chord);
    let area = 0.5 * b * c_root * (1.0 + 0.4);
    let ar = b * b / area;
    let omega_amount = 4.0 * b * cl / (std::f64::consts::PI * ar * a0 * c_root);
    assert!((d.optimum_washout_deg - omega_amount.to_degrees()).abs() < 1e-9);
    for row in &d.rows {
        let eta = row.y / (0.5 * b);
        let chord = c_root * (1.0 - 0.6 * eta);
        let omega = 1.0 - (1.0 - eta * eta).sqrt() / (chord / c_root);
        let expected = -(omega_amount * omega).to_degrees();
        assert!(
            (row.twist_deg - expected).abs() < 1e-9,
            "y {}: {} vs {expected}",
            row.y,
            row.twist_deg
        );
        assert!((row.optimum_deg - expected).abs() < 1e-9);
    }
}

#[test]
fn off_design_penalty_matches_solving_the_designed_wing_elsewhere() {
    // CDi = (CL^2 + delta_0 (CL - CL_d)^2)/(pi AR) for the washout-optimised wing (derived
    // from Glauert's series in twist.rs; no outside value).
    let w = tapered(8.0, 0.5);
    let d = twist::design_twist(&w, 0.5, Loading::Elliptic).expect("designs");
    let delta0 = twist::untwisted_delta(&w, &solve).expect("solves");
    let s = solved_at(&d.wing, 1.1);
    let ar = s.geometry.aspect_ratio;
    let expected = 1.1f64.powi(2) / (std::f64::consts::PI * ar)
        + twist::off_design_penalty(delta0, ar, 1.1, 0.5);
    assert!(
        (s.coefficients.cdi - expected).abs() / expected < 2e-4,
        "{} vs {expected}",
        s.coefficients.cdi
    );
}

#[test]
fn the_root_keeps_its_twist_and_chords_and_airfoils_are_kept() {
    let w = trainer_like();
    let d = twist::design_twist(&w, 0.5, Loading::Elliptic).expect("designs");
    assert_eq!(d.wing.stations[0].twist_deg, 1.0);
    for s in &w.stations {
        let kept = d
            .wing
            .stations
            .iter()
            .find(|t| t.y == s.y)
            .expect("station kept");
        assert_eq!(kept.chord, s.chord);
        assert_eq!(kept.airfoil, s.airfoil);
    }
    assert_eq!(d.wing.airfoils, w.airfoils);
}

#[test]
fn bad_design_requests_are_refused() {
    assert!(Loading::parse("blend:1.5").is_err());
    assert!(Loading::parse("oval").is_err());
    assert_eq!(Loading::parse("blend:0.25"), Ok(Loading::Blend(0.25)));
    let err = twist::design_twist(&trainer_like(), 0.0, Loading::Elliptic).unwrap_err();
    assert!(matches!(err, DesignError::Impossible(_)));
    // A pointed tip needs unbounded twist for the elliptic loading.
    let pointed = wing(vec![station(0.0, 1.0, 0.0), station(4.0, 0.0, 0.0)], thin());
    let err = twist::design_twist(&pointed, 0.5, Loading::Elliptic).unwrap_err();
    assert!(err.to_string().contains("twist"), "{err}");
}
