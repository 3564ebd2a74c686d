//! The editable grid over a wing: which panes (sheets) there are, their columns, how a cell
//! reads, parses and nudges. The app and the views share this one description.

use crate::text::fit_number;
use crate::wing::{ControlKind, Wing};

/// A pane of cells.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Sheet {
    /// One row per station.
    Stations,
    /// One row per airfoil.
    Airfoils,
    /// One row per control surface.
    Controls,
    /// The condition bar (one row).
    Condition,
}

impl Sheet {
    /// Order of the focus cycle.
    pub const ALL: [Self; 4] = [
        Self::Stations,
        Self::Airfoils,
        Self::Controls,
        Self::Condition,
    ];

    /// The name used on screen and in sessions.
    #[must_use]
    pub const fn name(self) -> &'static str {
        match self {
            Self::Stations => "stations",
            Self::Airfoils => "airfoils",
            Self::Controls => "controls",
            Self::Condition => "condition",
        }
    }

    /// The sheet with this name (stations for anything unknown).
    #[must_use]
    pub fn from_name(name: &str) -> Self {
        Self::ALL
            .into_iter()
            .find(|s| s.name() == name)
            .unwrap_or(Self::Stations)
    }

    /// The next (`forward`) or previous sheet in the focus cycle.
    #[must_use]
    pub fn cycle(self, forward: bool) -> Self {
        let i = Self::ALL.iter().position(|s| *s == self).unwrap_or(0);
        let n = Self::ALL.len();
        Self::ALL[if forward {
            (i + 1) % n
        } else {
            (i + n - 1) % n
        }]
    }
}

/// One editable quantity.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
#[allow(
    missing_docs,
    reason = "the variants are the wing-file keys named in `key`"
)]
pub enum Field {
    Y,
    Chord,
    Twist,
    Airfoil,
    XLe,
    Z,
    AirfoilKey,
    LiftSlope,
    AlphaZeroLift,
    ClMax,
    Cd0,
    Cd1,
    Cd2,
    Name,
    Kind,
    YInner,
    YOuter,
    ChordFraction,
    Deflection,
    Effectiveness,
    Alpha,
    TargetCl,
    Speed,
    Altitude,
}

impl Field {
    /// The wing-file key, as used by the validation rules.
    #[must_use]
    pub const fn key(self) -> &'static str {
        match self {
            Self::Y => "y",
            Self::Chord => "chord",
            Self::Twist => "twist",
            Self::Airfoil => "airfoil",
            Self::XLe => "x_le",
            Self::Z => "z",
            Self::AirfoilKey => "key",
            Self::LiftSlope => "lift_slope",
            Self::AlphaZeroLift => "alpha_zero_lift",
            Self::ClMax => "cl_max",
            Self::Cd0 => "cd0",
            Self::Cd1 => "cd1",
            Self::Cd2 => "cd2",
            Self::Name => "name",
            Self::Kind => "kind",
            Self::YInner => "y_inner",
            Self::YOuter => "y_outer",
            Self::ChordFraction => "chord_fraction",
            Self::Deflection => "deflection",
            Self::Effectiveness => "effectiveness",
            Self::Alpha => "alpha",
            Self::TargetCl => "cl",
            Self::Speed => "speed",
            Self::Altitude => "altitude",
        }
    }

    /// Column heading with unit (the key itself where that says it all).
    #[must_use]
    pub const fn title(self) -> &'static str {
        match self {
            Self::Y => "y m",
            Self::Chord => "chord m",
            Self::AirfoilKey => "airfoil",
            Self::XLe => "x_le m",
            Self::Z => "z m",
            Self::LiftSlope => "a0/rad",
            Self::AlphaZeroLift => "a_L0",
            Self::Twist
            | Self::Airfoil
            | Self::ClMax
            | Self::Cd0
            | Self::Cd1
            | Self::Cd2
            | Self::Name
            | Self::Kind => self.key(),
            Self::YInner => "y_in m",
            Self::YOuter => "y_out m",
            Self::ChordFraction => "cf/c",
            Self::Deflection => "defl",
            Self::Effectiveness => "eff",
            Self::Alpha => "alpha deg",
            Self::TargetCl => "target CL",
            Self::Speed => "speed m/s",
            Self::Altitude => "altitude m",
        }
    }

    /// Display width of the column.
    #[must_use]
    pub const fn width(self) -> u16 {
        match self {
            Self::Airfoil | Self::AirfoilKey | Self::Name => 9,
            Self::Kind => 7,
            Self::Twist | Self::AlphaZeroLift | Self::ChordFraction | Self::Deflection => 6,
            _ => 7,
        }
    }

    /// The small nudge step; the large step is ten of these.
    #[must_use]
    pub const fn step(self) -> f64 {
        match self {
            Self::Y | Self::Chord | Self::XLe | Self::Z | Self::YInner | Self::YOuter => 0.01,
            Self::Twist | Self::AlphaZeroLift | Self::Alpha => 0.1,
            Self::Deflection => 0.5,
            Self::LiftSlope => 0.05,
            Self::ClMax | Self::ChordFraction | Self::Effectiveness | Self::TargetCl => 0.01,
            Self::Cd0 | Self::Cd1 | Self::Cd2 => 0.0005,
            Self::Speed => 1.0,
            Self::Altitude => 100.0,
            Self::Airfoil | Self::AirfoilKey | Self::Name | Self::Kind => 1.0,
        }
    }

    /// Fields holding text rather than a number.
    #[must_use]
    pub const fn is_text(self) -> bool {
        matches!(
            self,
            Self::Airfoil | Self::AirfoilKey | Self::Name | Self::Kind
        )
    }
}

