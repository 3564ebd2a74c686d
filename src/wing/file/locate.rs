//! Turning byte offsets and toml/serde errors into one-line, located wing-file errors.
//!
//! The place (station, airfoil, control, condition) of a serde error is taken from a second,
//! loose parse that keeps only the span of every table, so inline tables, dotted keys and
//! brackets inside strings are named correctly. A TOML syntax error leaves no parse at all;
//! only then are the table headers scanned line by line.

use std::ops::Range;
use std::path::Path;

use serde::de::{self, Deserializer, IgnoredAny, MapAccess, SeqAccess, Visitor};
use serde::Deserialize;
use toml::Spanned;

use super::super::validate::{did_you_mean, Place};
use super::WingFileError;
use crate::text::{clip, QUOTE_CHARS};

/// Names places and turns offsets into 1-based line:column for one file's text.
pub(super) struct Locator<'a> {
    text: &'a str,
    path: &'a Path,
}

impl<'a> Locator<'a> {
    pub(super) fn new(text: &'a str, path: &'a Path) -> Self {
        Self { text, path }
    }

    /// 1-based line and column (in characters) of a byte offset. An offset at the end of
    /// the file points just after its last character, not at an empty line below it.
    fn line_column(&self, offset: usize) -> (usize, usize) {
        let end = self.text.trim_end().len();
        let mut offset = offset.min(end);
        while !self.text.is_char_boundary(offset) {
            offset -= 1;
        }
        let before = &self.text[..offset];
        let line = before.matches('\n').count() + 1;
        let column = before.rsplit('\n').next().map_or(0, |l| l.chars().count()) + 1;
        (line, column)
    }

    /// An error at a byte offset.
    pub(super) fn at(
        &self,
        offset: usize,
        place: &Place,
        field: &str,
        reason: String,
    ) -> WingFileError {
        let (line, column) = self.line_column(offset);
        WingFileError {
            path: self.path.to_path_buf(),
            line,
            column,
            place: one_line(&place.to_string()),
            field: one_line(&clip(field, QUOTE_CHARS)),
            // The parts quoted from the file are clipped where they are quoted; this bounds
            // whatever else a message could carry.
            reason: one_line(&clip(&reason, 3 * QUOTE_CHARS)),
        }
    }

    /// Maps a toml error (syntax) or serde error (unknown key, missing field, wrong type,
    /// unknown variant) to one line at the offending key or value.
    pub(super) fn serde_error(&self, e: &toml::de::Error) -> WingFileError {
        let offset = e.span().map_or(0, |s| s.start);
        let message = e.message();
        let place = self.place_of(offset);
        if let Some(at) = self.kind_as_table(offset) {
            let reason = "must be \"flap\" or \"aileron\" in quotes (got an inline table)";
            return self.at(at, &place, "kind", reason.into());
        }
        if let Some((key, expected)) = unknown_key(message) {
            let known: Vec<&str> = expected.iter().map(String::as_str).collect();
            let reason = match did_you_mean(&key, &known) {
                Some(best) => format!("unknown key (did you mean `{best}`?)"),
                None => format!("unknown key (expected one of: {})", known.join(", ")),
            };
            return self.at(offset, &place, &key, reason);
        }
        if let Some(key) = between(message, "missing field `", "`") {
            return self.at(offset, &place, key, "missing (required)".into());
        }
        if let Some(variant) = between(message, "unknown variant `", "`") {
            let reason = unknown_kind(variant);
            return self.at(offset, &place, "kind", reason);
        }
        if message.starts_with("wanted string or table") {
            let reason = "must be \"flap\" or \"aileron\" in quotes".to_string();
            return self.at(offset, &place, "kind", reason);
        }
        if let Some(key) = between(message, "duplicate key `", "`") {
            return self.at(offset, &place, key, "duplicate key".into());
        }
        let field = self
            .key_before(offset)
            .or_else(|| self.header_key(offset))
            .or_else(|| self.line_key(offset))
            .unwrap_or_else(|| "toml".to_string());
        if let Some(reason) = wrong_type(message, &field, self.value_kind(offset)) {
            return self.at(offset, &place, &field, reason);
        }
        if let Some((at, reason)) = self.bad_character(offset) {
            let field = self.line_key(at).unwrap_or_else(|| "toml".to_string());
            return self.at(at, &place, &field, reason);
        }
        let reason = self
            .missing_value(offset)
            .unwrap_or_else(|| syntax(message, self.text.get(offset..).unwrap_or("")));
        self.at(offset, &place, &field, reason)
    }

