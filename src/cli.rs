//! The command line: `serve`, `ask`, `chat`, `check` and `eval`, all reading
//! the same `--data`, `--intents` and `--now` options.

use std::io::{BufRead, Write};
use std::net::SocketAddr;
use std::path::PathBuf;
use std::sync::Arc;
use std::time::Duration;

use clap::{Args, Parser, Subcommand};

use crate::dataset::shared::SharedData;
use crate::dialogue::{MemoryStore, RedisStore, SessionStore};

/// How often a replica checks the shared dataset for a newer version: a
/// change reaches every replica within this plus one fetch.
const SHARED_POLL_MS: u64 = 200;

/// How often `--watch` looks at the files.
const WATCH_POLL_MS: u64 = 500;
use crate::engine::{self, Clock, Engine, Settings, Snapshot, Sources};

/// Answers readers' questions about results data.
#[derive(Debug, Parser)]
#[command(name = "tidings", version, about)]
pub struct Cli {
    #[command(subcommand)]
    pub command: Command,
}

/// Options every command shares.
#[derive(Debug, Args, Clone)]
pub struct Common {
    /// Scenario folder (default: the built-in demo games).
    #[arg(long, env = "TIDINGS_DATA", global = true)]
    pub data: Option<PathBuf>,
    /// Intents folder (default: the built-in demo intents).
    #[arg(long, env = "TIDINGS_INTENTS", global = true)]
    pub intents: Option<PathBuf>,
    /// Fixed current time (RFC 3339), for replays and tests.
    #[arg(long, env = "TIDINGS_NOW", global = true)]
    pub now: Option<String>,
    /// Change batches to apply to the data before answering (a batch file
    /// or a folder of them, played in file-name order), so a command
    /// answers as the service did at that moment of a replayed night.
    #[arg(long, global = true)]
    pub replay: Option<PathBuf>,
    /// With --replay: apply only the batches whose `as_of` is at or before
    /// this time (RFC 3339).
    #[arg(long, global = true, requires = "replay")]
    pub until: Option<String>,
}

/// Where conversations are kept and for how long.
#[derive(Debug, Args, Clone)]
pub struct SessionOptions {
    /// Redis URL for sessions shared by every replica (default: in this
    /// process's memory).
    #[arg(long, env = "TIDINGS_REDIS_URL")]
    pub redis_url: Option<String>,
    /// --redis-url names nodes of a Redis Cluster (one or more URLs,
    /// separated by commas), not one server.
    #[arg(long, env = "TIDINGS_REDIS_CLUSTER", requires = "redis_url")]
    pub redis_cluster: bool,
    /// CA certificates (PEM) to trust for a rediss:// URL instead of the
    /// built-in roots, for a Redis certificate signed by a private CA.
    #[arg(long, env = "TIDINGS_REDIS_CA", requires = "redis_url")]
    pub redis_ca: Option<PathBuf>,
    /// Prefix of every Redis key, so several deployments can share one Redis.
    #[arg(long, env = "TIDINGS_REDIS_PREFIX", default_value = "tidings:")]
    pub redis_prefix: String,
    /// Idle time after which a conversation is forgotten, in seconds.
    #[arg(long, env = "TIDINGS_SESSION_TTL", default_value_t = 1800)]
    pub session_ttl: u64,
    /// How long a message id is remembered for retries, in seconds.
    #[arg(long, env = "TIDINGS_RETRY_WINDOW", default_value_t = 600)]
    pub retry_window: u64,
    /// Without --redis-url: most readers whose conversation is kept in
    /// memory; past it the least recently active reader is forgotten.
    #[arg(long, env = "TIDINGS_MAX_SESSIONS", default_value_t = crate::dialogue::memory_store::DEFAULT_MAX_READERS)]
    pub max_sessions: usize,
    /// After how long without an update a live contest's figures are said
    /// to be old in answers, in seconds.
    #[arg(long, env = "TIDINGS_STALE_AFTER", default_value_t = 600)]
    pub stale_after: u64,
    /// Most of any kind of record (0 to 1) a whole-dataset replacement
    /// through the admin API may remove unless sent with ?force=true.
    #[arg(long, env = "TIDINGS_MAX_REMOVED_SHARE", default_value_t = 0.5)]
    pub max_removed_share: f64,
    /// Bearer token for the admin API (/v1/admin/...); without one the
    /// admin API is off.
    #[arg(long, env = "TIDINGS_ADMIN_TOKEN", hide_env_values = true)]
    pub admin_token: Option<String>,
    /// Bearer token for GET /metrics (the admin token is taken as well);
    /// with neither, metrics are off. A token of its own, so a scraper's
    /// credential cannot change the data.
    #[arg(long, env = "TIDINGS_METRICS_TOKEN", hide_env_values = true)]
    pub metrics_token: Option<String>,
}

