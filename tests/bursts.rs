//! A burst from one reader over a real socket: 200 messages sent at once
//! by one reader wait for each other's turn instead of racing, so none is
//! a 5xx, every one is answered or refused with `429` and `retry-after`,
//! the session counts exactly the turns answered, and the store does no
//! more work per answered message than for a message on its own.
//!
//! The Redis test runs its own redis-server (`TIDINGS_REDIS_SERVER_BIN`,
//! else the one on the PATH), so `INFO commandstats` counts this test's
//! commands alone.

mod common;

use std::sync::Arc;
use std::time::{Duration, Instant};

use common::{engine_with, test_settings, Server};
use tidings::dialogue::{MemoryStore, RedisStore, SessionStore};
use tidings::engine::Engine;
use tidings::http::{Edge, Queueing};

const BURST: usize = 200;
const QUESTION: &str = "medal table";

/// No rate limits (the burst is the point), and the given line per reader.
fn edge(per_reader: usize) -> Edge {
    Edge {
        queue: Queueing {
            per_reader,
            // Inside the 10 s request timeout, with room for a slow machine.
            wait: Duration::from_secs(8),
        },
        ..Edge::without_rate_limits()
    }
}

/// What came back for one message.
#[derive(Debug)]
enum Got {
    Answered,
    Refused { retry_after: u64, code: String },
    Other(#[allow(dead_code)] u16, #[allow(dead_code)] String),
}

/// Sends `BURST` messages of `user` at once, each with its own message id
/// if `ids`.
async fn burst(s: &Server, user: &str, ids: bool) -> Vec<Got> {
    let tasks: Vec<_> = (0..BURST)
        .map(|i| {
            let client = s.client.clone();
            let url = s.url("/v1/messages");
            let mut body = serde_json::json!({"user": user, "text": QUESTION});
            if ids {
                body["message_id"] = format!("{user}-{i}").into();
            }
            tokio::spawn(async move {
                let r = client.post(url).json(&body).send().await.unwrap();
                let status = r.status().as_u16();
                let retry_after = r
                    .headers()
                    .get("retry-after")
                    .and_then(|v| v.to_str().ok()?.parse::<u64>().ok());
                let text = r.text().await.unwrap();
                let json: serde_json::Value = serde_json::from_str(&text).unwrap_or_default();
                match (status, retry_after) {
                    (200, _) if json["text"].as_str().is_some_and(|t| !t.is_empty()) => {
                        Got::Answered
                    }
                    (429, Some(after)) => Got::Refused {
                        retry_after: after,
                        code: json["error"]["code"].as_str().unwrap_or("").to_string(),
                    },
                    _ => Got::Other(status, text),
                }
            })
        })
        .collect();
    let mut out = Vec::with_capacity(BURST);
    for t in tasks {
        out.push(t.await.unwrap());
    }
    out
}

/// Checks the burst's answers: no 5xx and nothing but answers and 429s
/// with retry-after; returns how many were answered.
fn answered(got: &[Got]) -> usize {
    let others: Vec<&Got> = got.iter().filter(|g| matches!(g, Got::Other(..))).collect();
    assert!(others.is_empty(), "not an answer nor a 429: {others:?}");
    for g in got {
        if let Got::Refused { retry_after, code } = g {
            assert!(*retry_after >= 1);
            assert_eq!(code, "reader_busy");
        }
    }
    got.iter().filter(|g| matches!(g, Got::Answered)).count()
}

/// The turn count of the reader's stored session.
async fn turns_stored(engine: &Engine, store: &dyn SessionStore, user: &str) -> u64 {
    let key = engine.user_key("chat", user);
    let loaded = store.load(&key, None).await.unwrap();
    loaded.session.map_or(0, |s| s.turn)
}

#[tokio::test(flavor = "multi_thread", worker_threads = 4)]
async fn a_burst_of_one_reader_waits_in_line_and_every_message_is_answered() {
    let store = Arc::new(MemoryStore::new());
    let engine = engine_with(store.clone(), test_settings());
    let s = Server::start_with(engine.clone(), edge(BURST)).await;
    let got = burst(&s, "burst-reader", true).await;
    let n = answered(&got);
    // A line long enough for the whole burst: every message is answered,
    // none lost to a compare-and-set race.
    assert_eq!(n, BURST, "{got:?}");
    assert_eq!(
        turns_stored(&engine, store.as_ref(), "burst-reader").await,
        BURST as u64,
        "the session counts every turn answered, once"
    );
}

#[tokio::test(flavor = "multi_thread", worker_threads = 4)]
async fn a_burst_past_the_line_gets_429_with_retry_after_and_the_session_stays_whole() {
    let store = Arc::new(MemoryStore::new());
    let engine = engine_with(store.clone(), test_settings());
    let s = Server::start_with(engine.clone(), edge(3)).await;
    let got = burst(&s, "burst-reader", true).await;
    let n = answered(&got);
    assert!(n >= 1, "the first message is always answered");
    assert!(n < BURST, "a line of 3 cannot hold 200 messages at once");
    assert_eq!(
        turns_stored(&engine, store.as_ref(), "burst-reader").await,
        n as u64
    );
    // The line is gone once the burst is over: the reader is answered
    // again at once.
    let (status, _) = s.ask("burst-reader", QUESTION).await;
    assert_eq!(status, 200);
}

/// A private redis-server on a free port, stopped when dropped.
struct PrivateRedis {
    child: std::process::Child,
    port: u16,
}

impl PrivateRedis {
    fn start() -> PrivateRedis {
        let port = {
            let l = std::net::TcpListener::bind("127.0.0.1:0").unwrap();
            l.local_addr().unwrap().port()
        };
        let bin = std::env::var("TIDINGS_REDIS_SERVER_BIN")
            .unwrap_or_else(|_| "redis-server".to_string());
        let child = std::process::Command::new(&bin)
            .args(["--port", &port.to_string(), "--bind", "127.0.0.1"])
            .args(["--save", "", "--appendonly", "no"])
            .stdout(std::process::Stdio::null())
            .spawn()
            .unwrap_or_else(|e| panic!("cannot start {bin} ({e}); set TIDINGS_REDIS_SERVER_BIN"));
        PrivateRedis { child, port }
    }