/// The columns of a sheet. `offsets` adds x_le and z to the stations; the condition bar
/// shows target CL instead of alpha when the wing has one.
#[must_use]
pub fn columns(wing: &Wing, sheet: Sheet, offsets: bool) -> Vec<Field> {
    match sheet {
        Sheet::Stations if offsets => vec![
            Field::Y,
            Field::Chord,
            Field::Twist,
            Field::Airfoil,
            Field::XLe,
            Field::Z,
        ],
        Sheet::Stations => vec![Field::Y, Field::Chord, Field::Twist, Field::Airfoil],
        Sheet::Airfoils => vec![
            Field::AirfoilKey,
            Field::LiftSlope,
            Field::AlphaZeroLift,
            Field::ClMax,
            Field::Cd0,
            Field::Cd1,
            Field::Cd2,
        ],
        Sheet::Controls => vec![
            // Deflection next to the kind: the number a designer changes most, so it is
            // in view at 80 columns.
            Field::Name,
            Field::Kind,
            Field::Deflection,
            Field::YInner,
            Field::YOuter,
            Field::ChordFraction,
            Field::Effectiveness,
        ],
        Sheet::Condition => {
            let first = if wing.condition.target_cl.is_some() {
                Field::TargetCl
            } else {
                Field::Alpha
            };
            vec![first, Field::Speed, Field::Altitude]
        }
    }
}

/// True when any station has a leading-edge offset or height, so those columns matter.
#[must_use]
pub fn offsets_used(wing: &Wing) -> bool {
    wing.stations.iter().any(|s| s.x_le != 0.0 || s.z != 0.0)
}

/// Number of rows in a sheet.
#[must_use]
pub fn rows(wing: &Wing, sheet: Sheet) -> usize {
    match sheet {
        Sheet::Stations => wing.stations.len(),
        Sheet::Airfoils => wing.airfoils.len(),
        Sheet::Controls => wing.controls.len(),
        Sheet::Condition => 1,
    }
}

/// The airfoil key in row `row` of the airfoil sheet.
#[must_use]
pub fn airfoil_key(wing: &Wing, row: usize) -> Option<&str> {
    wing.airfoils.keys().nth(row).map(String::as_str)
}

