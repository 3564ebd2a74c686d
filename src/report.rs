//! Renderings of a solution: the notebook line, a readable table, JSON and CSV.
//! Strings only; printing is the caller's business.

use std::fmt::Write as _;

use serde_json::{json, Value};

use crate::solver::{Coefficients, Solution, SpanPoint, METHOD};
use crate::text::inert;
use crate::wing::{fingerprint, Geometry, Wing};

/// How the condition was set, for the notebook line.
fn condition_text(s: &Solution) -> String {
    format!(
        "alpha {:.2} deg, V {:.1} m/s, h {:.0} m ISA",
        s.coefficients.alpha_deg, s.flight.speed, s.flight.altitude
    )
}

fn opt(value: Option<f64>, decimals: usize) -> String {
    value.map_or_else(|| "n/a".to_string(), |v| format!("{v:.decimals$}"))
}

fn lift_to_drag(s: &Solution) -> Option<f64> {
    let c = &s.coefficients;
    (c.cd > 0.0).then(|| c.cl / c.cd)
}

/// One line to paste into a lab notebook: the wing, the condition, the key coefficients with
/// units, the method and term count, and the wing's fingerprint.
#[must_use]
pub fn line(wing: &Wing, s: &Solution) -> String {
    let c = &s.coefficients;
    let stall = s.first_stall.map_or_else(
        || "stall n/a".to_string(),
        |f| format!("stall y {:.3} m at CL {:.3}", f.y, f.cl_wing),
    );
    format!(
        "{name} | {cond} | CL {cl:.4} CDi {cdi:.5} CDp {cdp:.5} CD {cd:.5} L/D {ld} e {e} \
         CLa {cla:.3}/rad Cl_roll {roll:.5} Cn {cn:.5} Mroot {m:.1} N m {stall} | {METHOD} N={n} | wing {hash}",
        name = inert(&wing.name),
        cond = condition_text(s),
        cl = c.cl,
        cdi = c.cdi,
        cdp = c.cdp,
        cd = c.cd,
        ld = opt(lift_to_drag(s), 1),
        e = opt(c.e, 4),
        cla = s.cl_alpha,
        roll = c.cl_roll,
        cn = c.cn,
        m = s.flight.root_bending_moment,
        n = s.terms,
        hash = fingerprint(wing),
    )
}

/// A readable multi-line report with the spanwise table at the stations.
#[must_use]
pub fn table(wing: &Wing, s: &Solution) -> String {
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
    let _ = writeln!(out, "method      {METHOD}, N = {}", s.terms);
    let _ = writeln!(
        out,
        "geometry    b {:.3} m  S {:.4} m^2  AR {:.3}  taper {:.3}  MAC {:.4} m at y {:.3} m",
        g.span, g.area, g.aspect_ratio, g.taper_ratio, g.mac, g.y_mac
    );
    let _ = writeln!(
        out,
        "condition   {}  rho {:.4} kg/m^3  q {:.1} Pa  Mach {:.3}  Re(MAC) {:.3e}",
        condition_text(s),
        f.air.density,
        f.q,
        f.mach,
        f.reynolds_mac
    );
    let _ = writeln!(
        out,
        "lift        CL {:.4}  CL_alpha {:.4}/rad ({:.5}/deg)  tau {:.4}",
        c.cl,
        s.cl_alpha,
        s.cl_alpha.to_radians(),
        s.tau
    );
    let _ = writeln!(
        out,
        "drag        CDi {:.5}  CDp {:.5}  CD {:.5}  L/D {}  e {}  delta {}",
        c.cdi,
        c.cdp,
        c.cd,
        opt(lift_to_drag(s), 2),
        opt(c.e, 4),
        opt(c.delta, 4)
    );
    let _ = writeln!(
        out,
        "moments     Cl_roll {:.5}  Cn {:.6} (induced {:.6}, profile {:.6})",
        c.cl_roll, c.cn, c.cn_induced, c.cn_profile
    );
    let _ = writeln!(
        out,
        "loads       lift {:.1} N  drag {:.2} N  root bending {:.2} N m  centre of lift y {:.3} m",
        f.lift, f.drag, f.root_bending_moment, s.center_of_lift_y
    );
    let stall = s.first_stall.map_or_else(
        || "none (no section's cl rises with alpha)".to_string(),
        |st| {
            format!(
                "y {:.3} m at CL {:.4} (alpha {:.2} deg)",
                st.y, st.cl_wing, st.alpha_deg
            )
        },
    );
    let _ = writeln!(out, "first stall {stall}");
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
            "{:>9.4} {:>8.4} {:>8.4} {:>8.4} {:>9.4} {:>9.4} {:>8.3}",
            p.y, p.chord, p.cl, p.span_load, p.alpha_i_deg, p.gamma, p.cl_ratio
        );
    }
    out
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
        "reynolds": reynolds,
    })
}

