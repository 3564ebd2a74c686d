//! The wing file format: every broken fixture gives its exact one-line error (through the
//! library and through `gammaline check`), every example wing loads and solves, and writing a
//! wing then reading it back gives the same wing.

mod common;

use std::collections::BTreeMap;
use std::path::{Path, PathBuf};
use std::process::Command;

use gammaline::solver::{self, Method};
use gammaline::wing::{file, Airfoil, Condition, Control, ControlKind, Station, Wing};
use proptest::prelude::*;

const BAD: &str = "tests/fixtures/bad";

/// Example wings that show a warning on purpose (each says so in a comment).
const MEANT_TO_WARN: &[&str] = &["ridge-courier.toml"];

fn manifest() -> &'static Path {
    Path::new(env!("CARGO_MANIFEST_DIR"))
}

/// The `.toml` files of a folder under the package, as paths relative to the package.
fn toml_files(folder: &str) -> Vec<PathBuf> {
    let mut files: Vec<PathBuf> = std::fs::read_dir(manifest().join(folder))
        .expect("folder exists")
        .filter_map(|e| e.ok())
        .map(|e| Path::new(folder).join(e.file_name()))
        .filter(|p| p.extension().is_some_and(|x| x == "toml"))
        .collect();
    files.sort();
    files
}

/// The error line a fixture must give, from its first line `# expect: ...`.
fn expected_error(text: &str, path: &Path) -> String {
    let first = text.lines().next().unwrap_or_default();
    first
        .strip_prefix("# expect: ")
        .unwrap_or_else(|| panic!("{}: first line must be `# expect: ...`", path.display()))
        .to_string()
}

#[test]
fn there_is_a_fixture_for_each_kind_of_error() {
    assert!(toml_files(BAD).len() >= 20, "{:?}", toml_files(BAD));
}

#[test]
fn every_bad_fixture_gives_its_exact_error() {
    let mut wrong = Vec::new();
    for path in toml_files(BAD) {
        let text = std::fs::read_to_string(manifest().join(&path)).expect("readable");
        let expected = expected_error(&text, &path);
        match file::parse(&text, &path) {
            Ok(_) => wrong.push(format!(
                "{}: accepted, expected `{expected}`",
                path.display()
            )),
            Err(e) if e.to_string() != expected => {
                wrong.push(format!(
                    "{}:\n  got      {e}\n  expected {expected}",
                    path.display()
                ));
            }
            Err(_) => {}
        }
    }
    assert!(wrong.is_empty(), "\n{}", wrong.join("\n"));
}

#[test]
fn every_error_line_is_one_line_with_a_location() {
    for path in toml_files(BAD) {
        let text = std::fs::read_to_string(manifest().join(&path)).expect("readable");
        let e = file::parse(&text, &path).expect_err("a bad fixture");
        assert!(!e.to_string().contains('\n'), "{e}");
        assert!(e.line >= 1 && e.column >= 1, "{e}");
        // A broken CSV table is located in the CSV file itself.
        let named = std::fs::read_to_string(manifest().join(&e.path)).expect("the named file");
        assert!(
            e.line <= named.lines().count(),
            "{e}: past the end of the file"
        );
    }
}

#[test]
fn check_prints_each_fixtures_error_and_exits_2() {
    for path in toml_files(BAD) {
        let text = std::fs::read_to_string(manifest().join(&path)).expect("readable");
        let expected = format!("error: {}\n", expected_error(&text, &path));
        let out = Command::new(env!("CARGO_BIN_EXE_gammaline"))
            .arg("check")
            .arg(&path)
            .current_dir(manifest())
            .output()
            .expect("the binary runs");
        assert_eq!(out.status.code(), Some(2), "{}", path.display());
        assert_eq!(String::from_utf8_lossy(&out.stderr), expected);
        assert!(
            out.stdout.is_empty(),
            "{}: no partial result",
            path.display()
        );
    }
}

