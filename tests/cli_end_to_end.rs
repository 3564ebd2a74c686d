//! The real binary, end to end: every example wing in every format, the JSON contract,
//! exit codes and one-line errors.

mod cli_support;

use std::path::PathBuf;

use serde_json::Value;

use cli_support::{example_wings, gammaline, stderr, stdout};

fn json_of(file: &str, extra: &[&str]) -> Value {
    let mut args = vec!["solve", file, "--format", "json"];
    args.extend_from_slice(extra);
    let o = gammaline(&args);
    assert!(o.status.success(), "{file}: {}", stderr(&o));
    serde_json::from_str(&stdout(&o)).expect("one JSON object")
}

/// The keys the core issue spells out: a contract users' scripts rely on.
const CONTRACT_KEYS: [&str; 19] = [
    "wing",
    "method",
    "alpha_deg",
    "CL",
    "CDi",
    "CDp",
    "CD",
    "e",
    "CL_alpha_per_rad",
    "aspect_ratio",
    "area_m2",
    "span_m",
    "Cl_roll",
    "Cn",
    "Cm",
    "root_bending_moment_Nm",
    "first_stall_y_m",
    "CL_first_stall",
    "spanwise",
];

#[test]
fn there_are_at_least_four_example_wings() {
    assert!(example_wings().len() >= 4, "{:?}", example_wings());
}

#[test]
fn every_example_solves_in_every_format() {
    for wing in example_wings() {
        let file = wing.to_str().expect("utf-8 path");
        for format in ["line", "table", "json", "csv"] {
            let o = gammaline(&["solve", file, "--format", format]);
            assert!(o.status.success(), "{file} {format}: {}", stderr(&o));
            assert!(!stdout(&o).trim().is_empty(), "{file} {format}: no output");
        }
    }
}

#[test]
fn json_has_the_contract_keys_with_numbers() {
    for wing in example_wings() {
        let v = json_of(wing.to_str().expect("utf-8"), &[]);
        for key in CONTRACT_KEYS {
            assert!(v.get(key).is_some(), "{}: missing {key}", wing.display());
        }
        for key in [
            "CL",
            "CDi",
            "CD",
            "CL_alpha_per_rad",
            "aspect_ratio",
            "span_m",
            "Cm",
        ] {
            assert!(
                v[key].as_f64().is_some_and(f64::is_finite),
                "{key} = {}",
                v[key]
            );
        }
        let spanwise = v["spanwise"].as_array().expect("array");
        assert!(spanwise.len() >= 20);
        for key in ["y_m", "chord_m", "cl", "alpha_i_deg", "gamma_m2_s"] {
            assert!(spanwise[0].get(key).is_some(), "spanwise lacks {key}");
        }
        let ys: Vec<f64> = spanwise
            .iter()
            .map(|p| p["y_m"].as_f64().expect("y"))
            .collect();
        assert!(ys.windows(2).all(|w| w[0] < w[1]), "spanwise y ascends");
    }
}

#[test]
fn json_agrees_with_the_library() {
    let wing = &example_wings()[0];
    let v = json_of(wing.to_str().expect("utf-8"), &["--alpha", "3.5"]);
    let w = gammaline::wing::file::read(wing).expect("example reads");
    let mut c = w.condition;
    c.alpha_deg = 3.5;
    c.target_cl = None;
    let s = gammaline::solver::solve(&w, &c, gammaline::solver::Method::default()).expect("solves");
    assert_eq!(v["CL"].as_f64(), Some(s.coefficients.cl));
    assert_eq!(v["CDi"].as_f64(), Some(s.coefficients.cdi));
    assert_eq!(v["alpha_deg"].as_f64(), Some(3.5));
}

#[test]
fn target_cl_lands_on_the_cl() {
    let wing = example_wings()[0].to_str().expect("utf-8").to_string();
    let v = json_of(&wing, &["--cl", "0.62"]);
    let cl = v["CL"].as_f64().expect("CL");
    assert!((cl - 0.62).abs() < 1e-10, "CL {cl}");
}

