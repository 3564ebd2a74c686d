//! Shared helpers for the command-line tests: the real binary run from the repository, its
//! output as text, and the bundled example wings.
#![allow(
    dead_code,
    reason = "each test file uses its own part of these helpers"
)]

use std::path::{Path, PathBuf};
use std::process::{Command, Output};

/// Runs the built binary from the repository folder, with a session folder of this test
/// file's own so parallel test binaries never share one.
pub fn gammaline(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_gammaline"))
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .env(
            "GAMMALINE_SESSION_DIR",
            std::env::temp_dir().join(concat!("gammaline-", env!("CARGO_CRATE_NAME"))),
        )
        .output()
        .expect("the binary runs")
}

/// Standard output as text.
pub fn stdout(o: &Output) -> String {
    String::from_utf8_lossy(&o.stdout).into_owned()
}

/// Standard error as text.
pub fn stderr(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

/// The bundled example wings, `wings/*.toml`, in name order.
pub fn example_wings() -> Vec<PathBuf> {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("wings");
    let mut files: Vec<PathBuf> = std::fs::read_dir(dir)
        .expect("wings/ exists")
        .filter_map(|e| e.ok().map(|e| e.path()))
        .filter(|p| p.extension().is_some_and(|x| x == "toml"))
        .collect();
    files.sort();
    files
}
