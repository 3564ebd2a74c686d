//! The quick picker: open wings first, then wing files found nearby.

use std::path::{Path, PathBuf};

use super::doc::{same_file, Doc};

/// Most files listed, so a huge folder does not slow the picker.
const MAX_FILES: usize = 200;

/// What choosing an entry does.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Target {
    /// Switch to an open wing.
    Open(usize),
    /// Open a file.
    File(PathBuf),
}

/// One line of the picker.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Entry {
    /// What is shown (raw; cleaned when drawn).
    pub label: String,
    /// What choosing it does.
    pub target: Target,
}

/// The picker's list and selection.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Picker {
    /// Entries, open wings first.
    pub entries: Vec<Entry>,
    /// Selected entry.
    pub selected: usize,
}

/// Lists the open wings `docs` (`current` selected) and the `*.toml` files in the
/// `examples` folder, the open wings' folders and the working folder.
#[must_use]
pub fn build(docs: &[Doc], current: usize, examples: Option<&Path>) -> Picker {
    let mut entries: Vec<Entry> = docs
        .iter()
        .enumerate()
        .map(|(i, d)| Entry {
            label: format!(
                "{}{} (open{})",
                if d.unsaved() { "* " } else { "" },
                d.title(),
                d.path
                    .as_ref()
                    .map_or(String::new(), |p| format!(", {}", p.display()))
            ),
            target: Target::Open(i),
        })
        .collect();
    let mut folders: Vec<PathBuf> = examples.into_iter().map(Path::to_path_buf).collect();
    folders.extend(
        docs.iter()
            .filter_map(|d| d.path.as_ref()?.parent().map(Path::to_path_buf)),
    );
    folders.push(PathBuf::from("."));
    let mut files: Vec<PathBuf> = Vec::new();
    for folder in folders {
        for path in wing_files(&folder) {
            let open = docs
                .iter()
                .any(|d| d.path.as_ref().is_some_and(|p| same_file(p, &path)));
            if !open && !files.iter().any(|f| same_file(f, &path)) && files.len() < MAX_FILES {
                files.push(path);
            }
        }
    }
    entries.extend(files.into_iter().map(|p| Entry {
        label: p.display().to_string(),
        target: Target::File(p),
    }));
    Picker {
        selected: current.min(entries.len().saturating_sub(1)),
        entries,
    }
}

/// The `*.toml` files directly in a folder, sorted.
fn wing_files(folder: &Path) -> Vec<PathBuf> {
    let Ok(read) = std::fs::read_dir(folder) else {
        return Vec::new();
    };
    let mut out: Vec<PathBuf> = read
        .filter_map(Result::ok)
        .map(|e| e.path())
        .filter(|p| p.extension().is_some_and(|x| x == "toml") && p.is_file())
        .filter(|p| p.file_name().is_some_and(|n| n != "Cargo.toml"))
        .take(MAX_FILES)
        .collect();
    out.sort();
    out
}
