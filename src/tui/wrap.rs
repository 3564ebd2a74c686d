//! Fitting text into a width: word wrapping, and shortening a path from the left.

/// Breaks `text` into lines of at most `width` characters at spaces; a word longer than the
/// width is split. Always at least one line.
#[must_use]
pub fn wrap(text: &str, width: usize) -> Vec<String> {
    let width = width.max(1);
    let mut out = Vec::new();
    let mut line = String::new();
    for word in text.split(' ').filter(|w| !w.is_empty()) {
        let mut word: Vec<char> = word.chars().collect();
        loop {
            let used = line.chars().count();
            let gap = usize::from(used > 0);
            if used + gap + word.len() <= width {
                if gap == 1 {
                    line.push(' ');
                }
                line.extend(word.iter());
                break;
            }
            if used > 0 {
                out.push(std::mem::take(&mut line));
                continue;
            }
            // A word wider than a whole line: split it.
            let rest = word.split_off(width);
            out.push(word.iter().collect());
            word = rest;
        }
    }
    if !line.is_empty() || out.is_empty() {
        out.push(line);
    }
    out
}

/// `path` shortened from the left to at most `width` characters, starting with `ellipsis`
/// and, where it can, at a folder boundary (`…/gl-sess/notebook.txt`).
#[must_use]
pub fn shorten_path(path: &str, width: usize, ellipsis: &str) -> String {
    let chars: Vec<char> = path.chars().collect();
    if chars.len() <= width {
        return path.to_string();
    }
    let mark = ellipsis.chars().count();
    let keep = width.saturating_sub(mark);
    let tail = &chars[chars.len() - keep..];
    // Prefer to start at a separator so the shown part names whole folders.
    let start = tail
        .iter()
        .position(|c| *c == '/' || *c == '\\')
        .filter(|&i| i + 1 < tail.len())
        .unwrap_or(0);
    let mut out = ellipsis.to_string();
    out.extend(&tail[start..]);
    out
}

/// A one-line message made to fit `width`: when it is too long, the longest path in it
/// (a word with a `/`) is shortened from the left, then the next, keeping at least the file
/// name. Returns the message as it best fits (it may still be too long).
#[must_use]
pub fn fit_paths(text: &str, width: usize, ellipsis: &str) -> String {
    let mut words: Vec<String> = text.split(' ').map(str::to_string).collect();
    let total = |w: &[String]| w.iter().map(|s| s.chars().count()).sum::<usize>() + w.len() - 1;
    let mut done = vec![false; words.len()];
    while total(&words) > width {
        let candidate = (0..words.len())
            .filter(|&i| !done[i] && words[i].contains('/'))
            .max_by_key(|&i| words[i].chars().count());
        let Some(i) = candidate else { break };
        done[i] = true;
        let len = words[i].chars().count();
        let excess = total(&words) - width;
        let file = words[i].rsplit('/').next().map_or(0, |f| f.chars().count());
        let target = len
            .saturating_sub(excess)
            .max(file + ellipsis.chars().count() + 1);
        if target < len {
            words[i] = shorten_path(&words[i], target, ellipsis);
        }
    }
    words.join(" ")
}

/// `text` cut or padded to exactly `width` characters, right-aligned when `right`.
#[must_use]
pub fn fit(text: &str, width: usize, right: bool) -> String {
    let cut: String = text.chars().take(width).collect();
    if right {
        format!("{cut:>width$}")
    } else {
        format!("{cut:<width$}")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn wraps_at_spaces_within_the_width() {
        let lines = wrap("one two three four five", 9);
        assert_eq!(lines, ["one two", "three", "four five"]);
        assert!(lines.iter().all(|l| l.chars().count() <= 9));
    }

    #[test]
    fn splits_a_word_wider_than_the_line() {
        assert_eq!(wrap("abcdefghij xy", 4), ["abcd", "efgh", "ij", "xy"]);
        assert_eq!(wrap("", 5), [""]);
    }

    #[test]
    fn paths_are_shortened_from_the_left_at_a_folder() {
        let p = "/tmp/some/deep/gl-sess/notebook.txt";
        assert_eq!(shorten_path(p, 40, "…"), p);
        assert_eq!(shorten_path(p, 24, "…"), "…/gl-sess/notebook.txt");
        assert_eq!(shorten_path(p, 24, "..."), ".../gl-sess/notebook.txt");
        assert!(shorten_path(p, 8, "…").chars().count() <= 8);
    }

    #[test]
    fn messages_shorten_their_paths_to_fit() {
        let m = "sent to clipboard; line appended to /tmp/some/deep/gl-sess/notebook.txt";
        let fitted = fit_paths(m, 60, "…");
        assert_eq!(
            fitted,
            "sent to clipboard; line appended to …/gl-sess/notebook.txt"
        );
        assert_eq!(fit_paths("short /a/b", 60, "…"), "short /a/b");
        // Never below the file name.
        assert!(fit_paths(m, 10, "…").ends_with("…/notebook.txt"));
    }
}