    fn url(&self) -> String {
        format!("redis://127.0.0.1:{}/", self.port)
    }

    async fn conn(&self) -> redis::aio::MultiplexedConnection {
        let client = redis::Client::open(self.url()).unwrap();
        let deadline = Instant::now() + Duration::from_secs(5);
        loop {
            match client.get_multiplexed_async_connection().await {
                Ok(c) => return c,
                Err(e) if Instant::now() > deadline => panic!("private redis: {e}"),
                Err(_) => tokio::time::sleep(Duration::from_millis(20)).await,
            }
        }
    }
}

impl Drop for PrivateRedis {
    fn drop(&mut self) {
        let _ = self.child.kill();
        let _ = self.child.wait();
    }
}

/// Commands Redis ran since the last reset, from `INFO commandstats`
/// (scripts' own commands included), leaving out this test's own `INFO`
/// and `CONFIG`.
async fn commands_since_reset(con: &mut redis::aio::MultiplexedConnection) -> u64 {
    let info: String = redis::cmd("INFO")
        .arg("commandstats")
        .query_async(con)
        .await
        .unwrap();
    info.lines()
        .filter_map(|l| l.strip_prefix("cmdstat_"))
        .filter(|l| !l.starts_with("info:") && !l.starts_with("config"))
        .filter_map(|l| {
            let calls = l.split(',').find_map(|f| f.split_once("calls="))?.1;
            calls.parse::<u64>().ok()
        })
        .sum()
}

async fn reset(con: &mut redis::aio::MultiplexedConnection) {
    let _: () = redis::cmd("CONFIG")
        .arg("RESETSTAT")
        .query_async(con)
        .await
        .unwrap();
}

#[tokio::test(flavor = "multi_thread", worker_threads = 4)]
async fn a_burst_costs_redis_about_what_its_messages_cost_one_by_one() {
    let redis = PrivateRedis::start();
    let mut con = redis.conn().await;
    let store = Arc::new(RedisStore::new(&redis.url(), "tidings-test:burst:").unwrap());
    let engine = engine_with(store.clone(), test_settings());
    let s = Server::start_with(engine.clone(), edge(BURST)).await;

    // Warm up (connection, script loaded), then one message on its own,
    // as the second turn of a reader: the figure a burst is held to. No
    // message ids here (a save with a reply to keep costs a few commands
    // more, counted in the test below).
    let post = |user: &'static str| {
        let s = &s;
        async move { s.ask(user, QUESTION).await.0 }
    };
    assert_eq!(post("warm-reader").await, 200);
    assert_eq!(post("single-reader").await, 200);
    reset(&mut con).await;
    assert_eq!(post("single-reader").await, 200);
    let single = commands_since_reset(&mut con).await;
    assert!(single > 0, "the message reached Redis");

