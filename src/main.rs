use std::io::Write;

use clap::Parser;

fn main() {
    let cli = match turnsheet::cli::Cli::try_parse() {
        Ok(cli) => cli,
        Err(e) => {
            // Help, version and usage errors: clap's own text, but a failed write is
            // reported instead of ignored.
            let code = e.exit_code();
            if let Err(io) = e.print().and_then(|()| std::io::stdout().flush()) {
                turnsheet::cli::say(&format!("could not write the output: {io}"));
                std::process::exit(turnsheet::cli::EXIT_WRITE_FAILED);
            }
            std::process::exit(code);
        }
    };
    let code = match cli.command {
        Some(command) => turnsheet::cli::run(command),
        None => turnsheet::platform::desktop::run(),
    };
    std::process::exit(code);
}
