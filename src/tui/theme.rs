//! Styles and glyphs in one place: a 16-colour theme, a monochrome theme built on modifiers
//! for `NO_COLOR`, and Unicode or ASCII glyphs for borders and sparklines.
//!
//! The selection is always marked by a modifier (reversed, bold) and never by colour alone:
//! crossterm resets attributes on colour changes, and a monochrome terminal has no colour.

use ratatui::style::{Color, Modifier, Style};
use ratatui::symbols::border;

/// The glyphs used for borders, sparklines and markers.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Glyphs {
    /// Border set for pane blocks.
    pub border: border::Set,
    /// Sparkline levels from empty to full (nine entries).
    pub levels: [&'static str; 9],
    /// The cl_max = 1 line drawn across empty cells.
    pub limit: &'static str,
    /// Marks under the plot where cl first reaches cl_max (a spanwise point, not a station).
    pub stall: &'static str,
    /// Marks the current wing in the wing bar.
    pub current: &'static str,
    /// Separator between fields in bars.
    pub separator: &'static str,
    /// Marks text cut short (a path shortened from the left, a long name).
    pub ellipsis: &'static str,
    /// Marks a change against the reference in the results strip.
    pub delta: &'static str,
    /// Marks the reason an edit was refused.
    pub refused: &'static str,
}

/// Unicode box drawing and eighth blocks.
pub const UNICODE: Glyphs = Glyphs {
    border: border::PLAIN,
    levels: [" ", "▁", "▂", "▃", "▄", "▅", "▆", "▇", "█"],
    limit: "─",
    stall: "▲",
    current: "▸",
    separator: "│",
    ellipsis: "…",
    delta: "Δ",
    refused: "✗ ",
};

/// Seven-bit glyphs for terminals or locales without UTF-8.
pub const ASCII: Glyphs = Glyphs {
    border: border::Set {
        top_left: "+",
        top_right: "+",
        bottom_left: "+",
        bottom_right: "+",
        vertical_left: "|",
        vertical_right: "|",
        horizontal_top: "-",
        horizontal_bottom: "-",
    },
    levels: [" ", ".", ",", "-", "~", "=", "+", "*", "#"],
    // Not one of the levels, so the line cannot be taken for a bar top.
    limit: "_",
    stall: "^",
    current: ">",
    separator: "|",
    ellipsis: "...",
    delta: "d",
    refused: "! ",
};

/// Every style the views use, by meaning.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Theme {
    /// Ordinary text.
    pub text: Style,
    /// Pane titles and table headers.
    pub header: Style,
    /// Secondary text: units, axis labels, hints.
    pub dim: Style,
    /// The selected cell or item.
    pub selected: Style,
    /// The current wing's name in the wing bar.
    pub current: Style,
    /// A value that is not accepted, and error messages.
    pub invalid: Style,
    /// Validity warnings.
    pub warning: Style,
    /// The present wing's span load.
    pub load: Style,
    /// The elliptic load of the same lift.
    pub elliptic: Style,
    /// The pinned reference wing.
    pub reference: Style,
    /// Sections at or past cl_max, and the first-stall marker.
    pub stall: Style,
    /// Keys in the footer and help.
    pub key: Style,
    /// Glyph set.
    pub glyphs: Glyphs,
}

impl Theme {
    /// The default theme: the 16 named terminal colours plus modifiers.
    #[must_use]
    pub fn colour(glyphs: Glyphs) -> Self {
        let fg = |c: Color| Style::new().fg(c);
        Self {
            text: Style::new(),
            header: fg(Color::Cyan).add_modifier(Modifier::BOLD),
            dim: fg(Color::DarkGray),
            selected: Style::new().add_modifier(Modifier::REVERSED | Modifier::BOLD),
            current: fg(Color::LightCyan).add_modifier(Modifier::BOLD | Modifier::UNDERLINED),
            invalid: fg(Color::LightRed).add_modifier(Modifier::BOLD),
            warning: fg(Color::Yellow),
            load: fg(Color::Green),
            elliptic: fg(Color::Blue),
            reference: fg(Color::Magenta),
            stall: fg(Color::Red).add_modifier(Modifier::BOLD),
            key: fg(Color::LightYellow).add_modifier(Modifier::BOLD),
            glyphs,
        }
    }

    /// The `NO_COLOR` theme: no colour at all, meaning carried by modifiers.
    #[must_use]
    pub fn monochrome(glyphs: Glyphs) -> Self {
        let m = |m: Modifier| Style::new().add_modifier(m);
        Self {
            text: Style::new(),
            header: m(Modifier::BOLD),
            dim: m(Modifier::DIM),
            selected: m(Modifier::REVERSED | Modifier::BOLD),
            current: m(Modifier::BOLD | Modifier::UNDERLINED),
            invalid: m(Modifier::BOLD | Modifier::UNDERLINED),
            warning: m(Modifier::BOLD),
            load: Style::new(),
            elliptic: m(Modifier::DIM),
            reference: m(Modifier::ITALIC),
            stall: m(Modifier::BOLD | Modifier::REVERSED),
            key: m(Modifier::BOLD),
            glyphs,
        }
    }

    /// The theme the environment asks for: monochrome when `NO_COLOR` is set to anything
    /// non-empty (<https://no-color.org>), ASCII glyphs when asked or when the locale is not
    /// UTF-8.
    #[must_use]
    pub fn from_env(ascii: bool) -> Self {
        let glyphs = if ascii || !locale_is_utf8() {
            ASCII
        } else {
            UNICODE
        };
        if std::env::var_os("NO_COLOR").is_some_and(|v| !v.is_empty()) {
            Self::monochrome(glyphs)
        } else {
            Self::colour(glyphs)
        }
    }
}

/// True when the effective character-type locale (`LC_ALL`, then `LC_CTYPE`, then `LANG`)
/// names UTF-8. An unset locale is the C locale, which is not.
#[must_use]
pub fn locale_is_utf8() -> bool {
    let var = ["LC_ALL", "LC_CTYPE", "LANG"]
        .iter()
        .filter_map(|k| std::env::var(k).ok())
        .find(|v| !v.is_empty());
    var.is_some_and(|v| {
        let v = v.to_ascii_lowercase();
        v.contains("utf-8") || v.contains("utf8")
    })
}
