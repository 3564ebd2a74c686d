//! The editable grid over a wing: which panes (sheets) there are, their columns, how a cell
//! reads, parses and nudges. The app and the views share this one description.

use crate::text::fit_number;
mod fields;

pub use fields::{Field, FieldSpec, Value, SPECS};

use crate::wing::Wing;

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
            Field::Cm0,
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

/// A numeric field's value at a row (`None` for text, past the last row, or unset).
fn number(wing: &Wing, row: usize, field: Field) -> Option<f64> {
    match field.spec().value {
        Value::Number { get, .. } | Value::Optional { get, .. } => get(wing, row),
        Value::Text { .. } => None,
    }
}

fn text_value(wing: &Wing, row: usize, field: Field) -> Option<String> {
    match field.spec().value {
        Value::Text { get, .. } => get(wing, row),
        Value::Number { .. } | Value::Optional { .. } => None,
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
    fit_number(v, field.spec().digits, usize::from(field.width()))
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
    let input = input.trim();
    match field.spec().value {
        Value::Text { set, .. } => {
            if input.is_empty() && field != Field::Name {
                return Err("must not be empty".into());
            }
            set(wing, row, input)
        }
        Value::Optional {
            set,
            empty_unsets: true,
            ..
        } if input.is_empty() => {
            if let Some(slot) = set(wing, row) {
                *slot = None;
            }
            Ok(())
        }
        Value::Number { .. } | Value::Optional { .. } => {
            set_number(wing, row, field, parse_number(input)?);
            Ok(())
        }
    }
}

fn set_number(wing: &mut Wing, row: usize, field: Field, v: f64) {
    match field.spec().value {
        Value::Number { set, .. } => {
            if let Some(slot) = set(wing, row) {
                *slot = v;
            }
        }
        Value::Optional { set, .. } => {
            if let Some(slot) = set(wing, row) {
                *slot = Some(v);
            }
        }
        Value::Text { .. } => {}
    }
}

/// Why a table airfoil's derived field cannot be changed in the workbench.
pub const TABLE_FIELD: &str =
    "comes from the airfoil's table (read-only here; edit the table in the file)";

/// True for a table airfoil's fields that its table gives (read-only here: only cl_max is
/// the user's own).
#[must_use]
pub fn from_table(wing: &Wing, row: usize, field: Field) -> bool {
    field.spec().from_table && fields::airfoil(wing, row).is_some_and(|a| a.table.is_some())
}

/// Moves a value by `steps` small steps (numbers), or to the next/previous choice (airfoil,
/// kind). Returns false when the cell cannot be nudged.
pub fn nudge(wing: &mut Wing, row: usize, field: Field, steps: i32) -> bool {
    if from_table(wing, row, field) {
        return false;
    }
    let base = match field.spec().value {
        Value::Text { cycle, .. } => return cycle.is_some_and(|cycle| cycle(wing, row, steps)),
        Value::Number { get, .. } => get(wing, row),
        Value::Optional {
            get, unset_value, ..
        } => get(wing, row).or_else(|| unset_value(wing, row)),
    };
    let step = field.step();
    set_number(
        wing,
        row,
        field,
        on_grid(base.unwrap_or(0.0) + f64::from(steps) * step, step),
    );
    true
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

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_field_table_is_in_field_order() {
        for (i, (field, spec)) in Field::ALL.iter().zip(&SPECS).enumerate() {
            assert_eq!(spec.field, *field, "row {i}");
            assert_eq!(*field as usize, i);
        }
    }

    /// Every field of every sheet: its editor text sets back to the same wing, and a number
    /// written to it is read back from it and changes nothing else.
    #[test]
    fn every_field_reads_back_what_it_sets_and_touches_nothing_else() {
        let mut wing = crate::tui::starter::wing();
        wing.condition.target_cl = Some(0.5);
        wing.controls
            .push(crate::verify::wings::aileron(0.5, 0.9, 0.25, 5.0));
        for sheet in Sheet::ALL {
            for field in columns(&wing, sheet, true) {
                for row in 0..rows(&wing, sheet) {
                    let mut copy = wing.clone();
                    set(&mut copy, row, field, &edit_text(&wing, row, field)).expect("sets");
                    assert_eq!(copy, wing, "{field:?} row {row}");
                    if field.is_text() {
                        continue;
                    }
                    set(&mut copy, row, field, "0.123").expect("sets");
                    assert_eq!(number(&copy, row, field), Some(0.123), "{field:?}");
                    set(&mut copy, row, field, &edit_text(&wing, row, field)).expect("sets");
                    assert_eq!(copy, wing, "{field:?} row {row} touched another value");
                }
            }
        }
    }

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
