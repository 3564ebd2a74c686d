//! Making file-derived text inert before it reaches a terminal (workbench and command line).
//!
//! ratatui writes cell contents verbatim, so an escape sequence hidden in a wing name could
//! move the cursor, retitle the window or rewrite the clipboard. Everything that comes from a
//! file (names, airfoil keys, paths, error messages quoting them) goes through [`inert`].
//!
//! Numbers shown to people go through [`fixed`] (or [`signed`]), so a value that rounds to
//! zero never prints as `-0.000`; full-precision output (CSV, JSON) goes through
//! [`unsigned_zero`].

use std::fmt::Write as _;

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

/// [`inert`] line by line: line breaks stay, so a multi-line report keeps its shape.
#[must_use]
pub fn inert_lines(text: &str) -> String {
    text.split('\n').map(inert).collect::<Vec<_>>().join("\n")
}

/// Serialized JSON with every control character (C0, DEL, C1) and bidirectional override
/// written as a `\uXXXX` escape. serde_json escapes only C0 and line breaks inside strings, so
/// a raw line break separates documents and stays; any other such character is inside a
/// string, where the escape reads back unchanged.
#[must_use]
pub fn json_escaped(json: &str) -> String {
    let mut out = String::with_capacity(json.len());
    for c in json.chars() {
        if (c.is_control() && c != '\n') || is_bidi_control(c) {
            let mut units = [0u16; 2];
            for unit in c.encode_utf16(&mut units) {
                let _ = write!(out, "\\u{unit:04x}");
            }
        } else {
            out.push(c);
        }
    }
    out
}

/// How much of the file's own text an error line quotes, in characters.
pub const QUOTE_CHARS: usize = 80;

