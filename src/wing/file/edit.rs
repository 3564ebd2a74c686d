//! Saving a wing into the text of the file it came from: only the values that differ are
//! rewritten, so the user's comments, blank lines and key order stay.

use std::path::Path;

use toml_edit::{ArrayOfTables, DocumentMut, Item, Key, Table, Value};

use align::align;

mod align;

use super::{parse_with, to_toml};
use crate::wing::table::{SectionTable, TableSource};
use crate::wing::{Airfoil, Condition, Control, Station, Wing};

/// `text` (a wing file from folder `from`) with every airfoil's `table = "FILE.csv"` rewritten
/// for a file saved in folder `to`, so a wing saved elsewhere still finds its CSV tables:
/// relative to `to` when the CSV lies below it, else as an absolute path. Comments are kept.
#[must_use]
pub fn rebase_tables(text: &str, from: &Path, to: &Path) -> String {
    let Ok(mut doc) = text.parse::<DocumentMut>() else {
        return text.to_owned();
    };
    let to = to.canonicalize().unwrap_or_else(|_| to.to_path_buf());
    let Some(airfoils) = doc.get_mut("airfoil").and_then(Item::as_table_like_mut) else {
        return text.to_owned();
    };
    let mut changed = false;
    for (_, airfoil) in airfoils.iter_mut() {
        let Some(value) = airfoil
            .as_table_like_mut()
            .and_then(|t| t.get_mut("table"))
            .and_then(Item::as_value_mut)
        else {
            continue;
        };
        let Some(named) = value.as_str().map(Path::new) else {
            continue;
        };
        if named.is_absolute() {
            continue;
        }
        let csv = from.join(named);
        let csv = csv.canonicalize().unwrap_or(csv);
        let new = csv.strip_prefix(&to).unwrap_or(&csv).display().to_string();
        let decor = value.decor().clone();
        *value = Value::from(new);
        *value.decor_mut() = decor;
        changed = true;
    }
    if changed {
        doc.to_string()
    } else {
        text.to_owned()
    }
}

/// `original` (a wing file's text) changed to describe `wing`: values that differ are
/// replaced in place (keeping a trailing comment and its column), stations and controls added
/// or removed, airfoils added, removed or renamed, the condition switched between alpha and a
/// target CL. Text that does not parse as a wing, or an edit that would not read back as
/// `wing`, gives [`to_toml`] instead.
#[must_use]
pub fn edit_toml(original: &str, wing: &Wing) -> String {
    // The wing's own tables stand in for the CSV files the text names: the text is read here
    // without knowing where it lives.
    let known: Vec<_> = wing
        .airfoils
        .values()
        .filter_map(|a| a.table.clone())
        .collect();
    let parse = |text: &str, path: &str| parse_with(text, Path::new(path), &known);
    let edited = (|| {
        let old = parse(original, "original.toml").ok()?;
        let mut doc: DocumentMut = original.parse().ok()?;
        edit(&mut doc, &old, wing)?;
        let text = doc.to_string();
        let again = parse(&text, "edited.toml").ok()?;
        (again == as_written(wing)).then_some(text)
    })();
    edited.unwrap_or_else(|| to_toml(wing))
}

/// The wing as a file holds it: with a target CL the file has no alpha, so it reads back as
/// the default.
fn as_written(wing: &Wing) -> Wing {
    let mut w = wing.clone();
    if w.condition.target_cl.is_some() {
        w.condition.alpha_deg = Condition::default().alpha_deg;
    }
    w
}

fn edit(doc: &mut DocumentMut, old: &Wing, new: &Wing) -> Option<()> {
    let root = doc.as_table_mut();
    put(root, "name", Some(old.name.as_str()), new.name.as_str());
    put(root, "symmetric", Some(old.symmetric), new.symmetric);
    let stations = (old.stations.as_slice(), new.stations.as_slice());
    tables(root, "station", stations, same_station, station)?;
    airfoils(root, old, new)?;
    let controls = (old.controls.as_slice(), new.controls.as_slice());
    tables(root, "control", controls, same_control, control)?;
    condition(root, &old.condition, &new.condition)
}

/// Sets `key` to `new` unless `old` (the file's value, `None` for a table being written
/// afresh) already equals it. A replaced value keeps its decoration: the comment after it
/// stays, at the same column where the new value leaves room.
fn put<T>(table: &mut Table, key: &str, old: Option<T>, new: T)
where
    T: PartialEq + Into<Value>,
{
    if old.is_some_and(|o| o == new) {
        return;
    }
    let mut value: Value = new.into();
    match table.get_mut(key) {
        Some(Item::Value(current)) => {
            *value.decor_mut() = current.decor().clone();
            let (was, now) = (bare_len(current), bare_len(&value));
            if let Some(suffix) = value.decor().suffix().and_then(|s| s.as_str()) {
                let suffix = keep_comment_column(suffix, was, now);
                value.decor_mut().set_suffix(suffix);
            }
            *current = value;
        }
        _ => {
            table.insert(key, Item::Value(value));
        }
    }
}

