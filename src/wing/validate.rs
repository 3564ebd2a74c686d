//! The rules a wing must meet before it is solved, and the warnings where lifting-line
//! theory is weak. Shared by the file reader and the workbench's editor.

use std::fmt;

use super::{Airfoil, Geometry, Wing};
use crate::text::{clip, readable, QUOTE_CHARS};

/// The largest angle of attack (either sign), degrees, in a file, a flag or a solution: past
/// it the angle no longer describes a wing in forward flight. Also the limit on twist,
/// zero-lift angle and control deflection.
pub const MAX_ALPHA_DEG: f64 = 90.0;
/// The largest length (|y|, chord, |x_le|, |z|), m: ten times any wing built.
pub const MAX_LENGTH_M: f64 = 1000.0;
/// The smallest span and nonzero chord, m: below a millimetre the planform's ratios (aspect
/// ratio, taper) lose their meaning in floating point.
pub const MIN_LENGTH_M: f64 = 0.001;
/// The largest true airspeed, m/s (about Mach 3; above Mach 0.3 the results are warned).
pub const MAX_SPEED_M_S: f64 = 1000.0;
/// The smallest section lift slope, per radian: a slope given per degree (0.11) is caught.
pub const MIN_LIFT_SLOPE: f64 = 0.5;
/// The smallest `cl_max`: a section that stalls at once has no lifting-line answer.
pub const MIN_CL_MAX: f64 = 0.1;
/// The largest section lift slope, per radian: twice the thin-airfoil 2 pi, so a slope given
/// per degree times 57.3 twice over, or any other unit slip, is caught.
pub const MAX_LIFT_SLOPE: f64 = 12.5;
/// The largest `cl_max` of a section: beyond any high-lift section.
pub const MAX_CL: f64 = 10.0;
/// The largest `cd0` (a flat plate across the flow has about 2) and |cd1|, |cd2|.
pub const MAX_DRAG_TERM: f64 = 10.0;

/// Where in a wing a problem sits.
#[derive(Debug, Clone, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub enum Place {
    /// The top level of the file.
    Wing,
    /// Station by zero-based index.
    Station(usize),
    /// Airfoil by key.
    Airfoil(String),
    /// Control by zero-based index.
    Control(usize),
    /// The `[condition]` table.
    Condition,
    /// The `[reference]` table.
    Reference,
}

impl fmt::Display for Place {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Self::Wing => write!(f, "wing"),
            Self::Station(i) => write!(f, "station {}", i + 1),
            Self::Airfoil(key) => write!(f, "airfoil {}", clip(key, QUOTE_CHARS)),
            Self::Control(i) => write!(f, "control {}", i + 1),
            Self::Condition => write!(f, "condition"),
            Self::Reference => write!(f, "reference"),
        }
    }
}

/// One broken rule: the place, the field and what is wrong.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Problem {
    /// Where.
    pub place: Place,
    /// The wing-file key.
    pub field: &'static str,
    /// What is wrong, in a few words.
    pub reason: String,
}

impl fmt::Display for Problem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}: {}: {}", self.place, self.field, self.reason)
    }
}

fn problem(place: Place, field: &'static str, reason: impl Into<String>) -> Problem {
    Problem {
        place,
        field,
        reason: reason.into(),
    }
}

/// Checks every rule; returns all problems in file order (empty when the wing is valid).
#[must_use]
pub fn problems(wing: &Wing) -> Vec<Problem> {
    let mut out = Vec::new();
    station_problems(wing, &mut out);
    airfoil_problems(wing, &mut out);
    control_problems(wing, &mut out);
    condition_problems(wing, &mut out);
    reference_problems(&wing.reference, &mut out);
    out
}

/// `[reference]`: area, span and chord above 0, x a length (each when given). Area is an
/// area, so its bound is the square of the length bound.
fn reference_problems(r: &super::Reference, out: &mut Vec<Problem>) {
    let place = Place::Reference;
    let positive = [
        ("area", r.area, (MAX_LENGTH_M * MAX_LENGTH_M, " m^2")),
        ("span", r.span, LENGTH),
        ("chord", r.chord, LENGTH),
    ];
    for (field, value, limit) in positive {
        let Some(value) = value else { continue };
        if finite(out, &place, field, value) {
            if value <= 0.0 {
                let reason = format!("must be > 0 (got {})", readable(value));
                out.push(problem(place.clone(), field, reason));
            } else {
                at_most(out, &place, field, value, limit);
            }
        }
    }
    if let Some(x) = r.x {
        within(out, &place, "x", x, LENGTH);
    }
}

