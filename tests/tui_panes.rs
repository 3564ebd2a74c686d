//! Every pane of the workbench drawn through ratatui's `TestBackend` at the least size, 80x24:
//! each screen as an insta snapshot (tests/snapshots/, easier to review than to assert), and
//! the styles that carry meaning asserted beside it. Review a changed screen with
//! `cargo insta review`, or `INSTA_UPDATE=always cargo test --test tui_panes` and read the
//! diff of tests/snapshots/ before committing it.

mod tui_support;

use gammaline::tui::app::App;
use gammaline::tui::theme::{Theme, UNICODE};
use gammaline::tui::view;
use ratatui::backend::TestBackend;
use ratatui::buffer::Buffer;
use ratatui::style::{Color, Modifier};
use ratatui::Terminal;
use tui_support::{app, app_with, lines, press, retype, tapered};

/// The workbench drawn by a real `Terminal` over a `TestBackend` of `width` x `height`.
fn screen(app: &App, width: u16, height: u16) -> Buffer {
    let mut terminal = Terminal::new(TestBackend::new(width, height)).expect("test terminal");
    terminal
        .draw(|frame| view::render(app, frame.area(), frame.buffer_mut()))
        .expect("draws");
    terminal.backend().buffer().clone()
}

fn text(buf: &Buffer) -> String {
    lines(buf)
        .iter()
        .map(|l| l.trim_end().to_string())
        .collect::<Vec<_>>()
        .join("\n")
}

/// Where `needle` starts on screen: (column, row).
fn find(buf: &Buffer, needle: &str) -> (u16, u16) {
    for (row, line) in lines(buf).iter().enumerate() {
        if let Some(byte) = line.find(needle) {
            let column = line[..byte].chars().count();
            return (column as u16, row as u16);
        }
    }
    panic!("{needle:?} not on screen:\n{}", text(buf));
}

/// The colour theme, where styles carry meaning through colour as well as modifiers.
fn colour_app(dir: &std::path::Path) -> App {
    app_with(tapered(), Theme::colour(UNICODE), dir)
}

/// The opening screen: wing bar, condition bar, station table, plots, results strip, status
/// and footer. The selected cell is reversed and bold (never colour alone), the current wing
/// is underlined, the footer's keys are bold.
#[test]
fn workbench() {
    let dir = tempfile::tempdir().expect("temp dir");
    let app = app(dir.path());
    let buf = screen(&app, 80, 24);
    insta::assert_snapshot!("workbench", text(&buf));
    let (x, y) = find(&buf, "0.000");
    assert!(buf[(x, y)]
        .modifier
        .contains(Modifier::REVERSED | Modifier::BOLD));
    let (x, y) = find(&buf, "Tapered trainer");
    assert!(
        buf[(x, y)].modifier.contains(Modifier::UNDERLINED),
        "current wing"
    );
    let footer = buf.area.height - 1;
    let bold_keys = (0..buf.area.width)
        .filter(|&x| buf[(x, footer)].modifier.contains(Modifier::BOLD))
        .count();
    assert!(bold_keys > 0, "no key marked in the footer");
}

/// The span-load plot in colour: the present load green, the elliptic load of the same lift
/// blue, and the stall marker (the first collocation point to reach cl_max) red and bold.
#[test]
fn plots_pane_colours() {
    let dir = tempfile::tempdir().expect("temp dir");
    let app = colour_app(dir.path());
    let buf = screen(&app, 80, 24);
    let fg_count = |c: Color| {
        buf.content()
            .iter()
            .filter(|cell| cell.fg == c && cell.symbol() != " ")
            .count()
    };
    assert!(fg_count(Color::Green) > 0, "no span load drawn");
    assert!(fg_count(Color::Blue) > 0, "no elliptic load drawn");
    let (x, y) = find(&buf, "▲");
    assert_eq!(buf[(x, y)].fg, Color::Red);
    assert!(buf[(x, y)].modifier.contains(Modifier::BOLD));
}

/// A refused edit: the cell editor open on the chord, the reason in the status line in the
/// error style.
#[test]
fn editing_a_cell_with_a_refused_value() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = colour_app(dir.path());
    press(&mut app, "l\n");
    retype(&mut app, "-1");
    press(&mut app, "\n");
    let buf = screen(&app, 80, 24);
    insta::assert_snapshot!("editing_refused", text(&buf));
    let (x, y) = find(&buf, "✗");
    assert_eq!(
        buf[(x, y)].fg,
        Color::LightRed,
        "the refusal is not in the error style"
    );
}

/// The condition bar in focus.
#[test]
fn condition_bar_in_focus() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app(dir.path());
    press(&mut app, "\t\t\t");
    insta::assert_snapshot!("condition_focused", text(&screen(&app, 80, 24)));
}

/// The help overlay: the cautions first, in the warning style.
#[test]
fn help_overlay() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = colour_app(dir.path());
    press(&mut app, "?");
    let buf = screen(&app, 80, 24);
    insta::assert_snapshot!("help", text(&buf));
    let (x, y) = find(&buf, "Results are preliminary");
    assert_eq!(
        buf[(x, y)].fg,
        Color::Yellow,
        "the cautions are not in the warning style"
    );
    let (x, y) = find(&buf, "Moving and changing");
    assert_eq!(
        buf[(x, y)].fg,
        Color::Cyan,
        "a mode heading is not a heading"
    );
}

/// The wing picker overlay over the workbench (a wing without a file, so no temporary path
/// reaches the screen), its entry selected.
#[test]
fn picker_overlay() {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut app = app_with(tapered(), Theme::monochrome(UNICODE), dir.path());
    press(&mut app, "w");
    let buf = screen(&app, 80, 24);
    insta::assert_snapshot!("picker", text(&buf));
    let (x, y) = find(&buf, "Tapered trainer (open");
    assert!(
        buf[(x, y)].modifier.contains(Modifier::REVERSED),
        "entry not selected"
    );
}

/// One column short of the least size: what is wrong and which keys still work.
#[test]
fn too_small() {
    let dir = tempfile::tempdir().expect("temp dir");
    let app = app(dir.path());
    insta::assert_snapshot!("too_small", text(&screen(&app, 79, 24)));
}
