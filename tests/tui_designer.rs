//! What a designer needs at 80x24: every condition number with its unit, the controls'
//! deflection, Cn, a stall marker that stays inside the axis ends, a cl_max line that reads
//! as a line in ASCII, keys that wait while the terminal is too small, Tab completion in the
//! path prompts and status messages that clear once they no longer apply.

mod tui_support;

use std::path::{Path, PathBuf};

use gammaline::tui::app::{App, Mode};
use gammaline::tui::theme::{Theme, ASCII, UNICODE};
use gammaline::wing::{file, Wing};
use ratatui::layout::Size;
use ratatui::style::Modifier;
use tui_support::{app, app_with, draw, editor_text, lines, press, tapered, text};

fn examples() -> Vec<(PathBuf, Wing)> {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("wings");
    let mut files: Vec<PathBuf> = std::fs::read_dir(&dir)
        .expect("wings folder")
        .flatten()
        .map(|e| e.path())
        .filter(|p| p.extension().is_some_and(|e| e == "toml"))
        .collect();
    files.sort();
    assert!(files.len() >= 4, "the bundled examples: {files:?}");
    files
        .into_iter()
        .map(|p| {
            let wing = file::read(&p).expect("example reads");
            (p, wing)
        })
        .collect()
}

/// The rows above the panes' top border: the wing bar and the condition bar.
fn bar_rows(rows: &[String]) -> Vec<String> {
    rows.iter()
        .skip(1)
        .take_while(|r| !r.starts_with('┌'))
        .cloned()
        .collect()
}

#[test]
fn the_condition_bar_shows_every_value_with_its_unit_mach_and_re_at_80_columns() {
    let dir = tempfile::tempdir().expect("temp dir");
    for (path, wing) in examples() {
        let app = app_with(wing, Theme::monochrome(UNICODE), dir.path());
        let s = app.doc().solved.clone().expect("example solves");
        let bar = bar_rows(&lines(&draw(&app, 80, 24))).join("\n");
        let name = path.display();
        for whole in [
            " m/s",
            " m2",
            &format!("M {:.2}", s.flight.mach),
            &format!("Re {:.1e}", s.flight.reynolds_mac),
            &format!("AR {:.2}", s.geometry.aspect_ratio),
        ] {
            assert!(bar.contains(whole), "{name}: `{whole}` missing from\n{bar}");
        }
        // The altitude's unit follows its number (not cut at the edge).
        assert!(
            bar.contains(&format!("{:.1} m ", app.doc().wing.condition.altitude)),
            "{name}:\n{bar}"
        );
        for row in bar.lines() {
            assert!(row.chars().count() <= 80);
        }
    }
}

#[test]
fn the_controls_deflection_is_in_view_at_80_columns() {
    let dir = tempfile::tempdir().expect("temp dir");
    for (path, wing) in examples() {
        let deflection = wing.controls.first().map(|c| c.deflection_deg);
        let mut app = app_with(wing, Theme::monochrome(UNICODE), dir.path());
        press(&mut app, "\t\t");
        let rows = lines(&draw(&app, 80, 24));
        assert!(
            rows[3].contains("defl"),
            "{}: heading {}",
            path.display(),
            rows[3]
        );
        if let Some(d) = deflection {
            assert!(
                rows[4].contains(&format!("{d:.2}")),
                "{}: {}",
                path.display(),
                rows[4]
            );
        }
    }
}

#[test]
fn cn_is_in_the_results_strip_with_and_without_a_reference() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let cn = app.doc().solved.as_ref().expect("solves").coefficients.cn;
    let screen = text(&draw(&app, 80, 24));
    let want = format!("Cn {cn:.5}").replace("-0.00000", "0.00000");
    assert!(screen.contains(&want), "{want}\n{screen}");
    // Pinned and changed: every item still fits, the last one included.
    press(&mut app, "p\t\t>");
    let screen = text(&draw(&app, 80, 24));
    assert!(screen.contains("Cn "), "{screen}");
    assert!(screen.contains("M_root "), "{screen}");
}

/// A whole-span wing whose only stall-prone section is at one tip.
fn tip_stalling(right: bool) -> Wing {
    let mut wing = tapered();
    wing.symmetric = false;
    let half = wing.stations.clone();
    let mut left: Vec<_> = half.iter().skip(1).rev().cloned().collect();
    for s in &mut left {
        s.y = -s.y;
    }
    left.extend(half);
    for s in &mut left {
        s.airfoil = "root".into();
    }
    let tip = if right { left.len() - 1 } else { 0 };
    left[tip].airfoil = "tip".into();
    wing.stations = left;
    if let Some(a) = wing.airfoils.get_mut("tip") {
        a.cl_max = 0.2;
    }
    wing.controls.clear();
    wing
}

#[test]
fn the_stall_marker_stays_between_the_axis_ends() {
    let dir = tempfile::tempdir().expect("temp dir");
    for right in [true, false] {
        let app = app_with(tip_stalling(right), Theme::monochrome(UNICODE), dir.path());
        let stall = app.doc().solved.as_ref().expect("solves").first_stall;
        assert!(
            stall.is_some_and(|s| (s.y > 3.0) == right && s.y.abs() > 3.0),
            "stalls at the {} tip: {stall:?}",
            if right { "right" } else { "left" }
        );
        let rows = lines(&draw(&app, 80, 24));
        let axis = rows
            .iter()
            .find(|r| r.contains("│y m"))
            .unwrap_or_else(|| panic!("axis row in\n{}", rows.join("\n")));
        let start = axis.find("│y m").expect("axis label") + '│'.len_utf8();
        let plot: String = axis[start..]
            .chars()
            .skip(4)
            .take_while(|&c| c != '│')
            .collect();
        // Both ends stay readable, as a range away from the marker; no number beside it.
        let expected = if right {
            format!("-5.00 to 5.00{}▲", " ".repeat(plot.chars().count() - 14))
        } else {
            format!("▲{}-5.00 to 5.00", " ".repeat(plot.chars().count() - 14))
        };
        assert_eq!(plot, expected);
    }
}

