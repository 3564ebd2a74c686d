//! What each command does, returning a one-line error for bad input.

use std::io::Write as _;
use std::path::{Path, PathBuf};

use super::{ConditionArgs, Format, MethodArg, SolveArgs, SweepArgs};
use crate::report;
use crate::solver::{self, FreeStream, Method, PreparedWing};
use crate::text;
use crate::wing::validate::MAX_ALPHA_DEG;
use crate::wing::{file, validate, Condition, Geometry, Wing};

/// Writes to stdout; a closed pipe (`| head`) ends the output quietly instead of failing.
/// Every report passes through here made inert (JSON escaped instead), so no text from a file
/// can reach the terminal as an escape sequence.
fn emit(text: &str, format: Format) -> Result<(), String> {
    let safe = match format {
        Format::Json => text::json_escaped(text),
        Format::Line | Format::Table | Format::Csv => text::inert_lines(text),
    };
    let mut out = std::io::stdout().lock();
    match out.write_all(safe.as_bytes()).and_then(|()| out.flush()) {
        Err(e) if e.kind() != std::io::ErrorKind::BrokenPipe => Err(format!("stdout: {e}")),
        _ => Ok(()),
    }
}

/// Prints `label: message` on stderr, made inert.
pub(super) fn say(label: &str, message: &str) {
    eprintln!("{label}: {}", text::inert(message));
}

/// A path as printed in messages.
fn shown(path: &Path) -> String {
    text::inert(&path.display().to_string())
}

/// Reads a wing.
fn load(path: &Path) -> Result<Wing, String> {
    file::read(path).map_err(|e| e.to_string())
}

/// The method the flags ask for; a resolution flag of the other method is refused.
fn method(args: &ConditionArgs) -> Result<Method, String> {
    match (args.method, args.terms, args.panels) {
        (MethodArg::Series, terms, None) => {
            Ok(Method::series(terms.unwrap_or(solver::DEFAULT_TERMS)))
        }
        (MethodArg::Vortex, None, panels) => {
            Ok(Method::vortex(panels.unwrap_or(solver::DEFAULT_PANELS)))
        }
        (MethodArg::Series, _, Some(_)) => {
            Err("--panels applies to --method vortex (the series takes --terms)".into())
        }
        (MethodArg::Vortex, Some(_), _) => {
            Err("--terms applies to --method series (the vortex method takes --panels)".into())
        }
    }
}

/// Prepares `wing` at `condition` (which sets the Mach correction and the roll rate).
fn prepare(
    path: &Path,
    wing: &Wing,
    condition: &Condition,
    args: &ConditionArgs,
) -> Result<PreparedWing, String> {
    let mut wing = wing.clone();
    wing.condition = *condition;
    solver::prepare(&wing, method(args)?).map_err(|e| format!("{}: {e}", shown(path)))
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
            shown(path)
        )),
        None => Ok(c),
    }
}

fn warn(path: &Path, warnings: &[String]) {
    for w in warnings {
        say("warning", &format!("{}: {w}", path.display()));
    }
}

/// `gammaline solve`: each file in turn; the first bad one stops the run.
pub(super) fn solve(args: &SolveArgs) -> Result<(), String> {
    if args.format == Format::Csv && args.files.len() > 1 {
        return Err("--format csv takes one wing file at a time".into());
    }
    for (i, path) in args.files.iter().enumerate() {
        if i > 0 && args.format == Format::Table {
            emit("\n", args.format)?;
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
    let prepared = prepare(path, &wing, &c, &args.condition)?;
    let failed = |e: solver::SolveError| format!("{}: {e}", shown(path));
    let mut s = prepared.solve(&c).map_err(failed)?;
    if args.stall {
        s.cl_max = Some(prepared.cl_max().map_err(failed)?);
    }
    warn(path, &s.warnings);
    let out = match args.format {
        Format::Line => format!("{}\n", report::line(&wing, &s, c.target_cl)),
        Format::Table => report::table(&wing, &s, c.target_cl),
        Format::Json => format!("{}\n", report::json(&wing, &s, c.target_cl)),
        Format::Csv => report::csv(&s),
    };
    emit(&out, args.format)
}

/// `gammaline sweep`.
pub(super) fn sweep(args: &SweepArgs) -> Result<(), String> {
    let count = sweep_points(args.from, args.to, args.step)?;
    let wing = load(&args.file)?;
    let c = condition(&args.file, &wing, &args.condition)?;
    let prepared = prepare(&args.file, &wing, &c, &args.condition)?;
    warn(&args.file, prepared.warnings());
    let alphas: Vec<f64> = (0..count)
        .map(|i| args.from + i as f64 * args.step)
        .collect();
    let points = prepared
        .sweep(&alphas)
        .map_err(|e| format!("{}: {e}", shown(&args.file)))?;
    let q = FreeStream::of(&c).q;
    let style = match args.format {
        Format::Json => report::SweepStyle::Json,
        Format::Csv => report::SweepStyle::Csv,
        Format::Line | Format::Table => report::SweepStyle::Table,
    };
    let table = report::SweepTable {
        geometry: prepared.geometry(),
        method: prepared.method().name(),
        q,
        points: &points,
    };
    emit(&report::sweep(&wing, &table, style), args.format)
}

/// The most points one sweep computes.
pub(super) const MAX_SWEEP_POINTS: usize = 100_000;

/// The number of points from `from` up to `to` by `step`, or why the range is refused.
fn sweep_points(from: f64, to: f64, step: f64) -> Result<usize, String> {
    let readable = text::readable;
    if !(step > 0.0 && step.is_finite()) {
        return Err(format!(
            "sweep: --step must be > 0 (got {}): the sweep runs from --from up to --to; \
             to sweep the other way, swap them",
            readable(step)
        ));
    }
    for (flag, v) in [("--from", from), ("--to", to)] {
        if !(-MAX_ALPHA_DEG..=MAX_ALPHA_DEG).contains(&v) {
            return Err(format!(
                "sweep: {flag} must be within -{MAX_ALPHA_DEG} to {MAX_ALPHA_DEG} deg (got {})",
                readable(v)
            ));
        }
    }
    if to < from {
        return Err(format!(
            "sweep: --to {} is below --from {}: the sweep runs upwards, swap them",
            readable(to),
            readable(from)
        ));
    }
    let steps = ((to - from) / step + 1e-9).floor();
    if steps >= MAX_SWEEP_POINTS as f64 {
        return Err(format!(
            "sweep: {} points is too many (at most {MAX_SWEEP_POINTS}); take a larger --step",
            readable(steps + 1.0)
        ));
    }
    // A whole number in 0..MAX_SWEEP_POINTS, so the cast is exact.
    Ok(steps as usize + 1)
}

/// `gammaline check`: validates every file; fails if any is bad.
pub(super) fn check(files: &[PathBuf]) -> Result<(), String> {
    let mut errors = Vec::new();
    for path in files {
        match load(path) {
            Ok(wing) => {
                let g = Geometry::of(&wing);
                let line = report::geometry_line(path, &wing, &g);
                emit(&format!("{line}\n"), Format::Line)?;
                warn(path, &validate::warnings(&wing, &g));
            }
            Err(e) => errors.push(e),
        }
    }
    // All but the last are printed here, the last by the caller, so each file gets one line.
    let last = errors.pop();
    for e in errors {
        say("error", &e);
    }
    last.map_or(Ok(()), Err)
}
