//! Trade studies: every variant equals a plain solve of the wing edited by hand.

mod common;

use common::{aileron, station, thin, wing};
use gammaline::design::study::{self, Key, Vary};
use gammaline::solver::{self, Method, Solution, SolveError};
use gammaline::wing::{Condition, Wing};

fn solve(w: &Wing, c: &Condition) -> Result<Solution, SolveError> {
    let mut w = w.clone();
    w.condition = *c;
    solver::solve(&w, c, Method::default())
}

fn base() -> Wing {
    let mut w = wing(
        vec![
            station(0.0, 1.4, 1.0),
            station(2.0, 1.2, 0.5),
            station(4.5, 0.6, -1.0),
        ],
        thin(),
    );
    w.controls.push(aileron(2.6, 4.2, 0.25, 3.0));
    w.condition.speed = 35.0;
    w
}

/// Each key's edit done by hand, independently of `Key::apply`.
fn edited_by_hand(name: &str, value: f64) -> Wing {
    let mut w = base();
    match name {
        "station.2.chord" => w.stations[1].chord = value,
        "station.3.twist" => w.stations[2].twist_deg = value,
        "station.2.y" => w.stations[1].y = value,
        "control.aileron.deflection" => w.controls[0].deflection_deg = value,
        "airfoil.a.lift_slope" => w.airfoils.get_mut("a").unwrap().lift_slope = value,
        "airfoil.a.alpha_zero_lift" => {
            w.airfoils.get_mut("a").unwrap().alpha_zero_lift_deg = value;
        }
        "airfoil.a.cl_max" => w.airfoils.get_mut("a").unwrap().cl_max = value,
        "span" => {
            let k = value / 9.0;
            for s in &mut w.stations {
                s.y *= k;
            }
            w.controls[0].y_inner *= k;
            w.controls[0].y_outer *= k;
        }
        "taper" => {
            // Tip chord value * 1.4; the middle station 2/4.5 of the way to the tip.
            let old = 0.6 / 1.4;
            w.stations[1].chord = 1.2 * (1.0 + (value / old - 1.0) * 2.0 / 4.5);
            w.stations[2].chord = 1.4 * value;
        }
        "washout" => {
            w.stations[1].twist_deg = 0.5 - value * 2.0 / 4.5;
            w.stations[2].twist_deg = -1.0 - value;
        }
        _ => unreachable!("{name}"),
    }
    w
}

#[test]
fn every_variant_equals_a_plain_solve_of_the_edited_wing() {
    // Consistency with `solve` (the requirement; no outside value).
    let ranges = [
        ("station.2.chord", "0.8:1.4:0.2"),
        ("station.3.twist", "-3:1:1"),
        ("station.2.y", "1:3:0.5"),
        ("control.aileron.deflection", "-10:10:5"),
        ("airfoil.a.lift_slope", "5.5:6.5:0.5"),
        ("airfoil.a.alpha_zero_lift", "-3:0:1"),
        ("airfoil.a.cl_max", "1.2:1.6:0.2"),
        ("span", "8:12:2"),
        ("taper", "0.3:0.7:0.2"),
        ("washout", "0:4:1"),
    ];
    for condition in [
        Condition {
            alpha_deg: 4.0,
            ..base().condition
        },
        Condition {
            target_cl: Some(0.6),
            ..base().condition
        },
    ] {
        for (name, range) in ranges {
            let vary = Vary::parse(&format!("{name}={range}")).expect("parses");
            let variants = study::run(&base(), &vary, &condition, &solve);
            assert_eq!(variants.len(), vary.values.len());
            for v in &variants {
                let row = v.result.as_ref().expect("solves");
                let s = solve(&edited_by_hand(name, v.value), &condition).expect("solves");
                let c = &s.coefficients;
                let same = |a: f64, b: f64| (a - b).abs() <= 1e-12 * (1.0 + b.abs());
                assert!(
                    same(row.cl, c.cl) && same(row.cdi, c.cdi) && same(row.cd, c.cd),
                    "{name} {}",
                    v.value
                );
                assert!(same(row.alpha_deg, c.alpha_deg) && same(row.cl_roll, c.cl_roll));
                assert!(same(row.root_bending, s.flight.right_root_bending_moment));
                assert!(same(row.cl_alpha, s.cl_alpha));
                assert_eq!(row.e.is_some(), c.e.is_some());
                assert_eq!(row.first_stall_y, s.first_stall.map(|f| f.y));
            }
        }
    }
}

#[test]
fn values_run_from_from_to_to_by_step() {
    let v = Vary::parse("washout=0:5:0.005").expect("parses");
    assert_eq!(v.values.len(), 1001);
    assert_eq!(v.key, Key::Washout);
    assert!((v.values[1000] - 5.0).abs() < 1e-9);
    assert_eq!(
        Vary::parse("span=10:10:1").expect("parses").values,
        vec![10.0]
    );
}

#[test]
fn bad_keys_and_ranges_are_refused_with_the_reason() {
    for (text, words) in [
        ("washout", "KEY=FROM:TO:STEP"),
        ("station.0.chord=1:2:1", "1 or more"),
        ("station.1.cord=1:2:1", "did you mean `chord`"),
        ("wing.span=1:2:1", "station, control or airfoil"),
        ("washout=1:0:1", "below FROM"),
        ("washout=0:1:0", "STEP must be > 0"),
        ("washout=0:1", "three numbers"),
        ("washout=0:1e9:1e-3", "too many"),
    ] {
        let err = Vary::parse(text).unwrap_err();
        assert!(err.contains(words), "{text}: {err}");
    }
    let err = Key::parse("station.9.chord")
        .unwrap()
        .check(&base())
        .unwrap_err();
    assert!(err.contains("stations 1 to 3"), "{err}");
    let err = Key::parse("airfoil.b.cl_max")
        .unwrap()
        .check(&base())
        .unwrap_err();
    assert!(err.contains("no airfoil `b`"), "{err}");
}

#[test]
fn a_variant_that_breaks_a_rule_is_reported_not_fatal() {
    let vary = Vary::parse("station.2.y=0:2:1").expect("parses");
    let variants = study::run(&base(), &vary, &base().condition, &solve);
    let err = variants[0].result.as_ref().unwrap_err();
    assert!(err.contains("station 2") && err.contains("y"), "{err}");
    assert!(variants[1].result.is_ok() && variants[2].result.is_ok());
}
