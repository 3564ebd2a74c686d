//! Renderings of the design results (twist design, washout, spar loads, trade studies):
//! tables, JSON and CSV. Strings only; printing is the caller's business.

use std::fmt::Write as _;
use std::path::Path;

use serde_json::{json, Value};

use crate::design::loads::{LoadCase, MassDistribution, SparLoads};
use crate::design::roll::RollAuthority;
use crate::design::study::{Row, Variant, Vary};
use crate::design::twist::TwistDesign;
use crate::design::washout::{Goal, Outcome, WashoutDesign};
use crate::report::{csv_row, opt, unsigned_zeros};
use crate::solver::Solution;
use crate::text::{fixed, inert, signed};
use crate::wing::{fingerprint, Wing};

/// Everything `design --loading` prints.
pub struct TwistReport<'a> {
    /// The design.
    pub design: &'a TwistDesign,
    /// The designed wing solved at the design CL, controls neutral.
    pub neutral: &'a Solution,
    /// The designed wing solved at the design CL with the file's control deflections.
    pub as_written: &'a Solution,
    /// Induced-drag factor of the untwisted planform (the off-design penalty's factor).
    pub untwisted_delta: f64,
    /// Where the designed wing was written.
    pub output: &'a Path,
}

fn deflected(r: &TwistReport) -> bool {
    r.design
        .wing
        .controls
        .iter()
        .any(|c| c.deflection_deg != 0.0)
}

/// The readable report of a twist design: the result, the closed-form optimum beside it and
/// the station table.
#[must_use]
pub fn twist_table(r: &TwistReport) -> String {
    let d = r.design;
    let c = &r.neutral.coefficients;
    let mut out = String::new();
    let _ = writeln!(
        out,
        "wing        {}  [{}] -> {}",
        inert(&d.wing.name),
        fingerprint(&d.wing),
        inert(&r.output.display().to_string())
    );
    let _ = writeln!(
        out,
        "design      {} loading at CL {}, controls neutral: alpha {} deg",
        d.loading.label(),
        fixed(d.cl, 4),
        fixed(d.alpha_deg, 3)
    );
    let _ = writeln!(
        out,
        "result      e {} (the loading's own {})  CDi {}  delta {}",
        opt(c.e, 5),
        fixed(d.loading.ideal_e(), 4),
        fixed(c.cdi, 6),
        opt(c.delta, 5)
    );
    if deflected(r) {
        let w = &r.as_written.coefficients;
        let _ = writeln!(
            out,
            "as written  with the file's control deflections: e {}  CDi {}  Cl_roll {}",
            opt(w.e, 5),
            fixed(w.cdi, 6),
            fixed(w.cl_roll, 5)
        );
    }
    let _ = writeln!(
        out,
        "optimum     closed-form washout {} deg (elliptic, root section); off design \
         CDi = (CL^2 + {} (CL - {})^2)/(pi AR)",
        fixed(d.optimum_washout_deg, 3),
        fixed(r.untwisted_delta, 5),
        fixed(d.cl, 3)
    );
    let _ = writeln!(
        out,
        "\n{:>9} {:>8} {:>9} {:>9} {:>9}",
        "y m", "chord m", "before", "twist", "optimum"
    );
    for row in &d.rows {
        let _ = writeln!(
            out,
            "{:>9} {:>8} {:>9} {:>9} {:>9}{}",
            fixed(row.y, 4),
            fixed(row.chord, 4),
            fixed(row.before_deg, 3),
            fixed(row.twist_deg, 3),
            if row.optimum_deg.is_finite() {
                fixed(row.optimum_deg, 3)
            } else {
                "n/a".into()
            },
            if row.added { "  added" } else { "" }
        );
    }
    out
}

/// The JSON object of `design --loading --format json`.
#[must_use]
pub fn twist_json(r: &TwistReport) -> Value {
    let d = r.design;
    let c = &r.neutral.coefficients;
    let w = &r.as_written.coefficients;
    let stations: Vec<Value> = d
        .rows
        .iter()
        .map(|row| {
            json!({
                "y_m": row.y,
                "chord_m": row.chord,
                "twist_before_deg": row.before_deg,
                "twist_deg": row.twist_deg,
                "optimum_twist_deg": row.optimum_deg.is_finite().then_some(row.optimum_deg),
                "added": row.added,
            })
        })
        .collect();
    let mut out = json!({
        "wing": d.wing.name,
        "fingerprint": fingerprint(&d.wing),
        "output": r.output.display().to_string(),
        "loading": d.loading.label(),
        "CL": d.cl,
        "alpha_deg": d.alpha_deg,
        "e": c.e,
        "CDi": c.cdi,
        "delta": c.delta,
        "e_loading": d.loading.ideal_e(),
        "e_as_written": w.e,
        "CDi_as_written": w.cdi,
        "optimum_washout_deg": d.optimum_washout_deg,
        "untwisted_delta": r.untwisted_delta,
        "stations": stations,
    });
    unsigned_zeros(&mut out);
    out
}

