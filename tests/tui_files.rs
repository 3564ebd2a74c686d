//! Opening, saving and restoring as a user meets them: plain messages for a missing file or
//! a folder, the reason of a refused path in view, save-as never replaces another file
//! unasked, and a restart says what it brought back.

mod tui_support;

use gammaline::tui::app::Mode;
use gammaline::tui::{build_app, persist, LaunchOptions};
use tui_support::{app, draw, lines, press, retype};

fn prompt(app: &mut gammaline::tui::app::App, key: &str, text: &str) {
    press(app, key);
    retype(app, text);
    press(app, "\n");
}

#[test]
fn a_refused_path_shows_its_reason_while_the_prompt_is_open() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let missing = dir.path().join("missing.toml");
    prompt(&mut app, "o", &missing.display().to_string());
    assert!(matches!(app.mode, Mode::Edit(_)));
    let rows = lines(&draw(&app, 120, 24));
    assert!(rows[22].starts_with("open wing file: "), "{}", rows[22]);
    assert!(
        rows[23].starts_with("no such file: "),
        "the reason is on screen: {}",
        rows[23]
    );
    assert!(rows[23].contains("missing.toml"));
    prompt(&mut app, "\u{1b}o", &dir.path().display().to_string());
    assert!(
        app.status.text.contains("is a folder"),
        "{}",
        app.status.text
    );
}

#[test]
fn save_as_asks_before_replacing_another_file() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let other = dir.path().join("other.toml");
    std::fs::write(&other, "keep me").expect("write");
    prompt(&mut app, "S", &other.display().to_string());
    assert!(matches!(app.mode, Mode::Edit(_)), "asks first");
    assert_eq!(std::fs::read_to_string(&other).expect("read"), "keep me");
    assert!(app.status.text.contains("exists"), "{}", app.status.text);
    // Enter again on the same path replaces it.
    press(&mut app, "\n");
    assert!(matches!(app.mode, Mode::Normal));
    assert!(std::fs::read_to_string(&other)
        .expect("read")
        .contains("Tapered trainer"));
    assert_eq!(app.doc().path.as_deref(), Some(other.as_path()));
    // Its own file is saved over without a question.
    prompt(&mut app, "S", &other.display().to_string());
    assert!(matches!(app.mode, Mode::Normal));
}

#[test]
fn save_as_into_a_missing_folder_says_so() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let target = dir.path().join("no-such-folder").join("w.toml");
    prompt(&mut app, "S", &target.display().to_string());
    assert!(
        app.status
            .text
            .starts_with("cannot save: there is no folder"),
        "{}",
        app.status.text
    );
    assert!(!target.exists());
}

#[test]
fn a_restart_says_that_unsaved_edits_came_back() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "l>");
    persist::save_session(&mut app);
    let options = LaunchOptions {
        session_dir: Some(dir.path().join("session")),
        ..LaunchOptions::default()
    };
    let restored = build_app(&options);
    assert!(restored.doc().unsaved());
    assert!(
        restored
            .status
            .text
            .contains("restored 1 wing(s) with unsaved edits"),
        "{}",
        restored.status.text
    );
    assert!(!restored.status.error, "good news is not an error");
}

#[test]
fn opening_only_broken_files_keeps_the_last_session_and_lists_every_problem() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "p");
    persist::save_session(&mut app);
    let broken = dir.path().join("broken.toml");
    std::fs::write(&broken, "name = \"b\"\n[[station]]\ny = \"zero\"\n").expect("write");
    let options = LaunchOptions {
        session_dir: Some(dir.path().join("session")),
        files: vec![broken, dir.path().join("missing.toml")],
        ..LaunchOptions::default()
    };
    let restored = build_app(&options);
    assert_eq!(
        restored.doc().title(),
        "Tapered trainer",
        "not a blank starter"
    );
    let text = &restored.status.text;
    assert!(
        text.contains("broken.toml") && text.contains("no such file"),
        "{text}"
    );
    assert!(restored.status.error);
    // Both problems are on screen: the status line takes the rows it needs.
    let screen = lines(&draw(&restored, 80, 24)).join(" ");
    let screen = screen.split_whitespace().collect::<Vec<_>>().join(" ");
    assert!(screen.contains("no such file:"), "{screen}");
    assert!(screen.contains("missing.toml"), "{screen}");
    // The pinned reference keeps its tag on its wing.
    assert_eq!(restored.reference.as_ref().map(|r| r.source), Some(0));
}

