//! Saving never loses a user's work: a file changed behind the workbench's back is not
//! overwritten unasked, two workbenches on one file or one session say so, a failed session
//! write makes the quit question say the edits exist only in memory, a file opens in one tab,
//! and a save keeps what the file is (link, permissions, read-only, bundled example).

mod tui_support;

use std::fs;
use std::os::unix::fs::PermissionsExt as _;
use std::path::Path;

use gammaline::session;
use gammaline::tui::app::{App, Mode};
use gammaline::tui::{build_app, persist, LaunchOptions};
use tui_support::{app, draw, lines, press, retype, write_tapered, TAPERED};

fn launch(dir: &Path, files: Vec<std::path::PathBuf>) -> App {
    build_app(&LaunchOptions {
        session_dir: Some(dir.join("session")),
        files,
        ..LaunchOptions::default()
    })
}

fn screen(app: &App) -> String {
    let rows = lines(&draw(app, 80, 24)).join(" ");
    rows.split_whitespace().collect::<Vec<_>>().join(" ")
}

/// Someone else's version of the fixture file: the same wing under another name.
fn theirs() -> String {
    TAPERED.replace("Tapered trainer", "Their trainer")
}

#[test]
fn a_file_changed_on_disk_is_not_overwritten_until_s_is_pressed_again() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let path = dir.path().join("tapered.toml");
    press(&mut app, "l>");
    fs::write(&path, theirs()).expect("their save");
    press(&mut app, "s");
    assert_eq!(fs::read_to_string(&path).expect("read"), theirs(), "kept");
    assert!(app.status.error);
    let said = &app.status.text;
    assert!(said.contains("changed on disk"), "{said}");
    assert!(
        said.contains("s again") && said.contains("R reloads") && said.contains("S saves"),
        "offers overwrite, reload and save-as: {said}"
    );
    assert!(app.doc().unsaved(), "the edit is still there");
    // Any other key disarms the overwrite.
    press(&mut app, "js");
    assert_eq!(fs::read_to_string(&path).expect("read"), theirs());
    press(&mut app, "s");
    let text = fs::read_to_string(&path).expect("read");
    assert!(
        text.contains("Tapered trainer") && text.contains("chord = 1.7"),
        "{text}"
    );
    assert!(!app.doc().unsaved());
}

#[test]
fn reloading_after_a_conflict_takes_their_file_and_undo_brings_mine_back() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let path = dir.path().join("tapered.toml");
    press(&mut app, "l>");
    let mine = app.doc().wing.clone();
    fs::write(&path, theirs()).expect("their save");
    press(&mut app, "s");
    app.status_drawn();
    press(&mut app, "R");
    assert_eq!(app.doc().wing.name, "Their trainer");
    press(&mut app, "u");
    assert_eq!(app.doc().wing, mine);
    // Their file is now what mine was based on: s writes without a question.
    press(&mut app, "s");
    assert!(!app.status.error, "{}", app.status.text);
    assert!(fs::read_to_string(&path)
        .expect("read")
        .contains("Tapered trainer"));
}

#[test]
fn two_workbenches_on_one_file_never_lose_an_edit_without_saying_so() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = write_tapered(dir.path());
    let (one, two) = (dir.path().join("one"), dir.path().join("two"));
    let mut a = launch(&one, vec![path.clone()]);
    let mut b = launch(&two, vec![path.clone()]);
    press(&mut a, "l>s");
    assert!(!a.status.error, "{}", a.status.text);
    press(&mut b, "jl<s");
    assert!(
        b.status.text.contains("changed on disk"),
        "{}",
        b.status.text
    );
    let text = fs::read_to_string(&path).expect("read");
    assert!(
        text.contains("chord = 1.7"),
        "the first save stands: {text}"
    );
}

#[test]
fn a_second_workbench_on_one_session_says_so_and_never_writes_it() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = write_tapered(dir.path());
    let mut first = launch(dir.path(), vec![path.clone()]);
    press(&mut first, "l>");
    persist::save_session(&mut first);
    let written =
        fs::read_to_string(dir.path().join("session").join(session::FILE_NAME)).expect("session");
    let mut second = launch(dir.path(), vec![]);
    assert!(second.status.error);
    assert!(
        second.status.text.contains("another workbench"),
        "{}",
        second.status.text
    );
    assert!(screen(&second).contains("another workbench"));
    // It starts from the session (its own copy of the first one's unsaved edit).
    assert_eq!(second.doc().wing, first.doc().wing);
    press(&mut second, "jl>>");
    persist::save_session(&mut second);
    let after =
        fs::read_to_string(dir.path().join("session").join(session::FILE_NAME)).expect("session");
    assert_eq!(
        after, written,
        "the second workbench left the session alone"
    );
    // Its quit question says its edits are nowhere else.
    press(&mut second, "q");
    assert!(matches!(second.mode, Mode::Confirm));
    let (question, advice) = second.quit_question();
    assert!(question.contains("only in memory"), "{question}");
    assert!(advice.expect("advice").contains("another workbench"));
    // Once the first one is gone, a new workbench takes the session over.
    drop(first);
    drop(second);
    let third = launch(dir.path(), vec![]);
    assert!(!third.status.text.contains("another workbench"));
}

