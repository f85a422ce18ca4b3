//! The HTTP API: `POST /v1/messages`, `DELETE /v1/users/{channel}/{user}`,
//! `GET /healthz` (the process is up) and `GET /readyz` (and its session
//! store answers); the admin API ([`admin`]) under `/v1/admin/`; the
//! editors' desk page ([`desk`]) at `/desk`; the counters for a
//! Prometheus scraper at `/metrics`.
//!
//! Errors come back as `{"error": {"code", "message"}}`; a reader's mistake
//! is never a 500.

mod admin;
pub mod cors;
mod desk;
mod error;
pub mod keys;
pub mod limit;
mod metrics;
pub mod openapi;
pub mod queue;
pub mod reply;
pub mod request_id;
mod serve;
pub mod signature;

use std::future::Future;
use std::net::SocketAddr;
use std::sync::Arc;
use std::time::Duration;

use axum::extract::{
    ConnectInfo, DefaultBodyLimit, FromRequest, FromRequestParts, MatchedPath, Path, Request, State,
};
use axum::http::StatusCode;
use axum::middleware::Next;
use axum::response::{IntoResponse, Response};
use axum::{Extension, Json, Router};
use serde::Deserialize;
use tokio::net::TcpListener;
use tower_http::trace::TraceLayer;

pub use cors::Cors;
pub use error::ApiError;
pub use keys::ClientKeys;
pub use limit::{Rate, Rates};
pub use queue::Queueing;
pub use serve::Limits;

use crate::engine::{self, Engine, Incoming};

/// Largest request body accepted.
pub const MAX_BODY: usize = 16 * 1024;
/// Longest message text accepted, in characters.
pub const MAX_TEXT: usize = 500;

/// How the edge of the service is set up: limits on connections and on
/// request rates.
#[derive(Debug, Clone, Default)]
pub struct Edge {
    /// Timeouts, the connection cap and the drain on shutdown.
    pub connections: Limits,
    /// Rate limits.
    pub rates: Rates,
    /// How one reader's messages wait for each other.
    pub queue: Queueing,
    /// Client keys of the reader-facing routes; none leaves them open.
    pub keys: ClientKeys,
    /// Signature checks of `POST /v1/messages`, when configured.
    pub signing: Option<Arc<signature::Signing>>,
    /// Origins a browser may call the API from.
    pub cors: Cors,
}

impl Edge {
    /// The default connection limits, no rate limits and a long line for
    /// each reader: for tools and tests that send many messages as one
    /// reader on purpose.
    pub fn without_rate_limits() -> Edge {
        Edge {
            connections: Limits::default(),
            rates: Rates {
                per_source: None,
                per_reader: None,
                per_key: None,
                ..Rates::default()
            },
            // Many messages of one reader at once are the point of such
            // callers: they wait in line rather than being turned away.
            queue: Queueing {
                per_reader: 1024,
                ..Queueing::default()
            },
            ..Edge::default()
        }
    }
}

/// What the edge keeps while serving: its settings and the rate limits'
/// buckets. Shared by every request through an `Arc` in the request
/// extensions.
#[derive(Debug)]
pub struct EdgeState {
    rates: Rates,
    sources: limit::Buckets,
    readers: limit::Buckets,
    admin_failures: limit::Buckets,
    /// Each reader's messages, one turn at a time.
    turns: queue::ReaderTurns,
    keys: ClientKeys,
    key_buckets: limit::Buckets,
    signing: Option<Arc<signature::Signing>>,
    /// One log line per interval when clients are being limited.
    limited_log: crate::log_gate::SharedLogGate,
}

impl EdgeState {
    fn new(edge: &Edge) -> EdgeState {
        EdgeState {
            rates: edge.rates.clone(),
            sources: limit::Buckets::default(),
            readers: limit::Buckets::default(),
            admin_failures: limit::Buckets::default(),
            turns: queue::ReaderTurns::new(edge.queue),
            keys: edge.keys.clone(),
            key_buckets: limit::Buckets::default(),
            signing: edge.signing.clone(),
            limited_log: crate::log_gate::SharedLogGate::new(Duration::from_secs(10)),
        }
    }

