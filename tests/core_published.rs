//! The solver against published closed forms and values. Each check names its source.

mod common;

use std::f64::consts::PI;

use common::{rel, solve, solve_n};
use gammaline::solver::{self, controls, Options};

const TERMS: usize = solver::DEFAULT_TERMS;

// ---- Elliptic loading: Prandtl's closed forms (Anderson, *Fundamentals of Aerodynamics*,
// ---- 6th ed., sec. 5.3.1; equation numbers from memory: 5.42-5.45, 5.61).

/// Aspect ratio of the true ellipse of span 2 and root chord c0: b^2/S with S = pi b c0 / 4.
fn elliptic_ar(c0: f64) -> f64 {
    4.0 * 2.0 / (PI * c0)
}

#[test]
fn elliptic_planform_has_span_efficiency_one() {
    // e = 1 for an untwisted elliptic wing of one section (Anderson sec. 5.3.1). Stations sit
    // at the collocation points, so the solver sees the exact ellipse: solver precision.
    let s = solve(&common::elliptic_at_collocation(0.4, TERMS), 5.0);
    assert!((s.coefficients.e.expect("lift") - 1.0).abs() < 1e-10);
    assert!(s.fourier[1..]
        .iter()
        .all(|a| a.abs() < 1e-12 * s.fourier[0].abs()));
}

#[test]
fn elliptic_downwash_is_uniform_and_equals_cl_over_pi_ar() {
    // alpha_i = CL/(pi AR) everywhere (Anderson sec. 5.3.1); with Glauert's series that is
    // A_1 at every point.
    let s = solve(&common::elliptic_at_collocation(0.4, TERMS), 4.0);
    let expected = s.fourier[0].to_degrees();
    for p in &s.spanwise {
        assert!((p.alpha_i_deg - expected).abs() < 1e-10, "at y {}", p.y);
    }
}

#[test]
fn elliptic_lift_slope_and_root_circulation_match_the_closed_forms() {
    // a = a0/(1 + a0/(pi AR)) and Gamma_0 = 2 V S CL/(pi b) (Anderson sec. 5.3.1), with AR and
    // S of the true ellipse; the solver's root circulation must equal Gamma_0.
    let c0 = 0.4;
    let ar = elliptic_ar(c0);
    let a0 = 2.0 * PI;
    let alpha = 6.0_f64.to_radians();
    let cl = a0 / (1.0 + a0 / (PI * ar)) * alpha;
    let area = PI * 2.0 * c0 / 4.0;
    let speed = gammaline::wing::Condition::default().speed;
    let gamma0 = 2.0 * speed * area * cl / (PI * 2.0);
    let s = solve(&common::elliptic_at_collocation(c0, TERMS), 6.0);
    assert!(
        rel(s.stations[0].gamma, gamma0) < 1e-10,
        "{} vs {gamma0}",
        s.stations[0].gamma
    );
}

#[test]
fn elliptic_root_bending_moment_and_centre_of_lift() {
    // Derivation (ours, from the elliptic load l(y) = rho V Gamma_0 sqrt(1 - (y/s)^2), s = b/2):
    // half-wing lift = rho V Gamma_0 pi s / 4, root moment = rho V Gamma_0 s^2 / 3, so
    // M_root = L_total * b / (3 pi) and the half-wing centre of lift is at 4 s / (3 pi).
    let s = solve(&common::elliptic_at_collocation(0.4, TERMS), 5.0);
    let b = s.geometry.span;
    assert!(rel(s.flight.root_bending_moment, s.flight.lift * b / (3.0 * PI)) < 1e-4);
    assert!(rel(s.center_of_lift_y, 4.0 * (b / 2.0) / (3.0 * PI)) < 1e-4);
}