#[test]
fn a_failed_session_write_makes_the_quit_question_say_the_edits_are_only_in_memory() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    // A file where the session folder should be.
    fs::write(dir.path().join("session"), "in the way").expect("write");
    press(&mut app, "l>");
    persist::save_session(&mut app);
    assert!(app.status.error && app.status.text.contains("session not saved"));
    press(&mut app, "q");
    assert!(matches!(app.mode, Mode::Confirm));
    let rows = lines(&draw(&app, 80, 24));
    let text = rows.join("\n");
    assert!(text.contains("only in memory"), "{text}");
    assert!(!text.contains("session keeps"), "{text}");
    assert!(
        text.contains("s saves") && text.contains("S saves as"),
        "names what to do: {text}"
    );
    // Quitting anyway leaves a line in the shell saying the edits are gone.
    let note = gammaline::tui::lost_work(&app).expect("a note");
    assert!(
        note.contains("not kept") && note.contains("session not saved"),
        "{note}"
    );
    // When the session can be written again, the question says so again.
    press(&mut app, "n");
    fs::remove_file(dir.path().join("session")).expect("clear the way");
    press(&mut app, "q");
    let (question, advice) = app.quit_question();
    assert!(question.contains("session keeps them"), "{question}");
    assert!(advice.is_none());
    assert!(gammaline::tui::lost_work(&app).is_none());
}

#[test]
fn opening_a_file_already_open_in_the_session_goes_to_its_tab() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "l>");
    let edited = app.doc().wing.clone();
    persist::save_session(&mut app);
    let path = dir.path().join("tapered.toml");
    // By the same name twice and by another spelling of it.
    let other_spelling = dir.path().join(".").join("tapered.toml");
    let restored = launch(dir.path(), vec![path.clone(), path, other_spelling]);
    assert_eq!(restored.docs.len(), 1, "one tab per file");
    assert_eq!(restored.doc().wing, edited, "the unsaved edits are kept");
    assert!(restored.doc().unsaved());
}

#[test]
fn saving_through_a_link_keeps_the_link_and_the_permissions() {
    let dir = tempfile::tempdir().expect("temp dir");
    let target = write_tapered(dir.path());
    fs::set_permissions(&target, fs::Permissions::from_mode(0o640)).expect("chmod");
    let link = dir.path().join("link.toml");
    std::os::unix::fs::symlink("tapered.toml", &link).expect("link");
    let mut app = launch(dir.path(), vec![link.clone()]);
    press(&mut app, "l>s");
    assert!(!app.status.error, "{}", app.status.text);
    assert!(fs::symlink_metadata(&link)
        .expect("meta")
        .file_type()
        .is_symlink());
    assert!(fs::read_to_string(&target)
        .expect("read")
        .contains("chord = 1.7"));
    let mode = fs::metadata(&target).expect("meta").permissions().mode();
    assert_eq!(mode & 0o777, 0o640);
}

#[test]
fn s_on_a_read_only_file_asks_for_another_name_and_overwrites_only_when_asked_twice() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = write_tapered(dir.path());
    fs::set_permissions(&path, fs::Permissions::from_mode(0o444)).expect("chmod");
    let mut app = launch(dir.path(), vec![path.clone()]);
    press(&mut app, "l>s");
    assert!(matches!(app.mode, Mode::Edit(_)), "save-as opened");
    assert!(app.status.text.contains("read-only"), "{}", app.status.text);
    assert_eq!(fs::read_to_string(&path).expect("read"), TAPERED);
    // Enter on its own path asks once more, then overwrites and keeps the bits.
    press(&mut app, "\n");
    assert!(
        app.status.text.contains("Enter again"),
        "{}",
        app.status.text
    );
    assert_eq!(fs::read_to_string(&path).expect("read"), TAPERED);
    press(&mut app, "\n");
    assert!(matches!(app.mode, Mode::Normal), "{}", app.status.text);
    assert!(fs::read_to_string(&path)
        .expect("read")
        .contains("chord = 1.7"));
    let mode = fs::metadata(&path).expect("meta").permissions().mode();
    assert_eq!(mode & 0o777, 0o444);
}

