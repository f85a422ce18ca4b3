//! `GET /metrics`: the service's counters for a Prometheus scraper, and the
//! middleware that counts every request by matched route and status.
//!
//! Who may read it: whoever holds the metrics token (`--metrics-token`) or
//! the admin token, as a bearer token, which a Prometheus scrape config
//! sends as it is (`authorization: {credentials: ...}`). Not open by
//! default because the same port serves readers from the internet; not by
//! source address either, because behind a reverse proxy on the same host
//! every request comes from loopback. A token of its own, so the
//! monitoring system's credential cannot change the data.

use axum::extract::{FromRequestParts, MatchedPath, Request, State};
use axum::http::request::Parts;
use axum::http::{header, StatusCode};
use axum::middleware::Next;
use axum::response::{IntoResponse, Response};

use super::admin::check_bearer;
use super::openapi::{Api, Body, Guard, Op};
use super::ApiError;
use crate::engine::Engine;

/// Proof that the request may read the metrics.
pub struct Scraper;

impl FromRequestParts<Engine> for Scraper {
    type Rejection = ApiError;

    async fn from_request_parts(parts: &mut Parts, engine: &Engine) -> Result<Scraper, ApiError> {
        match check_bearer(parts, |token| engine.metrics_allows(token))? {
            Some(true) => Ok(Scraper),
            None => Err(ApiError {
                status: StatusCode::FORBIDDEN,
                code: "metrics_off",
                message:
                    "metrics are off: start the service with --metrics-token (or --admin-token)"
                        .into(),
                retry_after: None,
            }),
            Some(false) => Err(ApiError {
                status: StatusCode::UNAUTHORIZED,
                code: "unauthorized",
                message: "send the metrics token as Authorization: Bearer <token>".into(),
                retry_after: None,
            }),
        }
    }
}

async fn metrics(_: Scraper, State(engine): State<Engine>) -> impl IntoResponse {
    (
        [
            (header::CONTENT_TYPE, crate::metrics::CONTENT_TYPE),
            // Always live figures: never kept by a cache on the way.
            (header::CACHE_CONTROL, "no-store"),
        ],
        engine.metrics_text(),
    )
}

/// Counts the request by the route it matched (not its raw path, which
/// the client chooses) and the status it got, whatever layer answered.
pub async fn count(State(engine): State<Engine>, req: Request, next: Next) -> Response {
    let route = req.extensions().get::<MatchedPath>().cloned();
    let response = next.run(req).await;
    engine.metrics().request(
        route.as_ref().map(MatchedPath::as_str),
        response.status().as_u16(),
    );
    response
}

/// The metrics route.
pub fn routes() -> Api {
    Api::new().get(
        "/metrics",
        metrics,
        Op::new(
            "The service's counters for a Prometheus scraper",
            Guard::Metrics,
            Body::Text(
                "text/plain",
                "The Prometheus text exposition format, version 0.0.4.",
            ),
        ),
    )
}
