//! The deployment of deploy/compose.yaml as processes on this machine: two
//! `tidings serve` replicas with the compose file's settings on one Redis,
//! behind nginx configured by the same template compose mounts
//! (deploy/nginx/tidings.conf.template). Also the image's HEALTHCHECK
//! command against a live and a dead replica, and the sample Secret of
//! deploy/k8s refusing to serve.
//!
//! nginx comes from Debian's `nginx-light`, which tests/run.sh installs when
//! it is missing; `TIDINGS_NGINX` points the test at another copy. Without
//! nginx the test fails and says so; it never skips.

mod common;

use std::collections::BTreeMap;
use std::net::TcpListener;
use std::path::{Path, PathBuf};
use std::process::{Child, Command, Stdio};
use std::time::Duration;

use common::{redis_url, test_prefix, wait_until, ServeProcess, NOW};

fn root() -> &'static Path {
    Path::new(env!("CARGO_MANIFEST_DIR"))
}

fn read(rel: &str) -> String {
    std::fs::read_to_string(root().join(rel)).unwrap_or_else(|e| panic!("{rel}: {e}"))
}

fn yaml(rel: &str) -> serde_json::Value {
    serde_saphyr::from_str(&read(rel)).unwrap_or_else(|e| panic!("{rel} does not parse: {e}"))
}

/// A YAML mapping of plain settings as (name, value) pairs; values the
/// compose file takes from the operator's environment (`${...}`) are left
/// out, the test gives its own.
fn settings(map: &serde_json::Value) -> Vec<(String, String)> {
    map.as_object()
        .expect("a mapping of settings")
        .iter()
        .map(|(k, v)| {
            let v = match v {
                serde_json::Value::String(s) => s.clone(),
                other => other.to_string(),
            };
            (k.clone(), v)
        })
        .filter(|(_, v)| !v.contains("${"))
        .collect()
}

/// What envsubst does to the template when the nginx image starts: every
/// `${NAME}` of `values` replaced. A `${NAME}` left over is a name compose
/// does not give nginx, and fails the test.
fn render(template: &str, values: &BTreeMap<&str, String>) -> String {
    let mut out = template.to_string();
    for (name, value) in values {
        out = out.replace(&format!("${{{name}}}"), value);
    }
    let left: Vec<&str> = out
        .split("${")
        .skip(1)
        .filter_map(|rest| rest.split_once('}').map(|(name, _)| name))
        .filter(|name| !name.is_empty() && name.chars().all(|c| c.is_ascii_uppercase() || c == '_'))
        .collect();
    assert!(
        left.is_empty(),
        "the nginx template uses names compose.yaml does not set: {left:?}"
    );
    out
}

/// A port nobody listens on now, for nginx (which cannot be told port 0
/// and report back).
fn free_port() -> u16 {
    TcpListener::bind("127.0.0.1:0")
        .unwrap()
        .local_addr()
        .unwrap()
        .port()
}

fn nginx_bin() -> PathBuf {
    if let Ok(p) = std::env::var("TIDINGS_NGINX") {
        return PathBuf::from(p);
    }
    ["/usr/sbin/nginx", "/usr/local/sbin/nginx", "/usr/bin/nginx"]
        .iter()
        .map(PathBuf::from)
        .find(|p| p.exists())
        .unwrap_or_else(|| {
            panic!("nginx is not installed: run the tests with `bash tests/run.sh`, which installs nginx-light, or set TIDINGS_NGINX")
        })
}

/// nginx of the test's own, in a private folder, in front of `replicas`.
struct Proxy {
    child: Child,
    nginx: PathBuf,
    args: Vec<String>,
    dir: PathBuf,
    base: String,
}

