//! Hostile text never reaches the terminal: names, airfoil keys, control names and file names
//! carrying escape sequences (OSC 52 clipboard, OSC 0 title, CSI), C1 controls and bidi
//! overrides go through every command, every format and every error path; no output byte may
//! hold an ESC, a C1 control or a bidi override.

use std::path::{Path, PathBuf};
use std::process::{Command, Output};

/// OSC 52 (clipboard), OSC 0 (window title), a CSI, the 8-bit CSI U+009B, NEL and the bidi
/// overrides and isolates.
const HOSTILE: &str = "\u{1b}]52;c;aGkK\u{7}\u{1b}]0;owned\u{7}\u{1b}[2J\u{9b}31m\u{85}\u{202e}\u{2066}\u{2067}\u{2068}\u{2069}\u{200f}\u{61c}x";

/// TOML basic-string spelling of [`HOSTILE`].
fn toml_escaped(s: &str) -> String {
    s.chars()
        .map(|c| {
            if c.is_ascii_graphic() || c == ' ' {
                c.to_string()
            } else {
                format!("\\u{:04X}", u32::from(c))
            }
        })
        .collect()
}

fn gammaline(args: &[&std::ffi::OsStr]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_gammaline"))
        .args(args)
        .env(
            "GAMMALINE_SESSION_DIR",
            std::env::temp_dir().join("gammaline-cli-tests"),
        )
        .output()
        .expect("the binary runs")
}

