//! The one HTTP error type: a status, a stable code and a plain message for
//! the client. Causes are logged, never sent.

use axum::extract::rejection::JsonRejection;
use axum::http::StatusCode;
use axum::response::{IntoResponse, Response};
use axum::Json;

/// An error as the client sees it.
#[derive(Debug)]
pub struct ApiError {
    pub status: StatusCode,
    pub code: &'static str,
    pub message: String,
    /// When to try again, sent as `retry-after` (whole seconds, at least
    /// one): with 429s and with 503s that will pass.
    pub retry_after: Option<std::time::Duration>,
}

impl ApiError {
    /// A 429 for a client over one of its rate limits (`what`: "this
    /// source", "this reader", "this client key").
    pub fn rate_limited(what: &str, retry_after: std::time::Duration) -> ApiError {
        ApiError {
            status: StatusCode::TOO_MANY_REQUESTS,
            code: "rate_limited",
            message: format!(
                "too many requests from {what}; try again after the retry-after header's seconds"
            ),
            retry_after: Some(retry_after),
        }
    }

    /// A 422 for a request that parsed but cannot be used.
    pub fn invalid(code: &'static str, message: impl Into<String>) -> ApiError {
        ApiError {
            status: StatusCode::UNPROCESSABLE_ENTITY,
            code,
            message: message.into(),
            retry_after: None,
        }
    }
}

impl IntoResponse for ApiError {
    fn into_response(self) -> Response {
        if self.status.is_server_error() {
            tracing::error!(code = self.code, message = %self.message, "request failed");
        }
        let mut response = (
            self.status,
            Json(super::openapi::ErrorBody {
                error: super::openapi::ErrorDetail {
                    code: self.code.to_string(),
                    message: self.message,
                },
            }),
        )
            .into_response();
        if let Some(after) = self.retry_after {
            let secs = after.as_secs() + u64::from(after.subsec_nanos() > 0);
            response.headers_mut().insert(
                axum::http::header::RETRY_AFTER,
                axum::http::HeaderValue::from(secs.max(1)),
            );
        }
        response
    }
}

impl From<JsonRejection> for ApiError {
    fn from(r: JsonRejection) -> ApiError {
        let status = r.status();
        let (code, message) = match status {
            StatusCode::PAYLOAD_TOO_LARGE => (
                "body_too_large",
                "the request body is larger than this endpoint accepts (16 KiB for messages)"
                    .to_string(),
            ),
            StatusCode::UNSUPPORTED_MEDIA_TYPE => (
                "unsupported_media_type",
                "send the body as JSON with content-type: application/json".to_string(),
            ),
            StatusCode::UNPROCESSABLE_ENTITY => ("invalid_body", lowercase_first(&r.body_text())),
            _ => ("malformed_json", lowercase_first(&r.body_text())),
        };
        ApiError {
            status,
            code,
            message,
            retry_after: None,
        }
    }
}

impl From<axum::extract::rejection::PathRejection> for ApiError {
    fn from(r: axum::extract::rejection::PathRejection) -> ApiError {
        ApiError {
            status: StatusCode::BAD_REQUEST,
            code: "bad_path",
            message: lowercase_first(&r.body_text()),
            retry_after: None,
        }
    }
}

impl From<crate::engine::EngineError> for ApiError {
    fn from(e: crate::engine::EngineError) -> ApiError {
        use crate::engine::EngineError;
        match e {
            EngineError::UnknownChannel(..) => ApiError::invalid("unknown_channel", e.to_string()),
            EngineError::Store(_) => ApiError {
                status: StatusCode::SERVICE_UNAVAILABLE,
                code: "store_unavailable",
                message: "the session store cannot be reached; try again shortly".into(),
                retry_after: None,
            },
            // Turns of one reader wait for each other on a replica, so this
            // is replicas racing for one reader: the reader's burst, not a
            // fault of the service, hence a 429 to retry and no ERROR line.
            EngineError::Busy => {
                if let Some(held) = BUSY_LOG.pass() {
                    tracing::warn!(
                        held_back = held,
                        "a reader's messages kept racing across replicas"
                    );
                }
                super::queue::busy(e.to_string())
            }
        }
    }
}

/// The warnings for [`crate::engine::EngineError::Busy`], at most one per
/// 10 seconds.
static BUSY_LOG: std::sync::LazyLock<crate::log_gate::SharedLogGate> =
    std::sync::LazyLock::new(|| {
        crate::log_gate::SharedLogGate::new(std::time::Duration::from_secs(10))
    });

fn lowercase_first(s: &str) -> String {
    let mut c = s.chars();
    match c.next() {
        Some(f) => f
            .to_lowercase()
            .chain(c)
            .collect::<String>()
            .trim_end_matches('.')
            .to_string(),
        None => String::new(),
    }
}