#[test]
fn flags_override_the_file_condition() {
    let wing = example_wings()[0].to_str().expect("utf-8").to_string();
    let v = json_of(
        &wing,
        &["--speed", "30", "--altitude", "1000", "--terms", "40"],
    );
    assert_eq!(v["speed_m_s"].as_f64(), Some(30.0));
    assert_eq!(v["terms"].as_u64(), Some(40));
    // ISA density at 1000 m is 1.11164 kg/m^3 (U.S. Standard Atmosphere 1976, table 1).
    assert!((v["rho_kg_m3"].as_f64().expect("rho") - 1.11164).abs() < 1e-4);
}

#[test]
fn line_format_is_one_line_with_name_method_and_fingerprint() {
    let wing = example_wings()[0].to_str().expect("utf-8").to_string();
    let o = gammaline(&["solve", &wing, "--format", "line"]);
    let text = stdout(&o);
    assert_eq!(text.lines().count(), 1, "{text}");
    let v = json_of(&wing, &[]);
    assert!(text.starts_with(v["wing"].as_str().expect("name")));
    assert!(text.contains(&format!("N={}", v["terms"])));
    assert!(text.contains(&format!(
        "wing {}",
        v["fingerprint"].as_str().expect("hash")
    )));
    assert!(text.contains("CL ") && text.contains("CDi ") && text.contains(" e "));
}

fn line_of(file: &str, extra: &[&str]) -> String {
    let mut args = vec!["solve", file, "--format", "line"];
    args.extend_from_slice(extra);
    let o = gammaline(&args);
    assert!(o.status.success(), "{file}: {}", stderr(&o));
    stdout(&o)
}

#[test]
fn a_target_cl_solve_says_so_in_the_line_and_the_json() {
    // The sailplane's [condition] gives cl = 0.60 instead of alpha.
    let file = "wings/sailplane.toml";
    let v = json_of(file, &[]);
    assert_eq!(v["target_CL"].as_f64(), Some(0.6));
    let alpha = v["alpha_deg"].as_f64().expect("alpha");
    let line = line_of(file, &[]);
    let expected = format!("| target CL 0.6000 -> alpha {alpha:.2} deg, V ");
    assert!(line.contains(&expected), "{expected} not in {line}");
    // The same wing at a given alpha: no target, and JSON says null.
    let line = line_of(file, &["--alpha", "3"]);
    assert!(line.contains("| alpha 3.00 deg, V "), "{line}");
    assert!(!line.contains("target"), "{line}");
    assert!(json_of(file, &["--alpha", "3"])["target_CL"].is_null());
    // A target from the command line on a wing whose file gives alpha.
    let line = line_of("wings/survey-drone.toml", &["--cl", "0.5"]);
    assert!(line.contains("| target CL 0.5000 -> alpha "), "{line}");
    let table = stdout(&gammaline(&["solve", file]));
    assert!(
        table.contains("condition   target CL 0.6000 -> alpha "),
        "{table}"
    );
}

#[test]
fn csv_has_a_header_and_one_row_per_output_point() {
    let wing = example_wings()[0].to_str().expect("utf-8").to_string();
    let o = gammaline(&["solve", &wing, "--format", "csv"]);
    let text = stdout(&o);
    let mut lines = text.lines();
    assert_eq!(
        lines.next(),
        Some("y_m,chord_m,cl,span_load,alpha_i_deg,gamma_m2_s,cl_max,cl_over_cl_max")
    );
    let v = json_of(&wing, &[]);
    assert_eq!(
        lines.count(),
        v["spanwise"].as_array().expect("array").len()
    );
}

