//! Slow and idle clients against a real server on a loopback port: the
//! header-read timeout, the idle timeout, the connection cap and the
//! bounded drain on shutdown. Each would hang (and fail on the test's
//! outer bound) without its limit.

mod common;

use std::sync::{Arc, Mutex};
use std::time::Duration;

use tidings::http::Limits;
use tokio::io::{AsyncReadExt, AsyncWriteExt};
use tokio::net::TcpStream;

/// How long any one step may take before the test counts it as hung.
/// Far above the limits set below, so it bounds a failure, not the speed.
const HUNG: Duration = Duration::from_secs(20);

fn limits() -> Limits {
    Limits {
        header_read_timeout: Duration::from_secs(60),
        idle_timeout: Duration::from_secs(60),
        max_connections: 64,
        drain_timeout: Duration::from_secs(60),
    }
}

struct Started {
    addr: std::net::SocketAddr,
    stop: tokio::sync::oneshot::Sender<()>,
    done: tokio::task::JoinHandle<std::io::Result<()>>,
}

async fn start(limits: Limits) -> Started {
    let listener = tokio::net::TcpListener::bind("127.0.0.1:0").await.unwrap();
    let addr = listener.local_addr().unwrap();
    let (stop, rx) = tokio::sync::oneshot::channel::<()>();
    let done = tokio::spawn(tidings::http::run_with(
        listener,
        common::demo_engine(),
        tidings::http::Edge {
            connections: limits,
            ..tidings::http::Edge::without_rate_limits()
        },
        async {
            let _ = rx.await;
        },
    ));
    Started { addr, stop, done }
}

/// Reads until the server closes the connection; what it sent.
async fn read_to_close(s: &mut TcpStream) -> String {
    let mut out = Vec::new();
    let r = tokio::time::timeout(HUNG, async {
        let mut buf = [0u8; 4096];
        loop {
            match s.read(&mut buf).await {
                Ok(0) | Err(_) => break,
                Ok(n) => out.extend_from_slice(&buf[..n]),
            }
        }
    })
    .await;
    assert!(r.is_ok(), "the server kept the connection open");
    String::from_utf8_lossy(&out).into_owned()
}

#[tokio::test]
async fn a_header_sent_a_byte_at_a_time_is_cut_off() {
    let server = start(Limits {
        header_read_timeout: Duration::from_millis(300),
        ..limits()
    })
    .await;
    let mut s = TcpStream::connect(server.addr).await.unwrap();
    // Bytes keep arriving, so only the header-read timeout can end this.
    let drip = async {
        for b in b"GET /healthz HTTP/1.1\r\nHost: x\r\nX-Slow: aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa"
        {
            if s.write_all(&[*b]).await.is_err() {
                return false;
            }
            tokio::time::sleep(Duration::from_millis(50)).await;
        }
        true
    };
    let finished_drip = tokio::time::timeout(HUNG, drip).await.unwrap();
    // Either a write failed because the server had closed, or the read
    // sees the close now.
    if finished_drip {
        let rest = read_to_close(&mut s).await;
        assert!(!rest.contains("200 OK"), "{rest}");
    }
}

#[tokio::test]
async fn a_connection_that_sends_nothing_is_closed() {
    let server = start(Limits {
        idle_timeout: Duration::from_millis(200),
        ..limits()
    })
    .await;
    let mut s = TcpStream::connect(server.addr).await.unwrap();
    let got = read_to_close(&mut s).await;
    assert!(got.is_empty(), "{got}");
}

#[tokio::test]
async fn an_idle_keep_alive_connection_is_closed_after_its_answer() {
    let server = start(Limits {
        idle_timeout: Duration::from_millis(200),
        ..limits()
    })
    .await;
    let mut s = TcpStream::connect(server.addr).await.unwrap();
    s.write_all(b"GET /healthz HTTP/1.1\r\nHost: x\r\n\r\n")
        .await
        .unwrap();
    let got = read_to_close(&mut s).await;
    assert!(got.starts_with("HTTP/1.1 200 OK"), "{got}");
}

/// Collects what the code under test logs, for checking a log line.
#[derive(Clone, Default)]
struct Captured(Arc<Mutex<Vec<u8>>>);

impl std::io::Write for Captured {
    fn write(&mut self, b: &[u8]) -> std::io::Result<usize> {
        std::io::Write::write(&mut *self.0.lock().unwrap(), b)
    }
    fn flush(&mut self) -> std::io::Result<()> {
        Ok(())
    }
}

