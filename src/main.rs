use clap::Parser;

fn main() {
    let cli = turnsheet::cli::Cli::parse();
    let code = match cli.command {
        Some(command) => turnsheet::cli::run(command),
        None => turnsheet::app::run_desktop(),
    };
    std::process::exit(code);
}
