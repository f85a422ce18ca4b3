//! `GET /metrics` against a real server: who may read it, and the counts
//! after some traffic, read back by a general-purpose parser of the
//! Prometheus text format rather than by our own code.
//!
//! The parser is `prometheus_client.parser.text_string_to_metric_families`
//! from the PyPI package `prometheus_client` (the Prometheus project's
//! Python client), run with the Python of the venv `tests/run.sh` installs
//! it into (`TIDINGS_METRICS_PYTHON`).

mod common;

use std::collections::BTreeMap;
use std::io::Write;
use std::process::{Command, Stdio};
use std::sync::Arc;

use common::down::Down;
use common::Server;
use serde_json::{json, Value};

const METRICS_TOKEN: &str = "metrics-token-for-the-test";
const ADMIN_TOKEN: &str = "admin-token-for-the-metrics-test";

/// The Python that has `prometheus_client`. Missing, the test fails: it
/// never skips silently.
fn python() -> String {
    std::env::var("TIDINGS_METRICS_PYTHON").unwrap_or_else(|_| {
        panic!("TIDINGS_METRICS_PYTHON is not set: run the tests with `bash tests/run.sh`, which installs prometheus_client into a venv")
    })
}

/// One sample as the parser reads it.
#[derive(Debug, Clone)]
struct Sample {
    family: String,
    kind: String,
    name: String,
    labels: BTreeMap<String, String>,
    value: f64,
}

/// Parses exposition text with prometheus_client's parser (which raises on
/// a line it cannot read), one sample per line of its JSON output.
fn parse(text: &str) -> Vec<Sample> {
    const SCRIPT: &str = r#"
import json, sys
from prometheus_client.parser import text_string_to_metric_families
for family in text_string_to_metric_families(sys.stdin.read()):
    for s in family.samples:
        print(json.dumps({"family": family.name, "type": family.type,
                          "name": s.name, "labels": s.labels, "value": s.value}))
"#;
    let mut child = Command::new(python())
        .args(["-c", SCRIPT])
        .stdin(Stdio::piped())
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap_or_else(|e| panic!("cannot run {}: {e}", python()));
    child
        .stdin
        .take()
        .unwrap()
        .write_all(text.as_bytes())
        .unwrap();
    let out = child.wait_with_output().unwrap();
    assert!(
        out.status.success(),
        "prometheus_client could not parse the metrics: {}\n---\n{text}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout)
        .unwrap()
        .lines()
        .map(|l| {
            let v: Value = serde_json::from_str(l).unwrap();
            Sample {
                family: v["family"].as_str().unwrap().into(),
                kind: v["type"].as_str().unwrap().into(),
                name: v["name"].as_str().unwrap().into(),
                labels: v["labels"]
                    .as_object()
                    .unwrap()
                    .iter()
                    .map(|(k, v)| (k.clone(), v.as_str().unwrap().to_string()))
                    .collect(),
                value: v["value"].as_f64().unwrap(),
            }
        })
        .collect()
}

/// The value of the sample `name` with exactly `labels`; 0 when absent
/// (a series not counted yet).
fn value(samples: &[Sample], name: &str, labels: &[(&str, &str)]) -> f64 {
    let want: BTreeMap<String, String> = labels
        .iter()
        .map(|(k, v)| (k.to_string(), v.to_string()))
        .collect();
    samples
        .iter()
        .find(|s| s.name == name && s.labels == want)
        .map_or(0.0, |s| s.value)
}

async fn scrape(s: &Server) -> (String, Vec<Sample>) {
    let r = s
        .client
        .get(s.url("/metrics"))
        .bearer_auth(METRICS_TOKEN)
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
    // The content type of format 0.0.4 (Prometheus exposition formats
    // documentation).
    assert_eq!(
        r.headers()["content-type"],
        "text/plain; version=0.0.4; charset=utf-8"
    );
    let text = r.text().await.unwrap();
    let samples = parse(&text);
    (text, samples)
}

fn settings() -> tidings::engine::Settings {
    tidings::engine::Settings {
        admin_token: Some(ADMIN_TOKEN.into()),
        metrics_token: Some(METRICS_TOKEN.into()),
        ..common::test_settings()
    }
}

#[tokio::test]
async fn metrics_are_off_without_a_token_and_need_the_right_one() {
    let s = Server::start(common::demo_engine()).await;
    let r = s.client.get(s.url("/metrics")).send().await.unwrap();
    assert_eq!(r.status(), 403);
    let body: Value = r.json().await.unwrap();
    assert_eq!(body["error"]["code"], "metrics_off");

    let s = Server::start(common::engine_with(
        Arc::new(tidings::dialogue::MemoryStore::new()),
        settings(),
    ))
    .await;
    let r = s.client.get(s.url("/metrics")).send().await.unwrap();
    assert_eq!(r.status(), 401);
    let r = s
        .client
        .get(s.url("/metrics"))
        .bearer_auth("not-the-metrics-token")
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 401);
    let body: Value = r.json().await.unwrap();
    assert_eq!(body["error"]["code"], "unauthorized");
    // The admin token reads them too.
    let r = s
        .client
        .get(s.url("/metrics"))
        .bearer_auth(ADMIN_TOKEN)
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
}