#[tokio::test]
async fn past_the_cap_a_connection_gets_a_json_503_and_a_log_line() {
    let log = Captured::default();
    let sink = log.clone();
    let subscriber = tracing_subscriber::fmt()
        .with_writer(move || sink.clone())
        .with_ansi(false)
        .finish();
    // The test runtime is single-threaded, so the server's tasks log here.
    let _guard = tracing::subscriber::set_default(subscriber);
    let server = start(Limits {
        max_connections: 2,
        ..limits()
    })
    .await;
    // Two connections that answer a request each, so both are known open.
    let mut held = Vec::new();
    for _ in 0..2 {
        let mut s = TcpStream::connect(server.addr).await.unwrap();
        s.write_all(b"GET /healthz HTTP/1.1\r\nHost: x\r\n\r\n")
            .await
            .unwrap();
        let mut buf = [0u8; 1024];
        let n = tokio::time::timeout(HUNG, s.read(&mut buf))
            .await
            .unwrap()
            .unwrap();
        assert!(buf[..n].starts_with(b"HTTP/1.1 200 OK"));
        held.push(s);
    }
    let mut third = TcpStream::connect(server.addr).await.unwrap();
    let got = read_to_close(&mut third).await;
    assert!(got.starts_with("HTTP/1.1 503"), "{got}");
    let body: serde_json::Value =
        serde_json::from_str(got.split_once("\r\n\r\n").unwrap().1).unwrap();
    assert_eq!(body["error"]["code"], "too_many_connections");
    let text = String::from_utf8(log.0.lock().unwrap().clone()).unwrap();
    assert!(text.contains("connection limit reached"), "{text}");
    // Once one closes, a new connection is served again.
    drop(held.pop());
    common::wait_until("a freed slot", HUNG, || async {
        let Ok(mut s) = TcpStream::connect(server.addr).await else {
            return false;
        };
        if s.write_all(b"GET /healthz HTTP/1.1\r\nHost: x\r\nConnection: close\r\n\r\n")
            .await
            .is_err()
        {
            return false;
        }
        read_to_close(&mut s).await.starts_with("HTTP/1.1 200 OK")
    })
    .await;
}

#[tokio::test]
async fn shutdown_is_not_held_by_a_half_sent_header() {
    let server = start(Limits {
        drain_timeout: Duration::from_millis(300),
        ..limits()
    })
    .await;
    let mut s = TcpStream::connect(server.addr).await.unwrap();
    s.write_all(b"POST /v1/messages HTTP/1.1\r\nHost: x\r\nContent-")
        .await
        .unwrap();
    // Make sure the server holds the connection before stopping it.
    let mut probe = TcpStream::connect(server.addr).await.unwrap();
    probe
        .write_all(b"GET /healthz HTTP/1.1\r\nHost: x\r\nConnection: close\r\n\r\n")
        .await
        .unwrap();
    assert!(read_to_close(&mut probe).await.starts_with("HTTP/1.1 200"));
    server.stop.send(()).unwrap();
    let ended = tokio::time::timeout(HUNG, server.done).await;
    assert!(ended.is_ok(), "the server did not stop within its drain");
    ended.unwrap().unwrap().unwrap();
    // And the held connection was closed with it.
    read_to_close(&mut s).await;
}

#[tokio::test]
async fn a_request_in_progress_finishes_during_the_drain() {
    let server = start(limits()).await;
    let mut s = TcpStream::connect(server.addr).await.unwrap();
    let body = r#"{"user":"drain-1","text":"who won the men's 100 m?"}"#;
    // The head is sent and the body is still to come when shutdown starts.
    s.write_all(
        format!(
            "POST /v1/messages HTTP/1.1\r\nHost: x\r\ncontent-type: application/json\r\ncontent-length: {}\r\n\r\n",
            body.len()
        )
        .as_bytes(),
    )
    .await
    .unwrap();
    // Wait until the server is reading this request: a second request on
    // another connection proves the accept loop has passed it on.
    let mut probe = TcpStream::connect(server.addr).await.unwrap();
    probe
        .write_all(b"GET /healthz HTTP/1.1\r\nHost: x\r\nConnection: close\r\n\r\n")
        .await
        .unwrap();
    read_to_close(&mut probe).await;
    server.stop.send(()).unwrap();
    s.write_all(body.as_bytes()).await.unwrap();
    let got = read_to_close(&mut s).await;
    assert!(got.starts_with("HTTP/1.1 200 OK"), "{got}");
    assert!(got.contains("Wonorin Galkace"), "{got}");
    tokio::time::timeout(HUNG, server.done)
        .await
        .unwrap()
        .unwrap()
        .unwrap();
}
