//! The admin API through HTTP: live batches applied all or nothing, a whole
//! dataset replaced, the status, and the token that guards them.

mod common;

use std::sync::Arc;

use common::{engine_with, test_settings, Server};
use serde_json::{json, Value};
use tidings::dialogue::MemoryStore;

const TOKEN: &str = "admin-token-for-tests-0123456789";

fn admin_server_engine() -> tidings::engine::Engine {
    let mut settings = test_settings();
    settings.admin_token = Some(TOKEN.into());
    engine_with(Arc::new(MemoryStore::new()), settings)
}

async fn admin(s: &Server, method: &str, path: &str, body: Option<Value>) -> (u16, Value) {
    let mut req = match method {
        "GET" => s.client.get(s.url(path)),
        "PUT" => s.client.put(s.url(path)),
        _ => s.client.post(s.url(path)),
    }
    .bearer_auth(TOKEN);
    if let Some(b) = body {
        req = req.json(&b);
    }
    let r = req.send().await.unwrap();
    (r.status().as_u16(), r.json().await.unwrap())
}

/// The marathon called: live until now in the demo.
fn marathon_final() -> Value {
    json!({"as_of": "2027-08-14T21:30:00+01:00", "changes": [
        {"change": "results", "contest": "ath-m-marathon-final", "status": "final", "entries": [
            {"competitor": "p036", "place": 1, "mark": "2:05:31", "award": "gold"}
        ]}
    ]})
}

#[tokio::test]
async fn without_a_token_configured_the_admin_api_is_off() {
    let s = Server::start(common::demo_engine()).await;
    let (status, body) = admin(&s, "GET", "/v1/admin/status", None).await;
    assert_eq!(status, 403);
    assert_eq!(body["error"]["code"], "admin_off");
    let (status, _) = admin(&s, "POST", "/v1/admin/batches", Some(marathon_final())).await;
    assert_eq!(status, 403);
}

#[tokio::test]
async fn a_wrong_or_missing_token_is_refused() {
    let s = Server::start(admin_server_engine()).await;
    for auth in [None, Some("Bearer nope"), Some(TOKEN)] {
        let mut req = s.client.get(s.url("/v1/admin/status"));
        if let Some(a) = auth {
            req = req.header("authorization", a);
        }
        let r = req.send().await.unwrap();
        assert_eq!(r.status(), 401, "{auth:?}");
        let body: Value = r.json().await.unwrap();
        assert_eq!(body["error"]["code"], "unauthorized");
    }
    let (status, body) = admin(&s, "GET", "/v1/admin/status", None).await;
    assert_eq!(status, 200);
    assert_eq!(body["dataset_version"], 1);
    assert!(body["intents"].as_array().unwrap().len() >= 18);
    assert_eq!(body["as_of"], "2027-08-14T21:04:00+01:00");
    // The demo clock is 21:10, six minutes after the data's as_of.
    assert_eq!(body["age_seconds"], 360);
}

#[tokio::test]
async fn a_batch_is_applied_and_answers_change() {
    let s = Server::start(admin_server_engine()).await;
    let (_, before) = s.ask("reader-live", "who won the men's marathon?").await;
    assert_eq!(before["detail"], "live", "{before}");
    let (status, body) = admin(&s, "POST", "/v1/admin/batches", Some(marathon_final())).await;
    assert_eq!(status, 200, "{body}");
    assert_eq!(body["dataset_version"], 2);
    let (_, after) = s.ask("reader-live-2", "who won the men's marathon?").await;
    assert_eq!(after["dataset_version"], 2);
    assert_eq!(after["as_of"], "2027-08-14T21:30:00+01:00");
    assert!(
        after["text"]
            .as_str()
            .unwrap()
            .starts_with("Banel Morressi (Kalvenmark) won the men's marathon"),
        "{after}"
    );
    let (_, st) = admin(&s, "GET", "/v1/admin/status", None).await;
    assert_eq!(st["dataset_version"], 2);
}

