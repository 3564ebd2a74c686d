//! Edits that do what they say and variants that can be told apart: an inserted station
//! leaves the wing unchanged (airfoil blend included), a save writes the shortest decimal and
//! keeps comments with their station, a switch from alpha to cl drops the stale comment, tabs
//! and notebook lines name the file, and a failure stays on screen until seen.

mod tui_support;

use std::fs;
use std::path::Path;

use crossterm::event::KeyCode;
use gammaline::report;
use gammaline::tui::app::App;
use gammaline::tui::{build_app, LaunchOptions};
use tui_support::{app, draw, key, lines, press, write_tapered, TAPERED};

fn launch(dir: &Path, files: Vec<std::path::PathBuf>) -> App {
    build_app(&LaunchOptions {
        session_dir: Some(dir.join("session")),
        files,
        ..LaunchOptions::default()
    })
}

/// The numbers a designer reads off a solution, for comparing two wings.
fn results(app: &App) -> Vec<f64> {
    let s = app.doc().solved.as_ref().expect("solved");
    let (c, f) = (&s.coefficients, &s.flight);
    vec![
        c.cl,
        c.cdi,
        c.cdp,
        c.cl_roll,
        c.cn,
        f.right_root_bending_moment,
        f.left_root_bending_moment,
    ]
}

fn assert_close(a: &[f64], b: &[f64]) {
    for (x, y) in a.iter().zip(b) {
        // Round-off only: the wing is the same piecewise-linear wing ("common practice, no
        // source": a relative tolerance well above double round-off).
        assert!((x - y).abs() <= 1e-9 * x.abs().max(1e-6), "{a:?} vs {b:?}");
    }
}

#[test]
fn inserting_between_two_airfoils_blends_them_and_leaves_the_results_unchanged() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let before = results(&app);
    // Between station 2 (root) and station 3 (tip).
    press(&mut app, "ji");
    assert_eq!(app.doc().wing.stations.len(), 4);
    let inserted = &app.doc().wing.stations[2];
    assert_ne!(
        inserted.airfoil, "root",
        "not the inner airfoil taken whole"
    );
    let blend = app.doc().wing.airfoils[&inserted.airfoil].clone();
    let (root, tip) = (
        app.doc().wing.airfoils["root"].clone(),
        app.doc().wing.airfoils["tip"].clone(),
    );
    assert!(
        (blend.alpha_zero_lift_deg - 0.5 * (root.alpha_zero_lift_deg + tip.alpha_zero_lift_deg))
            .abs()
            < 1e-12
    );
    assert!(app.status.text.contains("unchanged"), "{}", app.status.text);
    assert_close(&results(&app), &before);
    // Where one airfoil lies on both sides, that airfoil is used.
    press(&mut app, "ki");
    assert_eq!(app.doc().wing.stations[1].airfoil, "root");
    assert_close(&results(&app), &before);
}

/// A wing whose inserted station lands on 0.5 * (0.56 + 0.6), which is not 0.58 in doubles,
/// with comments on its stations and its condition.
const COMMENTED: &str = r#"name = "Commented"
symmetric = true

# root station
[[station]]
y = 0.0
chord = 0.56
twist = 0.0
airfoil = "a"

# middle station
[[station]]
y = 2.5
chord = 0.6  # kink
twist = 0.0
airfoil = "a"

# tip station
[[station]]
y = 5.0
chord = 0.4
twist = -2.0
airfoil = "a"

[airfoil.a]
lift_slope = 6.2
alpha_zero_lift = -2.0
cl_max = 1.4
cd0 = 0.008

[condition]
# cruise angle
alpha = 4.0  # deg, from the cruise trim
speed = 30.0
"#;

fn commented(dir: &Path) -> (App, std::path::PathBuf) {
    let path = dir.join("commented.toml");
    fs::write(&path, COMMENTED).expect("write");
    (launch(dir, vec![path.clone()]), path)
}

#[test]
fn an_inserted_station_is_saved_as_the_shortest_decimal() {
    let dir = tempfile::tempdir().expect("temp dir");
    let (mut app, path) = commented(dir.path());
    press(&mut app, "is");
    let text = fs::read_to_string(&path).expect("read");
    assert!(text.contains("chord = 0.58\n"), "{text}");
    assert!(!text.contains("0.5800000000000001"), "{text}");
    assert!(!app.doc().unsaved(), "saved is what is shown");
}

