//! Rolling upgrades: a release may change the shape of the conversation
//! state in Redis while replicas of the old and the new release serve side
//! by side. A session written by another release (another `schema`
//! number, whatever its shape) is not used: the reader's next message is
//! answered as a fresh question, never refused, never degraded, and the
//! next save writes this release's shape (docs/deploy.md, "Upgrading").

mod common;

use common::{keys_under, redis_conn, redis_engine, test_prefix};
use redis::AsyncCommands;
use tidings::dialogue::session::SCHEMA;
use tidings::dialogue::Outcome;

/// The reader's session key under `prefix` (one reader per prefix).
async fn session_key(prefix: &str) -> String {
    let keys = keys_under(prefix).await;
    keys.into_iter()
        .find(|k| k.ends_with(":s"))
        .expect("the reader has a session")
}

/// The session as stored: a hash of its version (`v`) and its JSON (`s`).
async fn stored(key: &str) -> serde_json::Value {
    let mut conn = redis_conn().await;
    let json: String = conn.hget(key, "s").await.unwrap();
    serde_json::from_str(&json).unwrap()
}

/// Replaces the session's JSON, keeping its version, as another release
/// writing it would.
async fn put(key: &str, v: &serde_json::Value) {
    let mut conn = redis_conn().await;
    let _: () = conn.hset(key, "s", v.to_string()).await.unwrap();
}

#[tokio::test]
async fn a_session_of_another_shape_is_dropped_and_rewritten() {
    let prefix = test_prefix("upgrade-shape");
    let (engine, _) = redis_engine(&prefix);
    let first = engine
        .handle("reader-a", "chat", "who won the men's 400 m?")
        .await
        .unwrap();
    assert_eq!(first.reply.outcome, Outcome::Answered);
    let key = session_key(&prefix).await;
    // What an older release might have written: its own schema number and
    // fields this release reads differently.
    put(
        &key,
        &serde_json::json!({"schema": SCHEMA - 1, "turn": "one", "channel": 7, "context": []}),
    )
    .await;
    let next = engine
        .handle("reader-a", "chat", "who won the women's 400 m?")
        .await
        .expect("a session of another shape is not an error");
    assert!(
        !next.degraded,
        "the store was reachable: {:?}",
        next.reply.text
    );
    assert_eq!(next.reply.outcome, Outcome::Answered, "{}", next.reply.text);
    // The follow-up context is gone with the old session: "and silver?"
    // now follows the question just answered.
    let silver = engine
        .handle("reader-a", "chat", "and silver?")
        .await
        .unwrap();
    assert!(
        silver.reply.text.contains("women's 400 m"),
        "{}",
        silver.reply.text
    );
    let now = stored(&key).await;
    assert_eq!(now["schema"], SCHEMA, "{now}");
    assert!(now["turn"].is_u64(), "{now}");
}

#[tokio::test]
async fn a_session_of_another_schema_starts_afresh_even_when_it_parses() {
    let prefix = test_prefix("upgrade-number");
    let (engine, _) = redis_engine(&prefix);
    engine
        .handle("reader-b", "chat", "who won the men's 400 m?")
        .await
        .unwrap();
    let key = session_key(&prefix).await;
    // A newer release (a replica already upgraded) wrote the same fields
    // under its own number: what they mean there is not known here, so the
    // context is not used, and the follow-up is asked about, not guessed.
    let mut newer = stored(&key).await;
    newer["schema"] = serde_json::json!(SCHEMA + 1);
    put(&key, &newer).await;
    let silver = engine
        .handle("reader-b", "chat", "and silver?")
        .await
        .expect("a session of another schema is not an error");
    assert!(!silver.degraded);
    assert_eq!(
        silver.reply.outcome,
        Outcome::Clarify,
        "{}",
        silver.reply.text
    );
    assert!(
        !silver.reply.text.contains("Nulan Bendand"),
        "no context was used: {}",
        silver.reply.text
    );
    assert_eq!(stored(&key).await["schema"], SCHEMA);
}
