//! Adding and removing rows of a wing's sheets: stations interpolated between neighbours,
//! copies, and the rules that keep a deletion from breaking the wing.

use super::cells::{airfoil_key, Sheet};
use crate::wing::{Airfoil, Control, ControlKind, Station, Wing};

/// How a new row is made.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum NewRow {
    /// Interpolated halfway between the selected station and the next one.
    Insert,
    /// A copy of the selected row (for a station: its values, placed halfway to a neighbour).
    Duplicate,
}

/// Adds a row after `row`; returns the new row's index, or `None` when the sheet has no rows
/// to add to.
pub fn add_row(wing: &mut Wing, sheet: Sheet, row: usize, how: NewRow) -> Option<usize> {
    match sheet {
        Sheet::Stations => add_station(wing, row, how),
        Sheet::Airfoils => {
            let key = airfoil_key(wing, row)?.to_string();
            let airfoil: Airfoil = wing.airfoils.get(&key).cloned().unwrap_or_default();
            let new_key = (2..)
                .map(|n| format!("{key}-{n}"))
                .find(|k| !wing.airfoils.contains_key(k))?;
            wing.airfoils.insert(new_key.clone(), airfoil);
            wing.airfoils.keys().position(|k| *k == new_key)
        }
        Sheet::Controls => {
            let control = match (how, wing.controls.get(row)) {
                (NewRow::Duplicate, Some(c)) => c.clone(),
                _ => default_control(wing),
            };
            let at = (row + 1).min(wing.controls.len());
            wing.controls.insert(at, control);
            Some(at)
        }
        Sheet::Condition => None,
    }
}

fn default_control(wing: &Wing) -> Control {
    let tip = wing.span_ends().1.max(0.0);
    Control {
        name: format!("control {}", wing.controls.len() + 1),
        kind: ControlKind::Aileron,
        y_inner: 0.6 * tip,
        y_outer: 0.95 * tip,
        chord_fraction: 0.25,
        deflection_deg: 0.0,
        effectiveness: None,
    }
}

fn add_station(wing: &mut Wing, row: usize, how: NewRow) -> Option<usize> {
    let n = wing.stations.len();
    if n < 2 {
        return None;
    }
    // Between `row` and the next; the tip station pairs with the one inboard of it.
    let a = row.min(n - 2);
    let (p, q) = (&wing.stations[a], &wing.stations[a + 1]);
    let mid = |u: f64, v: f64| 0.5 * (u + v);
    let station = match how {
        NewRow::Insert => Station {
            y: mid(p.y, q.y),
            chord: mid(p.chord, q.chord),
            twist_deg: mid(p.twist_deg, q.twist_deg),
            airfoil: p.airfoil.clone(),
            x_le: mid(p.x_le, q.x_le),
            z: mid(p.z, q.z),
        },
        NewRow::Duplicate => Station {
            y: mid(p.y, q.y),
            ..wing.stations[row.min(n - 1)].clone()
        },
    };
    wing.stations.insert(a + 1, station);
    Some(a + 1)
}

/// Fewest stations a wing can have.
pub const MIN_STATIONS: usize = 2;

/// Removes a row.
///
/// # Errors
/// Why the row cannot go, in the user's terms: nothing to delete, the last two stations, an
/// airfoil that stations still use.
pub fn remove_row(wing: &mut Wing, sheet: Sheet, row: usize) -> Result<(), String> {
    match sheet {
        Sheet::Stations if row < wing.stations.len() => {
            if wing.stations.len() <= MIN_STATIONS {
                return Err(format!(
                    "cannot delete: a wing needs at least {MIN_STATIONS} stations"
                ));
            }
            wing.stations.remove(row);
            Ok(())
        }
        Sheet::Airfoils => {
            let key = airfoil_key(wing, row)
                .ok_or("no airfoil to delete")?
                .to_string();
            let users: Vec<String> = (1..)
                .zip(&wing.stations)
                .filter(|(_, s)| s.airfoil == key)
                .map(|(i, _)| i.to_string())
                .collect();
            if !users.is_empty() {
                let (who, verb) = if users.len() == 1 {
                    ("station", "uses")
                } else {
                    ("stations", "use")
                };
                return Err(format!(
                    "cannot delete airfoil `{key}`: {who} {} {verb} it; give them another first",
                    users.join(", ")
                ));
            }
            wing.airfoils.remove(&key);
            Ok(())
        }
        Sheet::Controls if row < wing.controls.len() => {
            wing.controls.remove(row);
            Ok(())
        }
        Sheet::Condition => Err("the condition has no rows to delete".into()),
        _ => Err(format!("nothing to delete in {}", sheet.name())),
    }
}