/// Characters of a value as written, without what surrounds it.
fn bare_len(value: &Value) -> usize {
    let mut bare = value.clone();
    bare.decor_mut().clear();
    bare.to_string().chars().count()
}

/// The spaces before a trailing comment, widened or narrowed by the change in the value's
/// length so the comment keeps its column (at least one space stays).
fn keep_comment_column(suffix: &str, was: usize, now: usize) -> String {
    let spaces = suffix.len() - suffix.trim_start_matches(' ').len();
    let rest = &suffix[spaces..];
    if !rest.starts_with('#') {
        return suffix.to_string();
    }
    let spaces = (spaces + was).saturating_sub(now).max(1);
    format!("{}{rest}", " ".repeat(spaces))
}

/// Two stations are the same row edited when they sit at the same place along the span or
/// keep everything but one of their values.
fn same_station(a: &Station, b: &Station) -> bool {
    let kept = [
        a.y == b.y,
        a.chord == b.chord,
        a.twist_deg == b.twist_deg,
        a.airfoil == b.airfoil,
    ];
    a.y == b.y || kept.iter().filter(|k| **k).count() >= 3
}

/// Two controls are the same row edited when they keep their name.
fn same_control(a: &Control, b: &Control) -> bool {
    a.name == b.name
}

/// Every number of the wing rounded to 15 significant digits, the most a double always holds,
/// so a value a step of arithmetic left a hair off (0.5800000000000001 from halving
/// 0.56 + 0.6) is written as the shortest decimal that reads back as it (0.58). Changes a
/// value by at most half a unit in the 15th digit.
#[must_use]
pub fn tidy_numbers(wing: &Wing) -> Wing {
    let mut w = wing.clone();
    for s in &mut w.stations {
        for v in [
            &mut s.y,
            &mut s.chord,
            &mut s.twist_deg,
            &mut s.x_le,
            &mut s.z,
        ] {
            *v = tidy(*v);
        }
    }
    for a in w.airfoils.values_mut() {
        if a.table.is_some() {
            // The rest is the table's own fit, read back exactly as it is.
            a.cl_max = tidy(a.cl_max);
            continue;
        }
        for v in [
            &mut a.lift_slope,
            &mut a.alpha_zero_lift_deg,
            &mut a.cl_max,
            &mut a.cd0,
            &mut a.cd1,
            &mut a.cd2,
            &mut a.cm0,
        ] {
            *v = tidy(*v);
        }
    }
    for c in &mut w.controls {
        for v in [
            &mut c.y_inner,
            &mut c.y_outer,
            &mut c.chord_fraction,
            &mut c.deflection_deg,
        ] {
            *v = tidy(*v);
        }
        c.effectiveness = c.effectiveness.map(tidy);
    }
    let k = &mut w.condition;
    for v in [&mut k.alpha_deg, &mut k.speed, &mut k.altitude] {
        *v = tidy(*v);
    }
    k.target_cl = k.target_cl.map(tidy);
    w
}

/// `v` rounded to 15 significant digits (non-finite values as they are).
#[must_use]
pub fn tidy(v: f64) -> f64 {
    if v.is_finite() {
        format!("{v:.14e}").parse().unwrap_or(v)
    } else {
        v
    }
}

/// Rewrites the array of tables `key` (`[[station]]`, `[[control]]`) for `new`, reusing the
/// table of each aligned old item and writing `fields` into it.
fn tables<T: PartialEq>(
    root: &mut Table,
    key: &str,
    (old, new): (&[T], &[T]),
    like: fn(&T, &T) -> bool,
    fields: fn(&mut Table, Option<&T>, &T),
) -> Option<()> {
    if old == new {
        return Some(());
    }
    // Taken out of its slot, not removed: the key keeps its place among the others, and with
    // it the place where new tables print.
    let slot = root.entry(key).or_insert(Item::None);
    let mut existing: Vec<Option<Table>> = match std::mem::take(slot) {
        Item::ArrayOfTables(a) => a.into_iter().map(Some).collect(),
        Item::None => Vec::new(),
        _ => return None,
    };
    if existing.len() != old.len() {
        return None;
    }
    let mut array = ArrayOfTables::new();
    for (item, from) in new.iter().zip(align(old, new, like)) {
        let reused = from.and_then(|i| Some((existing.get_mut(i)?.take()?, &old[i])));
        let (mut table, before) = match reused {
            Some((table, before)) => (table, Some(before)),
            None => (fresh_table(), None),
        };
        fields(&mut table, before, item);
        array.push(table);
    }
    if array.is_empty() {
        root.remove(key);
    } else {
        *slot = Item::ArrayOfTables(array);
    }
    Some(())
}

