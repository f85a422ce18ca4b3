//! The session store contract (`src/dialogue/store.rs`), one suite run
//! against every store: each check below becomes one test per backend,
//! `memory_store::<check>` and `redis_store::<check>`.
//!
//! The Redis tests need a server at `TIDINGS_TEST_REDIS_URL`;
//! `bash tests/run.sh` starts a private one. Without it they fail rather
//! than skip, so a run that never touched Redis cannot pass for one that
//! did. Every test uses its own random key prefix, so tests run in
//! parallel (and against a shared server) without seeing each other.

mod common;

use std::collections::BTreeSet;
use std::sync::Arc;
use std::time::{Duration, Instant};

use tidings::dialogue::{
    KeepReply, Loaded, MemoryStore, RedisStore, Saved, Session, SessionStore, StoreError,
};

const TTL: Duration = Duration::from_secs(60);
const REPLY_TTL: Duration = Duration::from_secs(60);

/// A random hex string, for prefixes and reader keys.
fn random_hex() -> String {
    format!("{:016x}", rand::random::<u64>())
}

/// A reader key as the engine makes them: `channel:hex`.
fn new_reader() -> String {
    format!("chat:{}{}", random_hex(), random_hex())
}

fn session(turn: u64) -> Session {
    let mut s = Session::new("chat", 1_800_000_000);
    s.turn = turn;
    s
}

fn keep<'a>(message: &'a str, reply: &'a str) -> Option<KeepReply<'a>> {
    Some(KeepReply {
        message,
        reply,
        ttl: REPLY_TTL,
    })
}

/// Polls `load` every 20 ms until `done` holds or 3 s pass, and returns
/// the last load: expiry is checked without a fixed long sleep.
async fn load_until(
    store: &dyn SessionStore,
    reader: &str,
    message: Option<&str>,
    done: impl Fn(&Loaded) -> bool,
) -> Loaded {
    let deadline = Instant::now() + Duration::from_secs(3);
    loop {
        let loaded = store.load(reader, message).await.unwrap();
        if done(&loaded) || Instant::now() >= deadline {
            return loaded;
        }
        tokio::time::sleep(Duration::from_millis(20)).await;
    }
}

// ---------------------------------------------------------------------------
// The contract, for any store.
// ---------------------------------------------------------------------------

async fn an_unknown_reader_loads_as_nothing_at_version_zero(store: Arc<dyn SessionStore>) {
    let reader = new_reader();
    assert_eq!(store.load(&reader, None).await.unwrap(), Loaded::default());
    assert_eq!(
        store.load(&reader, Some("m1")).await.unwrap(),
        Loaded::default()
    );
}

/// The version a reader's session is at now.
async fn version_of(store: &dyn SessionStore, reader: &str) -> u64 {
    store.load(reader, None).await.unwrap().version
}

async fn a_first_save_at_version_zero_is_stored_and_read_back_at_a_new_version(
    store: Arc<dyn SessionStore>,
) {
    let reader = new_reader();
    let s = session(1);
    assert_eq!(
        store.save(&reader, &s, 0, TTL, None).await.unwrap(),
        Saved::Stored
    );
    let loaded = store.load(&reader, None).await.unwrap();
    assert_eq!(loaded.session, Some(s));
    assert_ne!(loaded.version, 0);
    assert_eq!(loaded.earlier_reply, None);
    // Each save moves the version on by one.
    let v = loaded.version;
    store
        .save(&reader, &session(2), v, TTL, None)
        .await
        .unwrap();
    assert_eq!(version_of(store.as_ref(), &reader).await, v + 1);
}

async fn a_new_session_after_erasure_never_reuses_an_old_version(store: Arc<dyn SessionStore>) {
    let reader = new_reader();
    store
        .save(&reader, &session(1), 0, TTL, None)
        .await
        .unwrap();
    let old = version_of(store.as_ref(), &reader).await;
    store.erase(&reader).await.unwrap();
    // Another message starts a new session...
    store
        .save(&reader, &session(7), 0, TTL, None)
        .await
        .unwrap();
    let new = version_of(store.as_ref(), &reader).await;
    assert_ne!(new, old, "a version came back after erasure");
    // ...and a turn that loaded the erased session cannot write it back.
    assert_eq!(
        store
            .save(&reader, &session(2), old, TTL, None)
            .await
            .unwrap(),
        Saved::Conflict
    );
    assert_eq!(
        store.load(&reader, None).await.unwrap().session,
        Some(session(7))
    );
}