/// At most `max` characters of `text`, ending in `...` when cut, so a message quoting a
/// file stays readable whatever the file holds.
#[must_use]
pub fn clip(text: &str, max: usize) -> String {
    match text.char_indices().nth(max) {
        None => text.to_string(),
        Some((at, _)) => format!("{}...", &text[..at]),
    }
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

/// `v` with `decimals` places; a value that rounds to zero prints without a minus sign.
/// Pad it with `{:>9}` where a column needs it.
#[must_use]
pub fn fixed(v: f64, decimals: usize) -> String {
    drop_minus_of_zero(format!("{v:.decimals$}"))
}

/// `v` in at most `width` characters for a table cell: [`fixed`] with `decimals` places, or
/// fewer places when the number is long, or exponent form when even its whole part is too
/// long, so no digit is ever cut off (a cut number reads as another number).
#[must_use]
pub fn fit_number(v: f64, decimals: usize, width: usize) -> String {
    let fixed_forms = (0..=decimals).rev().map(|d| fixed(v, d));
    let exponent_forms = (0..=3usize)
        .rev()
        .map(|d| drop_minus_of_zero(format!("{v:.d$e}")));
    fixed_forms
        .chain(exponent_forms)
        .find(|t| t.chars().count() <= width)
        .unwrap_or_else(|| drop_minus_of_zero(format!("{v:.0e}")))
}

/// Like [`fixed`] with the sign always shown (`+0.00` for a value that rounds to zero), for
/// differences.
#[must_use]
pub fn signed(v: f64, decimals: usize) -> String {
    let text = fixed(v, decimals);
    if text.starts_with('-') {
        text
    } else {
        format!("+{text}")
    }
}

/// A number quoted in a message: the shortest form that reads back to the same value, in
/// exponent form when plain digits would be long (`1e300`, `2.5e-9`, not 300 digits).
#[must_use]
pub fn readable(v: f64) -> String {
    let magnitude = v.abs();
    if v == 0.0 {
        "0".to_string()
    } else if !v.is_finite() || (1e-4..1e9).contains(&magnitude) {
        format!("{v}")
    } else {
        format!("{v:e}")
    }
}

/// `v` rounded to `digits` significant digits, printed as by [`readable`] (`-0.121`, not
/// `-0.12100000000000001`).
#[must_use]
pub fn significant(v: f64, digits: usize) -> String {
    let rounded: f64 = format!("{v:.prec$e}", prec = digits.saturating_sub(1))
        .parse()
        .unwrap_or(v);
    readable(rounded)
}

/// `-0.0` made `0.0`, for output at full precision; every other value unchanged.
#[must_use]
pub fn unsigned_zero(v: f64) -> f64 {
    if v == 0.0 {
        0.0
    } else {
        v
    }
}

/// `-0.000` (or `-0.0e0`) becomes `0.000`: the minus of a number whose digits are all zero.
fn drop_minus_of_zero(text: String) -> String {
    match text.strip_prefix('-') {
        Some(rest) if is_zero_digits(rest) => rest.to_string(),
        _ => text,
    }
}

/// True when the mantissa of `text` has no digit but 0 (`0`, `0.000`, `0.0e0`, `0.0e-3`).
fn is_zero_digits(text: &str) -> bool {
    let mantissa = text.split(['e', 'E']).next().unwrap_or(text);
    mantissa.bytes().any(|b| b == b'0') && mantissa.bytes().all(|b| b == b'0' || b == b'.')
}

/// Characters that reorder the text around them and can disguise what is on screen.
const fn is_bidi_control(c: char) -> bool {
    matches!(
        c,
        '\u{202A}'..='\u{202E}' | '\u{2066}'..='\u{2069}' | '\u{200E}' | '\u{200F}' | '\u{061C}'
    )
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
    fn numbers_that_round_to_zero_have_no_minus() {
        assert_eq!(fixed(-5.8e-18, 5), "0.00000");
        assert_eq!(fixed(-0.0, 2), "0.00");
        assert_eq!(fixed(-0.004, 2), "0.00");
        assert_eq!(fixed(-0.005_001, 2), "-0.01");
        assert_eq!(fixed(-3.25, 1), "-3.2");
        assert_eq!(signed(-1e-9, 3), "+0.000");
        assert_eq!(signed(0.5, 1), "+0.5");
        assert_eq!(signed(-0.5, 1), "-0.5");
        assert_eq!(drop_minus_of_zero(format!("{:.1e}", -0.0)), "0.0e0");
        assert_eq!(fixed(f64::NAN, 2), "NaN");
        assert_eq!(fixed(f64::NEG_INFINITY, 2), "-inf");
        assert!(unsigned_zero(-0.0).is_sign_positive());
        assert_eq!(unsigned_zero(-2.5e-18), -2.5e-18);
    }

    #[test]
    fn json_escapes_c1_and_bidi_and_reads_back() {
        let value = serde_json::json!({ "name": "a\u{1b}]0;t\u{7}\u{9b}\u{85}\u{202e}\u{2066}b" });
        let text = json_escaped(&value.to_string());
        assert!(
            !text.chars().any(|c| c.is_control() || is_bidi_control(c)),
            "{text}"
        );
        assert!(
            text.contains("\\u009b") && text.contains("\\u202e"),
            "{text}"
        );
        let back: serde_json::Value = serde_json::from_str(&text).expect("still JSON");
        assert_eq!(back, value);
        assert_eq!(inert_lines("a\u{1b}\nb\u{9b}"), "a?\nb?");
        assert_eq!(clip("abcdef", 3), "abc...");
        assert_eq!(clip("ab°", 3), "ab°");
    }

    #[test]
    fn cell_numbers_fit_without_a_cut_digit() {
        assert_eq!(fit_number(-999.999, 3, 7), "-1000.0");
        assert_eq!(fit_number(0.5, 3, 7), "0.500");
        assert_eq!(fit_number(1.5e15, 3, 7), "1.50e15");
        assert_eq!(fit_number(-1.5e15, 3, 7), "-1.5e15");
        assert_eq!(fit_number(-1e-20, 3, 7), "0.000");
    }

    #[test]
    fn quoted_numbers_stay_short() {
        assert_eq!(readable(1e300), "1e300");
        assert_eq!(readable(-2.5e-9), "-2.5e-9");
        assert_eq!(readable(-0.0), "0");
        assert_eq!(readable(0.15), "0.15");
        assert_eq!(readable(-4.0), "-4");
        assert_eq!(readable(123_456_789.0), "123456789");
        assert_eq!(readable(f64::INFINITY), "inf");
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