#[test]
fn a_missing_file_is_reported_at_its_path() {
    let e = file::read(Path::new("tests/fixtures/no-such-wing.toml")).expect_err("missing");
    assert!(matches!(e, file::ReadError::Unreadable { .. }), "{e:?}");
    let line = e.to_string();
    // The path first, no made-up line:column or field for a file that was never read.
    assert!(
        line.starts_with("tests/fixtures/no-such-wing.toml: cannot read: "),
        "{line}"
    );
    assert_eq!(line.lines().count(), 1, "{line}");
}

#[test]
fn every_example_wing_loads_and_solves_without_unmeant_warnings() {
    let examples = toml_files("wings");
    assert!(examples.len() >= 4, "{examples:?}");
    for path in examples {
        let wing = file::read(&manifest().join(&path))
            .unwrap_or_else(|e| panic!("{}: {e}", path.display()));
        let solution = solver::solve(&wing, &wing.condition, Method::default())
            .unwrap_or_else(|e| panic!("{}: {e}", path.display()));
        let name = path
            .file_name()
            .and_then(|n| n.to_str())
            .unwrap_or_default();
        if MEANT_TO_WARN.contains(&name) {
            assert!(!solution.warnings.is_empty(), "{name} is meant to warn");
        } else {
            assert!(
                solution.warnings.is_empty(),
                "{name}: {:?}",
                solution.warnings
            );
        }
        assert!(solution.coefficients.cl.is_finite(), "{name}");
    }
}

#[test]
fn the_example_wings_are_the_scenarios_they_claim() {
    // Aspect ratios of the scenarios (issue: sailplane above 20; solar strip "very high").
    let ar = |name: &str| {
        let wing = file::read(&manifest().join("wings").join(name)).expect("loads");
        gammaline::wing::Geometry::of(&wing).aspect_ratio
    };
    assert!(ar("sailplane.toml") > 20.0);
    assert!(ar("solar-strip.toml") > 30.0);
    let trainer = file::read(&manifest().join("wings/trainer.toml")).expect("loads");
    let kinds: Vec<ControlKind> = trainer.controls.iter().map(|c| c.kind).collect();
    assert!(kinds.contains(&ControlKind::Flap) && kinds.contains(&ControlKind::Aileron));
}

#[test]
fn every_example_wing_round_trips_through_to_toml() {
    for path in toml_files("wings") {
        let wing = file::read(&manifest().join(&path)).expect("loads");
        let text = file::to_toml(&wing);
        let again = file::parse(&text, &path).unwrap_or_else(|e| panic!("{e}\n{text}"));
        assert_eq!(again, wing, "{}", path.display());
    }
}

#[test]
fn whole_numbers_are_accepted_where_numbers_are_expected() {
    let text = "[[station]]\ny = 0\nchord = 1\nairfoil = \"a\"\n[[station]]\ny = 4\nchord = 1\n\
                airfoil = \"a\"\n[airfoil.a]\nlift_slope = 6\nalpha_zero_lift = 0\ncl_max = 1\ncd0 = 0\n";
    let wing = file::parse(text, Path::new("ints.toml")).expect("valid");
    assert_eq!(wing.stations[1].y, 4.0);
    assert_eq!(wing.name, "ints", "the name defaults to the file stem");
}

#[test]
fn the_first_problem_in_reading_order_is_reported() {
    // Airfoil table first (bad cl_max), then a station with a bad chord below it.
    let text = "[airfoil.a]\nlift_slope = 6.0\nalpha_zero_lift = 0.0\ncl_max = 0.0\ncd0 = 0.0\n\
                [[station]]\ny = 0.0\nchord = -1.0\nairfoil = \"a\"\n\
                [[station]]\ny = 1.0\nchord = 1.0\nairfoil = \"a\"\n";
    let e = file::parse(text, Path::new("order.toml")).expect_err("bad");
    assert_eq!(
        e.to_string(),
        "order.toml:4:10: airfoil a: cl_max: must be > 0 (got 0)"
    );
}

#[test]
fn a_non_finite_value_written_out_reads_back_as_a_located_error() {
    let mut wing = common::tapered(8.0, 0.5);
    wing.stations[1].twist_deg = f64::NAN;
    let text = file::to_toml(&wing);
    let e = file::parse(&text, Path::new("edited.toml")).expect_err("nan");
    assert_eq!((e.place.as_str(), e.field.as_str()), ("station 2", "twist"));
}