#[test]
fn in_ascii_the_cl_max_line_is_not_a_data_glyph() {
    for glyphs in [ASCII, UNICODE] {
        assert!(
            !glyphs.levels.contains(&glyphs.limit),
            "limit glyph {} is also a level",
            glyphs.limit
        );
    }
    let dir = tempfile::tempdir().expect("temp dir");
    let app = app_with(tapered(), Theme::monochrome(ASCII), dir.path());
    let buf = draw(&app, 80, 24);
    let rows = lines(&buf);
    let (y, row) = rows
        .iter()
        .enumerate()
        .find(|(_, r)| r.contains(" =1 "))
        .expect("the cl_max line's row");
    let x = row.find(" =1 ").expect("label") + 4;
    let cell = &buf[(u16::try_from(x).expect("x"), u16::try_from(y).expect("y"))];
    assert_eq!(cell.symbol(), ASCII.limit, "{row}");
    assert!(cell.modifier.contains(Modifier::BOLD), "stall style: {row}");
}

fn shrink(app: &mut App) {
    app.size = Size::new(60, 20);
}

#[test]
fn keys_do_nothing_while_the_terminal_is_too_small_except_quit_which_asks() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "l>");
    let wing = app.doc().wing.clone();
    let cursor = app.doc().cursor;
    shrink(&mut app);
    press(&mut app, "ujl+d\tpxt?");
    assert_eq!(app.doc().wing, wing, "no edit while too small");
    assert_eq!(app.doc().cursor, cursor);
    assert!(app.reference.is_none());
    assert!(matches!(app.mode, Mode::Normal));
    // Quit with unsaved work: the question is asked, on the small screen.
    press(&mut app, "q");
    assert!(matches!(app.mode, Mode::Confirm));
    let small = text(&draw(&app, 60, 20));
    let words = small.split_whitespace().collect::<Vec<_>>().join(" ");
    assert!(words.contains("quit anyway? y/n"), "{small}");
    press(&mut app, "n");
    assert!(matches!(app.mode, Mode::Normal) && !app.quit);
    press(&mut app, "qy");
    assert!(app.quit);
}

#[test]
fn quit_needs_no_question_when_nothing_would_be_lost() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    shrink(&mut app);
    press(&mut app, "q");
    assert!(app.quit);
}

#[test]
fn tab_completes_a_path_in_the_open_prompt() {
    let dir = tempfile::tempdir().expect("temp dir");
    let folder = dir.path().join("designs");
    std::fs::create_dir(&folder).expect("folder");
    tui_support::write_tapered(&folder);
    std::fs::write(folder.join("tail-sketch.toml"), tui_support::TAPERED).expect("second");
    std::fs::write(folder.join("tapered-notes.txt"), "").expect("not a wing");
    let mut app = app(dir.path());
    press(&mut app, "o");
    press(&mut app, &format!("{}/des", dir.path().display()));
    press(&mut app, "\t");
    assert_eq!(editor_text(&app), format!("{}/", folder.display()));
    press(&mut app, "ta\t");
    // Two wing files share "ta": nothing more to add, so both are listed under the prompt.
    assert_eq!(editor_text(&app), format!("{}/ta", folder.display()));
    let screen = text(&draw(&app, 80, 24));
    assert!(
        screen.contains("tail-sketch.toml  tapered.toml"),
        "{screen}"
    );
    press(&mut app, "p\t");
    assert_eq!(
        editor_text(&app),
        format!("{}/tapered.toml", folder.display())
    );
    press(&mut app, "\n");
    assert!(matches!(app.mode, Mode::Normal));
    assert!(
        app.status.text.starts_with("opened "),
        "{}",
        app.status.text
    );
}

#[test]
fn a_seen_status_message_clears_when_the_cursor_moves_on() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "l>");
    assert_eq!(app.status.text, "chord = 1.700");
    app.status_drawn();
    press(&mut app, "j");
    assert_eq!(app.status.text, "", "the message was about the other cell");
    // A message not yet drawn stays for the user to read, even when keys follow at once.
    press(&mut app, "Z");
    let unseen = app.status.text.clone();
    assert!(unseen.contains("not a key"), "{unseen}");
    press(&mut app, "j");
    assert_eq!(app.status.text, unseen);
    // An action with its own message replaces it.
    app.status_drawn();
    press(&mut app, "u");
    assert_eq!(app.status.text, "undone");
}

#[test]
fn the_stall_warning_is_shown_first_with_the_count_of_the_others() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut wing = tapered();
    // Past the stall, with an aileron beyond 20 deg: two warnings, the stall the one shown.
    wing.condition.alpha_deg = 16.0;
    wing.controls[0].deflection_deg = 25.0;
    let app = app_with(wing, Theme::monochrome(UNICODE), dir.path());
    let s = app.doc().solved.as_ref().expect("solves");
    assert!(s.warnings.len() >= 2, "{:?}", s.warnings);
    let rows = lines(&draw(&app, 80, 24));
    let line = rows
        .iter()
        .find(|r| r.starts_with("! "))
        .unwrap_or_else(|| panic!("{}", rows.join("\n")));
    assert!(line.starts_with("! cl exceeds cl_max"), "{line}");
    let more = format!("(+{} more)", s.warnings.len() - 1);
    assert!(line.trim_end().ends_with(&more), "{line}");
}