fn number(wing: &Wing, row: usize, field: Field) -> Option<f64> {
    let s = wing.stations.get(row);
    let a = airfoil_key(wing, row).and_then(|k| wing.airfoils.get(k));
    let c = wing.controls.get(row);
    let cond = &wing.condition;
    match field {
        Field::Y => s.map(|s| s.y),
        Field::Chord => s.map(|s| s.chord),
        Field::Twist => s.map(|s| s.twist_deg),
        Field::XLe => s.map(|s| s.x_le),
        Field::Z => s.map(|s| s.z),
        Field::LiftSlope => a.map(|a| a.lift_slope),
        Field::AlphaZeroLift => a.map(|a| a.alpha_zero_lift_deg),
        Field::ClMax => a.map(|a| a.cl_max),
        Field::Cd0 => a.map(|a| a.cd0),
        Field::Cd1 => a.map(|a| a.cd1),
        Field::Cd2 => a.map(|a| a.cd2),
        Field::YInner => c.map(|c| c.y_inner),
        Field::YOuter => c.map(|c| c.y_outer),
        Field::ChordFraction => c.map(|c| c.chord_fraction),
        Field::Deflection => c.map(|c| c.deflection_deg),
        Field::Effectiveness => c.and_then(|c| c.effectiveness),
        Field::Alpha => Some(cond.alpha_deg),
        Field::TargetCl => cond.target_cl,
        Field::Speed => Some(cond.speed),
        Field::Altitude => Some(cond.altitude),
        Field::Airfoil | Field::AirfoilKey | Field::Name | Field::Kind => None,
    }
}

fn text_value(wing: &Wing, row: usize, field: Field) -> Option<String> {
    match field {
        Field::Airfoil => wing.stations.get(row).map(|s| s.airfoil.clone()),
        Field::AirfoilKey => airfoil_key(wing, row).map(str::to_string),
        Field::Name => wing.controls.get(row).map(|c| c.name.clone()),
        Field::Kind => wing.controls.get(row).map(|c| c.kind.as_str().to_string()),
        _ => None,
    }
}

/// A cell as shown in the table (rounded; raw text, to be cleaned before drawing).
#[must_use]
pub fn display(wing: &Wing, row: usize, field: Field) -> String {
    if field.is_text() {
        return text_value(wing, row, field).unwrap_or_default();
    }
    let Some(v) = number(wing, row, field) else {
        return "-".into();
    };
    let decimals = match field {
        Field::Cd0 | Field::Cd1 | Field::Cd2 => 4,
        Field::Speed | Field::Altitude => 1,
        Field::Twist | Field::AlphaZeroLift | Field::Deflection | Field::Alpha => 2,
        _ => 3,
    };
    fit_number(v, decimals, usize::from(field.width()))
}

/// A cell's full-precision text, to start the editor with.
#[must_use]
pub fn edit_text(wing: &Wing, row: usize, field: Field) -> String {
    if field.is_text() {
        return text_value(wing, row, field).unwrap_or_default();
    }
    number(wing, row, field).map_or_else(String::new, short_exact)
}

/// The shortest decimal that reads back as `v` to ten significant digits, so the editor
/// opens on `0.3`, not `0.30000000000000004`, and on `0.5191`, not sixteen digits.
#[must_use]
pub fn short_exact(v: f64) -> String {
    let close = |t: &str| {
        t.parse::<f64>()
            .is_ok_and(|r| (r - v).abs() <= 1e-10 * v.abs().max(f64::MIN_POSITIVE))
    };
    (0..=12)
        .map(|p| format!("{v:.p$}"))
        .find(|t| close(t))
        .unwrap_or_else(|| format!("{v}"))
}

fn parse_number(input: &str) -> Result<f64, String> {
    let t = input.trim();
    t.parse::<f64>()
        .ok()
        .filter(|v| v.is_finite())
        .ok_or_else(|| format!("`{t}` is not a number"))
}

