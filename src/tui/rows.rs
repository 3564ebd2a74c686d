//! Adding and removing rows of a wing's sheets: stations interpolated between neighbours,
//! copies, and the rules that keep a deletion from breaking the wing.

use super::cells::{airfoil_key, Sheet};
use crate::wing::file::tidy;
use crate::wing::{Airfoil, Control, ControlKind, Station, Wing};

/// How a new row is made.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum NewRow {
    /// Interpolated halfway between the selected station and the next one, every property
    /// (the airfoil too: see [`add_row`]), so the wing itself is unchanged.
    Insert,
    /// A copy of the selected row (for a station: its values, placed halfway to a neighbour).
    Duplicate,
}

/// Adds a row after `row`; returns the new row's index.
///
/// # Errors
/// Why no row can be added there: a sheet without rows to add to, or a station between two
/// different table airfoils (see [`halfway_airfoil`]).
pub fn add_row(wing: &mut Wing, sheet: Sheet, row: usize, how: NewRow) -> Result<usize, String> {
    match sheet {
        Sheet::Stations => add_station(wing, row, how),
        _ => add_other(wing, sheet, row, how)
            .ok_or_else(|| format!("cannot add a row to {}", sheet.name())),
    }
}

fn add_other(wing: &mut Wing, sheet: Sheet, row: usize, how: NewRow) -> Option<usize> {
    match sheet {
        Sheet::Stations | Sheet::Condition => None,
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

fn add_station(wing: &mut Wing, row: usize, how: NewRow) -> Result<usize, String> {
    let n = wing.stations.len();
    if n < 2 {
        return Err("cannot add a row to stations".into());
    }
    // Between `row` and the next; the tip station pairs with the one inboard of it.
    let a = row.min(n - 2);
    let (p, q) = (wing.stations[a].clone(), wing.stations[a + 1].clone());
    let mid = |u: f64, v: f64| tidy(0.5 * (u + v));
    let station = match how {
        NewRow::Insert => Station {
            y: mid(p.y, q.y),
            chord: mid(p.chord, q.chord),
            twist_deg: mid(p.twist_deg, q.twist_deg),
            airfoil: halfway_airfoil(wing, &p.airfoil, &q.airfoil)
                .map_err(|why| format!("cannot insert after station {}: {why}", a + 1))?,
            x_le: mid(p.x_le, q.x_le),
            z: mid(p.z, q.z),
        },
        NewRow::Duplicate => Station {
            y: mid(p.y, q.y),
            ..wing.stations[row.min(n - 1)].clone()
        },
    };
    wing.stations.insert(a + 1, station);
    Ok(a + 1)
}

/// The airfoil for a station inserted halfway between stations with airfoils `a` and `b`.
/// Between stations every section property varies linearly, so the section halfway is the
/// even blend of the two: with one airfoil on both sides that is the airfoil itself; else an
/// airfoil `a-b-blend` holding the blend is added (or reused), and the wing is unchanged.
///
/// # Errors
/// When either airfoil is given by a table: the blend of two tables is not a table an airfoil
/// can hold, so no station there can leave the wing as it is.
fn halfway_airfoil(wing: &mut Wing, a: &str, b: &str) -> Result<String, String> {
    if a == b {
        return Ok(a.to_string());
    }
    let (Some(pa), Some(pb)) = (wing.airfoils.get(a), wing.airfoils.get(b)) else {
        return Ok(a.to_string());
    };
    if pa.table.is_some() || pb.table.is_some() {
        return Err(format!(
            "the section between `{a}` and `{b}` blends a table airfoil, which no single \
             airfoil can hold, so a station there would change the wing; insert where one \
             airfoil lies on both sides, or duplicate (D) and set its airfoil"
        ));
    }
    let blend = blend(pa, pb);
    let base = format!("{a}-{b}-blend");
    let key = std::iter::once(base.clone())
        .chain((2..).map(|n| format!("{base}-{n}")))
        .find(|k| wing.airfoils.get(k).is_none_or(|f| *f == blend))
        .unwrap_or(base);
    wing.airfoils.insert(key.clone(), blend);
    Ok(key)
}

/// The even blend of two airfoils, property by property (the rule between stations).
fn blend(a: &Airfoil, b: &Airfoil) -> Airfoil {
    let mid = |u: f64, v: f64| tidy(0.5 * (u + v));
    Airfoil {
        lift_slope: mid(a.lift_slope, b.lift_slope),
        alpha_zero_lift_deg: mid(a.alpha_zero_lift_deg, b.alpha_zero_lift_deg),
        cl_max: mid(a.cl_max, b.cl_max),
        cd0: mid(a.cd0, b.cd0),
        cd1: mid(a.cd1, b.cd1),
        cd2: mid(a.cd2, b.cd2),
        cm0: mid(a.cm0, b.cm0),
        table: None,
    }
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
