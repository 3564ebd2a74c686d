//! End to end: the real binary in a real tmux at 80x24. Keys go in with send-keys and the
//! screen is read back with capture-pane, polled until a deadline.

mod tui_support;

use std::path::{Path, PathBuf};
use std::process::{Command, Output};
use std::time::{Duration, Instant};

use gammaline::wing::file;

const DEADLINE: Duration = Duration::from_secs(15);

/// A private tmux server, killed on drop.
struct Tmux {
    socket: String,
}

impl Tmux {
    fn available() -> bool {
        Command::new("tmux")
            .arg("-V")
            .output()
            .is_ok_and(|o| o.status.success())
    }

    fn new(name: &str) -> Self {
        Self {
            socket: format!("gammaline-test-{}-{name}", std::process::id()),
        }
    }

    fn run(&self, args: &[&str]) -> Output {
        Command::new("tmux")
            .args(["-L", &self.socket, "-f", "/dev/null"])
            .args(args)
            .output()
            .expect("tmux runs")
    }

    fn start(&self, command: &str) {
        let out = self.run(&[
            "new-session",
            "-d",
            "-s",
            "t",
            "-x",
            "80",
            "-y",
            "24",
            command,
        ]);
        assert!(
            out.status.success(),
            "{}",
            String::from_utf8_lossy(&out.stderr)
        );
        self.run(&["set-option", "-s", "escape-time", "10"]);
    }

    fn keys(&self, keys: &[&str]) {
        let mut args = vec!["send-keys", "-t", "t"];
        args.extend_from_slice(keys);
        self.run(&args);
    }

    fn screen(&self) -> String {
        String::from_utf8_lossy(&self.run(&["capture-pane", "-p", "-t", "t"]).stdout).into_owned()
    }

    fn alive(&self) -> bool {
        self.run(&["has-session", "-t", "t"]).status.success()
    }

    /// Polls the screen until `ok` holds; fails with the last screen at the deadline.
    fn wait_for(&self, what: &str, ok: impl Fn(&str) -> bool) -> String {
        let start = Instant::now();
        loop {
            let screen = self.screen();
            if ok(&screen) {
                return screen;
            }
            assert!(
                start.elapsed() < DEADLINE,
                "waited for {what}; screen:\n{screen}"
            );
            std::thread::sleep(Duration::from_millis(50));
        }
    }

    fn wait_exit(&self) {
        let start = Instant::now();
        while self.alive() {
            assert!(
                start.elapsed() < DEADLINE,
                "the workbench did not quit:\n{}",
                self.screen()
            );
            std::thread::sleep(Duration::from_millis(50));
        }
    }
}

/// True (and says so) when tmux is not installed, so the end-to-end tests are skipped on a
/// contributor's machine. In CI (`CI` set to anything but `false` or `0`, as CI services do)
/// a missing tmux is a failure: the end-to-end tests must not pass there without running.
fn tmux_missing() -> bool {
    skip_without(Tmux::available(), std::env::var("CI").ok().as_deref())
}

/// Whether to skip for want of tmux; panics when tmux is wanted but missing in CI.
fn skip_without(available: bool, ci: Option<&str>) -> bool {
    if available {
        return false;
    }
    let in_ci = ci.is_some_and(|v| !matches!(v.trim(), "" | "0" | "false"));
    assert!(
        !in_ci,
        "tmux is not installed but CI is set: install tmux so the end-to-end workbench tests run"
    );
    eprintln!("SKIPPED: tmux is not installed; install tmux to run the end-to-end workbench test");
    true
}

#[test]
fn a_missing_tmux_skips_locally_and_fails_in_ci() {
    assert!(!skip_without(true, Some("true")));
    assert!(skip_without(false, None));
    assert!(skip_without(false, Some("false")));
    let in_ci = std::panic::catch_unwind(|| skip_without(false, Some("true")));
    assert!(in_ci.is_err(), "a missing tmux passed silently in CI");
}

impl Drop for Tmux {
    fn drop(&mut self) {
        let _ = self.run(&["kill-server"]);
    }
}

fn command(session: &Path, extra_env: &str, files: &[&Path]) -> String {
    let mut words: Vec<String> = files.iter().map(|f| format!("'{}'", f.display())).collect();
    if !words.is_empty() {
        words.insert(0, "open".to_string());
    }
    format!(
        "env GAMMALINE_SESSION_DIR='{}' LANG=C.UTF-8 {extra_env} '{}' {}",
        session.display(),
        env!("CARGO_BIN_EXE_gammaline"),
        words.join(" ")
    )
}

