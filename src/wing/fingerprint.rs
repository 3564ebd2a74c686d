//! A short, stable fingerprint of everything in a wing that changes its answer.

use sha2::{Digest, Sha256};

use super::Wing;

/// Eight hex digits of SHA-256 over the wing's stations, airfoils, controls and symmetry, at
/// full precision. The name and the flight condition are left out: two files that differ only
/// there describe the same wing.
#[must_use]
pub fn fingerprint(wing: &Wing) -> String {
    let canonical = format!(
        "{:?}|{:?}|{:?}|{:?}",
        wing.symmetric, wing.stations, wing.airfoils, wing.controls
    );
    let digest = Sha256::digest(canonical.as_bytes());
    digest.iter().take(4).map(|b| format!("{b:02x}")).collect()
}