async fn a_save_with_a_stale_version_conflicts_and_changes_nothing(store: Arc<dyn SessionStore>) {
    let reader = new_reader();
    assert_eq!(
        store
            .save(&reader, &session(1), 0, TTL, None)
            .await
            .unwrap(),
        Saved::Stored
    );
    let v1 = version_of(store.as_ref(), &reader).await;
    assert_eq!(
        store
            .save(&reader, &session(2), v1, TTL, None)
            .await
            .unwrap(),
        Saved::Stored
    );
    for stale in [0, v1, v1 + 2] {
        assert_eq!(
            store
                .save(&reader, &session(99), stale, TTL, keep("m1", "lost"))
                .await
                .unwrap(),
            Saved::Conflict,
            "expected version {stale}"
        );
    }
    let loaded = store.load(&reader, Some("m1")).await.unwrap();
    assert_eq!(loaded.session, Some(session(2)));
    assert_eq!(loaded.version, v1 + 1);
    // A conflicting save keeps no reply either: all or nothing.
    assert_eq!(loaded.earlier_reply, None);
    // A version ahead of an unknown reader's conflicts as well.
    let other = new_reader();
    assert_eq!(
        store.save(&other, &session(1), 1, TTL, None).await.unwrap(),
        Saved::Conflict
    );
    assert_eq!(store.load(&other, None).await.unwrap(), Loaded::default());
}

async fn a_kept_reply_is_loaded_for_its_message_only(store: Arc<dyn SessionStore>) {
    let reader = new_reader();
    assert_eq!(
        store
            .save(&reader, &session(1), 0, TTL, keep("m1", "first reply"))
            .await
            .unwrap(),
        Saved::Stored
    );
    let loaded = store.load(&reader, Some("m1")).await.unwrap();
    assert_eq!(loaded.earlier_reply.as_deref(), Some("first reply"));
    assert_eq!(loaded.session, Some(session(1)));
    assert_ne!(loaded.version, 0);
    assert_eq!(
        store.load(&reader, Some("m2")).await.unwrap().earlier_reply,
        None
    );
    assert_eq!(store.load(&reader, None).await.unwrap().earlier_reply, None);
    // Another reader's message with the same id is another message.
    let other = new_reader();
    assert_eq!(
        store.load(&other, Some("m1")).await.unwrap(),
        Loaded::default()
    );
}

async fn a_message_answered_already_gets_its_first_reply_and_changes_nothing(
    store: Arc<dyn SessionStore>,
) {
    let reader = new_reader();
    assert_eq!(
        store
            .save(&reader, &session(1), 0, TTL, keep("m1", "first reply"))
            .await
            .unwrap(),
        Saved::Stored
    );
    // The retry carries the current version, so only the reply check
    // stops it.
    let v1 = version_of(store.as_ref(), &reader).await;
    assert_eq!(
        store
            .save(&reader, &session(2), v1, TTL, keep("m1", "second reply"))
            .await
            .unwrap(),
        Saved::Answered("first reply".to_string())
    );
    let loaded = store.load(&reader, Some("m1")).await.unwrap();
    assert_eq!(loaded.session, Some(session(1)));
    assert_eq!(loaded.version, v1);
    assert_eq!(loaded.earlier_reply.as_deref(), Some("first reply"));
    // Another message still goes through.
    assert_eq!(
        store
            .save(&reader, &session(2), v1, TTL, keep("m2", "another"))
            .await
            .unwrap(),
        Saved::Stored
    );
    assert_eq!(store.load(&reader, None).await.unwrap().version, v1 + 1);
}

async fn sessions_and_replies_expire_after_their_ttl(store: Arc<dyn SessionStore>) {
    let reader = new_reader();
    let short = Duration::from_millis(50);
    let reply = Some(KeepReply {
        message: "m1",
        reply: "soon gone",
        ttl: short,
    });
    assert_eq!(
        store
            .save(&reader, &session(1), 0, short, reply)
            .await
            .unwrap(),
        Saved::Stored
    );
    let loaded = load_until(&*store, &reader, Some("m1"), |l| {
        l.session.is_none() && l.earlier_reply.is_none()
    })
    .await;
    assert_eq!(loaded, Loaded::default(), "still there after 3 s");
    // Expired means gone: a new conversation starts at version zero.
    assert_eq!(
        store
            .save(&reader, &session(1), 0, TTL, None)
            .await
            .unwrap(),
        Saved::Stored
    );
}

