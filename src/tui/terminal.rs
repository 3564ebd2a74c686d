//! Entering and leaving the terminal's full-screen mode, so the terminal is restored on
//! every exit: normal return, error, or panic.

use std::io::{self, Write};

use crossterm::event::DisableMouseCapture;
use crossterm::execute;
use ratatui::DefaultTerminal;

/// Owns the terminal while the workbench runs; dropping it restores the terminal.
pub struct Guard {
    /// The ratatui terminal.
    pub terminal: DefaultTerminal,
}

impl Guard {
    /// Switches to the alternate screen and raw mode (`ratatui::try_init`, which also
    /// installs a panic hook that restores the terminal) and makes sure mouse capture is
    /// off so the terminal's own text selection keeps working.
    ///
    /// # Errors
    /// When the terminal cannot be set up (e.g. stdout is not a terminal).
    pub fn new() -> io::Result<Self> {
        let terminal = ratatui::try_init().inspect_err(|_| {
            // try_init may fail after raw mode is on; leave the terminal as we found it.
            ratatui::restore();
        })?;
        let guard = Self { terminal };
        execute!(io::stdout(), DisableMouseCapture)?;
        Ok(guard)
    }

    /// Writes raw bytes (an OSC 52 sequence) straight to the terminal.
    ///
    /// # Errors
    /// When stdout cannot be written.
    pub fn write_raw(&mut self, bytes: &str) -> io::Result<()> {
        let mut out = io::stdout();
        out.write_all(bytes.as_bytes())?;
        out.flush()
    }
}

impl Drop for Guard {
    fn drop(&mut self) {
        // Undo what we switched on ourselves before ratatui leaves raw mode.
        let _ = execute!(io::stdout(), DisableMouseCapture);
        ratatui::restore();
    }
}