    /// Takes a token from `buckets` for `key`, or the 429 to answer.
    fn take(
        &self,
        buckets: &limit::Buckets,
        key: &str,
        rate: Option<Rate>,
        what: &'static str,
    ) -> Result<(), ApiError> {
        let Some(rate) = rate else { return Ok(()) };
        buckets.take(key, rate).map_err(|wait| {
            if let Some(held) = self.limited_log.pass() {
                tracing::info!(limit = what, held_back = held, "rate limit reached");
            }
            ApiError::rate_limited(what, wait)
        })
    }
}

/// The source address of a request, when it came over a socket.
fn source(extensions: &axum::http::Extensions) -> Option<String> {
    extensions
        .get::<ConnectInfo<SocketAddr>>()
        .map(|c| c.0.ip().to_string())
}

/// The per-source rate limit, before anything else is read. The health
/// checks are left out: a load balancer polls them from one address.
async fn limit_source(State(edge): State<Arc<EdgeState>>, req: Request, next: Next) -> Response {
    let path = req.uri().path();
    if !openapi::UNLIMITED.contains(&path) {
        if let Some(src) = source(req.extensions()) {
            if let Err(e) = edge.take(&edge.sources, &src, edge.rates.per_source, "this address") {
                return e.into_response();
            }
        }
    }
    next.run(req).await
}

/// How long one request may take.
pub const REQUEST_TIMEOUT: Duration = Duration::from_secs(10);

/// Largest request head (request line and headers) accepted; larger is a
/// 431 in the service's error shape.
pub const MAX_HEAD: usize = 16 * 1024;

/// The per-request time limit, answered in the service's error shape (a
/// stuck request cannot hold a connection or shutdown for ever), and the
/// head size limit, checked first.
async fn time_limit(req: Request, next: Next) -> Response {
    let head: usize = req.uri().to_string().len()
        + req
            .headers()
            .iter()
            .map(|(k, v)| k.as_str().len() + v.len() + 4)
            .sum::<usize>();
    if head > MAX_HEAD {
        return ApiError {
            status: StatusCode::REQUEST_HEADER_FIELDS_TOO_LARGE,
            code: "headers_too_large",
            message: format!(
                "the request line and headers must be at most {} KiB",
                MAX_HEAD / 1024
            ),
            retry_after: None,
        }
        .into_response();
    }
    match tokio::time::timeout(REQUEST_TIMEOUT, next.run(req)).await {
        Ok(r) => r,
        Err(_) => ApiError {
            status: StatusCode::SERVICE_UNAVAILABLE,
            code: "timeout",
            message: format!(
                "the request took longer than {} seconds; try again",
                REQUEST_TIMEOUT.as_secs()
            ),
            retry_after: Some(Duration::from_secs(1)),
        }
        .into_response(),
    }
}

/// JSON body extractor that answers bad JSON in the service's own format.
#[derive(FromRequest)]
#[from_request(via(axum::Json), rejection(ApiError))]
pub struct AppJson<T>(pub T);

/// Path parameters, with a bad path (not UTF-8 once decoded) answered in
/// the service's own error format.
#[derive(FromRequestParts)]
#[from_request(via(Path), rejection(ApiError))]
pub struct AppPath<T>(pub T);

/// A reader's message.
#[derive(Debug, Deserialize, schemars::JsonSchema)]
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
    /// Whether the reply should carry `candidates` and `facts`, which
    /// explain it (for the desk, tuning and checking).
    #[serde(default)]
    pub explain: bool,
}

