//! Shared helpers for integration tests: a real server on port 0.

#![allow(dead_code)]

pub mod cluster;
pub mod down;
pub mod speech;

use std::io::{BufRead, BufReader};
use std::net::SocketAddr;
use std::process::{Child, Command, Stdio};
use std::sync::Arc;
use std::sync::Mutex;
use std::time::Duration;

use tidings::dialogue::MemoryStore;
use tidings::engine::{self, Clock, Engine, Settings, Sources};

/// The demo clock: Saturday 14 August 2027, 21:10 in the scenario's zone.
pub const NOW: &str = "2027-08-14T21:10:00+01:00";

/// An engine over the built-in demo with in-memory sessions.
pub fn demo_engine() -> Engine {
    let snap = engine::load(&Sources::default()).expect("the demo loads");
    let settings =
        Settings::with_clock(Clock::Fixed(NOW.parse().unwrap()), b"test-secret".to_vec());
    Engine::new(snap, Arc::new(MemoryStore::new()), settings)
}

/// A running server; dropped at the end of the test with its runtime.
pub struct Server {
    pub addr: SocketAddr,
    pub client: reqwest::Client,
    _shutdown: tokio::sync::oneshot::Sender<()>,
}

impl Server {
    pub async fn start(engine: Engine) -> Server {
        let listener = tokio::net::TcpListener::bind("127.0.0.1:0").await.unwrap();
        let addr = listener.local_addr().unwrap();
        let (tx, rx) = tokio::sync::oneshot::channel::<()>();
        tokio::spawn(async move {
            tidings::http::run(listener, engine, async {
                let _ = rx.await;
            })
            .await
            .unwrap();
        });
        Server {
            addr,
            client: reqwest::Client::new(),
            _shutdown: tx,
        }
    }

    /// A server with its own edge settings (rate limits, connections).
    pub async fn start_with(engine: Engine, edge: tidings::http::Edge) -> Server {
        let listener = tokio::net::TcpListener::bind("127.0.0.1:0").await.unwrap();
        let addr = listener.local_addr().unwrap();
        let (tx, rx) = tokio::sync::oneshot::channel::<()>();
        tokio::spawn(async move {
            tidings::http::run_with(listener, engine, edge, async {
                let _ = rx.await;
            })
            .await
            .unwrap();
        });
        Server {
            addr,
            client: reqwest::Client::new(),
            _shutdown: tx,
        }
    }

    pub fn url(&self, path: &str) -> String {
        format!("http://{}{path}", self.addr)
    }

    /// Sends a reader's message and returns status and JSON body.
    pub async fn ask(&self, user: &str, text: &str) -> (u16, serde_json::Value) {
        let r = self
            .client
            .post(self.url("/v1/messages"))
            .json(&serde_json::json!({"user": user, "text": text}))
            .send()
            .await
            .unwrap();
        let status = r.status().as_u16();
        (status, r.json().await.unwrap())
    }
}

/// The private Redis started by `tests/run.sh`. Tests that need it fail
/// loudly when it is missing: they never skip silently.
pub fn redis_url() -> String {
    std::env::var("TIDINGS_TEST_REDIS_URL").unwrap_or_else(|_| {
        panic!("TIDINGS_TEST_REDIS_URL is not set: run the tests with `bash tests/run.sh`, which starts a private redis-server")
    })
}

/// A key prefix of its own for one test, so tests share one Redis safely.
pub fn test_prefix(name: &str) -> String {
    format!("tidings-test:{name}:{:016x}:", rand::random::<u64>())
}

/// An engine over the demo with the given store and settings.
pub fn engine_with(store: Arc<dyn tidings::dialogue::SessionStore>, settings: Settings) -> Engine {
    let snap = engine::load(&Sources::default()).expect("the demo loads");
    Engine::new(snap, store, settings)
}

/// The demo test settings: fixed clock, fixed secret.
pub fn test_settings() -> Settings {
    Settings::with_clock(Clock::Fixed(NOW.parse().unwrap()), b"test-secret".to_vec())
}

/// An engine over the demo with sessions in Redis under `prefix`.
pub fn redis_engine(prefix: &str) -> (Engine, Arc<tidings::dialogue::RedisStore>) {
    let store = Arc::new(
        tidings::dialogue::RedisStore::new(&redis_url(), prefix).expect("the Redis URL parses"),
    );
    (engine_with(store.clone(), test_settings()), store)
}

