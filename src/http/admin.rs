//! The admin API under `/v1/admin/`: live changes to the results and the
//! service's status, for the newsroom's feed and its editors.
//!
//! Every route needs `Authorization: Bearer <token>` with the token the
//! service was started with (`--admin-token`); without one configured the
//! admin API is off and answers 403, never open.

use axum::extract::{DefaultBodyLimit, FromRequestParts, Query, State};
use axum::http::request::Parts;
use axum::http::{header, StatusCode};
use axum::response::IntoResponse;
use axum::routing::{get, post, put};
use axum::{Json, Router};
use serde_json::json;

use super::{ApiError, AppJson};
use crate::dataset::changes::{Batch, Records};
use crate::engine::{ChangeError, Engine};

/// Largest admin request body: a whole scenario fits with room to spare.
pub const MAX_ADMIN_BODY: usize = 32 * 1024 * 1024;

/// Proof that the request carries the admin token.
pub struct Admin;

impl FromRequestParts<Engine> for Admin {
    type Rejection = ApiError;

    async fn from_request_parts(parts: &mut Parts, engine: &Engine) -> Result<Admin, ApiError> {
        let allowed = check_bearer(parts, |token| engine.admin_allows(token))?;
        match allowed {
            None => Err(ApiError {
                status: StatusCode::FORBIDDEN,
                code: "admin_off",
                message: "the admin API is off: start the service with --admin-token".into(),
                retry_after: None,
            }),
            Some(true) => Ok(Admin),
            Some(false) => Err(ApiError {
                status: StatusCode::UNAUTHORIZED,
                code: "unauthorized",
                message: "send the admin token as Authorization: Bearer <token>".into(),
                retry_after: None,
            }),
        }
    }
}

/// The bearer token of a request as `allows` judges it (`None`: nothing
/// to check it against). Failed logins are limited per source address,
/// checked before the token is: once a source has used up its failures,
/// even the right token waits, so guessing runs at the limit's pace.
pub(super) fn check_bearer(
    parts: &Parts,
    allows: impl Fn(&str) -> Option<bool>,
) -> Result<Option<bool>, ApiError> {
    let token = parts
        .headers
        .get(header::AUTHORIZATION)
        .and_then(|v| v.to_str().ok())
        // The scheme name is case-insensitive (RFC 7235 §2.1).
        .and_then(|v| {
            v.get(..7)
                .filter(|s| s.eq_ignore_ascii_case("bearer "))
                .map(|_| &v[7..])
        })
        .unwrap_or("");
    let limiter = parts
        .extensions
        .get::<std::sync::Arc<super::EdgeState>>()
        .cloned();
    let src = super::source(&parts.extensions);
    if let (Some(edge), Some(src)) = (&limiter, &src) {
        if let Err(wait) = edge.admin_failures.check(src, edge.rates.admin_failures) {
            return Err(ApiError::rate_limited(
                "this address after failed admin logins",
                wait,
            ));
        }
    }
    let allowed = allows(token);
    if allowed == Some(false) {
        if let (Some(edge), Some(src)) = (&limiter, &src) {
            let _ = edge.admin_failures.take(src, edge.rates.admin_failures);
        }
    }
    Ok(allowed)
}

async fn apply_batch(
    _: Admin,
    State(engine): State<Engine>,
    AppJson(batch): AppJson<Batch>,
) -> Result<impl IntoResponse, ApiError> {
    match engine.apply_batch(&batch).await {
        Ok(version) => Ok(Json(json!({
            "dataset_version": version,
            "applied": batch.changes.len(),
        }))),
        Err(e) => Err(change_error(
            "invalid_batch",
            "the batch was not applied",
            e,
        )),
    }
}

/// `?force=true` on a dataset replacement.
#[derive(Debug, serde::Deserialize)]
struct Force {
    #[serde(default)]
    force: bool,
}

