//! The `tidings` binary: parse the command line, set up logging, hand over
//! to the library.

use std::io::IsTerminal;

use clap::Parser;

#[tokio::main]
async fn main() {
    tracing_subscriber::fmt()
        .with_env_filter(
            tracing_subscriber::EnvFilter::try_from_env("TIDINGS_LOG")
                .unwrap_or_else(|_| "tidings=info,tower_http=warn".into()),
        )
        .with_writer(std::io::stderr)
        // Colours only for a person at a terminal; log files and collectors
        // get plain text.
        .with_ansi(std::io::stderr().is_terminal())
        .init();
    let cli = tidings::cli::Cli::parse();
    std::process::exit(tidings::cli::run(cli).await);
}