/// A plain Redis connection for inspecting what the service stored.
pub async fn redis_conn() -> redis::aio::MultiplexedConnection {
    redis::Client::open(redis_url())
        .unwrap()
        .get_multiplexed_async_connection()
        .await
        .unwrap_or_else(|e| panic!("cannot reach the test Redis at {}: {e}", redis_url()))
}

/// Every key under a prefix (SCAN, never KEYS).
pub async fn keys_under(prefix: &str) -> Vec<String> {
    keys_matching(&format!("{prefix}*")).await
}

/// Every key matching a SCAN pattern, iterating the cursor to the end.
pub async fn keys_matching(pattern: &str) -> Vec<String> {
    let mut conn = redis_conn().await;
    let mut cursor: u64 = 0;
    let mut keys = Vec::new();
    loop {
        let (next, batch): (u64, Vec<String>) = redis::cmd("SCAN")
            .arg(cursor)
            .arg("MATCH")
            .arg(pattern)
            .arg("COUNT")
            .arg(1000)
            .query_async(&mut conn)
            .await
            .unwrap();
        keys.extend(batch);
        if next == 0 {
            return keys;
        }
        cursor = next;
    }
}

/// A message with optional id, as a chat platform sends it.
pub async fn post_message(
    s: &Server,
    user: &str,
    text: &str,
    message_id: Option<&str>,
) -> (u16, serde_json::Value, bool) {
    let mut body = serde_json::json!({"user": user, "text": text});
    if let Some(id) = message_id {
        body["message_id"] = serde_json::json!(id);
    }
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .json(&body)
        .send()
        .await
        .unwrap();
    let status = r.status().as_u16();
    let repeated = r
        .headers()
        .get("tidings-repeated")
        .is_some_and(|v| v == "true");
    (status, r.json().await.unwrap(), repeated)
}

/// Waits for `check` to hold, polling; panics with `what` after `limit`.
pub async fn wait_until<F, Fut>(what: &str, limit: Duration, mut check: F)
where
    F: FnMut() -> Fut,
    Fut: std::future::Future<Output = bool>,
{
    let deadline = tokio::time::Instant::now() + limit;
    loop {
        if check().await {
            return;
        }
        if tokio::time::Instant::now() > deadline {
            panic!("timed out waiting for {what}");
        }
        tokio::time::sleep(Duration::from_millis(25)).await;
    }
}

/// A `tidings serve` process of the test's own.
pub struct ServeProcess {
    child: Child,
    pub base: String,
    log: Arc<Mutex<String>>,
}

impl ServeProcess {
    /// Starts `bin serve` (the test's own `tidings`, passed as
    /// `env!("CARGO_BIN_EXE_tidings")`) with `args` and `envs`, on a port
    /// the kernel picks (`--listen 127.0.0.1:0`), and reads the bound
    /// address from its log, so two processes can never be handed the
    /// same port.
    pub fn start(bin: &str, args: &[&str], envs: &[(&str, &str)]) -> ServeProcess {
        let mut child = Command::new(bin)
            .arg("serve")
            .args(["--listen", "127.0.0.1:0"])
            .args(args)
            .envs(envs.iter().copied())
            .stdout(Stdio::null())
            .stderr(Stdio::piped())
            .spawn()
            .expect("tidings serve starts");
        // Drain the log all along (a full pipe would block the server) and
        // pick out the address it reports.
        let log = Arc::new(Mutex::new(String::new()));
        let (tx, rx) = std::sync::mpsc::channel::<String>();
        let stderr = child.stderr.take().expect("stderr is piped");
        let sink = Arc::clone(&log);
        std::thread::spawn(move || {
            for line in BufReader::new(stderr).lines().map_while(Result::ok) {
                if line.contains("serving") {
                    // As text (`addr=...`) or as a JSON log line.
                    let addr = line
                        .split_whitespace()
                        .find_map(|w| w.strip_prefix("addr="))
                        .map(str::to_string)
                        .or_else(|| {
                            serde_json::from_str::<serde_json::Value>(&line)
                                .ok()?
                                .pointer("/fields/addr")?
                                .as_str()
                                .map(str::to_string)
                        });
                    if let Some(addr) = addr {
                        let _ = tx.send(addr);
                    }
                }
                let mut l = sink.lock().unwrap();
                l.push_str(&line);
                l.push('\n');
            }
        });
        let addr = rx
            .recv_timeout(Duration::from_secs(30))
            .unwrap_or_else(|_| {
                panic!(
                    "tidings serve did not report its address: {}",
                    log.lock().unwrap()
                )
            });
        ServeProcess {
            child,
            base: format!("http://{addr}"),
            log,
        }
    }

