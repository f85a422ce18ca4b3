//! The ceiling the service is measured against (`tools/load.sh`): the least
//! an HTTP front end for readers' messages can do. It parses the same
//! request body as `POST /v1/messages`, reads the reader's session once and
//! writes it once (Redis `GET` and `SET ... PX`, or a map in memory), and
//! answers a small JSON reply. No understanding, no answer.
//!
//! `cargo run --release --example ceiling -- LISTEN [REDIS_URL]`

use std::collections::HashMap;
use std::sync::{Arc, Mutex};

use axum::extract::State;
use axum::http::StatusCode;
use axum::routing::post;
use axum::{Json, Router};
use redis::aio::ConnectionManager;
use serde_json::{json, Value};
use tidings::http::MessageIn;

#[derive(Clone)]
enum Store {
    Redis(ConnectionManager),
    // Sharded like a real in-memory store would be, so one lock is not
    // the whole cost.
    Memory(Arc<Vec<Mutex<HashMap<String, String>>>>),
}

async fn message(
    State(store): State<Store>,
    Json(m): Json<MessageIn>,
) -> Result<Json<Value>, StatusCode> {
    let key = format!(
        "ceiling:{}:{}",
        m.channel.as_deref().unwrap_or("chat"),
        m.user
    );
    let before: Option<String> = match &store {
        Store::Redis(con) => {
            let mut con = con.clone();
            let v: Option<String> = redis::cmd("GET")
                .arg(&key)
                .query_async(&mut con)
                .await
                .map_err(|_| StatusCode::SERVICE_UNAVAILABLE)?;
            let session = json!({ "last": m.text, "turns": 1 }).to_string();
            redis::cmd("SET")
                .arg(&key)
                .arg(session)
                .arg("PX")
                .arg(1_800_000)
                .query_async::<()>(&mut con)
                .await
                .map_err(|_| StatusCode::SERVICE_UNAVAILABLE)?;
            v
        }
        Store::Memory(shards) => {
            let shard = &shards[key.len() % shards.len()];
            let mut map = shard.lock().unwrap_or_else(|p| p.into_inner());
            let v = map.get(&key).cloned();
            map.insert(key, json!({ "last": m.text, "turns": 1 }).to_string());
            v
        }
    };
    Ok(Json(json!({
        "text": "ok",
        "outcome": "answered",
        "channel": m.channel.unwrap_or_else(|| "chat".into()),
        "seen": before.is_some(),
    })))
}

#[tokio::main]
async fn main() {
    let mut args = std::env::args().skip(1);
    let listen = args.next().unwrap_or_else(|| "127.0.0.1:8090".into());
    let store = match args.next() {
        Some(url) => {
            let client = redis::Client::open(url).expect("a Redis URL");
            Store::Redis(
                client
                    .get_connection_manager()
                    .await
                    .expect("Redis answers"),
            )
        }
        None => Store::Memory(Arc::new((0..64).map(|_| Mutex::default()).collect())),
    };
    let app = Router::new()
        .route("/v1/messages", post(message))
        .with_state(store);
    let listener = tokio::net::TcpListener::bind(&listen)
        .await
        .expect("the address is free");
    axum::serve(listener, app).await.expect("serving");
}
