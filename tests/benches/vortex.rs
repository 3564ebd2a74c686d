//! Vortex-method benchmarks (criterion): `cargo bench --bench vortex`. Results and the machine
//! they were taken on are in docs/performance.md.

#[path = "../common/mod.rs"]
mod common;

use std::hint::black_box;

use criterion::{criterion_group, criterion_main, Criterion};
use gammaline::solver::vortex::{prepare, Options};
use gammaline::solver::{DEFAULT_MAX_ITER, DEFAULT_PANELS, DEFAULT_TOL};
use gammaline::wing::{Section, Wing};

/// A 10-station tapered wing (AR about 9, taper 0.4, 2 deg washout) swept 10 deg at the
/// quarter chord with 3 deg dihedral and a part-span aileron.
fn swept_wing() -> Wing {
    let mut w = common::wing(Vec::new(), common::with_drag(0.009, 0.0, 0.0055));
    w.stations = (0..10)
        .map(|i| {
            let eta = f64::from(i) / 9.0;
            let y = 1.6 * eta;
            let mut s = common::station(y, 0.30 * (1.0 - 0.6 * eta), -2.0 * eta);
            s.x_le = y * 10f64.to_radians().tan() - 0.25 * s.chord;
            s.z = y * 3f64.to_radians().tan();
            s
        })
        .collect();
    w.controls.push(common::aileron(1.05, 1.50, 0.25, 5.0));
    w
}

/// A lift curve that bends over toward cl_max (invented): cl_max tanh(a0 alpha / cl_max).
fn bending(section: &Section, alpha: f64) -> (f64, f64) {
    let (a0, top) = (section.airfoil.lift_slope, section.airfoil.cl_max);
    let x = a0 * (alpha - section.airfoil.alpha_zero_lift_deg.to_radians()) / top;
    (top * x.tanh(), a0 / x.cosh().powi(2))
}

fn benches(c: &mut Criterion) {
    let wing = swept_wing();
    let options = Options {
        panels: DEFAULT_PANELS,
        tol: DEFAULT_TOL,
        max_iter: DEFAULT_MAX_ITER,
    };
    let condition = common::at_alpha(8.0);
    let mut group = c.benchmark_group("vortex");
    group.bench_function("nonlinear_60_prepare_and_solve", |b| {
        b.iter(|| {
            let p = prepare(black_box(&wing), options)
                .expect("prepares")
                .with_lift_law(bending);
            p.solve(black_box(&condition)).expect("solves")
        });
    });
    let prepared = prepare(&wing, options)
        .expect("prepares")
        .with_lift_law(bending);
    group.bench_function("nonlinear_60_solve", |b| {
        b.iter(|| prepared.solve(black_box(&condition)).expect("solves"));
    });
    let alphas: Vec<f64> = (0..100).map(|i| -5.0 + 0.2 * f64::from(i)).collect();
    group.bench_function("sweep_100_continuation", |b| {
        b.iter(|| {
            let p = prepare(black_box(&wing), options)
                .expect("prepares")
                .with_lift_law(bending);
            p.sweep(black_box(&alphas)).expect("converges")
        });
    });
    group.finish();
}

criterion_group!(vortex, benches);
criterion_main!(vortex);
