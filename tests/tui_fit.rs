//! Text fits the screen at every width from the smallest: the help wraps and scrolls to its
//! last line, plot headings keep their min and max, the status line shortens paths, the wing
//! bar shows the current wing's whole name, and table columns are drawn whole or not at all.

mod tui_support;

use gammaline::solver::Method;
use gammaline::tui::app::Mode;
use gammaline::tui::doc::Doc;
use gammaline::tui::keymap::{self, CAUTIONS};
use gammaline::tui::view::help;
use gammaline::tui::view::plots::short;
use gammaline::wing::Wing;
use ratatui::layout::Size;
use tui_support::{app, draw, lines, press, tapered};

/// Words of `text` joined by single spaces.
fn words(text: &str) -> String {
    text.split_whitespace().collect::<Vec<_>>().join(" ")
}

#[test]
fn help_wraps_to_the_overlay_and_scrolls_to_every_line_at_80x24() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "?");
    let mut seen: Vec<String> = Vec::new();
    let max = help::max_scroll(Size::new(80, 24));
    assert!(max > 0, "the help is longer than one screen");
    for _ in 0..=max {
        let rows = lines(&draw(&app, 80, 24));
        for row in &rows[1..23] {
            let inside: String = row.chars().skip(1).take(78).collect();
            // Nothing runs into the border: the text never fills the last column.
            assert_eq!(row.chars().nth(79), Some('│'), "{row}");
            seen.push(inside.trim_end().to_string());
        }
        press(&mut app, "j");
    }
    let all = words(&seen.join(" "));
    for caution in CAUTIONS {
        assert!(
            all.contains(caution),
            "caution not readable: {caution}\n{all}"
        );
    }
    for b in keymap::BINDINGS {
        assert!(all.contains(&words(b.help)), "help misses {}", b.help);
    }
    // Every wrapped line fits the overlay.
    for (line, _) in help::lines(78) {
        assert!(line.chars().count() <= 78, "{line}");
    }
}

#[test]
fn help_never_scrolls_past_its_end() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "?");
    let max = help::max_scroll(app.size);
    press(&mut app, &"j".repeat(usize::from(max) + 50));
    assert!(matches!(app.mode, Mode::Help { scroll } if scroll == max));
    press(&mut app, "k");
    assert!(matches!(app.mode, Mode::Help { scroll } if scroll == max - 1));
    press(&mut app, "g");
    assert!(matches!(app.mode, Mode::Help { scroll: 0 }));
}

#[test]
fn plot_headings_keep_min_max_and_axis_ends_at_every_width() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    // With x_le and z shown the table is widest and the plots narrowest.
    press(&mut app, "x");
    for width in 80..=120 {
        let rows = lines(&draw(&app, width, 24));
        for name in ["span load", "a", "cl/cl_max"] {
            let row = rows
                .iter()
                .find(|r| {
                    let plot = r.rsplit('│').nth(1).unwrap_or("");
                    plot.starts_with(name) && (plot.contains("max ") || plot.contains(".."))
                })
                .unwrap_or_else(|| panic!("{name} heading at {width}:\n{}", rows.join("\n")));
            let plot = row.rsplit('│').nth(1).expect("inside the pane").trim_end();
            // The heading ends in the whole max, as `short` writes it: not cut.
            let last = plot.rsplit([' ']).next().expect("number");
            let last = last.rsplit("..").next().expect("number");
            let value: f64 = last
                .parse()
                .unwrap_or_else(|_| panic!("{name} at {width}: {plot}"));
            assert_eq!(short(value), last, "{name} at {width}: {plot}");
        }
        let axis = rows
            .iter()
            .find(|r| r.contains("│y m -5.00"))
            .unwrap_or_else(|| panic!("axis at {width}"));
        assert!(axis.contains(" 5.00│"), "{axis}");
    }
}

#[test]
fn long_notebook_paths_are_shortened_from_the_left() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let deep = dir
        .path()
        .join("a-rather-long-folder-name")
        .join("and-another-one-below-it")
        .join("gl-sess");
    app.settings.notebook = deep.join("notebook.txt");
    press(&mut app, "y");
    let rows = lines(&draw(&app, 80, 24));
    let status = rows[22].trim_end();
    assert!(status.starts_with("sent to clipboard"), "{status}");
    assert!(status.ends_with("…/gl-sess/notebook.txt"), "{status}");
    assert!(std::fs::read_to_string(deep.join("notebook.txt")).is_ok());
}

