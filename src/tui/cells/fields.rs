//! The field table: one row per editable quantity with its key, heading, width, step,
//! digits, unit and how it is read and written. Every consumer (the cells, the table view,
//! the condition bar, the app's messages) reads it, so a field is described once.

use super::airfoil_key;
use crate::wing::{Airfoil, Control, ControlKind, Station, Wing};

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
    Cm0,
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
    /// Every field, in the order of [`SPECS`].
    pub const ALL: [Self; 25] = [
        Self::Y,
        Self::Chord,
        Self::Twist,
        Self::Airfoil,
        Self::XLe,
        Self::Z,
        Self::AirfoilKey,
        Self::LiftSlope,
        Self::AlphaZeroLift,
        Self::ClMax,
        Self::Cd0,
        Self::Cd1,
        Self::Cd2,
        Self::Cm0,
        Self::Name,
        Self::Kind,
        Self::YInner,
        Self::YOuter,
        Self::ChordFraction,
        Self::Deflection,
        Self::Effectiveness,
        Self::Alpha,
        Self::TargetCl,
        Self::Speed,
        Self::Altitude,
    ];

    /// This field's row of the field table.
    #[must_use]
    pub const fn spec(self) -> &'static FieldSpec {
        &SPECS[self as usize]
    }

    /// The wing-file key, as used by the validation rules.
    #[must_use]
    pub const fn key(self) -> &'static str {
        self.spec().key
    }

    /// Column heading (with the unit where the column has room for it).
    #[must_use]
    pub const fn title(self) -> &'static str {
        self.spec().title
    }

    /// Display width of the column.
    #[must_use]
    pub const fn width(self) -> u16 {
        self.spec().width
    }

    /// The small nudge step; the large step is ten of these.
    #[must_use]
    pub const fn step(self) -> f64 {
        self.spec().step
    }

    /// The unit of the value ("" for a number without one, or text).
    #[must_use]
    pub const fn unit(self) -> &'static str {
        self.spec().unit
    }

    /// Fields holding text rather than a number.
    #[must_use]
    pub const fn is_text(self) -> bool {
        matches!(self.spec().value, Value::Text { .. })
    }
}

/// How a field's value is read from and written to a wing, at a row of its sheet.
#[derive(Clone, Copy)]
pub enum Value {
    /// A number that is always there.
    Number {
        /// The value at a row (`None` past the last row).
        get: fn(&Wing, usize) -> Option<f64>,
        /// Where the value at a row lives.
        set: fn(&mut Wing, usize) -> Option<&mut f64>,
    },
    /// A number the wing may leave unset.
    Optional {
        /// The value at a row, when set.
        get: fn(&Wing, usize) -> Option<f64>,
        /// Where the value at a row lives.
        set: fn(&mut Wing, usize) -> Option<&mut Option<f64>>,
        /// Whether empty input unsets it.
        empty_unsets: bool,
        /// What the solver uses while it is unset (the start of a nudge).
        unset_value: fn(&Wing, usize) -> Option<f64>,
    },
    /// Text.
    Text {
        /// The text at a row.
        get: fn(&Wing, usize) -> Option<String>,
        /// Sets the text at a row (trimmed, non-empty unless the field allows it).
        set: fn(&mut Wing, usize, &str) -> Result<(), String>,
        /// Steps to the next or previous choice, where there are choices.
        cycle: Option<fn(&mut Wing, usize, i32) -> bool>,
    },
}

/// One row of the field table: everything the app, the views and the editor know about a
/// field.
#[derive(Clone, Copy)]
pub struct FieldSpec {
    /// The field.
    pub field: Field,
    /// The wing-file key.
    pub key: &'static str,
    /// Column heading.
    pub title: &'static str,
    /// Column width.
    pub width: u16,
    /// Small nudge step.
    pub step: f64,
    /// Decimals shown in the table.
    pub digits: usize,
    /// Unit of the value.
    pub unit: &'static str,
    /// True for the airfoil fields a table airfoil's data gives (read-only in the workbench).
    pub from_table: bool,
    /// How the value is read and written.
    pub value: Value,
}

