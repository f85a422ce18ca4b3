//! Who may use the service, over a real socket: client keys (rotation,
//! a rate limit per key, the desk behind a desk key or the admin token),
//! signed messages (good, bad, stale, replayed) and CORS for a browser
//! widget.

mod common;

use std::sync::Arc;
use std::time::Duration;

use base64::Engine as _;
use common::{engine_with, test_settings, ServeProcess, Server};
use serde_json::{json, Value};
use tidings::dialogue::MemoryStore;
use tidings::http::signature::{self, Signing};
use tidings::http::{ClientKeys, Cors, Edge, Rate};

const ADMIN: &str = "admin-token-for-tests-0123456789";
const OLD_KEY: &str = "chat-old-key-0123456789";
const NEW_KEY: &str = "chat-new-key-0123456789";
const SMS_KEY: &str = "sms-gateway-key-0123456789";
const DESK_KEY: &str = "desk-key-for-editors-0123";
const SECRET: &[u8] = b"signing-secret-for-tests-0123";

fn keys() -> ClientKeys {
    ClientKeys::parse([
        format!("chat-app {OLD_KEY}").as_str(),
        format!("chat-app {NEW_KEY}").as_str(),
        // Its digest only, as a key file may hold it.
        format!(
            "sms-gateway sha256:{} rate=0.001 burst=2",
            hex::encode(tidings::http::keys::digest(SMS_KEY))
        )
        .as_str(),
        format!("desk {DESK_KEY} desk").as_str(),
    ])
    .expect("the test keys parse")
}

fn admin_engine() -> tidings::engine::Engine {
    let mut settings = test_settings();
    settings.admin_token = Some(ADMIN.into());
    engine_with(Arc::new(MemoryStore::new()), settings)
}

async fn keyed_server() -> Server {
    Server::start_with(
        admin_engine(),
        Edge {
            keys: keys(),
            ..Edge::without_rate_limits()
        },
    )
    .await
}

async fn send(s: &Server, auth: Option<&str>) -> reqwest::Response {
    let mut req = s
        .client
        .post(s.url("/v1/messages"))
        .json(&json!({"user": "reader-keyed", "text": "hello"}));
    if let Some(a) = auth {
        req = req.header("authorization", a);
    }
    req.send().await.unwrap()
}

/// Status and error code of a reply in the service's error shape.
async fn refused(r: reqwest::Response) -> (u16, String) {
    let status = r.status().as_u16();
    let body: Value = r.json().await.unwrap();
    assert!(body["error"]["message"].is_string(), "{body}");
    (status, body["error"]["code"].as_str().unwrap().to_string())
}

fn basic(password: &str) -> String {
    let pair = format!("editor:{password}");
    format!(
        "Basic {}",
        base64::engine::general_purpose::STANDARD.encode(pair)
    )
}

#[tokio::test]
async fn with_keys_a_message_needs_a_valid_one_and_both_keys_of_a_rotation_work() {
    let s = keyed_server().await;
    assert_eq!(
        refused(send(&s, None).await).await,
        (401, "missing_key".into())
    );
    assert_eq!(
        refused(send(&s, Some("Bearer chat-old-key-012345678X")).await).await,
        (401, "bad_key".into())
    );
    assert_eq!(
        refused(send(&s, Some("Token whatever")).await).await,
        (401, "missing_key".into())
    );
    for key in [OLD_KEY, NEW_KEY, SMS_KEY] {
        let r = send(&s, Some(&format!("Bearer {key}"))).await;
        assert_eq!(r.status(), 200, "{key}");
    }
    // Erasure is reader-facing too.
    let erase = |auth: Option<String>| {
        let s = &s;
        async move {
            let mut req = s.client.delete(s.url("/v1/users/chat/reader-keyed"));
            if let Some(a) = auth {
                req = req.header("authorization", a);
            }
            req.send().await.unwrap()
        }
    };
    assert_eq!(
        refused(erase(None).await).await,
        (401, "missing_key".into())
    );
    assert_eq!(erase(Some(format!("Bearer {NEW_KEY}"))).await.status(), 204);
    // Health checks and the admin API keep their own rules.
    let health = s.client.get(s.url("/healthz")).send().await.unwrap();
    assert_eq!(health.status(), 200);
    let status = s
        .client
        .get(s.url("/v1/admin/status"))
        .bearer_auth(ADMIN)
        .send()
        .await
        .unwrap();
    assert_eq!(status.status(), 200);
}