fn finite(out: &mut Vec<Problem>, place: &Place, field: &'static str, value: f64) -> bool {
    if value.is_finite() {
        true
    } else {
        out.push(problem(
            place.clone(),
            field,
            format!("must be a finite number (got {})", readable(value)),
        ));
        false
    }
}

/// A finite value within `-limit..=limit`; pushes the problem otherwise.
fn within(
    out: &mut Vec<Problem>,
    place: &Place,
    field: &'static str,
    value: f64,
    (limit, unit): (f64, &str),
) -> bool {
    if !finite(out, place, field, value) {
        return false;
    }
    let ok = value.abs() <= limit;
    if !ok {
        out.push(problem(
            place.clone(),
            field,
            format!(
                "must be within -{limit} to {limit}{unit} (got {})",
                readable(value)
            ),
        ));
    }
    ok
}

/// A positive value (already checked finite and > 0) at least `limit`.
fn at_least(
    out: &mut Vec<Problem>,
    place: &Place,
    field: &'static str,
    value: f64,
    (limit, unit): (f64, &str),
) {
    if value > 0.0 && value < limit {
        out.push(problem(
            place.clone(),
            field,
            format!("must be at least {limit}{unit} (got {})", readable(value)),
        ));
    }
}

/// A value (already checked finite and for its lower bound) at most `limit`.
fn at_most(
    out: &mut Vec<Problem>,
    place: &Place,
    field: &'static str,
    value: f64,
    (limit, unit): (f64, &str),
) {
    if value > limit {
        out.push(problem(
            place.clone(),
            field,
            format!("must be at most {limit}{unit} (got {})", readable(value)),
        ));
    }
}

const LENGTH: (f64, &str) = (MAX_LENGTH_M, " m");
const ANGLE: (f64, &str) = (MAX_ALPHA_DEG, " deg");

fn station_problems(wing: &Wing, out: &mut Vec<Problem>) {
    let n = wing.stations.len();
    if n < 2 {
        out.push(problem(
            Place::Wing,
            "station",
            format!("at least two stations are needed (got {n})"),
        ));
    }
    // Zero chord is allowed at the tips only; an unsymmetric wing of two pointed tips would
    // still have no area at all.
    if n >= 2 && wing.stations.iter().all(|s| s.chord == 0.0) {
        out.push(problem(
            Place::Station(0),
            "chord",
            "every chord is 0: the wing has no area",
        ));
    }
    for (i, s) in wing.stations.iter().enumerate() {
        let place = Place::Station(i);
        let outermost = i + 1 == n || (!wing.symmetric && i == 0);
        if within(out, &place, "y", s.y, LENGTH) {
            if i == 0 && wing.symmetric && s.y != 0.0 {
                out.push(problem(
                    place.clone(),
                    "y",
                    format!(
                        "a symmetric wing's first station must be at y = 0 (got {})",
                        readable(s.y)
                    ),
                ));
            }
            let previous = i.checked_sub(1).map(|j| wing.stations[j].y);
            if let Some(before) = previous.filter(|b| b.is_finite() && s.y <= *b) {
                out.push(problem(
                    place.clone(),
                    "y",
                    format!(
                        "must be greater than the previous station's y = {} (got {})",
                        readable(before),
                        readable(s.y)
                    ),
                ));
            }
        }
        if finite(out, &place, "chord", s.chord) {
            if s.chord < 0.0 {
                out.push(problem(
                    place.clone(),
                    "chord",
                    format!("must be > 0 (got {})", readable(s.chord)),
                ));
            } else if s.chord == 0.0 && !outermost {
                out.push(problem(
                    place.clone(),
                    "chord",
                    "may be 0 only at the outermost station (a pointed tip)",
                ));
            } else if s.chord > 0.0 && s.chord < MIN_LENGTH_M {
                out.push(problem(
                    place.clone(),
                    "chord",
                    format!(
                        "must be 0 (a pointed tip) or at least {MIN_LENGTH_M} m (got {})",
                        readable(s.chord)
                    ),
                ));
            }
            at_most(out, &place, "chord", s.chord, LENGTH);
        }
        within(out, &place, "twist", s.twist_deg, ANGLE);
        within(out, &place, "x_le", s.x_le, LENGTH);
        within(out, &place, "z", s.z, LENGTH);
        if !wing.airfoils.contains_key(&s.airfoil) {
            let known: Vec<&str> = wing.airfoils.keys().map(String::as_str).collect();
            out.push(problem(
                place,
                "airfoil",
                format!(
                    "unknown airfoil `{}`{}",
                    clip(&s.airfoil, QUOTE_CHARS),
                    suggestion(&s.airfoil, &known)
                ),
            ));
        }
    }
    span_problem(wing, out);
}