#[test]
fn comments_stay_with_their_station_after_an_insert_and_an_edit() {
    let dir = tempfile::tempdir().expect("temp dir");
    let (mut app, path) = commented(dir.path());
    // Insert between the root and the middle station, then edit the middle one's chord.
    press(&mut app, "ijl>s");
    assert_eq!(app.doc().wing.stations[2].chord, 0.7);
    let text = fs::read_to_string(&path).expect("read");
    let middle = text.find("# middle station").expect("middle comment kept");
    let kink = text
        .find("chord = 0.7  # kink")
        .expect("kink comment on its value");
    let y_middle = text.find("y = 2.5").expect("middle station");
    let y_inserted = text.find("y = 1.25").expect("inserted station");
    assert!(
        y_inserted < middle && middle < y_middle && y_middle < kink,
        "{text}"
    );
    let tip = text.find("# tip station").expect("tip comment kept");
    assert!(tip < text.find("y = 5").expect("tip"), "{text}");
}

#[test]
fn switching_the_condition_from_alpha_to_cl_drops_the_comments_about_alpha() {
    let dir = tempfile::tempdir().expect("temp dir");
    let (mut app, path) = commented(dir.path());
    press(&mut app, "ts");
    let text = fs::read_to_string(&path).expect("read");
    assert!(text.contains("\ncl = "), "{text}");
    assert!(!text.contains("cruise angle"), "{text}");
    assert!(!text.contains("cruise trim"), "{text}");
    assert!(
        text.contains("# middle station"),
        "other comments stay: {text}"
    );
}

#[test]
fn wings_of_the_same_name_show_their_file_stems_in_the_tabs() {
    let dir = tempfile::tempdir().expect("temp dir");
    let first = write_tapered(dir.path());
    let second = dir.path().join("tapered-longer.toml");
    fs::write(&second, TAPERED.replace("y = 5.0", "y = 5.5")).expect("write");
    let app = launch(dir.path(), vec![first, second]);
    let bar = &lines(&draw(&app, 80, 24))[0];
    assert!(bar.contains("tapered ("), "{bar}");
    assert!(bar.contains("tapered-longer"), "{bar}");
}

#[test]
fn the_notebook_line_names_the_file_and_marks_unsaved_edits() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "yl>y");
    let notebook = fs::read_to_string(dir.path().join("notebook.txt")).expect("notebook");
    let rows: Vec<&str> = notebook.lines().collect();
    assert_eq!(rows.len(), 2, "{notebook}");
    assert!(rows[0].contains("file ") && rows[0].contains("tapered.toml"));
    assert!(!rows[0].contains("unsaved"), "{}", rows[0]);
    let hash_then_mark =
        rows[1].find("| wing ").expect("hash") < rows[1].find("(unsaved edits)").expect("mark");
    assert!(hash_then_mark, "{}", rows[1]);
}

#[test]
fn the_line_gives_the_root_moment_of_each_half_when_they_differ() {
    let dir = tempfile::tempdir().expect("temp dir");
    let app = app(dir.path());
    let (wing, s) = (&app.doc().wing, app.doc().solved.as_ref().expect("solved"));
    let even = report::line(wing, s, None);
    assert!(even.contains(" N m each half"), "{even}");
    // The aileron deflected: the halves carry different loads.
    let mut rolled = wing.clone();
    rolled.controls[0].deflection_deg = 10.0;
    let s = gammaline::tui::doc::solve(&rolled, Default::default()).expect("solves");
    let line = report::line(&rolled, &s, None);
    assert!(
        line.contains("Mroot right ") && line.contains(" left "),
        "{line}"
    );
}

#[test]
fn a_failed_save_stays_on_screen_until_a_frame_has_shown_it() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    fs::write(
        dir.path().join("tapered.toml"),
        TAPERED.replace("Tapered", "Their"),
    )
    .expect("write");
    press(&mut app, "l>");
    // Typed ahead, before the next frame: save (refused), then switch wings (good news).
    app.handle_key(key(KeyCode::Char('s')));
    app.handle_key(key(KeyCode::Char(']')));
    assert!(app.status.error);
    assert!(
        app.status.text.contains("changed on disk"),
        "{}",
        app.status.text
    );
    // Once seen, later messages replace it as usual.
    app.status_drawn();
    app.handle_key(key(KeyCode::Char(']')));
    assert!(!app.status.error, "{}", app.status.text);
}

#[test]
fn no_station_is_inserted_beside_a_table_airfoil_of_another_name_and_the_reason_is_said() {
    let dir = tempfile::tempdir().expect("temp dir");
    let example = Path::new(env!("CARGO_MANIFEST_DIR")).join("wings/ridge-courier.toml");
    let mut app = launch(dir.path(), vec![example]);
    let before = app.doc().wing.clone();
    // Between station 2 (`outboard`) and station 3 (`tip`, given by a table).
    press(&mut app, "ji");
    assert_eq!(app.doc().wing, before, "nothing inserted");
    assert!(app.status.error);
    assert!(
        app.status.text.contains("table airfoil"),
        "{}",
        app.status.text
    );
    assert!(app.status.text.contains("station 2"), "{}", app.status.text);
}
