//! Conversations under real conditions: retried messages, simultaneous
//! messages, erasure, expiry and a Redis that goes away and comes back.
//! Each runs against the private test Redis; the ones that make sense
//! without it also run in memory.

mod common;

use std::process::{Child, Command, Stdio};
use std::sync::Arc;
use std::time::Duration;

use common::{
    engine_with, keys_under, post_message, redis_conn, redis_engine, test_prefix, test_settings,
    wait_until, Server,
};
use tidings::dialogue::store::BoxFuture;
use tidings::dialogue::{
    KeepReply, Loaded, MemoryStore, RedisStore, Saved, SessionStore, StoreError,
};
use tidings::engine::Engine;

/// The stored session's turn counter for a reader, read through the store.
async fn stored_turn(engine: &Engine, store: &dyn SessionStore, user: &str) -> Option<u64> {
    let key = engine.user_key("chat", user);
    store
        .load(&key, None)
        .await
        .expect("the store answers")
        .session
        .map(|s| s.turn)
}

async fn retries_get_the_first_reply(engine: Engine, store: Arc<dyn SessionStore>) {
    let s = Server::start(engine.clone()).await;
    let user = "reader-retry";
    let (_, first, repeated) =
        post_message(&s, user, "who won the men's 400 m?", Some("m-1")).await;
    assert!(!repeated);
    let (_, second, _) = post_message(&s, user, "and silver?", Some("m-2")).await;
    assert!(second["text"].as_str().unwrap().contains("Nulan Bendand"));
    // The platform retries the first message: same reply, session untouched.
    let (status, again, repeated) =
        post_message(&s, user, "who won the men's 400 m?", Some("m-1")).await;
    assert_eq!(status, 200);
    assert!(repeated, "a retry is marked");
    assert_eq!(again, first, "a retry gets the first reply, unchanged");
    assert_eq!(stored_turn(&engine, store.as_ref(), user).await, Some(2));
    // And the conversation goes on from "and silver?", not from the retry.
    let (_, next, _) = post_message(&s, user, "what about the women's?", Some("m-3")).await;
    assert!(
        next["text"].as_str().unwrap().contains("Vonia Gassarace"),
        "{next}"
    );
    // The same id from another reader is another message.
    let (_, other, repeated) = post_message(&s, "reader-other", "hello", Some("m-1")).await;
    assert!(!repeated);
    assert_ne!(other["text"], first["text"]);
}

async fn simultaneous_messages_lose_no_update(engine: Engine, store: Arc<dyn SessionStore>) {
    let s = Arc::new(Server::start(engine.clone()).await);
    let user = "reader-burst";
    let n = 12;
    let mut tasks = Vec::new();
    for i in 0..n {
        let s = s.clone();
        tasks.push(tokio::spawn(async move {
            let id = format!("burst-{i}");
            post_message(&s, user, "who won the men's 100 m?", Some(&id)).await
        }));
    }
    for t in tasks {
        let (status, body, _) = t.await.unwrap();
        assert_eq!(status, 200, "{body}");
        assert_eq!(body["degraded"], false);
    }
    // Every message counted once: the turn counter saw each update.
    assert_eq!(stored_turn(&engine, store.as_ref(), user).await, Some(n));
}

async fn erasure_removes_everything(engine: Engine, store: Arc<dyn SessionStore>) {
    let s = Server::start(engine.clone()).await;
    let user = "+44 7700 900123";
    post_message(&s, user, "who won the men's 400 m?", Some("e-1")).await;
    post_message(&s, user, "and silver?", Some("e-2")).await;
    post_message(&s, "reader-kept", "who won the men's 400 m?", Some("k-1")).await;
    assert!(stored_turn(&engine, store.as_ref(), user).await.is_some());
    let path = format!("/v1/users/chat/{}", urlencode(user));
    let r = s.client.delete(s.url(&path)).send().await.unwrap();
    assert_eq!(r.status(), 204);
    assert_eq!(stored_turn(&engine, store.as_ref(), user).await, None);
    // The stored replies went too: the old message id is handled anew.
    let (_, body, repeated) = post_message(&s, user, "and silver?", Some("e-2")).await;
    assert!(!repeated);
    assert_eq!(body["outcome"], "clarify", "no context is left: {body}");
    // Another reader is untouched.
    assert_eq!(
        stored_turn(&engine, store.as_ref(), "reader-kept").await,
        Some(1)
    );
    // Erasing someone never seen is still a 204; an unknown channel is not.
    let r = s
        .client
        .delete(s.url("/v1/users/chat/nobody"))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 204);
    let r = s
        .client
        .delete(s.url("/v1/users/pigeon/nobody"))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 422);
}

