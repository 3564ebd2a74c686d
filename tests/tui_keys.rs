//! Key sequences driven through the workbench state.

mod tui_support;

use crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use gammaline::solver::Method;
use gammaline::tui::app::{App, Mode};
use gammaline::tui::cells::Sheet;
use gammaline::tui::doc::Doc;
use gammaline::tui::theme::{Theme, UNICODE};
use gammaline::wing::file;
use tui_support::{app, app_with, draw, press, retype, shown_cl, tapered};

#[test]
fn editing_a_chord_resolves_and_changes_cl() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let before = app.doc().solved.as_ref().expect("solves").coefficients.cl;
    // Row 1, column chord; edit to 2.0.
    press(&mut app, "l\n");
    retype(&mut app, "2.0");
    press(&mut app, "\n");
    assert!(matches!(app.mode, Mode::Normal));
    assert_eq!(app.doc().wing.stations[0].chord, 2.0);
    assert!(app.doc().unsaved());
    let after = app.doc().solved.as_ref().expect("solves").coefficients.cl;
    // The solver is the reference: the app must show exactly its answer for the edited wing.
    let direct = gammaline::solver::solve(
        &app.doc().wing,
        &app.doc().wing.condition,
        Default::default(),
    )
    .expect("solves")
    .coefficients
    .cl;
    assert_eq!(after, direct);
    assert!(
        (after - before).abs() > 1e-4,
        "CL moved: {before} -> {after}"
    );
    let screen = draw(&app, 80, 24);
    let shown = shown_cl(&screen).expect("CL on screen");
    assert!((shown - after).abs() < 5e-5, "{shown} vs {after}");
}

#[test]
fn an_invalid_value_is_refused_with_the_reason_and_not_committed() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "l\n");
    retype(&mut app, "-1");
    press(&mut app, "\n");
    let Mode::Edit(editor) = &app.mode else {
        panic!("the editor stays open on a refused value")
    };
    let reason = editor.error.clone().expect("a reason");
    assert!(
        reason.contains("chord") && reason.contains("> 0"),
        "{reason}"
    );
    assert_eq!(app.doc().wing.stations[0].chord, 1.6);
    let screen = tui_support::text(&draw(&app, 80, 24));
    assert!(screen.contains("must be > 0"), "{screen}");
    // Not a number is refused too.
    retype(&mut app, "abc");
    press(&mut app, "\n");
    let Mode::Edit(editor) = &app.mode else {
        panic!("still editing")
    };
    assert!(editor
        .error
        .as_deref()
        .is_some_and(|e| e.contains("not a number")));
    press(&mut app, "\u{1b}");
    assert!(matches!(app.mode, Mode::Normal));
    assert!(!app.doc().unsaved());
}

#[test]
fn y_out_of_order_is_refused() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "j\n");
    retype(&mut app, "6");
    press(&mut app, "\n");
    assert!(matches!(app.mode, Mode::Edit(_)));
    assert_eq!(app.doc().wing.stations[1].y, 2.5);
}

#[test]
fn nudges_take_small_and_large_steps_and_undo_redo_walk_back() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "ll+");
    assert!((app.doc().wing.stations[0].twist_deg - 0.1).abs() < 1e-12);
    press(&mut app, ">");
    assert!((app.doc().wing.stations[0].twist_deg - 1.1).abs() < 1e-12);
    press(&mut app, "--");
    assert!((app.doc().wing.stations[0].twist_deg - 0.9).abs() < 1e-12);
    press(&mut app, "uuuu");
    assert_eq!(app.doc().wing.stations[0].twist_deg, 0.0);
    assert!(!app.doc().unsaved());
    press(&mut app, "U");
    assert!((app.doc().wing.stations[0].twist_deg - 0.1).abs() < 1e-12);
}