    /// What the process has logged so far.
    pub fn log(&self) -> String {
        self.log.lock().unwrap().clone()
    }

    /// Stops the process and returns what it logged.
    pub fn stop(mut self) -> String {
        assert!(
            self.child.try_wait().unwrap().is_none(),
            "replica {} exited early",
            self.base
        );
        let _ = self.child.kill();
        let _ = self.child.wait();
        let log = self.log.lock().unwrap().clone();
        log
    }
}

// A test that fails part-way must not leave its server running: the
// process is killed when the handle goes, whether or not `stop` was called.
impl Drop for ServeProcess {
    fn drop(&mut self) {
        let _ = self.child.kill();
        let _ = self.child.wait();
    }
}

/// A reader's message on a channel to a server at `base`; the reply as
/// JSON, after checking the status is 200.
pub async fn ask_on(
    client: &reqwest::Client,
    base: &str,
    user: &str,
    text: &str,
    channel: &str,
) -> serde_json::Value {
    let r = client
        .post(format!("{base}/v1/messages"))
        .json(&serde_json::json!({"user": user, "text": text, "channel": channel}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200, "{text:?} on {channel}");
    r.json().await.unwrap()
}

/// `GET /v1/admin/status` of a server at `base`, with its admin token.
pub async fn admin_status(client: &reqwest::Client, base: &str, token: &str) -> serde_json::Value {
    client
        .get(format!("{base}/v1/admin/status"))
        .bearer_auth(token)
        .send()
        .await
        .unwrap()
        .json()
        .await
        .unwrap()
}

/// A reader's message to a server at `base` (a process of the test's own);
/// the reply as JSON.
pub async fn ask_at(
    client: &reqwest::Client,
    base: &str,
    user: &str,
    text: &str,
) -> serde_json::Value {
    client
        .post(format!("{base}/v1/messages"))
        .json(&serde_json::json!({"user": user, "text": text}))
        .send()
        .await
        .unwrap()
        .json()
        .await
        .unwrap()
}

/// The election night at 01:45, after the first 13 replay batches: six
/// wards called (Ashvenny North, Brindle Quay, Caddenmill, Dunvarrick,
/// Fennick Green, Lanmouth) and six still counting. The labels in
/// `tests/eval/election.yaml` are worked out for this state.
pub const ELECTION_NOW: &str = "2027-05-07T01:45:00+01:00";
pub const ELECTION_BATCHES: usize = 13;

/// An engine over the election scenario with the first `batches` replay
/// batches applied, on a fixed clock.
pub async fn election_engine(batches: usize, now: &str) -> tidings::engine::Engine {
    use std::sync::Arc;
    use tidings::dataset::changes::Batch;
    use tidings::engine::{self, Clock, Engine, Settings, Sources};

    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let snap = engine::load(&Sources {
        data: Some(root.join("dataset-demo/election")),
        intents: Some(root.join("intents/election")),
    })
    .expect("the election scenario loads");
    let settings =
        Settings::with_clock(Clock::Fixed(now.parse().unwrap()), b"test-secret".to_vec());
    let engine = Engine::new(
        snap,
        Arc::new(tidings::dialogue::MemoryStore::new()),
        settings,
    );
    let mut files: Vec<_> = std::fs::read_dir(root.join("dataset-demo/election/replay"))
        .expect("the replay folder is there")
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|x| x == "json"))
        .collect();
    files.sort();
    assert!(
        files.len() >= batches,
        "only {} replay batches",
        files.len()
    );
    for f in &files[..batches] {
        let text = std::fs::read_to_string(f).unwrap();
        let batch: Batch =
            serde_json::from_str(&text).unwrap_or_else(|e| panic!("{}: {e}", f.display()));
        engine
            .apply_batch(&batch)
            .await
            .unwrap_or_else(|e| panic!("{}: {e:?}", f.display()));
    }
    engine
}