/// The JSON object of `solve --format json`. The keys named in the core issue are a contract;
/// more may be added, none renamed or dropped. SI units, angles in degrees unless the key says.
#[must_use]
pub fn json(wing: &Wing, s: &Solution) -> Value {
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
        "method": METHOD,
        "terms": s.terms,
        "alpha_deg": c.alpha_deg,
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
        "root_bending_moment_Nm": f.root_bending_moment,
        "root_bending_moment_left_Nm": f.left_root_bending_moment,
        "center_of_lift_y_m": s.center_of_lift_y,
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
        "fourier": s.fourier,
        "warnings": s.warnings,
        "stations": points(&s.stations),
        "spanwise": points(&s.spanwise),
    });
    for part in [geometry_and_moments, flight] {
        if let (Value::Object(target), Value::Object(source)) = (&mut out, part) {
            target.extend(source);
        }
    }
    out
}

/// The spanwise table at the output points, with a header row.
#[must_use]
pub fn csv(s: &Solution) -> String {
    let mut out =
        String::from("y_m,chord_m,cl,span_load,alpha_i_deg,gamma_m2_s,cl_max,cl_over_cl_max\n");
    for p in &s.spanwise {
        let _ = writeln!(
            out,
            "{},{},{},{},{},{},{},{}",
            p.y, p.chord, p.cl, p.span_load, p.alpha_i_deg, p.gamma, p.cl_max, p.cl_ratio
        );
    }
    out
}

/// One line of `check`: the file, the wing and its planform.
#[must_use]
pub fn geometry_line(path: &std::path::Path, wing: &Wing, g: &Geometry) -> String {
    format!(
        "ok {}: {} [{}] | {} stations, {} | b {:.3} m S {:.4} m^2 AR {:.2} taper {:.3} \
         MAC {:.4} m at y {:.3} m | {} airfoils, {} controls",
        inert(&path.display().to_string()),
        inert(&wing.name),
        fingerprint(wing),
        wing.stations.len(),
        if wing.symmetric {
            "mirrored"
        } else {
            "full span"
        },
        g.span,
        g.area,
        g.aspect_ratio,
        g.taper_ratio,
        g.mac,
        g.y_mac,
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

/// An alpha sweep: one row per angle of attack, with lift and drag in N at dynamic pressure `q`.
#[must_use]
pub fn sweep(
    wing: &Wing,
    g: &Geometry,
    points: &[Coefficients],
    q: f64,
    style: SweepStyle,
) -> String {
    let ld = |c: &Coefficients| (c.cd > 0.0).then(|| c.cl / c.cd);
    match style {
        SweepStyle::Json => {
            let rows: Vec<Value> = points
                .iter()
                .map(|c| {
                    json!({
                        "alpha_deg": c.alpha_deg, "CL": c.cl, "CDi": c.cdi, "CDp": c.cdp,
                        "CD": c.cd, "e": c.e, "L_over_D": ld(c), "Cl_roll": c.cl_roll,
                        "Cn": c.cn, "lift_N": q * g.area * c.cl, "drag_N": q * g.area * c.cd,
                    })
                })
                .collect();
            let obj = json!({
                "wing": wing.name, "fingerprint": fingerprint(wing), "method": METHOD,
                "q_Pa": q, "area_m2": g.area, "points": rows,
            });
            format!("{obj}\n")
        }
        SweepStyle::Csv => {
            let mut out = String::from("alpha_deg,CL,CDi,CDp,CD,e,L_over_D,Cl_roll,Cn\n");
            for c in points {
                let _ = writeln!(
                    out,
                    "{},{},{},{},{},{},{},{},{}",
                    c.alpha_deg,
                    c.cl,
                    c.cdi,
                    c.cdp,
                    c.cd,
                    c.e.map_or(String::new(), |v| v.to_string()),
                    ld(c).map_or(String::new(), |v| v.to_string()),
                    c.cl_roll,
                    c.cn
                );
            }
            out
        }
        SweepStyle::Table => {
            let mut out = format!("wing {}  [{}]\n", inert(&wing.name), fingerprint(wing));
            let _ = writeln!(
                out,
                "{:>8} {:>8} {:>9} {:>9} {:>9} {:>7} {:>7} {:>9}",
                "alpha", "CL", "CDi", "CDp", "CD", "e", "L/D", "lift N"
            );
            for c in points {
                let _ = writeln!(
                    out,
                    "{:>8.2} {:>8.4} {:>9.5} {:>9.5} {:>9.5} {:>7} {:>7} {:>9.1}",
                    c.alpha_deg,
                    c.cl,
                    c.cdi,
                    c.cdp,
                    c.cd,
                    opt(c.e, 4),
                    opt(ld(c), 1),
                    q * g.area * c.cl
                );
            }
            out
        }
    }
}