/// A folder of its own for this test, with a file name that is itself hostile.
fn hostile_dir(tag: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("gammaline-hostile-{}-{tag}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("temp folder");
    dir
}

fn wing_text() -> String {
    let h = toml_escaped(HOSTILE);
    format!(
        r#"name = "{h}"
[[station]]
y = 0.0
chord = 0.3
airfoil = "{h}"
[[station]]
y = 0.5
chord = 0.2
airfoil = "{h}"
[airfoil."{h}"]
lift_slope = 6.0
alpha_zero_lift = -2.0
cl_max = 0.2
cd0 = 0.01
[[control]]
name = "{h}"
kind = "aileron"
y_inner = 0.1
y_outer = 0.4
chord_fraction = 0.45
deflection = 25.0
[condition]
alpha = 8.0
speed = 150.0
"#
    )
}

/// Broken files whose error lines quote hostile text.
fn broken_texts() -> Vec<String> {
    let h = toml_escaped(HOSTILE);
    let good = wing_text();
    vec![
        good.replacen(
            &format!("airfoil = \"{h}\""),
            &format!("airfoil = \"other{h}\""),
            1,
        ),
        good.replacen("chord = 0.3", &format!("\"{h}\" = 1\nchord = 0.3"), 1),
        good.replacen("chord = 0.3", &format!("chord = \"{h}\""), 1),
        good.replacen("kind = \"aileron\"", &format!("kind = \"{h}\""), 1),
        good.replacen("lift_slope = 6.0", "lift_slope = -6.0", 1),
        format!("[{h}]\n"),
        format!("name = \"{h}\n"),
    ]
}

/// Every character of the output that could change what a terminal does.
fn dangerous(bytes: &[u8]) -> Vec<String> {
    let text = match std::str::from_utf8(bytes) {
        Ok(t) => t,
        Err(e) => return vec![format!("not UTF-8: {e}")],
    };
    text.chars()
        .filter(|&c| {
            (c.is_control() && c != '\n')
                || matches!(c, '\u{202a}'..='\u{202e}' | '\u{2066}'..='\u{2069}' | '\u{200e}' | '\u{200f}' | '\u{61c}')
        })
        .map(|c| format!("U+{:04X}", u32::from(c)))
        .collect()
}

fn assert_inert(args: &[&std::ffi::OsStr], o: &Output) {
    for (stream, bytes) in [("stdout", &o.stdout), ("stderr", &o.stderr)] {
        let bad = dangerous(bytes);
        assert!(
            bad.is_empty(),
            "{args:?} {stream}: {bad:?}\n{}",
            String::from_utf8_lossy(bytes)
        );
    }
}

fn run_all(path: &Path, extra_runs: &[&[&str]]) -> Vec<Output> {
    let p = path.as_os_str();
    let mut runs: Vec<Vec<&std::ffi::OsStr>> = vec![vec!["check".as_ref(), p]];
    let designed = path.with_file_name(format!("designed{HOSTILE}.toml"));
    let os = |t: &'static str| -> &std::ffi::OsStr { t.as_ref() };
    for format in ["line", "table", "json", "csv"] {
        let f = os(format);
        runs.push(vec![os("solve"), p, os("--format"), f]);
        runs.push(vec![os("sweep"), p, os("--format"), f]);
        runs.push(vec![
            os("loads"),
            p,
            os("--mass"),
            os("5"),
            os("--load-factor"),
            os("2"),
            os("--format"),
            f,
        ]);
        runs.push(vec![
            os("design"),
            p,
            os("--cl"),
            os("0.3"),
            os("--loading"),
            os("elliptic"),
            os("--output"),
            designed.as_os_str(),
            os("--format"),
            f,
        ]);
    }
    for extra in extra_runs {
        let mut args = vec![extra[0].as_ref(), p];
        args.extend(extra[1..].iter().map(std::ffi::OsStr::new));
        runs.push(args);
    }
    runs.iter()
        .map(|args| {
            let o = gammaline(args);
            assert_inert(args, &o);
            o
        })
        .collect()
}

#[test]
fn hostile_names_are_inert_in_every_command_and_format() {
    let dir = hostile_dir("good");
    let path = dir.join(format!("wing{HOSTILE}.toml"));
    std::fs::write(&path, wing_text()).expect("write");
    let outputs = run_all(
        &path,
        &[
            &["solve", "--terms", "1"],
            &["solve", "--speed", "-3"],
            &["solve", "--cl", "0.5", "--format", "json"],
            &["sweep", "--from", "10", "--to", "1"],
            &["solve", "--format", "yaml"],
        ],
    );
    // The hostile text still gets through, made harmless: solving worked and warned.
    assert!(
        outputs[1].status.success(),
        "{}",
        String::from_utf8_lossy(&outputs[1].stderr)
    );
    let warned = String::from_utf8_lossy(&outputs[1].stderr).into_owned();
    assert!(warned.contains("warning"), "{warned}");
    let _ = std::fs::remove_dir_all(dir);
}

#[test]
fn json_keeps_hostile_names_exactly_but_escaped() {
    let dir = hostile_dir("json");
    let path = dir.join("wing.toml");
    std::fs::write(&path, wing_text()).expect("write");
    for command in ["solve", "sweep"] {
        let args: Vec<&std::ffi::OsStr> = vec![
            command.as_ref(),
            path.as_os_str(),
            "--format".as_ref(),
            "json".as_ref(),
        ];
        let o = gammaline(&args);
        assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
        assert_inert(&args, &o);
        let v: serde_json::Value = serde_json::from_slice(&o.stdout).expect("valid JSON");
        assert_eq!(
            v["wing"], HOSTILE,
            "{command}: the name reads back unchanged"
        );
    }
    let _ = std::fs::remove_dir_all(dir);
}

#[test]
fn hostile_text_in_broken_files_and_their_names_is_inert() {
    let dir = hostile_dir("bad");
    for (i, text) in broken_texts().iter().enumerate() {
        let path = dir.join(format!("bad{i}{HOSTILE}.toml"));
        std::fs::write(&path, text).expect("write");
        for o in run_all(&path, &[]) {
            assert_eq!(
                o.status.code(),
                Some(2),
                "{i}: {}",
                String::from_utf8_lossy(&o.stdout)
            );
        }
    }
    let missing = dir.join(format!("missing{HOSTILE}.toml"));
    run_all(&missing, &[]);
    let _ = std::fs::remove_dir_all(dir);
}