#[tokio::test]
async fn a_batch_giving_a_person_a_delegations_name_is_refused() {
    let s = Server::start(admin_server_engine()).await;
    let clash = json!({"changes": [
        {"change": "aliases", "of": "competitor", "id": "p005", "add": ["Quessary"]}
    ]});
    let (status, body) = admin(&s, "POST", "/v1/admin/batches", Some(clash)).await;
    assert_eq!(status, 422, "{body}");
    assert_eq!(body["error"]["code"], "invalid_batch");
    let msg = body["error"]["message"].as_str().unwrap();
    assert!(
        msg.contains("competitors.json") && msg.contains("p005") && msg.contains("aliases"),
        "{msg}"
    );
    let (_, st) = admin(&s, "GET", "/v1/admin/status", None).await;
    assert_eq!(st["dataset_version"], 1);
}

#[tokio::test]
async fn an_invalid_batch_changes_nothing_and_lists_every_problem() {
    let s = Server::start(admin_server_engine()).await;
    let bad = json!({"changes": [
        {"change": "results", "contest": "ath-m-marathon-final", "status": "final", "entries": [
            {"competitor": "p036", "place": 1, "mark": "not a time", "award": "gold"}
        ]},
        {"change": "schedule", "contest": "no-such-race", "start": "2027-08-15T10:00"}
    ]});
    let (status, body) = admin(&s, "POST", "/v1/admin/batches", Some(bad)).await;
    assert_eq!(status, 422, "{body}");
    assert_eq!(body["error"]["code"], "invalid_batch");
    let msg = body["error"]["message"].as_str().unwrap();
    assert!(
        msg.contains("change 2") && msg.contains("no-such-race"),
        "{msg}"
    );
    // All or nothing: the marathon is still live, the version unchanged.
    let (_, st) = admin(&s, "GET", "/v1/admin/status", None).await;
    assert_eq!(st["dataset_version"], 1);
    let (_, a) = s.ask("reader-still", "who won the men's marathon?").await;
    assert_eq!(a["detail"], "live");
    // A batch whose records contradict each other is checked like files.
    let bad = json!({"changes": [
        {"change": "results", "contest": "ath-m-marathon-final", "status": "final", "entries": [
            {"competitor": "p036", "place": 1, "mark": "not a time", "award": "gold"}
        ]}
    ]});
    let (status, body) = admin(&s, "POST", "/v1/admin/batches", Some(bad)).await;
    assert_eq!(status, 422);
    assert!(
        body["error"]["message"].as_str().unwrap().contains("mark"),
        "{body}"
    );
    // Malformed JSON is a 400 in the usual format.
    let r = s
        .client
        .post(s.url("/v1/admin/batches"))
        .bearer_auth(TOKEN)
        .header("content-type", "application/json")
        .body("{\"changes\": [")
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 400);
}

#[tokio::test]
async fn a_replacement_that_removes_most_records_is_refused_unless_forced() {
    let s = Server::start(admin_server_engine()).await;
    let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/games");
    let scenario: Value =
        serde_json::from_str(&std::fs::read_to_string(dir.join("scenario.json")).unwrap()).unwrap();
    let empty = json!({
        "scenario": scenario, "sports": [], "groups": [], "competitors": [], "contests": [],
    });
    let (status, body) = admin(&s, "PUT", "/v1/admin/dataset", Some(empty.clone())).await;
    assert_eq!(status, 422, "{body}");
    let msg = body["error"]["message"].as_str().unwrap();
    for file in [
        "sports.json",
        "groups.json",
        "competitors.json",
        "contests.json",
    ] {
        assert!(msg.contains(file), "{file}: {msg}");
    }
    assert!(msg.contains("removes 300 of 300 competitors"), "{msg}");
    let (_, st) = admin(&s, "GET", "/v1/admin/status", None).await;
    assert_eq!(st["dataset_version"], 1);
    // Forced, it is checked like any dataset and served.
    let (status, body) = admin(&s, "PUT", "/v1/admin/dataset?force=true", Some(empty)).await;
    assert_eq!(status, 200, "{body}");
    assert_eq!(body["dataset_version"], 2);
}

