//! Trade-study benchmark (criterion): `cargo bench --bench study`. 1,001 variants of the
//! trainer example, washout 0 to 5 deg at CL 0.5, every variant a full solve. After
//! criterion, the same study by a straightforward numpy implementation of the same method
//! (tests/benches/study_numpy.py) is timed when python3 with numpy is installed, and skipped
//! with a message otherwise. Results in docs/performance.md.

use std::hint::black_box;
use std::path::Path;
use std::process::Command;

use criterion::{criterion_group, Criterion};
use gammaline::design::study::{self, Vary};
use gammaline::solver::{self, Method, Solution, SolveError};
use gammaline::wing::{file, Condition, Wing};

fn solve(w: &Wing, c: &Condition) -> Result<Solution, SolveError> {
    let mut w = w.clone();
    w.condition = *c;
    solver::solve(&w, c, Method::default())
}

fn benches(c: &mut Criterion) {
    let wing = file::read(Path::new("wings/trainer.toml")).expect("the example reads");
    let condition = Condition {
        target_cl: Some(0.5),
        ..wing.condition
    };
    let mut group = c.benchmark_group("study");
    group.sample_size(20);
    for text in ["washout=0:5:0.005", "station.2.chord=1.0:2.0:0.001"] {
        let vary = Vary::parse(text).expect("parses");
        group.bench_function(text, |b| {
            b.iter(|| study::run(black_box(&wing), &vary, &condition, &solve));
        });
    }
    group.finish();
}

fn numpy_comparison() {
    let has_numpy = Command::new("python3")
        .args(["-c", "import numpy"])
        .status()
        .is_ok_and(|s| s.success());
    if !has_numpy {
        println!("numpy comparison skipped: python3 with numpy not found");
        return;
    }
    match Command::new("python3")
        .arg("tests/benches/study_numpy.py")
        .output()
    {
        Ok(o) => print!("{}", String::from_utf8_lossy(&o.stdout)),
        Err(e) => println!("numpy comparison failed to start: {e}"),
    }
}

criterion_group!(study_benches, benches);

fn main() {
    study_benches();
    Criterion::default().configure_from_args().final_summary();
    numpy_comparison();
}
