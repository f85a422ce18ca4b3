//! The `tidings` binary: parse the command line, set up logging, hand over
//! to the library.

use std::io::IsTerminal;

use clap::Parser;

#[tokio::main]
async fn main() {
    let filter = tracing_subscriber::EnvFilter::try_from_env("TIDINGS_LOG")
        .unwrap_or_else(|_| "tidings=info,tower_http=warn".into());
    match std::env::var("TIDINGS_LOG_FORMAT").as_deref() {
        Ok("json") => tracing_subscriber::fmt()
            .json()
            // The fields of every span a line was written in (a request's
            // method, route and id), so a collector can pick out one
            // request's lines.
            .with_current_span(true)
            .with_span_list(true)
            .with_env_filter(filter)
            .with_writer(std::io::stderr)
            .init(),
        Ok("text") | Ok("") | Err(std::env::VarError::NotPresent) => tracing_subscriber::fmt()
            .with_env_filter(filter)
            .with_writer(std::io::stderr)
            // Colours only for a person at a terminal; log files and
            // collectors get plain text.
            .with_ansi(std::io::stderr().is_terminal())
            .init(),
        Ok(other) => {
            eprintln!("TIDINGS_LOG_FORMAT must be text or json, not {other:?}");
            std::process::exit(2);
        }
        Err(std::env::VarError::NotUnicode(_)) => {
            eprintln!("TIDINGS_LOG_FORMAT must be text or json");
            std::process::exit(2);
        }
    }
    let cli = tidings::cli::Cli::parse();
    std::process::exit(tidings::cli::run(cli).await);
}
