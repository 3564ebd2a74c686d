//! The pitching moment about the reference point: Cm = M/(q S_ref c_ref), positive nose up,
//! integrated from the spanwise values (src/solver/moment.rs).

mod common;

use std::path::Path;

use gammaline::solver::{self, Method, Solution};
use gammaline::wing::{file, Reference, Wing};

fn solve(wing: &Wing, alpha_deg: f64) -> Solution {
    solver::solve(wing, &common::at_alpha(alpha_deg), Method::default()).expect("solves")
}

#[test]
fn a_flat_wing_about_its_quarter_chord_with_no_section_moment_has_no_moment() {
    // Every section's lift acts at its quarter chord; about that line, with cm = 0, nothing is
    // left (common practice, no source). The default moment point is the MAC's quarter chord,
    // which on a straight quarter-chord line is that line.
    for wing in [common::rectangular(6.0), straight_quarter_chord(8.0, 0.4)] {
        let s = solve(&wing, 6.0);
        assert!(s.coefficients.cl > 0.3);
        assert!(s.coefficients.cm.abs() < 1e-12, "{}", s.coefficients.cm);
    }
}

#[test]
fn a_moment_point_ahead_of_the_lift_gives_minus_cl_times_the_offset() {
    // Lift CL q S acting dx aft of the moment point: M = -CL q S dx, so Cm = -CL dx / c_ref
    // (common practice, no source; x aft, nose up positive, as in
    // ../shared/lifting-line-reference.md section 1).
    let mut wing = straight_quarter_chord(8.0, 0.4);
    let quarter = solve(&wing, 5.0).reference.x;
    let dx = 0.3;
    wing.reference = Reference {
        x: Some(quarter - dx),
        chord: Some(0.2),
        ..Reference::default()
    };
    let s = solve(&wing, 5.0);
    let expected = -s.coefficients.cl * dx / 0.2;
    assert!(
        (s.coefficients.cm - expected).abs() < 1e-10,
        "{} vs {expected}",
        s.coefficients.cm
    );
}

#[test]
fn a_constant_section_moment_on_a_rectangular_wing_is_the_wings_own() {
    // integral of c^2 cm dy / (S c) = cm for a constant chord c = c_ref (common practice, no
    // source); about the quarter chord the lift adds nothing.
    let mut wing = common::rectangular(6.0);
    wing.airfoils.get_mut("a").expect("a").cm0 = -0.05;
    for alpha in [0.0, 4.0, 10.0] {
        let cm = solve(&wing, alpha).coefficients.cm;
        assert!((cm + 0.05).abs() < 1e-12, "{alpha}: {cm}");
    }
}

#[test]
fn sweep_puts_the_tip_lift_aft_and_the_nose_down() {
    // On a swept-back wing every outboard section's lift acts aft of the root quarter chord,
    // so about that point the moment is nose down: Cm < 0 for CL > 0 (common practice, no
    // source); moving the point aft by d raises Cm by CL d / c_ref exactly (the definition).
    let mut wing = common::tapered(8.0, 0.5);
    wing.stations[1].x_le = 0.3;
    let root_quarter = 0.25 * wing.stations[0].chord;
    wing.reference.x = Some(root_quarter);
    let a = solve(&wing, 5.0);
    assert!(a.coefficients.cm < -0.01, "{}", a.coefficients.cm);
    wing.reference.x = Some(root_quarter + 0.1);
    let b = solve(&wing, 5.0);
    let shift = a.coefficients.cl * 0.1 / a.reference.chord;
    assert!((b.coefficients.cm - a.coefficients.cm - shift).abs() < 1e-12);
}

#[test]
fn a_sweep_gives_the_same_cm_as_a_solve() {
    let mut wing = common::tapered(8.0, 0.5);
    wing.stations[1].x_le = 0.2;
    wing.airfoils.get_mut("a").expect("a").cm0 = -0.04;
    let prepared = solver::prepare(&wing, Method::default()).expect("prepares");
    let rows = prepared.sweep(&[-2.0, 3.0, 8.0]).expect("sweeps");
    for row in rows {
        let alpha = row.coefficients.alpha_deg;
        let cm = solve(&wing, alpha).coefficients.cm;
        assert!((row.coefficients.cm - cm).abs() < 1e-12, "{alpha}");
    }
}

#[test]
fn the_reference_table_is_read_checked_and_written() {
    let base = std::fs::read_to_string(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("wings/survey-drone.toml"),
    )
    .expect("readable");
    let text = format!("{base}\n[reference]\narea = 0.9\nchord = 0.3\nx = 0.08\n");
    let wing = file::parse(&text, Path::new("ref.toml")).expect("valid");
    assert_eq!(
        wing.reference,
        Reference {
            area: Some(0.9),
            span: None,
            chord: Some(0.3),
            x: Some(0.08)
        }
    );
    let again = file::parse(&file::to_toml(&wing), Path::new("ref.toml")).expect("valid");
    assert_eq!(again, wing);
    let s = solve(&wing, 4.0);
    assert_eq!(
        (s.reference.area, s.reference.chord, s.reference.x),
        (0.9, 0.3, 0.08)
    );
    assert_eq!(
        s.reference.span, s.geometry.span,
        "the planform's span by default"
    );
}

/// Straight-tapered wing of span 2 whose quarter-chord line is straight and unswept.
fn straight_quarter_chord(aspect_ratio: f64, taper: f64) -> Wing {
    let mut wing = common::tapered(aspect_ratio, taper);
    let (root, tip) = (wing.stations[0].chord, wing.stations[1].chord);
    wing.stations[1].x_le = 0.25 * (root - tip);
    wing
}
