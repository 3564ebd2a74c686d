//! The published verification cases (src/verify/cases.rs, the table `gammaline verify`
//! prints): each case names its source and tolerance beside its expected value there.

use gammaline::verify::{self, render, Case, Tolerance};

/// Every case of the table passes: the same evidence a user sees from `gammaline verify`.
#[test]
fn every_published_case_passes() {
    let outcomes = verify::run_all();
    assert!(outcomes.len() >= 50, "only {} cases", outcomes.len());
    let failed: Vec<String> = outcomes
        .iter()
        .filter(|o| !o.pass)
        .map(|o| format!("{} ({}): {:?}", o.case, o.source, o.reading))
        .collect();
    assert!(failed.is_empty(), "failed cases:\n{}", failed.join("\n"));
}

/// Every topic the verification report promises has at least one case, each with a source.
#[test]
fn every_topic_is_covered_and_sourced() {
    let cases = verify::cases();
    for topic in [
        "elliptic",
        "rectangular AR 6",
        "taper of least delta",
        "bell loading",
        "Helmbold",
        "flap effectiveness",
        "ISA",
        "series:",
    ] {
        assert!(
            cases.iter().any(|c| c.name.starts_with(topic)),
            "no case for {topic}"
        );
    }
    for c in &cases {
        assert!(c.source.len() > 10, "{}: source {:?}", c.name, c.source);
    }
    let mut names: Vec<&str> = cases.iter().map(|c| c.name.as_str()).collect();
    names.sort_unstable();
    names.dedup();
    assert_eq!(names.len(), cases.len(), "case names repeat");
}

/// A value outside its tolerance, and a computation that fails, both count as failures and
/// print as FAIL with the case's source.
#[test]
fn a_wrong_value_or_an_error_fails() {
    let off = Case::fixed(
        "off",
        "a source, eq. 1",
        1.0,
        Tolerance::Relative(0.01),
        || Ok(1.02),
    );
    let broken = Case::fixed(
        "broken",
        "a source, eq. 2",
        1.0,
        Tolerance::Absolute(1.0),
        || Err("no lift".into()),
    );
    let near = Case::fixed(
        "near",
        "a source, eq. 3",
        1.0,
        Tolerance::Absolute(0.05),
        || Ok(1.02),
    );
    let outcomes = [off.run(), broken.run(), near.run()];
    assert_eq!(outcomes.each_ref().map(|o| o.pass), [false, false, true]);
    assert!(!verify::all_pass(&outcomes));
    let table = render::table(&outcomes);
    assert!(table
        .lines()
        .any(|l| l.starts_with("off") && l.ends_with("FAIL")));
    assert!(table.contains("error: no lift"));
    assert!(table.contains("a source, eq. 1"));
    assert!(table.ends_with("1 of 3 cases pass\n"), "{table}");
}

/// JSON and CSV carry every case with its source, expected and computed values.
#[test]
fn json_and_csv_carry_every_case() {
    let outcomes = verify::run_all();
    let doc: serde_json::Value = serde_json::from_str(&render::json(&outcomes)).expect("json");
    let cases = doc["cases"].as_array().expect("cases");
    assert_eq!(cases.len(), outcomes.len());
    assert_eq!(doc["total"], outcomes.len());
    for (c, o) in cases.iter().zip(&outcomes) {
        assert_eq!(c["case"], o.case.as_str());
        assert_eq!(c["source"], o.source);
        assert!(c["computed"].is_f64(), "{}", o.case);
        assert_eq!(c["pass"], o.pass);
    }
    let csv = render::csv(&outcomes);
    let mut lines = csv.lines();
    assert_eq!(
        lines.next(),
        Some("case,source,expected,computed,tolerance,pass")
    );
    assert_eq!(lines.count(), outcomes.len());
}

const BEGIN: &str = "<!-- generated: begin -->";
const END: &str = "<!-- generated: end -->";

/// docs/verification.md lists the cases generated from the same table; this test fails when
/// they drift. Regenerate with `GAMMALINE_UPDATE_DOCS=1 cargo test --test core_verification`.
#[test]
fn verification_doc_matches_the_cases() {
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("docs/verification.md");
    let doc = std::fs::read_to_string(&path).expect("docs/verification.md");
    let (head, rest) = doc.split_once(BEGIN).expect("begin marker");
    let (_, tail) = rest.split_once(END).expect("end marker");
    let table = render::markdown(&verify::run_all());
    let want = format!("{head}{BEGIN}\n{table}{END}{tail}");
    if std::env::var_os("GAMMALINE_UPDATE_DOCS").is_some() {
        std::fs::write(&path, &want).expect("write docs");
        return;
    }
    assert!(
        doc == want,
        "docs/verification.md is stale: run GAMMALINE_UPDATE_DOCS=1 cargo test --test core_verification"
    );
}