#[tokio::test]
async fn a_whole_dataset_is_replaced_and_its_version_moves_on() {
    let s = Server::start(admin_server_engine()).await;
    let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/games");
    let read = |f: &str| -> Value {
        serde_json::from_str(&std::fs::read_to_string(dir.join(f)).unwrap()).unwrap()
    };
    let mut scenario = read("scenario.json");
    scenario["as_of"] = json!("2027-08-14T22:00:00+01:00");
    let records = json!({
        "scenario": scenario,
        "sports": read("sports.json"),
        "groups": read("groups.json"),
        "competitors": read("competitors.json"),
        "contests": read("contests.json"),
    });
    assert!(
        records.to_string().len() > 64 * 1024,
        "bigger than a reader's message limit"
    );
    let (status, body) = admin(&s, "PUT", "/v1/admin/dataset", Some(records.clone())).await;
    assert_eq!(status, 200, "{body}");
    assert_eq!(body["dataset_version"], 2);
    let (_, a) = s.ask("reader-replaced", "medal table").await;
    assert_eq!(a["as_of"], "2027-08-14T22:00:00+01:00");
    // Records that do not agree are refused whole.
    let mut broken = records;
    broken["competitors"][0]["group"] = json!("atlantis");
    let (status, body) = admin(&s, "PUT", "/v1/admin/dataset", Some(broken)).await;
    assert_eq!(status, 422);
    assert!(
        body["error"]["message"]
            .as_str()
            .unwrap()
            .contains("atlantis"),
        "{body}"
    );
    let (_, st) = admin(&s, "GET", "/v1/admin/status", None).await;
    assert_eq!(st["dataset_version"], 2);
}

/// Readers keep asking while batches land: no request fails, each answer
/// comes from one whole version (versions only go up), and answers come
/// from many of the versions in between.
#[tokio::test(flavor = "multi_thread", worker_threads = 4)]
async fn questions_are_answered_while_batches_are_applied() {
    let s = Arc::new(Server::start(admin_server_engine()).await);
    // How many questions have been answered, so each batch waits until some
    // were asked since the last one: the two really interleave.
    let answered = Arc::new(std::sync::atomic::AtomicUsize::new(0));
    let done = Arc::new(std::sync::atomic::AtomicBool::new(false));
    let asker = {
        let s = s.clone();
        let answered = answered.clone();
        let done = done.clone();
        tokio::spawn(async move {
            let mut last = 0;
            let mut asked = 0;
            let mut versions = std::collections::BTreeSet::new();
            let mut i = 0;
            while !done.load(std::sync::atomic::Ordering::SeqCst) {
                i += 1;
                let (status, a) = s
                    .ask(
                        &format!("reader-{}", i % 7),
                        "who is leading the men's marathon?",
                    )
                    .await;
                assert_eq!(status, 200, "{a}");
                let v = a["dataset_version"].as_u64().unwrap();
                assert!(v >= last, "version went back from {last} to {v}");
                last = v;
                versions.insert(v);
                asked += 1;
                answered.fetch_add(1, std::sync::atomic::Ordering::SeqCst);
            }
            (asked, versions.len())
        })
    };
    for k in 0..20 {
        let before = answered.load(std::sync::atomic::Ordering::SeqCst);
        common::wait_until(
            "questions between batches",
            std::time::Duration::from_secs(10),
            || {
                let answered = answered.clone();
                async move { answered.load(std::sync::atomic::Ordering::SeqCst) >= before + 5 }
            },
        )
        .await;
        let batch = json!({"changes": [
            {"change": "results", "contest": "ath-m-marathon-final",
             "updated": format!("2027-08-14T21:{:02}:00+01:00", 10 + k)}
        ]});
        let (status, body) = admin(&s, "POST", "/v1/admin/batches", Some(batch)).await;
        assert_eq!(status, 200, "{body}");
    }
    done.store(true, std::sync::atomic::Ordering::SeqCst);
    let (asked, versions_seen) = asker.await.unwrap();
    assert!(asked >= 100, "only {asked} questions");
    assert!(
        versions_seen >= 10,
        "answers came from {versions_seen} versions"
    );
    let (_, st) = admin(&s, "GET", "/v1/admin/status", None).await;
    assert_eq!(st["dataset_version"], 21);
}

