//! The core never touches the terminal: no ratatui or crossterm in the solver, the wing model
//! and file format, the atmosphere or the verification cases (DEVELOPERS.md, the module
//! table); and the solver does no I/O.

use std::path::{Path, PathBuf};

fn rust_files(path: &Path, out: &mut Vec<PathBuf>) {
    if path.is_dir() {
        let mut entries: Vec<PathBuf> = std::fs::read_dir(path)
            .expect("readable folder")
            .map(|e| e.expect("entry").path())
            .collect();
        entries.sort();
        for entry in entries {
            rust_files(&entry, out);
        }
    } else if path.extension().is_some_and(|e| e == "rs") {
        out.push(path.to_path_buf());
    }
}

/// `(file, line number, line)` of every line in `roots` that mentions one of `words`.
fn mentions(roots: &[&str], words: &[&str]) -> Vec<String> {
    let base = Path::new(env!("CARGO_MANIFEST_DIR"));
    let mut files = Vec::new();
    for root in roots {
        let path = base.join(root);
        assert!(path.exists(), "{root} is gone: update this test");
        rust_files(&path, &mut files);
    }
    assert!(!files.is_empty());
    let mut found = Vec::new();
    for file in files {
        let text = std::fs::read_to_string(&file).expect("readable source");
        for (i, line) in text.lines().enumerate() {
            if words.iter().any(|w| line.contains(w)) {
                let shown = file.strip_prefix(base).unwrap_or(&file).display();
                found.push(format!("{shown}:{}: {}", i + 1, line.trim()));
            }
        }
    }
    found
}

#[test]
fn the_core_never_names_the_terminal_libraries() {
    let found = mentions(
        &["src/solver", "src/wing", "src/atmosphere.rs", "src/verify"],
        &["ratatui", "crossterm"],
    );
    assert!(
        found.is_empty(),
        "terminal code in the core:\n{}",
        found.join("\n")
    );
}

#[test]
fn the_solver_does_no_io() {
    let found = mentions(
        &["src/solver", "src/atmosphere.rs", "src/verify"],
        &[
            "std::fs",
            "std::io",
            "File::",
            "println!",
            "eprintln!",
            "std::env",
        ],
    );
    assert!(
        found.is_empty(),
        "I/O in the pure core:\n{}",
        found.join("\n")
    );
}