impl Proxy {
    fn start(replicas: [&str; 2]) -> Proxy {
        let compose = yaml("deploy/compose.yaml");
        let lb_env = &compose["services"]["nginx"]["environment"];
        let port = free_port();
        // The compose file's names, the test's addresses.
        let values = BTreeMap::from([
            ("TIDINGS_REPLICA_A", replicas[0].to_string()),
            ("TIDINGS_REPLICA_B", replicas[1].to_string()),
            ("TIDINGS_PROXY_LISTEN", format!("127.0.0.1:{port}")),
        ]);
        let mut names: Vec<String> = settings(lb_env).into_iter().map(|(k, _)| k).collect();
        names.sort();
        let known: Vec<String> = values.keys().map(|k| k.to_string()).collect();
        assert_eq!(names, known, "the names compose.yaml gives nginx");
        let site = render(&read("deploy/nginx/tidings.conf.template"), &values);
        let dir = std::env::temp_dir().join(format!(
            "tidings-deploy-{}-{:08x}",
            std::process::id(),
            rand::random::<u32>()
        ));
        std::fs::create_dir_all(&dir).unwrap();
        std::fs::write(dir.join("tidings.conf"), site).unwrap();
        // What the nginx image's own nginx.conf provides around conf.d,
        // with every path inside the private folder.
        let d = dir.display();
        let main = format!(
            "daemon off;\nworker_processes 2;\npid {d}/nginx.pid;\nerror_log {d}/error.log warn;\n\
             events {{ worker_connections 256; }}\n\
             http {{\n  access_log off;\n  client_body_temp_path {d}/body;\n  proxy_temp_path {d}/proxy;\n\
             fastcgi_temp_path {d}/fastcgi;\n  uwsgi_temp_path {d}/uwsgi;\n  scgi_temp_path {d}/scgi;\n\
             include {d}/tidings.conf;\n}}\n"
        );
        std::fs::write(dir.join("nginx.conf"), main).unwrap();
        let nginx = nginx_bin();
        let conf = dir.join("nginx.conf");
        let args = |test: bool| {
            let mut a = vec![
                "-p".to_string(),
                dir.display().to_string(),
                "-e".to_string(),
                dir.join("error.log").display().to_string(),
                "-c".to_string(),
                conf.display().to_string(),
            ];
            if test {
                a.push("-t".into());
            }
            a
        };
        let check = Command::new(&nginx).args(args(true)).output().unwrap();
        assert!(
            check.status.success(),
            "nginx refuses the rendered template: {}",
            String::from_utf8_lossy(&check.stderr)
        );
        let child = Command::new(&nginx)
            .args(args(false))
            .stdout(Stdio::null())
            .stderr(Stdio::null())
            .spawn()
            .unwrap_or_else(|e| panic!("{} does not start: {e}", nginx.display()));
        Proxy {
            child,
            nginx,
            args: args(false),
            dir,
            base: format!("http://127.0.0.1:{port}"),
        }
    }

    fn error_log(&self) -> String {
        std::fs::read_to_string(self.dir.join("error.log")).unwrap_or_default()
    }
}

impl Drop for Proxy {
    fn drop(&mut self) {
        // A SIGKILL to the master would leave its workers serving: ask it
        // to stop (it ends the workers first), and kill only if it hangs.
        let _ = Command::new(&self.nginx)
            .args(&self.args)
            .args(["-s", "stop"])
            .stderr(Stdio::null())
            .status();
        for _ in 0..100 {
            if !matches!(self.child.try_wait(), Ok(None)) {
                break;
            }
            std::thread::sleep(Duration::from_millis(20));
        }
        let _ = self.child.kill();
        let _ = self.child.wait();
        let _ = std::fs::remove_dir_all(&self.dir);
    }
}

const ADMIN_TOKEN: &str = "deploy-test-admin-token-0123456789";