/// A live figure not updated for longer than the configured time says how
/// old it is; a fresh one does not.
#[tokio::test]
async fn an_old_live_figure_says_how_old_it_is() {
    let at = |now: &str, stale_secs: u64| {
        let mut settings = test_settings();
        settings.clock = tidings::engine::Clock::Fixed(now.parse().unwrap());
        settings.stale_after = std::time::Duration::from_secs(stale_secs);
        engine_with(Arc::new(MemoryStore::new()), settings)
    };
    let q = "who is leading the men's marathon?";
    // The marathon was last updated at 21:02.
    let fresh = at("2027-08-14T21:10:00+01:00", 600)
        .handle("r", "chat", q)
        .await
        .unwrap();
    assert!(!fresh.reply.text.contains("ago"), "{}", fresh.reply.text);
    let old = at("2027-08-14T21:45:00+01:00", 600)
        .handle("r", "chat", q)
        .await
        .unwrap();
    assert!(
        old.reply.text.contains("(as of 21:02, 43 minutes ago)"),
        "{}",
        old.reply.text
    );
    let spoken = at("2027-08-14T21:45:00+01:00", 600)
        .handle("r", "voice", "who won the men's marathon?")
        .await
        .unwrap();
    assert!(
        spoken
            .reply
            .text
            .contains("last updated forty-three minutes ago"),
        "{}",
        spoken.reply.text
    );
    // A longer threshold: the same figure is not yet old.
    let patient = at("2027-08-14T21:45:00+01:00", 3600)
        .handle("r", "chat", q)
        .await
        .unwrap();
    assert!(
        !patient.reply.text.contains("ago"),
        "{}",
        patient.reply.text
    );
}

/// Questions that got no answer are listed for editors, most frequent
/// first, grouped by normalised text, with no reader ids; `tidings
/// unanswered` lists the same from Redis.
#[tokio::test]
async fn the_unanswered_list_counts_questions_without_readers() {
    let prefix = common::test_prefix("unanswered");
    let mut settings = test_settings();
    settings.admin_token = Some(TOKEN.into());
    let store =
        Arc::new(tidings::dialogue::RedisStore::new(&common::redis_url(), &prefix).unwrap());
    let s = Server::start(engine_with(store, settings)).await;
    for (user, text) in [
        ("+44 7700 900001", "What is the weather like?"),
        ("+44 7700 900002", "what is the WEATHER like"),
        (
            "+44 7700 900003",
            "call me on +44 7700 900123 or jane.doe@example.com",
        ),
    ] {
        s.ask(user, text).await;
    }
    // Asked back about, then left for another question.
    s.ask("+44 7700 900004", "when does Zoe compete next?")
        .await;
    s.ask("+44 7700 900004", "who leads the medal table?").await;
    // Asked back about and answered: not on the list.
    s.ask("+44 7700 900005", "how did Zoe do?").await;
    s.ask("+44 7700 900005", "the rower").await;

    // The list is written in the background: wait for all four entries.
    common::wait_until(
        "the list to fill",
        std::time::Duration::from_secs(5),
        || {
            let s = &s;
            async move {
                let (_, body) = admin(s, "GET", "/v1/admin/unanswered?limit=10", None).await;
                body["unanswered"].as_array().is_some_and(|r| r.len() >= 3)
            }
        },
    )
    .await;
    let (status, body) = admin(&s, "GET", "/v1/admin/unanswered?limit=10", None).await;
    assert_eq!(status, 200, "{body}");
    let (status, bad) = admin(&s, "GET", "/v1/admin/unanswered?limit=lots", None).await;
    assert_eq!(
        (status, bad["error"]["code"].as_str()),
        (422, Some("bad_limit"))
    );
    let rows = body["unanswered"].as_array().unwrap();
    assert_eq!(rows[0]["text"], "what is the weather like");
    assert_eq!(rows[0]["count"], 2);
    assert_eq!(rows[0]["kind"], "not_covered");
    assert!(
        rows.iter()
            .any(|r| r["kind"] == "abandoned" && r["text"] == "when does zoe compete next"),
        "{body}"
    );
    assert!(
        !rows
            .iter()
            .any(|r| r["text"].as_str().unwrap().contains("how did zoe")),
        "{body}"
    );
    assert!(
        !body.to_string().contains("7700"),
        "no reader ids or numbers: {body}"
    );
    assert!(
        !body.to_string().contains("jane"),
        "no e-mail addresses: {body}"
    );
    assert!(
        rows.iter()
            .any(|r| r["text"] == "call me on number or address"),
        "{body}"
    );

    let out = std::process::Command::new(env!("CARGO_BIN_EXE_tidings"))
        .args([
            "unanswered",
            "--redis-url",
            &common::redis_url(),
            "--redis-prefix",
            &prefix,
        ])
        .output()
        .unwrap();
    assert!(out.status.success());
    let text = String::from_utf8_lossy(&out.stdout);
    let first = text.lines().nth(1).unwrap_or_default();
    assert!(
        first.contains("2") && first.contains("what is the weather like"),
        "{text}"
    );
}