/// A span too small to be a wing (see [`MIN_LENGTH_M`]), at the outermost station's `y`.
fn span_problem(wing: &Wing, out: &mut Vec<Problem>) {
    let (Some(first), Some(last)) = (wing.stations.first(), wing.stations.last()) else {
        return;
    };
    let span = if wing.symmetric {
        2.0 * last.y
    } else {
        last.y - first.y
    };
    if wing.stations.len() >= 2 && span.is_finite() && span > 0.0 && span < MIN_LENGTH_M {
        out.push(problem(
            Place::Station(wing.stations.len() - 1),
            "y",
            format!(
                "the span must be at least {MIN_LENGTH_M} m (got {})",
                readable(span)
            ),
        ));
    }
}

/// " (did you mean `x`?)" for the closest candidate, or a few of the known ones.
#[must_use]
pub fn suggestion(word: &str, candidates: &[&str]) -> String {
    const SHOWN: usize = 5;
    match did_you_mean(word, candidates) {
        Some(best) => format!(" (did you mean `{}`?)", clip(best, QUOTE_CHARS)),
        None if candidates.is_empty() => " (no [airfoil.*] tables are defined)".to_string(),
        None => {
            let shown: Vec<String> = candidates
                .iter()
                .take(SHOWN)
                .map(|c| clip(c, QUOTE_CHARS / 4))
                .collect();
            let more = candidates.len().saturating_sub(SHOWN);
            let rest = if more > 0 {
                format!(" and {more} more")
            } else {
                String::new()
            };
            format!(" (known: {}{rest})", shown.join(", "))
        }
    }
}

/// Longest word (and candidate) compared for a did-you-mean: a typo of a key is short, and
/// the comparison grows with the product of the lengths, so a crafted file cannot stall it.
const SUGGEST_CHARS: usize = 64;

/// The candidate closest to a misspelt word, when one is close enough to be a likely typo.
#[must_use]
pub fn did_you_mean<'c>(word: &str, candidates: &[&'c str]) -> Option<&'c str> {
    if word.len() > SUGGEST_CHARS {
        return None;
    }
    // 0.7 on Jaro-Winkler accepts one or two slips in a short key and rejects unrelated
    // words (chosen by trying the keys of the format; no source).
    candidates
        .iter()
        .filter(|c| c.len() <= SUGGEST_CHARS)
        .map(|c| (strsim::jaro_winkler(word, c), *c))
        .max_by(|a, b| a.0.total_cmp(&b.0))
        .filter(|(score, _)| *score >= 0.7)
        .map(|(_, c)| c)
}

