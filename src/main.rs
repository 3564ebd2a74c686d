//! Temporary launcher for the workbench until the command line lands.

use std::path::PathBuf;
use std::process::ExitCode;

fn main() -> ExitCode {
    let mut options = gammaline::tui::LaunchOptions::default();
    let mut args = std::env::args().skip(1);
    while let Some(arg) = args.next() {
        match arg.as_str() {
            "--ascii" => options.ascii = true,
            "--session" => options.session_dir = args.next().map(PathBuf::from),
            "--notebook" => options.notebook = args.next().map(PathBuf::from),
            "open" => {}
            file => options.files.push(PathBuf::from(file)),
        }
    }
    gammaline::tui::run(options)
}