async fn erase_removes_a_readers_session_and_replies_and_nobody_elses(
    store: Arc<dyn SessionStore>,
) {
    let reader = new_reader();
    let other = new_reader();
    for r in [&reader, &other] {
        assert_eq!(
            store
                .save(r, &session(1), 0, TTL, keep("m1", "kept"))
                .await
                .unwrap(),
            Saved::Stored
        );
    }
    assert_eq!(store.erase(&reader).await.unwrap(), 2);
    assert_eq!(
        store.load(&reader, Some("m1")).await.unwrap(),
        Loaded::default()
    );
    let untouched = store.load(&other, Some("m1")).await.unwrap();
    assert_eq!(untouched.session, Some(session(1)));
    assert_ne!(untouched.version, 0);
    assert_eq!(untouched.earlier_reply.as_deref(), Some("kept"));
    // Nothing left to remove.
    assert_eq!(store.erase(&reader).await.unwrap(), 0);
    // The reply is gone too: the same message id is answered afresh.
    assert_eq!(
        store
            .save(&reader, &session(1), 0, TTL, keep("m1", "new"))
            .await
            .unwrap(),
        Saved::Stored
    );
}

async fn concurrent_updates_of_one_reader_are_never_lost(store: Arc<dyn SessionStore>) {
    const TASKS: u64 = 20;
    let reader = Arc::new(new_reader());
    let tasks: Vec<_> = (0..TASKS)
        .map(|_| {
            let store = Arc::clone(&store);
            let reader = Arc::clone(&reader);
            tokio::spawn(async move {
                let mut conflicts = 0u32;
                loop {
                    let loaded = store.load(&reader, None).await.unwrap();
                    let mut s = loaded.session.unwrap_or_else(|| session(0));
                    s.turn += 1;
                    // Let the others load the same version meanwhile.
                    tokio::task::yield_now().await;
                    match store
                        .save(&reader, &s, loaded.version, TTL, None)
                        .await
                        .unwrap()
                    {
                        Saved::Stored => return conflicts,
                        Saved::Conflict => conflicts += 1,
                        Saved::Answered(r) => panic!("no reply was kept, got {r:?}"),
                    }
                    assert!(conflicts < 10_000, "no progress after 10000 conflicts");
                }
            })
        })
        .collect();
    for task in tasks {
        task.await.expect("a task panicked");
    }
    let loaded = store.load(&reader, None).await.unwrap();
    assert_eq!(loaded.session.map(|s| s.turn), Some(TASKS));
}

async fn unanswered_questions_are_counted_grouped_and_capped(store: Arc<dyn SessionStore>) {
    use tidings::dialogue::store::UNANSWERED_CAP;
    let ns = new_reader();
    for r in 0..3 {
        store
            .note_unanswered(&format!("{ns}{r}"), "what is the weather", "not_understood")
            .await
            .unwrap();
    }
    store
        .note_unanswered(&format!("{ns}0"), "who won", "abandoned")
        .await
        .unwrap();
    store
        .note_unanswered(&format!("{ns}0"), "what is the weather", "abandoned")
        .await
        .unwrap();
    let top = store.unanswered(2).await.unwrap();
    assert_eq!(top.len(), 2);
    assert_eq!(
        (top[0].text.as_str(), top[0].kind.as_str(), top[0].count),
        ("what is the weather", "not_understood", 3)
    );
    assert_eq!(top[1].count, 1);
    // Capped: the least asked go first; the most asked stay.
    for i in 0..UNANSWERED_CAP + 5 {
        store
            .note_unanswered(
                &format!("{ns}filler-{i}"),
                &format!("filler {i}"),
                "not_understood",
            )
            .await
            .unwrap();
    }
    let all = store.unanswered(UNANSWERED_CAP * 2).await.unwrap();
    assert_eq!(all.len(), UNANSWERED_CAP);
    assert_eq!(all[0].text, "what is the weather");
    assert_eq!(all[0].count, 3);
    // A new question on a full list is kept and can climb.
    for r in 0..5 {
        store
            .note_unanswered(&format!("{ns}new-{r}"), "a brand new question", "abandoned")
            .await
            .unwrap();
    }
    let top = store.unanswered(1).await.unwrap();
    assert_eq!(
        (top[0].text.as_str(), top[0].count),
        ("a brand new question", 5)
    );
}

