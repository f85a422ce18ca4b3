//! Sessions on a real Redis Cluster started by the test (three masters,
//! each with a replica, on private ports): every key of one reader lives on
//! one slot, and a conversation carries on when the master holding the
//! reader's slot fails over, gracefully (`CLUSTER FAILOVER`) and by a crash
//! (the master killed, its replica promoted by the cluster).

mod common;

use std::time::Duration;

use common::cluster::{cli, wait_for, LocalCluster};
use common::{test_prefix, wait_until, ServeProcess};

fn replica(urls: &str, prefix: &str) -> ServeProcess {
    ServeProcess::start(
        env!("CARGO_BIN_EXE_tidings"),
        &[
            "--redis-url",
            urls,
            "--redis-cluster",
            "--redis-prefix",
            prefix,
            "--now",
            common::NOW,
        ],
        &[("TIDINGS_ID_SECRET", "cluster-test-secret")],
    )
}

async fn say(client: &reqwest::Client, base: &str, text: &str, id: &str) -> serde_json::Value {
    let r = client
        .post(format!("{base}/v1/messages"))
        .json(&serde_json::json!({
            "user": "+44 7700 900321", "text": text, "channel": "chat", "message_id": id
        }))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200, "{text:?}");
    r.json().await.unwrap()
}

/// Sends `text` until a reply is not degraded (the store answered) or 10 s
/// pass; a degraded reply saves nothing, so retrying it is harmless.
async fn say_when_stored(
    client: &reqwest::Client,
    base: &str,
    text: &str,
    id: &str,
) -> serde_json::Value {
    let deadline = tokio::time::Instant::now() + Duration::from_secs(10);
    loop {
        let body = say(client, base, text, id).await;
        if body["degraded"] == false || tokio::time::Instant::now() > deadline {
            return body;
        }
        tokio::time::sleep(Duration::from_millis(100)).await;
    }
}

fn assert_says(body: &serde_json::Value, wanted: &str) {
    assert_eq!(body["degraded"], false, "{body}");
    let text = body["text"].as_str().unwrap_or_default();
    assert!(text.contains(wanted), "{text:?} lacks {wanted:?}");
}

/// The reader's session key, found on the cluster.
fn session_key(cluster: &LocalCluster, prefix: &str) -> String {
    cluster
        .keys_under(prefix)
        .into_iter()
        .find(|k| k.ends_with(":s"))
        .expect("the reader's session is stored")
}

#[tokio::test(flavor = "multi_thread", worker_threads = 2)]
async fn a_conversation_survives_failovers_of_the_readers_master() {
    let mut cluster = LocalCluster::start(3, 1);
    assert_eq!(cluster.masters().len(), 3);
    let prefix = test_prefix("cluster");
    let a = replica(&cluster.urls(), &prefix);
    let b = replica(&cluster.urls(), &prefix);
    let client = reqwest::Client::new();
    for base in [&a.base, &b.base] {
        let url = format!("{base}/readyz");
        let c = client.clone();
        wait_until("the replica to be ready", Duration::from_secs(30), || {
            let (c, url) = (c.clone(), url.clone());
            async move {
                match c.get(&url).send().await {
                    Ok(r) => r
                        .json::<serde_json::Value>()
                        .await
                        .is_ok_and(|v| v["status"] == "ready"),
                    Err(_) => false,
                }
            }
        })
        .await;
    }

    let first = say(&client, &a.base, "who won the men's 400 m?", "c1").await;
    assert_says(&first, "Larrel Trilunick");

    // Every key of the reader (session, kept reply, reply index) hashes to
    // one slot: the reader key in braces is the hash tag (Redis Cluster
    // specification, "Hash tags").
    let keys = cluster.keys_under(&prefix);
    assert!(keys.len() >= 3, "session, reply and index: {keys:?}");
    let slots: std::collections::BTreeSet<u16> = keys.iter().map(|k| cluster.slot_of(k)).collect();
    assert_eq!(slots.len(), 1, "one reader, one slot: {keys:?}");

    // A graceful failover: the replica of the reader's master takes over
    // (it syncs first, so nothing is lost).
    let key = session_key(&cluster, &prefix);
    let master = cluster.master_of(&key);
    let standby = cluster.replica_of(master);
    assert!(cli(standby, &["CLUSTER", "FAILOVER"]).contains("OK"));
    wait_for("the replica to become master", || {
        cli(standby, &["ROLE"]).starts_with("master")
    });
    assert_eq!(cluster.master_of(&key), standby);

    let second = say_when_stored(&client, &b.base, "and silver?", "c2").await;
    assert_says(&second, "Nulan Bendand");

    // A crash: the new master is killed and the cluster promotes its
    // replica (the old master) after the node timeout. First make sure the
    // replica holds the latest version of the session.
    let version = cli(standby, &["HGET", &key, "v"]);
    wait_for("the replica to hold the latest session", || {
        replica_reads(master, &key) == version
    });
    cluster.kill(standby);
    wait_for("the old master to be promoted again", || {
        cli(master, &["ROLE"]).starts_with("master")
            && cli(master, &["CLUSTER", "INFO"]).contains("cluster_state:ok")
    });

    let third = say_when_stored(&client, &a.base, "what about the women's?", "c3").await;
    assert_says(&third, "Vonia Gassarace");
    let fourth = say_when_stored(&client, &b.base, "where is she from?", "c4").await;
    assert_says(&fourth, "Orrindel Isles");

    // Erasure reaches the reader's keys on the cluster too.
    let r = client
        .delete(format!("{}/v1/users/chat/%2B44%207700%20900321", a.base))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 204);
    assert!(cluster.keys_under(&prefix).is_empty());
    a.stop();
    b.stop();
}

/// `HGET key v` on a replica, which serves reads after `READONLY` (both
/// sent on one connection, through redis-cli's standard input).
fn replica_reads(port: u16, key: &str) -> String {
    use std::io::Write;
    let mut child = std::process::Command::new("redis-cli")
        .args(["-p", &port.to_string()])
        .stdin(std::process::Stdio::piped())
        .stdout(std::process::Stdio::piped())
        .spawn()
        .expect("redis-cli runs");
    writeln!(child.stdin.take().unwrap(), "READONLY\nHGET {key} v").unwrap();
    let out = child.wait_with_output().unwrap();
    String::from_utf8_lossy(&out.stdout)
        .lines()
        .nth(1)
        .unwrap_or_default()
        .to_string()
        + "\n"
}