#[test]
fn elliptic_profile_drag_with_uniform_cl() {
    // With uniform cl = CL the section polar integrates to cd0 + cd2 CL^2 (follows from the
    // elliptic closed form above). The piecewise-linear chord between stations makes cl only
    // nearly uniform between collocation points: 1e-3 relative.
    let mut wing = common::elliptic_at_collocation(0.4, TERMS);
    let foil = wing.airfoils.get_mut("a").expect("airfoil a");
    foil.cd0 = 0.008;
    foil.cd2 = 0.01;
    let s = solve(&wing, 5.0);
    let cl = s.coefficients.cl;
    assert!(rel(s.coefficients.cdp, 0.008 + 0.01 * cl * cl) < 1e-3);
}

#[test]
fn constant_cd0_integrates_to_cd0() {
    // CDp = (1/S) integral c cd0 dy = cd0 for any planform (definition of CDp).
    let mut wing = common::tapered(7.0, 0.45);
    wing.airfoils.get_mut("a").expect("a").cd0 = 0.0093;
    let s = solve(&wing, 3.0);
    assert!(rel(s.coefficients.cdp, 0.0093) < 1e-9);
}

// ---- Rectangular and tapered wings.

/// Converged lifting-line values for untwisted rectangular wings, a0 = 2 pi
/// (shared lifting-line reference, sec. 3 table: three independent methods agreeing to about
/// six digits; printed to three or four digits, so half a unit in the last place).
const RECTANGULAR: [(f64, f64, f64, f64); 4] = [
    (4.0, 0.0285, 0.120, 4.028),
    (6.0, 0.0483, 0.161, 4.530),
    (8.0, 0.0676, 0.195, 4.838),
    (10.0, 0.0859, 0.225, 5.047),
];

#[test]
fn rectangular_wings_match_the_converged_table() {
    for (ar, delta, tau, cl_alpha) in RECTANGULAR {
        let s = solve(&common::rectangular(ar), 4.0);
        assert!(
            (s.cl_alpha - cl_alpha).abs() < 5e-4,
            "AR {ar}: CL_alpha {}",
            s.cl_alpha
        );
        let d = s.coefficients.delta.expect("lift");
        assert!((d - delta).abs() < 5e-5, "AR {ar}: delta {d}");
        // tau is ill-conditioned (shared reference, sec. 3): one unit in its last digit.
        assert!((s.tau - tau).abs() < 1e-3, "AR {ar}: tau {}", s.tau);
    }
}

#[test]
fn lift_slope_relation_with_tau_holds() {
    // a = a0 / (1 + (a0/(pi AR))(1 + tau)) (Anderson, *Fundamentals of Aerodynamics*, 6th ed.,
    // sec. 5.3.2, equation number from memory 5.70), with the table's tau.
    for (ar, _, tau, _) in RECTANGULAR {
        let a0 = 2.0 * PI;
        let a = a0 / (1.0 + a0 / (PI * ar) * (1.0 + tau));
        let s = solve(&common::rectangular(ar), 2.0);
        assert!(rel(s.cl_alpha, a) < 1e-3, "AR {ar}: {} vs {a}", s.cl_alpha);
    }
}

#[test]
fn taper_ratio_of_least_induced_drag_is_near_one_third() {
    // Untwisted straight-tapered wings: delta is least near taper 0.3-0.4 (Glauert; Anderson's
    // figure of delta against taper ratio, from memory), 0.36-0.38 converged at AR 4-10
    // (shared lifting-line reference, sec. 3).
    for ar in [6.0, 8.0] {
        let (mut best, mut best_delta) = (0.0, f64::INFINITY);
        for i in 10..=100 {
            let taper = f64::from(i) / 100.0;
            let d = solve(&common::tapered(ar, taper), 4.0)
                .coefficients
                .delta
                .expect("lift");
            if d < best_delta {
                (best, best_delta) = (taper, d);
            }
        }
        assert!(
            (0.34..=0.40).contains(&best),
            "AR {ar}: least delta at taper {best}"
        );
    }
}