impl SessionOptions {
    /// Options for one-process tools: in memory, with the given TTL.
    fn in_memory(session_ttl: u64) -> SessionOptions {
        SessionOptions {
            redis_url: None,
            redis_cluster: false,
            redis_ca: None,
            redis_prefix: String::new(),
            session_ttl,
            retry_window: 600,
            max_sessions: crate::dialogue::memory_store::DEFAULT_MAX_READERS,
            stale_after: 600,
            max_removed_share: 0.5,
            admin_token: None,
            metrics_token: None,
        }
    }
}

/// `serve`'s limits on connections and request rates (see `http::Edge`).
#[derive(Debug, Args)]
pub struct EdgeOptions {
    /// Seconds a request's headers may take to arrive in full.
    #[arg(long, env = "TIDINGS_HEADER_TIMEOUT", default_value_t = 10)]
    pub header_timeout: u64,
    /// Seconds a connection with no request in progress may stay silent.
    #[arg(long, env = "TIDINGS_IDLE_TIMEOUT", default_value_t = 5)]
    pub idle_timeout: u64,
    /// Most connections open at once; more are refused with a 503.
    #[arg(long, env = "TIDINGS_MAX_CONNECTIONS", default_value_t = 512)]
    pub max_connections: usize,
    /// Seconds shutdown waits for open connections to finish.
    #[arg(long, env = "TIDINGS_DRAIN_TIMEOUT", default_value_t = 10)]
    pub drain_timeout: u64,
    /// Requests per second from one source address (0: no limit).
    #[arg(long, env = "TIDINGS_SOURCE_RATE", default_value_t = 50.0)]
    pub source_rate: f64,
    /// Requests one source address may send at once after a pause.
    #[arg(long, env = "TIDINGS_SOURCE_BURST", default_value_t = 100.0)]
    pub source_burst: f64,
    /// Messages per second from one reader (0: no limit).
    #[arg(long, env = "TIDINGS_READER_RATE", default_value_t = 1.0)]
    pub reader_rate: f64,
    /// Messages one reader may send at once after a pause.
    #[arg(long, env = "TIDINGS_READER_BURST", default_value_t = 8.0)]
    pub reader_burst: f64,
    /// Messages of one reader that may wait for the one being answered;
    /// more are answered 429 with retry-after.
    #[arg(long, env = "TIDINGS_READER_QUEUE", default_value_t = 8)]
    pub reader_queue: usize,
    /// A file of client keys, one `NAME KEY [rate=N] [burst=N] [desk]` a
    /// line; with any key configured, messages need one.
    #[arg(long, env = "TIDINGS_CLIENT_KEYS_FILE")]
    pub client_keys_file: Option<PathBuf>,
    /// A client key, `NAME KEY [settings]` as in the file (repeatable; in
    /// the environment, separated by commas).
    #[arg(
        long = "client-key",
        env = "TIDINGS_CLIENT_KEYS",
        value_delimiter = ',',
        hide_env_values = true
    )]
    pub client_keys: Vec<String>,
    /// Messages per second one client key may send, unless it sets its own
    /// (0: no limit).
    #[arg(long, env = "TIDINGS_KEY_RATE", default_value_t = 100.0)]
    pub key_rate: f64,
    /// Messages one client key may send at once after a pause.
    #[arg(long, env = "TIDINGS_KEY_BURST", default_value_t = 200.0)]
    pub key_burst: f64,
    /// Secret for the HMAC signatures of messages (repeatable for
    /// rotation; in the environment, separated by commas); with one set,
    /// unsigned messages are refused.
    #[arg(
        long = "signing-secret",
        env = "TIDINGS_SIGNING_SECRETS",
        value_delimiter = ',',
        hide_env_values = true
    )]
    pub signing_secrets: Vec<String>,
    /// How far a signature's timestamp may be from this clock, in seconds.
    #[arg(long, env = "TIDINGS_SIGNATURE_WINDOW", default_value_t = 300)]
    pub signature_window: u64,
    /// Origins a browser may call the API from (comma-separated
    /// `scheme://host[:port]`); none sends no CORS headers.
    #[arg(long, env = "TIDINGS_CORS_ORIGINS", value_delimiter = ',')]
    pub cors_origins: Vec<String>,
}

