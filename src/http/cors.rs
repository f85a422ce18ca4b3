//! Cross-origin requests, for a reader widget on a newsroom's own pages.
//!
//! Off unless origins are listed: then a browser on one of those origins
//! may call the API (its preflight is answered here, before any key or
//! route is looked at, as a preflight carries no credentials), and every
//! other origin gets no CORS headers at all, which the browser treats as
//! a refusal. Listing origins exactly, never `*`, keeps a page elsewhere
//! from using a reader's browser to talk to the service.

use std::time::Duration;

use axum::http::{header, HeaderName, HeaderValue, Method};
use tower_http::cors::{AllowOrigin, CorsLayer};

/// How long a browser may keep a preflight's answer.
pub const PREFLIGHT_MAX_AGE: Duration = Duration::from_secs(600);

/// An origin that cannot be listed.
#[derive(Debug, thiserror::Error, PartialEq)]
pub enum CorsError {
    #[error("CORS origin {0:?} must be scheme://host[:port], such as https://news.example, with no path")]
    BadOrigin(String),
}

/// The allowed origins, checked.
#[derive(Debug, Clone, Default)]
pub struct Cors {
    origins: Vec<HeaderValue>,
}

impl Cors {
    /// Origins as a browser sends them in `origin`: `scheme://host[:port]`.
    pub fn new<'a>(origins: impl IntoIterator<Item = &'a str>) -> Result<Cors, CorsError> {
        let mut list = Vec::new();
        for o in origins {
            let o = o.trim();
            if o.is_empty() {
                continue;
            }
            let rest = o
                .strip_prefix("https://")
                .or_else(|| o.strip_prefix("http://"));
            let ok = rest.is_some_and(|r| {
                !r.is_empty()
                    && !r.contains('/')
                    && r.chars().all(|c| {
                        c.is_ascii_alphanumeric() || matches!(c, '.' | '-' | ':' | '[' | ']')
                    })
            });
            let value = HeaderValue::from_str(o).ok().filter(|_| ok);
            list.push(value.ok_or_else(|| CorsError::BadOrigin(o.to_string()))?);
        }
        Ok(Cors { origins: list })
    }

    /// Whether any origin is allowed.
    pub fn is_empty(&self) -> bool {
        self.origins.is_empty()
    }

    /// The layer, or none when no origin is listed (no CORS headers).
    pub fn layer(&self) -> Option<CorsLayer> {
        if self.origins.is_empty() {
            return None;
        }
        Some(
            CorsLayer::new()
                .allow_origin(AllowOrigin::list(self.origins.clone()))
                .allow_methods([Method::GET, Method::POST, Method::DELETE])
                .allow_headers([
                    header::CONTENT_TYPE,
                    header::AUTHORIZATION,
                    HeaderName::from_static(super::signature::SIGNATURE_HEADER),
                    HeaderName::from_static(super::signature::TIMESTAMP_HEADER),
                    super::request_id::HEADER,
                ])
                // What a widget reads from a reply besides the body.
                .expose_headers([
                    HeaderName::from_static("tidings-repeated"),
                    header::RETRY_AFTER,
                    super::request_id::HEADER,
                ])
                .max_age(PREFLIGHT_MAX_AGE),
        )
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn origins_are_checked() {
        let c = Cors::new(["https://news.example", " http://localhost:3000 ", ""]).unwrap();
        assert_eq!(c.origins.len(), 2);
        assert!(c.layer().is_some());
        assert!(Cors::new([]).unwrap().layer().is_none());
        for bad in [
            "news.example",
            "https://news.example/",
            "*",
            "https://",
            "ftp://x",
        ] {
            assert_eq!(
                Cors::new([bad]).unwrap_err(),
                CorsError::BadOrigin(bad.into()),
                "{bad}"
            );
        }
    }
}
