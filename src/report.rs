//! Renderings of a solution: the notebook line, a readable table, JSON and CSV.
//! Strings only; printing is the caller's business.

use std::fmt::Write as _;

use serde_json::{json, Value};

use crate::solver::{Coefficients, Solution, SpanPoint, SweepPoint};
use crate::text::{fit_number, fixed, inert, readable, unsigned_zero};
use crate::wing::{fingerprint, Geometry, Wing};

/// How the condition was set, for the notebook line: a wing solved for a target CL says so
/// before the alpha that gives it.
fn condition_text(s: &Solution, target_cl: Option<f64>) -> String {
    let target = target_cl.map_or_else(String::new, |cl| format!("target CL {} -> ", fixed(cl, 4)));
    format!(
        "{target}alpha {} deg, V {} m/s, h {} m ISA",
        fixed(s.coefficients.alpha_deg, 2),
        fixed(s.flight.speed, 1),
        fixed(s.flight.altitude, 0)
    )
}

pub(crate) fn opt(value: Option<f64>, decimals: usize) -> String {
    value.map_or_else(|| "n/a".to_string(), |v| fixed(v, decimals))
}

/// Full-precision numbers for CSV: `-0` written as `0`, a missing value as an empty field.
pub(crate) fn csv_row(values: &[Option<f64>]) -> String {
    let fields: Vec<String> = values
        .iter()
        .map(|v| v.map_or_else(String::new, |v| readable(unsigned_zero(v))))
        .collect();
    fields.join(",")
}

/// Every `-0.0` in a JSON document written as `0.0`.
pub(crate) fn unsigned_zeros(value: &mut Value) {
    match value {
        Value::Number(n) if n.as_f64() == Some(0.0) && n.is_f64() => *value = json!(0.0),
        Value::Array(items) => items.iter_mut().for_each(unsigned_zeros),
        Value::Object(map) => map.values_mut().for_each(unsigned_zeros),
        _ => {}
    }
}

/// The right half's centre of lift; none when that half carries no lift.
fn center_of_lift(s: &Solution) -> Option<f64> {
    Some(s.center_of_lift_y).filter(|y| y.is_finite())
}

/// The first number of a solution that is not finite, by its JSON key; `None` when every
/// number prints. Numbers that may be missing (e, delta, the centre of lift) are left out:
/// they print as `n/a` and `null`.
#[must_use]
pub fn non_finite(s: &Solution) -> Option<&'static str> {
    let c = &s.coefficients;
    let f = &s.flight;
    let g = &s.geometry;
    let stall = s
        .first_stall
        .map_or([0.0; 3], |st| [st.y, st.cl_wing, st.alpha_deg]);
    let scalars = [
        ("alpha_deg", c.alpha_deg),
        ("CL", c.cl),
        ("CDi", c.cdi),
        ("CDp", c.cdp),
        ("CD", c.cd),
        ("Cl_roll", c.cl_roll),
        ("Cn", c.cn),
        ("Cm", c.cm),
        ("CL_alpha_per_rad", s.cl_alpha),
        ("tau", s.tau),
        ("span_m", g.span),
        ("area_m2", g.area),
        ("mac_m", g.mac),
        ("q_Pa", f.q),
        ("mach", f.mach),
        ("reynolds_mac", f.reynolds_mac),
        ("lift_N", f.lift),
        ("drag_N", f.drag),
        ("root_bending_moment_Nm", f.right_root_bending_moment),
        ("root_bending_moment_left_Nm", f.left_root_bending_moment),
        ("first_stall_y_m", stall[0]),
        ("CL_first_stall", stall[1]),
        ("alpha_first_stall_deg", stall[2]),
    ];
    let point_finite = |p: &SpanPoint| point_values(p).iter().all(|v| v.is_finite());
    scalars
        .iter()
        .find(|(_, v)| !v.is_finite())
        .map(|(key, _)| *key)
        .or_else(|| (!s.spanwise.iter().all(point_finite)).then_some("spanwise"))
        .or_else(|| (!s.stations.iter().all(point_finite)).then_some("stations"))
}

/// A spanwise point's numbers in the CSV's column order.
const fn point_values(p: &SpanPoint) -> [f64; 8] {
    [
        p.y,
        p.chord,
        p.cl,
        p.span_load,
        p.alpha_i_deg,
        p.gamma,
        p.cl_max,
        p.cl_ratio,
    ]
}

fn lift_to_drag(s: &Solution) -> Option<f64> {
    let c = &s.coefficients;
    (c.cd > 0.0).then(|| c.cl / c.cd)
}

