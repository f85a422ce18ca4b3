//! Request ids and JSON logs: an id sent in `x-request-id` comes back in
//! the response and is on every log line of its request; a missing or
//! unusable one is replaced by one the service makes; with
//! `TIDINGS_LOG_FORMAT=json` every log line is one JSON object.

mod common;

use common::{demo_engine, ServeProcess, Server};
use serde_json::{json, Value};

const ID: &str = "edge-7f3a.92c1:req";
const USER: &str = "reader-with-a-raw-id-0042";
const TEXT: &str = "who won the men's 100m?";

#[tokio::test]
async fn a_usable_id_is_echoed_and_others_are_replaced() {
    let s = Server::start(demo_engine()).await;
    let send = |id: Option<String>| {
        let mut r = s
            .client
            .post(s.url("/v1/messages"))
            .json(&json!({"user": "ids", "text": "hello"}));
        if let Some(id) = id {
            r = r.header("x-request-id", id);
        }
        r.send()
    };
    let r = send(Some(ID.into())).await.unwrap();
    assert_eq!(r.status(), 200);
    assert_eq!(r.headers()["x-request-id"], ID);

    let made_up = |r: &reqwest::Response| {
        let id = r.headers()["x-request-id"].to_str().unwrap().to_string();
        assert_eq!(id.len(), 32, "{id}");
        assert!(id.bytes().all(|b| b.is_ascii_hexdigit()), "{id}");
        id
    };
    let a = made_up(&send(None).await.unwrap());
    let b = made_up(&send(None).await.unwrap());
    assert_ne!(a, b);
    for unusable in ["x".repeat(129), "two words".into(), "a\"b".into()] {
        let r = send(Some(unusable.clone())).await.unwrap();
        let id = made_up(&r);
        assert_ne!(id, unusable);
    }
    // Errors and routes that match nothing carry one too.
    let r = s
        .client
        .get(s.url("/nowhere"))
        .header("x-request-id", ID)
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 404);
    assert_eq!(r.headers()["x-request-id"], ID);
}

/// The request span's fields on a JSON log line, if the line was written
/// inside a request.
fn request_span(line: &Value) -> Option<&Value> {
    line["spans"]
        .as_array()?
        .iter()
        .find(|s| s["name"] == "request")
}

#[tokio::test]
async fn with_json_logs_every_line_of_a_request_is_json_and_carries_its_id() {
    let server = ServeProcess::start(
        env!("CARGO_BIN_EXE_tidings"),
        &[],
        &[
            ("TIDINGS_LOG_FORMAT", "json"),
            // Debug, so the request writes several lines: the HTTP layer's
            // own and the turn's.
            ("TIDINGS_LOG", "tidings=debug,tower_http=debug"),
        ],
    );
    let client = reqwest::Client::new();
    let r = client
        .post(format!("{}/v1/messages", server.base))
        .header("x-request-id", ID)
        .json(&json!({"user": USER, "text": TEXT}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
    assert_eq!(r.headers()["x-request-id"], ID);
    let body: Value = r.json().await.unwrap();
    assert_eq!(body["intent"], "podium");
    // The log is read as it is written: wait for the request's last line.
    common::wait_until(
        "the request's last log line",
        std::time::Duration::from_secs(10),
        || {
            let done = server.log().contains("finished processing request");
            async move { done }
        },
    )
    .await;
    let log = server.stop();

    let lines: Vec<Value> = log
        .lines()
        .map(|l| {
            serde_json::from_str::<Value>(l)
                .ok()
                .filter(Value::is_object)
                .unwrap_or_else(|| panic!("not a JSON object: {l}"))
        })
        .collect();
    let in_request: Vec<&Value> = lines.iter().filter(|l| request_span(l).is_some()).collect();
    // The HTTP layer's start and finish and the turn, at least.
    assert!(in_request.len() >= 3, "{log}");
    for line in &in_request {
        let span = request_span(line).unwrap();
        assert_eq!(span["request_id"], ID, "{line}");
        assert_eq!(span["route"], "/v1/messages", "{line}");
    }
    let messages: Vec<&str> = in_request
        .iter()
        .filter_map(|l| l["fields"]["message"].as_str())
        .collect();
    assert!(messages.contains(&"turn"), "{messages:?}");
    // Lines outside any request are the process's own (start-up).
    for line in lines.iter().filter(|l| request_span(l).is_none()) {
        assert_ne!(line["target"], "tower_http::trace::on_request", "{line}");
        assert_ne!(line["fields"]["message"], "turn", "{line}");
    }
    // The reader's id only hashed, and their words not at all, even at
    // debug level.
    assert!(!log.contains(USER), "{log}");
    assert!(!log.contains("men's 100m"), "{log}");
}