async fn one_reader_counts_once_per_question_and_for_a_share_only(store: Arc<dyn SessionStore>) {
    use tidings::dialogue::store::UNANSWERED_PER_READER;
    let reader = new_reader();
    for _ in 0..5 {
        store
            .note_unanswered(&reader, "the same garbage", "not_understood")
            .await
            .unwrap();
    }
    for i in 0..UNANSWERED_PER_READER * 3 {
        store
            .note_unanswered(&reader, &format!("garbage {i}"), "not_understood")
            .await
            .unwrap();
    }
    let all = store.unanswered(10_000).await.unwrap();
    let same = all.iter().find(|u| u.text == "the same garbage").unwrap();
    assert_eq!(
        same.count, 1,
        "one reader asking again is not a second reader"
    );
    let theirs = all
        .iter()
        .filter(|u| u.text == "the same garbage" || u.text.starts_with("garbage "))
        .count();
    assert_eq!(theirs, UNANSWERED_PER_READER);
}

async fn erasing_a_reader_takes_their_questions_off_the_unanswered_list(
    store: Arc<dyn SessionStore>,
) {
    let (a, b) = (new_reader(), new_reader());
    let only_a = format!("only asked by {a}");
    store
        .note_unanswered(&a, &only_a, "not_understood")
        .await
        .unwrap();
    store
        .note_unanswered(&a, "asked by both", "not_understood")
        .await
        .unwrap();
    store
        .note_unanswered(&b, "asked by both", "not_understood")
        .await
        .unwrap();
    store.erase(&a).await.unwrap();
    let all = store.unanswered(10_000).await.unwrap();
    assert!(all.iter().all(|u| u.text != only_a), "{all:?}");
    let both = all.iter().find(|u| u.text == "asked by both").unwrap();
    assert!(both.count >= 1);
    // Erasing again changes nothing more.
    store.erase(&a).await.unwrap();
    let again = store.unanswered(10_000).await.unwrap();
    assert_eq!(
        again
            .iter()
            .find(|u| u.text == "asked by both")
            .map(|u| u.count),
        Some(both.count)
    );
}

/// One test per backend for each check: `memory_store::<check>` and
/// `redis_store::<check>`. Multi-threaded, so the concurrency check runs
/// really concurrently.
macro_rules! contract {
    ($($check:ident),* $(,)?) => {
        mod memory_store {
            $(
                #[tokio::test(flavor = "multi_thread", worker_threads = 4)]
                async fn $check() {
                    super::$check(std::sync::Arc::new(super::MemoryStore::new())).await;
                }
            )*
        }
        mod redis_store {
            $(
                #[tokio::test(flavor = "multi_thread", worker_threads = 4)]
                async fn $check() {
                    super::$check(std::sync::Arc::new(super::redis_store().await)).await;
                }
            )*
        }
    };
}

contract!(
    an_unknown_reader_loads_as_nothing_at_version_zero,
    a_first_save_at_version_zero_is_stored_and_read_back_at_a_new_version,
    a_new_session_after_erasure_never_reuses_an_old_version,
    a_save_with_a_stale_version_conflicts_and_changes_nothing,
    a_kept_reply_is_loaded_for_its_message_only,
    a_message_answered_already_gets_its_first_reply_and_changes_nothing,
    sessions_and_replies_expire_after_their_ttl,
    erase_removes_a_readers_session_and_replies_and_nobody_elses,
    concurrent_updates_of_one_reader_are_never_lost,
    unanswered_questions_are_counted_grouped_and_capped,
    one_reader_counts_once_per_question_and_for_a_share_only,
    erasing_a_reader_takes_their_questions_off_the_unanswered_list,
);

// ---------------------------------------------------------------------------
// Redis only: what the server holds, and Redis down.
// ---------------------------------------------------------------------------