const fn spec(
    field: Field,
    (key, title, unit): (&'static str, &'static str, &'static str),
    (width, step, digits): (u16, f64, usize),
    value: Value,
) -> FieldSpec {
    FieldSpec {
        field,
        key,
        title,
        width,
        step,
        digits,
        unit,
        from_table: false,
        value,
    }
}

/// An airfoil field that a table airfoil's data gives.
const fn tabulated(spec: FieldSpec) -> FieldSpec {
    FieldSpec {
        from_table: true,
        ..spec
    }
}

fn station(w: &Wing, row: usize) -> Option<&Station> {
    w.stations.get(row)
}

fn station_mut(w: &mut Wing, row: usize) -> Option<&mut Station> {
    w.stations.get_mut(row)
}

pub(super) fn airfoil(w: &Wing, row: usize) -> Option<&Airfoil> {
    airfoil_key(w, row).and_then(|k| w.airfoils.get(k))
}

fn airfoil_mut(w: &mut Wing, row: usize) -> Option<&mut Airfoil> {
    w.airfoils.values_mut().nth(row)
}

fn control(w: &Wing, row: usize) -> Option<&Control> {
    w.controls.get(row)
}

fn control_mut(w: &mut Wing, row: usize) -> Option<&mut Control> {
    w.controls.get_mut(row)
}

/// The field table, in the order of [`Field::ALL`] (a test checks it).
pub const SPECS: [FieldSpec; 25] = [
    spec(
        Field::Y,
        ("y", "y m", "m"),
        (7, 0.01, 3),
        Value::Number {
            get: |w, r| station(w, r).map(|s| s.y),
            set: |w, r| station_mut(w, r).map(|s| &mut s.y),
        },
    ),
    spec(
        Field::Chord,
        ("chord", "chord m", "m"),
        (7, 0.01, 3),
        Value::Number {
            get: |w, r| station(w, r).map(|s| s.chord),
            set: |w, r| station_mut(w, r).map(|s| &mut s.chord),
        },
    ),
    spec(
        Field::Twist,
        ("twist", "twist", "deg"),
        (6, 0.1, 2),
        Value::Number {
            get: |w, r| station(w, r).map(|s| s.twist_deg),
            set: |w, r| station_mut(w, r).map(|s| &mut s.twist_deg),
        },
    ),
    spec(
        Field::Airfoil,
        ("airfoil", "airfoil", ""),
        (9, 1.0, 0),
        Value::Text {
            get: |w, r| station(w, r).map(|s| s.airfoil.clone()),
            set: |w, r, t| {
                if let Some(s) = station_mut(w, r) {
                    s.airfoil = t.to_string();
                }
                Ok(())
            },
            cycle: Some(cycle_airfoil),
        },
    ),
    spec(
        Field::XLe,
        ("x_le", "x_le m", "m"),
        (7, 0.01, 3),
        Value::Number {
            get: |w, r| station(w, r).map(|s| s.x_le),
            set: |w, r| station_mut(w, r).map(|s| &mut s.x_le),
        },
    ),
    spec(
        Field::Z,
        ("z", "z m", "m"),
        (7, 0.01, 3),
        Value::Number {
            get: |w, r| station(w, r).map(|s| s.z),
            set: |w, r| station_mut(w, r).map(|s| &mut s.z),
        },
    ),
    spec(
        Field::AirfoilKey,
        ("key", "airfoil", ""),
        (9, 1.0, 0),
        Value::Text {
            get: |w, r| airfoil_key(w, r).map(str::to_string),
            set: rename_airfoil,
            cycle: None,
        },
    ),
    tabulated(spec(
        Field::LiftSlope,
        ("lift_slope", "a0/rad", "/rad"),
        (7, 0.05, 3),
        Value::Number {
            get: |w, r| airfoil(w, r).map(|a| a.lift_slope),
            set: |w, r| airfoil_mut(w, r).map(|a| &mut a.lift_slope),
        },
    )),
    tabulated(spec(
        Field::AlphaZeroLift,
        ("alpha_zero_lift", "a_L0", "deg"),
        (6, 0.1, 2),
        Value::Number {
            get: |w, r| airfoil(w, r).map(|a| a.alpha_zero_lift_deg),
            set: |w, r| airfoil_mut(w, r).map(|a| &mut a.alpha_zero_lift_deg),
        },
    )),
    spec(
        Field::ClMax,
        ("cl_max", "cl_max", ""),
        (7, 0.01, 3),
        Value::Number {
            get: |w, r| airfoil(w, r).map(|a| a.cl_max),
            set: |w, r| airfoil_mut(w, r).map(|a| &mut a.cl_max),
        },
    ),
    tabulated(spec(
        Field::Cd0,
        ("cd0", "cd0", ""),
        (7, 0.0005, 4),
        Value::Number {
            get: |w, r| airfoil(w, r).map(|a| a.cd0),
            set: |w, r| airfoil_mut(w, r).map(|a| &mut a.cd0),
        },
    )),
    tabulated(spec(
        Field::Cd1,
        ("cd1", "cd1", ""),
        (7, 0.0005, 4),
        Value::Number {
            get: |w, r| airfoil(w, r).map(|a| a.cd1),
            set: |w, r| airfoil_mut(w, r).map(|a| &mut a.cd1),
        },
    )),
    tabulated(spec(
        Field::Cd2,
        ("cd2", "cd2", ""),
        (7, 0.0005, 4),
        Value::Number {
            get: |w, r| airfoil(w, r).map(|a| a.cd2),
            set: |w, r| airfoil_mut(w, r).map(|a| &mut a.cd2),
        },
    )),
    tabulated(spec(
        Field::Cm0,
        ("cm0", "cm0", ""),
        (7, 0.005, 4),
        Value::Number {
            get: |w, r| airfoil(w, r).map(|a| a.cm0),
            set: |w, r| airfoil_mut(w, r).map(|a| &mut a.cm0),
        },
    )),
    spec(
        Field::Name,
        ("name", "name", ""),
        (9, 1.0, 0),
        Value::Text {
            get: |w, r| control(w, r).map(|c| c.name.clone()),
            set: |w, r, t| {
                if let Some(c) = control_mut(w, r) {
                    c.name = t.to_string();
                }
                Ok(())
            },
            cycle: None,
        },
    ),
    spec(
        Field::Kind,
        ("kind", "kind", ""),
        (7, 1.0, 0),
        Value::Text {
            get: |w, r| control(w, r).map(|c| c.kind.as_str().to_string()),
            set: set_kind,
            cycle: Some(cycle_kind),
        },
    ),
    spec(
        Field::YInner,
        ("y_inner", "y_in m", "m"),
        (7, 0.01, 3),
        Value::Number {
            get: |w, r| control(w, r).map(|c| c.y_inner),
            set: |w, r| control_mut(w, r).map(|c| &mut c.y_inner),
        },
    ),
    spec(
        Field::YOuter,
        ("y_outer", "y_out m", "m"),
        (7, 0.01, 3),
        Value::Number {
            get: |w, r| control(w, r).map(|c| c.y_outer),
            set: |w, r| control_mut(w, r).map(|c| &mut c.y_outer),
        },
    ),
    spec(
        Field::ChordFraction,
        ("chord_fraction", "cf/c", ""),
        (6, 0.01, 3),
        Value::Number {
            get: |w, r| control(w, r).map(|c| c.chord_fraction),
            set: |w, r| control_mut(w, r).map(|c| &mut c.chord_fraction),
        },
    ),
    spec(
        Field::Deflection,
        ("deflection", "defl", "deg"),
        (6, 0.5, 2),
        Value::Number {
            get: |w, r| control(w, r).map(|c| c.deflection_deg),
            set: |w, r| control_mut(w, r).map(|c| &mut c.deflection_deg),
        },
    ),
    // Unset, the solver uses the thin-airfoil value; empty input returns to it.
    spec(
        Field::Effectiveness,
        ("effectiveness", "eff", ""),
        (7, 0.01, 3),
        Value::Optional {
            get: |w, r| control(w, r).and_then(|c| c.effectiveness),
            set: |w, r| control_mut(w, r).map(|c| &mut c.effectiveness),
            empty_unsets: true,
            unset_value: |w, r| control(w, r).map(crate::solver::controls::effectiveness),
        },
    ),
    spec(
        Field::Alpha,
        ("alpha", "alpha deg", "deg"),
        (7, 0.1, 2),
        Value::Number {
            get: |w, _| Some(w.condition.alpha_deg),
            set: |w, _| Some(&mut w.condition.alpha_deg),
        },
    ),
    spec(
        Field::TargetCl,
        ("cl", "target CL", ""),
        (7, 0.01, 3),
        Value::Optional {
            get: |w, _| w.condition.target_cl,
            set: |w, _| Some(&mut w.condition.target_cl),
            empty_unsets: false,
            unset_value: |_, _| None,
        },
    ),
    spec(
        Field::Speed,
        ("speed", "speed m/s", "m/s"),
        (7, 1.0, 1),
        Value::Number {
            get: |w, _| Some(w.condition.speed),
            set: |w, _| Some(&mut w.condition.speed),
        },
    ),
    spec(
        Field::Altitude,
        ("altitude", "altitude m", "m"),
        (7, 100.0, 1),
        Value::Number {
            get: |w, _| Some(w.condition.altitude),
            set: |w, _| Some(&mut w.condition.altitude),
        },
    ),
];

fn set_kind(wing: &mut Wing, row: usize, input: &str) -> Result<(), String> {
    let kind = match input {
        "flap" => ControlKind::Flap,
        "aileron" => ControlKind::Aileron,
        other => return Err(format!("`{other}` is not `flap` or `aileron`")),
    };
    if let Some(c) = control_mut(wing, row) {
        c.kind = kind;
    }
    Ok(())
}

fn cycle_kind(wing: &mut Wing, row: usize, _steps: i32) -> bool {
    let Some(c) = control_mut(wing, row) else {
        return false;
    };
    c.kind = match c.kind {
        ControlKind::Flap => ControlKind::Aileron,
        ControlKind::Aileron => ControlKind::Flap,
    };
    true
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
