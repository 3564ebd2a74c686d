//! Spar loads: the root values against the solver's and against beam statics by hand.

mod common;

use common::{station, tapered, thin, wing};
use gammaline::atmosphere::G0;
use gammaline::design::loads::{self, LoadCase, MassDistribution};
use gammaline::solver::{self, Method, Solution, SolveError};
use gammaline::wing::{Condition, Wing};

fn solve(w: &Wing, c: &Condition) -> Result<Solution, SolveError> {
    solver::solve(w, c, Method::default())
}

fn case(mass: f64, n: f64, wing_mass: f64, distribution: MassDistribution) -> LoadCase {
    LoadCase {
        mass_kg: mass,
        load_factor: n,
        wing_mass_kg: wing_mass,
        distribution,
    }
}

/// A 10 m wing flying at 40 m/s (invented).
fn glider() -> Wing {
    let mut w = wing(
        vec![
            station(0.0, 1.2, 0.0),
            station(2.5, 1.0, -0.5),
            station(5.0, 0.5, -2.0),
        ],
        thin(),
    );
    w.condition.speed = 40.0;
    w
}

#[test]
fn root_bending_at_one_g_without_wing_mass_equals_the_solvers() {
    // Same quantity two ways: the solver's closed-form half-span moment at that CL and the
    // quadrature of the spanwise circulation here (the consistency check).
    let mut small = tapered(8.0, 0.5);
    small.condition.speed = 25.0;
    for (w, mass) in [(glider(), 350.0), (small, 10.0)] {
        let c = case(mass, 1.0, 0.0, MassDistribution::Uniform);
        let l = loads::spar_loads(&w, &c, &solve).expect("loads");
        let direct = solve(
            &w,
            &gammaline::design::at_cl(&w, l.solution.coefficients.cl),
        )
        .expect("solves");
        let m = direct.flight.right_root_bending_moment;
        assert!(
            (l.root_bending - m).abs() / m < 1e-5,
            "{} vs {m}",
            l.root_bending
        );
        // The lift carries the weight: L = N m g.
        assert!((direct.flight.lift - mass * G0).abs() < 1e-6 * mass * G0);
        // Each half's root shear is half the lift on a symmetric wing (statics).
        assert!((l.root_shear - 0.5 * mass * G0).abs() / (mass * G0) < 1e-5);
    }
}

#[test]
fn uniform_wing_mass_relieves_the_root_by_m_g_n_b_over_8() {
    // Statics: a uniform weight M g N over span b gives the half-span root moment
    // (M g N / b)(b/2)^2/2 = M g N b / 8 (the formula, beam statics by hand).
    let w = glider();
    let bare = loads::spar_loads(
        &w,
        &case(250.0, 3.8, 0.0, MassDistribution::Uniform),
        &solve,
    )
    .expect("loads");
    let heavy = loads::spar_loads(
        &w,
        &case(250.0, 3.8, 60.0, MassDistribution::Uniform),
        &solve,
    )
    .expect("loads");
    let relief = 60.0 * G0 * 3.8 * 10.0 / 8.0;
    assert!((bare.root_bending - heavy.root_bending - relief).abs() < 1e-9 * relief);
    assert!((heavy.relief_root_bending - relief).abs() < 1e-9 * relief);
    assert!((heavy.left_root_bending - heavy.root_bending).abs() < 1e-6 * relief);
}

#[test]
fn shear_and_bending_vanish_at_the_tips() {
    // Nothing is outboard of a tip (statics).
    for distribution in [MassDistribution::Uniform, MassDistribution::Chord] {
        let l = loads::spar_loads(&glider(), &case(400.0, 2.5, 40.0, distribution), &solve)
            .expect("loads");
        for row in [l.rows[0], *l.rows.last().unwrap()] {
            assert!(
                row.shear.abs() < 1e-9 && row.bending.abs() < 1e-9,
                "{row:?}"
            );
        }
        // The root carries half of lift less wing weight on a symmetric wing (statics).
        let half_net = 0.5 * 2.5 * G0 * (400.0 - 40.0);
        assert!(
            (l.root_shear - half_net).abs() < 1e-5 * half_net,
            "{}",
            l.root_shear
        );
    }
}

#[test]
fn chord_weighted_mass_relief_matches_the_hand_integral() {
    // Straight taper c = c_r (1 - (1 - lambda) eta): the chord-weighted moment about the root
    // of the right half is integral c y dy = c_r s^2 (1/2 - (1 - lambda)/3), s the semispan
    // (integrated by hand).
    let mut w = tapered(8.0, 0.5);
    w.condition.speed = 30.0;
    let c_r = w.stations[0].chord;
    let area = 2.0 * 0.5 * c_r * 1.5;
    let bare = loads::spar_loads(&w, &case(12.0, 2.0, 0.0, MassDistribution::Chord), &solve)
        .expect("loads");
    let heavy = loads::spar_loads(&w, &case(12.0, 2.0, 3.0, MassDistribution::Chord), &solve)
        .expect("loads");
    let expected = 2.0 * G0 * 3.0 / area * c_r * (0.5 - 0.5 / 3.0);
    let got = bare.root_bending - heavy.root_bending;
    assert!(
        (got - expected).abs() < 1e-9 * expected,
        "{got} vs {expected}"
    );
}

#[test]
fn a_load_beyond_cl_max_is_refused() {
    let err = loads::spar_loads(
        &glider(),
        // CL about 3.2: past the first stall, yet within the +-90 deg the solver accepts.
        &case(500.0, 6.0, 0.0, MassDistribution::Uniform),
        &solve,
    )
    .unwrap_err();
    assert!(err.to_string().contains("CL_max"), "{err}");
    let err = loads::spar_loads(
        &glider(),
        &case(100.0, 1.0, 150.0, MassDistribution::Uniform),
        &solve,
    )
    .unwrap_err();
    assert!(err.to_string().contains("--wing-mass"), "{err}");
}