/// A replica as compose runs it: the compose file's settings for the
/// replicas, with the test's Redis, prefix and secrets, and debug logs so
/// the test can count the turns each one answered.
fn replica(prefix: &str) -> ServeProcess {
    let compose = yaml("deploy/compose.yaml");
    let env = settings(&compose["x-tidings"]["environment"]);
    assert!(
        env.iter()
            .any(|(k, v)| k == "TIDINGS_SOURCE_RATE" && v == "0"),
        "behind nginx the replicas leave per-source limits to the proxy: {env:?}"
    );
    let mut envs: Vec<(&str, &str)> = env
        .iter()
        // The test's own Redis and port, given as options below.
        .filter(|(k, _)| k != "TIDINGS_REDIS_URL" && k != "TIDINGS_LISTEN" && k != "TIDINGS_LOG")
        .map(|(k, v)| (k.as_str(), v.as_str()))
        .collect();
    envs.extend([
        ("TIDINGS_ID_SECRET", "deploy-test-secret"),
        ("TIDINGS_ADMIN_TOKEN", ADMIN_TOKEN),
        ("TIDINGS_LOG", "tidings=debug,tower_http=warn"),
    ]);
    let url = redis_url();
    ServeProcess::start(
        env!("CARGO_BIN_EXE_tidings"),
        &["--redis-url", &url, "--redis-prefix", prefix, "--now", NOW],
        &envs,
    )
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

/// How many turns a replica's debug log says it answered.
fn turns_in(log: &str) -> usize {
    log.lines()
        .filter(|l| l.contains("tidings::engine") && l.contains(": turn "))
        .count()
}

/// A conversation through the proxy: each turn must be answered (200, not
/// degraded) and name what it should.
async fn say(client: &reqwest::Client, proxy: &Proxy, i: usize, text: &str, wanted: &[&str]) {
    let r = client
        .post(format!("{}/v1/messages", proxy.base))
        .json(&serde_json::json!({
            "user": "+44 7700 900789", "text": text, "channel": "chat",
            "message_id": format!("deploy-{i}")
        }))
        .send()
        .await
        .unwrap();
    let status = r.status();
    let body: serde_json::Value = r.json().await.unwrap_or_default();
    assert_eq!(
        status,
        200,
        "turn {i} {text:?}: {body}\nnginx: {}",
        proxy.error_log()
    );
    assert_eq!(body["degraded"], false, "turn {i} {text:?}: {body}");
    let reply = body["text"].as_str().unwrap_or_default();
    for w in wanted {
        assert!(
            reply.contains(w),
            "turn {i} {text:?} → {reply:?} lacks {w:?}"
        );
    }
}

#[tokio::test]
async fn behind_nginx_a_conversation_alternates_replicas_and_outlives_one() {
    let prefix = test_prefix("deploy");
    let a = replica(&prefix);
    let b = replica(&prefix);
    let client = reqwest::Client::new();
    ready(&client, &a.base).await;
    ready(&client, &b.base).await;
    let addr = |s: &ServeProcess| s.base.trim_start_matches("http://").to_string();
    let proxy = Proxy::start([&addr(&a), &addr(&b)]);
    let health = format!("{}/healthz", proxy.base);
    wait_until("nginx to pass /healthz on", Duration::from_secs(10), || {
        let c = client.clone();
        let url = health.clone();
        async move { c.get(&url).send().await.is_ok_and(|r| r.status() == 200) }
    })
    .await;

    // Round robin sends consecutive turns to different replicas, so each
    // follow-up is answered by the replica that did not see the question.
    say(
        &client,
        &proxy,
        0,
        "who won the men's 400 m?",
        &["Larrel Trilunick"],
    )
    .await;
    say(&client, &proxy, 1, "and silver?", &["Nulan Bendand"]).await;
    say(
        &client,
        &proxy,
        2,
        "what about the women's?",
        &["Vonia Gassarace"],
    )
    .await;

    // One replica dies mid-conversation, without a chance to drain.
    let log_b = b.stop();
    let b_turns = turns_in(&log_b);
    assert!(
        (1..=2).contains(&b_turns),
        "round robin gave the second replica {b_turns} of the first 3 turns:\n{log_b}"
    );

    // nginx finds the dead replica refusing connections and passes the
    // turn to the live one, which has the conversation from Redis.
    say(
        &client,
        &proxy,
        3,
        "where is she from?",
        &["Vonia Gassarace", "Orrindel Isles"],
    )
    .await;
    say(
        &client,
        &proxy,
        4,
        "how many medals has she won?",
        &["Vonia Gassarace"],
    )
    .await;

    let log_a = a.stop();
    let a_turns = turns_in(&log_a);
    assert_eq!(
        a_turns,
        5 - b_turns,
        "every turn answered once, the last two by the survivor:\n{log_a}"
    );
    assert!(
        !log_a.contains("7700") && !log_b.contains("7700"),
        "a raw user id was logged"
    );
}

/// The HEALTHCHECK command of deploy/Dockerfile, as the container runtime
/// runs it (exec form, no shell of its own).
fn healthcheck_command() -> Vec<String> {
    let dockerfile = read("deploy/Dockerfile").replace("\\\n", " ");
    let line = dockerfile
        .lines()
        .find(|l| l.starts_with("HEALTHCHECK"))
        .expect("deploy/Dockerfile has a HEALTHCHECK");
    let json = &line[line.find("CMD [").expect("HEALTHCHECK CMD in exec form") + 4..];
    serde_json::from_str(json).unwrap_or_else(|e| panic!("HEALTHCHECK CMD is not JSON: {e}"))
}

fn healthcheck_passes(listen: &str) -> bool {
    let cmd = healthcheck_command();
    Command::new(&cmd[0])
        .args(&cmd[1..])
        .env("TIDINGS_LISTEN", listen)
        .stdout(Stdio::null())
        .stderr(Stdio::null())
        .status()
        .unwrap_or_else(|e| panic!("{} does not run: {e}", cmd[0]))
        .success()
}

#[test]
fn the_image_healthcheck_passes_on_a_live_replica_and_fails_on_a_dead_one() {
    let s = ServeProcess::start(env!("CARGO_BIN_EXE_tidings"), &["--now", NOW], &[]);
    let listen = s.base.trim_start_matches("http://").to_string();
    assert!(healthcheck_passes(&listen), "healthcheck on live {listen}");
    s.stop();
    assert!(!healthcheck_passes(&listen), "healthcheck on dead {listen}");
}

/// deploy/k8s/secret.yaml as it stands must not run a replica with a
/// token anyone can read in the repository.
#[test]
fn the_sample_secret_refuses_to_serve() {
    let secret = settings(&yaml("deploy/k8s/secret.yaml")["stringData"]);
    let config = settings(&yaml("deploy/k8s/configmap.yaml")["data"]);
    let out = Command::new(env!("CARGO_BIN_EXE_tidings"))
        .args(["serve", "--listen", "127.0.0.1:0"])
        .env_remove("TIDINGS_ADMIN_TOKEN")
        .envs(config.into_iter().filter(|(k, _)| k != "TIDINGS_LISTEN"))
        .envs(secret)
        .output()
        .unwrap();
    let stderr = String::from_utf8_lossy(&out.stderr);
    assert_eq!(out.status.code(), Some(1), "{stderr}");
    assert!(
        stderr.contains("--admin-token must be at least 16 characters"),
        "{stderr}"
    );
}
