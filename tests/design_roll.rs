//! Roll authority: damping of the elliptic wing, aileron power and the steady roll.

mod common;

use common::{aileron, at_alpha, elliptic_at_collocation, tapered};
use gammaline::design::roll;
use gammaline::solver::{self, Method, Solution, SolveError};
use gammaline::wing::{Condition, Wing};

fn solve(w: &Wing, c: &Condition) -> Result<Solution, SolveError> {
    let mut w = w.clone();
    w.condition = *c;
    solver::solve(&w, c, Method::default())
}

#[test]
fn roll_damping_of_the_elliptic_wing_matches_the_closed_form() {
    // Clp = -(a0/8)/(1 + 2 a0/(pi AR)) for the elliptic wing (shared lifting-line reference,
    // section 3: -(pi/4) AR/(AR + 4) for a0 = 2 pi). An undeflected aileron changes nothing
    // but makes the wing one "with an aileron".
    let mut w = elliptic_at_collocation(0.25, 60);
    w.controls.push(aileron(0.6, 0.95, 0.25, 0.0));
    // The solver sees the exact elliptic chord at its collocation points, so the loading is
    // the ellipse's, aspect ratio b^2/(pi b c0/4) = 4 b/(pi c0); but Cl_roll is normalised
    // by the reference area S of the stations' polygon, a little smaller than the ellipse's,
    // hence the factor S_ellipse/S_polygon on the closed form.
    let ar = 4.0 * 2.0 / (std::f64::consts::PI * 0.25);
    let polygon_ar = solve(&w, &at_alpha(4.0))
        .expect("solves")
        .geometry
        .aspect_ratio;
    let a0 = std::f64::consts::TAU;
    let closed_form = -(a0 / 8.0) / (1.0 + 2.0 * a0 / (std::f64::consts::PI * ar));
    let expected = closed_form * polygon_ar / ar;
    let r = roll::roll_authority(&w, &at_alpha(4.0), &solve)
        .expect("solves")
        .expect("has an aileron");
    assert!(
        (r.clp - expected).abs() < 1e-7 * expected.abs(),
        "{} vs {expected}",
        r.clp
    );
    assert!(r.pb_2v.abs() < 1e-12, "undeflected: no roll");
}

#[test]
fn right_aileron_down_rolls_left_at_the_balance_rate() {
    // Sign conventions (shared reference, section 1): right aileron down lifts the right
    // half, Cl_roll < 0, and the wing rolls left (pb/2V < 0); in the steady roll
    // Cl_delta delta + Clp pb/2V = 0 (steady-roll balance, from memory).
    let mut w = tapered(7.0, 0.5);
    w.controls.push(aileron(0.55, 0.95, 0.25, 6.0));
    let r = roll::roll_authority(&w, &at_alpha(3.0), &solve)
        .expect("solves")
        .expect("has an aileron");
    assert!(
        r.clp < 0.0 && r.cl_delta_per_rad < 0.0 && r.pb_2v < 0.0,
        "{r:?}"
    );
    let balance = r.cl_delta_per_rad * 6f64.to_radians() + r.clp * r.pb_2v;
    assert!(balance.abs() < 1e-9, "{balance}");
    // The steady rate really zeroes the rolling moment when solved with it.
    let rolling = Condition {
        roll_rate: r.pb_2v,
        ..at_alpha(3.0)
    };
    let s = solve(&w, &rolling).expect("solves");
    assert!(
        s.coefficients.cl_roll.abs() < 1e-9,
        "{}",
        s.coefficients.cl_roll
    );
}

#[test]
fn a_wing_without_ailerons_has_no_roll_authority() {
    let r = roll::roll_authority(&tapered(7.0, 0.5), &at_alpha(3.0), &solve).expect("solves");
    assert!(r.is_none());
}
