//! One-parameter trade studies: a wing varied along one key, each variant solved.
//!
//! Variants are independent, so they are spread over the machine's cores with scoped
//! threads; each solve is the full one, so a study answers exactly as `solve` would for the
//! edited wing.

use std::num::NonZeroUsize;

use super::SolveFn;
use crate::wing::validate::did_you_mean;
use crate::wing::{Condition, Wing};

/// Most variants one study may have.
pub const MOST_VARIANTS: usize = 100_000;

/// What a study varies.
#[derive(Debug, Clone, PartialEq)]
pub enum Key {
    /// `station.N.chord` (N from 1).
    StationChord(usize),
    /// `station.N.twist`, degrees.
    StationTwist(usize),
    /// `station.N.y`, m.
    StationY(usize),
    /// `control.NAME.deflection`, degrees.
    ControlDeflection(String),
    /// `airfoil.NAME.lift_slope`, per radian.
    AirfoilLiftSlope(String),
    /// `airfoil.NAME.alpha_zero_lift`, degrees.
    AirfoilZeroLift(String),
    /// `airfoil.NAME.cl_max`.
    AirfoilClMax(String),
    /// `span`: every y scaled to this span, m (control edges with them).
    Span,
    /// `taper`: tip chord over root chord, outer chords scaled linearly in y.
    Taper,
    /// `washout`: linear twist added from 0 at the root to -value at the tips, degrees.
    Washout,
}

/// A key and the values it takes.
#[derive(Debug, Clone, PartialEq)]
pub struct Vary {
    /// What is varied.
    pub key: Key,
    /// The text of the key, as given.
    pub name: String,
    /// The values, FROM, FROM + STEP, ... up to TO.
    pub values: Vec<f64>,
}

impl Vary {
    /// Reads `KEY=FROM:TO:STEP`.
    ///
    /// # Errors
    /// A one-line message naming what is wrong.
    pub fn parse(text: &str) -> Result<Self, String> {
        let (name, range) = text
            .split_once('=')
            .ok_or_else(|| format!("--vary: expected KEY=FROM:TO:STEP (got `{text}`)"))?;
        let key = Key::parse(name)?;
        let numbers: Vec<f64> = range
            .split(':')
            .map(|p| p.trim().parse::<f64>())
            .collect::<Result<_, _>>()
            .map_err(|_| format!("--vary {name}: expected FROM:TO:STEP numbers (got `{range}`)"))?;
        let [from, to, step] = numbers[..] else {
            return Err(format!(
                "--vary {name}: expected FROM:TO:STEP, three numbers (got `{range}`)"
            ));
        };
        Ok(Self {
            key,
            name: name.to_string(),
            values: values(from, to, step).map_err(|e| format!("--vary {name}: {e}"))?,
        })
    }
}

/// FROM, FROM + STEP, ... up to TO (within a rounding allowance).
fn values(from: f64, to: f64, step: f64) -> Result<Vec<f64>, String> {
    if !(from.is_finite() && to.is_finite() && step.is_finite() && step > 0.0) {
        return Err(format!(
            "STEP must be > 0 and FROM, TO finite (got {from}:{to}:{step})"
        ));
    }
    if to < from {
        return Err(format!("TO {to} is below FROM {from}"));
    }
    let count = ((to - from) / step + 1e-9).floor() + 1.0;
    if count > MOST_VARIANTS as f64 {
        return Err(format!(
            "{count} variants is too many (at most {MOST_VARIANTS})"
        ));
    }
    Ok((0..count as usize)
        .map(|i| from + i as f64 * step)
        .collect())
}

const STATION_FIELDS: [&str; 3] = ["chord", "twist", "y"];
const AIRFOIL_FIELDS: [&str; 3] = ["lift_slope", "alpha_zero_lift", "cl_max"];

impl Key {
    /// Reads a key: `station.N.chord|twist|y`, `control.NAME.deflection`,
    /// `airfoil.NAME.lift_slope|alpha_zero_lift|cl_max`, `span`, `taper` or `washout`.
    ///
    /// # Errors
    /// A one-line message for anything else.
    pub fn parse(text: &str) -> Result<Self, String> {
        let unknown = |why: String| format!("--vary: unknown key `{text}`: {why}");
        match text {
            "span" => return Ok(Self::Span),
            "taper" => return Ok(Self::Taper),
            "washout" => return Ok(Self::Washout),
            _ => {}
        }
        let (group, rest) = text.split_once('.').ok_or_else(|| {
            unknown("expected station.N.FIELD, control.NAME.deflection, airfoil.NAME.FIELD, span, taper or washout".into())
        })?;
        if !["station", "control", "airfoil"].contains(&group) {
            return Err(unknown(format!(
                "`{group}` is not station, control or airfoil{}",
                did_you_mean(group, &["station", "control", "airfoil"])
                    .map_or_else(String::new, |s| format!(" (did you mean `{s}`?)"))
            )));
        }
        let (name, field) = rest
            .rsplit_once('.')
            .ok_or_else(|| unknown(format!("expected {group}.NAME.FIELD")))?;
        let field_error = |fields: &[&str]| {
            unknown(format!(
                "the field must be one of {}{}",
                fields.join(", "),
                did_you_mean(field, fields)
                    .map_or_else(String::new, |s| format!(" (did you mean `{s}`?)"))
            ))
        };
        match group {
            "station" => {
                let n: usize =
                    name.parse().ok().filter(|&n| n >= 1).ok_or_else(|| {
                        unknown(format!("station number `{name}` must be 1 or more"))
                    })?;
                match field {
                    "chord" => Ok(Self::StationChord(n)),
                    "twist" => Ok(Self::StationTwist(n)),
                    "y" => Ok(Self::StationY(n)),
                    _ => Err(field_error(&STATION_FIELDS)),
                }
            }
            "control" if field == "deflection" => Ok(Self::ControlDeflection(name.into())),
            "control" => Err(field_error(&["deflection"])),
            _ => match field {
                "lift_slope" => Ok(Self::AirfoilLiftSlope(name.into())),
                "alpha_zero_lift" => Ok(Self::AirfoilZeroLift(name.into())),
                "cl_max" => Ok(Self::AirfoilClMax(name.into())),
                _ => Err(field_error(&AIRFOIL_FIELDS)),
            },
        }
    }

