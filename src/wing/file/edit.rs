//! Saving a wing into the text of the file it came from: only the values that differ are
//! rewritten, so the user's comments, blank lines and key order stay.

use std::path::Path;

use toml_edit::{ArrayOfTables, DocumentMut, Item, Key, Table, Value};

use super::{parse, to_toml};
use crate::wing::{Airfoil, Condition, Control, Station, Wing};

/// `original` (a wing file's text) changed to describe `wing`: values that differ are
/// replaced in place (keeping a trailing comment and its column), stations and controls added
/// or removed, airfoils added, removed or renamed, the condition switched between alpha and a
/// target CL. Text that does not parse as a wing, or an edit that would not read back as
/// `wing`, gives [`to_toml`] instead.
#[must_use]
pub fn edit_toml(original: &str, wing: &Wing) -> String {
    let edited = (|| {
        let old = parse(original, Path::new("original.toml")).ok()?;
        let mut doc: DocumentMut = original.parse().ok()?;
        edit(&mut doc, &old, wing)?;
        let text = doc.to_string();
        let again = parse(&text, Path::new("edited.toml")).ok()?;
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
    tables(root, "station", &old.stations, &new.stations, station)?;
    airfoils(root, old, new)?;
    tables(root, "control", &old.controls, &new.controls, control)?;
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

/// For each new item, the old item whose table it takes over (`None`: a new table). Equal
/// items are matched first (a longest common subsequence); between two matches the rest pair
/// up in order, so an edited row keeps its table and comments, an inserted one gets a new one.
fn align<T: PartialEq>(old: &[T], new: &[T]) -> Vec<Option<usize>> {
    let (n, m) = (old.len(), new.len());
    let mut common = vec![vec![0_usize; m + 1]; n + 1];
    for i in (0..n).rev() {
        for j in (0..m).rev() {
            common[i][j] = if old[i] == new[j] {
                common[i + 1][j + 1] + 1
            } else {
                common[i + 1][j].max(common[i][j + 1])
            };
        }
    }
    let mut matches = Vec::new();
    let (mut i, mut j) = (0, 0);
    while i < n && j < m {
        if old[i] == new[j] {
            matches.push((i, j));
            i += 1;
            j += 1;
        } else if common[i + 1][j] >= common[i][j + 1] {
            i += 1;
        } else {
            j += 1;
        }
    }
    matches.push((n, m));
    let mut out = vec![None; m];
    let (mut from_old, mut from_new) = (0, 0);
    for (mi, mj) in matches {
        for (k, slot) in out[from_new..mj].iter_mut().enumerate() {
            *slot = (from_old + k < mi).then_some(from_old + k);
        }
        if mj < m {
            out[mj] = Some(mi);
        }
        (from_old, from_new) = (mi + 1, mj + 1);
    }
    out
}

/// Rewrites the array of tables `key` (`[[station]]`, `[[control]]`) for `new`, reusing the
/// table of each aligned old item and writing `fields` into it.
fn tables<T: PartialEq>(
    root: &mut Table,
    key: &str,
    old: &[T],
    new: &[T],
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
    for (item, from) in new.iter().zip(align(old, new)) {
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
    put(t, "lift_slope", old.map(|o| o.lift_slope), new.lift_slope);
    let zero_lift = (old.map(|o| o.alpha_zero_lift_deg), new.alpha_zero_lift_deg);
    put(t, "alpha_zero_lift", zero_lift.0, zero_lift.1);
    put(t, "cl_max", old.map(|o| o.cl_max), new.cl_max);
    put(t, "cd0", old.map(|o| o.cd0), new.cd0);
    put(t, "cd1", Some(old.map_or(0.0, |o| o.cd1)), new.cd1);
    put(t, "cd2", Some(old.map_or(0.0, |o| o.cd2)), new.cd2);
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
            rename(t, "alpha", "cl");
            put(t, "cl", None, cl);
        }
        (Some(_), None) => {
            rename(t, "cl", "alpha");
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
    fn alignment_matches_equal_rows_and_pairs_the_rest_in_order() {
        assert_eq!(align(&[1, 2, 3], &[1, 2, 3]), [Some(0), Some(1), Some(2)]);
        assert_eq!(align(&[1, 3], &[1, 2, 3]), [Some(0), None, Some(1)]);
        assert_eq!(align(&[1, 2, 3], &[1, 3]), [Some(0), Some(2)]);
        assert_eq!(align(&[1, 2, 3], &[1, 9, 3]), [Some(0), Some(1), Some(2)]);
        assert_eq!(align(&[1, 2], &[7, 8, 2]), [Some(0), None, Some(1)]);
        assert_eq!(align::<i32>(&[], &[4]), [None]);
    }

    #[test]
    fn a_comment_keeps_its_column() {
        assert_eq!(keep_comment_column("   # m", 4, 3), "    # m");
        assert_eq!(keep_comment_column(" # m", 3, 8), " # m");
        assert_eq!(keep_comment_column("", 3, 8), "");
    }
}
