//! Text, JSON and CSV renderings of verification outcomes (strings only).

use serde_json::{json, Value};

use super::Outcome;

/// Column titles, in order, for the table and the CSV header.
pub const COLUMNS: [&str; 6] = [
    "case",
    "source",
    "expected",
    "computed",
    "tolerance",
    "pass",
];

/// A number for people: six significant digits, exponent form outside 1e-3..1e6.
#[must_use]
pub fn value(x: f64) -> String {
    if x == 0.0 {
        return "0".into();
    }
    let magnitude = x.abs();
    if !(1e-3..1e6).contains(&magnitude) {
        return format!("{x:.5e}");
    }
    let digits = usize::try_from(5 - magnitude.log10().floor() as i32).unwrap_or(0);
    let text = format!("{x:.digits$}");
    // 1.500000 -> 1.5; 2.000000 -> 2
    match text.contains('.') {
        true => text.trim_end_matches('0').trim_end_matches('.').to_string(),
        false => text,
    }
}

fn cells(outcome: &Outcome) -> [String; 6] {
    let (expected, computed) = match &outcome.reading {
        Ok(r) => (value(r.expected), value(r.computed)),
        Err(e) => (String::new(), format!("error: {e}")),
    };
    [
        outcome.case.clone(),
        outcome.source.to_string(),
        expected,
        computed,
        outcome.tolerance.to_string(),
        pass_word(outcome.pass).to_string(),
    ]
}

const fn pass_word(pass: bool) -> &'static str {
    if pass {
        "pass"
    } else {
        "FAIL"
    }
}

/// An aligned table with a header, one line a case, and a closing count.
#[must_use]
pub fn table(outcomes: &[Outcome]) -> String {
    let rows: Vec<[String; 6]> = outcomes.iter().map(cells).collect();
    let mut widths = COLUMNS.map(str::len);
    for row in &rows {
        for (w, cell) in widths.iter_mut().zip(row) {
            *w = (*w).max(cell.chars().count());
        }
    }
    let line = |row: &[String; 6]| {
        let mut out = String::new();
        for (i, (cell, w)) in row.iter().zip(widths).enumerate() {
            // numbers right-aligned, words left-aligned
            let numeric = (2..=4).contains(&i);
            match (numeric, i + 1 == row.len()) {
                (true, _) => out += &format!("{cell:>w$}  "),
                (false, true) => out += cell,
                (false, false) => out += &format!("{cell:<w$}  "),
            }
        }
        out.trim_end().to_string() + "\n"
    };
    let mut out = line(&COLUMNS.map(String::from));
    for row in &rows {
        out += &line(row);
    }
    out += &summary(outcomes);
    out
}

/// "N of M cases pass" (and which failed), one line.
#[must_use]
pub fn summary(outcomes: &[Outcome]) -> String {
    let passed = outcomes.iter().filter(|o| o.pass).count();
    format!("{passed} of {} cases pass\n", outcomes.len())
}

fn json_value(outcome: &Outcome) -> Value {
    let (expected, computed, error) = match &outcome.reading {
        Ok(r) => (json!(r.expected), json!(r.computed), Value::Null),
        Err(e) => (Value::Null, Value::Null, json!(e)),
    };
    let (kind, tol) = match outcome.tolerance {
        super::Tolerance::Absolute(t) => ("absolute", t),
        super::Tolerance::Relative(t) => ("relative", t),
    };
    json!({
        "case": outcome.case,
        "source": outcome.source,
        "expected": expected,
        "computed": computed,
        "tolerance": tol,
        "tolerance_kind": kind,
        "pass": outcome.pass,
        "error": error,
    })
}

/// One JSON object: `{"cases": [...], "passed": n, "total": m}`.
#[must_use]
pub fn json(outcomes: &[Outcome]) -> String {
    let passed = outcomes.iter().filter(|o| o.pass).count();
    let doc = json!({
        "cases": outcomes.iter().map(json_value).collect::<Vec<_>>(),
        "passed": passed,
        "total": outcomes.len(),
    });
    format!("{doc}\n")
}

/// CSV with a header row; numbers at full precision, text quoted where it needs it.
#[must_use]
pub fn csv(outcomes: &[Outcome]) -> String {
    let mut out = COLUMNS.join(",") + "\n";
    for o in outcomes {
        let (expected, computed) = match &o.reading {
            Ok(r) => (r.expected.to_string(), r.computed.to_string()),
            Err(e) => (String::new(), quoted(&format!("error: {e}"))),
        };
        let row = [
            quoted(&o.case),
            quoted(o.source),
            expected,
            computed,
            quoted(&o.tolerance.to_string()),
            pass_word(o.pass).to_lowercase(),
        ];
        out += &row.join(",");
        out.push('\n');
    }
    out
}

/// A CSV field: quoted (quotes doubled) when it holds a comma, quote or newline.
fn quoted(field: &str) -> String {
    if field.contains([',', '"', '\n']) {
        format!("\"{}\"", field.replace('"', "\"\""))
    } else {
        field.to_string()
    }
}

/// A Markdown table of the cases without the computed values (those depend on the build;
/// `gammaline verify` prints them): case, source, expected, tolerance.
#[must_use]
pub fn markdown(outcomes: &[Outcome]) -> String {
    let mut out = String::from("| case | source | expected | tolerance |\n|---|---|---|---|\n");
    for o in outcomes {
        let expected = o
            .reading
            .as_ref()
            .map_or(String::new(), |r| value(r.expected));
        out += &format!(
            "| {} | {} | {expected} | {} |\n",
            o.case.replace('|', "\\|"),
            o.source,
            o.tolerance
        );
    }
    out
}