/// Sets a cell from typed text. Only parsing is checked here; the wing rules are checked by
/// the caller on the edited copy.
///
/// # Errors
/// A short reason when the text is not a value for this field.
pub fn set(wing: &mut Wing, row: usize, field: Field, input: &str) -> Result<(), String> {
    if from_table(wing, row, field) {
        return Err(TABLE_FIELD.into());
    }
    if field.is_text() {
        return set_text(wing, row, field, input.trim());
    }
    if field == Field::Effectiveness && input.trim().is_empty() {
        if let Some(c) = wing.controls.get_mut(row) {
            c.effectiveness = None;
        }
        return Ok(());
    }
    let v = parse_number(input)?;
    set_number(wing, row, field, v);
    Ok(())
}

fn set_number(wing: &mut Wing, row: usize, field: Field, v: f64) {
    let key = airfoil_key(wing, row).map(str::to_string);
    let s = wing.stations.get_mut(row);
    let a = key.and_then(|k| wing.airfoils.get_mut(&k));
    let c = wing.controls.get_mut(row);
    let cond = &mut wing.condition;
    let slot = match field {
        Field::Y => s.map(|s| &mut s.y),
        Field::Chord => s.map(|s| &mut s.chord),
        Field::Twist => s.map(|s| &mut s.twist_deg),
        Field::XLe => s.map(|s| &mut s.x_le),
        Field::Z => s.map(|s| &mut s.z),
        Field::LiftSlope => a.map(|a| &mut a.lift_slope),
        Field::AlphaZeroLift => a.map(|a| &mut a.alpha_zero_lift_deg),
        Field::ClMax => a.map(|a| &mut a.cl_max),
        Field::Cd0 => a.map(|a| &mut a.cd0),
        Field::Cd1 => a.map(|a| &mut a.cd1),
        Field::Cd2 => a.map(|a| &mut a.cd2),
        Field::YInner => c.map(|c| &mut c.y_inner),
        Field::YOuter => c.map(|c| &mut c.y_outer),
        Field::ChordFraction => c.map(|c| &mut c.chord_fraction),
        Field::Deflection => c.map(|c| &mut c.deflection_deg),
        Field::Effectiveness => c.map(|c| c.effectiveness.insert(v)),
        Field::Alpha => Some(&mut cond.alpha_deg),
        Field::TargetCl => Some(cond.target_cl.insert(v)),
        Field::Speed => Some(&mut cond.speed),
        Field::Altitude => Some(&mut cond.altitude),
        Field::Airfoil | Field::AirfoilKey | Field::Name | Field::Kind => None,
    };
    if let Some(slot) = slot {
        *slot = v;
    }
}

fn set_text(wing: &mut Wing, row: usize, field: Field, input: &str) -> Result<(), String> {
    if input.is_empty() && field != Field::Name {
        return Err("must not be empty".into());
    }
    match field {
        Field::Airfoil => {
            if let Some(s) = wing.stations.get_mut(row) {
                s.airfoil = input.to_string();
            }
        }
        Field::AirfoilKey => rename_airfoil(wing, row, input)?,
        Field::Name => {
            if let Some(c) = wing.controls.get_mut(row) {
                c.name = input.to_string();
            }
        }
        Field::Kind => {
            let kind = match input {
                "flap" => ControlKind::Flap,
                "aileron" => ControlKind::Aileron,
                other => return Err(format!("`{other}` is not `flap` or `aileron`")),
            };
            if let Some(c) = wing.controls.get_mut(row) {
                c.kind = kind;
            }
        }
        _ => {}
    }
    Ok(())
}

/// Renames an airfoil and every station that uses it.
fn rename_airfoil(wing: &mut Wing, row: usize, new: &str) -> Result<(), String> {
    let Some(old) = airfoil_key(wing, row).map(str::to_string) else {
        return Ok(());
    };
    if old == new {
        return Ok(());
    }
    if wing.airfoils.contains_key(new) {
        return Err(format!("an airfoil `{new}` already exists"));
    }
    if let Some(a) = wing.airfoils.remove(&old) {
        wing.airfoils.insert(new.to_string(), a);
    }
    for s in wing.stations.iter_mut().filter(|s| s.airfoil == old) {
        s.airfoil = new.to_string();
    }
    Ok(())
}