    /// `kind = { ... }`: an inline table where the control kind's text belongs (serde reads
    /// its first key as the kind). The offset of the `{`.
    fn kind_as_table(&self, offset: usize) -> Option<usize> {
        let start = self.text.get(..offset)?.rfind('\n').map_or(0, |i| i + 1);
        let line = self.text[start..].lines().next()?;
        let (key, value) = line.split_once('=')?;
        let brace = value.trim_start();
        (key.trim() == "kind" && brace.starts_with('{'))
            .then(|| start + line.len() - value.len() + (value.len() - brace.len()))
    }

    /// What the value at `offset` is when serde calls it a map: TOML's dates and times are
    /// read as tables inside the parser, and an inline table is one.
    fn value_kind(&self, offset: usize) -> Option<&'static str> {
        let value = self.text.get(offset..)?;
        if value.starts_with('{') {
            return Some("an inline table");
        }
        let token: &str = value.split(['\n', '#', ',', '}']).next()?.trim();
        let date_like = token.starts_with(|c: char| c.is_ascii_digit())
            && token.contains(['-', ':'])
            && token
                .chars()
                .all(|c| c.is_ascii_digit() || "-:.+TtZz ".contains(c));
        date_like.then_some("a date or time")
    }

    /// The first character that TOML forbids on the line of `offset` (a control character
    /// other than tab, a carriage return not followed by a line feed), with why.
    fn bad_character(&self, offset: usize) -> Option<(usize, String)> {
        let offset = offset.min(self.text.len());
        let start = self.text.get(..offset)?.rfind('\n').map_or(0, |i| i + 1);
        let end = self.text[start..]
            .find('\n')
            .map_or(self.text.len(), |i| start + i);
        let line = &self.text[start..end];
        line.char_indices().find_map(|(i, c)| {
            let at = start + i;
            match c {
                '\r' if !self.text[at + 1..].starts_with('\n') => Some((
                    at,
                    "a carriage return (CR) alone ends a line here: TOML needs LF or CR LF \
                     line endings; convert the file's line endings"
                        .to_string(),
                )),
                '\t' | '\r' => None,
                c if c.is_control() => Some((
                    at,
                    format!(
                        "control character U+{code:04X} is not allowed in a TOML file (only \
                         tab is; inside a quoted string write it as \\u{code:04X})",
                        code = u32::from(c)
                    ),
                )),
                _ => None,
            }
        })
    }

    /// The table an offset falls in: the innermost table span from a loose parse, or, when
    /// the text does not parse at all, the last table header above the offset.
    fn place_of(&self, offset: usize) -> Place {
        match toml::from_str::<Loose>(self.text) {
            Ok(loose) => loose.place_of(offset),
            Err(_) => header_place(self.text, offset),
        }
    }

    /// The key of `key = value` when `offset` is at the value (also inside inline tables).
    fn key_before(&self, offset: usize) -> Option<String> {
        let before = self
            .text
            .get(..offset)?
            .trim_end()
            .strip_suffix('=')?
            .trim_end();
        let rest =
            before.trim_end_matches(|c: char| c.is_ascii_alphanumeric() || c == '_' || c == '-');
        let key = &before[rest.len()..];
        (!key.is_empty()).then(|| key.to_string())
    }
}

