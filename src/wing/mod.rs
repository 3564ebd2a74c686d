//! The wing model (stations, airfoils, controls, default condition) and its TOML file format.
//!
//! Nothing here solves anything. The solver reads a [`Wing`] through [`Sections`], the
//! stations' sections with their airfoils resolved once for its many look-ups;
//! [`Wing::section_at`] is the same interpolation for a single look-up.

mod blend;
pub mod file;
mod fingerprint;
pub mod geometry;
mod model;
mod reference;
pub mod sections;
pub mod table;
pub mod validate;

pub use blend::{Curve, LinearCurve, TableBlend};
pub use fingerprint::fingerprint;
pub use geometry::Geometry;
pub use model::{Airfoil, Condition, Control, ControlKind, Section, Station, Wing};
pub use reference::{Reference, ReferenceValues};
pub use sections::Sections;

pub(crate) use model::bracket;