/// The station table of a twist design, with a header row.
#[must_use]
pub fn twist_csv(r: &TwistReport) -> String {
    let mut out = String::from("y_m,chord_m,twist_before_deg,twist_deg,optimum_twist_deg,added\n");
    for row in &r.design.rows {
        let values = [
            Some(row.y),
            Some(row.chord),
            Some(row.before_deg),
            Some(row.twist_deg),
            row.optimum_deg.is_finite().then_some(row.optimum_deg),
        ];
        let _ = writeln!(out, "{},{}", csv_row(&values), u8::from(row.added));
    }
    out
}

fn distribution_name(d: MassDistribution) -> &'static str {
    match d {
        MassDistribution::Uniform => "uniform",
        MassDistribution::Chord => "chord",
    }
}

/// The readable report of `loads`: the case, the root values and the spanwise table.
#[must_use]
pub fn loads_table(wing: &Wing, case: &LoadCase, l: &SparLoads) -> String {
    let s = &l.solution;
    let f = &s.flight;
    let mut out = String::new();
    let _ = writeln!(
        out,
        "wing        {}  [{}]",
        inert(&wing.name),
        fingerprint(wing)
    );
    let _ = writeln!(out, "method      {}", s.method.name);
    let _ = writeln!(
        out,
        "case        {} kg x load factor {} = {} N at V {} m/s, h {} m ISA (q {} Pa)",
        fixed(case.mass_kg, 1),
        fixed(case.load_factor, 2),
        fixed(f.lift, 1),
        fixed(f.speed, 1),
        fixed(f.altitude, 0),
        fixed(f.q, 1)
    );
    let stall = s.first_stall.map_or_else(
        || "n/a".to_string(),
        |st| {
            format!(
                "{} (first stall at y {} m)",
                fixed(st.cl_wing, 4),
                fixed(st.y, 3)
            )
        },
    );
    let _ = writeln!(
        out,
        "lift        CL {} at alpha {} deg; CL_max {}",
        fixed(s.coefficients.cl, 4),
        fixed(s.coefficients.alpha_deg, 3),
        stall
    );
    let _ = writeln!(
        out,
        "wing mass   {} kg, {} along the span: relieves the root by {} N m",
        fixed(case.wing_mass_kg, 1),
        distribution_name(case.distribution),
        fixed(l.relief_root_bending, 1)
    );
    let _ = writeln!(
        out,
        "root        right: shear {} N, bending {} N m; left: shear {} N, bending {} N m",
        fixed(l.root_shear, 1),
        fixed(l.root_bending, 1),
        fixed(l.left_root_shear, 1),
        fixed(l.left_root_bending, 1)
    );
    let _ = writeln!(
        out,
        "\n{:>9} {:>11} {:>13}",
        "y m", "shear N", "bending N m"
    );
    for row in &l.rows {
        let _ = writeln!(
            out,
            "{:>9} {:>11} {:>13}",
            fixed(row.y, 4),
            fixed(row.shear, 1),
            fixed(row.bending, 1)
        );
    }
    out
}

/// The JSON object of `loads --format json`; `root_shear_N`, `root_bending_moment_Nm`, `CL`
/// and the `spanwise` rows (`y_m`, `shear_N`, `bending_Nm`) are the contract.
#[must_use]
pub fn loads_json(wing: &Wing, case: &LoadCase, l: &SparLoads) -> Value {
    let s = &l.solution;
    let rows: Vec<Value> = l
        .rows
        .iter()
        .map(|r| json!({"y_m": r.y, "shear_N": r.shear, "bending_Nm": r.bending}))
        .collect();
    let mut out = json!({
        "wing": wing.name,
        "fingerprint": fingerprint(wing),
        "method": s.method.name,
        "mass_kg": case.mass_kg,
        "load_factor": case.load_factor,
        "wing_mass_kg": case.wing_mass_kg,
        "mass_distribution": distribution_name(case.distribution),
        "speed_m_s": s.flight.speed,
        "altitude_m": s.flight.altitude,
        "q_Pa": s.flight.q,
        "CL": s.coefficients.cl,
        "alpha_deg": s.coefficients.alpha_deg,
        "CL_first_stall": s.first_stall.map(|st| st.cl_wing),
        "lift_N": s.flight.lift,
        "root_shear_N": l.root_shear,
        "root_bending_moment_Nm": l.root_bending,
        "root_shear_left_N": l.left_root_shear,
        "root_bending_moment_left_Nm": l.left_root_bending,
        "relief_root_bending_moment_Nm": l.relief_root_bending,
        "spanwise": rows,
    });
    unsigned_zeros(&mut out);
    out
}

