//! Numerical checks of the solver: convergence in the term count, the integrals against
//! independent evaluations and closed forms, target-CL solves and the stall estimate.

mod common;

use std::f64::consts::PI;

use approx::assert_relative_eq;
use common::*;
use gammaline::solver::series::{prepare, Options, Prepared, DEFAULT_TERMS};
use gammaline::wing::{Condition, Wing};

fn prepared(w: &Wing, terms: usize) -> Prepared {
    prepare(w, Options { terms }).expect("solvable")
}

/// Convergence (issue item 10): on a smooth tapered wing with washout the integrated results
/// change by less than 1e-4 relative between the default term count and twice it
/// (the study in docs/theory.md shows about 1e-5 for this wing).
#[test]
fn converged_at_the_default_term_count() {
    let w = smooth_tapered();
    let (p1, p2) = (prepared(&w, DEFAULT_TERMS), prepared(&w, 2 * DEFAULT_TERMS));
    let alpha = 5f64.to_radians();
    let (a, b) = (p1.coefficients(alpha), p2.coefficients(alpha));
    for (name, x, y) in [
        ("CL_alpha", p1.cl_alpha(), p2.cl_alpha()),
        ("CL", a.cl, b.cl),
        ("CDi", a.cdi, b.cdi),
        ("e", a.e.unwrap(), b.e.unwrap()),
        ("CDp", a.cdp, b.cdp),
    ] {
        assert!(rel(x, y) < 1e-4, "{name}: {x} vs {y}");
    }
}

/// A straight-tapered wing has a kink at the root, which limits the series to second-order
/// convergence (docs/theory.md); its lift slope still meets 1e-4 at the default count.
#[test]
fn straight_taper_lift_slope_converged() {
    let w = tapered_twisted(8.0, 0.5, -3.0);
    let (a, b) = (prepared(&w, DEFAULT_TERMS), prepared(&w, 2 * DEFAULT_TERMS));
    assert!(rel(a.cl_alpha(), b.cl_alpha()) < 1e-4);
}

/// A part-span aileron is a step in alpha_L0, which a sine series resolves slowly; the
/// cell-averaged control shift keeps its rolling moment within 1% of a 4x-terms answer (the
/// study shows 0.08% at the default count).
#[test]
fn part_span_aileron_converged() {
    let w = aileron_wing();
    let alpha = 3f64.to_radians();
    let a = prepared(&w, DEFAULT_TERMS).coefficients(alpha).cl_roll;
    let b = prepared(&w, 4 * DEFAULT_TERMS).coefficients(alpha).cl_roll;
    assert!(rel(a, b) < 0.01, "{a} vs {b}");
    // and the answer does not wander as the count changes by one (edges between points)
    for n in [DEFAULT_TERMS - 1, DEFAULT_TERMS + 1, DEFAULT_TERMS + 3] {
        let c = prepared(&w, n).coefficients(alpha).cl_roll;
        assert!(rel(c, b) < 0.01, "N = {n}: {c} vs {b}");
    }
}

/// Midpoint-rule integrals over the span of a solved load, independent of the solver's own
/// closed forms: `(integral c cl alpha_i dy, integral c cl alpha_i y dy,
/// integral_0^tip c cl dy, integral_0^tip c cl y dy, -integral_tip^0 c cl y dy)`, from the
/// series c cl = 4 b sum A_n sin(n theta), alpha_i = sum n A_n sin(n theta)/sin(theta),
/// y = y_mid - (b/2) cos(theta), dy = (b/2) sin(theta) dtheta (Anderson, *Fundamentals of
/// Aerodynamics*, sec. 5.3.4). The midpoint rule's error here is far below the tolerances.
fn midpoint_integrals(a: &[f64], y_mid: f64, span: f64) -> [f64; 5] {
    let h = 0.5 * span;
    // The root y = 0 splits the range, so neither half's integrand has a step inside it.
    let theta_root = (y_mid / h).clamp(-1.0, 1.0).acos();
    let left = midpoint(a, (y_mid, span), (0.0, theta_root));
    let right = midpoint(a, (y_mid, span), (theta_root, PI));
    [
        left[0] + right[0],
        left[1] + right[1],
        right[2],
        right[3],
        -left[3],
    ]
}