impl Locator<'_> {
    /// toml reads `key =` with nothing after it as a broken string; say what it is.
    fn missing_value(&self, offset: usize) -> Option<String> {
        let before = self.text.get(..offset)?;
        let line_start = before.rfind('\n').map_or(0, |i| i + 1);
        let after = self.text.get(offset..)?.lines().next().unwrap_or("").trim();
        let empty_after = after.is_empty() || after.starts_with('#');
        (empty_after && before[line_start..].trim_end().ends_with('='))
            .then(|| "TOML syntax: no value after `=`".to_string())
    }

    /// The key of the `key = ...` line that `offset` is on (for a value broken past reading).
    fn line_key(&self, offset: usize) -> Option<String> {
        let start = self.text.get(..offset)?.rfind('\n').map_or(0, |i| i + 1);
        let line = self.text[start..].lines().next()?;
        let (key, _) = line.split_once('=')?;
        let key = key.trim();
        let bare = key
            .chars()
            .all(|c| c.is_ascii_alphanumeric() || c == '_' || c == '-');
        (bare && !key.is_empty()).then(|| key.to_string())
    }

    /// The last key of a `[table]` header when `offset` is at one (a table given where an
    /// array of tables or a value belongs).
    fn header_key(&self, offset: usize) -> Option<String> {
        let rest = self.text.get(offset..)?.lines().next()?.strip_prefix('[')?;
        let name = rest.split(']').next()?.trim_start_matches('[');
        let key = name
            .rsplit('.')
            .next()?
            .trim()
            .trim_matches(|c| c == '"' || c == '\'');
        (!key.is_empty()).then(|| key.to_string())
    }
}

/// Keys and airfoil names come from the file and may hold line breaks or other control
/// characters; they are escaped so the error stays one line.
pub(super) fn one_line(s: &str) -> String {
    s.chars()
        .map(|c| {
            if c.is_control() {
                c.escape_default().to_string()
            } else {
                c.to_string()
            }
        })
        .collect()
}

fn unknown_kind(variant: &str) -> String {
    let kinds = ["flap", "aileron"];
    let variant = clip(variant, QUOTE_CHARS);
    let variant = variant.as_str();
    match did_you_mean(variant, &kinds) {
        Some(best) => format!("unknown control kind `{variant}` (did you mean `{best}`?)"),
        None => format!("unknown control kind `{variant}` (expected `flap` or `aileron`)"),
    }
}

/// "invalid type: string \"x\", expected f64" -> "must be a number (got string \"x\")".
/// `value_kind` names a value that serde calls a map more exactly (a date, an inline table).
fn wrong_type(message: &str, field: &str, value_kind: Option<&str>) -> Option<String> {
    let rest = message.strip_prefix("invalid type: ")?;
    let (got, expected) = rest.rsplit_once(", expected ")?;
    let wanted = match expected.trim() {
        "f64" | "a float" => "a number".to_string(),
        "a boolean" => "true or false".to_string(),
        "a string" => "text in quotes".to_string(),
        "a sequence" => format!("an array of [[{field}]] tables"),
        other if other.starts_with("struct ") || other == "a map" => "a table".to_string(),
        other => other.to_string(),
    };
    let got = match got {
        "map" => value_kind.unwrap_or("a table").to_string(),
        "sequence" => "an array".to_string(),
        other => clip(other, QUOTE_CHARS),
    };
    Some(format!("must be {wanted} (got {got})"))
}

/// A syntax error on one line: toml puts its "expected ..." hint on a second line. When toml
/// gives no words at all, the text it stopped at is quoted.
fn syntax(message: &str, rest: &str) -> String {
    let parts: Vec<&str> = message
        .lines()
        .map(str::trim)
        .filter(|l| !l.is_empty())
        .collect();
    if parts.is_empty() {
        let here = rest.lines().next().unwrap_or("").trim_end();
        if here.is_empty() {
            return "TOML syntax: the file ends where a value or key was expected".to_string();
        }
        return format!("TOML syntax: cannot read `{}`", clip(here, QUOTE_CHARS / 2));
    }
    format!("TOML syntax: {}", parts.join("; "))
}

fn between<'m>(message: &'m str, open: &str, close: &str) -> Option<&'m str> {
    let rest = message.split_once(open)?.1;
    Some(rest.split_once(close)?.0)
}

/// Parses serde's "unknown field `x`, expected one of `a`, `b`" into the key and candidates.
fn unknown_key(message: &str) -> Option<(String, Vec<String>)> {
    let key = between(message, "unknown field `", "`")?.to_string();
    let expected = message
        .split_once("expected")
        .map(|(_, list)| {
            list.split('`')
                .skip(1)
                .step_by(2)
                .map(str::to_string)
                .collect()
        })
        .unwrap_or_default();
    Some((key, expected))
}

/// Every table of a wing file with its byte span, whatever its contents.
#[derive(Deserialize, Default)]
#[serde(default)]
struct Loose {
    station: Spans,
    airfoil: Spans,
    control: Spans,
    condition: Option<Spanned<IgnoredAny>>,
    reference: Option<Spanned<IgnoredAny>>,
}

