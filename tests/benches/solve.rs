//! Solver benchmarks (criterion): `cargo bench --bench solve`. Results and the machine they
//! were taken on are in docs/performance.md.

#[path = "../common/mod.rs"]
mod common;

use std::hint::black_box;

use criterion::{criterion_group, criterion_main, BenchmarkId, Criterion};
use gammaline::solver::series::{prepare, Options, DEFAULT_TERMS};
use gammaline::wing::Wing;

/// A 10-station tapered wing (AR about 9, taper 0.4) with washout, a second airfoil blended in
/// toward the tip, profile drag and an aileron: the work a real file gives the solver.
fn ten_station_wing() -> Wing {
    let mut w = common::wing(Vec::new(), common::with_drag(0.009, 0.0, 0.0055));
    let tip = gammaline::wing::Airfoil {
        lift_slope: 5.9,
        alpha_zero_lift_deg: -1.5,
        cl_max: 1.3,
        ..common::with_drag(0.0085, 0.0, 0.006)
    };
    w.airfoils.insert("tip".into(), tip);
    w.stations = (0..10)
        .map(|i| {
            let eta = f64::from(i) / 9.0;
            let mut s = common::station(1.6 * eta, 0.30 * (1.0 - 0.6 * eta), -2.0 * eta);
            if i >= 7 {
                s.airfoil = "tip".into();
            }
            s
        })
        .collect();
    w.controls.push(common::aileron(1.05, 1.50, 0.25, 5.0));
    w
}

fn benches(c: &mut Criterion) {
    let wing = ten_station_wing();
    let condition = common::at_alpha(4.0);
    let mut group = c.benchmark_group("solve");
    for terms in [DEFAULT_TERMS, 200] {
        group.bench_with_input(BenchmarkId::new("full", terms), &terms, |b, &terms| {
            b.iter(|| {
                let p = prepare(black_box(&wing), Options { terms }).expect("solvable");
                p.solve(black_box(&condition)).expect("solves")
            });
        });
    }
    group.bench_function(BenchmarkId::new("prepare", DEFAULT_TERMS), |b| {
        b.iter(|| prepare(black_box(&wing), Options::default()).expect("solvable"));
    });
    let prepared = prepare(&wing, Options::default()).expect("solvable");
    group.bench_function(BenchmarkId::new("solution_only", DEFAULT_TERMS), |b| {
        b.iter(|| prepared.solve(black_box(&condition)).expect("solves"));
    });
    let alphas: Vec<f64> = (0..101).map(|i| -5.0 + 0.15 * f64::from(i)).collect();
    group.bench_function(
        BenchmarkId::new("sweep_101_prepare_once", DEFAULT_TERMS),
        |b| {
            b.iter(|| {
                let p = prepare(black_box(&wing), Options::default()).expect("solvable");
                p.sweep(black_box(&alphas))
            });
        },
    );
    group.bench_function(
        BenchmarkId::new("sweep_101_full_solves", DEFAULT_TERMS),
        |b| {
            b.iter(|| {
                alphas
                    .iter()
                    .map(|&alpha_deg| {
                        let p = prepare(black_box(&wing), Options::default()).expect("solvable");
                        p.solve(&common::at_alpha(alpha_deg))
                            .expect("solves")
                            .coefficients
                            .cl
                    })
                    .sum::<f64>()
            });
        },
    );
    group.finish();
}

criterion_group!(solve, benches);
criterion_main!(solve);