fn airfoil_problems(wing: &Wing, out: &mut Vec<Problem>) {
    for (key, a) in &wing.airfoils {
        let place = Place::Airfoil(key.clone());
        if a.table.is_some() {
            // The table was checked as it was read; only cl_max is the user's own.
            cl_max_problems(out, &place, a.cl_max);
            continue;
        }
        if finite(out, &place, "lift_slope", a.lift_slope) {
            if a.lift_slope <= 0.0 {
                out.push(problem(
                    place.clone(),
                    "lift_slope",
                    format!("must be > 0 per radian (got {})", readable(a.lift_slope)),
                ));
            }
            let per_radian = |limit| (limit, " per radian");
            at_least(
                out,
                &place,
                "lift_slope",
                a.lift_slope,
                per_radian(MIN_LIFT_SLOPE),
            );
            at_most(
                out,
                &place,
                "lift_slope",
                a.lift_slope,
                per_radian(MAX_LIFT_SLOPE),
            );
        }
        within(out, &place, "alpha_zero_lift", a.alpha_zero_lift_deg, ANGLE);
        let cl_max_ok = cl_max_problems(out, &place, a.cl_max);
        let cd0_ok = finite(out, &place, "cd0", a.cd0) && a.cd0 >= 0.0;
        if a.cd0 < 0.0 {
            out.push(problem(
                place.clone(),
                "cd0",
                format!("must be >= 0 (got {})", readable(a.cd0)),
            ));
        } else if cd0_ok {
            at_most(out, &place, "cd0", a.cd0, (MAX_DRAG_TERM, ""));
        }
        let cd1_ok = within(out, &place, "cd1", a.cd1, (MAX_DRAG_TERM, ""));
        let cd2_ok = within(out, &place, "cd2", a.cd2, (MAX_DRAG_TERM, ""));
        if cl_max_ok && cd0_ok && cd1_ok && cd2_ok {
            polar_problems(&place, a, out);
        }
        finite(out, &place, "cm0", a.cm0);
    }
}

/// cl_max finite, from [`MIN_CL_MAX`] to [`MAX_CL`]; true when it is usable.
fn cl_max_problems(out: &mut Vec<Problem>, place: &Place, cl_max: f64) -> bool {
    let ok = finite(out, place, "cl_max", cl_max) && cl_max > 0.0;
    if cl_max <= 0.0 {
        out.push(problem(
            place.clone(),
            "cl_max",
            format!("must be > 0 (got {})", readable(cl_max)),
        ));
    } else if ok {
        at_least(out, place, "cl_max", cl_max, (MIN_CL_MAX, ""));
        at_most(out, place, "cl_max", cl_max, (MAX_CL, ""));
    }
    ok
}

/// The profile drag polar must not go negative anywhere a section flies, |cl| <= cl_max:
/// a negative cd would be a thrust.
fn polar_problems(place: &Place, a: &Airfoil, out: &mut Vec<Problem>) {
    let cd = |cl: f64| a.cd0 + a.cd1 * cl + a.cd2 * cl * cl;
    let mut candidates = vec![-a.cl_max, a.cl_max];
    if a.cd2 > 0.0 {
        let vertex = -a.cd1 / (2.0 * a.cd2);
        if vertex.abs() <= a.cl_max {
            candidates.push(vertex);
        }
    }
    let lowest = candidates
        .into_iter()
        .map(|cl| (cd(cl), cl))
        .min_by(|x, y| x.0.total_cmp(&y.0));
    if let Some((least, at)) = lowest.filter(|(least, _)| *least < 0.0) {
        let field = if a.cd2 < 0.0 { "cd2" } else { "cd1" };
        out.push(problem(
            place.clone(),
            field,
            format!(
                "the polar gives cd = {} at cl = {}; cd0 + cd1*cl + cd2*cl^2 must be >= 0 \
                 for |cl| <= cl_max",
                crate::text::significant(least, 4),
                crate::text::significant(at, 4)
            ),
        ));
    }
}