fn airfoil() -> impl Strategy<Value = Airfoil> {
    (
        3.0..7.0f64,
        -5.0..1.0f64,
        0.5..2.0f64,
        // cd0 >= 2 * 0.0025 keeps the polar >= 0 up to cl_max = 2, as validation requires.
        0.005..0.02f64,
        -0.0025..0.0025f64,
        0.0..0.02f64,
    )
        .prop_map(
            |(lift_slope, alpha_zero_lift_deg, cl_max, cd0, cd1, cd2)| Airfoil {
                lift_slope,
                alpha_zero_lift_deg,
                cl_max,
                cd0,
                cd1,
                cd2,
                ..Airfoil::default()
            },
        )
}

/// A valid wing: 2-6 stations with increasing y, positive chords, up to two controls.
fn valid_wing() -> impl Strategy<Value = Wing> {
    let stations = prop::collection::vec(
        (0.05..2.0f64, 0.01..1.0f64, -5.0..5.0f64, any::<bool>()),
        2..6,
    );
    let airfoils = prop::collection::vec(airfoil(), 1..3);
    let controls = prop::collection::vec(
        (
            0.0..0.45f64,
            0.05..0.5f64,
            0.05..0.95f64,
            -20.0..20.0f64,
            any::<bool>(),
            prop::option::of(0.1..1.0f64),
        ),
        0..3,
    );
    let condition = (
        -5.0..10.0f64,
        prop::option::of(-0.5..1.5f64),
        1.0..80.0f64,
        -500.0..20_000.0f64,
    );
    (
        any::<bool>(),
        "[ -~]{0,20}",
        stations,
        airfoils,
        controls,
        condition,
    )
        .prop_map(
            |(
                symmetric,
                name,
                raw_stations,
                raw_airfoils,
                raw_controls,
                (alpha, cl, speed, altitude),
            )| {
                let airfoils: BTreeMap<String, Airfoil> = raw_airfoils
                    .into_iter()
                    .enumerate()
                    .map(|(i, a)| {
                        (
                            if i == 0 {
                                "root".to_string()
                            } else {
                                format!("tip {i}")
                            },
                            a,
                        )
                    })
                    .collect();
                let keys: Vec<String> = airfoils.keys().cloned().collect();
                let mut y = if symmetric { 0.0 } else { -1.0 };
                let stations: Vec<Station> = raw_stations
                    .iter()
                    .enumerate()
                    .map(|(i, &(step, chord, twist_deg, offset))| {
                        if i > 0 {
                            y += step;
                        }
                        Station {
                            y,
                            chord,
                            twist_deg,
                            airfoil: keys[i % keys.len()].clone(),
                            x_le: if offset { 0.1 * step } else { 0.0 },
                            z: if offset { 0.01 * chord } else { 0.0 },
                        }
                    })
                    .collect();
                let (left, right) = (stations[0].y, y);
                let reach = if symmetric { right } else { right.min(-left) };
                let controls = raw_controls
                    .into_iter()
                    .enumerate()
                    .filter(|_| reach > 0.0)
                    .map(
                        |(
                            i,
                            (inner, width, chord_fraction, deflection_deg, flap, effectiveness),
                        )| {
                            let y_inner = inner * reach;
                            Control {
                                name: format!("surface \"{i}\""),
                                kind: if flap {
                                    ControlKind::Flap
                                } else {
                                    ControlKind::Aileron
                                },
                                y_inner,
                                y_outer: (y_inner + width * reach).min(reach),
                                chord_fraction,
                                deflection_deg,
                                effectiveness,
                            }
                        },
                    )
                    .collect();
                // A file gives alpha or a target CL; with a target the angle is not written.
                let condition = Condition {
                    alpha_deg: if cl.is_some() { 0.0 } else { alpha },
                    target_cl: cl,
                    speed,
                    altitude,
                    roll_rate: 0.0,
                };
                Wing {
                    name,
                    symmetric,
                    stations,
                    airfoils,
                    controls,
                    condition,
                    reference: Default::default(),
                }
            },
        )
}

