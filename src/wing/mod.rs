//! The wing model (stations, airfoils, controls, default condition) and its TOML file format.
//!
//! Nothing here solves anything: the solver reads a [`Wing`] through [`Wing::section_at`].

mod blend;
pub mod file;
mod fingerprint;
pub mod geometry;
mod model;
pub mod sections;
pub mod table;
pub mod validate;

pub use blend::{Curve, LinearCurve, TableBlend};
pub use fingerprint::fingerprint;
pub use geometry::Geometry;
pub use model::{Airfoil, Condition, Control, ControlKind, Section, Station, Wing};
pub use sections::Sections;
