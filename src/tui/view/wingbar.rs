//! The wing bar: open wings, the current one marked, unsaved ones starred, the reference
//! tagged, wings of the same name told apart by their file's stem. The current wing's name is shown whole when it fits the screen; the others share
//! what is left, and wings that do not fit are counted at the ends.

use ratatui::buffer::Buffer;
use ratatui::layout::Rect;

use super::put;
use crate::text::inert;
use crate::tui::app::App;

/// Longest name shown for a wing that is not the current one.
const NAME_WIDTH: usize = 22;
/// Shortest a name is cut to before wings are left out.
const MIN_NAME: usize = 6;
/// The bar's heading.
const HEADING: &str = "wings ";

/// One wing's entry: fixed marks around a name that may be cut.
struct Entry {
    prefix: String,
    name: Vec<char>,
    suffix: String,
}

impl Entry {
    fn width(&self, name: usize) -> usize {
        self.prefix.chars().count() + name.min(self.name.len()) + self.suffix.chars().count()
    }

    fn text(&self, name: usize, ellipsis: &str) -> String {
        let mut out = self.prefix.clone();
        if self.name.len() <= name {
            out.extend(&self.name);
        } else {
            let mark = ellipsis.chars().count();
            out.extend(&self.name[..name.saturating_sub(mark)]);
            out.push_str(ellipsis);
        }
        out.push_str(&self.suffix);
        out
    }
}

/// The labels of the wing bar for `width` columns: `(text, is current)`, with `"+n"` counts
/// for wings left out before or after.
#[must_use]
pub fn labels(app: &App, width: u16) -> Vec<(String, bool)> {
    let t = &app.theme;
    let entries: Vec<Entry> = app
        .docs
        .iter()
        .enumerate()
        .map(|(i, doc)| {
            let current = i == app.current;
            let pinned = app.reference.as_ref().is_some_and(|r| r.source == i);
            Entry {
                prefix: format!("{}{}:", if current { t.glyphs.current } else { " " }, i + 1),
                name: inert(&tab_name(app, i)).chars().collect(),
                suffix: format!(
                    "{}{}",
                    if doc.unsaved() { "*" } else { "" },
                    if pinned { " (ref)" } else { "" }
                ),
            }
        })
        .collect();
    let room = usize::from(width).saturating_sub(HEADING.len());
    let current = app.current.min(entries.len().saturating_sub(1));
    // The current wing keeps its whole name if it can; the rest of the row is shared.
    let mine = entries[current].width(usize::MAX).min(room);
    let mut shown = (current, current + 1);
    let mut others = NAME_WIDTH;
    let used = |shown: (usize, usize), others: usize| -> usize {
        let counts = usize::from(shown.0 > 0) * 4 + usize::from(shown.1 < entries.len()) * 4;
        (shown.0..shown.1)
            .filter(|&i| i != current)
            .map(|i| entries[i].width(others) + 1)
            .sum::<usize>()
            + mine
            + counts
    };
    // Add neighbours alternately after and before the current wing while they fit.
    loop {
        let mut grew = false;
        for after in [true, false] {
            let next = if after {
                (shown.1 < entries.len()).then(|| (shown.0, shown.1 + 1))
            } else {
                (shown.0 > 0).then(|| (shown.0 - 1, shown.1))
            };
            let Some(next) = next else { continue };
            let fits = (MIN_NAME..=others).rev().find(|&w| used(next, w) <= room);
            if let Some(w) = fits {
                shown = next;
                others = w;
                grew = true;
            }
        }
        if !grew {
            break;
        }
    }
    // Give names back the room that is left, up to their usual width.
    while others < NAME_WIDTH && used(shown, others + 1) <= room {
        others += 1;
    }
    // The current wing gets whatever the others and the counts leave.
    let left = room.saturating_sub(used(shown, others) - mine);
    let mut out = Vec::new();
    if shown.0 > 0 {
        out.push((format!("+{}", shown.0), false));
    }
    for (i, e) in entries.iter().enumerate().take(shown.1).skip(shown.0) {
        if i == current {
            let name_room = left.saturating_sub(e.width(0));
            out.push((e.text(name_room, t.glyphs.ellipsis), true));
        } else {
            out.push((e.text(others, t.glyphs.ellipsis), false));
        }
    }
    if shown.1 < entries.len() {
        out.push((format!("+{}", entries.len() - shown.1), false));
    }
    out
}

/// The name on a wing's tab: the wing's name, or when another open wing has the same name,
/// its file's stem first (so a cut name still tells the variants apart) and the name after.
#[must_use]
pub fn tab_name(app: &App, i: usize) -> String {
    let doc = &app.docs[i];
    let twins = app.docs.iter().filter(|d| d.title() == doc.title()).count();
    if twins < 2 {
        return doc.title().to_string();
    }
    let stem = doc.path.as_deref().and_then(std::path::Path::file_stem);
    match stem {
        Some(stem) => format!("{} ({})", stem.to_string_lossy(), doc.title()),
        None => format!("no file ({})", doc.title()),
    }
}

/// Draws the wing bar.
pub fn render(app: &App, area: Rect, buf: &mut Buffer) {
    let t = &app.theme;
    let mut x = put(buf, area.x, area.y, area.width, HEADING, t.header);
    for (label, current) in labels(app, area.width) {
        let style = if current { t.current } else { t.text };
        x = put(
            buf,
            x,
            area.y,
            area.right().saturating_sub(x),
            &label,
            style,
        );
        x = put(buf, x, area.y, area.right().saturating_sub(x), " ", t.text);
    }
}
