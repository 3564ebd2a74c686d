//! Path completion for the prompts (Tab): the longest unambiguous continuation of what was
//! typed, and the candidates when there is more than one.

use std::path::Path;

/// What Tab does to a typed path.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Completion {
    /// The text after completion (unchanged when nothing matches or nothing is shared).
    pub text: String,
    /// The names that still match, folders with a trailing `/` (empty when one was chosen).
    pub candidates: Vec<String>,
}

/// One entry of a folder listing: its name and whether it is a folder.
pub type Entry = (String, bool);

/// Completes `typed` against the folder it names, read from the file system. `wings_only`
/// keeps folders and `.toml` files (the open prompt). `~/` is read as the home folder but
/// kept as typed.
#[must_use]
pub fn complete(typed: &str, wings_only: bool) -> Completion {
    let (folder, _) = split(typed);
    let listed =
        super::actions::expand_home(Path::new(if folder.is_empty() { "." } else { folder }));
    complete_with(typed, &list(&listed), wings_only)
}

/// Completes `typed` against a given listing of the folder it names.
#[must_use]
pub fn complete_with(typed: &str, entries: &[Entry], wings_only: bool) -> Completion {
    let (folder, stem) = split(typed);
    let mut names: Vec<String> = entries
        .iter()
        .filter(|(name, dir)| {
            name.starts_with(stem) && (*dir || !wings_only || name.ends_with(".toml"))
        })
        // Hidden entries only when asked for with a leading dot.
        .filter(|(name, _)| !name.starts_with('.') || stem.starts_with('.'))
        .map(|(name, dir)| {
            if *dir {
                format!("{name}/")
            } else {
                name.clone()
            }
        })
        .collect();
    names.sort();
    match names.as_slice() {
        [] => Completion {
            text: typed.to_string(),
            candidates: Vec::new(),
        },
        [only] => Completion {
            text: format!("{folder}{only}"),
            candidates: Vec::new(),
        },
        many => Completion {
            text: format!("{folder}{}", common_prefix(many)),
            candidates: names,
        },
    }
}

/// The folder part (up to and including the last `/`) and the name typed after it.
fn split(typed: &str) -> (&str, &str) {
    typed
        .rfind('/')
        .map_or(("", typed), |i| (&typed[..=i], &typed[i + 1..]))
}

fn common_prefix(names: &[String]) -> String {
    let Some(first) = names.first() else {
        return String::new();
    };
    let mut end = first.len();
    for name in &names[1..] {
        end = first
            .char_indices()
            .zip(name.chars())
            .take_while(|((_, a), b)| a == b)
            .last()
            .map_or(0, |((i, a), _)| i + a.len_utf8())
            .min(end);
    }
    first[..end].to_string()
}

/// The folder's entries (nothing when it cannot be read: completion simply offers none).
fn list(folder: &Path) -> Vec<Entry> {
    let Ok(read) = std::fs::read_dir(folder) else {
        return Vec::new();
    };
    read.flatten()
        .filter_map(|e| {
            let name = e.file_name().into_string().ok()?;
            // Follows symlinks, so a link to a folder completes as a folder.
            let dir = e.path().is_dir();
            Some((name, dir))
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn entries() -> Vec<Entry> {
        vec![
            ("wings".into(), true),
            ("wide.toml".into(), false),
            ("sailplane.toml".into(), false),
            ("solar-strip.toml".into(), false),
            ("notes.txt".into(), false),
            (".hidden.toml".into(), false),
        ]
    }

    #[test]
    fn one_match_completes_whole_and_a_folder_gets_its_slash() {
        let c = complete_with("wing", &entries(), true);
        assert_eq!(c.text, "wings/");
        assert!(c.candidates.is_empty());
        assert_eq!(
            complete_with("a/sai", &entries(), true).text,
            "a/sailplane.toml"
        );
    }

    #[test]
    fn several_matches_extend_to_the_shared_part_and_list_the_rest() {
        let c = complete_with("s", &entries(), true);
        assert_eq!(c.text, "s");
        assert_eq!(c.candidates, ["sailplane.toml", "solar-strip.toml"]);
        let c = complete_with("w", &entries(), true);
        assert_eq!(c.text, "wi");
        assert_eq!(c.candidates, ["wide.toml", "wings/"]);
    }

    #[test]
    fn the_open_prompt_offers_wing_files_and_folders_only() {
        assert_eq!(complete_with("no", &entries(), true).text, "no");
        assert_eq!(complete_with("no", &entries(), false).text, "notes.txt");
        assert_eq!(complete_with("", &entries(), true).candidates.len(), 4);
        assert_eq!(complete_with(".", &entries(), true).text, ".hidden.toml");
    }
}
