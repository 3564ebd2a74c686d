//! A short, stable fingerprint of everything in a wing that changes its answer.

use sha2::{Digest, Sha256};

use std::collections::BTreeMap;
use std::fmt;

use super::{Airfoil, Wing};

/// An airfoil as the fingerprint has always spelt it, with `cm0` and the table only when
/// they are given, so wings that use neither keep their fingerprints.
struct Canonical<'a>(&'a Airfoil);

impl fmt::Debug for Canonical<'_> {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let a = self.0;
        let mut s = f.debug_struct("Airfoil");
        s.field("lift_slope", &a.lift_slope)
            .field("alpha_zero_lift_deg", &a.alpha_zero_lift_deg)
            .field("cl_max", &a.cl_max)
            .field("cd0", &a.cd0)
            .field("cd1", &a.cd1)
            .field("cd2", &a.cd2);
        if a.cm0 != 0.0 {
            s.field("cm0", &a.cm0);
        }
        if let Some(table) = &a.table {
            s.field("table", table.columns());
        }
        s.finish()
    }
}

/// Eight hex digits of SHA-256 over the wing's stations, airfoils, controls, symmetry and
/// `[reference]` (when given), at
/// full precision. The name and the flight condition are left out: two files that differ only
/// there describe the same wing.
#[must_use]
pub fn fingerprint(wing: &Wing) -> String {
    let airfoils: BTreeMap<&String, Canonical> = wing
        .airfoils
        .iter()
        .map(|(k, a)| (k, Canonical(a)))
        .collect();
    let mut canonical = format!(
        "{:?}|{:?}|{:?}|{:?}",
        wing.symmetric, wing.stations, airfoils, wing.controls
    );
    // Only when given, so a wing without `[reference]` keeps the fingerprint it always had.
    if !wing.reference.is_empty() {
        canonical.push_str(&format!("|{:?}", wing.reference));
    }
    let digest = Sha256::digest(canonical.as_bytes());
    digest.iter().take(4).map(|b| format!("{b:02x}")).collect()
}