#[tokio::test]
async fn each_key_has_its_own_rate_limit() {
    let s = keyed_server().await;
    // The sms gateway's key allows two at once and no more for a while.
    for _ in 0..2 {
        assert_eq!(
            send(&s, Some(&format!("Bearer {SMS_KEY}"))).await.status(),
            200
        );
    }
    let r = send(&s, Some(&format!("Bearer {SMS_KEY}"))).await;
    assert!(r.headers().contains_key("retry-after"));
    assert_eq!(refused(r).await, (429, "rate_limited".into()));
    // The chat app's keys share their name's default limit, untouched.
    assert_eq!(
        send(&s, Some(&format!("Bearer {OLD_KEY}"))).await.status(),
        200
    );
}

#[tokio::test]
async fn a_default_per_key_rate_applies_to_keys_without_their_own() {
    let s = Server::start_with(
        common::demo_engine(),
        Edge {
            keys: keys(),
            rates: tidings::http::Rates {
                per_key: Some(Rate::new(0.001, 3.0)),
                ..Edge::without_rate_limits().rates
            },
            ..Edge::without_rate_limits()
        },
    )
    .await;
    // Old and new keys of one name draw on one bucket.
    for key in [OLD_KEY, NEW_KEY, OLD_KEY] {
        assert_eq!(send(&s, Some(&format!("Bearer {key}"))).await.status(), 200);
    }
    let r = send(&s, Some(&format!("Bearer {NEW_KEY}"))).await;
    assert_eq!(refused(r).await, (429, "rate_limited".into()));
}

#[tokio::test]
async fn the_desk_needs_a_desk_key_or_the_admin_token() {
    let s = keyed_server().await;
    for path in ["/desk", "/desk/desk.js"] {
        let r = s.client.get(s.url(path)).send().await.unwrap();
        assert_eq!(
            r.headers()["www-authenticate"],
            "Basic realm=\"tidings desk\", charset=\"UTF-8\""
        );
        assert_eq!(refused(r).await, (401, "desk_locked".into()), "{path}");
    }
    // A client key that is not a desk key does not open it.
    let r = s
        .client
        .get(s.url("/desk"))
        .header("authorization", basic(OLD_KEY))
        .send()
        .await
        .unwrap();
    assert_eq!(refused(r).await, (401, "desk_locked".into()));
    for password in [DESK_KEY, ADMIN] {
        let r = s
            .client
            .get(s.url("/desk"))
            .header("authorization", basic(password))
            .send()
            .await
            .unwrap();
        assert_eq!(r.status(), 200);
        assert!(r.text().await.unwrap().contains("<option"));
        // The page's own messages go with the browser's Basic credentials.
        assert_eq!(send(&s, Some(&basic(password))).await.status(), 200);
    }
}

#[tokio::test]
async fn the_desk_is_behind_the_admin_token_alone_when_there_are_no_keys() {
    let s = Server::start(admin_engine()).await;
    let r = s.client.get(s.url("/desk")).send().await.unwrap();
    assert_eq!(refused(r).await, (401, "desk_locked".into()));
    let r = s
        .client
        .get(s.url("/desk"))
        .bearer_auth(ADMIN)
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
    // Messages stay open: no keys are configured.
    assert_eq!(send(&s, None).await.status(), 200);
    // With neither, the desk is open as before.
    let open = Server::start(common::demo_engine()).await;
    let r = open.client.get(open.url("/desk")).send().await.unwrap();
    assert_eq!(r.status(), 200);
}

fn now() -> i64 {
    std::time::SystemTime::now()
        .duration_since(std::time::UNIX_EPOCH)
        .unwrap()
        .as_secs() as i64
}

async fn signed_server() -> Server {
    Server::start_with(
        common::demo_engine(),
        Edge {
            signing: Some(Arc::new(Signing::new(
                vec![b"retired-secret-0123456789".to_vec(), SECRET.to_vec()],
                signature::DEFAULT_WINDOW,
                signature::DEFAULT_SEEN,
            ))),
            ..Edge::without_rate_limits()
        },
    )
    .await
}

async fn post_signed(
    s: &Server,
    body: &str,
    ts: Option<i64>,
    sig: Option<&str>,
) -> reqwest::Response {
    let mut req = s
        .client
        .post(s.url("/v1/messages"))
        .header("content-type", "application/json")
        .body(body.to_string());
    if let Some(ts) = ts {
        req = req.header(signature::TIMESTAMP_HEADER, ts.to_string());
    }
    if let Some(sig) = sig {
        req = req.header(signature::SIGNATURE_HEADER, sig);
    }
    req.send().await.unwrap()
}