#[test]
fn sweep_csv_rows_match_the_range_and_single_solves() {
    let wing = example_wings()[0].to_str().expect("utf-8").to_string();
    let o = gammaline(&[
        "sweep", &wing, "--from", "-2", "--to", "6", "--step", "2", "--format", "csv",
    ]);
    assert!(o.status.success(), "{}", stderr(&o));
    let text = stdout(&o);
    let rows: Vec<&str> = text.lines().skip(1).collect();
    assert_eq!(rows.len(), 5);
    let cl_at_4: f64 = rows[3]
        .split(',')
        .nth(1)
        .expect("CL")
        .parse()
        .expect("number");
    let v = json_of(&wing, &["--alpha", "4"]);
    assert!((cl_at_4 - v["CL"].as_f64().expect("CL")).abs() < 1e-12);
}

#[test]
fn check_accepts_every_example() {
    let files: Vec<String> = example_wings()
        .iter()
        .map(|p| p.display().to_string())
        .collect();
    let mut args = vec!["check"];
    args.extend(files.iter().map(String::as_str));
    let o = gammaline(&args);
    assert!(o.status.success(), "{}", stderr(&o));
    assert_eq!(
        stdout(&o).lines().filter(|l| l.starts_with("ok ")).count(),
        files.len()
    );
}

#[test]
fn a_broken_file_gives_one_line_and_exit_code_2() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = dir.path().join("broken.toml");
    std::fs::write(&path, "name = \"x\"\n[[station]]\ny = 0.0\nchord = -0.2\nairfoil = \"a\"\n[[station]]\ny = 1.0\nchord = 0.1\nairfoil = \"a\"\n[airfoil.a]\nlift_slope = 6.0\nalpha_zero_lift = 0.0\ncl_max = 1.2\ncd0 = 0.01\n")
        .expect("write");
    for command in ["check", "solve"] {
        let o = gammaline(&[command, path.to_str().expect("utf-8")]);
        assert_eq!(o.status.code(), Some(2));
        assert!(stdout(&o).is_empty(), "no partial result");
        let err = stderr(&o);
        assert_eq!(err.lines().count(), 1, "{err}");
        assert!(
            err.starts_with(&format!("error: {}:4:9: station 1: chord:", path.display())),
            "{err}"
        );
    }
}

#[test]
fn a_missing_file_gives_one_plain_line_and_exit_code_2() {
    for command in ["solve", "check", "sweep"] {
        let o = gammaline(&[command, "nothere.toml"]);
        assert_eq!(o.status.code(), Some(2), "{command}");
        assert!(stdout(&o).is_empty(), "{command}: no partial result");
        let err = stderr(&o);
        assert_eq!(err.lines().count(), 1, "{command}: {err}");
        assert!(
            err.starts_with("error: nothere.toml: cannot read: "),
            "{command}: {err}"
        );
        assert!(
            !err.contains(":1:1:") && !err.contains(": -:"),
            "{command}: {err}"
        );
    }
}

#[test]
fn bad_flags_exit_2_without_output() {
    let wing = example_wings()[0].to_str().expect("utf-8").to_string();
    for args in [
        vec!["solve", &wing, "--alpha", "2", "--cl", "0.3"],
        vec!["solve", &wing, "--speed", "-4"],
        vec!["solve", &wing, "--terms", "1"],
        vec!["solve", &wing, "--altitude", "90000"],
        vec!["solve", &wing, "--format", "xml"],
        vec!["solve", "no/such/file.toml"],
    ] {
        let o = gammaline(&args);
        assert_eq!(o.status.code(), Some(2), "{args:?}");
        assert!(stdout(&o).is_empty(), "{args:?}");
        assert!(stderr(&o).contains("error"), "{args:?}: {}", stderr(&o));
    }
}

