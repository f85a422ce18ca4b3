//! The HTTP API: `POST /v1/messages` and `GET /healthz`.
//!
//! Errors come back as `{"error": {"code", "message"}}`; a reader's mistake
//! is never a 500.

mod error;

use std::future::Future;
use std::time::Duration;

use axum::extract::{DefaultBodyLimit, FromRequest, MatchedPath, Request, State};
use axum::http::StatusCode;
use axum::response::IntoResponse;
use axum::routing::{get, post};
use axum::{Json, Router};
use serde::Deserialize;
use serde_json::json;
use tokio::net::TcpListener;
use tower_http::timeout::TimeoutLayer;
use tower_http::trace::TraceLayer;

pub use error::ApiError;

use crate::engine::Engine;

/// Largest request body accepted.
pub const MAX_BODY: usize = 16 * 1024;
/// Longest message text accepted, in characters.
pub const MAX_TEXT: usize = 500;

/// JSON body extractor that answers bad JSON in the service's own format.
#[derive(FromRequest)]
#[from_request(via(axum::Json), rejection(ApiError))]
pub struct AppJson<T>(pub T);

/// A reader's message.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct MessageIn {
    /// The reader's id on the channel; hashed before use.
    pub user: String,
    pub text: String,
    #[serde(default)]
    pub channel: Option<String>,
    /// The platform's id for this message; retries carry the same id.
    #[serde(default)]
    pub message_id: Option<String>,
}

async fn messages(
    State(engine): State<Engine>,
    AppJson(m): AppJson<MessageIn>,
) -> Result<impl IntoResponse, ApiError> {
    if m.user.trim().is_empty() {
        return Err(ApiError::invalid("empty_user", "user must not be empty"));
    }
    if m.user.chars().count() > 200 {
        return Err(ApiError::invalid(
            "user_too_long",
            "user must be at most 200 characters",
        ));
    }
    let text = m.text.trim();
    if text.is_empty() {
        return Err(ApiError::invalid("empty_text", "text must not be empty"));
    }
    if text.chars().count() > MAX_TEXT {
        return Err(ApiError::invalid(
            "text_too_long",
            format!("text must be at most {MAX_TEXT} characters"),
        ));
    }
    let channel = m.channel.as_deref().unwrap_or("chat");
    let answer = engine.handle(&m.user, channel, text).await?;
    Ok(Json(answer))
}

async fn healthz(State(engine): State<Engine>) -> impl IntoResponse {
    let snap = engine.snapshot();
    Json(
        json!({ "status": "ok", "dataset_version": snap.data.version, "intents": snap.catalog.intents.len() }),
    )
}

async fn not_found() -> ApiError {
    ApiError {
        status: StatusCode::NOT_FOUND,
        code: "not_found",
        message: "no such endpoint".into(),
    }
}

/// The application's routes and layers.
pub fn app(engine: Engine) -> Router {
    Router::new()
        .route("/v1/messages", post(messages))
        .route("/healthz", get(healthz))
        .fallback(not_found)
        .with_state(engine)
        // Layers run outside-in: the trace span wraps everything, then the
        // timeout (so a stuck request cannot hold shutdown forever), then the
        // body limit that the JSON extractor reports as 413.
        .layer(DefaultBodyLimit::max(MAX_BODY))
        .layer(TimeoutLayer::with_status_code(
            StatusCode::SERVICE_UNAVAILABLE,
            Duration::from_secs(10),
        ))
        .layer(TraceLayer::new_for_http().make_span_with(|req: &Request| {
            let route = req
                .extensions()
                .get::<MatchedPath>()
                .map(|p| p.as_str().to_string())
                .unwrap_or_default();
            tracing::info_span!("request", method = %req.method(), route = %route)
        }))
}

/// Serves the API on `listener` until `shutdown` completes.
pub async fn run(
    listener: TcpListener,
    engine: Engine,
    shutdown: impl Future<Output = ()> + Send + 'static,
) -> std::io::Result<()> {
    axum::serve(listener, app(engine))
        .with_graceful_shutdown(shutdown)
        .await
}