/// Shortest signing secret accepted.
const MIN_SIGNING_SECRET: usize = 16;

impl EdgeOptions {
    /// The edge these options set. Zero durations become one second, so a
    /// typo cannot switch a timeout off; a zero (or negative) rate turns
    /// that rate limit off. Keys, secrets and origins are checked: a
    /// problem stops the start with what is wrong (never the key itself).
    pub fn edge(&self) -> Result<crate::http::Edge, String> {
        let secs = |s: u64| Duration::from_secs(s.max(1));
        let rate = |per_second: f64, burst: f64| {
            (per_second > 0.0).then(|| crate::http::Rate::new(per_second, burst.max(1.0)))
        };
        Ok(crate::http::Edge {
            connections: crate::http::Limits {
                header_read_timeout: secs(self.header_timeout),
                idle_timeout: secs(self.idle_timeout),
                max_connections: self.max_connections.max(1),
                drain_timeout: secs(self.drain_timeout),
            },
            rates: crate::http::Rates {
                per_source: rate(self.source_rate, self.source_burst),
                per_reader: rate(self.reader_rate, self.reader_burst),
                per_key: rate(self.key_rate, self.key_burst),
                ..crate::http::Rates::default()
            },
            queue: crate::http::Queueing {
                per_reader: self.reader_queue,
                ..crate::http::Queueing::default()
            },
            keys: self.keys()?,
            signing: self.signing()?,
            cors: crate::http::Cors::new(self.cors_origins.iter().map(String::as_str))
                .map_err(|e| e.to_string())?,
        })
    }

    /// The client keys of the file and of the options, all checked
    /// together (a key may not be in both).
    fn keys(&self) -> Result<crate::http::ClientKeys, String> {
        let text = match &self.client_keys_file {
            None => String::new(),
            Some(path) => std::fs::read_to_string(path)
                .map_err(|e| format!("cannot read --client-keys-file {}: {e}", path.display()))?,
        };
        let file_lines = text.lines().count();
        let lines = text
            .lines()
            .chain(self.client_keys.iter().map(String::as_str));
        crate::http::ClientKeys::parse(lines).map_err(|(line, e)| match &self.client_keys_file {
            Some(path) if line <= file_lines => format!("{}:{line}: {e}", path.display()),
            _ => format!("--client-key number {}: {e}", line - file_lines),
        })
    }

    /// Signature checks, when a secret is set.
    fn signing(&self) -> Result<Option<Arc<crate::http::signature::Signing>>, String> {
        let secrets: Vec<&String> = self
            .signing_secrets
            .iter()
            .filter(|s| !s.is_empty())
            .collect();
        if secrets.is_empty() {
            return Ok(None);
        }
        if secrets.iter().any(|s| s.len() < MIN_SIGNING_SECRET) {
            return Err(format!(
                "--signing-secret must be at least {MIN_SIGNING_SECRET} characters: use a long random value"
            ));
        }
        Ok(Some(Arc::new(crate::http::signature::Signing::new(
            secrets.iter().map(|s| s.as_bytes().to_vec()).collect(),
            Duration::from_secs(self.signature_window.max(1)),
            crate::http::signature::DEFAULT_SEEN,
        ))))
    }
}