/// `[integral c cl alpha_i dy, integral c cl alpha_i y dy, integral c cl dy,
/// integral c cl y dy]` over theta in `range`, by the midpoint rule on 20 000 cells.
fn midpoint(a: &[f64], (y_mid, span): (f64, f64), (lo, hi): (f64, f64)) -> [f64; 4] {
    let m = 20_000;
    let h = 0.5 * span;
    let step = (hi - lo) / m as f64;
    let mut out = [0.0; 4];
    for i in 0..m {
        let theta = lo + (i as f64 + 0.5) * step;
        let (mut load, mut induced) = (0.0, 0.0);
        for (k, an) in a.iter().enumerate() {
            let n = (k + 1) as f64;
            load += an * (n * theta).sin();
            induced += n * an * (n * theta).sin();
        }
        let ccl = 4.0 * span * load;
        let alpha_i = induced / theta.sin();
        let y = y_mid - h * theta.cos();
        let dy = h * theta.sin() * step;
        out[0] += ccl * alpha_i * dy;
        out[1] += ccl * alpha_i * y * dy;
        out[2] += ccl * dy;
        out[3] += ccl * y * dy;
    }
    out
}

/// The induced drag CDi = pi AR sum n A_n^2 (Glauert; Anderson, *Fundamentals of
/// Aerodynamics*, eq. 5.61), the induced yaw (1/(S b)) integral c cl alpha_i y dy and both
/// halves' lift and root bending moments are taken in closed form from the A_n; each must
/// equal an independent integration of the same series, for a twisted wing with a deflected
/// aileron (asymmetric load) and for a whole-span wing whose midpoint is off y = 0.
#[test]
fn load_integrals_match_an_independent_integration() {
    let mut mirrored = tapered_twisted(7.0, 0.4, -4.0);
    mirrored.controls.push(aileron(0.55, 0.9, 0.25, 8.0));
    let mut offset = mirrored.clone();
    offset.symmetric = false;
    offset.stations = vec![
        station(-0.7, 0.2, -3.0),
        station(0.4, 0.35, 0.0),
        station(1.3, 0.15, -2.0),
    ];
    offset.controls = vec![aileron(0.3, 0.6, 0.3, 6.0)];
    for w in [mirrored, offset] {
        let p = prepared(&w, DEFAULT_TERMS);
        let g = *p.geometry();
        for alpha_deg in [-2.0, 3.0, 8.0] {
            let alpha = f64::to_radians(alpha_deg);
            let [drag, yaw, right_lift, right_moment, left_moment] =
                midpoint_integrals(&p.fourier_at(alpha), g.y_mid, g.span);
            let c = p.coefficients(alpha);
            let s = p.solve(&at_alpha(alpha_deg)).expect("solves");
            assert_relative_eq!(drag / g.area, c.cdi, max_relative = 1e-7);
            assert_relative_eq!(yaw / (g.area * g.span), c.cn_induced, max_relative = 1e-6);
            assert_relative_eq!(
                right_moment,
                s.right_root_bending_per_q,
                max_relative = 1e-7
            );
            assert_relative_eq!(
                right_moment / right_lift,
                s.center_of_lift_y,
                max_relative = 1e-7
            );
            assert_relative_eq!(
                left_moment * s.flight.q,
                s.flight.left_root_bending_moment,
                max_relative = 1e-7
            );
        }
    }
}

