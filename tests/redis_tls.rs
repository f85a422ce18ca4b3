//! Sessions over TLS: a redis-server of the test's own listening on TLS
//! only, with a certificate from a CA made here with openssl, reached by
//! `tidings serve --redis-url rediss://... --redis-ca`. Without the CA the
//! certificate is refused, so the test shows the connection is verified,
//! not merely encrypted.

mod common;

use std::path::{Path, PathBuf};
use std::process::{Child, Command, Stdio};
use std::time::Duration;

use common::ServeProcess;

const SECRET: &str = "id-secret-for-the-tls-test-0123456789";

fn run(cmd: &mut Command) {
    let out = cmd.output().expect("openssl runs");
    assert!(
        out.status.success(),
        "{cmd:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
}

/// A CA and a server certificate for 127.0.0.1 signed by it, in `dir`.
fn make_certificates(dir: &Path) {
    let at = |f: &str| dir.join(f);
    run(Command::new("openssl")
        .args([
            "req", "-x509", "-newkey", "rsa:2048", "-nodes", "-days", "2",
        ])
        .args(["-subj", "/CN=tidings test CA", "-keyout"])
        .arg(at("ca.key"))
        .arg("-out")
        .arg(at("ca.crt")));
    run(Command::new("openssl")
        .args([
            "req",
            "-newkey",
            "rsa:2048",
            "-nodes",
            "-subj",
            "/CN=127.0.0.1",
            "-keyout",
        ])
        .arg(at("server.key"))
        .arg("-out")
        .arg(at("server.csr")));
    // rustls checks the address against the subject alternative names.
    std::fs::write(at("ext"), "subjectAltName=IP:127.0.0.1\n").unwrap();
    run(Command::new("openssl")
        .args(["x509", "-req", "-days", "2", "-CAcreateserial", "-in"])
        .arg(at("server.csr"))
        .arg("-CA")
        .arg(at("ca.crt"))
        .arg("-CAkey")
        .arg(at("ca.key"))
        .arg("-out")
        .arg(at("server.crt"))
        .arg("-extfile")
        .arg(at("ext")));
}

struct TlsRedis {
    child: Child,
    port: u16,
}

impl Drop for TlsRedis {
    fn drop(&mut self) {
        let _ = self.child.kill();
        let _ = self.child.wait();
    }
}

fn free_port() -> u16 {
    std::net::TcpListener::bind("127.0.0.1:0")
        .unwrap()
        .local_addr()
        .unwrap()
        .port()
}

fn start_tls_redis(dir: &Path) -> TlsRedis {
    let bin = std::env::var("TIDINGS_REDIS_SERVER_BIN").unwrap_or_else(|_| "redis-server".into());
    let port = free_port();
    let child = Command::new(bin)
        .args(["--port", "0", "--tls-port", &port.to_string()])
        .arg("--tls-cert-file")
        .arg(dir.join("server.crt"))
        .arg("--tls-key-file")
        .arg(dir.join("server.key"))
        .arg("--tls-ca-cert-file")
        .arg(dir.join("ca.crt"))
        .args([
            "--tls-auth-clients",
            "no",
            "--save",
            "",
            "--appendonly",
            "no",
        ])
        .arg("--dir")
        .arg(dir)
        .stdout(Stdio::null())
        .stderr(Stdio::null())
        .spawn()
        .expect("redis-server starts (set TIDINGS_REDIS_SERVER_BIN)");
    // Ready when the TLS port accepts.
    let deadline = std::time::Instant::now() + Duration::from_secs(10);
    while std::net::TcpStream::connect(("127.0.0.1", port)).is_err() {
        assert!(
            std::time::Instant::now() < deadline,
            "redis-server with TLS did not listen on {port}"
        );
        std::thread::sleep(Duration::from_millis(25));
    }
    TlsRedis { child, port }
}

async fn readiness(base: &str) -> serde_json::Value {
    reqwest::get(format!("{base}/readyz"))
        .await
        .unwrap()
        .json()
        .await
        .unwrap()
}

#[tokio::test(flavor = "multi_thread", worker_threads = 2)]
async fn sessions_go_over_rediss_with_the_ca_and_are_refused_without_it() {
    let dir: PathBuf =
        std::env::temp_dir().join(format!("tidings-tls-{:016x}", rand::random::<u64>()));
    std::fs::create_dir_all(&dir).unwrap();
    make_certificates(&dir);
    let redis = start_tls_redis(&dir);
    let url = format!("rediss://127.0.0.1:{}/", redis.port);
    let bin = env!("CARGO_BIN_EXE_tidings");
    let ca = dir.join("ca.crt");

    let server = ServeProcess::start(
        bin,
        &["--redis-url", &url, "--redis-ca", ca.to_str().unwrap()],
        &[("TIDINGS_ID_SECRET", SECRET)],
    );
    let client = reqwest::Client::new();
    let first = common::ask_at(&client, &server.base, "reader-tls", "how did Dosavorn do").await;
    assert_eq!(first["degraded"], false, "{first}");
    assert_eq!(first["outcome"], "clarify", "{first}");
    // The follow-up needs the session kept in Redis, over TLS.
    let second = common::ask_at(&client, &server.base, "reader-tls", "the final").await;
    assert_eq!(second["degraded"], false, "{second}");
    assert_eq!(second["outcome"], "answered", "{second}");
    let ready = readiness(&server.base).await;
    assert_eq!(ready["status"], "ready", "{ready}");
    server.stop();

    // The built-in roots do not know the test CA: the certificate is
    // refused and the service says it is degraded.
    let untrusting = ServeProcess::start(
        bin,
        &["--redis-url", &url],
        &[("TIDINGS_ID_SECRET", SECRET)],
    );
    let ready = readiness(&untrusting.base).await;
    assert_eq!(ready["status"], "degraded", "{ready}");
    let reason = ready["sessions"]["status"].as_str().unwrap().to_lowercase();
    assert!(
        reason.contains("certificate") || reason.contains("tls"),
        "{reason}"
    );
    untrusting.stop();

    // A CA with a plain redis:// URL is a mistake, said at start-up.
    let out = Command::new(bin)
        .args(["serve", "--listen", "127.0.0.1:0", "--redis-url"])
        .arg(format!("redis://127.0.0.1:{}/", redis.port))
        .arg("--redis-ca")
        .arg(&ca)
        .env("TIDINGS_ID_SECRET", SECRET)
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(1));
    assert!(String::from_utf8_lossy(&out.stderr).contains("needs a rediss:// url"));
    drop(redis);
    let _ = std::fs::remove_dir_all(&dir);
}