/// CL as `gammaline solve --format line` prints it for a wing file (the strip shows the same
/// four decimals).
fn solved_cl(path: &Path) -> String {
    let out = Command::new(env!("CARGO_BIN_EXE_gammaline"))
        .args([
            "solve",
            path.to_str().expect("utf-8 path"),
            "--format",
            "line",
        ])
        .output()
        .expect("solve runs");
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let line = String::from_utf8_lossy(&out.stdout).into_owned();
    let cl = line
        .split(" | ")
        .nth(2)
        .and_then(|part| part.split_whitespace().nth(1))
        .expect("CL in the line");
    format!("CL {cl}")
}

fn strip_cl(screen: &str) -> Option<String> {
    let at = screen.find("\nCL ")?;
    let rest = &screen[at + 1..];
    Some(
        rest.split_whitespace()
            .take(2)
            .collect::<Vec<_>>()
            .join(" "),
    )
}

#[test]
fn edit_save_copy_quit_and_restore_in_tmux() {
    if tmux_missing() {
        return;
    }
    let dir = tempfile::tempdir().expect("temp dir");
    let wing_path: PathBuf = tui_support::write_tapered(dir.path());
    let session = dir.path().join("session");
    let notebook = session.join("notebook.txt");
    let tmux = Tmux::new("main");
    tmux.start(&command(&session, "", &[&wing_path]));
    let first = tmux.wait_for("the workbench", |s| {
        s.contains("Tapered trainer") && s.contains("\nCL ")
    });
    let cl_before = strip_cl(&first).expect("CL shown");
    assert_eq!(cl_before, solved_cl(&wing_path));

    // Edit the root chord to 2.0.
    tmux.keys(&["l", "Enter"]);
    tmux.wait_for("the editor", |s| s.contains("1.6"));
    tmux.keys(&["C-a", "C-k"]);
    tmux.keys(&["2.0", "Enter"]);
    let edited = tmux.wait_for("the new chord", |s| s.contains("chord = 2.000"));
    assert!(
        edited.contains("1:Tapered trainer*"),
        "marked unsaved:\n{edited}"
    );
    let cl_edited = strip_cl(&edited).expect("CL shown");
    assert_ne!(cl_edited, cl_before);

    // Save; the strip's CL is what the solver gives for the saved file.
    tmux.keys(&["s"]);
    tmux.wait_for("the save", |s| {
        s.contains("saved ") && !s.contains("trainer*")
    });
    assert_eq!(cl_edited, solved_cl(&wing_path));
    assert_eq!(
        file::read(&wing_path).expect("reads").stations[0].chord,
        2.0
    );

    // Copy the result line: it lands in the notebook.
    tmux.keys(&["y"]);
    tmux.wait_for("the copy", |s| s.contains("sent to clipboard"));
    let noted = std::fs::read_to_string(&notebook).expect("notebook written");
    assert!(noted.contains(&cl_edited), "{noted}");

    // An unsaved twist change, then quit: asked, and the session keeps it.
    tmux.keys(&["l", ">"]);
    tmux.wait_for("the nudge", |s| s.contains("twist = 1.00"));
    tmux.keys(&["q"]);
    tmux.wait_for("the quit question", |s| s.contains("quit anyway? y/n"));
    tmux.keys(&["y"]);
    tmux.wait_exit();

    // Reopen with no files: the session comes back, unsaved edit and cursor included.
    let tmux = Tmux::new("again");
    tmux.start(&command(&session, "", &[]));
    let back = tmux.wait_for("the restored session", |s| s.contains("1:Tapered trainer*"));
    assert!(back.contains("2.000"), "{back}");
    assert!(
        back.contains("1.00 root"),
        "the unsaved twist is restored:\n{back}"
    );
    tmux.keys(&["q", "y"]);
    tmux.wait_exit();
}

#[test]
fn monochrome_ascii_and_small_terminals_in_tmux() {
    if tmux_missing() {
        return;
    }
    let dir = tempfile::tempdir().expect("temp dir");
    let wing_path = tui_support::write_tapered(dir.path());
    let tmux = Tmux::new("plain");
    // LANG=C after the default: a non-UTF-8 locale switches to ASCII glyphs by itself.
    tmux.start(&command(
        &dir.path().join("s"),
        "NO_COLOR=1 LC_ALL=C",
        &[&wing_path],
    ));
    let screen = tmux.wait_for("the workbench", |s| s.contains("+ stations"));
    assert!(screen.is_ascii(), "{screen}");
    tmux.run(&["resize-window", "-t", "t", "-x", "60", "-y", "20"]);
    tmux.wait_for("the size message", |s| s.contains("terminal too small"));
    tmux.run(&["resize-window", "-t", "t", "-x", "80", "-y", "24"]);
    tmux.wait_for("the layout again", |s| s.contains("+ stations"));
    tmux.keys(&["q"]);
    tmux.wait_exit();
}

