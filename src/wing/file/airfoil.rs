//! Reading one `[airfoil.KEY]` table: linear parameters, inline arrays, or a CSV file named
//! relative to the wing file.

use std::path::{Path, PathBuf};
use std::sync::Arc;

use serde::Deserialize;
use toml::Spanned;

use super::locate::{one_line, Locator};
use super::{take, take_or, Spans, WingFileError};
use crate::wing::table::{self, Columns, SectionTable, TableProblem, TableSource};
use crate::wing::validate::Place;
use crate::wing::Airfoil;

/// Largest CSV table file read (far more than any section polar needs).
const MAX_CSV_BYTES: u64 = 1 << 20;

type Array = Spanned<Vec<Spanned<f64>>>;

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
pub(super) struct RawAirfoil {
    lift_slope: Option<Spanned<f64>>,
    alpha_zero_lift: Option<Spanned<f64>>,
    cl_max: Option<Spanned<f64>>,
    cd0: Option<Spanned<f64>>,
    cd1: Option<Spanned<f64>>,
    cd2: Option<Spanned<f64>>,
    cm0: Option<Spanned<f64>>,
    table: Option<Spanned<String>>,
    alpha: Option<Array>,
    cl: Option<Array>,
    cd: Option<Array>,
    cm: Option<Array>,
}

/// Where a wing file's tables come from: tables already read (by the name the file gives
/// them, so a save can re-read its own text without the disk), else files beside the wing.
pub(super) struct TableFiles<'a> {
    /// The wing file's folder.
    pub(super) folder: PathBuf,
    /// Tables already in memory.
    pub(super) known: &'a [Arc<SectionTable>],
}

impl TableFiles<'_> {
    fn known(&self, name: &str) -> Option<Arc<SectionTable>> {
        let wanted = TableSource::File(name.to_string());
        self.known.iter().find(|t| t.source == wanted).cloned()
    }
}

/// Everything needed to read one airfoil and report where it is wrong.
pub(super) struct Reader<'a, 'b> {
    pub(super) spans: &'a mut Spans,
    pub(super) locate: &'a Locator<'b>,
    pub(super) files: &'a TableFiles<'b>,
}

impl Reader<'_, '_> {
    /// The airfoil of `[airfoil.KEY]`.
    pub(super) fn airfoil(
        &mut self,
        key: &str,
        raw: Spanned<RawAirfoil>,
    ) -> Result<Airfoil, WingFileError> {
        let place = Place::Airfoil(key.to_string());
        let header = raw.span().start;
        self.spans.tables.insert(place.clone(), header);
        let a = raw.into_inner();
        let table_keys = [
            ("table", a.table.as_ref().map(Spanned::span)),
            ("alpha", a.alpha.as_ref().map(Spanned::span)),
            ("cl", a.cl.as_ref().map(Spanned::span)),
            ("cd", a.cd.as_ref().map(Spanned::span)),
            ("cm", a.cm.as_ref().map(Spanned::span)),
        ];
        if !table_keys.iter().any(|(_, s)| s.is_some()) {
            return self.linear(&place, header, a);
        }
        let linear_keys = [
            ("lift_slope", a.lift_slope.as_ref().map(Spanned::span)),
            (
                "alpha_zero_lift",
                a.alpha_zero_lift.as_ref().map(Spanned::span),
            ),
            ("cd0", a.cd0.as_ref().map(Spanned::span)),
            ("cd1", a.cd1.as_ref().map(Spanned::span)),
            ("cd2", a.cd2.as_ref().map(Spanned::span)),
            ("cm0", a.cm0.as_ref().map(Spanned::span)),
        ];
        if let Some((field, Some(span))) = linear_keys.into_iter().find(|(_, s)| s.is_some()) {
            let reason = "not used with a table: the table gives the section data".to_string();
            return Err(self.locate.at(span.start, &place, field, reason));
        }
        if let (Some(_), Some((field, Some(span)))) =
            (&a.table, table_keys[1..].iter().find(|(_, s)| s.is_some()))
        {
            let reason = "give `table = \"FILE.csv\"` or inline arrays, not both".to_string();
            return Err(self.locate.at(span.start, &place, field, reason));
        }
        let cl_max = a.cl_max.map(|v| take(self.spans, &place, "cl_max", v));
        let table = match a.table {
            Some(name) => self.csv_table(&place, name)?,
            None => self.inline_table(&place, header, a.alpha, a.cl, a.cd, a.cm)?,
        };
        Ok(Airfoil::from_table(table, cl_max))
    }

