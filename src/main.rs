//! The `gammaline` binary: the command line and the terminal workbench.

use std::process::ExitCode;

fn main() -> ExitCode {
    // A bug must still end in one readable line, not a backtrace.
    std::panic::set_hook(Box::new(|info| {
        // The message may quote a file's text: inert, so it cannot drive the terminal.
        let message = gammaline::text::inert(&info.to_string().replace('\n', " "));
        eprintln!("error: internal error (please report it): {message}");
    }));
    gammaline::cli::run()
}
