//! The real binary with both methods: `--method`, `--panels`, `--stall` and sweep flags.

mod cli_support;

use serde_json::Value;

use cli_support::{example_wings, gammaline};

fn json(args: &[&str]) -> Value {
    let o = gammaline(args);
    assert!(
        o.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&o.stderr)
    );
    serde_json::from_slice(&o.stdout).expect("one JSON object")
}

#[test]
fn every_example_wing_solves_with_both_methods() {
    for path in example_wings() {
        let file = path.to_str().expect("utf-8 path");
        let series = json(&["solve", file, "--format", "json"]);
        assert_eq!(series["converged"], true);
        assert!(series["terms"].as_u64().is_some() && series["fourier"].is_array());
        let vortex = json(&["solve", file, "--format", "json", "--method", "vortex"]);
        assert_eq!(vortex["converged"], true, "{file}");
        assert!(vortex["panels"].as_u64().is_some_and(|n| n >= 60), "{file}");
        assert!(
            vortex["iterations"].as_u64().is_some_and(|n| n >= 1),
            "{file}"
        );
        assert!(
            vortex["residual"].as_f64().is_some_and(|r| r < 1e-9),
            "{file}"
        );
        assert!(vortex["method"]
            .as_str()
            .is_some_and(|m| m.contains("vortices")));
        let (a, b) = (
            series["CL"].as_f64().unwrap(),
            vortex["CL"].as_f64().unwrap(),
        );
        // Sweep, dihedral and taper of the quarter-chord line separate the two methods by a
        // few percent on these wings; a large gap would be a bug.
        assert!((a - b).abs() < 0.1 * a.abs().max(0.1), "{file}: {a} vs {b}");
        for format in ["line", "table", "csv"] {
            let o = gammaline(&["solve", file, "--method", "vortex", "--format", format]);
            assert!(o.status.success(), "{file} {format}");
        }
    }
}

#[test]
fn stall_flag_reports_cl_max_and_how_it_was_found() {
    let file = "wings/trainer.toml";
    for method in ["series", "vortex"] {
        let v = json(&[
            "solve", file, "--format", "json", "--stall", "--method", method,
        ]);
        let cl_max = v["CL_max"].as_f64().expect("CL_max");
        assert!(cl_max > 0.0, "{method}: {cl_max}");
        assert!(v["alpha_CL_max_deg"].as_f64().is_some());
        assert!(v["stall_found_by"].as_str().is_some_and(|s| !s.is_empty()));
    }
    let plain = json(&["solve", file, "--format", "json"]);
    assert!(plain.get("CL_max").is_none(), "only on request");
    let o = gammaline(&["solve", file, "--stall", "--method", "vortex"]);
    assert!(String::from_utf8_lossy(&o.stdout).contains("CL_max"));
}

#[test]
fn vortex_sweep_runs_through_the_stall_and_flags_stalled_rows() {
    let v = json(&[
        "sweep",
        "wings/trainer.toml",
        "--method",
        "vortex",
        "--from",
        "0",
        "--to",
        "24",
        "--step",
        "2",
        "--format",
        "json",
    ]);
    let rows = v["points"].as_array().expect("points");
    assert_eq!(rows.len(), 13);
    assert_eq!(rows[0]["stalled"], false);
    assert_eq!(
        rows[12]["stalled"], true,
        "24 deg is past every section's cl_max"
    );
    assert!(rows[12]["stalled_points"].as_u64().is_some_and(|n| n > 0));
    assert!(v["method"].as_str().is_some_and(|m| m.contains("vortices")));
    let table = gammaline(&[
        "sweep",
        "wings/trainer.toml",
        "--method",
        "vortex",
        "--from",
        "20",
        "--to",
        "22",
    ]);
    assert!(String::from_utf8_lossy(&table.stdout).contains("past cl_max"));
}

#[test]
fn a_resolution_flag_of_the_other_method_is_refused_in_one_line() {
    let series_with_panels: &[&str] = &["solve", "wings/trainer.toml", "--panels", "40"];
    let vortex_with_terms: &[&str] = &[
        "solve",
        "wings/trainer.toml",
        "--method",
        "vortex",
        "--terms",
        "40",
    ];
    for args in [series_with_panels, vortex_with_terms] {
        let o = gammaline(args);
        assert_eq!(o.status.code(), Some(2), "{args:?}");
        let err = String::from_utf8_lossy(&o.stderr);
        assert_eq!(err.lines().count(), 1, "{err}");
        assert!(err.contains("applies to --method"), "{err}");
    }
    let o = gammaline(&[
        "solve",
        "wings/trainer.toml",
        "--method",
        "vortex",
        "--panels",
        "2",
    ]);
    assert_eq!(o.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&o.stderr).contains("panels: must be between"));
}

/// A section driven outside its airfoil table rests on no data: the vortex method says where.
#[test]
fn a_section_beyond_its_airfoil_table_is_named_in_a_warning() {
    let run = |alpha: &str| {
        let o = gammaline(&[
            "solve",
            "wings/ridge-courier.toml",
            "--method",
            "vortex",
            "--alpha",
            alpha,
        ]);
        assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
        String::from_utf8_lossy(&o.stderr).into_owned()
    };
    let inside = run("4");
    assert!(!inside.contains("beyond its airfoil table"), "{inside}");
    let below = run("-14");
    assert!(
        below.contains("beyond its airfoil table (-8.0 to 18.0 deg)"),
        "{below}"
    );
}
