//! The terminal workbench: a station editor with live spanwise plots, a results strip and
//! sessions, over the solver core.
//!
//! Layout of the module: [`app`] holds the state and `update(Action)`; [`keymap`] is the one
//! key table; [`view`] draws `&App`; [`session`] keeps the work between runs.

pub mod actions;
pub mod app;
pub mod cells;
pub mod clipboard;
pub mod complete;
pub mod doc;
pub mod editor;
pub mod keymap;
pub mod layout_rules;
pub mod persist;
pub mod picker;
pub mod rows;
pub mod starter;
pub mod terminal;
pub mod theme;
pub mod view;
pub mod wrap;

use std::io;
use std::path::{Path, PathBuf};
use std::process::ExitCode;
use std::time::{Duration, Instant};

use crossterm::event::{self, Event};

use crate::session;
use crate::solver::Method;
use app::{App, Settings};

/// Environment variable naming the notebook file.
pub const NOTEBOOK_ENV: &str = "GAMMALINE_NOTEBOOK";
/// Quiet time after a change before the session is written; bounds what a killed process
/// can lose.
pub const AUTOSAVE_AFTER: Duration = Duration::from_millis(500);

/// How the workbench is started.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct LaunchOptions {
    /// Wing files to open. Empty: the last session, or the bundled examples (`./wings` or the
    /// source tree's `wings`) when there is none. Unsaved wings of the last session are kept
    /// open beside the files.
    pub files: Vec<PathBuf>,
    /// The session folder (`--session`); else `GAMMALINE_SESSION_DIR`, else the user's
    /// configuration folder.
    pub session_dir: Option<PathBuf>,
    /// ASCII borders and sparklines (`--ascii`); also chosen when the locale is not UTF-8.
    pub ascii: bool,
    /// The notebook file for copied lines; else `GAMMALINE_NOTEBOOK`, else the session's
    /// choice, else `notebook.txt` in the session folder when that was given explicitly,
    /// else in the user data folder.
    pub notebook: Option<PathBuf>,
}

/// Runs the workbench until the user quits. The terminal is restored on every exit.
#[must_use]
pub fn run(options: LaunchOptions) -> ExitCode {
    let mut app = build_app(&options);
    let outcome = std::panic::catch_unwind(std::panic::AssertUnwindSafe(|| {
        let mut guard = terminal::Guard::new()?;
        event_loop(&mut guard, &mut app)
    }));
    match outcome {
        Ok(Ok(())) => {
            if let Some(note) = lost_work(&app) {
                eprintln!("gammaline: {note}");
            }
            ExitCode::SUCCESS
        }
        Ok(Err(e)) => {
            eprintln!("gammaline: the workbench stopped: {e}");
            ExitCode::FAILURE
        }
        Err(_) => {
            // The terminal is already restored (guard drop and ratatui's hook); keep the work.
            persist::save_session(&mut app);
            eprintln!("gammaline: internal error in the workbench; the session was saved");
            ExitCode::FAILURE
        }
    }
}

/// What to say on leaving when unsaved wings were kept nowhere (the user chose to quit
/// anyway): the shell then still shows that they are gone, and why.
#[must_use]
pub fn lost_work(app: &App) -> Option<String> {
    let n = app.docs.iter().filter(|d| d.unsaved()).count();
    let why = app.session_state.why_not()?;
    (n > 0).then(|| {
        crate::text::inert(&format!(
            "{n} wing(s) with unsaved edits were not kept ({why})"
        ))
    })
}