    fn linear(
        &mut self,
        place: &Place,
        header: usize,
        a: RawAirfoil,
    ) -> Result<Airfoil, WingFileError> {
        let missing = |field: &str| {
            self.locate
                .at(header, place, field, "missing (required)".to_string())
        };
        let lift_slope = a.lift_slope.ok_or_else(|| missing("lift_slope"))?;
        let alpha_zero_lift = a
            .alpha_zero_lift
            .ok_or_else(|| missing("alpha_zero_lift"))?;
        let cl_max = a.cl_max.ok_or_else(|| missing("cl_max"))?;
        let cd0 = a.cd0.ok_or_else(|| missing("cd0"))?;
        let spans = &mut *self.spans;
        Ok(Airfoil {
            lift_slope: take(spans, place, "lift_slope", lift_slope),
            alpha_zero_lift_deg: take(spans, place, "alpha_zero_lift", alpha_zero_lift),
            cl_max: take(spans, place, "cl_max", cl_max),
            cd0: take(spans, place, "cd0", cd0),
            cd1: take_or(spans, place, "cd1", a.cd1, 0.0),
            cd2: take_or(spans, place, "cd2", a.cd2, 0.0),
            cm0: take_or(spans, place, "cm0", a.cm0, 0.0),
            table: None,
        })
    }

    /// `alpha = [...]`, `cl = [...]`, `cd = [...]`, optional `cm = [...]`; a problem points
    /// at the offending value, or at the array as a whole.
    fn inline_table(
        &self,
        place: &Place,
        header: usize,
        alpha: Option<Array>,
        cl: Option<Array>,
        cd: Option<Array>,
        cm: Option<Array>,
    ) -> Result<SectionTable, WingFileError> {
        let missing = |field: &str| {
            let reason = "missing (required with inline table arrays)".to_string();
            self.locate.at(header, place, field, reason)
        };
        let alpha = alpha.ok_or_else(|| missing("alpha"))?;
        let cl = cl.ok_or_else(|| missing("cl"))?;
        let cd = cd.ok_or_else(|| missing("cd"))?;
        let arrays = [Some(&alpha), Some(&cl), Some(&cd), cm.as_ref()];
        let values = |a: &Array| a.get_ref().iter().map(|v| *v.get_ref()).collect();
        let columns = Columns {
            alpha_deg: values(&alpha),
            cl: values(&cl),
            cd: values(&cd),
            cm: cm.as_ref().map(values),
        };
        SectionTable::new(TableSource::Inline, columns).map_err(|p| {
            let array = arrays[p.column.index()].unwrap_or(&alpha);
            let offset = p
                .row
                .and_then(|r| array.get_ref().get(r))
                .map_or(array.span().start, |v| v.span().start);
            self.locate.at(offset, place, p.column.key(), p.reason)
        })
    }

    /// `table = "FILE.csv"`: the one file named, relative to the wing file's folder.
    fn csv_table(
        &mut self,
        place: &Place,
        name: Spanned<String>,
    ) -> Result<SectionTable, WingFileError> {
        let at = name.span().start;
        let name = take(self.spans, place, "table", name);
        if let Some(table) = self.files.known(&name) {
            return Ok((*table).clone());
        }
        let path = self.files.folder.join(&name);
        let text = read_csv(&path).map_err(|reason| self.locate.at(at, place, "table", reason))?;
        let csv = table::parse_csv(&text).map_err(|e| WingFileError {
            path: path.clone(),
            line: e.line,
            column: e.column,
            place: one_line(&place.to_string()),
            field: e.field,
            reason: one_line(&e.reason),
        })?;
        let source = TableSource::File(name);
        SectionTable::new(source, csv.columns.clone())
            .map_err(|p| csv_problem(&path, place, &csv, &p))
    }
}

/// The text of a CSV table file, or why it cannot be read.
fn read_csv(path: &Path) -> Result<String, String> {
    let shown = path.display();
    let size = std::fs::metadata(path)
        .map_err(|e| format!("cannot read {shown}: {e}"))?
        .len();
    if size > MAX_CSV_BYTES {
        return Err(format!(
            "{shown} is {size} bytes, more than a table may be ({MAX_CSV_BYTES})"
        ));
    }
    std::fs::read_to_string(path).map_err(|e| format!("cannot read {shown}: {e}"))
}

/// A table rule broken in a CSV file: at the cell, or at the column's header name.
fn csv_problem(
    path: &Path,
    place: &Place,
    csv: &table::CsvTable,
    p: &TableProblem,
) -> WingFileError {
    let row = p.row.and_then(|r| csv.rows.get(r)).unwrap_or(&csv.header);
    let column = row.columns.get(p.column.index()).copied().unwrap_or(1);
    WingFileError {
        path: path.to_path_buf(),
        line: row.line,
        column,
        place: one_line(&place.to_string()),
        field: p.column.key().to_string(),
        reason: one_line(&p.reason),
    }
}
