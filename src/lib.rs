//! gammaline: finite-wing analysis by lifting-line theory.
//!
//! The crate is layered so that a reader can tell from a module's name what it may touch:
//! - [`wing`]: the wing model, its planform geometry, validation and TOML file format;
//! - [`atmosphere`]: the 1976 standard atmosphere (pure functions);
//! - [`solver`]: Glauert's solution of Prandtl's lifting-line equation (pure, no I/O);
//! - [`verify`]: the published verification cases, shared by `gammaline verify` and the tests;
//! - [`design`]: twist design, washout, spar loads, roll authority and trade studies (pure);
//! - [`report`]: text, JSON and CSV renderings of a solution (strings only);
//! - [`cli`]: the headless command line; [`tui`]: the terminal workbench.

pub mod atmosphere;
pub mod cli;
pub mod design;
pub mod fsio;
pub mod report;
pub mod report_design;
pub mod session;
pub mod solver;
pub mod text;
pub mod tui;
pub mod verify;
pub mod wing;