#[tokio::test]
async fn the_exported_dataset_restores_what_was_served() {
    let s = Server::start(admin_server_engine()).await;
    let (status, _) = admin(&s, "POST", "/v1/admin/batches", Some(marathon_final())).await;
    assert_eq!(status, 200);
    let r = s
        .client
        .get(s.url("/v1/admin/dataset"))
        .bearer_auth(TOKEN)
        .send()
        .await
        .unwrap();
    assert_eq!(r.status().as_u16(), 200);
    assert!(r.headers().get("tidings-dataset-version").is_some());
    let exported: Value = r.json().await.unwrap();
    for part in ["scenario", "sports", "groups", "competitors", "contests"] {
        assert!(!exported[part].is_null(), "the export has {part}");
    }
    // The batch is in the export, and the export is a valid replacement.
    let marathon = exported["contests"]
        .as_array()
        .unwrap()
        .iter()
        .find(|c| c["id"] == "ath-m-marathon-final")
        .expect("the marathon is exported");
    assert_eq!(marathon["status"], "final");
    let (status, body) = admin(&s, "PUT", "/v1/admin/dataset", Some(exported.clone())).await;
    assert_eq!(status, 200, "{body}");
    let again: Value = s
        .client
        .get(s.url("/v1/admin/dataset"))
        .bearer_auth(TOKEN)
        .send()
        .await
        .unwrap()
        .json()
        .await
        .unwrap();
    assert_eq!(again["contests"], exported["contests"]);
    assert_eq!(again["competitors"], exported["competitors"]);
    // Without the token, nothing is exported.
    let r = s
        .client
        .get(s.url("/v1/admin/dataset"))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status().as_u16(), 401);
}

/// Posts a batch as raw text, so that its lines and columns are known.
async fn post_text(s: &Server, body: &str) -> (u16, Value) {
    let r = s
        .client
        .post(s.url("/v1/admin/batches"))
        .bearer_auth(TOKEN)
        .header("content-type", "application/json")
        .body(body.to_string())
        .send()
        .await
        .unwrap();
    (r.status().as_u16(), r.json().await.unwrap())
}