    /// Checks that the key names something `wing` has (a station number in range, a known
    /// control or airfoil, a tip chord for `taper`).
    ///
    /// # Errors
    /// A one-line message naming what is missing and what there is.
    pub fn check(&self, wing: &Wing) -> Result<(), String> {
        self.apply(wing, self.current(wing)).map(|_| ())
    }

    /// The key's value in `wing` as it is (NaN where it has none).
    #[must_use]
    pub fn current(&self, wing: &Wing) -> f64 {
        let station = |n: usize| wing.stations.get(n - 1);
        match self {
            Self::StationChord(n) => station(*n).map_or(f64::NAN, |s| s.chord),
            Self::StationTwist(n) => station(*n).map_or(f64::NAN, |s| s.twist_deg),
            Self::StationY(n) => station(*n).map_or(f64::NAN, |s| s.y),
            Self::ControlDeflection(name) => wing
                .controls
                .iter()
                .find(|c| &c.name == name)
                .map_or(f64::NAN, |c| c.deflection_deg),
            Self::AirfoilLiftSlope(name) => {
                wing.airfoils.get(name).map_or(f64::NAN, |a| a.lift_slope)
            }
            Self::AirfoilZeroLift(name) => wing
                .airfoils
                .get(name)
                .map_or(f64::NAN, |a| a.alpha_zero_lift_deg),
            Self::AirfoilClMax(name) => wing.airfoils.get(name).map_or(f64::NAN, |a| a.cl_max),
            Self::Span => {
                let (left, right) = wing.span_ends();
                right - left
            }
            Self::Taper => tip_over_root(wing),
            Self::Washout => 0.0,
        }
    }

    /// `wing` with the key set to `value` (not validated: the solver does that).
    ///
    /// # Errors
    /// When the key names a station, control or airfoil the wing does not have, or asks a
    /// taper of a wing with a zero root chord.
    pub fn apply(&self, wing: &Wing, value: f64) -> Result<Wing, String> {
        let mut w = wing.clone();
        match self {
            Self::StationChord(n) => station_mut(&mut w, *n)?.chord = value,
            Self::StationTwist(n) => station_mut(&mut w, *n)?.twist_deg = value,
            Self::StationY(n) => station_mut(&mut w, *n)?.y = value,
            Self::ControlDeflection(name) => {
                let known: Vec<&str> = wing.controls.iter().map(|c| c.name.as_str()).collect();
                let control = w
                    .controls
                    .iter_mut()
                    .find(|c| &c.name == name)
                    .ok_or_else(|| missing("control", name, &known))?;
                control.deflection_deg = value;
            }
            Self::AirfoilLiftSlope(name)
            | Self::AirfoilZeroLift(name)
            | Self::AirfoilClMax(name) => {
                let known: Vec<&str> = wing.airfoils.keys().map(String::as_str).collect();
                let airfoil = w
                    .airfoils
                    .get_mut(name)
                    .ok_or_else(|| missing("airfoil", name, &known))?;
                match self {
                    Self::AirfoilLiftSlope(_) => airfoil.lift_slope = value,
                    Self::AirfoilZeroLift(_) => airfoil.alpha_zero_lift_deg = value,
                    _ => airfoil.cl_max = value,
                }
            }
            Self::Span => scale_span(&mut w, value / self.current(wing)),
            Self::Taper => retaper(&mut w, value)?,
            Self::Washout => add_washout(&mut w, value),
        }
        Ok(w)
    }
}

fn missing(what: &str, name: &str, known: &[&str]) -> String {
    let hint = did_you_mean(name, known).map_or_else(
        || format!(" (the wing has: {})", known.join(", ")),
        |s| format!(" (did you mean `{s}`?)"),
    );
    format!("--vary: the wing has no {what} `{name}`{hint}")
}