const HOW: &str = "run the tests with `bash tests/run.sh`, which starts a private redis-server \
                   and sets TIDINGS_TEST_REDIS_URL";

/// The test server's URL; fails the test when none is configured.
fn redis_url() -> String {
    match std::env::var("TIDINGS_TEST_REDIS_URL") {
        Ok(url) if !url.trim().is_empty() => url,
        _ => panic!("TIDINGS_TEST_REDIS_URL is not set: {HOW}"),
    }
}

/// A store on the test server under a prefix of its own; fails the test
/// when the server does not answer.
async fn redis_store() -> RedisStore {
    let url = redis_url();
    let prefix = format!("tidings-test:{}:", random_hex());
    let store = RedisStore::new(&url, &prefix)
        .unwrap_or_else(|e| panic!("TIDINGS_TEST_REDIS_URL is not usable ({e}): {HOW}"));
    if let Err(e) = store.ping().await {
        panic!("no redis at TIDINGS_TEST_REDIS_URL ({e}): {HOW}");
    }
    store
}

/// A plain connection to the test server, to look at what the store wrote.
async fn inspector() -> redis::aio::MultiplexedConnection {
    let client = redis::Client::open(redis_url()).expect("the url parsed for the store");
    client
        .get_multiplexed_async_connection()
        .await
        .unwrap_or_else(|e| panic!("no redis at TIDINGS_TEST_REDIS_URL ({e}): {HOW}"))
}

/// Every key matching `pattern`.
async fn scan(pattern: &str) -> BTreeSet<String> {
    common::keys_matching(pattern).await.into_iter().collect()
}

async fn pttl(con: &mut redis::aio::MultiplexedConnection, key: &str) -> i64 {
    redis::cmd("PTTL").arg(key).query_async(con).await.unwrap()
}

/// Asserts that `key` expires in (`ttl` - 1 s, `ttl`].
async fn assert_ttl(con: &mut redis::aio::MultiplexedConnection, key: &str, ttl: Duration) {
    let ttl = i64::try_from(ttl.as_millis()).unwrap();
    let left = pttl(con, key).await;
    assert!(
        left > ttl - 5000 && left <= ttl,
        "{key}: PTTL {left} ms, expected in ({} ms, {ttl} ms]",
        ttl - 5000
    );
}

#[tokio::test]
async fn redis_keys_live_under_the_prefix_with_the_reader_as_hash_tag() {
    let store = redis_store().await;
    let mut con = inspector().await;
    let reader = new_reader();
    let p = store.prefix().to_string();
    assert_eq!(
        store
            .save(&reader, &session(1), 0, TTL, keep("m1", "kept"))
            .await
            .unwrap(),
        Saved::Stored
    );
    let expected: BTreeSet<String> = [
        format!("{p}{{{reader}}}:s"),
        format!("{p}{{{reader}}}:m:m1"),
        format!("{p}{{{reader}}}:mi"),
    ]
    .into();
    assert_eq!(scan(&format!("{p}*")).await, expected);

    let session_key = format!("{p}{{{reader}}}:s");
    let (version, json): (String, String) = redis::cmd("HMGET")
        .arg(&session_key)
        .arg("v")
        .arg("s")
        .query_async(&mut con)
        .await
        .unwrap();
    assert_eq!(
        version,
        store.load(&reader, None).await.unwrap().version.to_string()
    );
    assert_eq!(serde_json::from_str::<Session>(&json).unwrap(), session(1));
    let reply: String = redis::cmd("GET")
        .arg(format!("{p}{{{reader}}}:m:m1"))
        .query_async(&mut con)
        .await
        .unwrap();
    assert_eq!(reply, "kept");
    let index: BTreeSet<String> = redis::cmd("ZRANGE")
        .arg(format!("{p}{{{reader}}}:mi"))
        .arg(0)
        .arg(-1)
        .query_async(&mut con)
        .await
        .unwrap();
    assert_eq!(index, [format!("{p}{{{reader}}}:m:m1")].into());
}