/// Numbers printed as a minus sign before nothing but zeros (`-0.00000`, `-0`, `-0.0e0`).
fn negative_zeros(text: &str) -> Vec<String> {
    text.split(|c: char| c.is_whitespace() || matches!(c, ',' | ':' | '[' | ']' | '(' | ')'))
        .filter_map(|token| token.strip_prefix('-'))
        .filter(|rest| {
            let mantissa = rest.split(['e', 'E']).next().unwrap_or(rest);
            mantissa.starts_with('0') && mantissa.bytes().all(|b| b == b'0' || b == b'.')
        })
        .map(|rest| format!("-{rest}"))
        .collect()
}

#[test]
fn a_symmetric_wing_prints_zero_roll_and_yaw_without_a_minus() {
    // A mirrored wing with no deflected aileron rolls and yaws by symmetry not at all; the
    // solver's roundoff must not show as `-0.00000`.
    let o = gammaline(&["solve", "wings/survey-drone.toml", "--format", "line"]);
    assert!(o.status.success(), "{}", stderr(&o));
    let line = stdout(&o);
    let field = |name: &str| {
        let at = line.find(&format!(" {name} ")).expect(name) + name.len() + 2;
        line[at..]
            .split_whitespace()
            .next()
            .expect("a value")
            .to_string()
    };
    assert_eq!(field("Cl_roll"), "0.00000", "{line}");
    assert_eq!(field("Cn"), "0.00000", "{line}");
}

#[test]
fn no_format_prints_a_negative_zero() {
    for wing in example_wings() {
        let file = wing.to_str().expect("utf-8 path");
        for format in ["line", "table", "json", "csv"] {
            let o = gammaline(&["solve", file, "--format", format]);
            assert!(o.status.success(), "{file} {format}: {}", stderr(&o));
            let found = negative_zeros(&stdout(&o));
            assert!(found.is_empty(), "{file} {format}: {found:?}");
        }
        for format in ["table", "json", "csv"] {
            let o = gammaline(&[
                "sweep", file, "--from", "-2", "--to", "2", "--format", format,
            ]);
            assert!(o.status.success(), "{file} sweep {format}: {}", stderr(&o));
            let found = negative_zeros(&stdout(&o));
            assert!(found.is_empty(), "{file} sweep {format}: {found:?}");
        }
    }
}

#[test]
fn help_is_there_for_every_command() {
    for command in ["solve", "check", "sweep", "open"] {
        let o = gammaline(&[command, "--help"]);
        assert!(o.status.success());
        assert!(stdout(&o).contains("Usage: gammaline"), "{command}");
    }
}

#[test]
fn sweep_takes_negative_flag_values_and_explains_a_negative_step() {
    let o = gammaline(&[
        "sweep",
        "wings/trainer.toml",
        "--from",
        "-4",
        "--to",
        "-2",
        "--step",
        "1",
        "--format",
        "csv",
    ]);
    assert!(o.status.success(), "{}", stderr(&o));
    assert_eq!(stdout(&o).lines().count(), 4, "{}", stdout(&o));
    let o = gammaline(&["sweep", "wings/trainer.toml", "--step", "-1"]);
    assert_eq!(o.status.code(), Some(2));
    let err = stderr(&o);
    assert!(
        err.contains("--step must be > 0 (got -1)") && err.contains("--to"),
        "{err}"
    );
    assert_eq!(err.lines().count(), 1, "{err}");
}

#[test]
fn sweep_states_its_point_limit_in_the_help_and_the_refusal() {
    let help = stdout(&gammaline(&["sweep", "--help"]));
    assert!(help.contains("at most 100000 points"), "{help}");
    let o = gammaline(&["sweep", "wings/trainer.toml", "--step", "0.00001"]);
    assert_eq!(o.status.code(), Some(2));
    assert!(stderr(&o).contains("at most 100000"), "{}", stderr(&o));
}