/// Why a table airfoil's derived field cannot be changed in the workbench.
pub const TABLE_FIELD: &str =
    "comes from the airfoil's table (read-only here; edit the table in the file)";

/// True for a table airfoil's fields that its table gives (read-only here: only cl_max is
/// the user's own).
#[must_use]
pub fn from_table(wing: &Wing, row: usize, field: Field) -> bool {
    let derived = matches!(
        field,
        Field::LiftSlope | Field::AlphaZeroLift | Field::Cd0 | Field::Cd1 | Field::Cd2
    );
    derived
        && airfoil_key(wing, row)
            .and_then(|k| wing.airfoils.get(k))
            .is_some_and(|a| a.table.is_some())
}

/// Moves a value by `steps` small steps (numbers), or to the next/previous choice (airfoil,
/// kind). Returns false when the cell cannot be nudged.
pub fn nudge(wing: &mut Wing, row: usize, field: Field, steps: i32) -> bool {
    if from_table(wing, row, field) {
        return false;
    }
    match field {
        Field::Airfoil => cycle_airfoil(wing, row, steps),
        Field::Kind => {
            let Some(c) = wing.controls.get_mut(row) else {
                return false;
            };
            c.kind = match c.kind {
                ControlKind::Flap => ControlKind::Aileron,
                ControlKind::Aileron => ControlKind::Flap,
            };
            true
        }
        Field::AirfoilKey | Field::Name => false,
        _ => {
            // An unset effectiveness starts from the thin-airfoil value the solver uses.
            let base = number(wing, row, field)
                .or_else(|| {
                    let c = wing.controls.get(row)?;
                    (field == Field::Effectiveness)
                        .then(|| crate::solver::controls::effectiveness(c))
                })
                .unwrap_or(0.0);
            let v = on_grid(base + f64::from(steps) * field.step(), field.step());
            set_number(wing, row, field, v);
            true
        }
    }
}

/// `v` rounded to a multiple of `step`, as the nearest double to that decimal (so a nudged
/// 6.0 + 0.1 is 6.1, not 6.1000000000000005, on screen, in the editor and in a saved file).
/// Steps below 1 are fractions 1/k with k whole, so dividing by k rounds only once.
fn on_grid(v: f64, step: f64) -> f64 {
    if step >= 1.0 {
        (v / step).round() * step
    } else {
        let per = (1.0 / step).round();
        (v * per).round() / per
    }
}

fn cycle_airfoil(wing: &mut Wing, row: usize, steps: i32) -> bool {
    let keys: Vec<String> = wing.airfoils.keys().cloned().collect();
    let Some(s) = wing.stations.get_mut(row) else {
        return false;
    };
    if keys.is_empty() {
        return false;
    }
    let n = i64::try_from(keys.len()).unwrap_or(1);
    let i = keys.iter().position(|k| *k == s.airfoil).unwrap_or(0);
    let next = (i64::try_from(i).unwrap_or(0) + i64::from(steps.signum())).rem_euclid(n);
    s.airfoil = keys[usize::try_from(next).unwrap_or(0)].clone();
    true
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn long_numbers_fit_their_cells_without_a_chopped_digit() {
        let mut wing = crate::tui::starter::wing();
        wing.stations[1].y = -999.999;
        wing.stations[1].chord = 1000.0;
        for (field, v) in [(Field::Y, -999.999), (Field::Chord, 1000.0)] {
            let shown = display(&wing, 1, field);
            assert!(
                shown.chars().count() <= usize::from(field.width()),
                "{shown}"
            );
            let back: f64 = shown.parse().expect("a whole number");
            assert!((back - v).abs() <= 0.01 * v.abs(), "{shown} for {v}");
        }
    }
}
