//! Sending a result line to the clipboard (OSC 52, and tmux's buffer inside tmux) and to the
//! notebook file, so that nothing copied is ever lost.

use std::fs::OpenOptions;
use std::io::{self, Write};
use std::path::Path;
use std::process::{Command, Stdio};
use std::time::{SystemTime, UNIX_EPOCH};

use base64::Engine as _;

/// The OSC 52 sequence that sets the system clipboard: `ESC ] 52 ; c ; base64 BEL`.
#[must_use]
pub fn osc52(text: &str) -> String {
    let encoded = base64::engine::general_purpose::STANDARD.encode(text);
    format!("\u{1b}]52;c;{encoded}\u{7}")
}

/// Hands `text` to tmux with `tmux load-buffer -w -`, which sets tmux's paste buffer and
/// forwards it to the outer terminal's clipboard whatever tmux's clipboard option says.
///
/// # Errors
/// When tmux cannot be started or reports failure.
pub fn tmux_load_buffer(text: &str) -> io::Result<()> {
    let mut child = Command::new("tmux")
        .args(["load-buffer", "-w", "-"])
        .stdin(Stdio::piped())
        .stdout(Stdio::null())
        .stderr(Stdio::null())
        .spawn()?;
    if let Some(mut stdin) = child.stdin.take() {
        stdin.write_all(text.as_bytes())?;
    }
    let status = child.wait()?;
    if status.success() {
        Ok(())
    } else {
        Err(io::Error::other(format!(
            "tmux load-buffer failed: {status}"
        )))
    }
}

/// Appends `timestamp  line` to the notebook file as one whole line or nothing, creating the
/// file and its folder if needed. The line goes to the end in a single write; a short write
/// (a full disk) is cut back off, so no torn line stays; a last line left torn before (by
/// another program, or a crash) is ended first, so the new line starts on its own.
///
/// # Errors
/// When the folder or file cannot be created or written; the file is then as it was.
pub fn append_notebook(path: &Path, timestamp: &str, line: &str) -> io::Result<()> {
    if let Some(parent) = path.parent().filter(|p| !p.as_os_str().is_empty()) {
        std::fs::create_dir_all(parent)?;
    }
    let mut file = OpenOptions::new()
        .read(true)
        .create(true)
        .append(true)
        .open(path)?;
    let before = file.metadata()?.len();
    let mut record = String::new();
    if before > 0 && !ends_with_newline(&mut file, before)? {
        record.push('\n');
    }
    record.push_str(&format!("{timestamp}  {line}\n"));
    let written = file.write(record.as_bytes());
    match written {
        Ok(n) if n == record.len() => file.sync_data(),
        Ok(n) => {
            file.set_len(before)?;
            Err(io::Error::new(
                io::ErrorKind::WriteZero,
                format!("only {n} of {} bytes could be written", record.len()),
            ))
        }
        Err(e) => {
            // Whatever part reached the file goes again.
            let _ = file.set_len(before);
            Err(e)
        }
    }
}

/// Whether the file's last byte (of `len`) is a line break.
fn ends_with_newline(file: &mut std::fs::File, len: u64) -> io::Result<bool> {
    use std::io::{Read as _, Seek as _, SeekFrom};
    file.seek(SeekFrom::Start(len - 1))?;
    let mut last = [0_u8; 1];
    file.read_exact(&mut last)?;
    Ok(last[0] == b'\n')
}

/// The current time as `YYYY-MM-DDTHH:MM:SSZ` (UTC).
#[must_use]
pub fn timestamp_now() -> String {
    let secs = SystemTime::now()
        .duration_since(UNIX_EPOCH)
        .map_or(0, |d| d.as_secs());
    timestamp(secs)
}

/// Formats seconds since the Unix epoch as `YYYY-MM-DDTHH:MM:SSZ`.
#[must_use]
pub fn timestamp(secs: u64) -> String {
    let days = i64::try_from(secs / 86_400).unwrap_or(0);
    let rem = secs % 86_400;
    let (y, m, d) = civil_from_days(days);
    format!(
        "{y:04}-{m:02}-{d:02}T{:02}:{:02}:{:02}Z",
        rem / 3600,
        rem / 60 % 60,
        rem % 60
    )
}

/// Proleptic Gregorian date from days since 1970-01-01 (the well-known era algorithm:
/// 400-year eras of 146097 days, years starting in March so the leap day comes last).
fn civil_from_days(days: i64) -> (i64, u32, u32) {
    let z = days + 719_468;
    let era = z.div_euclid(146_097);
    let doe = z.rem_euclid(146_097);
    let yoe = (doe - doe / 1460 + doe / 36_524 - doe / 146_096) / 365;
    let doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
    let mp = (5 * doy + 2) / 153;
    let d = doy - (153 * mp + 2) / 5 + 1;
    let m = if mp < 10 { mp + 3 } else { mp - 9 };
    let y = yoe + era * 400 + i64::from(m <= 2);
    (
        y,
        u32::try_from(m).unwrap_or(1),
        u32::try_from(d).unwrap_or(1),
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn osc52_is_base64_between_the_right_bytes() {
        assert_eq!(osc52("hi"), "\u{1b}]52;c;aGk=\u{7}");
    }

    #[test]
    fn timestamps_of_known_instants() {
        assert_eq!(timestamp(0), "1970-01-01T00:00:00Z");
        assert_eq!(timestamp(951_782_400), "2000-02-29T00:00:00Z");
        assert_eq!(timestamp(1_700_000_000), "2023-11-14T22:13:20Z");
    }

    #[test]
    fn notebook_lines_are_appended() {
        let dir = tempfile::tempdir().expect("temp dir");
        let path = dir.path().join("sub").join("notebook.txt");
        append_notebook(&path, "T1", "first").expect("append");
        append_notebook(&path, "T2", "second").expect("append");
        let text = std::fs::read_to_string(&path).expect("read");
        assert_eq!(text, "T1  first\nT2  second\n");
    }

    #[test]
    fn a_torn_last_line_is_ended_before_the_next_line() {
        let dir = tempfile::tempdir().expect("temp dir");
        let path = dir.path().join("notebook.txt");
        std::fs::write(&path, "T1  first\nT2  sec").expect("write");
        append_notebook(&path, "T3", "third").expect("append");
        let text = std::fs::read_to_string(&path).expect("read");
        assert_eq!(text, "T1  first\nT2  sec\nT3  third\n");
    }

    #[test]
    fn a_full_disk_leaves_the_notebook_as_it_was() {
        // /dev/full accepts an open and refuses every write with "no space left".
        let full = Path::new("/dev/full");
        if !full.exists() {
            eprintln!("skipped: no /dev/full here");
            return;
        }
        let err = append_notebook(full, "T1", "line").expect_err("disk full");
        assert!(err.to_string().to_lowercase().contains("space"), "{err}");
    }
}
