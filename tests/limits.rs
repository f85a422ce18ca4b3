//! Rate limits over a real socket: per reader, per source address and on
//! failed admin logins, each answered 429 with `retry-after` and the
//! service's error body.

mod common;

use std::sync::Arc;

use common::{engine_with, test_settings, Server};
use tidings::dialogue::MemoryStore;
use tidings::http::{Edge, Rate, Rates};

const TOKEN: &str = "admin-token-for-tests-0123456789";

/// Rates that refill so slowly that no token comes back during a test.
fn edge(rates: Rates) -> Edge {
    Edge {
        rates,
        ..Edge::without_rate_limits()
    }
}

const SLOW: f64 = 0.001;

fn no_rates() -> Rates {
    Edge::without_rate_limits().rates
}

async fn post(s: &Server, user: &str) -> reqwest::Response {
    s.client
        .post(s.url("/v1/messages"))
        .json(&serde_json::json!({"user": user, "text": "hello"}))
        .send()
        .await
        .unwrap()
}

async fn assert_limited(r: reqwest::Response) {
    assert_eq!(r.status(), 429);
    let after: u64 = r.headers()["retry-after"]
        .to_str()
        .unwrap()
        .parse()
        .unwrap();
    assert!(after >= 1);
    let body: serde_json::Value = r.json().await.unwrap();
    assert_eq!(body["error"]["code"], "rate_limited", "{body}");
    assert!(body["error"]["message"].is_string());
}

#[tokio::test]
async fn one_reader_past_their_burst_gets_429_and_others_go_on() {
    let s = Server::start_with(
        common::demo_engine(),
        edge(Rates {
            per_reader: Some(Rate::new(SLOW, 3.0)),
            ..no_rates()
        }),
    )
    .await;
    for _ in 0..3 {
        assert_eq!(post(&s, "reader-burst").await.status(), 200);
    }
    assert_limited(post(&s, "reader-burst").await).await;
    assert_eq!(post(&s, "reader-calm").await.status(), 200);
}

#[tokio::test]
async fn one_source_past_its_burst_gets_429_but_health_checks_go_on() {
    let s = Server::start_with(
        common::demo_engine(),
        edge(Rates {
            per_source: Some(Rate::new(SLOW, 4.0)),
            ..no_rates()
        }),
    )
    .await;
    for i in 0..4 {
        assert_eq!(post(&s, &format!("reader-{i}")).await.status(), 200);
    }
    assert_limited(post(&s, "reader-new").await).await;
    let health = s.client.get(s.url("/healthz")).send().await.unwrap();
    assert_eq!(health.status(), 200);
}

#[tokio::test]
async fn failed_admin_logins_are_limited_per_source_even_for_the_right_token() {
    let mut settings = test_settings();
    settings.admin_token = Some(TOKEN.into());
    let s = Server::start_with(
        engine_with(Arc::new(MemoryStore::new()), settings),
        edge(Rates {
            admin_failures: Rate::new(SLOW, 3.0),
            ..no_rates()
        }),
    )
    .await;
    let status = |token: &'static str| {
        let s = &s;
        async move {
            s.client
                .get(s.url("/v1/admin/status"))
                .bearer_auth(token)
                .send()
                .await
                .unwrap()
        }
    };
    // Good logins do not use up the allowance.
    for _ in 0..5 {
        assert_eq!(status(TOKEN).await.status(), 200);
    }
    for _ in 0..3 {
        assert_eq!(status("a-wrong-guess-0000000").await.status(), 401);
    }
    assert_limited(status("a-wrong-guess-0000001").await).await;
    assert_limited(status(TOKEN).await).await;
}