impl Loose {
    fn place_of(&self, offset: usize) -> Place {
        let inside = |span: &Range<usize>| span.contains(&offset);
        let indexed = |spans: &Spans, make: fn(usize) -> Place| {
            let mut elements = spans.0.iter().filter(|(key, _)| key.is_none());
            elements.position(|(_, s)| inside(s)).map(make)
        };
        indexed(&self.station, Place::Station)
            .or_else(|| indexed(&self.control, Place::Control))
            .or_else(|| {
                let (key, _) = self.airfoil.0.iter().find(|(_, s)| inside(s))?;
                Some(Place::Airfoil(key.clone()?))
            })
            .or_else(|| {
                let condition = self.condition.as_ref()?;
                inside(&condition.span()).then_some(Place::Condition)
            })
            .or_else(|| {
                let reference = self.reference.as_ref()?;
                inside(&reference.span()).then_some(Place::Reference)
            })
            .unwrap_or(Place::Wing)
    }
}

/// The spans of an array's elements (no key) or a table's values (by key); any other value
/// gives none, so a value of the wrong type still leaves the other tables named.
#[derive(Default)]
struct Spans(Vec<(Option<String>, Range<usize>)>);

impl<'de> Deserialize<'de> for Spans {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        d.deserialize_any(SpansVisitor)
    }
}

struct SpansVisitor;

impl<'de> Visitor<'de> for SpansVisitor {
    type Value = Spans;

    fn expecting(&self, f: &mut std::fmt::Formatter) -> std::fmt::Result {
        f.write_str("any value")
    }

    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> Result<Spans, A::Error> {
        let mut out = Vec::new();
        while let Some(item) = seq.next_element::<Spanned<IgnoredAny>>()? {
            out.push((None, item.span()));
        }
        Ok(Spans(out))
    }

    /// A table of tables (`[airfoil.*]`): one span per key.
    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<Spans, A::Error> {
        let mut out = Vec::new();
        while let Some(key) = map.next_key::<String>()? {
            let value = map.next_value::<Spanned<IgnoredAny>>()?;
            out.push((Some(key), value.span()));
        }
        Ok(Spans(out))
    }

    fn visit_bool<E: de::Error>(self, _: bool) -> Result<Spans, E> {
        Ok(Spans::default())
    }

    fn visit_i64<E: de::Error>(self, _: i64) -> Result<Spans, E> {
        Ok(Spans::default())
    }

    fn visit_f64<E: de::Error>(self, _: f64) -> Result<Spans, E> {
        Ok(Spans::default())
    }

    fn visit_str<E: de::Error>(self, _: &str) -> Result<Spans, E> {
        Ok(Spans::default())
    }
}

/// The place named by the last table header above `offset` (for text that does not parse).
fn header_place(text: &str, offset: usize) -> Place {
    let mut place = Place::Wing;
    let (mut stations, mut controls) = (0, 0);
    let mut start = 0;
    for line in text.split_inclusive('\n') {
        if start > offset {
            break;
        }
        start += line.len();
        let header: String = line
            .split('#')
            .next()
            .unwrap_or("")
            .chars()
            .filter(|c| !c.is_whitespace())
            .collect();
        // A header broken by a typo still names its table, so match on the opening only.
        place = match header.as_str() {
            h if opens(h, "[[station", "]]") => {
                stations += 1;
                Place::Station(stations - 1)
            }
            h if opens(h, "[[control", "]]") => {
                controls += 1;
                Place::Control(controls - 1)
            }
            h if opens(h, "[condition", "]") => Place::Condition,
            h if opens(h, "[reference", "]") => Place::Reference,
            h if h.starts_with("[airfoil.") => {
                let key = h["[airfoil.".len()..].trim_end_matches(']');
                Place::Airfoil(key.trim_matches(|c| c == '"' || c == '\'').to_string())
            }
            h if h.starts_with('[') => Place::Wing,
            _ => place,
        };
    }
    place
}

/// Whether a header (whitespace removed) is `open` + `close`, or that cut short.
fn opens(header: &str, open: &str, close: &str) -> bool {
    header
        .strip_prefix(open)
        .is_some_and(|rest| close.starts_with(rest))
}
