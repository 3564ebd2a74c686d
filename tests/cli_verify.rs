//! `gammaline verify`, the real binary: every case printed with its source, machine-readable
//! formats, exit status 0 when all pass.

use std::process::Command;

fn verify(args: &[&str]) -> (i32, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_gammaline"))
        .arg("verify")
        .args(args)
        .output()
        .expect("runs");
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8(out.stdout).expect("utf-8"),
    )
}

#[test]
fn table_lists_every_case_with_its_source_and_passes() {
    let (code, text) = verify(&[]);
    assert_eq!(code, 0, "{text}");
    let mut lines = text.lines();
    let header = lines.next().expect("header");
    for column in [
        "case",
        "source",
        "expected",
        "computed",
        "tolerance",
        "pass",
    ] {
        assert!(header.contains(column), "{header}");
    }
    for case in gammaline::verify::cases() {
        let line = text
            .lines()
            .find(|l| l.starts_with(case.name.as_str()))
            .unwrap_or_else(|| panic!("{} missing", case.name));
        assert!(line.contains(case.source), "{line}");
        assert!(line.ends_with("pass"), "{line}");
    }
    let total = gammaline::verify::cases().len();
    assert!(text.ends_with(&format!("{total} of {total} cases pass\n")));
}

#[test]
fn json_and_csv() {
    let (code, json) = verify(&["--format", "json"]);
    assert_eq!(code, 0);
    let doc: serde_json::Value = serde_json::from_str(&json).expect("one JSON object");
    assert_eq!(doc["passed"], doc["total"]);
    let (code, csv) = verify(&["--format", "csv"]);
    assert_eq!(code, 0);
    assert!(csv.starts_with("case,source,expected,computed,tolerance,pass\n"));
    assert_eq!(csv.lines().count(), gammaline::verify::cases().len() + 1);
}
