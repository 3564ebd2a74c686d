//! Reading and writing wing files (TOML). Every error names the file, line:column, the
//! station or table, the field and what is wrong.

use std::collections::{BTreeMap, HashMap};
use std::fmt::Write as _;
use std::ops::Range;
use std::path::{Path, PathBuf};

use serde::Deserialize;
use toml::Spanned;

use super::validate::{self, Place};
use super::{Condition, Control, ControlKind, Reference, Station, Wing};

mod airfoil;
mod edit;
mod locate;

use airfoil::{RawAirfoil, Reader, TableFiles};
pub use edit::{edit_toml, rebase_tables, tidy, tidy_numbers};
use locate::Locator;

/// A wing file that cannot be used, located to the character.
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("{}:{line}:{column}: {place}: {field}: {reason}", path.display())]
pub struct WingFileError {
    /// The file.
    pub path: PathBuf,
    /// 1-based line.
    pub line: usize,
    /// 1-based column (characters).
    pub column: usize,
    /// The station or table, e.g. `station 3`, `airfoil root`.
    pub place: String,
    /// The key, or `toml` for a syntax error.
    pub field: String,
    /// What is wrong.
    pub reason: String,
}

/// Why a wing file could not be used: it could not be read at all, or it was read and is
/// not a valid wing.
#[derive(Debug, thiserror::Error)]
pub enum ReadError {
    /// The file could not be read (missing, a folder, no permission, not UTF-8); there is no
    /// line or column to point at.
    #[error("{}: cannot read: {source}", path.display())]
    Unreadable {
        /// The file.
        path: PathBuf,
        /// What the system said.
        source: std::io::Error,
    },
    /// The file is larger than [`MAX_FILE_BYTES`]: no wing needs that much, and reading it
    /// whole could exhaust memory (a device, a runaway file).
    #[error(
        "{}: cannot read: larger than the {} MiB limit for a wing file",
        path.display(),
        MAX_FILE_BYTES >> 20
    )]
    TooLarge {
        /// The file.
        path: PathBuf,
    },
    /// The text is not a valid wing, located to the character.
    #[error(transparent)]
    Invalid(#[from] WingFileError),
}

/// The largest wing file read: 16 MiB, room for some 200,000 stations.
pub const MAX_FILE_BYTES: u64 = 16 << 20;

/// Reads and validates a wing file.
///
/// # Errors
/// [`ReadError::Unreadable`] when the file cannot be read, [`ReadError::TooLarge`] past
/// [`MAX_FILE_BYTES`], else the first problem in it.
pub fn read(path: &Path) -> Result<Wing, ReadError> {
    let text = read_text(path)?;
    Ok(parse(&text, path)?)
}

/// The file's text, at most [`MAX_FILE_BYTES`] of it (never more is read, so a device or a
/// growing file cannot exhaust memory).
///
/// # Errors
/// [`ReadError::Unreadable`] or [`ReadError::TooLarge`].
pub fn read_text(path: &Path) -> Result<String, ReadError> {
    use std::io::Read as _;
    let unreadable = |source| ReadError::Unreadable {
        path: path.to_path_buf(),
        source,
    };
    let mut bytes = Vec::new();
    std::fs::File::open(path)
        .and_then(|f| f.take(MAX_FILE_BYTES + 1).read_to_end(&mut bytes))
        .map_err(unreadable)?;
    if bytes.len() as u64 > MAX_FILE_BYTES {
        return Err(ReadError::TooLarge {
            path: path.to_path_buf(),
        });
    }
    String::from_utf8(bytes).map_err(|_| {
        unreadable(std::io::Error::new(
            std::io::ErrorKind::InvalidData,
            "stream did not contain valid UTF-8",
        ))
    })
}

/// Parses and validates wing-file text; `path` is used in error messages and for the default
/// name.
///
/// # Errors
/// The first problem in the text.
pub fn parse(text: &str, path: &Path) -> Result<Wing, WingFileError> {
    parse_with(text, path, &[])
}

