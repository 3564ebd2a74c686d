//! Convergence study of the Glauert collocation solver, printed as the tables of
//! docs/theory.md. Not part of the normal test run (it solves up to 1000 terms):
//!
//!   cargo test --release --test convergence_study -- --ignored --nocapture
//!
//! The reference ("converged") value of each quantity is the 1000-term answer.

mod common;

use common::*;
use gammaline::solver::series::{prepare, Options, DEFAULT_TERMS};
use gammaline::wing::Wing;

const COUNTS: [usize; 12] = [10, 20, 30, 40, 60, 80, 120, 160, 240, 320, 480, 640];
const REFERENCE_TERMS: usize = 1000;

const LABELS: [&str; 8] = [
    "CL_alpha /rad",
    "CL",
    "CDi",
    "e",
    "delta",
    "Cl_roll",
    "CDp",
    "CL_first_stall",
];
const CL_ALPHA: usize = 0;
const CL: usize = 1;
const CDI: usize = 2;
const E: usize = 3;
const DELTA: usize = 4;
const CL_ROLL: usize = 5;
const CDP: usize = 6;
const CL_STALL: usize = 7;

/// The quantities of [`LABELS`]; all but CL_alpha and CL_first_stall at alpha = 5 deg.
fn quantities(wing: &Wing, terms: usize) -> [f64; 8] {
    let p = prepare(wing, Options { terms }).expect("solvable");
    let c = p.coefficients(5f64.to_radians());
    let stall = p
        .solve(&wing.condition)
        .ok()
        .and_then(|s| s.first_stall)
        .map_or(f64::NAN, |f| f.cl_wing);
    [
        p.cl_alpha(),
        c.cl,
        c.cdi,
        c.e.unwrap_or(f64::NAN),
        c.delta.unwrap_or(f64::NAN),
        c.cl_roll,
        c.cdp,
        stall,
    ]
}

fn table(name: &str, wing: &Wing, columns: &[usize]) {
    let reference = quantities(wing, REFERENCE_TERMS);
    println!("\n### {name}\n");
    let mut header = String::from("| N |");
    let mut rule = String::from("|---|");
    for &i in columns {
        header += &format!(" {} | rel. error |", LABELS[i]);
        rule += "---|---|";
    }
    println!("{header}\n{rule}");
    let mut counts: Vec<usize> = COUNTS.to_vec();
    if !counts.contains(&DEFAULT_TERMS) {
        counts.push(DEFAULT_TERMS);
        counts.sort_unstable();
    }
    for n in counts.into_iter().chain([REFERENCE_TERMS]) {
        let q = quantities(wing, n);
        let mut row = format!("| {n} |");
        for &i in columns {
            let err = if n == REFERENCE_TERMS {
                "(reference)".to_string()
            } else {
                format!("{:.1e}", rel(q[i], reference[i]))
            };
            row += &format!(" {:.6} | {err} |", q[i]);
        }
        println!("{row}");
    }
}

#[test]
#[ignore = "prints the convergence tables for docs/theory.md; run with --release"]
fn print_convergence_tables() {
    let mut rect = rectangular(6.0);
    rect.airfoils
        .insert("a".into(), with_drag(0.008, 0.0, 0.006));
    table(
        "Rectangular, AR 6, untwisted, cd = 0.008 + 0.006 cl^2",
        &rect,
        &[CL_ALPHA, CDI, E, DELTA, CDP],
    );

    let mut washout = tapered_twisted(8.0, 0.5, -3.0);
    washout
        .airfoils
        .insert("a".into(), with_drag(0.008, 0.0, 0.006));
    table(
        "Tapered, AR 8, taper 0.5, 3 deg linear washout, cd = 0.008 + 0.006 cl^2",
        &washout,
        &[CL_ALPHA, CL, CDI, E, DELTA, CDP],
    );

    table(
        "Rectangular AR 8, aileron 0.60-0.95 semispan, 25% chord, +10 deg right",
        &aileron_wing(),
        &[CL_ALPHA, CL_ROLL],
    );

    table(
        "Tapered, AR 8, taper 0.5, untwisted",
        &tapered(8.0, 0.5),
        &[CL_ALPHA, CDI, E, DELTA],
    );

    table(
        "Smooth taper (chord 1 - 0.6 eta^2, twist -3 eta^2 deg, 81 stations), AR 8",
        &smooth_tapered(),
        &[CL_ALPHA, CL, CDI, E, CDP],
    );

    let mut tip = pointed(6.0);
    tip.airfoils
        .insert("a".into(), with_drag(0.008, 0.0, 0.006));
    table(
        "Pointed tip (taper 0), AR 6, untwisted",
        &tip,
        &[CL_ALPHA, CDI, E, DELTA, CDP, CL_STALL],
    );

    table(
        "Elliptic planform from 41 cosine-spaced stations, AR 8, untwisted, cl_max 1.2",
        &elliptic_stations(41, 1.2),
        &[CL_ALPHA, CL_STALL],
    );
}

/// An elliptic planform of span 2 and AR 8 from `n` right-half stations, cosine-spaced
/// toward the tip (the tip chord is zero), one section with `cl_max`.
fn elliptic_stations(n: usize, cl_max: f64) -> Wing {
    let c0 = 4.0 * 2.0 / (std::f64::consts::PI * 8.0);
    let stations = (0..n)
        .map(|k| {
            let y = (k as f64 / (n - 1) as f64 * std::f64::consts::FRAC_PI_2).sin();
            station(y, c0 * (1.0 - y * y).max(0.0).sqrt(), 0.0)
        })
        .collect();
    let mut a = thin();
    a.cl_max = cl_max;
    wing(stations, a)
}
