//! The workbench's method switch and its on-demand CL_max.

mod tui_support;

use tui_support::{app, draw, press, text};

#[test]
fn m_switches_every_wing_to_the_other_method_and_the_strip_says_which() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    assert!(text(&draw(&app, 120, 40)).contains("method series 60"));
    let series_cl = app.doc().solved.as_ref().expect("solved").coefficients.cl;
    press(&mut app, "m");
    assert!(
        app.status.text.contains("horseshoe vortices"),
        "{:?}",
        app.status
    );
    let s = app
        .doc()
        .solved
        .as_ref()
        .expect("solved by the vortex method");
    assert_eq!(s.method.short_name, "vortex");
    assert!((s.coefficients.cl - series_cl).abs() < 0.05 * series_cl);
    assert!(text(&draw(&app, 120, 40)).contains("method vortex 60"));
    press(&mut app, "m");
    assert_eq!(
        app.doc().solved.as_ref().expect("solved").method.short_name,
        "series"
    );
}

#[test]
fn capital_m_finds_the_cl_max_of_the_current_wing() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "mM");
    assert!(!app.status.error, "{:?}", app.status);
    assert!(app.status.text.starts_with("CL_max "), "{:?}", app.status);
    assert!(app.status.text.contains("vortex"), "{:?}", app.status);
}