#[tokio::test]
async fn counts_move_with_traffic_and_parse_with_a_general_parser() {
    let prefix = common::test_prefix("metrics");
    let store = Arc::new(
        tidings::dialogue::RedisStore::new(&common::redis_url(), &prefix)
            .expect("the Redis URL parses"),
    );
    let s = Server::start(common::engine_with(store, settings())).await;
    let (_, before) = scrape(&s).await;

    for i in 0..3 {
        let (status, body) = s.ask(&format!("m-{i}"), "who won the men's 100m?").await;
        assert_eq!(status, 200);
        assert_eq!(body["intent"], "podium", "{body}");
        assert_eq!(body["outcome"], "answered", "{body}");
    }
    let (_, body) = s.ask("m-clarify", "who won?").await;
    assert_eq!(body["outcome"], "clarify", "{body}");
    let clarified_intent = body["intent"].as_str().unwrap().to_string();
    let (_, body) = s.ask("m-none", "qwxz vlorp").await;
    assert_eq!(body["outcome"], "not_understood", "{body}");
    assert!(body["intent"].is_null());
    // A reader's mistake, an unknown path (of the client's choosing) and
    // a batch applied and one refused.
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .json(&json!({"user": "m", "text": "  "}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 422);
    let r = s
        .client
        .get(s.url("/v2/anything-a-client-likes"))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 404);
    let post_batch = |batch: Value| {
        s.client
            .post(s.url("/v1/admin/batches"))
            .bearer_auth(ADMIN_TOKEN)
            .json(&batch)
            .send()
    };
    let good = json!({"as_of": "2027-08-14T21:30:00+01:00", "changes": [
        {"change": "results", "contest": "ath-m-marathon-final", "status": "final", "entries": [
            {"competitor": "p036", "place": 1, "mark": "2:05:31", "award": "gold"}
        ]}
    ]});
    assert_eq!(post_batch(good).await.unwrap().status(), 200);
    let bad = json!({"changes": [{"change": "schedule", "contest": "no-such-race", "start": "2027-08-15T10:00"}]});
    assert_eq!(post_batch(bad).await.unwrap().status(), 422);

    let (text, after) = scrape(&s).await;
    let moved = |name: &str, labels: &[(&str, &str)]| {
        value(&after, name, labels) - value(&before, name, labels)
    };

    // Requests by matched route and status; the raw path never shows.
    let requests = "tidings_http_requests_total";
    assert_eq!(
        moved(requests, &[("route", "/v1/messages"), ("status", "200")]),
        5.0
    );
    assert_eq!(
        moved(requests, &[("route", "/v1/messages"), ("status", "422")]),
        1.0
    );
    assert_eq!(
        moved(requests, &[("route", "unmatched"), ("status", "404")]),
        1.0
    );
    assert_eq!(
        moved(
            requests,
            &[("route", "/v1/admin/batches"), ("status", "200")]
        ),
        1.0
    );
    assert_eq!(
        moved(
            requests,
            &[("route", "/v1/admin/batches"), ("status", "422")]
        ),
        1.0
    );
    // The first scrape is counted once it has gone.
    assert_eq!(
        value(
            &after,
            requests,
            &[("route", "/metrics"), ("status", "200")]
        ),
        1.0
    );
    assert!(!text.contains("anything-a-client-likes"), "{text}");

    // Outcomes by intent.
    let turns = "tidings_turns_total";
    assert_eq!(
        moved(turns, &[("intent", "podium"), ("outcome", "answered")]),
        3.0
    );
    assert_eq!(
        moved(
            turns,
            &[
                ("intent", clarified_intent.as_str()),
                ("outcome", "clarify")
            ]
        ),
        1.0
    );
    assert_eq!(
        moved(turns, &[("intent", "none"), ("outcome", "not_understood")]),
        1.0
    );

    // The latency histogram: five turns, cumulative buckets, +Inf = count.
    let count = "tidings_turn_duration_seconds_count";
    assert_eq!(moved(count, &[]), 5.0);
    let buckets: Vec<(f64, f64)> = after
        .iter()
        .filter(|s| s.name == "tidings_turn_duration_seconds_bucket")
        .map(|s| {
            let le = &s.labels["le"];
            let bound = if le == "+Inf" {
                f64::INFINITY
            } else {
                le.parse().unwrap()
            };
            (bound, s.value)
        })
        .collect();
    assert!(buckets.len() > 5);
    assert!(buckets
        .windows(2)
        .all(|w| w[0].0 < w[1].0 && w[0].1 <= w[1].1));
    assert_eq!(
        buckets.last().unwrap(),
        &(f64::INFINITY, value(&after, count, &[]))
    );
    assert!(value(&after, "tidings_turn_duration_seconds_sum", &[]) > 0.0);

    // The session store: a load and a save a turn, each one round trip to
    // Redis, and no errors.
    let calls = "tidings_session_store_calls_total";
    assert_eq!(moved(calls, &[("operation", "load")]), 5.0);
    assert_eq!(moved(calls, &[("operation", "save")]), 5.0);
    assert_eq!(
        moved(
            "tidings_session_store_errors_total",
            &[("operation", "load")]
        ),
        0.0
    );
    assert!(moved("tidings_session_store_round_trips_total", &[]) >= 10.0);
    assert_eq!(moved("tidings_degraded_replies_total", &[]), 0.0);

    // Batches, the dataset's version and its age on the test's fixed clock
    // (21:10; the demo data were confirmed at 21:04, the batch says 21:30).
    let batches = "tidings_batches_total";
    assert_eq!(moved(batches, &[("result", "applied")]), 1.0);
    assert_eq!(moved(batches, &[("result", "invalid")]), 1.0);
    assert_eq!(value(&before, "tidings_dataset_version", &[]), 1.0);
    assert_eq!(value(&after, "tidings_dataset_version", &[]), 2.0);
    assert_eq!(value(&before, "tidings_dataset_age_seconds", &[]), 360.0);
    assert_eq!(value(&after, "tidings_dataset_age_seconds", &[]), -1200.0);
    assert_eq!(value(&after, "tidings_reload_errors_total", &[]), 0.0);

    // Every family has the type it is meant to have.
    let kind = |family: &str| {
        after
            .iter()
            .find(|s| s.family == family)
            .map(|s| s.kind.clone())
            .unwrap_or_else(|| panic!("no family {family} in\n{text}"))
    };
    // prometheus_client names a counter's family without `_total`.
    assert_eq!(kind("tidings_http_requests"), "counter");
    assert_eq!(kind("tidings_turns"), "counter");
    assert_eq!(kind("tidings_turn_duration_seconds"), "histogram");
    assert_eq!(kind("tidings_dataset_version"), "gauge");
    assert_eq!(kind("tidings_dataset_age_seconds"), "gauge");
}

#[tokio::test]
async fn a_store_outage_shows_as_errors_and_degraded_replies() {
    let s = Server::start(common::engine_with(Arc::new(Down::default()), settings())).await;
    for i in 0..2 {
        let (status, body) = s.ask(&format!("d-{i}"), "who won the men's 100m?").await;
        assert_eq!(status, 200);
        assert_eq!(body["degraded"], true);
    }
    let r = s.client.get(s.url("/readyz")).send().await.unwrap();
    assert_eq!(r.status(), 200);
    let (_, after) = scrape(&s).await;
    assert_eq!(value(&after, "tidings_degraded_replies_total", &[]), 2.0);
    let errors = "tidings_session_store_errors_total";
    assert_eq!(value(&after, errors, &[("operation", "load")]), 2.0);
    assert_eq!(value(&after, errors, &[("operation", "ping")]), 1.0);
    // In memory or down, no store reports round trips.
    assert!(after
        .iter()
        .all(|s| s.name != "tidings_session_store_round_trips_total"));
}
