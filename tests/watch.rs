//! `tidings serve --watch` as a real process: changed intents and data are
//! served without a restart, and a broken file keeps the last good version
//! serving while the admin status shows its file:line:column.

mod common;

use std::path::{Path, PathBuf};
use std::time::Duration;

use common::{wait_until, ServeProcess};

const TOKEN: &str = "watch-admin-token-0123456789";

fn copy_dir(from: &Path, to: &Path) {
    std::fs::create_dir_all(to).unwrap();
    for f in std::fs::read_dir(from).unwrap().flatten() {
        std::fs::copy(f.path(), to.join(f.file_name())).unwrap();
    }
}

fn scratch(tag: &str) -> PathBuf {
    std::env::temp_dir().join(format!(
        "tidings-watch-{tag}-{}-{:08x}",
        std::process::id(),
        rand::random::<u32>()
    ))
}

async fn hello(client: &reqwest::Client, base: &str) -> String {
    let a = common::ask_at(client, base, "w", "hello").await;
    a["text"].as_str().unwrap_or_default().to_string()
}

async fn status(client: &reqwest::Client, base: &str) -> serde_json::Value {
    common::admin_status(client, base, TOKEN).await
}

#[tokio::test]
async fn changed_files_are_served_and_a_broken_one_keeps_the_last_good_version() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let (data, intents) = (scratch("data"), scratch("intents"));
    copy_dir(&root.join("dataset-demo/games"), &data);
    copy_dir(&root.join("intents/games"), &intents);
    let (d, i) = (data.display().to_string(), intents.display().to_string());
    let server = ServeProcess::start(
        env!("CARGO_BIN_EXE_tidings"),
        // One reader polls for each reload, faster than a reader's rate.
        &[
            "--watch",
            "--data",
            &d,
            "--intents",
            &i,
            "--reader-rate",
            "0",
        ],
        &[("TIDINGS_ADMIN_TOKEN", TOKEN)],
    );
    let client = reqwest::Client::new();
    let base = server.base.clone();
    wait_until("the server to answer", Duration::from_secs(30), || {
        let (c, b) = (client.clone(), base.clone());
        async move { c.get(format!("{b}/healthz")).send().await.is_ok() }
    })
    .await;
    assert!(hello(&client, &base).await.starts_with("Hello!"));

    // An editor changes the greeting's wording.
    let greeting = intents.join("greeting.yaml");
    let text = std::fs::read_to_string(&greeting).unwrap();
    let changed = text.replace("answered: \"Hello!", "answered: \"Welcome!");
    assert_ne!(text, changed);
    std::fs::write(&greeting, &changed).unwrap();
    wait_until("the new wording", Duration::from_secs(10), || {
        let (c, b) = (client.clone(), base.clone());
        async move { hello(&c, &b).await.starts_with("Welcome!") }
    })
    .await;

    // A broken file: the last good version keeps serving, the status says
    // where the problem is.
    std::fs::write(&greeting, "intent: greeting\nreplies: [oops\n").unwrap();
    wait_until("the problem in the status", Duration::from_secs(10), || {
        let (c, b) = (client.clone(), base.clone());
        async move { !status(&c, &b).await["reload_error"].is_null() }
    })
    .await;
    let problem = status(&client, &base).await["reload_error"]
        .as_str()
        .unwrap()
        .to_string();
    assert!(problem.contains("greeting.yaml:"), "{problem}");
    assert!(hello(&client, &base).await.starts_with("Welcome!"));

    // Fixed again: served, and the problem is gone.
    std::fs::write(&greeting, &text).unwrap();
    wait_until("the fixed file", Duration::from_secs(10), || {
        let (c, b) = (client.clone(), base.clone());
        async move { status(&c, &b).await["reload_error"].is_null() }
    })
    .await;
    assert!(hello(&client, &base).await.starts_with("Hello!"));

    // The data too: a new as_of is a new version.
    let before = status(&client, &base).await["dataset_version"]
        .as_u64()
        .unwrap();
    let scenario = data.join("scenario.json");
    let s = std::fs::read_to_string(&scenario).unwrap();
    std::fs::write(
        &scenario,
        s.replace("2027-08-14T21:04:00+01:00", "2027-08-14T21:09:00+01:00"),
    )
    .unwrap();
    wait_until("the new data version", Duration::from_secs(10), || {
        let (c, b) = (client.clone(), base.clone());
        async move { status(&c, &b).await["dataset_version"].as_u64() > Some(before) }
    })
    .await;
    assert_eq!(
        status(&client, &base).await["as_of"],
        "2027-08-14T21:09:00+01:00"
    );

    // A live change through the admin API, then an edit of the data files:
    // the files are not loaded over the live change, and the status says so.
    let r = client
        .post(format!("{base}/v1/admin/batches"))
        .bearer_auth(TOKEN)
        .json(&serde_json::json!({"changes": [
            {"change": "aliases", "of": "group", "id": "quessary", "add": ["the Q"]}
        ]}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
    let live = status(&client, &base).await["dataset_version"].as_u64();
    let s = std::fs::read_to_string(&scenario).unwrap();
    std::fs::write(
        &scenario,
        s.replace("2027-08-14T21:09:00+01:00", "2027-08-14T21:08:00+01:00"),
    )
    .unwrap();
    wait_until("the refusal in the status", Duration::from_secs(10), || {
        let (c, b) = (client.clone(), base.clone());
        async move {
            status(&c, &b).await["reload_error"]
                .as_str()
                .is_some_and(|p| p.contains("posted through the admin API"))
        }
    })
    .await;
    assert_eq!(
        status(&client, &base).await["dataset_version"].as_u64(),
        live
    );
    // Editors' swap files are not data files: no reload for them.
    std::fs::write(data.join(".scenario.json.swp"), "x").unwrap();

    server.stop();
    let _ = std::fs::remove_dir_all(&data);
    let _ = std::fs::remove_dir_all(&intents);
}