fn urlencode(s: &str) -> String {
    s.bytes()
        .map(|b| match b {
            b'A'..=b'Z' | b'a'..=b'z' | b'0'..=b'9' | b'-' | b'_' | b'.' => (b as char).to_string(),
            _ => format!("%{b:02X}"),
        })
        .collect()
}

#[tokio::test]
async fn in_memory_retries_get_the_first_reply() {
    let store = Arc::new(MemoryStore::new());
    retries_get_the_first_reply(engine_with(store.clone(), test_settings()), store).await;
}

#[tokio::test]
async fn in_redis_retries_get_the_first_reply() {
    let (engine, store) = redis_engine(&test_prefix("retry"));
    retries_get_the_first_reply(engine, store).await;
}

/// The memory store with a pause after each load, so that simultaneous
/// turns of one reader really overlap between load and save (in memory a
/// turn is otherwise too quick for requests to interleave).
struct Paused(MemoryStore);

impl SessionStore for Paused {
    fn load<'a>(
        &'a self,
        reader: &'a str,
        message: Option<&'a str>,
    ) -> BoxFuture<'a, Result<Loaded, StoreError>> {
        Box::pin(async move {
            let loaded = self.0.load(reader, message).await;
            tokio::time::sleep(Duration::from_millis(2)).await;
            loaded
        })
    }
    fn save<'a>(
        &'a self,
        reader: &'a str,
        session: &'a tidings::dialogue::Session,
        expected: u64,
        ttl: Duration,
        reply: Option<KeepReply<'a>>,
    ) -> BoxFuture<'a, Result<Saved, StoreError>> {
        self.0.save(reader, session, expected, ttl, reply)
    }
    fn erase<'a>(&'a self, reader: &'a str) -> BoxFuture<'a, Result<u64, StoreError>> {
        self.0.erase(reader)
    }
    fn note_unanswered<'a>(
        &'a self,
        reader: &'a str,
        text: &'a str,
        kind: &'a str,
    ) -> BoxFuture<'a, Result<(), StoreError>> {
        self.0.note_unanswered(reader, text, kind)
    }
    fn unanswered(
        &self,
        limit: usize,
    ) -> BoxFuture<'_, Result<Vec<tidings::dialogue::Unanswered>, StoreError>> {
        self.0.unanswered(limit)
    }
    fn ping(&self) -> BoxFuture<'_, Result<(), StoreError>> {
        self.0.ping()
    }
    fn name(&self) -> &'static str {
        "paused-memory"
    }
}

#[tokio::test(flavor = "multi_thread", worker_threads = 4)]
async fn in_memory_simultaneous_messages_lose_no_update() {
    let store = Arc::new(Paused(MemoryStore::new()));
    simultaneous_messages_lose_no_update(engine_with(store.clone(), test_settings()), store).await;
}

#[tokio::test(flavor = "multi_thread", worker_threads = 4)]
async fn in_redis_simultaneous_messages_lose_no_update() {
    let (engine, store) = redis_engine(&test_prefix("burst"));
    simultaneous_messages_lose_no_update(engine, store).await;
}

#[tokio::test]
async fn in_memory_erasure_removes_everything() {
    let store = Arc::new(MemoryStore::new());
    erasure_removes_everything(engine_with(store.clone(), test_settings()), store).await;
}

#[tokio::test]
async fn in_redis_erasure_removes_everything_and_a_scan_finds_nothing() {
    let prefix = test_prefix("erase");
    let (engine, store) = redis_engine(&prefix);
    let reader = engine.user_key("chat", "+44 7700 900123");
    erasure_removes_everything(engine, store).await;
    // After the last message above the reader has a fresh session again;
    // erase once more and scan the whole prefix for anything of theirs.
    let s = Server::start(redis_engine(&prefix).0).await;
    let r = s
        .client
        .delete(s.url("/v1/users/chat/%2B44%207700%20900123"))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 204);
    let left: Vec<String> = keys_under(&prefix)
        .await
        .into_iter()
        .filter(|k| k.contains(&reader))
        .collect();
    assert!(left.is_empty(), "left after erasure: {left:?}");
    // The other reader's keys are still there, and no key holds a raw id.
    let all = keys_under(&prefix).await;
    assert!(!all.is_empty());
    assert!(all
        .iter()
        .all(|k| !k.contains("7700") && !k.contains("reader-kept")));
}