/// A table written anew, after a blank line like the rest of the file format.
fn fresh_table() -> Table {
    let mut table = Table::new();
    table.decor_mut().set_prefix("\n");
    table
}

fn station(t: &mut Table, old: Option<&Station>, new: &Station) {
    put(t, "y", old.map(|o| o.y), new.y);
    put(t, "chord", old.map(|o| o.chord), new.chord);
    put(t, "twist", old.map(|o| o.twist_deg), new.twist_deg);
    put(
        t,
        "airfoil",
        old.map(|o| o.airfoil.clone()),
        new.airfoil.clone(),
    );
    // Offsets are left out of a new table while they are zero, as in a written file.
    put(t, "x_le", Some(old.map_or(0.0, |o| o.x_le)), new.x_le);
    put(t, "z", Some(old.map_or(0.0, |o| o.z)), new.z);
}

fn control(t: &mut Table, old: Option<&Control>, new: &Control) {
    put(t, "name", old.map(|o| o.name.clone()), new.name.clone());
    put(t, "kind", old.map(|o| o.kind.as_str()), new.kind.as_str());
    put(t, "y_inner", old.map(|o| o.y_inner), new.y_inner);
    put(t, "y_outer", old.map(|o| o.y_outer), new.y_outer);
    let fraction = (old.map(|o| o.chord_fraction), new.chord_fraction);
    put(t, "chord_fraction", fraction.0, fraction.1);
    put(
        t,
        "deflection",
        old.map(|o| o.deflection_deg),
        new.deflection_deg,
    );
    match new.effectiveness {
        Some(e) => put(t, "effectiveness", old.and_then(|o| o.effectiveness), e),
        None => {
            t.remove("effectiveness");
        }
    }
}

fn airfoil_fields(t: &mut Table, old: Option<&Airfoil>, new: &Airfoil) {
    if let Some(table) = &new.table {
        table_fields(t, old, new, table);
        return;
    }
    put(t, "lift_slope", old.map(|o| o.lift_slope), new.lift_slope);
    let zero_lift = (old.map(|o| o.alpha_zero_lift_deg), new.alpha_zero_lift_deg);
    put(t, "alpha_zero_lift", zero_lift.0, zero_lift.1);
    put(t, "cl_max", old.map(|o| o.cl_max), new.cl_max);
    put(t, "cd0", old.map(|o| o.cd0), new.cd0);
    put(t, "cd1", Some(old.map_or(0.0, |o| o.cd1)), new.cd1);
    put(t, "cd2", Some(old.map_or(0.0, |o| o.cd2)), new.cd2);
    put(t, "cm0", Some(old.map_or(0.0, |o| o.cm0)), new.cm0);
}

/// A table airfoil: its table is written only into a fresh `[airfoil.*]` table (the
/// workbench cannot edit the rows), as the file it was read from or as inline arrays; cl_max
/// only when it differs from what the file already gives (the table's largest cl when unset).
fn table_fields(t: &mut Table, old: Option<&Airfoil>, new: &Airfoil, table: &SectionTable) {
    let old = old.filter(|o| o.table.is_some());
    if old.is_none() {
        match &table.source {
            TableSource::File(name) => put(t, "table", None, name.as_str()),
            TableSource::Inline => {
                let c = table.columns();
                let arrays = [("alpha", Some(&c.alpha_deg)), ("cl", Some(&c.cl))];
                let rest = [("cd", Some(&c.cd)), ("cm", c.cm.as_ref())];
                for (key, values) in arrays.into_iter().chain(rest) {
                    if let Some(values) = values {
                        let array: toml_edit::Array = values.iter().copied().collect();
                        t.insert(key, Item::Value(Value::Array(array)));
                    }
                }
            }
        }
    }
    let was = old.map_or_else(|| table.largest_cl(), |o| o.cl_max);
    put(t, "cl_max", Some(was), new.cl_max);
}