#[test]
fn a_wing_left_out_of_the_session_takes_its_reference_tag_with_it() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "p");
    persist::save_session(&mut app);
    // Opening another file drops the saved wing the reference came from.
    let other = dir.path().join("other.toml");
    std::fs::copy(dir.path().join("tapered.toml"), &other).expect("copy");
    let options = LaunchOptions {
        session_dir: Some(dir.path().join("session")),
        files: vec![other],
        ..LaunchOptions::default()
    };
    let restored = build_app(&options);
    assert_eq!(restored.docs.len(), 1);
    let bar = &lines(&draw(&restored, 80, 24))[0];
    assert!(!bar.contains("(ref)"), "no wing wears the tag: {bar}");
    assert!(restored.reference.is_some(), "the reference stays pinned");
}

#[test]
fn saving_a_table_wing_from_the_workbench_keeps_its_table_files_and_arrays() {
    use gammaline::solver::Method;
    use gammaline::tui::app::App;
    use gammaline::tui::doc::Doc;
    use gammaline::tui::theme::{Theme, UNICODE};
    let dir = tempfile::tempdir().expect("temp dir");
    let wings = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("wings");
    for name in [
        "ridge-courier.toml",
        "ridge-courier-root.csv",
        "ridge-courier-outboard.csv",
    ] {
        std::fs::copy(wings.join(name), dir.path().join(name)).expect("copy");
    }
    let path = dir.path().join("ridge-courier.toml");
    let original = std::fs::read_to_string(&path).expect("read");
    let wing = gammaline::wing::file::read(&path).expect("loads");
    let doc = Doc::new(wing, Some(path.clone()), Method::default());
    let settings = tui_support::settings(dir.path());
    let mut app = App::new(vec![doc], Theme::monochrome(UNICODE), settings);
    // Second station's chord, edited, then saved.
    press(&mut app, "jl\n");
    retype(&mut app, "0.35");
    press(&mut app, "\ns");
    let saved = std::fs::read_to_string(&path).expect("read");
    assert!(!app.doc().unsaved(), "{}", app.status.text);
    let changed: Vec<&str> = saved.lines().filter(|l| !original.contains(l)).collect();
    assert_eq!(changed, ["chord = 0.35"], "{saved}");
    assert!(saved.contains("table = \"ridge-courier-root.csv\""));
}

#[test]
fn a_table_wing_saved_into_another_folder_still_finds_its_csv_tables() {
    use gammaline::solver::Method;
    use gammaline::tui::app::App;
    use gammaline::tui::doc::Doc;
    use gammaline::tui::theme::{Theme, UNICODE};
    let dir = tempfile::tempdir().expect("temp dir");
    let (here, elsewhere, below) = (
        dir.path().join("here"),
        dir.path().join("elsewhere"),
        dir.path().join("here/variants"),
    );
    for folder in [&here, &elsewhere, &below] {
        std::fs::create_dir_all(folder).expect("folder");
    }
    let wings = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("wings");
    for name in [
        "ridge-courier.toml",
        "ridge-courier-root.csv",
        "ridge-courier-outboard.csv",
    ] {
        std::fs::copy(wings.join(name), here.join(name)).expect("copy");
    }
    let path = here.join("ridge-courier.toml");
    let wing = gammaline::wing::file::read(&path).expect("loads");
    let doc = Doc::new(wing, Some(path.clone()), Method::default());
    let settings = tui_support::settings(dir.path());
    let mut app = App::new(vec![doc], Theme::monochrome(UNICODE), settings);
    for target in [elsewhere.join("copy.toml"), below.join("copy.toml")] {
        prompt(&mut app, "S", &target.display().to_string());
        assert!(matches!(app.mode, Mode::Normal), "{}", app.status.text);
        let saved = std::fs::read_to_string(&target).expect("saved");
        assert!(
            gammaline::wing::file::read(&target).is_ok(),
            "the copy reads with its tables: {saved}"
        );
        assert!(saved.contains("# "), "comments kept: {saved}");
    }
    // The original and its tables are untouched.
    assert!(gammaline::wing::file::read(&path).is_ok());
}