#[derive(Debug, Subcommand)]
pub enum Command {
    /// Serve the HTTP API.
    Serve {
        #[command(flatten)]
        common: Common,
        /// Address to listen on.
        #[arg(long, env = "TIDINGS_LISTEN", default_value = "127.0.0.1:8080")]
        listen: SocketAddr,
        #[command(flatten)]
        sessions: SessionOptions,
        // Boxed: the edge's options are most of the command's size.
        #[command(flatten)]
        edge: Box<EdgeOptions>,
        /// Read the --data and --intents folders again when their files
        /// change; a broken file keeps the last good version serving.
        #[arg(long, env = "TIDINGS_WATCH")]
        watch: bool,
    },
    /// Answer one question and exit.
    Ask {
        #[command(flatten)]
        common: Common,
        /// Channel to phrase the answer for (chat, sms, voice, plain, or a
        /// profile of the intents folder's channels.yaml); voice prints SSML.
        #[arg(long, default_value = "chat")]
        channel: String,
        /// Print the whole reply as JSON.
        #[arg(long)]
        json: bool,
        /// The question.
        question: Vec<String>,
    },
    /// Talk to the service at a prompt; follow-ups keep their context.
    Chat {
        #[command(flatten)]
        common: Common,
        #[arg(long, default_value = "chat")]
        channel: String,
    },
    /// Check the data and intents; prints every problem, exits 1 on any.
    Check {
        #[command(flatten)]
        common: Common,
        /// Folders or files to check: a scenario folder (with scenario.json),
        /// an intents folder, an intent file or a channels.yaml. Without
        /// paths, --data and --intents (or the built-in demo) are checked.
        paths: Vec<PathBuf>,
    },
    /// List the questions readers asked that got no answer, most frequent
    /// first, from the Redis the service keeps them in.
    Unanswered {
        /// The service's Redis URL.
        #[arg(long, env = "TIDINGS_REDIS_URL")]
        redis_url: String,
        /// The service's key prefix.
        #[arg(long, env = "TIDINGS_REDIS_PREFIX", default_value = "tidings:")]
        redis_prefix: String,
        /// How many to list.
        #[arg(long, default_value_t = 50)]
        limit: usize,
    },
    /// Feed a night's change batches to a running server, in file-name
    /// order, waiting between them as their `as_of` times say (over
    /// --speed).
    Replay {
        /// The server's address.
        #[arg(long, env = "TIDINGS_SERVER", default_value = "http://127.0.0.1:8080")]
        server: String,
        /// The server's admin token.
        #[arg(long, env = "TIDINGS_ADMIN_TOKEN", hide_env_values = true)]
        admin_token: String,
        /// How many times faster than the night itself: 60 plays an hour in
        /// a minute; 0 sends each batch as soon as the last one is applied.
        #[arg(long, default_value_t = 60.0)]
        speed: f64,
        /// Batch files, or folders of them.
        #[arg(required = true)]
        paths: Vec<PathBuf>,
    },
    /// Run conversation scripts: every turn must show what it says it will.
    Test {
        #[command(flatten)]
        common: Common,
        /// Script files or folders of them (default: tests/scripts).
        #[arg(default_value = "tests/scripts")]
        paths: Vec<PathBuf>,
    },
    /// Measure understanding and answers against a labelled question set.
    Eval {
        #[command(flatten)]
        common: Common,
        /// The question set (YAML).
        #[arg(long, default_value = "tests/eval/games.yaml")]
        set: PathBuf,
        /// Print every failing case.
        #[arg(long)]
        verbose: bool,
        /// Print the figures as JSON.
        #[arg(long)]
        json: bool,
        /// Print the figures for each tag as well.
        #[arg(long)]
        by_tag: bool,
    },
}