/// One line to paste into a lab notebook: the wing, the condition, the key coefficients with
/// units, the method and term count, and the wing's fingerprint. `target_cl` is the CL the
/// solution was solved for, if it was (`None` when alpha was given).
#[must_use]
pub fn line(wing: &Wing, s: &Solution, target_cl: Option<f64>) -> String {
    let c = &s.coefficients;
    let stall = s.first_stall.map_or_else(
        || "stall n/a".to_string(),
        |f| format!("stall y {} m at CL {}", fixed(f.y, 3), fixed(f.cl_wing, 3)),
    );
    format!(
        "{name} | {cond} | CL {cl} CDi {cdi} CDp {cdp} CD {cd} L/D {ld} e {e} \
         CLa {cla}/rad Cl_roll {roll} Cn {cn} Cm {cm} {m} {stall} | {method} N={n} | \
         wing {hash}",
        name = inert(&wing.name),
        cond = condition_text(s, target_cl),
        cl = fixed(c.cl, 4),
        cdi = fixed(c.cdi, 5),
        cdp = fixed(c.cdp, 5),
        cd = fixed(c.cd, 5),
        ld = opt(lift_to_drag(s), 1),
        e = opt(c.e, 4),
        cla = fixed(s.cl_alpha, 3),
        roll = fixed(c.cl_roll, 5),
        cn = fixed(c.cn, 5),
        cm = fixed(c.cm, 5),
        m = root_moments(
            s.flight.right_root_bending_moment,
            s.flight.left_root_bending_moment
        ),
        method = s.method.name,
        n = s.method.resolution,
        hash = fingerprint(wing),
    )
}

/// The root bending moments for the line: one value for both halves when they agree to the
/// printed digit, else each half named (right first, as the reference's y axis points).
#[must_use]
pub fn root_moments(right: f64, left: f64) -> String {
    let (r, l) = (fixed(right, 1), fixed(left, 1));
    if r == l {
        format!("Mroot {r} N m each half")
    } else {
        format!("Mroot right {r} left {l} N m")
    }
}

/// The result line as the notebook keeps it: [`line()`] followed by where the wing came from
/// (its file, or none) and whether it had edits not saved to that file, so a line can be traced
/// back to a file even when two wings share a name.
#[must_use]
pub fn notebook_line(
    wing: &Wing,
    s: &Solution,
    target_cl: Option<f64>,
    file: Option<&std::path::Path>,
    unsaved: bool,
) -> String {
    let from = file.map_or_else(
        || "no file".to_string(),
        |p| format!("file {}", inert(&p.display().to_string())),
    );
    let mark = if unsaved { " (unsaved edits)" } else { "" };
    format!("{}{mark} {from}", line(wing, s, target_cl))
}