fn control_problems(wing: &Wing, out: &mut Vec<Problem>) {
    let (left, right) = wing.span_ends();
    let reach = right.min(-left).max(0.0);
    for (i, c) in wing.controls.iter().enumerate() {
        let place = Place::Control(i);
        let inner_ok = finite(out, &place, "y_inner", c.y_inner);
        let outer_ok = finite(out, &place, "y_outer", c.y_outer);
        if inner_ok && c.y_inner < 0.0 {
            out.push(problem(
                place.clone(),
                "y_inner",
                format!(
                    "must be >= 0 on the right half (got {})",
                    readable(c.y_inner)
                ),
            ));
        }
        if inner_ok && outer_ok && c.y_inner >= c.y_outer {
            out.push(problem(
                place.clone(),
                "y_outer",
                format!(
                    "must be greater than y_inner = {} (got {})",
                    readable(c.y_inner),
                    readable(c.y_outer)
                ),
            ));
        }
        if outer_ok && c.y_outer > reach + 1e-9 {
            out.push(problem(
                place.clone(),
                "y_outer",
                format!(
                    "lies outside the span: the tip is at y = {} (got {})",
                    readable(reach),
                    readable(c.y_outer)
                ),
            ));
        }
        if finite(out, &place, "chord_fraction", c.chord_fraction)
            && !(c.chord_fraction > 0.0 && c.chord_fraction < 1.0)
        {
            out.push(problem(
                place.clone(),
                "chord_fraction",
                format!(
                    "must be between 0 and 1, exclusive (got {})",
                    readable(c.chord_fraction)
                ),
            ));
        }
        within(out, &place, "deflection", c.deflection_deg, ANGLE);
        if let Some(e) = c.effectiveness {
            if finite(out, &place, "effectiveness", e) {
                if e <= 0.0 {
                    out.push(problem(
                        place.clone(),
                        "effectiveness",
                        format!("must be > 0 (got {})", readable(e)),
                    ));
                }
                // Thin-airfoil theory gives at most 1 (a control as deep as the chord).
                at_most(out, &place, "effectiveness", e, (1.0, ""));
            }
        }
    }
}

fn condition_problems(wing: &Wing, out: &mut Vec<Problem>) {
    out.extend(condition_rules(&wing.condition));
}

/// The rules on a flight condition (also applied to command-line overrides).
#[must_use]
pub fn condition_rules(c: &super::Condition) -> Vec<Problem> {
    let mut out = Vec::new();
    let place = Place::Condition;
    within(&mut out, &place, "alpha", c.alpha_deg, ANGLE);
    if let Some(cl) = c.target_cl {
        finite(&mut out, &place, "cl", cl);
    }
    if finite(&mut out, &place, "roll_rate", c.roll_rate) && c.roll_rate.abs() > 1.0 {
        // pb/2V is the tip's helix angle in radians: past 1 the tip meets the air at over 45 deg.
        out.push(problem(
            place.clone(),
            "roll_rate",
            format!(
                "must be within -1 to 1 (pb/2V; got {})",
                readable(c.roll_rate)
            ),
        ));
    }
    if finite(&mut out, &place, "speed", c.speed) {
        if c.speed <= 0.0 {
            out.push(problem(
                place.clone(),
                "speed",
                format!("must be > 0 m/s (got {})", readable(c.speed)),
            ));
        }
        at_most(&mut out, &place, "speed", c.speed, (MAX_SPEED_M_S, " m/s"));
    }
    if finite(&mut out, &place, "altitude", c.altitude)
        && !(crate::atmosphere::MIN_ALTITUDE..=crate::atmosphere::MAX_ALTITUDE)
            .contains(&c.altitude)
    {
        out.push(problem(
            place,
            "altitude",
            format!(
                "must be within the standard atmosphere, {} to {} m (got {})",
                crate::atmosphere::MIN_ALTITUDE,
                crate::atmosphere::MAX_ALTITUDE,
                readable(c.altitude)
            ),
        ));
    }
    out
}

/// Where lifting-line theory is weak for this wing, whatever the method (not errors; each
/// method adds its own).
#[must_use]
pub fn warnings(wing: &Wing, geometry: &Geometry) -> Vec<String> {
    let mut out = Vec::new();
    if geometry.aspect_ratio < 4.0 {
        out.push(format!(
            "aspect ratio {:.2} is below 4: lifting-line theory overestimates the lift slope",
            geometry.aspect_ratio
        ));
    }
    if !wing.symmetric && geometry.y_mid.abs() > 0.01 * geometry.span {
        out.push(format!(
            "the span is not centred on y = 0 (midpoint {:.3} m): moments are taken about y = 0",
            geometry.y_mid
        ));
    }
    for c in &wing.controls {
        if c.chord_fraction > 0.4 {
            out.push(format!(
                "control {}: chord fraction {:.2} above 0.4, thin-airfoil effectiveness is optimistic",
                c.name, c.chord_fraction
            ));
        }
        if c.deflection_deg.abs() > 20.0 {
            out.push(format!(
                "control {}: deflection {:.1} deg beyond 20 deg, linear flap theory overestimates it",
                c.name, c.deflection_deg
            ));
        }
    }
    out
}