/// The spanwise shear and bending, with a header row.
#[must_use]
pub fn loads_csv(l: &SparLoads) -> String {
    let mut out = String::from("y_m,shear_N,bending_Nm\n");
    for r in &l.rows {
        let _ = writeln!(
            out,
            "{}",
            csv_row(&[Some(r.y), Some(r.shear), Some(r.bending)])
        );
    }
    out
}

/// The roll-authority part of `solve`'s notebook line (empty without an aileron).
#[must_use]
pub fn roll_line(roll: Option<&RollAuthority>) -> String {
    roll.map_or_else(String::new, |r| {
        format!(
            " | roll Clp {} Cl_delta {}/rad pb/2V {}",
            fixed(r.clp, 4),
            fixed(r.cl_delta_per_rad, 4),
            fixed(r.pb_2v, 4)
        )
    })
}

/// `solve`'s table with a `roll` line after the moments (unchanged without an aileron).
#[must_use]
pub fn with_roll_table(table: &str, roll: Option<&RollAuthority>) -> String {
    let Some(r) = roll else {
        return table.to_string();
    };
    let line = format!(
        "roll        Clp {} per pb/2V  Cl_delta {}/rad  steady pb/2V {} at the file's deflection\n",
        fixed(r.clp, 4),
        fixed(r.cl_delta_per_rad, 4),
        fixed(r.pb_2v, 4)
    );
    let mut out = String::with_capacity(table.len() + line.len());
    let mut placed = false;
    for l in table.split_inclusive('\n') {
        out.push_str(l);
        if !placed && l.starts_with("moments") {
            out.push_str(&line);
            placed = true;
        }
    }
    if !placed {
        out.push_str(&line);
    }
    out
}

/// Adds `Clp`, `Cl_delta_per_rad` and `pb_2V` to `solve`'s JSON object (null without an
/// aileron).
pub fn add_roll_json(json: &mut Value, roll: Option<&RollAuthority>) {
    if let Value::Object(map) = json {
        map.insert("Clp".into(), json!(roll.map(|r| r.clp)));
        map.insert(
            "Cl_delta_per_rad".into(),
            json!(roll.map(|r| r.cl_delta_per_rad)),
        );
        map.insert("pb_2V".into(), json!(roll.map(|r| r.pb_2v)));
    }
}

/// The numbers of a study row in column order, `None` where a value does not exist.
fn study_values(row: &Row) -> [Option<f64>; 10] {
    [
        Some(row.alpha_deg),
        Some(row.cl),
        Some(row.cdi),
        row.e,
        Some(row.cl_alpha),
        Some(row.cd),
        row.l_over_d,
        row.first_stall_y,
        Some(row.root_bending),
        Some(row.cl_roll),
    ]
}

/// The JSON keys of a study row, as `solve` names them.
const STUDY_KEYS: [&str; 10] = [
    "alpha_deg",
    "CL",
    "CDi",
    "e",
    "CL_alpha_per_rad",
    "CD",
    "L_over_D",
    "first_stall_y_m",
    "root_bending_moment_Nm",
    "Cl_roll",
];

/// The readable table of a study: one row per variant, a failed one with its reason.
#[must_use]
pub fn study_table(wing: &Wing, vary: &Vary, variants: &[Variant]) -> String {
    let mut out = format!(
        "wing {}  [{}]  varying {}\n",
        inert(&wing.name),
        fingerprint(wing),
        inert(&vary.name)
    );
    let _ = writeln!(
        out,
        "{:>10} {:>7} {:>7} {:>8} {:>6} {:>6} {:>8} {:>6} {:>7} {:>10} {:>8}",
        "value", "alpha", "CL", "CDi", "e", "CLa", "CD", "L/D", "stall y", "Mroot N m", "Cl_roll"
    );
    let decimals = [2, 4, 5, 4, 3, 5, 1, 3, 1, 5];
    for v in variants {
        let _ = write!(out, "{:>10}", fixed(v.value, 4));
        match &v.result {
            Ok(row) => {
                let widths = [7, 7, 8, 6, 6, 8, 6, 7, 10, 8];
                for ((value, d), w) in study_values(row).iter().zip(decimals).zip(widths) {
                    let _ = write!(out, " {:>w$}", opt(*value, d));
                }
                out.push('\n');
            }
            Err(e) => {
                let _ = writeln!(out, "  not solved: {}", inert(e));
            }
        }
    }
    out
}