#[tokio::test]
async fn a_session_in_redis_expires_after_the_configured_idle_time() {
    let prefix = test_prefix("ttl");
    let (engine, _) = redis_engine(&prefix);
    let s = Server::start(engine.clone()).await;
    post_message(&s, "reader-ttl", "who won the men's 400 m?", None).await;
    let key = format!("{prefix}{{{}}}:s", engine.user_key("chat", "reader-ttl"));
    let mut conn = redis_conn().await;
    let ttl: i64 = redis::cmd("PTTL")
        .arg(&key)
        .query_async(&mut conn)
        .await
        .unwrap();
    // The default idle TTL is 30 minutes; allow five seconds for a slow machine.
    assert!(
        (1_795_000..=1_800_000).contains(&ttl),
        "PTTL of {key} is {ttl} ms"
    );
    // Each message renews it.
    redis::cmd("PEXPIRE")
        .arg(&key)
        .arg(60_000)
        .query_async::<i64>(&mut conn)
        .await
        .unwrap();
    post_message(&s, "reader-ttl", "and silver?", None).await;
    let ttl: i64 = redis::cmd("PTTL")
        .arg(&key)
        .query_async(&mut conn)
        .await
        .unwrap();
    assert!(ttl > 1_795_000, "renewed: {ttl}");
}

#[tokio::test]
async fn a_follow_up_after_the_session_expired_does_not_reuse_it() {
    let prefix = test_prefix("expired");
    let store = Arc::new(RedisStore::new(&common::redis_url(), &prefix).unwrap());
    let mut settings = test_settings();
    settings.session_ttl = Duration::from_millis(1500);
    let engine = engine_with(store.clone(), settings);
    let s = Server::start(engine.clone()).await;
    post_message(&s, "reader-late", "who won the men's 400 m?", None).await;
    let key = format!("{prefix}{{{}}}:s", engine.user_key("chat", "reader-late"));
    let conn = redis_conn().await;
    wait_until("the session to expire", Duration::from_secs(10), || {
        let mut conn = conn.clone();
        let key = key.clone();
        async move {
            redis::cmd("EXISTS")
                .arg(&key)
                .query_async::<i64>(&mut conn)
                .await
                .unwrap()
                == 0
        }
    })
    .await;
    let (_, body, _) = post_message(&s, "reader-late", "and silver?", None).await;
    assert_eq!(body["outcome"], "clarify", "{body}");
    assert!(!body["text"].as_str().unwrap().contains("Nulan Bendand"));
}

#[tokio::test]
async fn an_expired_session_in_memory_is_not_reused() {
    let store = Arc::new(MemoryStore::new());
    let mut settings = test_settings();
    settings.session_ttl = Duration::from_millis(300);
    let engine = engine_with(store.clone(), settings);
    let s = Server::start(engine.clone()).await;
    post_message(&s, "reader-late", "who won the men's 400 m?", None).await;
    let st = store.clone();
    let e = engine.clone();
    wait_until("the session to expire", Duration::from_secs(5), move || {
        let st = st.clone();
        let e = e.clone();
        async move { stored_turn(&e, st.as_ref(), "reader-late").await.is_none() }
    })
    .await;
    let (_, body, _) = post_message(&s, "reader-late", "and silver?", None).await;
    assert_eq!(body["outcome"], "clarify", "{body}");
}

/// A redis-server of this test's own, so it can be stopped and started.
struct OwnRedis {
    port: u16,
    dir: tempdir::Dir,
    child: Option<Child>,
}

mod tempdir {
    /// A scratch directory removed on drop.
    pub struct Dir(pub std::path::PathBuf);
    impl Dir {
        pub fn new(tag: &str) -> Dir {
            let p = std::env::temp_dir().join(format!(
                "tidings-{tag}-{}-{:08x}",
                std::process::id(),
                rand::random::<u32>()
            ));
            std::fs::create_dir_all(&p).unwrap();
            Dir(p)
        }
    }
    impl Drop for Dir {
        fn drop(&mut self) {
            let _ = std::fs::remove_dir_all(&self.0);
        }
    }
}