#[test]
fn s_on_a_bundled_example_saves_as_a_new_file_and_never_over_the_example() {
    let dir = tempfile::tempdir().expect("temp dir");
    let examples = dir.path().join("wings");
    fs::create_dir(&examples).expect("mkdir");
    let example = write_tapered(&examples);
    let doc = gammaline::tui::doc::Doc::read(&example, Default::default()).expect("read");
    let mut settings = tui_support::settings(dir.path());
    settings.examples = Some(examples.clone());
    let theme = gammaline::tui::theme::Theme::monochrome(gammaline::tui::theme::UNICODE);
    let mut app = App::new(vec![doc], theme, settings);
    press(&mut app, "l>s");
    assert!(matches!(app.mode, Mode::Edit(_)), "save-as opened");
    assert!(
        app.status.text.contains("bundled example"),
        "{}",
        app.status.text
    );
    // Its own path is refused even when asked twice.
    retype(&mut app, &example.display().to_string());
    press(&mut app, "\n\n");
    assert_eq!(fs::read_to_string(&example).expect("read"), TAPERED);
    let mine = dir.path().join("mine.toml");
    retype(&mut app, &mine.display().to_string());
    press(&mut app, "\n");
    assert!(matches!(app.mode, Mode::Normal), "{}", app.status.text);
    assert!(fs::read_to_string(&mine)
        .expect("read")
        .contains("chord = 1.7"));
    assert_eq!(fs::read_to_string(&example).expect("read"), TAPERED);
}

#[test]
fn a_save_into_a_read_only_folder_keeps_the_edits_and_offers_save_as() {
    let dir = tempfile::tempdir().expect("temp dir");
    let folder = dir.path().join("locked");
    fs::create_dir(&folder).expect("mkdir");
    let path = write_tapered(&folder);
    let mut app = launch(dir.path(), vec![path.clone()]);
    fs::set_permissions(&folder, fs::Permissions::from_mode(0o555)).expect("chmod");
    press(&mut app, "l>s");
    let probe = folder.join("probe");
    let root_can_write = fs::write(&probe, "").is_ok();
    fs::set_permissions(&folder, fs::Permissions::from_mode(0o755)).expect("chmod back");
    if root_can_write {
        eprintln!("skipped: permissions do not bind this user (root)");
        return;
    }
    assert!(matches!(app.mode, Mode::Edit(_)), "save-as opened");
    assert!(app.doc().unsaved());
    assert_eq!(fs::read_to_string(&path).expect("read"), TAPERED);
}

/// A wing file of `n` stations with a comment on the first one.
fn long_wing(n: usize) -> String {
    let mut text = String::from("name = \"long\"\nsymmetric = true\n");
    for i in 0..n {
        let y = i as f64 * 0.001;
        let chord = 1.0 - 0.5 * y / (n as f64 * 0.001);
        let note = if i == 0 { "  # root" } else { "" };
        text.push_str(&format!(
            "\n[[station]]\ny = {y}{note}\nchord = {chord}\ntwist = 0.0\nairfoil = \"a\"\n"
        ));
    }
    text.push_str(
        "\n[airfoil.a]\nlift_slope = 6.2\nalpha_zero_lift = -2.0\ncl_max = 1.4\ncd0 = 0.008\n",
    );
    text.push_str("\n[condition]\nalpha = 4.0\nspeed = 30.0\n");
    text
}

#[test]
#[ignore = "about a minute in a debug build: run with `cargo test --release -- --ignored`"]
fn a_50000_station_wing_saves_from_the_workbench_with_its_comments() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = dir.path().join("long.toml");
    fs::write(&path, long_wing(50_000)).expect("write");
    let mut app = launch(dir.path(), vec![path.clone()]);
    assert_eq!(app.doc().wing.stations.len(), 50_000, "{}", app.status.text);
    // An edit at the root and one at the tip: the stretch between them is the whole wing.
    press(&mut app, "l>G>s");
    assert!(!app.status.error, "{}", app.status.text);
    let text = fs::read_to_string(&path).expect("read");
    assert!(
        text.contains("y = 0  # root") || text.contains("y = 0.0  # root"),
        "comment kept"
    );
    let again = gammaline::wing::file::parse(&text, &path).expect("reads back");
    assert_eq!(again, app.doc().wing);
}

#[test]
fn unsaved_edits_restored_from_the_session_do_not_overwrite_a_file_changed_meanwhile() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = write_tapered(dir.path());
    let mut first = launch(dir.path(), vec![path.clone()]);
    press(&mut first, "l>");
    persist::save_session(&mut first);
    drop(first);
    // Someone changes the file while no workbench is open.
    fs::write(&path, theirs()).expect("their save");
    let mut again = launch(dir.path(), vec![]);
    assert!(again.doc().unsaved(), "the edit came back");
    press(&mut again, "s");
    assert!(
        again.status.text.contains("changed on disk"),
        "{}",
        again.status.text
    );
    assert_eq!(fs::read_to_string(&path).expect("read"), theirs());
}
