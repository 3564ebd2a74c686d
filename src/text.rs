//! Making file-derived text inert before it reaches a terminal (workbench and command line).
//!
//! ratatui writes cell contents verbatim, so an escape sequence hidden in a wing name could
//! move the cursor, retitle the window or rewrite the clipboard. Everything that comes from a
//! file (names, airfoil keys, paths, error messages quoting them) goes through [`inert`].

/// Replaces control characters (C0, DEL, C1) and bidirectional overrides with `?`, and tabs
/// and newlines with a space, so the result is inert on any terminal.
#[must_use]
pub fn inert(text: &str) -> String {
    text.chars()
        .map(|c| match c {
            '\t' | '\n' | '\r' => ' ',
            c if c.is_control() || is_bidi_control(c) => '?',
            c => c,
        })
        .collect()
}

/// Like [`inert`], and also keeps only printable ASCII (for the ASCII mode and for
/// comparisons in tests).
#[must_use]
pub fn inert_ascii(text: &str) -> String {
    inert(text)
        .chars()
        .map(|c| if c.is_ascii() { c } else { '?' })
        .collect()
}

/// Characters that reorder the text around them and can disguise what is on screen.
const fn is_bidi_control(c: char) -> bool {
    matches!(c, '\u{202A}'..='\u{202E}' | '\u{2066}'..='\u{2069}' | '\u{200E}' | '\u{200F}')
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn escapes_become_inert() {
        let hostile = "wing\u{1b}]52;c;aGk=\u{7}\u{1b}[2J\u{9b}31m";
        let out = inert(hostile);
        assert!(!out.chars().any(char::is_control), "{out:?}");
        assert!(out.starts_with("wing?]52;c;aGk=??[2J?31m"));
    }

    #[test]
    fn plain_text_is_unchanged() {
        assert_eq!(
            inert("Tapered wing, 5° washout"),
            "Tapered wing, 5° washout"
        );
        assert_eq!(inert_ascii("5° washout"), "5? washout");
    }
}
