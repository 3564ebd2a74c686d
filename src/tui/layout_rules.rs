//! The workbench's layout rules that the state needs as much as the drawing: the least
//! terminal size, and how the `?` help text is laid out (the cautions, then every key of
//! every mode, generated from the key table and wrapped so every line can be read at the
//! smallest size). Kept out of `view/` so the state never imports drawing code.

use ratatui::layout::{Rect, Size};

use super::keymap::{self, ModeKind, CAUTIONS};
use super::wrap::{fit, wrap};

/// Smallest terminal the workbench lays out in.
pub const MIN_WIDTH: u16 = 80;
/// Smallest terminal height.
pub const MIN_HEIGHT: u16 = 24;

/// Width of the help's keys column.
const KEYS: usize = 18;
/// Widest the help overlay grows.
const HELP_MAX_WIDTH: u16 = 100;

/// Whether a terminal of `size` is below the size the workbench lays out in.
#[must_use]
pub const fn too_small(size: Size) -> bool {
    size.width < MIN_WIDTH || size.height < MIN_HEIGHT
}

/// What a help line is, for its style.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum HelpKind {
    /// A key and what it does.
    Plain,
    /// A mode's heading.
    Heading,
    /// One of the cautions.
    Caution,
}

/// The help text wrapped to `width` columns, line by line. A key's description that does
/// not fit continues under the description column.
#[must_use]
pub fn help_lines(width: u16) -> Vec<(String, HelpKind)> {
    let width = usize::from(width).max(1);
    let mut out: Vec<(String, HelpKind)> = CAUTIONS
        .iter()
        .flat_map(|c| wrap(c, width))
        .map(|l| (l, HelpKind::Caution))
        .collect();
    // Too narrow for two columns: the keys go on a line of their own.
    let indent = if width >= KEYS + 21 { KEYS + 1 } else { 2 };
    for mode in ModeKind::ALL {
        out.push((String::new(), HelpKind::Plain));
        out.extend(
            wrap(mode.title(), width)
                .into_iter()
                .map(|l| (l, HelpKind::Heading)),
        );
        for (keys, help) in keymap::help(mode) {
            let mut rest = wrap(help, width - indent.min(width - 1)).into_iter();
            if indent > KEYS && keys.chars().count() <= KEYS {
                let first = rest.next().unwrap_or_default();
                out.push((
                    format!("{} {first}", fit(&keys, KEYS, false)),
                    HelpKind::Plain,
                ));
            } else {
                out.extend(wrap(&keys, width).into_iter().map(|l| (l, HelpKind::Plain)));
            }
            let pad = " ".repeat(indent.min(width - 1));
            out.extend(rest.map(|l| (format!("{pad}{l}"), HelpKind::Plain)));
        }
    }
    out
}

/// The help overlay's rectangle in a screen of `area`.
#[must_use]
pub fn help_frame(area: Rect) -> Rect {
    Rect {
        width: HELP_MAX_WIDTH.min(area.width),
        ..area
    }
}

/// The text area inside the help overlay's border for a screen of `size`.
fn help_inner_size(size: Size) -> Size {
    let rect = help_frame(Rect::new(0, 0, size.width, size.height));
    Size::new(rect.width.saturating_sub(2), rect.height.saturating_sub(2))
}

/// The furthest the help can scroll on a screen of `size` (the last line at the bottom).
#[must_use]
pub fn help_max_scroll(size: Size) -> u16 {
    let inner = help_inner_size(size);
    let total = help_lines(inner.width).len();
    u16::try_from(total.saturating_sub(usize::from(inner.height))).unwrap_or(u16::MAX)
}