async fn messages(
    State(engine): State<Engine>,
    Extension(edge): Extension<Arc<EdgeState>>,
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
    if let Some(id) = &m.message_id {
        if id.is_empty() || id.chars().count() > 200 {
            return Err(ApiError::invalid(
                "bad_message_id",
                "message_id must be 1 to 200 characters",
            ));
        }
    }
    let channel = m.channel.as_deref().unwrap_or("chat");
    // By the hashed key, so the buckets hold no reader id.
    let reader = engine.user_key(channel, &m.user);
    edge.take(&edge.readers, &reader, edge.rates.per_reader, "this reader")?;
    let _turn = edge.turns.enter(&reader).await?;
    let answer = engine
        .handle_message(Incoming {
            user: &m.user,
            channel,
            text,
            message_id: m.message_id.as_deref(),
        })
        .await?;
    // A retry gets the first reply; the header tells the client so.
    let repeated = [(
        "tidings-repeated",
        if answer.repeated { "true" } else { "false" },
    )];
    Ok((
        repeated,
        Json(reply::Sent {
            answer,
            explain: m.explain,
        }),
    ))
}

/// Erases everything kept for a reader: 204 whether or not anything was
/// kept, so the answer does not reveal whether the reader ever wrote.
async fn erase_user(
    State(engine): State<Engine>,
    AppPath((channel, user)): AppPath<(String, String)>,
) -> Result<StatusCode, ApiError> {
    if user.is_empty() {
        return Err(ApiError::invalid("empty_user", "user must not be empty"));
    }
    engine.erase(&channel, &user).await?;
    Ok(StatusCode::NO_CONTENT)
}

/// Ready when the session store answers. When it does not, replies still
/// go out (without conversation context, marked `degraded`), so this says
/// so with a 200 and `"status": "degraded"` rather than a 503: every replica
/// shares the store, and a 503 would take all of them out of the load
/// balancer at once.
async fn readyz(State(engine): State<Engine>) -> Json<Ready> {
    let (store, status) = engine.store_status().await;
    let snap = engine.snapshot();
    let (status, sessions) = match status {
        Ok(()) => ("ready", "ok".to_string()),
        Err(e) => ("degraded", e.to_string()),
    };
    Json(Ready {
        dataset_version: snap.data.version,
        sessions: engine::StoreState {
            status: sessions,
            store: store.to_string(),
        },
        status: status.to_string(),
    })
}

/// `GET /readyz`. Fields in name order, as the reply has always had them.
#[derive(Debug, serde::Serialize, schemars::JsonSchema)]
pub struct Ready {
    pub dataset_version: u64,
    pub sessions: engine::StoreState,
    /// `ready`, or `degraded` while the session store cannot be reached.
    pub status: String,
}

/// `GET /healthz`: the process is up with its data and intents loaded.
#[derive(Debug, serde::Serialize, schemars::JsonSchema)]
pub struct Health {
    pub dataset_version: u64,
    /// How many intents are loaded.
    pub intents: usize,
    /// Always `ok`.
    pub status: String,
}

async fn healthz(State(engine): State<Engine>) -> Json<Health> {
    let snap = engine.snapshot();
    Json(Health {
        dataset_version: snap.data.version,
        intents: snap.catalog.intents.len(),
        status: "ok".into(),
    })
}

async fn not_found() -> ApiError {
    ApiError {
        status: StatusCode::NOT_FOUND,
        code: "not_found",
        message: "no such endpoint".into(),
        retry_after: None,
    }
}

async fn wrong_method() -> ApiError {
    ApiError {
        status: StatusCode::METHOD_NOT_ALLOWED,
        code: "method_not_allowed",
        message: "this endpoint does not take that method; see the allow header".into(),
        retry_after: None,
    }
}