#[tokio::test]
async fn redis_expires_the_session_after_its_ttl_and_replies_after_theirs() {
    let store = redis_store().await;
    let mut con = inspector().await;
    let reader = new_reader();
    let p = store.prefix().to_string();
    let ttl = Duration::from_millis(1_800_000);
    let reply_ttl = Duration::from_secs(24 * 3600);
    let reply = Some(KeepReply {
        message: "m1",
        reply: "kept",
        ttl: reply_ttl,
    });
    assert_eq!(
        store
            .save(&reader, &session(1), 0, ttl, reply)
            .await
            .unwrap(),
        Saved::Stored
    );
    assert_ttl(&mut con, &format!("{p}{{{reader}}}:s"), ttl).await;
    assert_ttl(&mut con, &format!("{p}{{{reader}}}:m:m1"), reply_ttl).await;
    assert_ttl(&mut con, &format!("{p}{{{reader}}}:mi"), reply_ttl).await;

    // The next save renews the session's TTL; a shorter-lived reply does
    // not shorten the index, which must outlive every reply it lists.
    let short = Some(KeepReply {
        message: "m2",
        reply: "kept",
        ttl: Duration::from_secs(60),
    });
    let v = store.load(&reader, None).await.unwrap().version;
    assert_eq!(
        store
            .save(&reader, &session(2), v, ttl, short)
            .await
            .unwrap(),
        Saved::Stored
    );
    assert_ttl(&mut con, &format!("{p}{{{reader}}}:s"), ttl).await;
    assert_ttl(&mut con, &format!("{p}{{{reader}}}:mi"), reply_ttl).await;
    store.erase(&reader).await.unwrap();
}

#[tokio::test]
async fn redis_erase_leaves_no_key_of_the_reader() {
    let store = redis_store().await;
    let reader = new_reader();
    let other = new_reader();
    let p = store.prefix().to_string();
    for r in [&reader, &other] {
        store
            .save(r, &session(1), 0, TTL, keep("m1", "kept"))
            .await
            .unwrap();
        let v = store.load(r, None).await.unwrap().version;
        store
            .save(r, &session(2), v, TTL, keep("m2", "kept"))
            .await
            .unwrap();
    }
    assert_eq!(store.erase(&reader).await.unwrap(), 3);
    assert_eq!(scan(&format!("{p}{{{reader}}}*")).await, BTreeSet::new());
    // The other reader keeps session, two replies and the index.
    assert_eq!(scan(&format!("{p}*")).await.len(), 4);
    store.erase(&other).await.unwrap();
    assert_eq!(scan(&format!("{p}*")).await, BTreeSet::new());
}

/// Replies kept by an earlier release are listed in a plain set (`:ms`)
/// rather than the sorted index: an erasure must still find them, or a
/// reader erased right after an upgrade would keep their replies.
#[tokio::test]
async fn redis_erase_also_removes_replies_listed_in_the_earlier_plain_set() {
    let store = redis_store().await;
    let mut con = inspector().await;
    let reader = new_reader();
    let p = store.prefix().to_string();
    store
        .save(&reader, &session(1), 0, TTL, keep("m-new", "kept"))
        .await
        .unwrap();
    // What the earlier release left: a reply and its name in the set.
    let old_reply = format!("{p}{{{reader}}}:m:m-old");
    let _: () = redis::cmd("SET")
        .arg(&old_reply)
        .arg("kept before the upgrade")
        .arg("EX")
        .arg(60)
        .query_async(&mut con)
        .await
        .unwrap();
    let _: () = redis::cmd("SADD")
        .arg(format!("{p}{{{reader}}}:ms"))
        .arg(&old_reply)
        .query_async(&mut con)
        .await
        .unwrap();
    // The session and both replies.
    assert_eq!(store.erase(&reader).await.unwrap(), 3);
    assert_eq!(scan(&format!("{p}{{{reader}}}*")).await, BTreeSet::new());
}

