//! Frame time of the workbench: one keystroke (a chord nudge, which re-prepares and re-solves;
//! an alpha nudge, which re-solves the kept system) plus a full redraw of a 200-station wing
//! into a TestBackend, at 80x24 and 160x50.

use std::collections::BTreeMap;

use criterion::{criterion_group, criterion_main, BenchmarkId, Criterion};
use crossterm::event::{KeyCode, KeyEvent, KeyModifiers};
use gammaline::solver::Method;
use gammaline::tui::app::{App, Settings};
use gammaline::tui::doc::Doc;
use gammaline::tui::theme::{Theme, UNICODE};
use gammaline::wing::{Airfoil, Condition, Station, Wing};
use ratatui::backend::TestBackend;
use ratatui::Terminal;

/// A smoothly tapered, washed-out wing with `n` stations.
fn wing(n: usize) -> Wing {
    let stations = (0..n)
        .map(|i| {
            let t = i as f64 / (n - 1) as f64;
            Station {
                y: 6.0 * t,
                chord: 1.5 - 0.8 * t,
                twist_deg: -3.0 * t,
                airfoil: "a".into(),
                x_le: 0.0,
                z: 0.0,
            }
        })
        .collect();
    Wing {
        name: "bench".into(),
        symmetric: true,
        stations,
        airfoils: BTreeMap::from([("a".to_string(), Airfoil::default())]),
        controls: Vec::new(),
        condition: Condition {
            alpha_deg: 5.0,
            ..Condition::default()
        },
        reference: Default::default(),
    }
}

fn app(n: usize) -> App {
    let dir = std::env::temp_dir();
    let settings = Settings {
        method: Method::default(),
        notebook: dir.join("gammaline-bench-notebook.txt"),
        session_dir: None,
        in_tmux: false,
        examples: None,
    };
    let doc = Doc::new(wing(n), None, Method::default());
    let mut app = App::new(vec![doc], Theme::colour(UNICODE), settings);
    // Put the cursor on the chord of a station in the middle of the table.
    for _ in 0..n / 2 {
        app.handle_key(KeyEvent::new(KeyCode::Char('j'), KeyModifiers::NONE));
    }
    app.handle_key(KeyEvent::new(KeyCode::Char('l'), KeyModifiers::NONE));
    app
}

fn keystroke(c: &mut Criterion) {
    let mut group = c.benchmark_group("keystroke_and_frame_200_stations");
    for (w, h) in [(80u16, 24u16), (160, 50)] {
        let mut app = app(200);
        let mut terminal = Terminal::new(TestBackend::new(w, h)).expect("test backend");
        let mut up = true;
        group.bench_function(BenchmarkId::from_parameter(format!("{w}x{h}")), |b| {
            b.iter(|| nudge_and_draw(&mut app, &mut terminal, &mut up));
        });
    }
    group.finish();
}

/// One nudge of the selected value and a full frame. Alternates up and down so the wing
/// stays valid and the undo stack bounded.
fn nudge_and_draw(app: &mut App, terminal: &mut Terminal<TestBackend>, up: &mut bool) {
    let key = if *up { '+' } else { '-' };
    *up = !*up;
    app.handle_key(KeyEvent::new(KeyCode::Char(key), KeyModifiers::NONE));
    terminal
        .draw(|f| gammaline::tui::view::render(app, f.area(), f.buffer_mut()))
        .expect("draw");
}

fn alpha_nudge(c: &mut Criterion) {
    let mut app = app(200);
    // Tab through airfoils and controls to the condition bar; its first value is alpha.
    for _ in 0..3 {
        app.handle_key(KeyEvent::new(KeyCode::Tab, KeyModifiers::NONE));
    }
    let mut terminal = Terminal::new(TestBackend::new(80, 24)).expect("test backend");
    let mut up = true;
    c.bench_function("alpha_nudge_and_frame_200_stations_80x24", |b| {
        b.iter(|| nudge_and_draw(&mut app, &mut terminal, &mut up));
    });
}

fn redraw_only(c: &mut Criterion) {
    let app = app(200);
    let mut terminal = Terminal::new(TestBackend::new(80, 24)).expect("test backend");
    c.bench_function("redraw_only_200_stations_80x24", |b| {
        b.iter(|| {
            terminal
                .draw(|f| gammaline::tui::view::render(&app, f.area(), f.buffer_mut()))
                .expect("draw");
        });
    });
}

criterion_group!(benches, keystroke, alpha_nudge, redraw_only);
criterion_main!(benches);