#[test]
fn insert_interpolates_duplicate_copies_delete_removes() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "i");
    let s = &app.doc().wing.stations;
    assert_eq!(s.len(), 4);
    assert_eq!((s[1].y, s[1].twist_deg), (1.25, -0.5));
    approx::assert_abs_diff_eq!(s[1].chord, 1.45, epsilon = 1e-12);
    assert_eq!(app.doc().cursor.row, 1);
    press(&mut app, "jD");
    let s = &app.doc().wing.stations;
    assert_eq!(s.len(), 5);
    assert_eq!((s[3].y, s[3].chord), (3.75, 1.3));
    press(&mut app, "d");
    assert_eq!(app.doc().wing.stations.len(), 4);
    // Deleting the root of a symmetric wing breaks a rule: refused.
    press(&mut app, "gd");
    assert_eq!(app.doc().wing.stations.len(), 4);
    assert!(
        app.status.error && app.status.text.contains("y = 0"),
        "{:?}",
        app.status
    );
}

#[test]
fn nudging_the_airfoil_cycles_the_keys() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "lll+");
    assert_eq!(app.doc().wing.stations[0].airfoil, "tip");
}

#[test]
fn condition_bar_is_edited_in_place() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "\t\t\t");
    assert_eq!(app.doc().cursor.sheet, Sheet::Condition);
    press(&mut app, "\n");
    retype(&mut app, "3");
    press(&mut app, "\n");
    assert_eq!(app.doc().wing.condition.alpha_deg, 3.0);
    let cl = app.doc().solved.as_ref().expect("solves").coefficients.cl;
    // Switch to a target CL: the same CL is kept, now as the target, rounded to what the
    // bar shows so the editor opens on the value the user reads.
    press(&mut app, "t");
    let kept = app.doc().wing.condition.target_cl.expect("target");
    assert!(
        (kept - cl).abs() <= 0.0005 && (kept * 1000.0).fract().abs() < 1e-6,
        "{kept}"
    );
    press(&mut app, "\n");
    assert_eq!(tui_support::editor_text(&app), format!("{kept}"));
    press(&mut app, "\u{1b}");
    press(&mut app, "+");
    let target = app.doc().wing.condition.target_cl.expect("target");
    let solved = app.doc().solved.as_ref().expect("solves").coefficients.cl;
    assert!((solved - target).abs() < 1e-9);
    let screen = tui_support::text(&draw(&app, 80, 24));
    assert!(screen.contains("target CL"), "{screen}");
}

#[test]
fn pin_shows_deltas_and_reference_load() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "p");
    assert!(app.reference.is_some());
    press(&mut app, "l>");
    let screen = tui_support::text(&draw(&app, 80, 24));
    assert!(screen.contains("Δ+"), "{screen}");
    assert!(screen.contains("ref "), "{screen}");
    assert!(
        screen.contains("M_root"),
        "the strip grows to hold the deltas: {screen}"
    );
    assert!(
        screen.contains("(ref)"),
        "the wing it was pinned from is marked: {screen}"
    );
}

#[test]
fn quit_asks_only_with_unsaved_work() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "q");
    assert!(app.quit, "nothing unsaved: quits at once");
    let mut app = tui_support::app(dir.path());
    press(&mut app, "l+q");
    assert!(!app.quit);
    assert!(matches!(app.mode, Mode::Confirm));
    press(&mut app, "n");
    assert!(!app.quit && matches!(app.mode, Mode::Normal));
    press(&mut app, "qN");
    assert!(
        !app.quit && matches!(app.mode, Mode::Normal),
        "a capital N (caps lock) also stays"
    );
    press(&mut app, "qY");
    assert!(app.quit, "a capital Y also quits");
}

#[test]
fn save_writes_the_file_atomically_and_revert_reads_it_back() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "l+s");
    assert!(!app.doc().unsaved(), "{:?}", app.status);
    let path = app.doc().path.clone().expect("path");
    let saved = file::read(&path).expect("saved file reads back");
    assert_eq!(saved, app.doc().wing);
    let leftovers: Vec<_> = std::fs::read_dir(dir.path())
        .expect("list")
        .filter_map(Result::ok)
        .filter(|e| e.file_name().to_string_lossy().contains(".tmp-"))
        .collect();
    assert!(leftovers.is_empty());
    press(&mut app, ">>");
    assert!(app.doc().unsaved());
    press(&mut app, "R");
    assert_eq!(app.doc().wing, saved);
    assert!(!app.doc().unsaved());
}