#[tokio::test]
async fn signed_messages_pass_once_and_bad_stale_or_replayed_ones_are_refused() {
    let s = signed_server().await;
    let body = r#"{"user": "reader-signed", "text": "who won the women's long jump?"}"#;
    let ts = now();
    let good = signature::sign(SECRET, ts, body.as_bytes());
    let r = post_signed(&s, body, Some(ts), Some(&good)).await;
    assert_eq!(r.status(), 200);
    let reply: Value = r.json().await.unwrap();
    assert_eq!(
        reply["intent"], "podium",
        "the body reached the handler whole"
    );
    // The same request again, as a captured one would be.
    let r = post_signed(&s, body, Some(ts), Some(&good)).await;
    assert_eq!(refused(r).await, (401, "replayed_signature".into()));
    // Unsigned, signed under another secret, or over another body.
    let r = post_signed(&s, body, None, None).await;
    assert_eq!(refused(r).await, (401, "missing_signature".into()));
    let wrong = signature::sign(b"someone-elses-secret-01", ts, body.as_bytes());
    let r = post_signed(&s, body, Some(ts), Some(&wrong)).await;
    assert_eq!(refused(r).await, (401, "bad_signature".into()));
    let tampered = body.replace("long jump", "marathon");
    let r = post_signed(&s, &tampered, Some(ts), Some(&good)).await;
    assert_eq!(refused(r).await, (401, "bad_signature".into()));
    // Signed properly, but ten minutes ago.
    let old = ts - 600;
    let stale = signature::sign(SECRET, old, body.as_bytes());
    let r = post_signed(&s, body, Some(old), Some(&stale)).await;
    assert_eq!(refused(r).await, (401, "stale_signature".into()));
    // The retired secret still passes during a rotation.
    let body2 = r#"{"user": "reader-signed", "text": "hello"}"#;
    let retired = signature::sign(b"retired-secret-0123456789", ts, body2.as_bytes());
    assert_eq!(
        post_signed(&s, body2, Some(ts), Some(&retired))
            .await
            .status(),
        200
    );
    // Other routes are not signed.
    let r = s.client.get(s.url("/healthz")).send().await.unwrap();
    assert_eq!(r.status(), 200);
}

