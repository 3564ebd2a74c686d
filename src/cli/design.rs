//! `gammaline design`: the twist for a chosen loading, written to a new wing file.

use std::path::{Path, PathBuf};

use super::commands::{emit, load, method, shown, warn};
use super::{ConditionArgs, Format};
use crate::design::roll::{self, RollAuthority};
use crate::design::{self, twist, washout, DesignError, SolveFn};
use crate::report_design as render;
use crate::solver::{self, Solution, SolveError};
use crate::text::inert;
use crate::wing::{file, Condition, Wing};

#[derive(Debug, clap::Args)]
pub(super) struct DesignArgs {
    /// Wing file (TOML).
    #[arg(value_name = "FILE")]
    file: PathBuf,
    /// Design lift coefficient.
    #[arg(long, value_name = "CL", allow_negative_numbers = true)]
    cl: f64,
    /// Spanwise loading to design the twist for: elliptic, bell or blend:K (K in [0, 1]).
    #[arg(long, value_name = "LOADING", value_parser = twist::Loading::parse,
          required_unless_present = "washout", conflicts_with = "washout")]
    loading: Option<twist::Loading>,
    /// Find a linear washout instead: min-drag (least CDi at --cl) or root-first:MARGIN
    /// (least washout with every station's cl/cl_max MARGIN below the root's at first stall).
    #[arg(long, value_name = "GOAL", value_parser = washout::Goal::parse)]
    washout: Option<washout::Goal>,
    /// The designed wing file to write (never the input unless named here).
    #[arg(short = 'o', long = "output", value_name = "OUT")]
    output: PathBuf,
    #[command(flatten)]
    condition: ConditionArgs,
    /// Output format.
    #[arg(long, value_enum, default_value_t = Format::Table)]
    format: Format,
}

/// The solver with the command line's settings.
pub(super) fn solver_of(
    args: &ConditionArgs,
) -> impl Fn(&Wing, &Condition) -> Result<Solution, SolveError> + Sync {
    let method = method(args);
    // The wing carries the condition, so the preparation is done once for its roll rate
    // and Mach number.
    move |w: &Wing, c: &Condition| {
        let mut w = w.clone();
        w.condition = *c;
        solver::solve(&w, c, method)
    }
}

/// A design error in one line, naming the file.
pub(super) fn failed(path: &Path, e: &DesignError) -> String {
    format!("{}: {e}", shown(path))
}

/// The wing with the command line's speed and altitude in its condition.
pub(super) fn wing_at(path: &Path, args: &ConditionArgs) -> Result<Wing, String> {
    let mut wing = load(path)?;
    wing.condition = super::commands::condition(path, &wing, args)?;
    Ok(wing)
}

/// Writes the designed wing atomically: into a copy of the input's text (comments kept) when
/// the stations are the input's own, else afresh under a one-line `note` (the input's
/// comments would sit beside the wrong stations once stations are added).
pub(super) fn write_wing(
    input: &Path,
    output: &Path,
    wing: &Wing,
    note: &str,
) -> Result<(), String> {
    let original =
        std::fs::read_to_string(input).map_err(|e| inert(&format!("{}: {e}", input.display())))?;
    let same_stations =
        file::parse(&original, input).is_ok_and(|old| old.stations.len() == wing.stations.len());
    let text = if same_stations {
        file::edit_toml(&original, wing)
    } else {
        format!(
            "# {}
{}",
            inert(note),
            file::to_toml(wing)
        )
    };
    crate::fsio::write_atomic(output, text.as_bytes())
        .map_err(|e| inert(&format!("{}: cannot write: {e}", output.display())))
}

/// `gammaline design`.
pub(super) fn run(args: &DesignArgs) -> Result<(), String> {
    let wing = wing_at(&args.file, &args.condition)?;
    let solve = solver_of(&args.condition);
    let solve: SolveFn = &solve;
    match (args.loading, args.washout) {
        (Some(loading), _) => design_loading(args, &wing, loading, solve),
        (None, Some(goal)) => design_washout(args, &wing, goal, solve),
        (None, None) => Err("design: give --loading or --washout".into()),
    }
}

fn design_washout(
    args: &DesignArgs,
    wing: &Wing,
    goal: washout::Goal,
    solve: SolveFn,
) -> Result<(), String> {
    let found = washout::search(wing, args.cl, goal, solve).map_err(|e| failed(&args.file, &e))?;
    let note = format!(
        "Washout {} deg added for {} at CL {} from {}.",
        found.washout_deg,
        goal.label(),
        args.cl,
        args.file.display()
    );
    write_wing(&args.file, &args.output, &found.wing, &note)?;
    let report = render::WashoutReport {
        design: &found,
        goal,
        cl: args.cl,
        output: &args.output,
    };
    let text = match args.format {
        Format::Line | Format::Table => render::washout_table(&report),
        Format::Json => format!("{}\n", render::washout_json(&report)),
        Format::Csv => render::washout_csv(&report),
    };
    emit(&text, args.format)
}

fn design_loading(
    args: &DesignArgs,
    wing: &Wing,
    loading: twist::Loading,
    solve: SolveFn,
) -> Result<(), String> {
    let designed =
        twist::design_twist(wing, args.cl, loading).map_err(|e| failed(&args.file, &e))?;
    let neutral = solve(
        &twist::controls_neutral(&designed.wing),
        &design::at_cl(&designed.wing, args.cl),
    )
    .map_err(|e| failed(&args.file, &e.into()))?;
    let as_written = solve(&designed.wing, &design::at_cl(&designed.wing, args.cl))
        .map_err(|e| failed(&args.file, &e.into()))?;
    let delta0 = twist::untwisted_delta(wing, solve).map_err(|e| failed(&args.file, &e))?;
    warn(&args.file, &neutral.warnings);
    let note = format!(
        "Twist designed for the {} loading at CL {} from {}.",
        loading.label(),
        args.cl,
        args.file.display()
    );
    write_wing(&args.file, &args.output, &designed.wing, &note)?;
    let report = render::TwistReport {
        design: &designed,
        neutral: &neutral,
        as_written: &as_written,
        untwisted_delta: delta0,
        output: &args.output,
    };
    let text = match args.format {
        Format::Line | Format::Table => render::twist_table(&report),
        Format::Json => format!("{}\n", render::twist_json(&report)),
        Format::Csv => render::twist_csv(&report),
    };
    emit(&text, args.format)
}

/// The roll authority `solve` reports beside each solution (`None` without an aileron).
pub(super) fn roll_of(
    path: &Path,
    wing: &Wing,
    condition: &Condition,
    args: &ConditionArgs,
) -> Result<Option<RollAuthority>, String> {
    let solve = solver_of(args);
    roll::roll_authority(wing, condition, &solve).map_err(|e| failed(path, &e))
}