/// Parses `--now`.
pub fn clock(now: &Option<String>) -> Result<Clock, String> {
    match now {
        None => Ok(Clock::System),
        Some(s) => s.parse::<jiff::Timestamp>().map(Clock::Fixed).map_err(|e| {
            format!("--now must be an RFC 3339 time such as 2027-08-14T21:10:00+01:00: {e}")
        }),
    }
}

fn sources(c: &Common) -> Sources {
    Sources {
        data: c.data.clone(),
        intents: c.intents.clone(),
    }
}

/// The configured secret for hashing user ids (`TIDINGS_ID_SECRET`).
fn configured_secret() -> Option<Vec<u8>> {
    match std::env::var("TIDINGS_ID_SECRET") {
        Ok(s) if !s.is_empty() => Some(s.into_bytes()),
        _ => None,
    }
}

/// The secret for hashing user ids: the configured one, else a fresh one
/// for this process (fine while sessions live in this process only).
pub fn id_secret() -> Vec<u8> {
    configured_secret().unwrap_or_else(|| rand::random::<[u8; 32]>().to_vec())
}

/// Builds an engine: the scenario, the clock and the session store.
pub fn build_engine(c: &Common, o: &SessionOptions) -> Result<Engine, String> {
    if o.admin_token
        .as_deref()
        .is_some_and(|t| !t.is_empty() && t.len() < 16)
    {
        return Err("--admin-token must be at least 16 characters: use a long random value".into());
    }
    if o.metrics_token
        .as_deref()
        .is_some_and(|t| !t.is_empty() && t.len() < 16)
    {
        return Err(
            "--metrics-token must be at least 16 characters: use a long random value".into(),
        );
    }
    if o.redis_url.is_some() && configured_secret().is_none() {
        // With a random key per process, replicas would not find each
        // other's sessions, and after a restart an erasure would miss the
        // reader's old keys.
        return Err("--redis-url needs TIDINGS_ID_SECRET: set it to a long random value, the same on every replica".into());
    }
    let snap = replayed(engine::load(&sources(c)).map_err(|e| e.to_string())?, c)?;
    let settings = Settings {
        clock: clock(&c.now)?,
        session_ttl: Duration::from_secs(o.session_ttl.max(1)),
        retry_window: Duration::from_secs(o.retry_window.max(1)),
        id_secret: id_secret(),
        admin_token: o.admin_token.clone().filter(|t| !t.is_empty()),
        metrics_token: o.metrics_token.clone().filter(|t| !t.is_empty()),
        stale_after: Duration::from_secs(o.stale_after),
        max_removed_share: o.max_removed_share.clamp(0.0, 1.0),
    };
    // With Redis, replicas share the sessions and the dataset, both through
    // one link, so a change posted to one replica is served by all.
    Ok(match &o.redis_url {
        Some(url) => {
            let ca = match &o.redis_ca {
                None => None,
                Some(path) => Some(
                    std::fs::read(path)
                        .map_err(|e| format!("cannot read --redis-ca {}: {e}", path.display()))?,
                ),
            };
            let store = RedisStore::connect(url, &o.redis_prefix, o.redis_cluster, ca.as_deref())
                .map_err(|e| e.to_string())?;
            let shared = SharedData::on(store.link(), &o.redis_prefix);
            Engine::new(snap, Arc::new(store), settings).with_shared(shared)
        }
        None => Engine::new(
            snap,
            Arc::new(MemoryStore::with_cap(o.max_sessions)),
            settings,
        ),
    })
}