proptest! {
    #[test]
    fn to_toml_then_parse_gives_the_same_wing(wing in valid_wing()) {
        let text = file::to_toml(&wing);
        let again = file::parse(&text, Path::new("random.toml"));
        prop_assert_eq!(again, Ok(wing), "{}", text);
    }
}

/// Characters that break TOML structure in interesting ways, plus a multi-byte one.
const NOISE: &[char] = &[
    '[', ']', '=', '"', '\'', '\n', '.', '#', ',', '{', '}', '-', '1', 'e', 'x', 'é',
];

proptest! {
    /// Damaged example files never panic, and any error is one line inside the file.
    #[test]
    fn damaged_files_give_a_located_error_or_a_wing(
        which in 0usize..4,
        at in 0.0..1.0f64,
        cut in 0usize..12,
        insert in prop::collection::vec(prop::sample::select(NOISE), 0..4),
    ) {
        let files = toml_files("wings");
        let path = &files[which % files.len()];
        let text = std::fs::read_to_string(manifest().join(path)).expect("readable");
        let mut chars: Vec<char> = text.chars().collect();
        let start = ((chars.len() as f64) * at) as usize;
        let end = (start + cut).min(chars.len());
        chars.splice(start..end, insert);
        let damaged: String = chars.into_iter().collect();
        if let Err(e) = file::parse(&damaged, path) {
            let line = e.to_string();
            prop_assert!(!line.contains('\n'), "{}", line);
            prop_assert!(e.line <= damaged.lines().count().max(1), "{} in\n{}", line, damaged);
        }
    }
}

#[test]
fn names_with_line_breaks_are_escaped_so_the_error_stays_one_line() {
    let text = "[[station]]\ny = 0.0\nchord = 1.0\nairfoil = \"ro\\not\"\n\
                [[station]]\ny = 1.0\nchord = 1.0\nairfoil = \"ro\\not\"\n";
    let e = file::parse(text, Path::new("escape.toml")).expect_err("no such airfoil");
    assert_eq!(
        e.to_string(),
        "escape.toml:4:11: station 1: airfoil: unknown airfoil `ro\\not` (no [airfoil.*] tables are defined)"
    );
}

#[test]
fn the_error_lines_quoted_in_the_docs_are_the_fixtures_own() {
    let docs = std::fs::read_to_string(manifest().join("docs/wing-file.md")).expect("docs");
    let quoted: Vec<&str> = docs.lines().filter(|l| l.starts_with(BAD)).collect();
    assert!(!quoted.is_empty());
    for line in quoted {
        let path = line.split(':').next().expect("a path");
        let text = std::fs::read_to_string(manifest().join(path)).expect(path);
        assert_eq!(line, expected_error(&text, Path::new(path)));
    }
}

/// The survey drone's file: comments on their own lines and after values.
fn commented() -> (String, Wing) {
    let text = std::fs::read_to_string(manifest().join("wings/survey-drone.toml")).expect("reads");
    let wing = file::parse(&text, Path::new("survey-drone.toml")).expect("parses");
    (text, wing)
}

#[test]
fn editing_an_unchanged_wing_gives_back_the_same_text() {
    for path in toml_files("wings") {
        let text = std::fs::read_to_string(manifest().join(&path)).expect("reads");
        let wing = file::parse(&text, &path).expect("parses");
        assert_eq!(file::edit_toml(&text, &wing), text, "{}", path.display());
    }
}

#[test]
fn saving_into_the_file_keeps_comments_and_changes_only_the_values() {
    let (text, mut wing) = commented();
    wing.stations[0].chord = 0.32;
    let middle = Station {
        y: 0.8,
        chord: 0.225,
        twist_deg: -1.0,
        airfoil: "root".into(),
        x_le: 0.01875,
        z: 0.0,
    };
    wing.stations.insert(1, middle);
    let edited = file::edit_toml(&text, &wing);
    let again = file::parse(&edited, Path::new("edited.toml")).expect("reads back");
    assert_eq!(again, wing);
    let comments = |t: &str| -> Vec<String> {
        t.lines()
            .filter_map(|l| l.find('#').map(|at| l[at..].to_string()))
            .collect()
    };
    assert_eq!(comments(&edited), comments(&text), "{edited}");
    // The edited chord keeps its comment, at its column.
    assert!(
        edited.contains("chord = 0.32              # m\n"),
        "{edited}"
    );
    // Lines not touched by the change are as they were, in order; the new station is there.
    let kept: Vec<&str> = text
        .lines()
        .filter(|l| !l.starts_with("chord = 0.30"))
        .collect();
    let mut rest = edited.lines();
    for line in &kept {
        assert!(
            rest.any(|l| l == *line),
            "{line:?} missing or out of order in\n{edited}"
        );
    }
    assert!(edited.contains("y = 0.8\n"), "{edited}");
}