/// The JSON object of a study: `{"variants": [...]}`, each variant's numbers under the keys
/// `solve` uses, a failed one with `error`.
#[must_use]
pub fn study_json(wing: &Wing, vary: &Vary, variants: &[Variant]) -> Value {
    let rows: Vec<Value> = variants
        .iter()
        .map(|v| {
            let mut row = serde_json::Map::new();
            row.insert("value".into(), json!(v.value));
            match &v.result {
                Ok(r) => {
                    for (key, value) in STUDY_KEYS.iter().zip(study_values(r)) {
                        row.insert((*key).into(), json!(value));
                    }
                }
                Err(e) => {
                    row.insert("error".into(), json!(e));
                }
            }
            Value::Object(row)
        })
        .collect();
    let mut out = json!({
        "wing": wing.name,
        "fingerprint": fingerprint(wing),
        "vary": vary.name,
        "variants": rows,
    });
    unsigned_zeros(&mut out);
    out
}

/// A study as CSV with a header row; a failed variant has empty fields and its reason last.
#[must_use]
pub fn study_csv(variants: &[Variant]) -> String {
    let mut out = format!("value,{},error\n", STUDY_KEYS.join(","));
    for v in variants {
        let (values, error) = match &v.result {
            Ok(r) => (study_values(r), String::new()),
            Err(e) => ([None; 10], format!("\"{}\"", e.replace('"', "'"))),
        };
        let _ = writeln!(
            out,
            "{},{},{error}",
            csv_row(&[Some(v.value)]),
            csv_row(&values)
        );
    }
    out
}

/// Everything `design --washout` prints.
pub struct WashoutReport<'a> {
    /// The washout found.
    pub design: &'a WashoutDesign,
    /// What it was for.
    pub goal: Goal,
    /// Design lift coefficient.
    pub cl: f64,
    /// Where the wing was written.
    pub output: &'a Path,
}

/// (label, before, after, decimals) of a washout report's comparison.
fn washout_rows(r: &WashoutReport) -> [(&'static str, Option<f64>, Option<f64>, usize); 4] {
    let (b, a) = (&r.design.before, &r.design.after);
    [
        ("CDi", Some(b.cdi), Some(a.cdi), 6),
        ("e", b.e, a.e, 4),
        ("stall_margin", b.stall_margin, a.stall_margin, 4),
        ("first_stall_y_m", b.first_stall_y, a.first_stall_y, 3),
    ]
}

/// The readable report of a washout search: the washout and the wing before and after.
#[must_use]
pub fn washout_table(r: &WashoutReport) -> String {
    let d = r.design;
    let mut out = String::new();
    let _ = writeln!(
        out,
        "wing        {}  [{}] -> {}",
        inert(&d.wing.name),
        fingerprint(&d.wing),
        inert(&r.output.display().to_string())
    );
    let _ = writeln!(
        out,
        "washout     {} at CL {}: {} deg (twist added: root 0, tips {} deg)",
        r.goal.label(),
        fixed(r.cl, 4),
        fixed(d.washout_deg, 3),
        signed(-d.washout_deg, 3)
    );
    let _ = writeln!(out, "\n{:<16} {:>10} {:>10}", "", "before", "after");
    for (label, before, after, decimals) in washout_rows(r) {
        let _ = writeln!(
            out,
            "{label:<16} {:>10} {:>10}",
            opt(before, decimals),
            opt(after, decimals)
        );
    }
    out.push_str(
        "\nstall_margin: at the first-stall CL, the root's cl/cl_max less the highest on the \
         outer half of either semispan (positive: the root stalls first)\n",
    );
    out
}

/// The JSON object of `design --washout --format json`.
#[must_use]
pub fn washout_json(r: &WashoutReport) -> Value {
    let side = |o: &Outcome| {
        json!({
            "CDi": o.cdi,
            "e": o.e,
            "stall_margin": o.stall_margin,
            "first_stall_y_m": o.first_stall_y,
        })
    };
    let mut out = json!({
        "wing": r.design.wing.name,
        "fingerprint": fingerprint(&r.design.wing),
        "output": r.output.display().to_string(),
        "goal": r.goal.label(),
        "CL": r.cl,
        "washout_deg": r.design.washout_deg,
        "before": side(&r.design.before),
        "after": side(&r.design.after),
    });
    unsigned_zeros(&mut out);
    out
}

/// A washout search as CSV: one row per compared quantity.
#[must_use]
pub fn washout_csv(r: &WashoutReport) -> String {
    let mut out = format!(
        "quantity,before,after\nwashout_deg,0,{}\n",
        csv_row(&[Some(r.design.washout_deg)])
    );
    for (label, before, after, _) in washout_rows(r) {
        let _ = writeln!(out, "{label},{}", csv_row(&[before, after]));
    }
    out
}
