//! The admin API under `/v1/admin/`: live changes to the results and the
//! service's status, for the newsroom's feed and its editors.
//!
//! Every route needs `Authorization: Bearer <token>` with the token the
//! service was started with (`--admin-token`); without one configured the
//! admin API is off and answers 403, never open.

use axum::extract::{DefaultBodyLimit, FromRequest, FromRequestParts, Query, Request, State};
use axum::http::request::Parts;
use axum::http::{header, StatusCode};
use axum::response::IntoResponse;
use axum::Json;

use super::openapi::{schema, Api, Body, Guard, Op};
use super::ApiError;
use crate::dataset::changes::{self, Batch, Records};
use crate::dataset::DataProblem;
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

/// A batch applied. Fields in name order, as the reply has always had them.
#[derive(serde::Serialize, schemars::JsonSchema)]
pub struct Applied {
    /// How many changes the batch held.
    pub applied: usize,
    /// The version the batch made.
    pub dataset_version: u64,
}

/// A dataset replaced.
#[derive(serde::Serialize, schemars::JsonSchema)]
pub struct Replaced {
    /// The version the replacement made.
    pub dataset_version: u64,
}

/// The questions readers asked that got no answer, most asked first.
#[derive(serde::Serialize, schemars::JsonSchema)]
pub struct UnansweredList {
    pub unanswered: Vec<crate::dialogue::store::Unanswered>,
}

/// A JSON body kept as its text, so that every problem found in it can be
/// given with its line and column. Refused as `AppJson` refuses: 415
/// without a JSON content type, 413 over the body limit.
pub struct JsonText(pub String);

impl<S: Send + Sync> FromRequest<S> for JsonText {
    type Rejection = ApiError;

    async fn from_request(req: Request, state: &S) -> Result<JsonText, ApiError> {
        let json = req
            .headers()
            .get(header::CONTENT_TYPE)
            .and_then(|v| v.to_str().ok())
            .and_then(|v| v.split(';').next())
            .map(|v| v.trim().to_ascii_lowercase())
            .is_some_and(|v| v == "application/json" || v.ends_with("+json"));
        if !json {
            return Err(ApiError {
                status: StatusCode::UNSUPPORTED_MEDIA_TYPE,
                code: "unsupported_media_type",
                message: "send the body as JSON with content-type: application/json".into(),
                retry_after: None,
            });
        }
        match String::from_request(req, state).await {
            Ok(text) => Ok(JsonText(text)),
            Err(r) if r.status() == StatusCode::PAYLOAD_TOO_LARGE => Err(ApiError {
                status: StatusCode::PAYLOAD_TOO_LARGE,
                code: "body_too_large",
                message: format!(
                    "the request body is larger than the admin API accepts ({} MiB)",
                    MAX_ADMIN_BODY / (1024 * 1024)
                ),
                retry_after: None,
            }),
            Err(_) => Err(ApiError {
                status: StatusCode::BAD_REQUEST,
                code: "malformed_json",
                message: "the body is not UTF-8 text".into(),
                retry_after: None,
            }),
        }
    }
}

/// A body that does not read as a batch or a dataset: 400 for broken JSON, 422 for JSON
/// that does not fit the format; every problem with its line and column.
fn unreadable(text: &str, problems: &[DataProblem]) -> ApiError {
    let syntax = serde_json::from_str::<serde::de::IgnoredAny>(text).is_err();
    let message = problems
        .iter()
        .map(|p| p.to_string())
        .collect::<Vec<_>>()
        .join("; ");
    if syntax {
        ApiError {
            status: StatusCode::BAD_REQUEST,
            code: "malformed_json",
            message,
            retry_after: None,
        }
    } else {
        ApiError::invalid("invalid_body", message)
    }
}

async fn apply_batch(
    _: Admin,
    State(engine): State<Engine>,
    JsonText(text): JsonText,
) -> Result<impl IntoResponse, ApiError> {
    let batch = changes::parse(&text).map_err(|p| unreadable(&text, &p))?;
    match engine.apply_batch(&batch).await {
        Ok(version) => Ok(Json(Applied {
            applied: batch.changes.len(),
            dataset_version: version,
        })),
        Err(ChangeError::Invalid(mut problems)) => {
            // Problems are placed at the field of the batch at fault.
            changes::locate(&mut problems, changes::BATCH, &text);
            Err(change_error(
                "invalid_batch",
                "the batch was not applied",
                ChangeError::Invalid(problems),
            ))
        }
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
    JsonText(text): JsonText,
) -> Result<impl IntoResponse, ApiError> {
    let Ok(Query(Force { force })) = force else {
        return Err(ApiError::invalid(
            "bad_force",
            "?force= must be true or false",
        ));
    };
    let records = changes::parse_records(&text).map_err(|p| unreadable(&text, &p))?;
    match engine.replace_records_checked(records, force).await {
        Ok(version) => Ok(Json(Replaced {
            dataset_version: version,
        })),
        Err(ChangeError::Invalid(mut problems)) => {
            changes::locate_records(&mut problems, &text);
            Err(change_error(
                "invalid_dataset",
                "the dataset was not replaced",
                ChangeError::Invalid(problems),
            ))
        }
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
    Ok(Json(UnansweredList { unanswered: rows }))
}

/// The admin routes, with a body limit of their own (a whole scenario is
/// larger than any reader's message).
pub fn routes() -> Api {
    Api::new()
        .post(
            "/v1/admin/batches",
            apply_batch,
            Op::new(
                "Apply a batch of changes to the results, all or nothing",
                Guard::Admin,
                Body::Json(schema::<Applied>),
            )
            .reads::<Batch>()
            .errors(&[503]),
        )
        .put(
            "/v1/admin/dataset",
            replace_dataset,
            Op::new(
                "Replace the whole dataset",
                Guard::Admin,
                Body::Json(schema::<Replaced>),
            )
            .reads::<Records>()
            .query(
                "force",
                "boolean",
                "Replace even when most records of a kind would go.",
            )
            .errors(&[503]),
        )
        .get(
            "/v1/admin/dataset",
            export_dataset,
            Op::new(
                "The dataset being served, in the shape PUT takes",
                Guard::Admin,
                Body::Json(schema::<Records>),
            )
            .header(DATASET_VERSION_HEADER, "The exported dataset's version."),
        )
        .get(
            "/v1/admin/status",
            status,
            Op::new(
                "The service's data, intents, channels and session store",
                Guard::Admin,
                Body::Json(schema::<crate::engine::ServiceStatus>),
            ),
        )
        .get(
            "/v1/admin/unanswered",
            unanswered,
            Op::new(
                "The questions readers asked that got no answer",
                Guard::Admin,
                Body::Json(schema::<UnansweredList>),
            )
            .query("limit", "integer", "At most this many (default 50).")
            .errors(&[422, 503]),
        )
        .layer_routes(|r| r.layer(DefaultBodyLimit::max(MAX_ADMIN_BODY)))
}
