//! docs/workbench.md carries the key table and the screens generated from the code; this
//! test fails when they drift. Regenerate with `GAMMALINE_UPDATE_DOCS=1 cargo test --test
//! tui_docs`.

mod tui_support;

use std::path::Path;

use gammaline::tui::keymap;
use tui_support::{app, draw, lines, press, retype};

const BEGIN: &str = "<!-- generated: begin -->";
const END: &str = "<!-- generated: end -->";

fn screen(title: &str, app: &gammaline::tui::app::App) -> String {
    let body = lines(&draw(app, 80, 24))
        .iter()
        .map(|l| l.trim_end().to_string())
        .collect::<Vec<_>>()
        .join("\n");
    format!("### {title}\n\n```text\n{body}\n```\n\n")
}

fn generated() -> String {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    let mut out = String::from("## Keys\n\n");
    out.push_str(&keymap::markdown());
    out.push_str("## Screens (80x24, the bundled test wing)\n\n");
    out.push_str(&screen("Moving around", &app));
    press(&mut app, "l\n");
    retype(&mut app, "-1");
    press(&mut app, "\n");
    out.push_str(&screen(
        "Editing a cell: a refused value and its reason",
        &app,
    ));
    press(&mut app, "\u{1b}p>");
    out.push_str(&screen(
        "A pinned reference: deltas and both span loads",
        &app,
    ));
    press(&mut app, "\t\t\t");
    out.push_str(&screen("The condition bar in focus", &app));
    press(&mut app, "?");
    out.push_str(&screen("Help", &app));
    press(&mut app, "\u{1b}q");
    out.push_str(&screen("The quit question", &app));
    // Paths in the temporary folder differ on every run; keep only the file names.
    out.replace(&format!("{}/", dir.path().display()), "")
}

#[test]
fn workbench_doc_matches_the_keymap_and_screens() {
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("docs/workbench.md");
    let doc = std::fs::read_to_string(&path).expect("docs/workbench.md");
    let (head, rest) = doc.split_once(BEGIN).expect("begin marker");
    let (_, tail) = rest.split_once(END).expect("end marker");
    let want = format!("{head}{BEGIN}\n{}{END}{tail}", generated());
    if std::env::var_os("GAMMALINE_UPDATE_DOCS").is_some() {
        std::fs::write(&path, &want).expect("write docs");
        return;
    }
    assert!(
        doc == want,
        "docs/workbench.md is stale: run GAMMALINE_UPDATE_DOCS=1 cargo test --test tui_docs"
    );
}