/// [`parse`], taking a `table = "FILE.csv"` whose name matches one of `known` from memory
/// instead of reading the file (CSV tables are otherwise read relative to `path`'s folder).
fn parse_with(
    text: &str,
    path: &Path,
    known: &[std::sync::Arc<super::table::SectionTable>],
) -> Result<Wing, WingFileError> {
    parse_spans(text, path, known).map(|(wing, _)| wing)
}

/// A wing file's text and where each value stood in it, to locate a problem found after
/// reading (a target CL the solver cannot reach, say) the way the reader locates its own.
pub struct Origin {
    path: PathBuf,
    text: String,
    spans: Spans,
}

impl Origin {
    /// The one-line error for `field` of `place`: at its value, or at its table's header
    /// when the file does not give the key.
    #[must_use]
    pub fn error(&self, place: &Place, field: &'static str, reason: String) -> WingFileError {
        let offset = self.spans.offset(place, field);
        Locator::new(&self.text, &self.path).at(offset, place, field, reason)
    }
}

/// Reads and validates a wing file, keeping its [`Origin`].
///
/// # Errors
/// As [`read`].
pub fn read_with_origin(path: &Path) -> Result<(Wing, Origin), ReadError> {
    let text = read_text(path)?;
    let (wing, spans) = parse_spans(&text, path, &[])?;
    let origin = Origin {
        path: path.to_path_buf(),
        text,
        spans,
    };
    Ok((wing, origin))
}

fn parse_spans(
    text: &str,
    path: &Path,
    known: &[std::sync::Arc<super::table::SectionTable>],
) -> Result<(Wing, Spans), WingFileError> {
    let locate = Locator::new(text, path);
    let raw: RawWing = toml::from_str(text).map_err(|e| locate.serde_error(&e))?;
    if let Some(condition) = &raw.condition {
        if let (Some(_), Some(cl)) = (&condition.get_ref().alpha, &condition.get_ref().cl) {
            let reason = "give alpha or cl, not both".to_string();
            return Err(locate.at(cl.span().start, &Place::Condition, "cl", reason));
        }
    }
    let files = TableFiles {
        folder: path.parent().map(Path::to_path_buf).unwrap_or_default(),
        known,
    };
    let (wing, spans) = raw.into_wing(path, &locate, &files)?;
    // The first problem in reading order, so fixing a file top to bottom works.
    let first = validate::problems(&wing)
        .into_iter()
        .map(|p| (spans.offset(&p.place, p.field), p))
        .min_by_key(|(offset, _)| *offset);
    match first {
        None => Ok((wing, spans)),
        Some((offset, p)) => Err(locate.at(offset, &p.place, p.field, p.reason)),
    }
}

/// Byte offsets of each place and field, kept from the parse for error messages.
#[derive(Default)]
struct Spans {
    fields: HashMap<(Place, &'static str), usize>,
    tables: HashMap<Place, usize>,
}

impl Spans {
    fn field(&mut self, place: &Place, field: &'static str, span: Range<usize>) {
        self.fields.insert((place.clone(), field), span.start);
    }