#[tokio::test]
async fn redis_drops_expired_replies_from_a_growing_index() {
    let store = redis_store().await;
    let mut con = inspector().await;
    let reader = new_reader();
    let p = store.prefix().to_string();
    // A long-lived reply keeps the index alive while short-lived ones come
    // and go, as for a reader who writes more often than replies expire.
    assert_eq!(
        store
            .save(&reader, &session(1), 0, TTL, keep("first", "kept"))
            .await
            .unwrap(),
        Saved::Stored
    );
    let short = Duration::from_millis(50);
    let messages: Vec<String> = (0..40).map(|i| format!("m{i}")).collect();
    let v0 = store.load(&reader, None).await.unwrap().version;
    for (i, m) in messages.iter().enumerate() {
        let reply = Some(KeepReply {
            message: m,
            reply: "soon gone",
            ttl: short,
        });
        assert_eq!(
            store
                .save(&reader, &session(1), v0 + i as u64, TTL, reply)
                .await
                .unwrap(),
            Saved::Stored
        );
    }
    let last = messages.last().unwrap();
    let gone = load_until(&store, &reader, Some(last), |l| l.earlier_reply.is_none()).await;
    assert_eq!(gone.earlier_reply, None, "still there after 3 s");
    assert_eq!(
        store
            .save(
                &reader,
                &session(2),
                gone.version,
                TTL,
                keep("last", "kept")
            )
            .await
            .unwrap(),
        Saved::Stored
    );
    let index: BTreeSet<String> = redis::cmd("ZRANGE")
        .arg(format!("{p}{{{reader}}}:mi"))
        .arg(0)
        .arg(-1)
        .query_async(&mut con)
        .await
        .unwrap();
    let expected: BTreeSet<String> = [
        format!("{p}{{{reader}}}:m:first"),
        format!("{p}{{{reader}}}:m:last"),
    ]
    .into();
    assert_eq!(index, expected);
    assert_eq!(store.erase(&reader).await.unwrap(), 3);
}

#[tokio::test]
async fn redis_reads_an_unreadable_session_as_absent_and_the_next_save_repairs_it() {
    let store = redis_store().await;
    let mut con = inspector().await;
    let reader = new_reader();
    let key = format!("{}{{{reader}}}:s", store.prefix());
    let _: i64 = redis::cmd("HSET")
        .arg(&key)
        .arg("v")
        .arg(4)
        .arg("s")
        .arg("{not json")
        .query_async(&mut con)
        .await
        .unwrap();
    let _: i64 = redis::cmd("PEXPIRE")
        .arg(&key)
        .arg(60_000)
        .query_async(&mut con)
        .await
        .unwrap();
    let loaded = store.load(&reader, None).await.unwrap();
    assert_eq!(loaded.session, None);
    assert_eq!(loaded.version, 4);
    assert_eq!(
        store
            .save(&reader, &session(1), 4, TTL, None)
            .await
            .unwrap(),
        Saved::Stored
    );
    let loaded = store.load(&reader, None).await.unwrap();
    assert_eq!(loaded.session, Some(session(1)));
    assert_eq!(loaded.version, 5);
}

#[tokio::test]
async fn redis_down_makes_every_call_unavailable_within_three_seconds() {
    // A port that was just free: nothing listens there.
    let port = {
        let listener = std::net::TcpListener::bind("127.0.0.1:0").unwrap();
        listener.local_addr().unwrap().port()
    };
    let store = RedisStore::new(&format!("redis://127.0.0.1:{port}/"), "tidings-test:down:")
        .expect("a store is made while redis is down");
    let within = |started: Instant, call: &str| {
        assert!(
            started.elapsed() < Duration::from_secs(3),
            "{call} took {:?}",
            started.elapsed()
        );
    };
    let reader = new_reader();

    let started = Instant::now();
    let load = store.load(&reader, Some("m1")).await;
    within(started, "load");
    assert!(matches!(load, Err(StoreError::Unavailable(_))), "{load:?}");

    let started = Instant::now();
    let save = store
        .save(&reader, &session(1), 0, TTL, keep("m1", "r"))
        .await;
    within(started, "save");
    assert!(matches!(save, Err(StoreError::Unavailable(_))), "{save:?}");

    let started = Instant::now();
    let erase = store.erase(&reader).await;
    within(started, "erase");
    assert!(
        matches!(erase, Err(StoreError::Unavailable(_))),
        "{erase:?}"
    );

    let started = Instant::now();
    let ping = store.ping().await;
    within(started, "ping");
    match ping {
        Err(StoreError::Unavailable(m)) => assert!(m.contains("redis"), "{m}"),
        other => panic!("expected Unavailable, got {other:?}"),
    }
}

