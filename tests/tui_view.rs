//! Panes drawn into buffers and compared with the expected screen, styles where they carry
//! meaning; every size from 0x0 to 120x40 draws without panicking; hostile names are inert.

mod tui_support;

use gammaline::tui::app::Mode;
use gammaline::tui::theme::{Theme, ASCII, UNICODE};
use gammaline::tui::view;
use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::style::Modifier;
use tui_support::{app, app_with, draw, lines, press, tapered};

fn pane(width: u16, height: u16, f: impl FnOnce(Rect, &mut Buffer)) -> Buffer {
    let area = Rect::new(0, 0, width, height);
    let mut buf = Buffer::empty(area);
    f(area, &mut buf);
    buf
}

#[test]
fn station_table_lists_every_station_with_the_cell_selected() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "l");
    let buf = pane(38, 6, |a, b| view::table::render(&app, a, b));
    assert_eq!(
        lines(&buf),
        [
            "┌ stations 1/3 ──────────────────────┐",
            "│  #     y m chord m  twist airfoil  │",
            "│  1   0.000   1.600   0.00 root     │",
            "│  2   2.500   1.300  -1.00 root     │",
            "│  3   5.000   0.800  -3.00 tip      │",
            "└────────────────────────────────────┘",
        ]
    );
    // The selected cell (station 1, chord) carries the selection modifiers, not colour.
    for x in 13..20 {
        let m = buf[(x, 2)].modifier;
        assert!(
            m.contains(Modifier::REVERSED | Modifier::BOLD),
            "cell {x}: {m:?}"
        );
    }
    assert!(!buf[(5, 2)].modifier.contains(Modifier::REVERSED));
}

#[test]
fn offsets_columns_appear_when_asked() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "x");
    let buf = pane(60, 4, |a, b| view::table::render(&app, a, b));
    assert!(
        lines(&buf)[1].contains("x_le m     z m"),
        "{:?}",
        lines(&buf)
    );
}

#[test]
fn ascii_mode_uses_only_ascii() {
    let dir = tempfile::tempdir().expect("temp dir");
    let app = app_with(tapered(), Theme::colour(ASCII), dir.path());
    let screen = tui_support::text(&draw(&app, 80, 24));
    let bad: Vec<char> = screen.chars().filter(|c| !c.is_ascii()).collect();
    assert!(bad.is_empty(), "{bad:?}\n{screen}");
    assert!(screen.contains("+ stations"), "{screen}");
}

#[test]
fn results_strip_shows_the_solver_numbers() {
    let dir = tempfile::tempdir().expect("temp dir");
    let app = app(dir.path());
    let s = app.doc().solved.as_ref().expect("solves");
    let buf = pane(80, 4, |a, b| view::results::render(&app, a, b));
    let text = lines(&buf).join("\n");
    let c = &s.coefficients;
    for expected in [
        format!("CL {:.4}", c.cl),
        format!("CDi {:.5}", c.cdi),
        format!("e {:.4}", c.e.expect("lift")),
        format!("CL_a {:.3}/rad", s.cl_alpha),
        format!("L/D {:.1}", c.cl / c.cd),
        // The strip never shows a minus sign on a value that rounds to zero.
        format!("Cl_roll {:.5}", c.cl_roll).replace("-0.00000", "0.00000"),
        format!("M_root {:.1} N m", s.flight.right_root_bending_moment),
        format!("stall y {:.3} m", s.first_stall.expect("stalls").y),
    ] {
        assert!(text.contains(&expected), "{expected} missing from\n{text}");
    }
}

