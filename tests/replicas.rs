//! Two `tidings serve` processes sharing one Redis: a reader's conversation
//! alternates between them and keeps its context, as behind a load balancer.

mod common;

use std::io::Read;
use std::process::{Child, Command, Stdio};
use std::time::Duration;

use common::{keys_under, redis_url, test_prefix, wait_until};

struct Replica {
    child: Child,
    base: String,
}

impl Replica {
    fn start(prefix: &str) -> Replica {
        let port = std::net::TcpListener::bind("127.0.0.1:0")
            .unwrap()
            .local_addr()
            .unwrap()
            .port();
        let child = Command::new(env!("CARGO_BIN_EXE_tidings"))
            .arg("serve")
            .args(["--listen", &format!("127.0.0.1:{port}")])
            .args(["--redis-url", &redis_url()])
            .args(["--redis-prefix", prefix])
            .args(["--now", common::NOW])
            // Both replicas hash user ids with the same secret, as a
            // deployment must; debug logging to prove ids stay hashed.
            .env("TIDINGS_ID_SECRET", "replica-test-secret")
            .env("TIDINGS_LOG", "tidings=debug,tower_http=debug")
            .stdout(Stdio::null())
            .stderr(Stdio::piped())
            .spawn()
            .expect("tidings serve starts");
        Replica {
            child,
            base: format!("http://127.0.0.1:{port}"),
        }
    }

    /// Stops the process and returns what it logged.
    fn stop(mut self) -> String {
        let _ = self.child.kill();
        let _ = self.child.wait();
        let mut log = String::new();
        if let Some(mut e) = self.child.stderr.take() {
            let _ = e.read_to_string(&mut log);
        }
        log
    }
}

async fn ready(client: &reqwest::Client, base: &str) {
    let url = format!("{base}/readyz");
    wait_until(
        &format!("{url} to be ready"),
        Duration::from_secs(30),
        || {
            let c = client.clone();
            let url = url.clone();
            async move {
                match c.get(&url).send().await {
                    Ok(r) => r
                        .json::<serde_json::Value>()
                        .await
                        .is_ok_and(|v| v["status"] == "ready"),
                    Err(_) => false,
                }
            }
        },
    )
    .await;
}

#[tokio::test]
async fn a_conversation_alternating_between_two_replicas_keeps_its_context() {
    let prefix = test_prefix("replicas");
    let a = Replica::start(&prefix);
    let b = Replica::start(&prefix);
    let client = reqwest::Client::new();
    ready(&client, &a.base).await;
    ready(&client, &b.base).await;

    let user = "+44 7700 900456";
    let turns: [(&str, &str, &[&str]); 5] = [
        (&a.base, "who won the men's 400 m?", &["Larrel Trilunick"]),
        (&b.base, "and silver?", &["Nulan Bendand"]),
        (&a.base, "what about the women's?", &["Vonia Gassarace"]),
        (
            &b.base,
            "where is she from?",
            &["Vonia Gassarace", "Orrindel Isles"],
        ),
        (
            &a.base,
            "how many medals has she won?",
            &["Vonia Gassarace"],
        ),
    ];
    for (i, (base, text, wanted)) in turns.iter().enumerate() {
        let r = client
            .post(format!("{base}/v1/messages"))
            .json(&serde_json::json!({
                "user": user, "text": text, "channel": "chat", "message_id": format!("rep-{i}")
            }))
            .send()
            .await
            .unwrap();
        assert_eq!(r.status(), 200);
        let body: serde_json::Value = r.json().await.unwrap();
        assert_eq!(body["degraded"], false, "{body}");
        let reply = body["text"].as_str().unwrap();
        for w in *wanted {
            assert!(
                reply.contains(w),
                "{text:?} on {base} → {reply:?} lacks {w:?}"
            );
        }
    }
    // A retry of the second message sent to the other replica gets the
    // reply the first one gave.
    let r = client
        .post(format!("{}/v1/messages", a.base))
        .json(&serde_json::json!({"user": user, "text": "and silver?", "message_id": "rep-1"}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.headers()["tidings-repeated"], "true");
    let body: serde_json::Value = r.json().await.unwrap();
    assert!(body["text"].as_str().unwrap().contains("Nulan Bendand"));

    // Erasure through one replica removes what both wrote.
    let r = client
        .delete(format!("{}/v1/users/chat/%2B44%207700%20900456", b.base))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 204);
    assert!(keys_under(&prefix).await.is_empty());

    // The raw user id never reached the logs, even at debug level.
    let logs = a.stop() + &b.stop();
    assert!(logs.contains("turn"), "debug logging was on: {logs}");
    assert!(!logs.contains("7700"), "a raw user id was logged:\n{logs}");
}