#[test]
fn save_as_and_open_by_path() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let copy = dir.path().join("copy.toml");
    press(&mut app, "S");
    retype(&mut app, &copy.display().to_string());
    press(&mut app, "\n");
    assert_eq!(app.doc().path.as_deref(), Some(copy.as_path()));
    assert!(copy.exists());
    press(&mut app, "o");
    retype(
        &mut app,
        &dir.path().join("missing.toml").display().to_string(),
    );
    press(&mut app, "\n");
    assert!(
        matches!(app.mode, Mode::Edit(_)),
        "a missing file keeps the prompt open"
    );
    press(&mut app, "\u{1b}");
    press(&mut app, "o");
    retype(
        &mut app,
        &dir.path().join("tapered.toml").display().to_string(),
    );
    press(&mut app, "\n");
    assert_eq!(app.docs.len(), 2);
    assert_eq!(app.current, 1);
    press(&mut app, "]");
    assert_eq!(app.current, 0);
    press(&mut app, "[");
    assert_eq!(app.current, 1);
}

#[test]
fn picker_lists_open_and_saved_wings() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    std::fs::write(
        dir.path().join("other.toml"),
        tui_support::TAPERED.replace("Tapered trainer", "Other"),
    )
    .expect("write");
    press(&mut app, "w");
    let Mode::Picker(p) = &app.mode else {
        panic!("picker open")
    };
    assert_eq!(p.entries.len(), 2, "{:?}", p.entries);
    press(&mut app, "j\n");
    assert_eq!(app.docs.len(), 2);
    assert_eq!(app.doc().wing.name, "Other");
}

#[test]
fn copy_appends_the_result_line_to_the_notebook() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "y");
    assert!(
        app.status.text.contains("sent to clipboard"),
        "{:?}",
        app.status
    );
    assert!(app.status.text.contains("notebook.txt"));
    assert_eq!(app.outbox.len(), 1);
    assert!(app.outbox[0].starts_with("\u{1b}]52;c;") && app.outbox[0].ends_with('\u{7}'));
    let notebook = std::fs::read_to_string(dir.path().join("notebook.txt")).expect("notebook");
    let doc = app.doc();
    let line = gammaline::report::line(
        &doc.wing,
        doc.solved.as_ref().expect("solved"),
        doc.wing.condition.target_cl,
    );
    // The result line, then the file it came from.
    assert!(notebook.contains(&line), "{notebook}");
    assert!(notebook.trim_end().ends_with("tapered.toml"), "{notebook}");
    assert!(notebook.starts_with("20"), "timestamped: {notebook}");
}

#[test]
fn a_copied_line_says_when_the_wing_was_solved_for_a_target_cl() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut wing = tapered();
    wing.condition.target_cl = Some(0.55);
    let mut app = app_with(wing, Theme::colour(UNICODE), dir.path());
    press(&mut app, "y");
    let notebook = std::fs::read_to_string(dir.path().join("notebook.txt")).expect("notebook");
    let alpha = app
        .doc()
        .solved
        .as_ref()
        .expect("solved")
        .coefficients
        .alpha_deg;
    let expected = format!("target CL 0.5500 -> alpha {alpha:.2} deg");
    assert!(notebook.contains(&expected), "{expected} not in {notebook}");
}

#[test]
fn help_shows_the_cautions_and_closes() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "?");
    let screen = tui_support::text(&draw(&app, 100, 40));
    assert!(screen.contains("preliminary design estimates"), "{screen}");
    assert!(screen.contains("airworthiness"));
    press(&mut app, "\u{1b}");
    assert!(matches!(app.mode, Mode::Normal));
}

