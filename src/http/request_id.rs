//! Request ids: each request carries one, taken from its `x-request-id`
//! header when that is a usable id and made up otherwise, echoed in the
//! response's `x-request-id` and recorded on the request's tracing span,
//! so every log line written while the request is handled names it.
//!
//! A platform or proxy in front usually sets the header, and reusing its
//! id lets one message be followed through both logs. The id is a client's
//! text written into logs, so it is held to a short length and to
//! characters that cannot break a log line or forge a field: a header
//! outside those is replaced, not trimmed.

use axum::extract::Request;
use axum::http::{HeaderName, HeaderValue};
use axum::middleware::Next;
use axum::response::Response;

/// The header that carries the id, both ways.
pub const HEADER: HeaderName = HeaderName::from_static("x-request-id");

/// Longest id taken from a request: room for a UUID with a prefix or a
/// proxy's own format, not for a payload.
pub const MAX_LEN: usize = 128;

/// The request's id, in the request's extensions for the trace span.
#[derive(Debug, Clone)]
pub struct RequestId(pub String);

/// Whether `id` may be used as it is: 1 to [`MAX_LEN`] ASCII letters,
/// digits and `-_.:/+=` (enough for UUIDs, ULIDs, hex, base64 and the ids
/// proxies make).
pub fn acceptable(id: &str) -> bool {
    (1..=MAX_LEN).contains(&id.len())
        && id
            .bytes()
            .all(|b| b.is_ascii_alphanumeric() || b"-_.:/+=".contains(&b))
}

/// A fresh id: 16 random bytes in hex.
fn generate() -> String {
    hex::encode(rand::random::<[u8; 16]>())
}

/// Takes or makes the id, hands it to the layers inside, and puts it on
/// the response.
pub async fn tag(mut req: Request, next: Next) -> Response {
    let id = req
        .headers()
        .get(&HEADER)
        .and_then(|v| v.to_str().ok())
        .filter(|v| acceptable(v))
        .map(str::to_string)
        .unwrap_or_else(generate);
    req.extensions_mut().insert(RequestId(id.clone()));
    let mut response = next.run(req).await;
    // Always a valid header value: acceptable or hex.
    if let Ok(v) = HeaderValue::from_str(&id) {
        response.headers_mut().insert(HEADER, v);
    }
    response
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ids_are_short_and_of_safe_characters() {
        for ok in [
            "a",
            "3f2b9c1e-8d4a-4c7b-9a0e-1f2d3c4b5a69",
            "01HZX3K5Q7V8W9Y0ABCDEFGHJK",
            "edge/1:abc+def=",
            &"x".repeat(MAX_LEN),
        ] {
            assert!(acceptable(ok), "{ok}");
        }
        for bad in [
            "",
            &"x".repeat(MAX_LEN + 1),
            "two words",
            "line\nbreak",
            "quote\"d",
            "brace{}",
            "zoë",
            "a=b c=d",
        ] {
            assert!(!acceptable(bad), "{bad:?}");
        }
    }

    #[test]
    fn a_made_up_id_is_acceptable_and_new_each_time() {
        let (a, b) = (generate(), generate());
        assert!(acceptable(&a) && acceptable(&b));
        assert_eq!(a.len(), 32);
        assert_ne!(a, b);
    }
}
