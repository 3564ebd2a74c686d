//! The headless command line: `solve`, `check`, `sweep`, and the workbench launchers.
//! A thin shell over the core: parse flags, read files, call the solver, print a report.

mod commands;
mod design;
mod loads;
mod refusal;
mod study;
mod verify;

use std::path::PathBuf;
use std::process::ExitCode;

use clap::{Parser, Subcommand, ValueEnum};

/// Exit code for bad input (a broken wing file or a bad flag value).
pub const EXIT_BAD_INPUT: u8 = 2;

/// Finite-wing analysis by lifting-line theory.
///
/// With no command, opens the terminal workbench on the last session (or the bundled
/// example wings). Results are preliminary design estimates: verify by test and licensed
/// practice; local airworthiness rules govern.
#[derive(Debug, Parser)]
#[command(name = "gammaline", version, about, long_about)]
pub struct Cli {
    #[command(subcommand)]
    command: Option<Command>,
    /// Session folder (default: the user config directory; env GAMMALINE_SESSION_DIR).
    #[arg(long, global = true, value_name = "DIR")]
    session: Option<PathBuf>,
    /// Draw with ASCII only (automatic when the locale is not UTF-8).
    #[arg(long, global = true)]
    ascii: bool,
    /// Notebook file that copied result lines are appended to (env GAMMALINE_NOTEBOOK).
    #[arg(long, global = true, value_name = "FILE")]
    notebook: Option<PathBuf>,
}

#[derive(Debug, Subcommand)]
enum Command {
    /// Solve one wing at one condition and print the result.
    Solve(SolveArgs),
    /// Solve one wing over a range of angles of attack (a lift and drag polar), at most
    /// 100000 points.
    Sweep(SweepArgs),
    /// Design the twist for a spanwise loading at a lift coefficient; writes a new wing file.
    Design(design::DesignArgs),
    /// Shear force and bending moment along the span at a load factor.
    Loads(loads::LoadsArgs),
    /// Vary one parameter over a range and solve every variant (a trade study).
    Study(study::StudyArgs),
    /// Validate wing files and print each one's geometry summary.
    Check {
        /// Wing files (TOML).
        #[arg(required = true, value_name = "FILE")]
        files: Vec<PathBuf>,
    },
    /// Open wing files in the terminal workbench.
    Open {
        /// Wing files (TOML).
        #[arg(required = true, value_name = "FILE")]
        files: Vec<PathBuf>,
    },
    /// Run the published verification cases and print each with its source; exit 1 if any fails.
    Verify {
        /// Output format.
        #[arg(long, value_enum, default_value_t = verify::VerifyFormat::Table)]
        format: verify::VerifyFormat,
    },
}

/// Flags that override the wing file's `[condition]`.
#[derive(Debug, clap::Args)]
struct ConditionArgs {
    /// True airspeed, m/s.
    #[arg(long, value_name = "M/S", allow_negative_numbers = true)]
    speed: Option<f64>,
    /// ISA geopotential altitude, m.
    #[arg(long, value_name = "M", allow_negative_numbers = true)]
    altitude: Option<f64>,
    /// Solution method: Glauert's sine series (flat straight wing, linear sections) or the
    /// numerical lifting line of horseshoe vortices (sweep, dihedral, section lift curves).
    #[arg(long, value_enum, default_value_t = MethodArg::Series)]
    method: MethodArg,
    /// Number of sine terms in the series (`--method series`).
    #[arg(long, value_name = "N")]
    terms: Option<usize>,
    /// Number of spanwise panels (`--method vortex`).
    #[arg(long, value_name = "N")]
    panels: Option<usize>,
}

/// The `--method` values.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
enum MethodArg {
    /// Glauert's sine series by collocation.
    Series,
    /// Numerical lifting line: horseshoe vortices, Newton on the section lift curves.
    Vortex,
}