/// A readable multi-line report with the spanwise table at the stations; `target_cl` as for
/// [`line()`].
#[must_use]
pub fn table(wing: &Wing, s: &Solution, target_cl: Option<f64>) -> String {
    let c = &s.coefficients;
    let g = &s.geometry;
    let f = &s.flight;
    let mut out = String::new();
    let _ = writeln!(
        out,
        "wing        {}  [{}]",
        inert(&wing.name),
        fingerprint(wing)
    );
    let _ = writeln!(out, "method      {}", method_text(s));
    let _ = writeln!(
        out,
        "geometry    b {} m  S {} m^2  AR {}  taper {}  MAC {} m at y {} m",
        fixed(g.span, 3),
        fixed(g.area, 4),
        fixed(g.aspect_ratio, 3),
        fixed(g.taper_ratio, 3),
        fixed(g.mac, 4),
        fixed(g.y_mac, 3)
    );
    let _ = writeln!(
        out,
        "condition   {}  rho {} kg/m^3  q {} Pa  Mach {}  Re(MAC) {:.3e}",
        condition_text(s, target_cl),
        fixed(f.air.density, 4),
        fixed(f.q, 1),
        fixed(f.mach, 3),
        f.reynolds_mac
    );
    let _ = writeln!(
        out,
        "lift        CL {}  CL_alpha {}/rad ({}/deg)  tau {}",
        fixed(c.cl, 4),
        fixed(s.cl_alpha, 4),
        fixed(s.cl_alpha.to_radians(), 5),
        fixed(s.tau, 4)
    );
    let _ = writeln!(
        out,
        "drag        CDi {}  CDp {}  CD {}  L/D {}  e {}  delta {}",
        fixed(c.cdi, 5),
        fixed(c.cdp, 5),
        fixed(c.cd, 5),
        opt(lift_to_drag(s), 2),
        opt(c.e, 4),
        opt(c.delta, 4)
    );
    let _ = writeln!(
        out,
        "moments     Cl_roll {}  Cn {} (induced {}, profile {})",
        fixed(c.cl_roll, 5),
        fixed(c.cn, 6),
        fixed(c.cn_induced, 6),
        fixed(c.cn_profile, 6)
    );
    let r = &s.reference;
    let _ = writeln!(
        out,
        "pitch       Cm {} about x {} m  (S_ref {} m^2, c_ref {} m)",
        fixed(c.cm, 5),
        fixed(r.x, 4),
        fixed(r.area, 4),
        fixed(r.chord, 4)
    );
    let _ = writeln!(
        out,
        "loads       lift {} N  drag {} N  root bending {} N m  centre of lift y {} m",
        fixed(f.lift, 1),
        fixed(f.drag, 2),
        fixed(f.right_root_bending_moment, 2),
        opt(center_of_lift(s), 3)
    );
    let stall = s.first_stall.map_or_else(
        || "none (no section's cl rises with alpha)".to_string(),
        |st| {
            format!(
                "y {} m at CL {} (alpha {} deg)",
                fixed(st.y, 3),
                fixed(st.cl_wing, 4),
                fixed(st.alpha_deg, 2)
            )
        },
    );
    let _ = writeln!(out, "first stall {stall}");
    let stalled = s.stalled_y();
    if let (Some(first), Some(last)) = (stalled.first(), stalled.last()) {
        let _ = writeln!(
            out,
            "stalled     {} points past cl_max, y {} to {} m",
            stalled.len(),
            fixed(*first, 3),
            fixed(*last, 3)
        );
    }
    if let Some(m) = s.cl_max {
        let _ = writeln!(
            out,
            "CL_max      {} at alpha {} deg ({})",
            opt(finite(m.cl_max), 4),
            opt(finite(m.alpha_deg), 2),
            m.found_by.as_str()
        );
    }
    for w in &s.warnings {
        let _ = writeln!(out, "warning     {w}");
    }
    let _ = writeln!(
        out,
        "\n{:>9} {:>8} {:>8} {:>8} {:>9} {:>9} {:>8}",
        "y m", "chord m", "cl", "c*cl/cm", "alpha_i", "Gamma", "cl/clmax"
    );
    for p in &s.stations {
        let _ = writeln!(
            out,
            "{:>9} {:>8} {:>8} {:>8} {:>9} {:>9} {:>8}",
            fit_number(p.y, 4, 9),
            fit_number(p.chord, 4, 8),
            fit_number(p.cl, 4, 8),
            fit_number(p.span_load, 4, 8),
            fit_number(p.alpha_i_deg, 4, 9),
            fit_number(p.gamma, 4, 9),
            fit_number(p.cl_ratio, 3, 8)
        );
    }
    out
}

/// The method line of the table: name, resolution and, for an iterative solve, its
/// convergence.
fn method_text(s: &Solution) -> String {
    let m = &s.method;
    let mut out = format!("{}, N = {}", m.name, m.resolution);
    if let Some(r) = m.residual {
        let _ = write!(
            out,
            ", converged in {} iterations (residual {r:.1e})",
            m.iterations
        );
    }
    out
}

/// The method report's keys: its resolution under the method's own key (`terms`, `panels`),
/// convergence, and its extra arrays (e.g. `fourier`).
fn method_json(s: &Solution) -> Value {
    let m = &s.method;
    let mut out = json!({
        m.resolution_key: m.resolution,
        "converged": m.converged(),
        "iterations": m.iterations,
        "residual": m.residual,
    });
    if let Value::Object(map) = &mut out {
        for (key, values) in &m.extras {
            map.insert((*key).to_string(), json!(values));
        }
    }
    out
}

/// The stalled output points, and the wing's CL_max when it was asked for.
fn stall_json(s: &Solution) -> Value {
    let mut out = json!({ "stalled_y_m": s.stalled_y() });
    if let (Some(m), Value::Object(map)) = (s.cl_max, &mut out) {
        map.insert("CL_max".into(), json!(finite(m.cl_max)));
        map.insert("alpha_CL_max_deg".into(), json!(finite(m.alpha_deg)));
        map.insert("stall_found_by".into(), json!(m.found_by.as_str()));
    }
    out
}

/// A number, or `None` (JSON null) when it is not finite.
fn finite(v: f64) -> Option<f64> {
    v.is_finite().then_some(v)
}

