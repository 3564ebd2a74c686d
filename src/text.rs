//! Making text from files safe to print.

/// Replaces control characters (C0, DEL and C1, which include ESC and the escape-sequence
/// introducers) with `?`, so a crafted wing name cannot drive the terminal.
#[must_use]
pub fn inert(s: &str) -> String {
    s.chars()
        .map(|c| if c.is_control() { '?' } else { c })
        .collect()
}