#[test]
fn plots_show_ranges_axis_ends_and_the_cl_max_line() {
    let dir = tempfile::tempdir().expect("temp dir");
    let app = app(dir.path());
    let buf = pane(42, 16, |a, b| view::plots::render(&app, a, b));
    let rows = lines(&buf);
    let text = rows.join("\n");
    assert!(text.contains("span load c*cl/c_mean"), "{text}");
    assert!(
        text.contains("alpha_i deg") && text.contains("min "),
        "{text}"
    );
    assert!(text.contains("cl/cl_max"));
    let axis = rows
        .iter()
        .find(|r| r.contains("y m -5.00"))
        .expect("axis row");
    assert!(axis.ends_with(" 5.00│"), "{axis}");
    assert!(axis.contains('▲'), "first stall marked: {axis}");
    // The cl_max line: a row of limit glyphs drawn with the stall style.
    let (y, limit_row) = rows
        .iter()
        .enumerate()
        .find(|(_, r)| r.matches('─').count() > 20 && !r.starts_with('└') && !r.starts_with('┌'))
        .expect("cl_max line");
    assert!(limit_row.contains("────"));
    let x = u16::try_from(limit_row.chars().position(|c| c == '─').expect("glyph")).expect("x");
    assert!(buf[(x, u16::try_from(y).expect("y"))]
        .modifier
        .contains(Modifier::BOLD));
}

#[test]
fn every_size_draws_without_panicking() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let mut modes = vec![];
    press(&mut app, "p");
    modes.push(app.clone());
    press(&mut app, "l\n");
    tui_support::retype(&mut app, "-3");
    press(&mut app, "\n");
    modes.push(app.clone());
    press(&mut app, "\u{1b}?");
    modes.push(app.clone());
    press(&mut app, "\u{1b}w");
    modes.push(app.clone());
    press(&mut app, "\u{1b}l+q");
    assert!(matches!(app.mode, Mode::Confirm));
    modes.push(app.clone());
    for app in &modes {
        for w in 0..=120 {
            for h in 0..=40 {
                let _ = draw(app, w, h);
            }
        }
    }
}

#[test]
fn too_small_says_so() {
    let dir = tempfile::tempdir().expect("temp dir");
    let app = app(dir.path());
    let text = tui_support::text(&draw(&app, 79, 24));
    assert!(text.contains("terminal too small"), "{text}");
    assert!(tui_support::text(&draw(&app, 80, 23)).contains("terminal too small"));
    assert!(!tui_support::text(&draw(&app, 80, 24)).contains("too small"));
}

#[test]
fn a_hostile_wing_name_is_inert() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut wing = tapered();
    wing.name = "evil\u{1b}]52;c;cm0gLXJmIH4=\u{7}\u{1b}[2J\u{9b}1;1H\u{202e}".into();
    let key = wing.stations[0].airfoil.clone();
    let airfoil = wing.airfoils.remove(&key).expect("airfoil");
    let hostile_key = "r\u{1b}[31m".to_string();
    wing.airfoils.insert(hostile_key.clone(), airfoil);
    for s in wing.stations.iter_mut().filter(|s| s.airfoil == key) {
        s.airfoil = hostile_key.clone();
    }
    let mut app = app_with(wing, Theme::colour(UNICODE), dir.path());
    for state in ["", "w", "\u{1b}\t"] {
        press(&mut app, state);
        let buf = draw(&app, 100, 30);
        for cell in buf.content() {
            assert!(
                !cell
                    .symbol()
                    .chars()
                    .any(|c| c.is_control() || ('\u{202a}'..='\u{202e}').contains(&c)),
                "control character drawn: {:?}",
                cell.symbol()
            );
        }
        let text = tui_support::text(&buf);
        assert!(text.contains("evil?]52;c;"), "{text}");
    }
    // The copied line is inert too.
    press(&mut app, "\u{1b}y");
    let notebook = std::fs::read_to_string(dir.path().join("notebook.txt")).expect("notebook");
    assert!(
        !notebook.trim_end().chars().any(char::is_control),
        "{notebook:?}"
    );
}

#[test]
fn footer_hints_come_from_the_key_table() {
    let dir = tempfile::tempdir().expect("temp dir");
    let app = app(dir.path());
    let rows = lines(&draw(&app, 80, 24));
    let footer = &rows[23];
    for (key, hint) in gammaline::tui::keymap::hints(gammaline::tui::keymap::ModeKind::Normal)
        .into_iter()
        .take(4)
    {
        assert!(footer.contains(&format!("{key} {hint}")), "{footer}");
    }
}
