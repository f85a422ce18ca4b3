//! Two `tidings serve` processes sharing one Redis: a reader's conversation
//! alternates between them and keeps its context, as behind a load balancer.

mod common;

use std::time::Duration;

use common::{ask_at, keys_under, redis_url, test_prefix, wait_until, ServeProcess};

const ADMIN_TOKEN: &str = "replica-admin-token-0123456789";

/// A replica: `tidings serve` on the shared Redis under `prefix`. Every
/// replica hashes user ids with the same secret, as a deployment must, and
/// logs at debug level to prove ids stay hashed.
struct Replica;

impl Replica {
    fn start(prefix: &str) -> ServeProcess {
        let url = redis_url();
        ServeProcess::start(
            env!("CARGO_BIN_EXE_tidings"),
            &[
                "--redis-url",
                &url,
                "--redis-prefix",
                prefix,
                "--now",
                common::NOW,
            ],
            &[
                ("TIDINGS_ID_SECRET", "replica-test-secret"),
                ("TIDINGS_ADMIN_TOKEN", ADMIN_TOKEN),
                ("TIDINGS_LOG", "tidings=debug,tower_http=debug"),
            ],
        )
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
    assert_ne!(a.base, b.base, "two processes, two addresses");
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

/// A batch posted to one replica is served by the other within a second,
/// and a replica started later begins from the shared version.
#[tokio::test]
async fn a_change_posted_to_one_replica_is_served_by_all() {
    let prefix = test_prefix("shared-data");
    let a = Replica::start(&prefix);
    let b = Replica::start(&prefix);
    let client = reqwest::Client::new();
    ready(&client, &a.base).await;
    ready(&client, &b.base).await;
    let q = "who won the men's marathon?";
    assert_eq!(ask_at(&client, &b.base, "r1", q).await["detail"], "live");

    let batch = serde_json::json!({"as_of": "2027-08-14T21:30:00+01:00", "changes": [
        {"change": "results", "contest": "ath-m-marathon-final", "status": "final", "entries": [
            {"competitor": "p036", "place": 1, "mark": "2:05:31", "award": "gold"}
        ]}
    ]});
    let r = client
        .post(format!("{}/v1/admin/batches", a.base))
        .bearer_auth(ADMIN_TOKEN)
        .json(&batch)
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
    let posted = std::time::Instant::now();
    let v: serde_json::Value = r.json().await.unwrap();
    let version = v["dataset_version"].as_u64().unwrap();

    // The other replica serves it (within a second on an idle machine; the
    // time is logged, and the deadline leaves room for a loaded one).
    wait_until(
        "the other replica to serve the change",
        Duration::from_secs(5),
        || {
            let client = client.clone();
            let base = b.base.clone();
            async move {
                let a = ask_at(&client, &base, "r2", q).await;
                a["dataset_version"] == version && a["detail"] == "answered"
            }
        },
    )
    .await;
    eprintln!("served by the other replica after {:?}", posted.elapsed());
    let answer = ask_at(&client, &b.base, "r3", q).await;
    assert!(
        answer["text"]
            .as_str()
            .unwrap()
            .starts_with("Banel Morressi (Kalvenmark) won the men's marathon"),
        "{answer}"
    );

    // A replica that was not running catches up by version at start.
    let c = Replica::start(&prefix);
    ready(&client, &c.base).await;
    let answer = ask_at(&client, &c.base, "r4", q).await;
    assert_eq!(answer["dataset_version"], version, "{answer}");
    let _ = (a.stop(), b.stop(), c.stop());
}