#[tokio::test]
async fn redis_hung_makes_every_call_unavailable_within_three_seconds() {
    // A server that accepts connections and never answers.
    let listener = tokio::net::TcpListener::bind("127.0.0.1:0").await.unwrap();
    let port = listener.local_addr().unwrap().port();
    let _server = tokio::spawn(async move {
        let mut held = Vec::new();
        while let Ok((socket, _)) = listener.accept().await {
            held.push(socket);
        }
    });
    let store = RedisStore::new(&format!("redis://127.0.0.1:{port}/"), "tidings-test:hung:")
        .expect("a store is made while redis hangs");
    let reader = new_reader();

    let started = Instant::now();
    let load = store.load(&reader, None).await;
    assert!(
        started.elapsed() < Duration::from_secs(3),
        "load took {:?}",
        started.elapsed()
    );
    assert!(matches!(load, Err(StoreError::Unavailable(_))), "{load:?}");

    let started = Instant::now();
    let save = store.save(&reader, &session(1), 0, TTL, None).await;
    assert!(
        started.elapsed() < Duration::from_secs(3),
        "save took {:?}",
        started.elapsed()
    );
    assert!(matches!(save, Err(StoreError::Unavailable(_))), "{save:?}");

    let started = Instant::now();
    let ping = store.ping().await;
    assert!(
        started.elapsed() < Duration::from_secs(3),
        "ping took {:?}",
        started.elapsed()
    );
    assert!(matches!(ping, Err(StoreError::Unavailable(_))), "{ping:?}");
}

/// A private redis-server on `port`, stopped when dropped.
struct PrivateRedis(std::process::Child);

impl PrivateRedis {
    fn start(port: u16) -> PrivateRedis {
        // `tests/run.sh` says which binary; otherwise the one on the PATH.
        let bin = std::env::var("TIDINGS_REDIS_SERVER_BIN")
            .unwrap_or_else(|_| "redis-server".to_string());
        let child = std::process::Command::new(&bin)
            .args(["--port", &port.to_string(), "--bind", "127.0.0.1"])
            .args(["--save", "", "--appendonly", "no"])
            .stdout(std::process::Stdio::null())
            .spawn()
            .unwrap_or_else(|e| panic!("cannot start {bin} ({e}): {HOW}"));
        PrivateRedis(child)
    }
}

impl Drop for PrivateRedis {
    fn drop(&mut self) {
        let _ = self.0.kill();
        let _ = self.0.wait();
    }
}

/// Calls `ping` every 20 ms until it succeeds or 5 s pass.
async fn wait_for_ping(store: &RedisStore) -> Result<(), StoreError> {
    let deadline = Instant::now() + Duration::from_secs(5);
    loop {
        let result = store.ping().await;
        if result.is_ok() || Instant::now() >= deadline {
            return result;
        }
        tokio::time::sleep(Duration::from_millis(20)).await;
    }
}

#[tokio::test]
async fn redis_store_reconnects_by_itself_after_the_server_restarts() {
    let port = {
        let listener = std::net::TcpListener::bind("127.0.0.1:0").unwrap();
        listener.local_addr().unwrap().port()
    };
    let store = RedisStore::new(
        &format!("redis://127.0.0.1:{port}/"),
        "tidings-test:restart:",
    )
    .expect("a store is made before redis starts");
    let reader = new_reader();
    // Down before the first call: unavailable, and the next call retries.
    assert!(matches!(
        store.load(&reader, None).await,
        Err(StoreError::Unavailable(_))
    ));

    let server = PrivateRedis::start(port);
    wait_for_ping(&store).await.expect("redis-server started");
    assert_eq!(
        store
            .save(&reader, &session(1), 0, TTL, None)
            .await
            .unwrap(),
        Saved::Stored
    );

    drop(server);
    assert!(matches!(
        store.load(&reader, None).await,
        Err(StoreError::Unavailable(_))
    ));

    let _server = PrivateRedis::start(port);
    wait_for_ping(&store)
        .await
        .expect("the store reconnected to the restarted server");
    // The restarted server kept nothing and knows no script: the save
    // script is sent again (EVALSHA falls back to EVAL).
    assert_eq!(store.load(&reader, None).await.unwrap(), Loaded::default());
    assert_eq!(
        store
            .save(&reader, &session(1), 0, TTL, None)
            .await
            .unwrap(),
        Saved::Stored
    );
    assert_eq!(store.erase(&reader).await.unwrap(), 1);
}
