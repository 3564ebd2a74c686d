//! `gammaline verify`: runs the published verification cases and prints the evidence.

use std::process::ExitCode;

use clap::ValueEnum;

use crate::verify::{self, render};

/// Exit code when a verification case fails.
pub const EXIT_CASE_FAILED: u8 = 1;

/// How `verify` prints.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub(super) enum VerifyFormat {
    /// An aligned table: case, source, expected, computed, tolerance, pass.
    Table,
    /// One JSON object with every case.
    Json,
    /// One CSV row a case, with a header row.
    Csv,
}

/// Runs every case, prints them, and exits 1 if any fails.
pub(super) fn verify(format: VerifyFormat) -> ExitCode {
    let outcomes = verify::run_all();
    let text = match format {
        VerifyFormat::Table => render::table(&outcomes),
        VerifyFormat::Json => render::json(&outcomes),
        VerifyFormat::Csv => render::csv(&outcomes),
    };
    let as_format = match format {
        VerifyFormat::Table => super::Format::Table,
        VerifyFormat::Json => super::Format::Json,
        VerifyFormat::Csv => super::Format::Csv,
    };
    if let Err(message) = super::commands::emit(&text, as_format) {
        eprintln!("error: {message}");
        return ExitCode::from(super::EXIT_BAD_INPUT);
    }
    if verify::all_pass(&outcomes) {
        ExitCode::SUCCESS
    } else {
        ExitCode::from(EXIT_CASE_FAILED)
    }
}