#[test]
fn saving_into_the_file_follows_removed_rows_renames_and_a_target_cl() {
    let (text, mut wing) = commented();
    wing.controls.clear();
    let tip = wing.airfoils.remove("tip").expect("tip airfoil");
    wing.airfoils.insert(
        "outer".into(),
        Airfoil {
            cl_max: 1.25,
            ..tip
        },
    );
    wing.stations[1].airfoil = "outer".into();
    wing.condition.target_cl = Some(0.5);
    wing.name = "Survey drone, edited".into();
    let edited = file::edit_toml(&text, &wing);
    let again = file::parse(&edited, Path::new("edited.toml")).expect("reads back");
    // A file with a target CL has no alpha: it reads back as the default.
    wing.condition.alpha_deg = Condition::default().alpha_deg;
    assert_eq!(again, wing);
    assert!(!edited.contains("[[control]]"), "{edited}");
    assert!(
        edited.contains("[airfoil.outer]           # properties blend linearly"),
        "the renamed table keeps its comment:\n{edited}"
    );
    // In place, and without the comment about alpha, which says nothing true about a CL.
    assert!(
        edited.contains("\ncl = 0.5\n") && !edited.contains("# deg, angle of attack"),
        "alpha became cl in place, its comment dropped:\n{edited}"
    );
    assert!(
        edited.starts_with("# A small electric survey drone"),
        "{edited}"
    );
    // And back: controls and alpha again, appended where the format allows.
    let (_, original) = commented();
    let back = file::edit_toml(&edited, &original);
    assert_eq!(
        file::parse(&back, Path::new("back.toml")).expect("reads"),
        original
    );
}

#[test]
fn text_that_is_not_a_wing_is_replaced_by_the_written_wing() {
    let (_, wing) = commented();
    assert_eq!(file::edit_toml("not = [toml", &wing), file::to_toml(&wing));
}

#[test]
fn error_lines_quote_at_most_80_characters_of_the_file() {
    let long = "q".repeat(100_000);
    let many_airfoils: String = (0..2000)
        .map(|i| format!("[airfoil.{}{i}]\nlift_slope = 6.0\nalpha_zero_lift = 0.0\ncl_max = 1.0\ncd0 = 0.01\n", "k".repeat(200)))
        .collect();
    let wing = |station_extra: &str, airfoil: &str, tail: &str| {
        format!(
            "[[station]]\ny = 0.0\nchord = 0.3\nairfoil = \"{airfoil}\"\n{station_extra}\n\
             [[station]]\ny = 1.0\nchord = 0.2\nairfoil = \"{airfoil}\"\n{tail}"
        )
    };
    let texts = [
        wing(
            &format!("{long} = 1"),
            "a",
            "[airfoil.a]\nlift_slope = 6.0\nalpha_zero_lift = 0.0\ncl_max = 1.0\ncd0 = 0.01\n",
        ),
        wing("", &long, &many_airfoils),
        wing("twist = \"", "a", "").replace("twist = \"", &format!("twist = \"{long}\"")),
        format!("[[control]]\nkind = \"{long}\"\n"),
        format!("[airfoil.\"{long}\"]\nlift_slope = -1.0\n"),
        format!("name = \"{long}\"\nbad"),
    ];
    for text in &texts {
        let e = file::parse(text, Path::new("long.toml")).expect_err("broken");
        let line = e.to_string();
        assert!(
            line.chars().count() <= 300,
            "{} chars: {}",
            line.len(),
            &line[..400.min(line.len())]
        );
        assert!(!line.contains(&"q".repeat(81)), "{line}");
    }
}