/// The loaded scenario with `--replay`'s batches applied in order (up to
/// `--until`), each checked as the admin API checks it; the first refused
/// batch stops the command with its problems.
fn replayed(snap: Snapshot, c: &Common) -> Result<Snapshot, String> {
    let Some(path) = &c.replay else {
        return Ok(snap);
    };
    let until = match &c.until {
        None => None,
        Some(t) => Some(
            t.parse::<jiff::Timestamp>()
                .map_err(|e| format!("--until {t:?} is not an RFC 3339 time: {e}"))?,
        ),
    };
    let steps = crate::replay::read_steps(std::slice::from_ref(path)).map_err(|p| p.join("\n"))?;
    let mut data = snap.data;
    for step in steps {
        // Batches are in time order (read_steps checks): the first one
        // after --until ends the replay. One without a time of its own is
        // applied in its place.
        if let (Some(limit), Some(at)) = (until, step.as_of) {
            if at > limit {
                break;
            }
        }
        let batch: crate::dataset::changes::Batch =
            serde_json::from_str(&step.body).map_err(|e| e.to_string())?;
        // A batch without its own time keeps the data's.
        let as_of = engine::rfc3339(&data.as_of.to_zoned_datetime(data.tz.clone()));
        data = crate::dataset::changes::apply(&data, &batch, &as_of).map_err(|mut problems| {
            let name = step.path.display().to_string();
            crate::dataset::changes::locate(&mut problems, &name, &step.body);
            let list: Vec<String> = problems.iter().map(|p| p.to_string()).collect();
            list.join("\n")
        })?;
    }
    // Answers are given as at --until, not as at the last batch before it:
    // a live count last updated at 01:00 is 10 minutes old at 01:10.
    if let Some(t) = until {
        data.clock = Some(t);
    }
    Ok(Snapshot::new(data, snap.catalog))
}

/// Builds an engine with in-memory sessions.
pub fn local_engine(c: &Common, ttl: Duration) -> Result<Engine, String> {
    build_engine(c, &SessionOptions::in_memory(ttl.as_secs()))
}

