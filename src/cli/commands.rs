//! What each command does, returning a one-line error for bad input.

use std::io::Write as _;
use std::path::{Path, PathBuf};

use super::{ConditionArgs, Format, SolveArgs, SweepArgs};
use crate::report;
use crate::solver::{self, Options, Prepared};
use crate::text::inert;
use crate::wing::{file, validate, Condition, Geometry, Wing};

/// Writes to stdout; a closed pipe (`| head`) ends the output quietly instead of failing.
pub(super) fn emit(text: &str) -> Result<(), String> {
    let mut out = std::io::stdout().lock();
    match out.write_all(text.as_bytes()).and_then(|()| out.flush()) {
        Err(e) if e.kind() != std::io::ErrorKind::BrokenPipe => Err(format!("stdout: {e}")),
        _ => Ok(()),
    }
}

/// Reads a wing and prints its warnings to stderr.
fn load(path: &Path) -> Result<Wing, String> {
    file::read(path).map_err(|e| inert(&e.to_string()))
}

fn prepare(path: &Path, wing: &Wing, args: &ConditionArgs) -> Result<Prepared, String> {
    let options = Options {
        terms: args.terms.unwrap_or(solver::DEFAULT_TERMS),
    };
    solver::prepare(wing, options).map_err(|e| format!("{}: {e}", path.display()))
}

fn condition(path: &Path, wing: &Wing, args: &ConditionArgs) -> Result<Condition, String> {
    let mut c = wing.condition;
    if let Some(v) = args.speed {
        c.speed = v;
    }
    if let Some(h) = args.altitude {
        c.altitude = h;
    }
    match validate::condition_rules(&c).into_iter().next() {
        Some(p) => Err(format!(
            "{}: {p} (from the command line or [condition])",
            path.display()
        )),
        None => Ok(c),
    }
}

fn warn(path: &Path, warnings: &[String]) {
    for w in warnings {
        eprintln!("warning: {}: {w}", path.display());
    }
}

/// `gammaline solve`: each file in turn; the first bad one stops the run.
pub(super) fn solve(args: &SolveArgs) -> Result<(), String> {
    if args.format == Format::Csv && args.files.len() > 1 {
        return Err("--format csv takes one wing file at a time".into());
    }
    for (i, path) in args.files.iter().enumerate() {
        if i > 0 && args.format == Format::Table {
            emit("\n")?;
        }
        solve_one(path, args)?;
    }
    Ok(())
}

fn solve_one(path: &Path, args: &SolveArgs) -> Result<(), String> {
    let wing = load(path)?;
    let mut c = condition(path, &wing, &args.condition)?;
    if let Some(alpha) = args.alpha {
        c.alpha_deg = alpha;
        c.target_cl = None;
    }
    if let Some(cl) = args.cl {
        c.target_cl = Some(cl);
    }
    let prepared = prepare(path, &wing, &args.condition)?;
    let s = prepared
        .solve(&c)
        .map_err(|e| format!("{}: {e}", path.display()))?;
    warn(path, &s.warnings);
    match args.format {
        Format::Line => emit(&format!("{}\n", report::line(&wing, &s, c.target_cl))),
        Format::Table => emit(&report::table(&wing, &s, c.target_cl)),
        Format::Json => emit(&format!("{}\n", report::json(&wing, &s, c.target_cl))),
        Format::Csv => emit(&report::csv(&s)),
    }
}

/// `gammaline sweep`.
pub(super) fn sweep(args: &SweepArgs) -> Result<(), String> {
    let finite = args.step.is_finite() && args.from.is_finite() && args.to.is_finite();
    if !(finite && args.step > 0.0) {
        return Err("sweep: --step must be > 0 and --from/--to finite".into());
    }
    if args.to < args.from {
        return Err(format!(
            "sweep: --to {} is below --from {}",
            args.to, args.from
        ));
    }
    let count = ((args.to - args.from) / args.step + 1e-9).floor() as usize + 1;
    if count > 100_000 {
        return Err(format!(
            "sweep: {count} points is too many (at most 100000)"
        ));
    }
    let wing = load(&args.file)?;
    let c = condition(&args.file, &wing, &args.condition)?;
    let prepared = prepare(&args.file, &wing, &args.condition)?;
    warn(&args.file, &validate::warnings(&wing, prepared.geometry()));
    let alphas: Vec<f64> = (0..count)
        .map(|i| args.from + i as f64 * args.step)
        .collect();
    let points = prepared.sweep(&alphas);
    let q = {
        let air = crate::atmosphere::at(c.altitude);
        0.5 * air.density * c.speed * c.speed
    };
    let style = match args.format {
        Format::Json => report::SweepStyle::Json,
        Format::Csv => report::SweepStyle::Csv,
        Format::Line | Format::Table => report::SweepStyle::Table,
    };
    emit(&report::sweep(
        &wing,
        prepared.geometry(),
        &points,
        q,
        style,
    ))
}

/// `gammaline check`: validates every file; fails if any is bad.
pub(super) fn check(files: &[PathBuf]) -> Result<(), String> {
    let mut errors = Vec::new();
    for path in files {
        match load(path) {
            Ok(wing) => {
                let g = Geometry::of(&wing);
                emit(&format!("{}\n", report::geometry_line(path, &wing, &g)))?;
                warn(path, &validate::warnings(&wing, &g));
            }
            Err(e) => errors.push(e),
        }
    }
    // All but the last are printed here, the last by the caller, so each file gets one line.
    let last = errors.pop();
    for e in errors {
        eprintln!("error: {e}");
    }
    last.map_or(Ok(()), Err)
}