/// Builds the workbench state for these options (no terminal involved; tests use it).
#[must_use]
pub fn build_app(options: &LaunchOptions) -> App {
    let method = Method::default();
    let explicit_dir = options.session_dir.is_some()
        || std::env::var_os(session::DIR_ENV).is_some_and(|v| !v.is_empty());
    let dir = session::dir(options.session_dir.as_deref());
    let mut notices = Vec::new();
    let mut start = persist::Start::default();
    let claim = dir.as_deref().map(session::claim);
    if let Some(dir) = &dir {
        let loaded = session::load(dir);
        notices.extend(loaded.notice);
        if let Some(s) = loaded.session {
            start = persist::restore(&s, dir, method);
        }
    }
    let examples = persist::examples_dir();
    if !options.files.is_empty() {
        let opened = persist::open_files(&options.files, method);
        notices.extend(opened.notices);
        // The files replace the last session's saved wings; if none opened, the session
        // stays rather than an empty starter wing.
        if !opened.docs.is_empty() {
            // The reference stays pinned; its tag follows its wing, or goes with it.
            if let Some(r) = &mut start.reference {
                let kept = start.docs.get(r.source).is_some_and(doc::Doc::unsaved);
                r.source = if kept {
                    start.docs[..r.source]
                        .iter()
                        .filter(|d| d.unsaved())
                        .count()
                } else {
                    usize::MAX
                };
            }
            start.docs.retain(doc::Doc::unsaved);
            start.current = start.docs.len();
        }
        start.current = persist::add_opened(&mut start.docs, opened.docs, start.current);
    } else if start.docs.is_empty() {
        if let Some(ex) = &examples {
            let files = persist::example_files(ex);
            let opened = persist::open_files(&files, method);
            notices.extend(opened.notices);
            start.docs = opened.docs;
            start.current = 0;
        }
    }
    notices.extend(std::mem::take(&mut start.notices));
    let mut problems = !notices.is_empty();
    let recovered = start.docs.iter().filter(|d| d.unsaved()).count();
    if recovered > 0 {
        notices.push(format!(
            "restored {recovered} wing(s) with unsaved edits (* in the wing bar)"
        ));
    }
    let notebook = notebook_path(options, start.notebook.take(), dir.as_deref(), explicit_dir);
    let settings = Settings {
        method,
        notebook,
        session_dir: dir,
        in_tmux: std::env::var_os("TMUX").is_some_and(|v| !v.is_empty()),
        examples,
    };
    let mut app = App::new(start.docs, theme::Theme::from_env(options.ascii), settings);
    match (claim, &app.settings.session_dir) {
        (Some(session::Claim::Held(lock)), _) => app.session_lock = Some(lock),
        (Some(session::Claim::Taken(pid)), Some(dir)) => {
            let who = pid.map_or_else(String::new, |p| format!(" (process {p})"));
            let why = format!(
                "another workbench{who} has the session in {} open: this one works on its own \
                 copy and does not write the session, so save wings to files (s, S)",
                dir.display()
            );
            notices.insert(0, why.clone());
            problems = true;
            app.session_state = app::SessionState::Shared(why);
        }
        _ => {}
    }
    app.current = start.current.min(app.docs.len() - 1);
    app.reference = start.reference;
    app.clamp_cursor();
    if notices.is_empty() {
        app.say("press ? for the keys", false);
    } else {
        // Every notice, so none is lost; the status line wraps onto the footer row.
        app.say(&notices.join("; "), problems);
    }
    app
}

fn notebook_path(
    options: &LaunchOptions,
    from_session: Option<PathBuf>,
    dir: Option<&Path>,
    explicit_dir: bool,
) -> PathBuf {
    if let Some(p) = &options.notebook {
        return p.clone();
    }
    if let Some(p) = std::env::var_os(NOTEBOOK_ENV).filter(|v| !v.is_empty()) {
        return PathBuf::from(p);
    }
    if let Some(p) = from_session {
        return p;
    }
    // A session folder given on purpose (tests, separate projects) keeps its notebook too.
    if let (true, Some(dir)) = (explicit_dir, dir) {
        return dir.join("notebook.txt");
    }
    directories::ProjectDirs::from("", "", "gammaline").map_or_else(
        || PathBuf::from("gammaline-notebook.txt"),
        |d| d.data_dir().join("notebook.txt"),
    )
}

fn event_loop(guard: &mut terminal::Guard, app: &mut App) -> io::Result<()> {
    let mut first_change: Option<Instant> = None;
    app.size = guard.terminal.size()?;
    loop {
        guard
            .terminal
            .draw(|frame| view::render(app, frame.area(), frame.buffer_mut()))?;
        if !app.too_small() {
            app.status_drawn();
        }
        for sequence in std::mem::take(&mut app.outbox) {
            guard.write_raw(&sequence)?;
        }
        if app.quit {
            break;
        }
        let wait = first_change.map_or(Duration::from_secs(3600), |t| {
            AUTOSAVE_AFTER.saturating_sub(t.elapsed())
        });
        if event::poll(wait)? {
            handle(app, event::read()?);
            // Take every key already queued before drawing again, so fast typing or key
            // repeat never lags behind the screen.
            while !app.quit && event::poll(Duration::ZERO)? {
                handle(app, event::read()?);
            }
        }
        if app.session_changed && first_change.is_none() {
            first_change = Some(Instant::now());
        }
        if first_change.is_some_and(|t| t.elapsed() >= AUTOSAVE_AFTER) {
            persist::save_session(app);
            first_change = None;
        }
    }
    persist::save_session(app);
    Ok(())
}

fn handle(app: &mut App, event: Event) {
    match event {
        Event::Key(key) => app.handle_key(key),
        Event::Resize(width, height) => app.size = ratatui::layout::Size::new(width, height),
        _ => {}
    }
}