impl OwnRedis {
    fn start_on(port: u16, dir: tempdir::Dir) -> OwnRedis {
        let bin = std::env::var("TIDINGS_REDIS_SERVER_BIN").unwrap_or_else(|_| {
            panic!("TIDINGS_REDIS_SERVER_BIN is not set: run the tests with `bash tests/run.sh`")
        });
        let child = Command::new(bin)
            .args(["--port", &port.to_string(), "--bind", "127.0.0.1"])
            .args(["--save", "", "--appendonly", "no"])
            .arg("--dir")
            .arg(&dir.0)
            .stdout(Stdio::null())
            .stderr(Stdio::null())
            .spawn()
            .expect("redis-server starts");
        OwnRedis {
            port,
            dir,
            child: Some(child),
        }
    }

    fn url(&self) -> String {
        format!("redis://127.0.0.1:{}/", self.port)
    }

    async fn wait_ready(&self) {
        let url = self.url();
        wait_until("redis-server to answer", Duration::from_secs(10), || {
            let url = url.clone();
            async move {
                match redis::Client::open(url) {
                    Ok(c) => match c.get_multiplexed_async_connection().await {
                        Ok(mut conn) => redis::cmd("PING")
                            .query_async::<String>(&mut conn)
                            .await
                            .is_ok(),
                        Err(_) => false,
                    },
                    Err(_) => false,
                }
            }
        })
        .await;
    }

    fn stop(&mut self) {
        if let Some(mut c) = self.child.take() {
            let _ = c.kill();
            let _ = c.wait();
        }
    }
}

impl Drop for OwnRedis {
    fn drop(&mut self) {
        self.stop();
    }
}

fn free_port() -> u16 {
    std::net::TcpListener::bind("127.0.0.1:0")
        .unwrap()
        .local_addr()
        .unwrap()
        .port()
}

async fn readiness(s: &Server) -> serde_json::Value {
    let r = s.client.get(s.url("/readyz")).send().await.unwrap();
    assert_eq!(r.status(), 200);
    r.json().await.unwrap()
}

#[tokio::test]
async fn when_redis_goes_away_replies_go_on_degraded_and_recover_by_themselves() {
    let port = free_port();
    let mut redis = OwnRedis::start_on(port, tempdir::Dir::new("redis"));
    redis.wait_ready().await;
    let store = Arc::new(RedisStore::new(&redis.url(), "tidings:").unwrap());
    let engine = engine_with(store, test_settings());
    let s = Server::start(engine).await;

    let (status, body, _) = post_message(&s, "reader-r", "who won the men's 400 m?", None).await;
    assert_eq!(status, 200);
    assert_eq!(body["degraded"], false);
    assert_eq!(readiness(&s).await["status"], "ready");

    redis.stop();
    // Each message is still answered, on its own, marked degraded.
    let (status, body, _) = post_message(&s, "reader-r", "who won the women's 400 m?", None).await;
    assert_eq!(status, 200, "{body}");
    assert_eq!(body["degraded"], true);
    assert!(body["text"]
        .as_str()
        .unwrap()
        .contains("Rasaline Rentenert"));
    let (status, body, _) = post_message(&s, "reader-r", "and silver?", Some("x-1")).await;
    assert_eq!(status, 200);
    assert_eq!(body["degraded"], true);
    assert_eq!(
        body["outcome"], "clarify",
        "no context without the store: {body}"
    );
    let ready = readiness(&s).await;
    assert_eq!(ready["status"], "degraded", "{ready}");
    assert_eq!(ready["sessions"]["store"], "redis");
    // Erasure cannot be done now, and says so instead of claiming success.
    let r = s
        .client
        .delete(s.url("/v1/users/chat/reader-r"))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 503);

    // Redis comes back on the same port: the service picks up by itself.
    let dir = std::mem::replace(&mut redis.dir, tempdir::Dir::new("unused"));
    let redis = OwnRedis::start_on(port, dir);
    redis.wait_ready().await;
    wait_until("readiness to recover", Duration::from_secs(15), || async {
        readiness(&s).await["status"] == "ready"
    })
    .await;
    let (_, body, _) = post_message(&s, "reader-r", "who won the men's 400 m?", None).await;
    assert_eq!(body["degraded"], false, "{body}");
    let (_, body, _) = post_message(&s, "reader-r", "and silver?", None).await;
    assert!(
        body["text"].as_str().unwrap().contains("Nulan Bendand"),
        "{body}"
    );
}
