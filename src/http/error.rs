//! The one HTTP error type: a status, a stable code and a plain message for
//! the client. Causes are logged, never sent.

use axum::extract::rejection::JsonRejection;
use axum::http::StatusCode;
use axum::response::{IntoResponse, Response};
use axum::Json;
use serde_json::json;

/// An error as the client sees it.
#[derive(Debug)]
pub struct ApiError {
    pub status: StatusCode,
    pub code: &'static str,
    pub message: String,
}

impl ApiError {
    /// A 422 for a request that parsed but cannot be used.
    pub fn invalid(code: &'static str, message: impl Into<String>) -> ApiError {
        ApiError {
            status: StatusCode::UNPROCESSABLE_ENTITY,
            code,
            message: message.into(),
        }
    }
}

impl IntoResponse for ApiError {
    fn into_response(self) -> Response {
        if self.status.is_server_error() {
            tracing::error!(code = self.code, message = %self.message, "request failed");
        }
        (
            self.status,
            Json(json!({ "error": { "code": self.code, "message": self.message } })),
        )
            .into_response()
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
        }
    }
}

impl From<axum::extract::rejection::PathRejection> for ApiError {
    fn from(r: axum::extract::rejection::PathRejection) -> ApiError {
        ApiError {
            status: StatusCode::BAD_REQUEST,
            code: "bad_path",
            message: lowercase_first(&r.body_text()),
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
            },
            EngineError::Busy => ApiError {
                status: StatusCode::SERVICE_UNAVAILABLE,
                code: "busy",
                message: e.to_string(),
            },
        }
    }
}

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