    fn offset(&self, place: &Place, field: &'static str) -> usize {
        self.fields
            .get(&(place.clone(), field))
            .or_else(|| self.tables.get(place))
            .copied()
            .unwrap_or(0)
    }
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawWing {
    name: Option<Spanned<String>>,
    symmetric: Option<Spanned<bool>>,
    #[serde(default)]
    station: Vec<Spanned<RawStation>>,
    #[serde(default)]
    airfoil: BTreeMap<String, Spanned<RawAirfoil>>,
    #[serde(default)]
    control: Vec<Spanned<RawControl>>,
    condition: Option<Spanned<RawCondition>>,
    reference: Option<Spanned<RawReference>>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawStation {
    y: Spanned<f64>,
    chord: Spanned<f64>,
    twist: Option<Spanned<f64>>,
    airfoil: Spanned<String>,
    x_le: Option<Spanned<f64>>,
    z: Option<Spanned<f64>>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields, rename_all = "lowercase")]
enum RawKind {
    Flap,
    Aileron,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawControl {
    name: Spanned<String>,
    kind: Spanned<RawKind>,
    y_inner: Spanned<f64>,
    y_outer: Spanned<f64>,
    chord_fraction: Spanned<f64>,
    deflection: Option<Spanned<f64>>,
    effectiveness: Option<Spanned<f64>>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawCondition {
    alpha: Option<Spanned<f64>>,
    cl: Option<Spanned<f64>>,
    speed: Option<Spanned<f64>>,
    altitude: Option<Spanned<f64>>,
    roll_rate: Option<Spanned<f64>>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawReference {
    area: Option<Spanned<f64>>,
    span: Option<Spanned<f64>>,
    chord: Option<Spanned<f64>>,
    x: Option<Spanned<f64>>,
}

/// Takes a value and records where it stood.
fn take<T>(spans: &mut Spans, place: &Place, field: &'static str, value: Spanned<T>) -> T {
    spans.field(place, field, value.span());
    value.into_inner()
}

fn take_or<T>(
    spans: &mut Spans,
    place: &Place,
    field: &'static str,
    value: Option<Spanned<T>>,
    default: T,
) -> T {
    value.map_or(default, |v| take(spans, place, field, v))
}

impl RawWing {
    fn into_wing(
        self,
        path: &Path,
        locate: &Locator<'_>,
        files: &TableFiles<'_>,
    ) -> Result<(Wing, Spans), WingFileError> {
        let mut spans = Spans::default();
        let top = Place::Wing;
        let default_name = path
            .file_stem()
            .map_or_else(|| "wing".to_string(), |s| s.to_string_lossy().into_owned());
        let name = take_or(&mut spans, &top, "name", self.name, default_name);
        let symmetric = take_or(&mut spans, &top, "symmetric", self.symmetric, true);
        let stations = self
            .station
            .into_iter()
            .enumerate()
            .map(|(i, s)| station(&mut spans, i, s))
            .collect::<Vec<_>>();
        if let Some(last) = stations.len().checked_sub(1) {
            spans.tables.entry(Place::Wing).or_insert(0);
            // "Too few stations" points at the last station there is.
            let at = spans
                .tables
                .get(&Place::Station(last))
                .copied()
                .unwrap_or(0);
            spans.fields.entry((Place::Wing, "station")).or_insert(at);
        }
        let mut reader = Reader {
            spans: &mut spans,
            locate,
            files,
        };
        let airfoils = self
            .airfoil
            .into_iter()
            .map(|(key, a)| Ok((key.clone(), reader.airfoil(&key, a)?)))
            .collect::<Result<_, WingFileError>>()?;
        let controls = self
            .control
            .into_iter()
            .enumerate()
            .map(|(i, c)| control(&mut spans, i, c))
            .collect();
        let condition = self
            .condition
            .map_or_else(Condition::default, |c| condition(&mut spans, c));
        let reference = self
            .reference
            .map(|r| reference(&mut spans, r))
            .unwrap_or_default();
        let wing = Wing {
            name,
            symmetric,
            stations,
            airfoils,
            controls,
            condition,
            reference,
        };
        Ok((wing, spans))
    }
}

fn station(spans: &mut Spans, i: usize, raw: Spanned<RawStation>) -> Station {
    let place = Place::Station(i);
    spans.tables.insert(place.clone(), raw.span().start);
    let s = raw.into_inner();
    Station {
        y: take(spans, &place, "y", s.y),
        chord: take(spans, &place, "chord", s.chord),
        twist_deg: take_or(spans, &place, "twist", s.twist, 0.0),
        airfoil: take(spans, &place, "airfoil", s.airfoil),
        x_le: take_or(spans, &place, "x_le", s.x_le, 0.0),
        z: take_or(spans, &place, "z", s.z, 0.0),
    }
}

fn control(spans: &mut Spans, i: usize, raw: Spanned<RawControl>) -> Control {
    let place = Place::Control(i);
    spans.tables.insert(place.clone(), raw.span().start);
    let c = raw.into_inner();
    let kind = match take(spans, &place, "kind", c.kind) {
        RawKind::Flap => ControlKind::Flap,
        RawKind::Aileron => ControlKind::Aileron,
    };
    Control {
        name: take(spans, &place, "name", c.name),
        kind,
        y_inner: take(spans, &place, "y_inner", c.y_inner),
        y_outer: take(spans, &place, "y_outer", c.y_outer),
        chord_fraction: take(spans, &place, "chord_fraction", c.chord_fraction),
        deflection_deg: take_or(spans, &place, "deflection", c.deflection, 0.0),
        effectiveness: c
            .effectiveness
            .map(|e| take(spans, &place, "effectiveness", e)),
    }
}

fn condition(spans: &mut Spans, raw: Spanned<RawCondition>) -> Condition {
    let place = Place::Condition;
    spans.tables.insert(place.clone(), raw.span().start);
    let c = raw.into_inner();
    let d = Condition::default();
    Condition {
        alpha_deg: take_or(spans, &place, "alpha", c.alpha, d.alpha_deg),
        target_cl: c.cl.map(|v| take(spans, &place, "cl", v)),
        speed: take_or(spans, &place, "speed", c.speed, d.speed),
        altitude: take_or(spans, &place, "altitude", c.altitude, d.altitude),
        roll_rate: take_or(spans, &place, "roll_rate", c.roll_rate, d.roll_rate),
    }
}

fn reference(spans: &mut Spans, raw: Spanned<RawReference>) -> Reference {
    let place = Place::Reference;
    spans.tables.insert(place.clone(), raw.span().start);
    let r = raw.into_inner();
    let mut given =
        |field: &'static str, v: Option<Spanned<f64>>| v.map(|v| take(spans, &place, field, v));
    Reference {
        area: given("area", r.area),
        span: given("span", r.span),
        chord: given("chord", r.chord),
        x: given("x", r.x),
    }
}

/// Writes a wing in the file format, every value at full precision so it reads back equal.
#[must_use]
pub fn to_toml(wing: &Wing) -> String {
    let mut out = String::new();
    let _ = writeln!(out, "name = {}", quoted(&wing.name));
    let _ = writeln!(out, "symmetric = {}", wing.symmetric);
    for s in &wing.stations {
        let _ = writeln!(out, "\n[[station]]");
        let _ = writeln!(out, "y = {}", num(s.y));
        let _ = writeln!(out, "chord = {}", num(s.chord));
        let _ = writeln!(out, "twist = {}", num(s.twist_deg));
        let _ = writeln!(out, "airfoil = {}", quoted(&s.airfoil));
        if s.x_le != 0.0 {
            let _ = writeln!(out, "x_le = {}", num(s.x_le));
        }
        if s.z != 0.0 {
            let _ = writeln!(out, "z = {}", num(s.z));
        }
    }
    for (key, a) in &wing.airfoils {
        let _ = writeln!(out, "\n[airfoil.{}]", table_key(key));
        if let Some(table) = &a.table {
            write_table(&mut out, table, a.cl_max);
            continue;
        }
        let _ = writeln!(out, "lift_slope = {}", num(a.lift_slope));
        let _ = writeln!(out, "alpha_zero_lift = {}", num(a.alpha_zero_lift_deg));
        let _ = writeln!(out, "cl_max = {}", num(a.cl_max));
        let _ = writeln!(out, "cd0 = {}", num(a.cd0));
        let _ = writeln!(out, "cd1 = {}", num(a.cd1));
        let _ = writeln!(out, "cd2 = {}", num(a.cd2));
        if a.cm0 != 0.0 {
            let _ = writeln!(out, "cm0 = {}", num(a.cm0));
        }
    }
    for c in &wing.controls {
        let _ = writeln!(out, "\n[[control]]");
        let _ = writeln!(out, "name = {}", quoted(&c.name));
        let _ = writeln!(out, "kind = \"{}\"", c.kind.as_str());
        let _ = writeln!(out, "y_inner = {}", num(c.y_inner));
        let _ = writeln!(out, "y_outer = {}", num(c.y_outer));
        let _ = writeln!(out, "chord_fraction = {}", num(c.chord_fraction));
        let _ = writeln!(out, "deflection = {}", num(c.deflection_deg));
        if let Some(e) = c.effectiveness {
            let _ = writeln!(out, "effectiveness = {}", num(e));
        }
    }
    let c = &wing.condition;
    let _ = writeln!(out, "\n[condition]");
    match c.target_cl {
        Some(cl) => {
            let _ = writeln!(out, "cl = {}", num(cl));
        }
        None => {
            let _ = writeln!(out, "alpha = {}", num(c.alpha_deg));
        }
    }
    let _ = writeln!(out, "speed = {}", num(c.speed));
    let _ = writeln!(out, "altitude = {}", num(c.altitude));
    if c.roll_rate != 0.0 {
        let _ = writeln!(out, "roll_rate = {}", num(c.roll_rate));
    }
    write_reference(&mut out, &wing.reference);
    out
}

/// `[reference]` with the values the wing gives (none: no table).
fn write_reference(out: &mut String, r: &Reference) {
    if r.is_empty() {
        return;
    }
    let _ = writeln!(out, "\n[reference]");
    for (key, value) in [
        ("area", r.area),
        ("span", r.span),
        ("chord", r.chord),
        ("x", r.x),
    ] {
        if let Some(v) = value {
            let _ = writeln!(out, "{key} = {}", num(v));
        }
    }
}

/// A table airfoil's rows as inline arrays (also one read from a CSV file, so the text
/// stands on its own wherever it is read), and cl_max when it is not the table's largest cl.
fn write_table(out: &mut String, table: &super::table::SectionTable, cl_max: f64) {
    let c = table.columns();
    let array = |values: &[f64]| {
        let cells: Vec<String> = values.iter().map(|&v| num(v)).collect();
        format!("[{}]", cells.join(", "))
    };
    let _ = writeln!(out, "alpha = {}", array(&c.alpha_deg));
    let _ = writeln!(out, "cl = {}", array(&c.cl));
    let _ = writeln!(out, "cd = {}", array(&c.cd));
    if let Some(cm) = &c.cm {
        let _ = writeln!(out, "cm = {}", array(cm));
    }
    if cl_max != table.largest_cl() {
        let _ = writeln!(out, "cl_max = {}", num(cl_max));
    }
}

/// A TOML float that reads back to the same f64 (Rust's shortest round-trip form). A wing
/// being edited may hold a non-finite value; it is written in TOML's spelling so the file
/// still parses and the reader names the bad value.
fn num(x: f64) -> String {
    if x.is_nan() {
        return "nan".to_string();
    }
    if x.is_infinite() {
        return if x > 0.0 { "inf" } else { "-inf" }.to_string();
    }
    let s = format!("{x:?}");
    if s.contains(['.', 'e', 'E', 'n', 'i']) {
        s
    } else {
        format!("{s}.0")
    }
}

fn quoted(s: &str) -> String {
    toml::Value::String(s.to_string()).to_string()
}

fn table_key(key: &str) -> String {
    let bare = !key.is_empty()
        && key
            .chars()
            .all(|c| c.is_ascii_alphanumeric() || c == '_' || c == '-');
    if bare {
        key.to_string()
    } else {
        quoted(key)
    }
}