#[derive(Debug, clap::Args)]
struct SolveArgs {
    /// Wing files (TOML); several give one result each (JSON: one object per line).
    #[arg(value_name = "FILE", required = true)]
    files: Vec<PathBuf>,
    /// Angle of attack of the wing reference line, degrees.
    #[arg(
        long,
        value_name = "DEG",
        allow_negative_numbers = true,
        conflicts_with = "cl"
    )]
    alpha: Option<f64>,
    /// Solve for the angle of attack that gives this wing lift coefficient.
    #[arg(long, value_name = "CL", allow_negative_numbers = true)]
    cl: Option<f64>,
    #[command(flatten)]
    condition: ConditionArgs,
    /// Also find the wing's CL_max by stepping alpha until the lift peaks or the solver
    /// stops converging (JSON `CL_max`, `alpha_CL_max_deg`, `stall_found_by`).
    #[arg(long)]
    stall: bool,
    /// Output format.
    #[arg(long, value_enum, default_value_t = Format::Table)]
    format: Format,
}

#[derive(Debug, clap::Args)]
struct SweepArgs {
    /// Wing file (TOML).
    #[arg(value_name = "FILE")]
    file: PathBuf,
    /// First angle of attack, degrees.
    #[arg(long, value_name = "DEG", allow_negative_numbers = true, default_value_t = -4.0)]
    from: f64,
    /// Last angle of attack, degrees.
    #[arg(
        long,
        value_name = "DEG",
        allow_negative_numbers = true,
        default_value_t = 12.0
    )]
    to: f64,
    /// Step, degrees, > 0 (the sweep runs from --from up to --to, at most 100000 points).
    #[arg(
        long,
        value_name = "DEG",
        allow_negative_numbers = true,
        default_value_t = 1.0
    )]
    step: f64,
    #[command(flatten)]
    condition: ConditionArgs,
    /// Output format (`line` prints the table).
    #[arg(long, value_enum, default_value_t = Format::Table)]
    format: Format,
}

/// How `solve` and `sweep` print.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
enum Format {
    /// One line to paste into a notebook.
    Line,
    /// A readable report.
    Table,
    /// One JSON object.
    Json,
    /// The spanwise table with a header row.
    Csv,
}

/// Parses the command line and runs it; the binary's whole `main`.
#[must_use]
pub fn run() -> ExitCode {
    let cli = match Cli::try_parse() {
        Ok(cli) => cli,
        Err(e) => return flag_error(&e),
    };
    let result = match cli.command {
        Some(Command::Solve(args)) => commands::solve(&args),
        Some(Command::Sweep(args)) => commands::sweep(&args),
        Some(Command::Check { files }) => commands::check(&files),
        Some(Command::Verify { format }) => return verify::verify(format),
        Some(Command::Design(args)) => design::run(&args),
        Some(Command::Loads(args)) => loads::run(&args),
        Some(Command::Study(args)) => study::run(&args),
        Some(Command::Open { files }) => {
            return workbench(files, cli.session, cli.ascii, cli.notebook)
        }
        None => return workbench(Vec::new(), cli.session, cli.ascii, cli.notebook),
    };
    match result {
        Ok(()) => ExitCode::SUCCESS,
        Err(message) => {
            commands::say("error", &message);
            ExitCode::from(EXIT_BAD_INPUT)
        }
    }
}

/// Help and version as clap prints them; a bad flag in plain text made inert, since clap
/// quotes the offending argument, which may be a hostile file name.
fn flag_error(e: &clap::Error) -> ExitCode {
    use clap::error::ErrorKind;
    if matches!(e.kind(), ErrorKind::DisplayHelp | ErrorKind::DisplayVersion) {
        let _ = e.print();
        return ExitCode::SUCCESS;
    }
    eprint!("{}", crate::text::inert_lines(&e.render().to_string()));
    ExitCode::from(u8::try_from(e.exit_code()).unwrap_or(EXIT_BAD_INPUT))
}

fn workbench(
    files: Vec<PathBuf>,
    session_dir: Option<PathBuf>,
    ascii: bool,
    notebook: Option<PathBuf>,
) -> ExitCode {
    crate::tui::run(crate::tui::LaunchOptions {
        files,
        session_dir,
        ascii,
        notebook,
    })
}