/// The `[airfoil.*]` tables: edited in place, removed, added at the end; one removed and one
/// added at once is a rename and keeps its table.
fn airfoils(root: &mut Table, old: &Wing, new: &Wing) -> Option<()> {
    if old.airfoils == new.airfoils {
        return Some(());
    }
    let parent = root.get_mut("airfoil")?.as_table_mut()?;
    let gone: Vec<&String> = old
        .airfoils
        .keys()
        .filter(|k| !new.airfoils.contains_key(*k))
        .collect();
    let added: Vec<&String> = new
        .airfoils
        .keys()
        .filter(|k| !old.airfoils.contains_key(*k))
        .collect();
    if let ([from], [to]) = (gone.as_slice(), added.as_slice()) {
        rename(parent, from, to);
    } else {
        for key in &gone {
            parent.remove(key.as_str());
        }
    }
    for (key, airfoil) in &new.airfoils {
        let before = old
            .airfoils
            .get(key)
            .or_else(|| (gone.len() == 1 && added.len() == 1).then(|| &old.airfoils[gone[0]]));
        if parent.get(key).is_none() {
            parent.insert(key, Item::Table(fresh_table()));
        }
        let table = parent.get_mut(key)?.as_table_mut()?;
        airfoil_fields(table, before, airfoil);
    }
    Some(())
}

/// Renames `from` to `to` in place: the entry keeps its position, its decoration and the
/// column of its trailing comment.
fn rename(table: &mut Table, from: &str, to: &str) {
    let keys: Vec<String> = table.iter().map(|(k, _)| k.to_string()).collect();
    for k in keys {
        if let Some((key, mut item)) = table.remove_entry(&k) {
            let key = if k == from {
                let decor = match &mut item {
                    Item::Value(v) => Some(v.decor_mut()),
                    Item::Table(t) => Some(t.decor_mut()),
                    _ => None,
                };
                if let Some(decor) = decor {
                    if let Some(suffix) = decor.suffix().and_then(|s| s.as_str()) {
                        let suffix = keep_comment_column(suffix, from.len(), to.len());
                        decor.set_suffix(suffix);
                    }
                }
                Key::new(to)
                    .with_leaf_decor(key.leaf_decor().clone())
                    .with_dotted_decor(key.dotted_decor().clone())
            } else {
                key
            };
            table.insert_formatted(&key, item);
        }
    }
}

/// Renames the condition's `from` to `to` in place, dropping the comments written about the
/// old quantity (the one after its value and those on the lines just above it): a note on an
/// angle of attack says nothing true about a target CL.
fn switch_key(t: &mut Table, from: &str, to: &str) {
    rename(t, from, to);
    if let Some(mut key) = t.key_mut(to) {
        let indent = key
            .leaf_decor()
            .prefix()
            .and_then(|p| p.as_str())
            .map(|p| p.rsplit('\n').next().unwrap_or("").to_string());
        let kept = indent.filter(|i| i.trim().is_empty()).unwrap_or_default();
        key.leaf_decor_mut().set_prefix(kept);
    }
    if let Some(Item::Value(v)) = t.get_mut(to) {
        v.decor_mut().set_suffix("");
    }
}

/// `[condition]`: alpha or cl (a switch renames the one key to the other), speed, altitude,
/// roll rate.
fn condition(root: &mut Table, old: &Condition, new: &Condition) -> Option<()> {
    if old == new {
        return Some(());
    }
    if root.get("condition").is_none() {
        root.insert("condition", Item::Table(fresh_table()));
    }
    let t = root.get_mut("condition")?.as_table_mut()?;
    match (old.target_cl, new.target_cl) {
        (None, Some(cl)) => {
            switch_key(t, "alpha", "cl");
            put(t, "cl", None, cl);
        }
        (Some(_), None) => {
            switch_key(t, "cl", "alpha");
            put(t, "alpha", None, new.alpha_deg);
        }
        (Some(was), Some(cl)) => put(t, "cl", Some(was), cl),
        (None, None) => put(t, "alpha", Some(old.alpha_deg), new.alpha_deg),
    }
    put(t, "speed", Some(old.speed), new.speed);
    put(t, "altitude", Some(old.altitude), new.altitude);
    put(t, "roll_rate", Some(old.roll_rate), new.roll_rate);
    Some(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn numbers_are_tidied_to_the_shortest_decimal_that_reads_back() {
        assert_eq!(format!("{}", tidy(0.5 * (0.56 + 0.6))), "0.58");
        assert_eq!(tidy(0.1 + 0.2).to_string(), "0.3");
        assert_eq!(tidy(1.0 / 3.0).to_string(), "0.333333333333333");
        assert!(tidy(f64::NAN).is_nan());
    }

    #[test]
    fn a_comment_keeps_its_column() {
        assert_eq!(keep_comment_column("   # m", 4, 3), "    # m");
        assert_eq!(keep_comment_column(" # m", 3, 8), " # m");
        assert_eq!(keep_comment_column("", 3, 8), "");
    }
}
