//! Prandtl-Glauert correction of the section lift slope for the free-stream Mach number.
//!
//! cl_alpha(M) = cl_alpha(0) / beta, beta = sqrt(1 - M^2) (Glauert, Proc. R. Soc. A 118, 1928;
//! Anderson, *Fundamentals of Aerodynamics*, eq. 11.52), applied above [`ON_MACH`] only so
//! low-speed answers stay exactly incompressible.

use std::borrow::Cow;

use crate::wing::{Condition, Wing};

use super::solution::FreeStream;

/// The correction is applied above this Mach number.
pub const ON_MACH: f64 = 0.3;
/// Above this Mach number the correction is flagged as unreliable.
pub const WARN_MACH: f64 = 0.6;
/// At and above this Mach number subsonic theory does not apply at all.
pub const MAX_MACH: f64 = 1.0;

/// The factor the section lift slopes are divided by at `condition`: sqrt(1 - M^2) above
/// [`ON_MACH`], else 1.
#[must_use]
pub fn beta(condition: &Condition) -> f64 {
    let mach = FreeStream::of(condition).mach;
    if mach > ON_MACH && mach < MAX_MACH {
        (1.0 - mach * mach).sqrt()
    } else {
        1.0
    }
}

/// The wing with every airfoil's lift slope and cl_max divided by [`beta`] of its own
/// condition, the whole section lift curve scaled (borrowed unchanged when no correction
/// applies).
#[must_use]
pub fn corrected(wing: &Wing) -> Cow<'_, Wing> {
    let b = beta(&wing.condition);
    if b == 1.0 {
        return Cow::Borrowed(wing);
    }
    let mut out = wing.clone();
    for airfoil in out.airfoils.values_mut() {
        airfoil.lift_slope /= b;
        airfoil.cl_max /= b;
    }
    Cow::Owned(out)
}
