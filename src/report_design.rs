//! Renderings of the design results (twist design, washout, spar loads, trade studies):
//! tables, JSON and CSV. Strings only; printing is the caller's business.

use std::fmt::Write as _;
use std::path::Path;

use serde_json::{json, Value};

use crate::design::twist::TwistDesign;
use crate::report::{csv_row, opt, unsigned_zeros};
use crate::solver::Solution;
use crate::text::{fixed, inert};
use crate::wing::fingerprint;

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