#[test]
fn textbook_example_aspect_ratio_8_taper_08() {
    // Anderson, *Fundamentals of Aerodynamics*, Example 5.1 (AR 8, taper 0.8, a0 = 2 pi,
    // alpha 5 deg): CL ~ 0.434, CDi ~ 0.0079 (from memory). The book reads delta = tau = 0.055
    // off a figure, so allow 2% on CL and 5% on CDi; the converged lifting-line answer
    // (shared reference, sec. 3) is CL 0.4269, CDi 0.00757, to its printed digits.
    let s = solve(&common::tapered(8.0, 0.8), 5.0);
    let c = s.coefficients;
    assert!(rel(c.cl, 0.434) < 0.02, "CL {}", c.cl);
    assert!(rel(c.cdi, 0.0079) < 0.05, "CDi {}", c.cdi);
    assert!((c.cl - 0.4269).abs() < 5e-5, "CL {}", c.cl);
    assert!((c.cdi - 0.00757).abs() < 5e-6, "CDi {}", c.cdi);
}

#[test]
fn bell_loading_has_span_efficiency_three_quarters() {
    // Prandtl (1933) bell load Gamma ~ (1 - eta^2)^(3/2) = sin^3(theta), i.e. A_3/A_1 = -1/3 in
    // Glauert's series, so delta = 3 (1/3)^2 and e = 0.75 (shared reference, sec. 3).
    // The twist that produces it on an elliptic chord c = c0 sin(theta) follows from the
    // monoplane equation: twist = A_1 [(16 b / (3 a0 c0) + 4) sin^2(theta) - 2] (our algebra,
    // with sin 3t = 3 sin t - 4 sin^3 t). Stations at the collocation points make it exact there.
    let (c0, a0, span, a1) = (0.4, 2.0 * PI, 2.0, 0.01);
    let stations = common::collocation_ys(TERMS)
        .into_iter()
        .map(|y| {
            let s2 = 1.0 - y * y;
            let twist = a1 * ((16.0 * span / (3.0 * a0 * c0) + 4.0) * s2 - 2.0);
            common::station(y, c0 * s2.max(0.0).sqrt(), twist.to_degrees())
        })
        .collect();
    let s = solve(&common::wing(stations, common::thin()), 0.0);
    assert!(rel(s.fourier[0], a1) < 1e-9, "A1 {}", s.fourier[0]);
    assert!(rel(s.fourier[2] / s.fourier[0], -1.0 / 3.0) < 1e-9);
    assert!((s.coefficients.e.expect("lift") - 0.75).abs() < 1e-9);
}

#[test]
fn helmbold_and_lifting_line_agree_at_high_aspect_ratio_only() {
    // Helmbold (1942): a = a0 / (sqrt(1 + (a0/(pi AR))^2) + a0/(pi AR)) (shared reference,
    // sec. 3). Lifting-line theory overestimates the slope at low aspect ratio and the two
    // converge as AR grows; the elliptic wing isolates the effect of the theory.
    let helmbold = |ar: f64| {
        let k = 2.0 * PI / (PI * ar);
        2.0 * PI / ((1.0 + k * k).sqrt() + k)
    };
    let gap = |c0: f64| {
        let s = solve(&common::elliptic_at_collocation(c0, TERMS), 2.0);
        let ar = elliptic_ar(c0);
        // CL_alpha on the true ellipse's area: pi AR A_1 per radian of alpha.
        (PI * ar * s.fourier[0] / 2.0_f64.to_radians() - helmbold(ar)) / helmbold(ar)
    };
    let (low, mid, high) = (gap(2.0), gap(0.4), gap(0.1));
    assert!(low > 0.15, "AR 1.3: lifting line {low:.3} above Helmbold");
    assert!(mid > 0.0 && mid < 0.05, "AR 6.4: {mid:.4}");
    assert!(high > 0.0 && high < 0.01, "AR 25: {high:.4}");
}

// ---- Control surfaces (thin-airfoil theory).