#[test]
fn a_file_over_the_size_limit_is_refused_with_the_limit() {
    let dir = std::env::temp_dir().join(format!("gammaline-big-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("temp folder");
    let big = dir.join("big.toml");
    let f = std::fs::File::create(&big).expect("create");
    f.set_len(64 << 20).expect("a sparse 64 MiB file");
    for command in ["check", "solve"] {
        let o = gammaline(&[command, big.to_str().expect("utf-8")]);
        assert_eq!(o.status.code(), Some(2));
        let err = stderr(&o);
        assert!(err.contains("larger than the 16 MiB limit"), "{err}");
        assert_eq!(err.lines().count(), 1, "{err}");
    }
    let _ = std::fs::remove_dir_all(dir);
}

/// The trainer with its `[condition]` asking for a target CL instead of an alpha.
fn trainer_with_target_cl(tag: &str, cl: &str, lift_slope: &str) -> PathBuf {
    let text = std::fs::read_to_string("wings/trainer.toml").expect("the example");
    let text = text
        .replace("alpha = 3.0", &format!("cl = {cl}"))
        .replace("lift_slope = 6.0", &format!("lift_slope = {lift_slope}"));
    let dir = std::env::temp_dir().join(format!("gammaline-cl-{}-{tag}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("temp folder");
    let path = dir.join("trainer.toml");
    std::fs::write(&path, text).expect("write");
    path
}

#[test]
fn a_target_cl_past_90_deg_is_refused_and_check_points_at_it() {
    let path = trainer_with_target_cl("beyond", "9.0", "6.0");
    let file = path.to_str().expect("utf-8");
    for command in ["check", "solve"] {
        let o = gammaline(&[command, file]);
        assert_eq!(o.status.code(), Some(2), "{command}: {}", stdout(&o));
        let err = stderr(&o);
        let located = format!("{file}:59:6: condition: cl: ");
        assert!(
            err.starts_with(&format!("error: {located}")),
            "{command}: {err}"
        );
        assert!(err.contains("beyond -90 to 90 deg"), "{command}: {err}");
        assert_eq!(err.lines().count(), 1, "{err}");
    }
    let o = gammaline(&["solve", "wings/trainer.toml", "--cl", "-9"]);
    assert_eq!(o.status.code(), Some(2));
    assert!(stderr(&o).contains("--cl"), "{}", stderr(&o));
    let o = gammaline(&["solve", "wings/trainer.toml", "--cl", "-1e308"]);
    assert_eq!(o.status.code(), Some(2));
    assert!(!stderr(&o).contains("inf"), "{}", stderr(&o));
    let _ = std::fs::remove_dir_all(path.parent().expect("folder"));
}

#[test]
fn a_tiny_lift_slope_is_refused_at_its_key_not_called_zero() {
    // Sections with a tiny lift slope give a tiny but nonzero wing lift slope; it is not
    // "zero" (the test is relative): the slope itself is out of range, and said so there.
    let path = trainer_with_target_cl("slope", "0.5", "1e-20");
    let o = gammaline(&["solve", path.to_str().expect("utf-8")]);
    assert_eq!(o.status.code(), Some(2));
    let err = stderr(&o);
    assert!(!err.contains("is zero"), "{err}");
    assert!(
        err.contains(":32:14: airfoil main: lift_slope: must be at least"),
        "{err}"
    );
    let _ = std::fs::remove_dir_all(path.parent().expect("folder"));
}

/// The JSON keys whose doc (docs/wing-file.md, "Numbers in the output") says when they are
/// null; every other number is always a number.
const MAY_BE_NULL: [&str; 12] = [
    "target_CL",
    "L_over_D",
    "e",
    "delta",
    "center_of_lift_y_m",
    "first_stall_y_m",
    "CL_first_stall",
    "alpha_first_stall_deg",
    "residual",
    "Clp",
    "Cl_delta_per_rad",
    "pb_2V",
];

fn nulls(v: &Value, key: &str, out: &mut Vec<String>) {
    match v {
        Value::Null => out.push(key.to_string()),
        Value::Array(items) => items.iter().for_each(|x| nulls(x, key, out)),
        Value::Object(map) => map.iter().for_each(|(k, x)| nulls(x, k, out)),
        _ => {}
    }
}

#[test]
fn zero_lift_prints_no_nan_and_only_documented_nulls() {
    let doc = std::fs::read_to_string("docs/wing-file.md").expect("the doc");
    for key in MAY_BE_NULL {
        assert!(doc.contains(&format!("`{key}`")), "{key} is not documented");
    }
    for wing in example_wings() {
        let file = wing.to_str().expect("utf-8 path");
        for extra in [&[][..], &["--cl", "0"], &["--alpha", "-89"]] {
            for format in ["line", "table", "csv"] {
                let mut args = vec!["solve", file, "--format", format];
                args.extend_from_slice(extra);
                let o = gammaline(&args);
                assert!(o.status.success(), "{args:?}: {}", stderr(&o));
                let out = stdout(&o).to_lowercase();
                assert!(
                    !out.contains("nan") && !out.contains("inf"),
                    "{args:?}: {out}"
                );
            }
            let v = json_of(file, extra);
            let mut found = Vec::new();
            nulls(&v, "", &mut found);
            found.retain(|k| !MAY_BE_NULL.contains(&k.as_str()));
            assert!(found.is_empty(), "{file} {extra:?}: null {found:?}");
        }
    }
}

#[test]
fn ailerons_at_the_deflection_limit_still_solve() {
    let text = std::fs::read_to_string("wings/trainer.toml").expect("the example");
    let text = text.replace("deflection = 5.0", "deflection = 90.0");
    let dir = std::env::temp_dir().join(format!("gammaline-limit-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("temp folder");
    let path = dir.join("trainer.toml");
    std::fs::write(&path, text).expect("write");
    for format in ["json", "table", "line", "csv"] {
        let o = gammaline(&["solve", path.to_str().expect("utf-8"), "--format", format]);
        assert!(o.status.success(), "{format}: {}", stderr(&o));
    }
    let _ = std::fs::remove_dir_all(dir);
}

#[test]
fn big_wings_keep_the_table_columns_whole() {
    // Spans and speeds at the top of their ranges give circulations of five digits and more.
    let text = "[[station]]\ny = 0.0\nchord = 150.0\nairfoil = \"a\"\n\
                [[station]]\ny = 900.0\nchord = 100.0\nairfoil = \"a\"\n\
                [airfoil.a]\nlift_slope = 6.0\nalpha_zero_lift = -2.0\ncl_max = 1.5\ncd0 = 0.01\n\
                [condition]\nalpha = 5.0\nspeed = 300.0\n";
    let dir = std::env::temp_dir().join(format!("gammaline-big-wing-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("temp folder");
    let path = dir.join("big.toml");
    std::fs::write(&path, text).expect("write");
    let o = gammaline(&["solve", path.to_str().expect("utf-8")]);
    assert!(o.status.success(), "{}", stderr(&o));
    let out = stdout(&o);
    let table: Vec<&str> = out.lines().skip_while(|l| !l.contains("c*cl/cm")).collect();
    assert!(table.len() > 2, "{out}");
    for row in &table {
        assert_eq!(row.len(), table[0].len(), "{row}\n{out}");
    }
    let _ = std::fs::remove_dir_all(dir);
}

#[test]
fn sweep_angles_are_the_decimals_the_steps_name() {
    let o = gammaline(&[
        "sweep",
        "wings/trainer.toml",
        "--from",
        "-4",
        "--to",
        "1",
        "--step",
        "0.1",
        "--format",
        "csv",
    ]);
    assert!(o.status.success(), "{}", stderr(&o));
    let out = stdout(&o);
    let alphas: Vec<&str> = out
        .lines()
        .skip(1)
        .filter_map(|l| l.split(',').next())
        .collect();
    assert_eq!(alphas.len(), 51, "{out}");
    for a in alphas {
        assert!(a.len() <= 4, "alpha printed as {a}");
    }
}