#[test]
fn a_long_error_takes_the_footer_row_rather_than_being_cut() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let bad = dir.path().join("broken.toml");
    std::fs::write(&bad, "name = \"x\"\n[[station]]\ny = \"zero\"\n").expect("write");
    press(&mut app, "o");
    press(&mut app, &format!("{}\n", bad.display()));
    let reason = app.status.text.clone();
    assert!(app.status.error, "{reason}");
    press(&mut app, "\u{1b}");
    let rows = lines(&draw(&app, 80, 24));
    let shown = words(&format!("{} {}", rows[22], rows[23]));
    // The end of the reason is on screen (the path may be shortened, the reason is not).
    let tail = words(reason.rsplit(": ").next().expect("reason"));
    assert!(shown.contains(&tail), "{shown}\nwanted {tail}");
}

fn named(name: &str) -> Wing {
    let mut wing = tapered();
    wing.name = name.to_string();
    wing
}

#[test]
fn the_current_wings_whole_name_is_in_the_wing_bar() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    app.docs[0].wing.name = "Sailplane, 18 m, double taper".into();
    for name in [
        "Solar high-altitude strip, 60 m",
        "Survey drone, 3.2 m",
        "Light trainer, flaps 10",
    ] {
        app.docs
            .push(Doc::new(named(name), None, Method::default()));
    }
    for current in 0..4 {
        app.current = current;
        let name = app.doc().title().to_string();
        let bar = &lines(&draw(&app, 80, 24))[0];
        assert!(bar.contains(&name), "{name} not whole in {bar}");
        assert!(bar.contains(&format!("▸{}:", current + 1)), "{bar}");
    }
}

#[test]
fn with_many_wings_the_current_one_stays_visible() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    for i in 2..=14 {
        app.docs.push(Doc::new(
            named(&format!("Study wing number {i}")),
            None,
            Method::default(),
        ));
    }
    app.current = 11;
    let bar = lines(&draw(&app, 80, 24))[0].trim_end().to_string();
    assert!(bar.contains("▸12:Study wing number 12*"), "{bar}");
    assert!(bar.contains('+'), "left-out wings are counted: {bar}");
    assert!(bar.chars().count() <= 80);
}

#[test]
fn table_columns_are_whole_and_the_border_intact() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "\t");
    let rows = lines(&draw(&app, 80, 24));
    let title = &rows[2];
    assert!(title.contains("cols 1-5 of 8"), "{title}");
    let right = title.chars().position(|c| c == '┐').expect("corner");
    for row in &rows[3..6] {
        assert_eq!(row.chars().nth(right), Some('│'), "{row}");
    }
    // Moving to the last column scrolls the columns; the cursor's column is shown whole.
    press(&mut app, "lllllll");
    let rows = lines(&draw(&app, 80, 24));
    assert!(rows[2].contains("of 8"), "{}", rows[2]);
    assert!(rows[3].contains("cm0"), "{}", rows[3]);
}

#[test]
fn the_stall_marker_never_hides_an_axis_end() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut wing = tapered();
    // Nose-up tip and a weak tip section: the first stall is at the tip.
    wing.stations[2].twist_deg = 4.0;
    wing.airfoils.get_mut("tip").expect("tip").cl_max = 0.9;
    let app = tui_support::app_with(
        wing,
        gammaline::tui::theme::Theme::monochrome(gammaline::tui::theme::UNICODE),
        dir.path(),
    );
    let s = app.doc().solved.as_ref().expect("solves");
    assert!(
        s.first_stall.expect("stalls").y > 4.0,
        "stall near the right tip"
    );
    for width in 80..=120 {
        let rows = lines(&draw(&app, width, 24));
        let axis = rows
            .iter()
            .find(|r| r.contains("│y m -5.00"))
            .unwrap_or_else(|| panic!("axis at {width}:\n{}", rows.join("\n")));
        assert!(axis.contains('▲'), "{axis}");
        let numbers = axis.replace('▲', " ");
        assert!(
            numbers.contains(" 5.00"),
            "right end readable at {width}: {axis}"
        );
    }
}
