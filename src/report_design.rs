//! Renderings of the design results (twist design, washout, spar loads, trade studies):
//! tables, JSON and CSV. Strings only; printing is the caller's business.

use std::fmt::Write as _;
use std::path::Path;

use serde_json::{json, Value};

use crate::design::loads::{LoadCase, MassDistribution, SparLoads};
use crate::design::roll::RollAuthority;
use crate::design::twist::TwistDesign;
use crate::report::{csv_row, opt, unsigned_zeros};
use crate::solver::Solution;
use crate::text::{fixed, inert};
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