#[test]
fn flap_effectiveness_matches_thin_airfoil_values() {
    // tau_f for c_f/c = 0.1, 0.2, 0.25, 0.3, 0.5 (Abbott & von Doenhoff, *Theory of Wing
    // Sections*, 1959; Houghton & Carpenter, *Aerodynamics for Engineering Students*,
    // eq. 4.52), printed to three digits.
    for (fraction, tau) in [
        (0.1, 0.396),
        (0.2, 0.550),
        (0.25, 0.609),
        (0.3, 0.661),
        (0.5, 0.818),
    ] {
        let got = controls::thin_airfoil_effectiveness(fraction);
        assert!((got - tau).abs() < 5e-4, "c_f/c {fraction}: {got}");
    }
}

#[test]
fn full_span_flap_shifts_the_zero_lift_angle_by_tau_delta() {
    // A full-span plain flap moves alpha_L0 by -tau_f delta on every section (thin-airfoil
    // theory, references above), so the wing's lift equals the clean wing's at alpha + tau delta.
    let clean = common::tapered(8.0, 0.5);
    let mut flapped = clean.clone();
    flapped.controls.push(gammaline::wing::Control {
        kind: gammaline::wing::ControlKind::Flap,
        ..common::aileron(0.0, 1.0, 0.25, 10.0)
    });
    let tau = controls::thin_airfoil_effectiveness(0.25);
    let with_flap = solve(&flapped, 2.0).coefficients.cl;
    let equivalent = solve(&clean, 2.0 + tau * 10.0).coefficients.cl;
    assert!(
        rel(with_flap, equivalent) < 1e-9,
        "{with_flap} vs {equivalent}"
    );
}

#[test]
fn right_aileron_down_rolls_left_with_adverse_yaw() {
    // Sign conventions of the shared reference, sec. 1: more lift on the right half gives
    // negative Cl_roll; the right wing's extra induced drag yaws the nose right (Cn > 0).
    let mut wing = common::tapered(8.0, 0.5);
    wing.controls.push(common::aileron(0.6, 0.95, 0.25, 10.0));
    let s = solve(&wing, 4.0);
    assert!(
        s.coefficients.cl_roll < -1e-3,
        "Cl_roll {}",
        s.coefficients.cl_roll
    );
    assert!(
        s.coefficients.cn_induced > 1e-5,
        "Cn_induced {}",
        s.coefficients.cn_induced
    );
    let right = s.flight.root_bending_moment;
    assert!(right > s.flight.left_root_bending_moment);
}

// ---- Convergence (docs/theory.md): the default term count is converged.

#[test]
fn smooth_tapered_wing_is_converged_at_the_default_term_count() {
    // A smoothly tapered planform (chord 1 - 0.55 eta^2, washout -3 eta^2 deg, 161 stations):
    // no slope break at the root. Straight tapers with a root kink converge as N^-2
    // (docs/theory.md has the table).
    let stations = (0..=160)
        .map(|i| {
            let eta = f64::from(i) / 160.0;
            common::station(eta, 0.25 * (1.0 - 0.55 * eta * eta), -3.0 * eta * eta)
        })
        .collect();
    let mut wing = common::wing(stations, common::thin());
    let foil = wing.airfoils.get_mut("a").expect("a");
    foil.cd0 = 0.008;
    foil.cd2 = 0.006;
    let (a, b) = (solve_n(&wing, 4.0, TERMS), solve_n(&wing, 4.0, 2 * TERMS));
    let pairs = [
        (a.coefficients.cl, b.coefficients.cl),
        (a.coefficients.cdi, b.coefficients.cdi),
        (a.coefficients.cdp, b.coefficients.cdp),
        (a.cl_alpha, b.cl_alpha),
        (a.flight.root_bending_moment, b.flight.root_bending_moment),
    ];
    for (x, y) in pairs {
        assert!(rel(x, y) < 1e-4, "{x} vs {y}");
    }
}

#[test]
fn part_span_aileron_roll_is_within_one_percent_of_converged() {
    // The shared reference, sec. 2, asks control cases to converge within 1%.
    let mut wing = common::tapered(8.0, 0.5);
    wing.controls.push(common::aileron(0.55, 0.9, 0.25, 8.0));
    let a = solve_n(&wing, 2.0, TERMS).coefficients.cl_roll;
    let b = solve_n(&wing, 2.0, 4 * TERMS).coefficients.cl_roll;
    assert!(rel(a, b) < 0.01, "{a} vs {b}");
}