fn station_mut(wing: &mut Wing, n: usize) -> Result<&mut crate::wing::Station, String> {
    let count = wing.stations.len();
    wing.stations
        .get_mut(n - 1)
        .ok_or_else(|| format!("--vary: station {n}: the wing has stations 1 to {count}"))
}

/// Where y lies between the root (0) and its tip (1), on either half.
fn tip_fraction(wing: &Wing, y: f64) -> f64 {
    let (left, right) = wing.span_ends();
    let tip = if y >= 0.0 { right } else { left };
    if tip == 0.0 {
        0.0
    } else {
        (y / tip).clamp(0.0, 1.0)
    }
}

fn tip_over_root(wing: &Wing) -> f64 {
    let root = wing.section_at(0.0).chord;
    wing.stations.last().map_or(f64::NAN, |s| s.chord) / root
}

fn scale_span(wing: &mut Wing, factor: f64) {
    for s in &mut wing.stations {
        s.y *= factor;
    }
    for c in &mut wing.controls {
        c.y_inner *= factor;
        c.y_outer *= factor;
    }
}

/// Chords scaled by 1 + (lambda_new/lambda_old - 1) * (y / y_tip): the root kept, the tip
/// chord made `taper` times the root's.
fn retaper(wing: &mut Wing, taper: f64) -> Result<(), String> {
    let old = tip_over_root(wing);
    if !(old.is_finite() && old > 0.0) {
        return Err(
            "--vary taper: the wing's tip or root chord is zero, so its taper cannot be scaled"
                .into(),
        );
    }
    let ratio = taper / old;
    let fractions: Vec<f64> = wing
        .stations
        .iter()
        .map(|s| tip_fraction(wing, s.y))
        .collect();
    for (s, f) in wing.stations.iter_mut().zip(fractions) {
        s.chord *= 1.0 + (ratio - 1.0) * f;
    }
    Ok(())
}

fn add_washout(wing: &mut Wing, washout_deg: f64) {
    let fractions: Vec<f64> = wing
        .stations
        .iter()
        .map(|s| tip_fraction(wing, s.y))
        .collect();
    for (s, f) in wing.stations.iter_mut().zip(fractions) {
        s.twist_deg -= washout_deg * f;
    }
}

/// The numbers of one solved variant.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Row {
    /// Angle of attack, degrees.
    pub alpha_deg: f64,
    /// Lift coefficient.
    pub cl: f64,
    /// Induced drag coefficient.
    pub cdi: f64,
    /// Span efficiency (`None` at zero lift).
    pub e: Option<f64>,
    /// Lift-curve slope, per radian.
    pub cl_alpha: f64,
    /// Total drag coefficient.
    pub cd: f64,
    /// CL/CD (`None` when CD is not above 0).
    pub l_over_d: Option<f64>,
    /// Where the first section stalls, m.
    pub first_stall_y: Option<f64>,
    /// Right-half root bending moment, N m.
    pub root_bending: f64,
    /// Rolling moment coefficient.
    pub cl_roll: f64,
}

/// One variant: its value and its numbers, or why it could not be solved.
#[derive(Debug, Clone, PartialEq)]
pub struct Variant {
    /// The key's value.
    pub value: f64,
    /// The result.
    pub result: Result<Row, String>,
}

/// Solves every variant of `base` along `vary` at `condition`, spread over the cores.
#[must_use]
pub fn run(base: &Wing, vary: &Vary, condition: &Condition, solve: SolveFn) -> Vec<Variant> {
    let threads = std::thread::available_parallelism()
        .map_or(1, NonZeroUsize::get)
        .min(vary.values.len())
        .max(1);
    let chunk = vary.values.len().div_ceil(threads).max(1);
    std::thread::scope(|scope| {
        let parts: Vec<_> = vary
            .values
            .chunks(chunk)
            .map(|part| {
                let handle = scope.spawn(move || {
                    part.iter()
                        .map(|&v| variant(base, &vary.key, v, condition, solve))
                        .collect::<Vec<_>>()
                });
                (part, handle)
            })
            .collect();
        parts
            .into_iter()
            .flat_map(|(part, handle)| {
                handle.join().unwrap_or_else(|_| {
                    part.iter()
                        .map(|&value| Variant {
                            value,
                            result: Err("the solver failed on this variant".into()),
                        })
                        .collect()
                })
            })
            .collect()
    })
}

/// One variant, solved.
#[must_use]
pub fn variant(
    base: &Wing,
    key: &Key,
    value: f64,
    condition: &Condition,
    solve: SolveFn,
) -> Variant {
    let result = key.apply(base, value).and_then(|wing| {
        solve(&wing, condition)
            .map(|s| {
                let c = &s.coefficients;
                Row {
                    alpha_deg: c.alpha_deg,
                    cl: c.cl,
                    cdi: c.cdi,
                    e: c.e,
                    cl_alpha: s.cl_alpha,
                    cd: c.cd,
                    l_over_d: (c.cd > 0.0).then(|| c.cl / c.cd),
                    first_stall_y: s.first_stall.map(|f| f.y),
                    root_bending: s.flight.right_root_bending_moment,
                    cl_roll: c.cl_roll,
                }
            })
            .map_err(|e| e.to_string())
    });
    Variant { value, result }
}