/// Profile drag CDp = (1/S) integral c cd(cl) dy with cd = cd0 + cd1 cl + cd2 cl^2.
/// Constant cd0 on any wing gives CDp = cd0; cd1 adds cd1 CL exactly (integral c cl dy = CL S);
/// the cd2 term is checked against an independent midpoint-rule integration of the same series
/// on a rectangular wing (20 000 points, error below 1e-7).
#[test]
fn profile_drag_integral() {
    let mut w = rectangular(6.0);
    w.airfoils.insert("a".into(), with_drag(0.0085, 0.0, 0.0));
    let alpha = 6f64.to_radians();
    assert_relative_eq!(
        prepared(&w, DEFAULT_TERMS).coefficients(alpha).cdp,
        0.0085,
        max_relative = 1e-12
    );

    let mut w1 = tapered_twisted(8.0, 0.5, -2.0);
    w1.airfoils
        .insert("a".into(), with_drag(0.0085, 0.004, 0.0));
    let c = prepared(&w1, DEFAULT_TERMS).coefficients(alpha);
    assert_relative_eq!(c.cdp, 0.0085 + 0.004 * c.cl, max_relative = 1e-10);

    let (cd0, cd2) = (0.0085, 0.0062);
    w.airfoils.insert("a".into(), with_drag(cd0, 0.0, cd2));
    let p = prepared(&w, DEFAULT_TERMS);
    let a = p.fourier_at(alpha);
    let g = p.geometry();
    let (b, chord) = (g.span, g.root_chord);
    let m = 20_000;
    let mut integral = 0.0;
    for i in 0..m {
        let theta = (i as f64 + 0.5) * PI / m as f64;
        // c cl = 4 b sum A_n sin(n theta), dy = (b/2) sin(theta) dtheta
        let ccl: f64 = a
            .iter()
            .enumerate()
            .map(|(k, an)| an * ((k + 1) as f64 * theta).sin())
            .sum::<f64>()
            * 4.0
            * b;
        integral += ccl * ccl / chord * 0.5 * b * theta.sin() * PI / m as f64;
    }
    let expected = cd0 + cd2 * integral / g.area;
    assert_relative_eq!(p.coefficients(alpha).cdp, expected, max_relative = 1e-7);
}

/// Root bending moment of the elliptic load, derived here:
/// c cl(y) = (c cl)_0 sqrt(1 - (2y/b)^2); the lift L/q = integral c cl dy = (c cl)_0 pi b/4,
/// so (c cl)_0 = 4 CL S/(pi b). The right half's moment about the root is
/// M/q = integral_0^{b/2} c cl y dy = (c cl)_0 (b/2)^2 integral_0^1 eta sqrt(1 - eta^2) deta
///     = (c cl)_0 (b^2/4)(1/3) = CL S b/(3 pi),
/// i.e. half the lift acting at y = (4/(3 pi)) (b/2) = 2b/(3 pi), the centroid of a quarter
/// ellipse. The elliptic test wing carries exactly this load (A_1 only), and the solver takes
/// each half's lift and moment in closed form from the A_n (docs/theory.md, sec. 5), so the
/// only error is rounding: 1e-9.
#[test]
fn elliptic_root_bending_moment() {
    let w = elliptic_at_collocation(0.35, DEFAULT_TERMS);
    let p = prepared(&w, DEFAULT_TERMS);
    let s = p.solve(&at_alpha(5.0)).expect("solves");
    let (b, area, cl) = (s.geometry.span, s.geometry.area, s.coefficients.cl);
    assert_relative_eq!(
        s.right_root_bending_per_q,
        cl * area * b / (3.0 * PI),
        max_relative = 1e-9
    );
    assert_relative_eq!(
        s.center_of_lift_y,
        2.0 * b / (3.0 * PI),
        max_relative = 1e-9
    );
    assert_relative_eq!(
        s.flight.right_root_bending_moment,
        s.flight.q * cl * area * b / (3.0 * PI),
        max_relative = 1e-9
    );
}