#[tokio::test]
async fn a_refused_batch_names_each_field_at_its_line_and_column() {
    let s = Server::start(admin_server_engine()).await;
    let body = concat!(
        "{\"changes\": [\n",
        "  {\"change\": \"schedule\", \"contest\": \"no-such-race\", \"venue\": \"Nowhere\"},\n",
        "  {\"change\": \"results\", \"contest\": \"ath-m-marathon-final\", \"status\": \"final\",\n",
        "   \"entries\": [{\"competitor\": \"p036\", \"place\": 1, \"mark\": \"slow\", \"award\": \"gold\"}]}\n",
        "]}\n"
    );
    let (status, reply) = post_text(&s, body).await;
    assert_eq!(status, 422, "{reply}");
    assert_eq!(reply["error"]["code"], "invalid_batch");
    let msg = reply["error"]["message"].as_str().unwrap();
    // Line 2, where "no-such-race" starts; line 4, where "slow" starts.
    let col =
        |line: usize, value: &str| body.lines().nth(line - 1).unwrap().find(value).unwrap() + 1;
    assert!(
        msg.contains(&format!(
            "batch:2:{}: record change 1: field contest: no contest \"no-such-race\"",
            col(2, "\"no-such-race\"")
        )),
        "{msg}"
    );
    assert!(
        msg.contains(&format!(
            "batch:4:{}: record change 2 (contests.json ath-m-marathon-final entry 1): field mark:",
            col(4, "\"slow\"")
        )),
        "{msg}"
    );

    // A change that does not fit the format: 422, at the value refused.
    let body = "{\"changes\": [\n  {\"change\": \"results\", \"contest\": \"x\", \"status\": \"done\"}\n]}";
    let (status, reply) = post_text(&s, body).await;
    assert_eq!(status, 422, "{reply}");
    assert_eq!(reply["error"]["code"], "invalid_body");
    let msg = reply["error"]["message"].as_str().unwrap();
    assert!(
        msg.starts_with(&format!(
            "batch:2:{}: record change 1: unknown variant `done`",
            col_of(body, 2, "\"done\"")
        )),
        "{msg}"
    );

    // Broken JSON: 400, at serde's line and column.
    let (status, reply) = post_text(&s, "{\"changes\": [\n  {\"change\": }\n]}").await;
    assert_eq!(status, 400, "{reply}");
    assert_eq!(reply["error"]["code"], "malformed_json");
    assert!(
        reply["error"]["message"]
            .as_str()
            .unwrap()
            .starts_with("batch:2:14: expected value"),
        "{reply}"
    );
    let (_, st) = admin(&s, "GET", "/v1/admin/status", None).await;
    assert_eq!(st["dataset_version"], 1);
}

fn col_of(text: &str, line: usize, value: &str) -> usize {
    text.lines().nth(line - 1).unwrap().find(value).unwrap() + 1
}

#[tokio::test]
async fn a_refused_dataset_names_each_record_at_its_line_and_column() {
    let s = Server::start(admin_server_engine()).await;
    let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/games");
    let read = |f: &str| -> Value {
        serde_json::from_str(&std::fs::read_to_string(dir.join(f)).unwrap()).unwrap()
    };
    let mut competitors = read("competitors.json");
    competitors[4]["group"] = json!("atlantis");
    let id = competitors[4]["id"].as_str().unwrap().to_string();
    let body = serde_json::to_string_pretty(&json!({
        "scenario": read("scenario.json"), "sports": read("sports.json"),
        "groups": read("groups.json"), "competitors": competitors,
        "contests": read("contests.json"),
    }))
    .unwrap();
    let r = s
        .client
        .put(s.url("/v1/admin/dataset"))
        .bearer_auth(TOKEN)
        .header("content-type", "application/json")
        .body(body.clone())
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 422);
    let reply: Value = r.json().await.unwrap();
    assert_eq!(reply["error"]["code"], "invalid_dataset");
    let (line, text) = body
        .lines()
        .enumerate()
        .find(|(_, l)| l.contains("\"atlantis\""))
        .unwrap();
    let want = format!(
        "dataset:{}:{}: record competitors.json {id}: field group: no group with id \"atlantis\"",
        line + 1,
        text.find("\"atlantis\"").unwrap() + 1
    );
    let msg = reply["error"]["message"].as_str().unwrap();
    assert!(msg.contains(&want), "{want}\n{msg}");

    // A record that does not fit the format: each one, at its place.
    let broken = body.replacen("\"status\": \"final\"", "\"status\": \"over\"", 2);
    let r = s
        .client
        .put(s.url("/v1/admin/dataset"))
        .bearer_auth(TOKEN)
        .header("content-type", "application/json")
        .body(broken)
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 422);
    let reply: Value = r.json().await.unwrap();
    assert_eq!(reply["error"]["code"], "invalid_body");
    let msg = reply["error"]["message"].as_str().unwrap();
    assert_eq!(msg.matches("unknown variant `over`").count(), 2, "{msg}");
    assert!(msg.starts_with("dataset:"), "{msg}");
}
