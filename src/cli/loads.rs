//! `gammaline loads`: shear and bending along the span at a load factor.

use std::path::PathBuf;

use clap::ValueEnum;

use super::commands::{emit, warn};
use super::design::{failed, solver_of, wing_at};
use super::{ConditionArgs, Format};
use crate::design::loads::{self, LoadCase, MassDistribution};
use crate::design::SolveFn;
use crate::report_design as render;

#[derive(Debug, clap::Args)]
pub(super) struct LoadsArgs {
    /// Wing file (TOML).
    #[arg(value_name = "FILE")]
    file: PathBuf,
    /// Aircraft mass, kg (the wing's included).
    #[arg(long, value_name = "KG")]
    mass: f64,
    /// Load factor N: lift over weight.
    #[arg(long, value_name = "N", allow_negative_numbers = true)]
    load_factor: f64,
    /// Wing mass, kg: its weight at the same load factor relieves the lift.
    #[arg(long, value_name = "KG", default_value_t = 0.0)]
    wing_mass: f64,
    /// How the wing mass is spread along the span.
    #[arg(long, value_enum, default_value_t = Distribution::Uniform)]
    mass_distribution: Distribution,
    #[command(flatten)]
    condition: ConditionArgs,
    /// Output format.
    #[arg(long, value_enum, default_value_t = Format::Table)]
    format: Format,
}

/// `--mass-distribution`.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
enum Distribution {
    /// The same mass per metre of span.
    Uniform,
    /// Mass per metre proportional to the chord.
    Chord,
}

/// `gammaline loads`.
pub(super) fn run(args: &LoadsArgs) -> Result<(), String> {
    let wing = wing_at(&args.file, &args.condition)?;
    let solve = solver_of(&args.condition);
    let solve: SolveFn = &solve;
    let case = LoadCase {
        mass_kg: args.mass,
        load_factor: args.load_factor,
        wing_mass_kg: args.wing_mass,
        distribution: match args.mass_distribution {
            Distribution::Uniform => MassDistribution::Uniform,
            Distribution::Chord => MassDistribution::Chord,
        },
    };
    let result = loads::spar_loads(&wing, &case, solve).map_err(|e| failed(&args.file, &e))?;
    warn(&args.file, &result.solution.warnings);
    let text = match args.format {
        Format::Line | Format::Table => render::loads_table(&wing, &case, &result),
        Format::Json => format!("{}\n", render::loads_json(&wing, &case, &result)),
        Format::Csv => render::loads_csv(&result),
    };
    emit(&text, args.format)
}
