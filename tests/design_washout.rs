//! Washout search: the least-drag washout and the least root-first washout.

mod common;

use common::{rectangular, station, thin, wing};
use gammaline::design::washout::{self, Goal};
use gammaline::solver::{self, Method, Solution, SolveError};
use gammaline::wing::{Condition, Wing};

fn solve(w: &Wing, c: &Condition) -> Result<Solution, SolveError> {
    let mut w = w.clone();
    w.condition = *c;
    solver::solve(&w, c, Method::default())
}

fn washed(w: &Wing, deg: f64) -> Wing {
    gammaline::design::study::Key::Washout
        .apply(w, deg)
        .expect("applies")
}

fn cdi(w: &Wing, cl: f64) -> f64 {
    solve(w, &gammaline::design::at_cl(w, cl))
        .expect("solves")
        .coefficients
        .cdi
}

#[test]
fn min_drag_washout_is_the_least_induced_drag() {
    // By definition: CDi at the washout found is below CDi a little either side. A
    // rectangular wing loads its tips more than the ellipse does, so its least-drag washout
    // is positive (common practice, shared reference section 7; no single source).
    let w = rectangular(7.0);
    let found = washout::search(&w, 0.6, Goal::MinDrag, &solve).expect("finds");
    assert!(found.washout_deg > 0.0, "{}", found.washout_deg);
    let best = cdi(&found.wing, 0.6);
    for step in [-0.05, 0.05] {
        assert!(cdi(&washed(&w, found.washout_deg + step), 0.6) > best);
    }
    assert!(found.after.cdi < found.before.cdi);
    assert!(found.after.e.unwrap() > found.before.e.unwrap());
}

#[test]
fn root_first_washout_is_the_least_that_gives_the_margin() {
    // A tapered wing stalls outboard untwisted; washout moves the first stall in.
    let w = wing(vec![station(0.0, 1.0, 0.0), station(4.0, 0.4, 0.0)], thin());
    let found = washout::search(&w, 0.5, Goal::RootFirst(0.08), &solve).expect("finds");
    let after = found.after.stall_margin.expect("stalls");
    assert!(after >= 0.08 - 1e-9, "{after}");
    assert!(found.before.stall_margin.unwrap() < 0.08);
    let less = washout::stall_margin(&washed(&w, found.washout_deg - 0.01), &solve)
        .expect("solves")
        .expect("stalls");
    assert!(less < 0.08, "{less}: a smaller washout would do");
}

#[test]
fn goals_parse_and_refuse() {
    assert_eq!(Goal::parse("min-drag"), Ok(Goal::MinDrag));
    assert_eq!(Goal::parse("root-first:0.1"), Ok(Goal::RootFirst(0.1)));
    assert!(Goal::parse("root-first:1.5")
        .unwrap_err()
        .contains("MARGIN"));
    assert!(Goal::parse("least").unwrap_err().contains("min-drag"));
}