/// The help lists each binding under each of its modes with all its keys; every one of those
/// keys, pressed in that mode, must do what the help says. A key claimed twice in one mode (the
/// earlier binding wins) would make the help promise something the key does not do.
#[test]
fn every_key_the_help_lists_does_what_it_says() {
    use gammaline::tui::keymap::{self, ModeKind, BINDINGS};
    for mode in ModeKind::ALL {
        for binding in BINDINGS.iter().filter(|b| b.modes.contains(&mode)) {
            for key in binding.keys {
                let modifiers = if key.ctrl {
                    KeyModifiers::CONTROL
                } else {
                    KeyModifiers::NONE
                };
                let got = keymap::lookup(mode, &KeyEvent::new(key.code, modifiers));
                assert_eq!(
                    got,
                    Some(binding.action),
                    "{mode:?}: {} listed for {:?} ({})",
                    key.label(),
                    binding.action,
                    binding.help
                );
            }
        }
    }
}

#[test]
fn typing_replaces_the_old_value_and_ctrl_u_clears() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    // Chord of station 1: the old value is selected, typing replaces it.
    press(&mut app, "l\n");
    assert_eq!(tui_support::editor_text(&app), "1.6");
    press(&mut app, "1.7\n");
    assert_eq!(app.doc().wing.stations[0].chord, 1.7);
    // The arrows keep the old value for changing one digit.
    app.handle_key(tui_support::key(KeyCode::Enter));
    app.handle_key(tui_support::key(KeyCode::Left));
    press(&mut app, "5");
    assert_eq!(tui_support::editor_text(&app), "1.57");
    // Ctrl-U clears to the start of the line, as in a shell.
    app.handle_key(KeyEvent::new(KeyCode::Char('u'), KeyModifiers::CONTROL));
    assert_eq!(tui_support::editor_text(&app), "7");
    press(&mut app, "\u{1b}");
    // Enter on an untouched cell is not an edit: nothing to undo, nothing unsaved.
    let mut fresh = tui_support::app(dir.path());
    press(&mut fresh, "l\n\n");
    assert!(!fresh.doc().unsaved());
    press(&mut fresh, "u");
    assert!(fresh.status.error, "{}", fresh.status.text);
}

#[test]
fn nudged_values_open_in_the_editor_without_float_noise() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    // Twist of station 2 is -1.0; seven small steps of 0.1 land on -0.3.
    press(&mut app, "jll+++++++\n");
    assert_eq!(tui_support::editor_text(&app), "-0.3");
    assert_eq!(gammaline::tui::cells::short_exact(0.1 + 0.2), "0.3");
    assert_eq!(gammaline::tui::cells::short_exact(0.0375), "0.0375");
    assert_eq!(gammaline::tui::cells::short_exact(1e-7), "0.0000001");
}

#[test]
fn deleting_refuses_clearly_at_two_stations_and_for_used_airfoils() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "jd");
    assert_eq!(app.doc().wing.stations.len(), 2);
    press(&mut app, "d");
    assert_eq!(app.doc().wing.stations.len(), 2);
    assert!(app.status.error);
    assert_eq!(
        app.status.text,
        "cannot delete: a wing needs at least 2 stations"
    );
    press(&mut app, "Gd");
    assert_eq!(app.doc().wing.stations.len(), 2);
    // Airfoil `root` is used by station 1.
    press(&mut app, "\td");
    assert_eq!(app.doc().wing.airfoils.len(), 2);
    assert!(app
        .status
        .text
        .starts_with("cannot delete airfoil `root`: station 1 uses it"));
    // Undo brings the deleted station back.
    press(&mut app, "u");
    assert_eq!(app.doc().wing.stations.len(), 3);
}

#[test]
fn a_key_that_is_not_bound_says_so_and_names_the_other_case() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    // `n` is the quit question's "stay"; in normal mode the notebook is `N`.
    press(&mut app, "n");
    assert!(matches!(app.mode, Mode::Normal));
    assert_eq!(
        app.status.text,
        "n is not a key here; N does: choose the notebook file (? lists the keys)"
    );
    press(&mut app, "N");
    assert!(
        matches!(app.mode, Mode::Edit(_)),
        "N opens the notebook prompt"
    );
    press(&mut app, "\x1b");
    press(&mut app, "Z");
    assert_eq!(app.status.text, "Z is not a key here (? lists the keys)");
}