/// A target-CL solve finds the angle of attack of a closed form. On an elliptic planform the
/// monoplane equation times sin(theta) reads sum A_n (mu_0 + n) sin(n theta) =
/// (alpha - epsilon(theta)) sin(theta), mu_0 = 4 b/(a0 c0), epsilon = alpha_L0 - twist, so
/// A_1 = (alpha - alpha_L0w)/(mu_0 + 1) with the wing's zero-lift angle
/// alpha_L0w = (2/pi) integral_0^pi epsilon sin^2(theta) dtheta (Glauert, *The Elements of
/// Aerofoil and Airscrew Theory*, 1926; derived here). With alpha_L0 = -2 deg and twist
/// -4 y^2 deg on span 2 (y^2 = cos^2 theta): alpha_L0w = -2 + (8/pi)(pi/8) = -1 deg, and
/// CL = pi AR A_1 gives alpha = -1 deg + CL (mu_0 + 1)/(pi AR). (epsilon sin(theta) is a
/// finite sine series, so collocation at stations on the collocation points is exact: 1e-9.)
#[test]
fn target_cl_solve_finds_the_closed_form_angle() {
    let c0 = 0.3;
    let airfoil = gammaline::wing::Airfoil {
        alpha_zero_lift_deg: -2.0,
        ..thin()
    };
    let stations = gammaline::verify::wings::collocation_stations_y(DEFAULT_TERMS)
        .into_iter()
        .map(|y| station(y, c0 * (1.0 - y * y).max(0.0).sqrt(), -4.0 * y * y))
        .collect();
    let p = prepared(&wing(stations, airfoil), DEFAULT_TERMS);
    let (b, ar) = (p.geometry().span, p.geometry().aspect_ratio);
    let mu0 = 4.0 * b / (std::f64::consts::TAU * c0);
    for target in [-0.2, 0.0, 0.35, 1.1] {
        let condition = Condition {
            target_cl: Some(target),
            ..Condition::default()
        };
        let s = p.solve(&condition).expect("solves");
        let expected = -1.0 + (target * (mu0 + 1.0) / (PI * ar)).to_degrees();
        assert!(
            (s.coefficients.alpha_deg - expected).abs() < 1e-9,
            "CL {target}: alpha {} vs {expected}",
            s.coefficients.alpha_deg
        );
    }
}

/// Linear critical-section estimate: the section that reaches cl_max first. On an untwisted
/// rectangular wing cl is highest at the root (common practice, no single source; Anderson,
/// *Fundamentals of Aerodynamics*, sec. 5.3.3 on the stall pattern of planforms, from memory);
/// strong taper loads the tip sections and moves it outboard.
#[test]
fn first_stall_location() {
    let rect = prepared(&rectangular(7.0), DEFAULT_TERMS)
        .solve(&at_alpha(0.0))
        .expect("solves");
    let stall = rect.first_stall.expect("stalls");
    assert!(
        stall.y.abs() < 0.05,
        "rectangular: first stall at y = {}",
        stall.y
    );
    // and at that CL the section there is exactly at cl_max (the estimate is linear)
    let at_stall = prepared(&rectangular(7.0), DEFAULT_TERMS)
        .solve(&at_alpha(stall.alpha_deg))
        .expect("solves");
    let peak = at_stall
        .spanwise
        .iter()
        .map(|p| p.cl_ratio)
        .fold(f64::MIN, f64::max);
    assert_relative_eq!(peak, 1.0, max_relative = 1e-9);
    assert_relative_eq!(at_stall.coefficients.cl, stall.cl_wing, max_relative = 1e-9);

    let tapered_stall = prepared(&tapered(7.0, 0.25), DEFAULT_TERMS)
        .solve(&at_alpha(0.0))
        .expect("solves")
        .first_stall
        .expect("stalls");
    assert!(
        tapered_stall.y > 0.5,
        "taper 0.25: first stall at y = {}",
        tapered_stall.y
    );
}
