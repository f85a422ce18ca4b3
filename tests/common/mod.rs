//! Shared helpers for integration tests: a real server on port 0.

#![allow(dead_code)]

use std::net::SocketAddr;
use std::sync::Arc;
use std::time::Duration;

use tidings::dialogue::MemoryStore;
use tidings::engine::{self, Clock, Engine, Settings, Sources};

/// The demo clock: Saturday 14 August 2027, 21:10 in the scenario's zone.
pub const NOW: &str = "2027-08-14T21:10:00+01:00";

/// An engine over the built-in demo with in-memory sessions.
pub fn demo_engine() -> Engine {
    let snap = engine::load(&Sources::default()).expect("the demo loads");
    let settings = Settings {
        clock: Clock::Fixed(NOW.parse().unwrap()),
        session_ttl: Duration::from_secs(1800),
        id_secret: b"test-secret".to_vec(),
    };
    Engine::new(snap, Arc::new(MemoryStore::new()), settings)
}

/// A running server; dropped at the end of the test with its runtime.
pub struct Server {
    pub addr: SocketAddr,
    pub client: reqwest::Client,
    _shutdown: tokio::sync::oneshot::Sender<()>,
}

impl Server {
    pub async fn start(engine: Engine) -> Server {
        let listener = tokio::net::TcpListener::bind("127.0.0.1:0").await.unwrap();
        let addr = listener.local_addr().unwrap();
        let (tx, rx) = tokio::sync::oneshot::channel::<()>();
        tokio::spawn(async move {
            tidings::http::run(listener, engine, async {
                let _ = rx.await;
            })
            .await
            .unwrap();
        });
        Server {
            addr,
            client: reqwest::Client::new(),
            _shutdown: tx,
        }
    }

    pub fn url(&self, path: &str) -> String {
        format!("http://{}{path}", self.addr)
    }

    /// Sends a reader's message and returns status and JSON body.
    pub async fn ask(&self, user: &str, text: &str) -> (u16, serde_json::Value) {
        let r = self
            .client
            .post(self.url("/v1/messages"))
            .json(&serde_json::json!({"user": user, "text": text}))
            .send()
            .await
            .unwrap();
        let status = r.status().as_u16();
        (status, r.json().await.unwrap())
    }
}
