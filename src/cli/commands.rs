//! What each command does, returning a one-line error for bad input.

use std::io::Write as _;
use std::path::{Path, PathBuf};

use super::refusal::{self, Overrides};
use super::{ConditionArgs, Format, MethodArg, SolveArgs, SweepArgs};
use crate::report;
use crate::report_design;
use crate::solver::{self, FreeStream, Method, PreparedWing, SolveError};
use crate::text;
use crate::wing::file::{self, Origin};
use crate::wing::validate::MAX_ALPHA_DEG;
use crate::wing::{validate, Condition, Geometry, Wing};

/// Writes to stdout; a closed pipe (`| head`) ends the output quietly instead of failing.
/// Every report passes through here made inert (JSON escaped instead), so no text from a file
/// can reach the terminal as an escape sequence.
pub(super) fn emit(text: &str, format: Format) -> Result<(), String> {
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
pub(super) fn shown(path: &Path) -> String {
    text::inert(&path.display().to_string())
}

/// Reads a wing.
pub(super) fn load(path: &Path) -> Result<Wing, String> {
    file::read(path).map_err(|e| e.to_string())
}

/// Reads a wing, keeping where its values stood for locating later refusals.
fn load_with_origin(path: &Path) -> Result<(Wing, Origin), String> {
    file::read_with_origin(path).map_err(|e| e.to_string())
}

/// The method the flags ask for (see [`method_flags`] for a resolution flag of the other one).
pub(super) fn method(args: &ConditionArgs) -> Method {
    match args.method {
        MethodArg::Series => Method::series(args.terms.unwrap_or(solver::DEFAULT_TERMS)),
        MethodArg::Vortex => Method::vortex(args.panels.unwrap_or(solver::DEFAULT_PANELS)),
    }
}

/// Refuses a resolution flag that belongs to the other method.
pub(super) fn method_flags(args: &ConditionArgs) -> Result<(), String> {
    match (args.method, args.terms, args.panels) {
        (MethodArg::Series, _, Some(_)) => {
            Err("--panels applies to --method vortex (the series takes --terms)".into())
        }
        (MethodArg::Vortex, Some(_), _) => {
            Err("--terms applies to --method series (the vortex method takes --panels)".into())
        }
        _ => Ok(()),
    }
}

/// Prepares `wing` at `condition` (which sets the Mach correction and the roll rate).
fn prepare(
    wing: &Wing,
    condition: &Condition,
    args: &ConditionArgs,
) -> Result<PreparedWing, SolveError> {
    let mut wing = wing.clone();
    wing.condition = *condition;
    solver::prepare(&wing, method(args))
}

pub(super) fn condition(
    path: &Path,
    wing: &Wing,
    args: &ConditionArgs,
) -> Result<Condition, String> {
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

pub(super) fn warn(path: &Path, warnings: &[String]) {
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
    let (wing, origin) = load_with_origin(path)?;
    let mut c = condition(path, &wing, &args.condition)?;
    if let Some(alpha) = args.alpha {
        c.alpha_deg = alpha;
        c.target_cl = None;
    }
    if let Some(cl) = args.cl {
        c.target_cl = Some(cl);
    }
    let flags = Overrides {
        alpha: args.alpha.is_some(),
        cl: args.cl.is_some(),
        speed: args.condition.speed.is_some(),
        altitude: args.condition.altitude.is_some(),
    };
    method_flags(&args.condition)?;
    let refused = |e: SolveError| refusal::refusal(path, &origin, &e, flags);
    let prepared = prepare(&wing, &c, &args.condition).map_err(refused)?;
    let mut s = prepared.solve(&c).map_err(refused)?;
    if args.stall {
        s.cl_max = Some(prepared.cl_max().map_err(refused)?);
    }
    refusal::finite(&origin, &s)?;
    warn(path, &s.warnings);
    let roll = super::design::roll_of(path, &wing, &c, &args.condition)?;
    let out = match args.format {
        Format::Line => format!(
            "{}{}\n",
            report::line(&wing, &s, c.target_cl),
            report_design::roll_line(roll.as_ref())
        ),
        Format::Table => {
            report_design::with_roll_table(&report::table(&wing, &s, c.target_cl), roll.as_ref())
        }
        Format::Json => {
            let mut json = report::json(&wing, &s, c.target_cl);
            report_design::add_roll_json(&mut json, roll.as_ref());
            format!("{json}\n")
        }
        Format::Csv => report::csv(&s),
    };
    emit(&out, args.format)
}

/// `gammaline sweep`.
pub(super) fn sweep(args: &SweepArgs) -> Result<(), String> {
    let count = sweep_points(args.from, args.to, args.step)?;
    method_flags(&args.condition)?;
    let (wing, origin) = load_with_origin(&args.file)?;
    let c = condition(&args.file, &wing, &args.condition)?;
    let flags = Overrides {
        speed: args.condition.speed.is_some(),
        altitude: args.condition.altitude.is_some(),
        ..Overrides::default()
    };
    let prepared = prepare(&wing, &c, &args.condition)
        .map_err(|e| refusal::refusal(&args.file, &origin, &e, flags))?;
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

/// The wing, when `solve` would solve it at its own condition with the default method;
/// else `solve`'s refusal, located in the file.
fn solvable(path: &Path, wing: Wing, origin: &Origin) -> Result<Wing, String> {
    let none = Overrides::default();
    let s = solver::solve(&wing, &wing.condition, Method::default())
        .map_err(|e| refusal::refusal(path, origin, &e, none))?;
    refusal::finite(origin, &s)?;
    Ok(wing)
}

/// `gammaline check`: validates every file and solves it at its own condition; fails if
/// any is bad.
pub(super) fn check(files: &[PathBuf]) -> Result<(), String> {
    let mut errors = Vec::new();
    for path in files {
        match load_with_origin(path).and_then(|(wing, origin)| solvable(path, wing, &origin)) {
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
