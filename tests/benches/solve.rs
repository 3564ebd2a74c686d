//! Solver speed: one solve at the default term count and at 200 terms, and a 101-point alpha
//! sweep after one factorisation (against 101 full solves). Results in docs/performance.md.

use std::collections::BTreeMap;
use std::hint::black_box;

use criterion::{criterion_group, criterion_main, Criterion};
use gammaline::solver::{self, Options, DEFAULT_TERMS};
use gammaline::wing::{Airfoil, Condition, Control, ControlKind, Station, Wing};

/// A 10-station tapered wing with washout, two airfoils and an aileron (invented numbers).
fn ten_station_wing() -> Wing {
    let stations = (0..10)
        .map(|i| {
            let eta = f64::from(i) / 9.0;
            Station {
                y: 5.0 * eta,
                chord: 1.6 - 0.9 * eta,
                twist_deg: -2.5 * eta,
                airfoil: if i < 5 { "inner" } else { "outer" }.to_string(),
                x_le: 0.2 * eta,
                z: 0.0,
            }
        })
        .collect();
    let foil = |slope, zero_lift| Airfoil {
        lift_slope: slope,
        alpha_zero_lift_deg: zero_lift,
        cl_max: 1.4,
        cd0: 0.0085,
        cd1: 0.0,
        cd2: 0.006,
    };
    Wing {
        name: "bench".into(),
        symmetric: true,
        stations,
        airfoils: BTreeMap::from([
            ("inner".to_string(), foil(6.2, -2.2)),
            ("outer".to_string(), foil(6.0, -1.5)),
        ]),
        controls: vec![Control {
            name: "aileron".into(),
            kind: ControlKind::Aileron,
            y_inner: 3.2,
            y_outer: 4.7,
            chord_fraction: 0.25,
            deflection_deg: 5.0,
            effectiveness: None,
        }],
        condition: Condition {
            alpha_deg: 4.0,
            ..Condition::default()
        },
    }
}

fn benches(c: &mut Criterion) {
    let wing = ten_station_wing();
    let condition = wing.condition;
    c.bench_function("solve, 10 stations, default terms", |b| {
        b.iter(|| solver::solve(black_box(&wing), &condition, Options::default()))
    });
    c.bench_function("solve, 10 stations, 200 terms", |b| {
        b.iter(|| solver::solve(black_box(&wing), &condition, Options { terms: 200 }))
    });
    let alphas: Vec<f64> = (0..101).map(|i| -5.0 + 0.2 * f64::from(i)).collect();
    c.bench_function("sweep, 101 alphas, one factorisation", |b| {
        b.iter(|| {
            let prepared = solver::prepare(black_box(&wing), Options::default()).expect("solves");
            prepared.sweep(&alphas)
        })
    });
    c.bench_function("sweep, 101 full solves (for contrast)", |b| {
        b.iter(|| {
            alphas
                .iter()
                .map(|&alpha_deg| {
                    let c = Condition {
                        alpha_deg,
                        ..condition
                    };
                    solver::solve(black_box(&wing), &c, Options::default())
                })
                .count()
        })
    });
    let _ = DEFAULT_TERMS;
}

criterion_group! {
    name = solve;
    config = Criterion::default().sample_size(30).measurement_time(std::time::Duration::from_secs(3));
    targets = benches
}
criterion_main!(solve);