// ---- Consistency of the integrals and the target-CL solve.

#[test]
fn induced_drag_from_the_series_equals_its_quadrature() {
    // CDi = pi AR sum n A_n^2 (Glauert) and (1/S) integral c cl alpha_i dy must agree.
    let mut wing = common::tapered(7.0, 0.4);
    wing.stations[1].twist_deg = -2.5;
    wing.controls.push(common::aileron(0.5, 0.9, 0.3, 6.0));
    let p = solver::prepare(&wing, Options::default()).expect("prepares");
    for alpha in [-2.0_f64, 3.0, 8.0] {
        let c = p.coefficients(alpha.to_radians());
        let by_quadrature = p.integrals().cdi.at(alpha.to_radians());
        assert!(
            rel(by_quadrature, c.cdi) < 1e-6,
            "{by_quadrature} vs {}",
            c.cdi
        );
    }
}

#[test]
fn target_cl_solve_lands_on_the_cl() {
    let wing = common::tapered(8.0, 0.5);
    let p = solver::prepare(&wing, Options::default()).expect("prepares");
    let condition = gammaline::wing::Condition {
        target_cl: Some(0.73),
        ..gammaline::wing::Condition::default()
    };
    let s = p.solve(&condition).expect("solves");
    assert!((s.coefficients.cl - 0.73).abs() < 1e-12);
}

#[test]
fn first_stall_is_at_the_root_of_a_rectangular_wing_and_moves_out_with_taper() {
    // Critical-section estimate: an untwisted rectangular wing's cl peaks at the root; strong
    // taper pushes the peak outboard (common practice, no source).
    let rect = solve(&common::rectangular(7.0), 2.0)
        .first_stall
        .expect("stalls");
    assert!(rect.y.abs() < 0.05, "rectangular stalls at y {}", rect.y);
    let pointed = solve(&common::tapered(7.0, 0.25), 2.0)
        .first_stall
        .expect("stalls");
    assert!(pointed.y > 0.5, "taper 0.25 stalls at y {}", pointed.y);
    // When that section reaches cl_max, the wing's CL is below the section cl_max.
    assert!(rect.cl_wing < 1.5 && rect.cl_wing > 1.0);
}

#[test]
fn a_symmetric_wing_has_no_roll_or_yaw_and_mirroring_flips_both() {
    // Symmetry (common practice, no source): a mirrored load has no rolling or yawing moment;
    // reflecting a wing left to right reverses both.
    let clean = solve(&common::tapered(7.0, 0.5), 5.0).coefficients;
    assert!(clean.cl_roll.abs() < 1e-12 && clean.cn.abs() < 1e-12);
    let mut wing = common::tapered(7.0, 0.5);
    wing.controls.push(common::aileron(0.5, 0.9, 0.25, 7.0));
    let mut full = wing.clone();
    full.symmetric = false;
    let right = wing.stations.clone();
    let mut stations: Vec<_> = right
        .iter()
        .rev()
        .map(|s| common::station(-s.y, s.chord, 0.0))
        .collect();
    stations.extend(right.iter().skip(1).cloned());
    stations[0].twist_deg = 2.0; // an asymmetric twist on the left tip
    full.stations = stations;
    let a = solve(&full, 5.0).coefficients;
    let b = solve(&full.mirrored(), 5.0).coefficients;
    assert!(a.cl_roll.abs() > 1e-3);
    assert!(
        rel(b.cl_roll, -a.cl_roll) < 1e-9,
        "{} vs {}",
        b.cl_roll,
        a.cl_roll
    );
    assert!(rel(b.cn, -a.cn) < 1e-9, "{} vs {}", b.cn, a.cn);
    assert!(rel(b.cl, a.cl) < 1e-12);
}