/// Runs a command; returns the process exit code.
pub async fn run(cli: Cli) -> i32 {
    match cli.command {
        Command::Serve {
            common,
            listen,
            sessions,
            edge,
            watch,
        } => {
            let edge = match edge.edge() {
                Ok(e) => e,
                Err(e) => {
                    eprintln!("{e}");
                    return 1;
                }
            };
            if watch && common.data.is_none() && common.intents.is_none() {
                eprintln!("--watch needs --data or --intents: the built-in demo does not change");
                return 2;
            }
            let engine = match build_engine(&common, &sessions) {
                Ok(e) => e,
                Err(e) => {
                    eprintln!("{e}");
                    return 1;
                }
            };
            if watch {
                let watcher = engine.clone();
                let src = sources(&common);
                tokio::spawn(async move {
                    crate::watch::watch(watcher, src, Duration::from_millis(WATCH_POLL_MS)).await
                });
            }
            if sessions.redis_url.is_some() {
                // Start from the newest shared data, then keep in step.
                if let Err(e) = engine.catch_up().await {
                    tracing::warn!(error = %e, "cannot read the shared dataset; starting from the files");
                }
                let follower = engine.clone();
                tokio::spawn(async move {
                    follower
                        .follow_shared(Duration::from_millis(SHARED_POLL_MS))
                        .await
                });
            }
            let listener = match tokio::net::TcpListener::bind(listen).await {
                Ok(l) => l,
                Err(e) => {
                    eprintln!("cannot listen on {listen}: {e}");
                    return 1;
                }
            };
            // Before "serving", so the line is there once the address is.
            edge.keys.announce();
            let snap = engine.snapshot();
            tracing::info!(
                addr = %listener.local_addr().map(|a| a.to_string()).unwrap_or_default(),
                scenario = %snap.data.scenario.title,
                sessions = engine.store_name(),
                intents = snap.catalog.intents.len(),
                "serving"
            );
            match crate::http::run_with(listener, engine, edge, shutdown_signal()).await {
                Ok(()) => 0,
                Err(e) => {
                    eprintln!("server error: {e}");
                    1
                }
            }
        }
        Command::Ask {
            common,
            channel,
            json,
            question,
        } => {
            let engine = match local_engine(&common, Duration::from_secs(60)) {
                Ok(e) => e,
                Err(e) => {
                    eprintln!("{e}");
                    return 1;
                }
            };
            let q = question.join(" ");
            if q.trim().is_empty() {
                eprintln!("ask needs a question, for example: tidings ask \"who won the women's long jump?\"");
                return 2;
            }
            match engine.handle("cli", &channel, &q).await {
                Ok(a) if json => {
                    say(&serde_json::to_string_pretty(&a).unwrap_or_default());
                    0
                }
                Ok(a) => {
                    // A voice channel's reply is its SSML document.
                    say(a.reply.ssml.as_deref().unwrap_or(&a.reply.text));
                    0
                }
                Err(e) => {
                    eprintln!("{e}");
                    2
                }
            }
        }
        Command::Chat { common, channel } => {
            let engine = match local_engine(&common, Duration::from_secs(3600)) {
                Ok(e) => e,
                Err(e) => {
                    eprintln!("{e}");
                    return 1;
                }
            };
            let snap = engine.snapshot();
            println!(
                "{} — ask a question; an empty line or Ctrl-D ends.",
                snap.data.scenario.title
            );
            let stdin = std::io::stdin();
            loop {
                print!("> ");
                let _ = std::io::stdout().flush();
                let mut line = String::new();
                match stdin.lock().read_line(&mut line) {
                    Ok(0) | Err(_) => break,
                    Ok(_) => {}
                }
                let line = line.trim();
                if line.is_empty() {
                    break;
                }
                match engine.handle("cli-chat", &channel, line).await {
                    Ok(a) => println!("{}", a.reply.text),
                    Err(e) => eprintln!("{e}"),
                }
            }
            0
        }
        Command::Check { paths, .. } if !paths.is_empty() => crate::check::run(&paths),
        Command::Check { common, .. } => match engine::load(&sources(&common)) {
            Ok(s) => {
                println!(
                    "ok: {} ({} competitors, {} contests), {} intents",
                    s.data.scenario.title,
                    s.data.competitors.len(),
                    s.data.contests.len(),
                    s.catalog.intents.len()
                );
                0
            }
            Err(e) => {
                eprintln!("{e}");
                1
            }
        },
        Command::Eval {
            common,
            set,
            verbose,
            json,
            by_tag,
        } => crate::eval::run_cli(&common, &set, verbose, json, by_tag).await,
        Command::Test { common, paths } => crate::scripts::run(&common, &paths).await,
        Command::Replay {
            server,
            admin_token,
            speed,
            paths,
        } => crate::replay::run(&server, &admin_token, &paths, speed).await,
        Command::Unanswered {
            redis_url,
            redis_prefix,
            limit,
        } => {
            let store = match RedisStore::new(&redis_url, &redis_prefix) {
                Ok(s) => s,
                Err(e) => {
                    eprintln!("{e}");
                    return 1;
                }
            };
            match store.unanswered(limit).await {
                Ok(rows) if rows.is_empty() => {
                    say("no unanswered questions kept");
                    0
                }
                Ok(rows) => {
                    say(&format!("{:>6}  {:<15}  question", "times", "kind"));
                    for r in rows {
                        say(&format!("{:>6}  {:<15}  {}", r.count, r.kind, r.text));
                    }
                    0
                }
                Err(e) => {
                    eprintln!("{e}");
                    1
                }
            }
        }
    }
}

/// Prints a line; a closed pipe (`tidings ask … | head`) is not an error.
fn say(text: &str) {
    let mut out = std::io::stdout().lock();
    let _ = writeln!(out, "{text}");
}

/// Completes on Ctrl-C or SIGTERM.
pub async fn shutdown_signal() {
    let ctrl_c = async {
        let _ = tokio::signal::ctrl_c().await;
    };
    #[cfg(unix)]
    let term = async {
        match tokio::signal::unix::signal(tokio::signal::unix::SignalKind::terminate()) {
            Ok(mut s) => {
                s.recv().await;
            }
            Err(_) => std::future::pending::<()>().await,
        }
    };
    #[cfg(not(unix))]
    let term = std::future::pending::<()>();
    tokio::select! {
        _ = ctrl_c => {},
        _ = term => {},
    }
    tracing::info!("shutting down");
}
