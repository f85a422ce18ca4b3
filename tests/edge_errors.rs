//! The small faults at the edge: every error body in the one shape (431
//! included), a retry answered with the very same bytes, and follow-ups
//! answered degraded during a store outage not counted as not understood.

mod common;

use std::sync::Arc;

use common::down::Down;
use common::{demo_engine, test_settings, Server};

#[tokio::test]
async fn headers_too_large_get_a_431_in_the_error_shape() {
    let s = Server::start(demo_engine()).await;
    let r = s
        .client
        .get(s.url("/healthz"))
        .header("x-padding", "a".repeat(20 * 1024))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 431);
    let body: serde_json::Value = r.json().await.unwrap();
    assert_eq!(body["error"]["code"], "headers_too_large", "{body}");
}

#[tokio::test]
async fn a_retried_message_gets_the_same_bytes_back() {
    let s = Server::start(demo_engine()).await;
    // Several messages, each retried: facts come from a hash map, whose
    // order would differ between the reply and its stored copy.
    for i in 0..8 {
        let send = || {
            s.client
                .post(s.url("/v1/messages"))
                .json(&serde_json::json!({
                    "user": format!("bytes-{i}"),
                    "text": "who won the men's 100 m?",
                    "message_id": format!("m-{i}"),
                }))
                .send()
        };
        let first = send().await.unwrap();
        assert_eq!(first.headers()["tidings-repeated"], "false");
        let first = first.bytes().await.unwrap();
        let again = send().await.unwrap();
        assert_eq!(again.headers()["tidings-repeated"], "true");
        assert_eq!(again.bytes().await.unwrap(), first);
    }
}

#[tokio::test]
async fn degraded_follow_ups_are_not_counted_as_not_understood() {
    let store = Arc::new(Down::default());
    let engine = common::engine_with(store.clone(), test_settings());
    engine
        .handle("outage", "chat", "who won the men's 100 m?")
        .await
        .unwrap();
    // Without the session this follow-up cannot be understood.
    let a = engine
        .handle("outage", "chat", "and silver?")
        .await
        .unwrap();
    assert!(a.degraded);
    // The list is written by a spawned task: let it run if there is one.
    for _ in 0..20 {
        tokio::task::yield_now().await;
    }
    assert_eq!(store.noted(), 0);
}