/// Every route, each with its description for `GET /v1/openapi.json`.
pub fn routes() -> openapi::Api {
    use openapi::{schema, Body, Guard, Op};
    openapi::Api::new()
        .post(
            "/v1/messages",
            messages,
            Op::new(
                "Answer a reader's message",
                Guard::SignedClientKey,
                Body::Json(schema::<engine::Answer>),
            )
            .reads::<MessageIn>()
            .header(
                "tidings-repeated",
                "`true` when this is the stored reply to a message id seen before.",
            )
            .errors(&[429, 503]),
        )
        .delete(
            "/v1/users/{channel}/{user}",
            erase_user,
            Op::new(
                "Erase everything kept for a reader",
                Guard::ClientKey,
                Body::Empty,
            )
            .errors(&[400, 422, 503]),
        )
        .get(
            "/healthz",
            healthz,
            Op::new(
                "Whether the process is up",
                Guard::Open,
                Body::Json(schema::<Health>),
            ),
        )
        .get(
            "/readyz",
            readyz,
            Op::new(
                "Whether the session store answers too",
                Guard::Open,
                Body::Json(schema::<Ready>),
            ),
        )
        .merge(admin::routes())
        .merge(desk::routes())
        .merge(metrics::routes())
}

/// The application's routes and layers, without rate limits (see
/// [`Edge::without_rate_limits`]).
pub fn app(engine: Engine) -> Router {
    app_with(engine, &Edge::without_rate_limits())
}

/// The application's routes and layers, limited as `edge` says.
pub fn app_with(engine: Engine, edge: &Edge) -> Router {
    let state = Arc::new(EdgeState::new(edge));
    let engine_for_keys = engine.clone();
    let engine_for_metrics = engine.clone();
    routes()
        .finish()
        .fallback(not_found)
        .method_not_allowed_fallback(wrong_method)
        .with_state(engine)
        // Layers run outside-in: the trace span wraps everything, then the
        // timeout (so a stuck request cannot hold shutdown forever), then
        // the edge's state for handlers, the per-source rate limit (before
        // any body is read), CORS (a preflight carries no key), the client
        // keys, the signature check, then the body limit that the JSON extractor
        // reports as 413.
        .layer(DefaultBodyLimit::max(MAX_BODY))
        .layer(axum::middleware::from_fn_with_state(
            Arc::clone(&state),
            signature::verify,
        ))
        .layer(axum::middleware::from_fn_with_state(
            (Arc::clone(&state), engine_for_keys),
            keys::guard,
        ))
        .layer(tower::util::option_layer(edge.cors.layer()))
        .layer(axum::middleware::from_fn_with_state(
            Arc::clone(&state),
            limit_source,
        ))
        .layer(Extension(state))
        .layer(axum::middleware::from_fn(time_limit))
        .layer(TraceLayer::new_for_http().make_span_with(|req: &Request| {
            let route = req
                .extensions()
                .get::<MatchedPath>()
                .map(|p| p.as_str().to_string())
                .unwrap_or_default();
            let id = req
                .extensions()
                .get::<request_id::RequestId>()
                .map(|r| r.0.as_str())
                .unwrap_or_default();
            tracing::info_span!("request", method = %req.method(), route = %route, request_id = %id)
        }))
        // Outermost: every answer is counted, the limits' and timeouts' too.
        .layer(axum::middleware::from_fn_with_state(
            engine_for_metrics,
            metrics::count,
        ))
        // Outside the trace span, which records the id it hands in.
        .layer(axum::middleware::from_fn(request_id::tag))
}

/// Serves the API on `listener` with the default connection limits and no
/// rate limits until `shutdown` completes.
pub async fn run(
    listener: TcpListener,
    engine: Engine,
    shutdown: impl Future<Output = ()> + Send + 'static,
) -> std::io::Result<()> {
    run_with(listener, engine, Edge::without_rate_limits(), shutdown).await
}

/// Serves the API on `listener` as `edge` says until `shutdown`
/// completes, then drains open connections for at most
/// `edge.connections.drain_timeout`.
pub async fn run_with(
    listener: TcpListener,
    engine: Engine,
    edge: Edge,
    shutdown: impl Future<Output = ()> + Send + 'static,
) -> std::io::Result<()> {
    let router = app_with(engine, &edge);
    serve::serve(listener, router, edge.connections, shutdown).await
}