fn point_json(p: &SpanPoint, reynolds: f64) -> Value {
    json!({
        "y_m": p.y,
        "chord_m": p.chord,
        "cl": p.cl,
        "alpha_i_deg": p.alpha_i_deg,
        "gamma_m2_s": p.gamma,
        "span_load": p.span_load,
        "cl_max": p.cl_max,
        "cl_over_cl_max": p.cl_ratio,
        "cm": p.cm,
        "reynolds": reynolds,
    })
}

/// The JSON object of `solve --format json`. The keys named in the core issue are a contract;
/// more may be added, none renamed or dropped. SI units, angles in degrees unless the key says.
/// `target_CL` is the CL solved for, null when alpha was given.
#[must_use]
pub fn json(wing: &Wing, s: &Solution, target_cl: Option<f64>) -> Value {
    let c = &s.coefficients;
    let g = &s.geometry;
    let f = &s.flight;
    let reynolds = |p: &SpanPoint| f.air.density * f.speed * p.chord / f.air.viscosity;
    let points = |ps: &[SpanPoint]| {
        ps.iter()
            .map(|p| point_json(p, reynolds(p)))
            .collect::<Vec<_>>()
    };
    let mut out = json!({
        "wing": wing.name,
        "fingerprint": fingerprint(wing),
        "method": s.method.name,
        "alpha_deg": c.alpha_deg,
        "target_CL": target_cl,
        "CL": c.cl,
        "CDi": c.cdi,
        "CDp": c.cdp,
        "CD": c.cd,
        "L_over_D": lift_to_drag(s),
        "e": c.e,
        "delta": c.delta,
        "tau": s.tau,
        "CL_alpha_per_rad": s.cl_alpha,
        "CL_alpha_per_deg": s.cl_alpha.to_radians(),
    });
    let geometry_and_moments = json!({
        "aspect_ratio": g.aspect_ratio,
        "area_m2": g.area,
        "span_m": g.span,
        "taper_ratio": g.taper_ratio,
        "mean_chord_m": g.mean_chord,
        "mac_m": g.mac,
        "y_mac_m": g.y_mac,
        "Cl_roll": c.cl_roll,
        "Cn": c.cn,
        "Cn_induced": c.cn_induced,
        "Cn_profile": c.cn_profile,
        "Cm": c.cm,
        "reference_area_m2": s.reference.area,
        "reference_span_m": s.reference.span,
        "reference_chord_m": s.reference.chord,
        "reference_x_m": s.reference.x,
        "root_bending_moment_Nm": f.right_root_bending_moment,
        "root_bending_moment_left_Nm": f.left_root_bending_moment,
        "center_of_lift_y_m": center_of_lift(s),
        "first_stall_y_m": s.first_stall.map(|st| st.y),
        "CL_first_stall": s.first_stall.map(|st| st.cl_wing),
        "alpha_first_stall_deg": s.first_stall.map(|st| st.alpha_deg),
    });
    let flight = json!({
        "speed_m_s": f.speed,
        "altitude_m": f.altitude,
        "rho_kg_m3": f.air.density,
        "temperature_K": f.air.temperature,
        "q_Pa": f.q,
        "mach": f.mach,
        "reynolds_mac": f.reynolds_mac,
        "lift_N": f.lift,
        "drag_N": f.drag,
        "warnings": s.warnings,
        "stations": points(&s.stations),
        "spanwise": points(&s.spanwise),
    });
    for part in [geometry_and_moments, flight, method_json(s), stall_json(s)] {
        if let (Value::Object(target), Value::Object(source)) = (&mut out, part) {
            target.extend(source);
        }
    }
    unsigned_zeros(&mut out);
    out
}

/// The spanwise table at the output points, with a header row.
#[must_use]
pub fn csv(s: &Solution) -> String {
    let mut out =
        String::from("y_m,chord_m,cl,span_load,alpha_i_deg,gamma_m2_s,cl_max,cl_over_cl_max\n");
    for p in &s.spanwise {
        let row = point_values(p).map(Some);
        let _ = writeln!(out, "{}", csv_row(&row));
    }
    out
}

/// One line of `check`: the file, the wing and its planform.
#[must_use]
pub fn geometry_line(path: &std::path::Path, wing: &Wing, g: &Geometry) -> String {
    format!(
        "ok {}: {} [{}] | {} stations, {} | b {} m S {} m^2 AR {} taper {} \
         MAC {} m at y {} m | {} airfoils, {} controls",
        inert(&path.display().to_string()),
        inert(&wing.name),
        fingerprint(wing),
        wing.stations.len(),
        if wing.symmetric {
            "mirrored"
        } else {
            "full span"
        },
        fixed(g.span, 3),
        fixed(g.area, 4),
        fixed(g.aspect_ratio, 2),
        fixed(g.taper_ratio, 3),
        fixed(g.mac, 4),
        fixed(g.y_mac, 3),
        wing.airfoils.len(),
        wing.controls.len(),
    )
}