    // The burst, from a reader with one turn stored already, like the
    // single message.
    assert_eq!(post("burst-reader").await, 200);
    reset(&mut con).await;
    let got = burst(&s, "burst-reader", false).await;
    let n = answered(&got);
    let total = commands_since_reset(&mut con).await;
    let per_message = total as f64 / n as f64;
    println!(
        "Redis commands: one message {single}; burst of {BURST}: {total} for {n} answered = {per_message:.2} per message"
    );
    assert_eq!(n, BURST, "{got:?}");
    // Racing turns cost a whole extra load and save each time they lose;
    // waiting in line costs none.
    assert!(
        per_message <= single as f64 * 1.1,
        "{per_message:.2} commands per message in a burst against {single} for one"
    );
    assert_eq!(
        turns_stored(&engine, store.as_ref(), "burst-reader").await,
        BURST as u64 + 1
    );
}

/// A save that keeps a reply costs Redis the same commands whether the
/// reader has one reply kept or hundreds: expired names leave the reply
/// index by score, without a look at each member. (Before, past 32 kept
/// replies every save checked each of them with `EXISTS`.)
#[tokio::test(flavor = "multi_thread", worker_threads = 2)]
async fn a_save_costs_redis_the_same_however_many_replies_the_reader_keeps() {
    let redis = PrivateRedis::start();
    let mut con = redis.conn().await;
    let store = RedisStore::new(&redis.url(), "tidings-test:index:").unwrap();
    let ttl = Duration::from_secs(600);
    // Saves `n` turns of `reader`, each keeping its reply; the version
    // reached.
    async fn turns(store: &RedisStore, reader: &str, n: usize, ttl: Duration) -> u64 {
        let session = tidings::dialogue::Session::new("chat", 1_800_000_000);
        let mut version = 0;
        for i in 0..n {
            let message = format!("{reader}-m{i}");
            let keep = tidings::dialogue::KeepReply {
                message: &message,
                reply: "kept",
                ttl,
            };
            let saved = store
                .save(reader, &session, version, ttl, Some(keep))
                .await
                .unwrap();
            assert_eq!(saved, tidings::dialogue::Saved::Stored);
            version = store.load(reader, None).await.unwrap().version;
        }
        version
    }
    let few = turns(&store, "chat:few", 1, ttl).await;
    let many = turns(&store, "chat:many", 300, ttl).await;
    let with_one = one_more_save(&store, &mut con, "chat:few", few, ttl).await;
    let with_300 = one_more_save(&store, &mut con, "chat:many", many, ttl).await;
    assert!(with_one > 0, "the save reached Redis");
    assert_eq!(
        with_300, with_one,
        "a save of a reader with 300 kept replies took {with_300} commands, against {with_one} with one"
    );
    // Every reply is still found, and erased with the reader.
    assert_eq!(store.erase("chat:many").await.unwrap(), 302);
}

/// The Redis commands of one more save of `reader` at `version`, keeping a
/// reply.
async fn one_more_save(
    store: &RedisStore,
    con: &mut redis::aio::MultiplexedConnection,
    reader: &str,
    version: u64,
    ttl: Duration,
) -> u64 {
    let session = tidings::dialogue::Session::new("chat", 1_800_000_000);
    reset(con).await;
    let keep = tidings::dialogue::KeepReply {
        message: "one-more",
        reply: "kept",
        ttl,
    };
    let saved = store
        .save(reader, &session, version, ttl, Some(keep))
        .await
        .unwrap();
    assert_eq!(saved, tidings::dialogue::Saved::Stored);
    commands_since_reset(con).await
}