#[tokio::test]
async fn a_signed_body_over_the_limit_is_413_in_the_error_shape() {
    let s = signed_server().await;
    let body = format!(r#"{{"user": "r", "text": "{}"}}"#, "a".repeat(20 * 1024));
    let ts = now();
    let sig = signature::sign(SECRET, ts, body.as_bytes());
    let r = post_signed(&s, &body, Some(ts), Some(&sig)).await;
    assert_eq!(refused(r).await, (413, "body_too_large".into()));
}

const WIDGET: &str = "https://news.example";

async fn cors_server() -> Server {
    Server::start_with(
        common::demo_engine(),
        Edge {
            cors: Cors::new([WIDGET, "http://localhost:3000"]).unwrap(),
            keys: keys(),
            ..Edge::without_rate_limits()
        },
    )
    .await
}

async fn preflight(s: &Server, origin: &str) -> reqwest::Response {
    s.client
        .request(reqwest::Method::OPTIONS, s.url("/v1/messages"))
        .header("origin", origin)
        .header("access-control-request-method", "POST")
        .header(
            "access-control-request-headers",
            "content-type,authorization",
        )
        .send()
        .await
        .unwrap()
}

#[tokio::test]
async fn a_listed_origin_gets_its_preflight_answered_and_others_get_no_cors_headers() {
    let s = cors_server().await;
    // The preflight carries no key and needs none.
    let r = preflight(&s, WIDGET).await;
    assert_eq!(r.status(), 200);
    let h = r.headers();
    assert_eq!(h["access-control-allow-origin"], WIDGET);
    let methods = h["access-control-allow-methods"].to_str().unwrap();
    assert!(methods.contains("POST"), "{methods}");
    let allowed = h["access-control-allow-headers"]
        .to_str()
        .unwrap()
        .to_lowercase();
    assert!(
        allowed.contains("content-type") && allowed.contains("authorization"),
        "{allowed}"
    );
    assert_eq!(h["access-control-max-age"], "600");
    let vary = h
        .get_all("vary")
        .iter()
        .map(|v| v.to_str().unwrap().to_lowercase())
        .collect::<Vec<_>>()
        .join(",");
    assert!(vary.contains("origin"), "{vary}");
    // An origin not listed: no allow-origin, so the browser refuses.
    let r = preflight(&s, "https://elsewhere.example").await;
    assert!(!r.headers().contains_key("access-control-allow-origin"));
    // The request itself, from the widget, with its key.
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .header("origin", WIDGET)
        .bearer_auth(NEW_KEY)
        .json(&json!({"user": "reader-widget", "text": "hello"}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
    assert_eq!(r.headers()["access-control-allow-origin"], WIDGET);
    let exposed = r.headers()["access-control-expose-headers"]
        .to_str()
        .unwrap();
    assert!(exposed.contains("tidings-repeated"), "{exposed}");
    assert!(exposed.contains("x-request-id"), "{exposed}");
    // Refusals carry the headers too, so the widget can read the error.
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .header("origin", WIDGET)
        .json(&json!({"user": "reader-widget", "text": "hello"}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.headers()["access-control-allow-origin"], WIDGET);
    assert_eq!(refused(r).await, (401, "missing_key".into()));
}

#[tokio::test]
async fn without_origins_there_are_no_cors_headers() {
    let s = Server::start(common::demo_engine()).await;
    let r = preflight(&s, WIDGET).await;
    assert!(!r.headers().contains_key("access-control-allow-origin"));
    assert_eq!(refused(r).await, (405, "method_not_allowed".into()));
    let r = s
        .client
        .post(s.url("/v1/messages"))
        .header("origin", WIDGET)
        .json(&json!({"user": "reader-widget", "text": "hello"}))
        .send()
        .await
        .unwrap();
    assert_eq!(r.status(), 200);
    assert!(r
        .headers()
        .keys()
        .all(|k| !k.as_str().starts_with("access-control-")));
}

/// The serve command: keys from a file and from the environment, logged
/// by name only; without keys a warning says the API is open.
#[tokio::test(flavor = "multi_thread", worker_threads = 2)]
async fn serve_reads_keys_from_a_file_and_the_environment_and_logs_names_only() {
    let bin = env!("CARGO_BIN_EXE_tidings");
    let dir = std::env::temp_dir().join(format!("tidings-keys-{:016x}", rand::random::<u64>()));
    std::fs::create_dir_all(&dir).unwrap();
    let file = dir.join("keys");
    std::fs::write(
        &file,
        format!("# integrations\nchat-app {OLD_KEY} rate=0.001 burst=1\n"),
    )
    .unwrap();
    let env_keys = format!("sms-gateway {SMS_KEY},chat-app {NEW_KEY} rate=0.001 burst=1");
    let server = ServeProcess::start(
        bin,
        &["--client-keys-file", file.to_str().unwrap()],
        &[("TIDINGS_CLIENT_KEYS", &env_keys)],
    );
    let client = reqwest::Client::new();
    let post = |key: &'static str| {
        let client = &client;
        let base = &server.base;
        async move {
            client
                .post(format!("{base}/v1/messages"))
                .bearer_auth(key)
                .json(&json!({"user": "reader-serve", "text": "hello"}))
                .send()
                .await
                .unwrap()
                .status()
                .as_u16()
        }
    };
    assert_eq!(post(SMS_KEY).await, 200);
    assert_eq!(post(OLD_KEY).await, 200);
    // The old and the new key of the chat app share its burst of one.
    assert_eq!(post(NEW_KEY).await, 429);
    assert_eq!(post("not-a-key-at-all-0000").await, 401);
    tokio::time::sleep(Duration::from_millis(100)).await;
    let log = server.stop();
    assert!(log.contains("client keys required"), "{log}");
    assert!(log.contains("chat-app,sms-gateway"), "{log}");
    assert!(log.contains("key=chat-app"), "{log}");
    for secret in [OLD_KEY, NEW_KEY, SMS_KEY] {
        assert!(!log.contains(secret), "a key is in the log:\n{log}");
    }
    assert!(!log.contains("message API is open") && !log.contains("are open to anyone"));

    let open = ServeProcess::start(bin, &[], &[]);
    let log = open.stop();
    let warning = log
        .lines()
        .find(|l| l.contains("no client keys configured"))
        .unwrap_or_else(|| panic!("no warning that the API is open:\n{log}"));
    assert!(warning.contains("WARN"), "{warning}");
    assert_eq!(log.matches("no client keys configured").count(), 1);

    // A broken key file stops the start, naming the line but not the key.
    std::fs::write(&file, "chat-app short\n").unwrap();
    let out = std::process::Command::new(bin)
        .args(["serve", "--listen", "127.0.0.1:0", "--client-keys-file"])
        .arg(&file)
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(1));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains(&format!("{}:1:", file.display())), "{err}");
    assert!(err.contains("at least 16 characters"), "{err}");
    let _ = std::fs::remove_dir_all(&dir);
}

/// The key file shown in docs/api.md is one the service takes.
#[test]
fn the_key_file_example_in_the_api_docs_parses() {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let doc = std::fs::read_to_string(root.join("docs/api.md")).unwrap();
    let section = &doc[doc.find("## Client keys").expect("the section is there")..];
    let start = section
        .find("```text\n# NAME")
        .expect("the example is there")
        + "```text\n".len();
    let end = start + section[start..].find("```").unwrap();
    let keys = ClientKeys::parse(section[start..end].lines())
        .unwrap_or_else(|(line, e)| panic!("docs/api.md key example line {line}: {e}"));
    assert_eq!(keys.names(), ["chat-app", "sms-gateway", "desk"]);
}