/// How a sweep prints.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum SweepStyle {
    /// Aligned columns.
    Table,
    /// Comma-separated with a header row.
    Csv,
    /// One JSON object with a `points` array.
    Json,
}

/// An alpha sweep's rows and what they were computed with.
#[derive(Debug, Clone, Copy)]
pub struct SweepTable<'a> {
    /// The planform (for lift and drag in N).
    pub geometry: &'a Geometry,
    /// The method's name.
    pub method: &'a str,
    /// Dynamic pressure, Pa.
    pub q: f64,
    /// One row per angle of attack.
    pub points: &'a [SweepPoint],
}

/// An alpha sweep: one row per angle of attack, with lift and drag in N at the table's
/// dynamic pressure.
#[must_use]
pub fn sweep(wing: &Wing, table: &SweepTable, style: SweepStyle) -> String {
    let (g, q) = (table.geometry, table.q);
    let points: Vec<Coefficients> = table.points.iter().map(|p| p.coefficients).collect();
    let stalled: Vec<usize> = table.points.iter().map(|p| p.stalled_points).collect();
    let ld = |c: &Coefficients| (c.cd > 0.0).then(|| c.cl / c.cd);
    match style {
        SweepStyle::Json => {
            let rows: Vec<Value> = points
                .iter()
                .zip(&stalled)
                .map(|(c, &n)| {
                    json!({
                        "alpha_deg": c.alpha_deg, "CL": c.cl, "CDi": c.cdi, "CDp": c.cdp,
                        "CD": c.cd, "e": c.e, "L_over_D": ld(c), "Cl_roll": c.cl_roll,
                        "Cn": c.cn, "Cm": c.cm, "lift_N": q * g.area * c.cl,
                        "drag_N": q * g.area * c.cd, "stalled": n > 0, "stalled_points": n,
                    })
                })
                .collect();
            let mut obj = json!({
                "wing": wing.name, "fingerprint": fingerprint(wing), "method": table.method,
                "q_Pa": q, "area_m2": g.area, "points": rows,
            });
            unsigned_zeros(&mut obj);
            format!("{obj}\n")
        }
        SweepStyle::Csv => {
            let mut out =
                String::from("alpha_deg,CL,CDi,CDp,CD,e,L_over_D,Cl_roll,Cn,Cm,stalled_points\n");
            for (c, &n) in points.iter().zip(&stalled) {
                let row = [
                    Some(c.alpha_deg),
                    Some(c.cl),
                    Some(c.cdi),
                    Some(c.cdp),
                    Some(c.cd),
                    c.e,
                    ld(c),
                    Some(c.cl_roll),
                    Some(c.cn),
                    Some(c.cm),
                    Some(n as f64),
                ];
                let _ = writeln!(out, "{}", csv_row(&row));
            }
            out
        }
        SweepStyle::Table => {
            let mut out = format!("wing {}  [{}]\n", inert(&wing.name), fingerprint(wing));
            let _ = writeln!(
                out,
                "{:>8} {:>8} {:>9} {:>9} {:>9} {:>7} {:>7} {:>9}  stall",
                "alpha", "CL", "CDi", "CDp", "CD", "e", "L/D", "lift N"
            );
            for (c, &n) in points.iter().zip(&stalled) {
                let flag = if n > 0 {
                    format!("  {n} past cl_max")
                } else {
                    String::new()
                };
                let _ = writeln!(
                    out,
                    "{:>8} {:>8} {:>9} {:>9} {:>9} {:>7} {:>7} {:>9}{flag}",
                    fit_number(c.alpha_deg, 2, 8),
                    fit_number(c.cl, 4, 8),
                    fit_number(c.cdi, 5, 9),
                    fit_number(c.cdp, 5, 9),
                    fit_number(c.cd, 5, 9),
                    opt(c.e, 4),
                    ld(c).map_or_else(|| "n/a".to_string(), |v| fit_number(v, 1, 7)),
                    fit_number(q * g.area * c.cl, 1, 9)
                );
            }
            out
        }
    }
}

#[cfg(test)]
mod tests {
    use super::csv_row;

    #[test]
    fn csv_numbers_are_exact_and_short_at_any_size() {
        let row = csv_row(&[
            Some(1e-300),
            Some(-0.0),
            Some(2.5e20),
            Some(-4.0),
            None,
            Some(0.1),
        ]);
        assert_eq!(row, "1e-300,0,2.5e20,-4,,0.1");
    }
}
