//! Sessions: round trip through the workbench, atomic writes, corrupt files survived.

mod tui_support;

use gammaline::session::{self, Session};
use gammaline::tui::{build_app, persist, LaunchOptions};
use tui_support::{app, press};

#[test]
fn a_session_round_trips_open_wings_edits_cursor_and_reference() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "p");
    press(&mut app, "jl>");
    let edited = app.doc().wing.clone();
    persist::save_session(&mut app);
    let sdir = dir.path().join("session");
    let loaded = session::load(&sdir);
    assert!(loaded.notice.is_none());
    let s: Session = loaded.session.expect("session");
    assert_eq!(s.wings.len(), 1);
    assert!(s.wings[0].recovery.is_some(), "unsaved edit kept");
    let start = persist::restore(&s, &sdir, Default::default());
    assert_eq!(start.docs.len(), 1);
    let doc = &start.docs[0];
    assert_eq!(doc.wing, edited);
    assert!(doc.unsaved(), "still marked unsaved against the file");
    assert_eq!((doc.cursor.row, doc.cursor.col), (1, 1));
    let reference = start.reference.expect("reference");
    assert_eq!(reference.wing, tui_support::tapered());
}

#[test]
fn build_app_restores_the_last_session() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "l>");
    let edited = app.doc().wing.clone();
    persist::save_session(&mut app);
    let options = LaunchOptions {
        session_dir: Some(dir.path().join("session")),
        ..LaunchOptions::default()
    };
    let restored = build_app(&options);
    assert_eq!(restored.doc().wing, edited);
    assert_eq!(restored.settings.notebook, dir.path().join("notebook.txt"));
}

#[test]
fn a_corrupt_session_is_moved_aside_and_the_user_told() {
    let dir = tempfile::tempdir().expect("temp dir");
    let sdir = dir.path().join("session");
    std::fs::create_dir_all(&sdir).expect("mkdir");
    std::fs::write(sdir.join(session::FILE_NAME), "{ not json").expect("write");
    let options = LaunchOptions {
        session_dir: Some(sdir.clone()),
        files: vec![tui_support::write_tapered(dir.path())],
        ..LaunchOptions::default()
    };
    let app = build_app(&options);
    assert!(app.status.error);
    assert!(app.status.text.contains("moved aside"), "{:?}", app.status);
    let backup = sdir.join("session.json.corrupt-1");
    assert!(backup.exists());
    assert_eq!(
        std::fs::read_to_string(backup).expect("backup"),
        "{ not json"
    );
    assert_eq!(app.doc().wing.name, "Tapered trainer", "starts anyway");
}

#[test]
fn an_unparsable_recovery_copy_is_kept_aside() {
    let dir = tempfile::tempdir().expect("temp dir");
    let sdir = dir.path().join("session");
    let s = Session {
        version: session::VERSION,
        wings: vec![session::SessionWing {
            path: None,
            recovery: Some("name = [broken".into()),
            base: None,
            cursor: Default::default(),
        }],
        ..Session::default()
    };
    session::save(&sdir, &s).expect("save");
    let start = persist::restore(&s, &sdir, Default::default());
    assert!(start.docs.is_empty());
    assert!(
        start.notices[0].contains("recovery-1.toml"),
        "{:?}",
        start.notices
    );
    assert_eq!(
        std::fs::read_to_string(sdir.join("recovery-1.toml")).expect("kept"),
        "name = [broken"
    );
}

#[test]
fn atomic_write_replaces_the_whole_file() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = dir.path().join("f.json");
    session::write_atomic(&path, b"old contents that are long").expect("write");
    session::write_atomic(&path, b"new").expect("write");
    assert_eq!(std::fs::read(&path).expect("read"), b"new");
    let names: Vec<String> = std::fs::read_dir(dir.path())
        .expect("list")
        .filter_map(Result::ok)
        .map(|e| e.file_name().to_string_lossy().into_owned())
        .collect();
    assert_eq!(names, ["f.json"]);
}

#[test]
fn the_session_dir_flag_wins_over_the_environment() {
    let flag = std::path::Path::new("/tmp/from-flag");
    assert_eq!(session::dir(Some(flag)).as_deref(), Some(flag));
}
