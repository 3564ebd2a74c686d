//! `gammaline study`: one parameter varied, every variant solved.

use std::path::PathBuf;

use super::commands::{emit, shown};
use super::design::{solver_of, wing_at};
use super::{ConditionArgs, Format};
use crate::design::study::{self, Vary};
use crate::design::SolveFn;
use crate::report_design as render;

#[derive(Debug, clap::Args)]
pub(super) struct StudyArgs {
    /// Wing file (TOML).
    #[arg(value_name = "FILE")]
    file: PathBuf,
    /// What to vary and over what range: station.N.chord|twist|y, control.NAME.deflection,
    /// airfoil.NAME.lift_slope|alpha_zero_lift|cl_max, span, taper or washout.
    #[arg(long, value_name = "KEY=FROM:TO:STEP", value_parser = Vary::parse, allow_hyphen_values = true)]
    vary: Vary,
    /// Solve every variant at this angle of attack, degrees.
    #[arg(
        long,
        value_name = "DEG",
        allow_negative_numbers = true,
        conflicts_with = "cl"
    )]
    alpha: Option<f64>,
    /// Solve every variant for this lift coefficient.
    #[arg(long, value_name = "CL", allow_negative_numbers = true)]
    cl: Option<f64>,
    #[command(flatten)]
    condition: ConditionArgs,
    /// Output format (`line` prints the table).
    #[arg(long, value_enum, default_value_t = Format::Table)]
    format: Format,
}

/// `gammaline study`.
pub(super) fn run(args: &StudyArgs) -> Result<(), String> {
    let wing = wing_at(&args.file, &args.condition)?;
    args.vary
        .key
        .check(&wing)
        .map_err(|e| format!("{}: {e}", shown(&args.file)))?;
    let mut condition = wing.condition;
    if let Some(alpha) = args.alpha {
        condition.alpha_deg = alpha;
        condition.target_cl = None;
    }
    if let Some(cl) = args.cl {
        condition.target_cl = Some(cl);
    }
    let solve = solver_of(&args.condition);
    let solve: SolveFn = &solve;
    let variants = study::run(&wing, &args.vary, &condition, solve);
    let text = match args.format {
        Format::Line | Format::Table => render::study_table(&wing, &args.vary, &variants),
        Format::Json => format!("{}\n", render::study_json(&wing, &args.vary, &variants)),
        Format::Csv => render::study_csv(&variants),
    };
    emit(&text, args.format)
}
