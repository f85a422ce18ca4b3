//! The `tidings` binary: parse the command line, set up logging, hand over
//! to the library.

use clap::Parser;

#[tokio::main]
async fn main() {
    tracing_subscriber::fmt()
        .with_env_filter(
            tracing_subscriber::EnvFilter::try_from_env("TIDINGS_LOG")
                .unwrap_or_else(|_| "tidings=info,tower_http=warn".into()),
        )
        .with_writer(std::io::stderr)
        .init();
    let cli = tidings::cli::Cli::parse();
    std::process::exit(tidings::cli::run(cli).await);
}