async fn replace_dataset(
    _: Admin,
    State(engine): State<Engine>,
    force: Result<Query<Force>, axum::extract::rejection::QueryRejection>,
    AppJson(records): AppJson<Records>,
) -> Result<impl IntoResponse, ApiError> {
    let Ok(Query(Force { force })) = force else {
        return Err(ApiError::invalid(
            "bad_force",
            "?force= must be true or false",
        ));
    };
    match engine.replace_records_checked(records, force).await {
        Ok(version) => Ok(Json(json!({ "dataset_version": version }))),
        Err(e) => Err(change_error(
            "invalid_dataset",
            "the dataset was not replaced",
            e,
        )),
    }
}

/// A change that was refused: 422 with every problem when it does not
/// check out, 503 when it could not be shared with the other replicas.
fn change_error(code: &'static str, what: &str, e: ChangeError) -> ApiError {
    match e {
        ChangeError::Invalid(problems) => ApiError::invalid(
            code,
            format!(
                "{what}: {}",
                problems
                    .iter()
                    .map(|p| p.to_string())
                    .collect::<Vec<_>>()
                    .join("; ")
            ),
        ),
        ChangeError::Shared(e) => ApiError {
            status: StatusCode::SERVICE_UNAVAILABLE,
            code: "not_shared",
            message: format!(
                "{what}: it could not be shared with the other replicas ({e}); nothing changed"
            ),
            retry_after: None,
        },
        ChangeError::Unknown(_) => ApiError {
            status: StatusCode::SERVICE_UNAVAILABLE,
            code: "outcome_unknown",
            message: format!("{what}: {e}"),
            retry_after: None,
        },
        ChangeError::Busy => ApiError {
            status: StatusCode::SERVICE_UNAVAILABLE,
            code: "busy",
            message: format!("{what}: {}", ChangeError::Busy),
            retry_after: None,
        },
    }
}

/// The header that carries the exported dataset's version.
pub const DATASET_VERSION_HEADER: &str = "tidings-dataset-version";

/// The dataset being served, whole, in the shape `PUT /v1/admin/dataset`
/// takes: a backup that can be sent back as it is to restore it. Its
/// version goes in a header, not the body, so the body stays a valid
/// replacement (a restore makes the next version, it does not go back).
async fn export_dataset(_: Admin, State(engine): State<Engine>) -> impl IntoResponse {
    let snap = engine.snapshot();
    let records = Records::of(&snap.data);
    (
        [
            (
                header::HeaderName::from_static(DATASET_VERSION_HEADER),
                header::HeaderValue::from(snap.data.version),
            ),
            // A whole scenario, possibly large and always live: never
            // kept by a cache on the way.
            (
                header::CACHE_CONTROL,
                header::HeaderValue::from_static("no-store"),
            ),
        ],
        Json(records),
    )
}

async fn status(_: Admin, State(engine): State<Engine>) -> impl IntoResponse {
    Json(engine.status().await)
}

/// The questions readers asked that got no answer, most frequent first;
/// `?limit=N` (default 50). The query is read by hand so a bad limit gets
/// the JSON error format.
async fn unanswered(
    _: Admin,
    State(engine): State<Engine>,
    Query(q): Query<std::collections::HashMap<String, String>>,
) -> Result<impl IntoResponse, ApiError> {
    let limit = match q.get("limit") {
        None => 50,
        Some(l) => l.parse::<usize>().map_err(|_| {
            ApiError::invalid("bad_limit", "limit must be a whole number, such as 50")
        })?,
    };
    let rows = engine
        .unanswered(limit.min(crate::dialogue::store::UNANSWERED_CAP))
        .await
        .map_err(crate::engine::EngineError::Store)?;
    Ok(Json(json!({ "unanswered": rows })))
}

/// The admin routes, with a body limit of their own (a whole scenario is
/// larger than any reader's message).
pub fn routes() -> Router<Engine> {
    Router::new()
        .route("/v1/admin/batches", post(apply_batch))
        .route(
            "/v1/admin/dataset",
            put(replace_dataset).get(export_dataset),
        )
        .route("/v1/admin/status", get(status))
        .route("/v1/admin/unanswered", get(unanswered))
        .layer(DefaultBodyLimit::max(MAX_ADMIN_BODY))
}