#[test]
fn keys_wait_while_too_small_and_quit_still_asks_in_tmux() {
    if tmux_missing() {
        return;
    }
    let dir = tempfile::tempdir().expect("temp dir");
    let wing_path = tui_support::write_tapered(dir.path());
    let tmux = Tmux::new("small");
    tmux.start(&command(&dir.path().join("s"), "", &[&wing_path]));
    tmux.wait_for("the workbench", |s| s.contains("\nCL "));
    tmux.keys(&["l", ">"]);
    tmux.wait_for("the nudge", |s| s.contains("chord = 1.700"));
    tmux.run(&["resize-window", "-t", "t", "-x", "60", "-y", "20"]);
    tmux.wait_for("the size message", |s| s.contains("terminal too small"));
    // Undo, a move and a nudge, unseen: none of them may act.
    tmux.keys(&["u", "j", "+"]);
    tmux.keys(&["q"]);
    let asked = tmux.wait_for("the quit question on the small screen", |s| {
        s.contains("anyway? y/n")
    });
    assert!(asked.contains("terminal too small"), "{asked}");
    tmux.keys(&["n"]);
    tmux.wait_for("the question gone", |s| !s.contains("anyway?"));
    tmux.run(&["resize-window", "-t", "t", "-x", "80", "-y", "24"]);
    let back = tmux.wait_for("the layout again", |s| s.contains("┌ stations"));
    assert!(
        back.contains("1.700   0.00 root"),
        "the keys did nothing:\n{back}"
    );
    assert!(back.contains("Tapered trainer*"), "{back}");
    tmux.keys(&["q"]);
    tmux.wait_for("the quit question", |s| s.contains("quit anyway? y/n"));
    tmux.keys(&["y"]);
    tmux.wait_exit();
}

#[test]
fn tab_completes_the_open_prompt_in_tmux() {
    if tmux_missing() {
        return;
    }
    let dir = tempfile::tempdir().expect("temp dir");
    let wing_path = tui_support::write_tapered(dir.path());
    let other = dir.path().join("glider-variant.toml");
    std::fs::write(
        &other,
        tui_support::TAPERED.replace("Tapered trainer", "Variant B"),
    )
    .expect("second wing");
    let tmux = Tmux::new("complete");
    tmux.start(&command(&dir.path().join("s"), "", &[&wing_path]));
    tmux.wait_for("the workbench", |s| s.contains("\nCL "));
    tmux.keys(&["o"]);
    tmux.wait_for("the prompt", |s| s.contains("open wing file:"));
    tmux.keys(&["-l", &format!("{}/gl", dir.path().display())]);
    tmux.keys(&["Tab"]);
    tmux.wait_for("the completed name", |s| s.contains("glider-variant.toml"));
    tmux.keys(&["Enter"]);
    tmux.wait_for("the opened wing", |s| s.contains("2:Variant B"));
    tmux.keys(&["q"]);
    tmux.wait_exit();
}

#[test]
fn two_workbenches_on_one_file_and_one_session_in_tmux() {
    if tmux_missing() {
        return;
    }
    let dir = tempfile::tempdir().expect("temp dir");
    let wing_path: PathBuf = tui_support::write_tapered(dir.path());
    let session = dir.path().join("session");
    let first = Tmux::new("first");
    first.start(&command(&session, "", &[&wing_path]));
    first.wait_for("the first workbench", |s| s.contains("Tapered trainer"));
    let second = Tmux::new("second");
    second.start(&command(&session, "", &[&wing_path]));
    let told = second.wait_for("the second workbench's notice", |s| {
        s.contains("another workbench")
    });
    assert!(told.contains("Tapered trainer"), "{told}");

    // The first saves a new root chord; the second's save of its own edit is refused.
    first.keys(&["l", ">", "s"]);
    first.wait_for("the first save", |s| s.contains("saved "));
    second.keys(&["j", "l", ">", "s"]);
    second.wait_for("the refusal", |s| s.contains("changed on disk"));
    let saved = file::read(&wing_path).expect("reads");
    assert!(
        (saved.stations[0].chord - 1.7).abs() < 1e-12,
        "the first save stands"
    );
    assert!(
        (saved.stations[1].chord - 1.3).abs() < 1e-12,
        "not overwritten unasked"
    );

    // The second's quit question says its edit lives only in memory.
    second.keys(&["q"]);
    second.wait_for("the quit question", |s| s.contains("only in memory"));
    second.keys(&["y"]);
    second.wait_exit();
    first.keys(&["q"]);
    first.wait_exit();
    let kept = std::fs::read_to_string(session.join("session.json")).expect("session");
    assert!(
        !kept.contains("recovery\": \""),
        "the second never wrote it: {kept}"
    );
}