#[test]
fn saving_keeps_the_files_comments_and_layout() {
    let dir = tempfile::tempdir().expect("temp dir");
    let original = std::fs::read_to_string(concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/wings/survey-drone.toml"
    ))
    .expect("example reads");
    let path = dir.path().join("drone.toml");
    std::fs::write(&path, &original).expect("write");
    let wing = file::read(&path).expect("reads");
    let doc = Doc::new(wing, Some(path.clone()), Method::default());
    let mut app = App::new(
        vec![doc],
        Theme::monochrome(UNICODE),
        tui_support::settings(dir.path()),
    );
    // Root chord 0.30 -> 0.32, then a station halfway to the tip, then save.
    press(&mut app, "l\n");
    retype(&mut app, "0.32\n");
    press(&mut app, "is");
    assert!(!app.doc().unsaved(), "{:?}", app.status);
    assert_eq!(app.doc().wing.stations.len(), 3);
    let saved = std::fs::read_to_string(&path).expect("saved");
    let comments = |t: &str| -> Vec<String> {
        t.lines()
            .filter_map(|l| l.find('#').map(|at| l[at..].to_string()))
            .collect()
    };
    assert_eq!(comments(&saved), comments(&original), "{saved}");
    assert!(saved.contains("chord = 0.32              # m\n"), "{saved}");
    assert_eq!(saved.matches("[[station]]").count(), 3, "{saved}");
    assert_eq!(file::read(&path).expect("reads back"), app.doc().wing);
}

#[test]
fn a_condition_change_re_solves_like_a_fresh_solve() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    // Solution has no PartialEq: its Debug text holds every number at full precision.
    let fresh = |app: &App| {
        let s = gammaline::tui::doc::solve(&app.doc().wing, Method::default());
        format!("{s:?}")
    };
    let shown = |app: &App| format!("{:?}", app.doc().solved);
    // To the condition bar (stations, airfoils, controls, condition), alpha up a step.
    press(&mut app, "\t\t\t+");
    assert_eq!(app.doc().cursor.sheet, Sheet::Condition);
    assert_eq!(app.doc().wing.condition.alpha_deg, 6.1, "{:?}", app.status);
    assert_eq!(shown(&app), fresh(&app));
    // Then a planform change: the kept system must not be reused.
    press(&mut app, "\tl+");
    assert_eq!(app.doc().wing.stations[0].chord, 1.61, "{:?}", app.status);
    assert_eq!(shown(&app), fresh(&app));
    press(&mut app, "\t\t\t-");
    assert_eq!(shown(&app), fresh(&app));
}

#[test]
fn a_table_airfoils_derived_values_are_read_only_and_its_cl_max_editable() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("wings/ridge-courier.toml");
    let wing = file::read(&path).expect("loads");
    let mut app = app_with(wing.clone(), Theme::monochrome(UNICODE), dir.path());
    // Airfoil pane, first row (outboard), lift-slope column: neither a nudge nor the editor.
    press(&mut app, "\tl+");
    assert!(
        app.status.error && app.status.text.contains("table"),
        "{:?}",
        app.status
    );
    press(&mut app, "\n");
    assert!(
        matches!(app.mode, Mode::Normal),
        "no editor on a read-only cell"
    );
    assert_eq!(app.doc().wing, wing);
    // cl_max (two columns further) is the user's own.
    press(&mut app, "ll\n");
    retype(&mut app, "1.25");
    press(&mut app, "\n");
    assert_eq!(app.doc().wing.airfoils["outboard"].cl_max, 1.25);
}

#[test]
fn a_linear_airfoils_cm0_is_edited_in_the_airfoil_pane_and_moves_cm() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let before = app.doc().solved.as_ref().expect("solves").coefficients.cm;
    // Airfoil pane, the cm0 column (the last of eight).
    press(&mut app, "\tlllllll\n");
    retype(&mut app, "-0.04");
    press(&mut app, "\n");
    let key = app
        .doc()
        .wing
        .airfoils
        .keys()
        .next()
        .expect("an airfoil")
        .clone();
    assert_eq!(app.doc().wing.airfoils[&key].cm0, -0.04);
    let after = app.doc().solved.as_ref().expect("solves").coefficients.cm;
    assert!(after < before - 0.01, "{before} -> {after}");
}
