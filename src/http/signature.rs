//! Signed messages: when a signing secret is configured, every
//! `POST /v1/messages` carries `tidings-timestamp` (Unix seconds) and
//! `tidings-signature` (hex HMAC-SHA256 of `timestamp + "." + body` under
//! the secret). That proves the platform sent the body as it is, and the
//! timestamp bounds how long a captured request stays usable.
//!
//! Within the window (five minutes by default, either side of this
//! server's clock) a captured request could still be sent again, so the
//! signatures seen lately are kept and a second use is refused. The cache
//! is bounded: past its size the oldest are forgotten (and a warning
//! says the cache is too small for the traffic). It lives in this
//! process, so with several replicas a replay to another replica is
//! caught by the message id's retry handling only.
//!
//! Several secrets may be configured at once, so a secret can be rotated:
//! a signature under any of them passes.

use std::collections::{HashSet, VecDeque};
use std::sync::Mutex;
use std::time::{Duration, Instant, SystemTime, UNIX_EPOCH};

use axum::body::Body;
use axum::extract::{Request, State};
use axum::http::{Method, StatusCode};
use axum::middleware::Next;
use axum::response::{IntoResponse, Response};
use hmac::{Hmac, Mac};
use sha2::Sha256;

use super::ApiError;

/// The header with the signature, lowercase hex.
pub const SIGNATURE_HEADER: &str = "tidings-signature";
/// The header with the signing time, in Unix seconds.
pub const TIMESTAMP_HEADER: &str = "tidings-timestamp";
/// How far a timestamp may be from this server's clock, by default.
pub const DEFAULT_WINDOW: Duration = Duration::from_secs(300);
/// Signatures remembered at most, by default: five minutes of 150
/// messages a second.
pub const DEFAULT_SEEN: usize = 45_000;

/// HMAC-SHA256 of `message` under `key` (RFC 2104 with SHA-256).
pub fn hmac_sha256(key: &[u8], message: &[u8]) -> [u8; 32] {
    let mut mac = Hmac::<Sha256>::new_from_slice(key).expect("HMAC takes keys of any length");
    mac.update(message);
    mac.finalize().into_bytes().into()
}

/// The signature a sender puts in [`SIGNATURE_HEADER`] for `body` signed
/// at `timestamp` (Unix seconds).
pub fn sign(secret: &[u8], timestamp: i64, body: &[u8]) -> String {
    hex::encode(hmac_sha256(secret, &signed_bytes(timestamp, body)))
}

fn signed_bytes(timestamp: i64, body: &[u8]) -> Vec<u8> {
    let mut m = format!("{timestamp}.").into_bytes();
    m.extend_from_slice(body);
    m
}

/// Why a message's signature was refused.
#[derive(Debug, thiserror::Error, PartialEq)]
pub enum SignatureError {
    #[error("send {TIMESTAMP_HEADER} and {SIGNATURE_HEADER}: messages must be signed")]
    Missing,
    #[error("{TIMESTAMP_HEADER} must be a whole number of seconds since 1970 (Unix time)")]
    BadTimestamp,
    #[error("{TIMESTAMP_HEADER} is more than {0} seconds from the server's clock: sign the message when you send it")]
    Stale(u64),
    #[error(
        "the signature does not match the body: sign timestamp + \".\" + the exact body bytes"
    )]
    Bad,
    #[error("this signature was already used: a message is signed afresh each time it is sent")]
    Replayed,
}

impl From<SignatureError> for ApiError {
    fn from(e: SignatureError) -> ApiError {
        let code = match e {
            SignatureError::Missing => "missing_signature",
            SignatureError::BadTimestamp => "bad_timestamp",
            SignatureError::Stale(_) => "stale_signature",
            SignatureError::Bad => "bad_signature",
            SignatureError::Replayed => "replayed_signature",
        };
        ApiError {
            status: StatusCode::UNAUTHORIZED,
            code,
            message: e.to_string(),
            retry_after: None,
        }
    }
}

/// The verification settings and the signatures seen lately.
pub struct Signing {
    secrets: Vec<Vec<u8>>,
    window: Duration,
    seen: Mutex<Seen>,
    /// One warning per minute when the cache forgets signatures early.
    evicted_log: crate::log_gate::SharedLogGate,
}

// By hand: the secrets never reach a log.
impl std::fmt::Debug for Signing {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("Signing")
            .field("secrets", &self.secrets.len())
            .field("window", &self.window)
            .finish()
    }
}

#[derive(Debug)]
struct Seen {
    cap: usize,
    order: VecDeque<([u8; 32], Instant)>,
    set: HashSet<[u8; 32]>,
}

impl Signing {
    /// Verification under `secrets` (any one passes), with timestamps
    /// allowed `window` either side of this clock and at most `seen`
    /// signatures remembered.
    pub fn new(secrets: Vec<Vec<u8>>, window: Duration, seen: usize) -> Signing {
        Signing {
            secrets,
            window,
            seen: Mutex::new(Seen {
                cap: seen.max(1),
                order: VecDeque::new(),
                set: HashSet::new(),
            }),
            evicted_log: crate::log_gate::SharedLogGate::new(Duration::from_secs(60)),
        }
    }

    /// Checks a message signed at `timestamp` with `signature` (hex),
    /// `now` being this clock in Unix seconds, and remembers it.
    pub fn check(
        &self,
        timestamp: Option<&str>,
        signature: Option<&str>,
        body: &[u8],
        now: i64,
    ) -> Result<(), SignatureError> {
        let (Some(timestamp), Some(signature)) = (timestamp, signature) else {
            return Err(SignatureError::Missing);
        };
        let ts: i64 = timestamp
            .trim()
            .parse()
            .map_err(|_| SignatureError::BadTimestamp)?;
        let window = self.window.as_secs();
        if now.abs_diff(ts) > window {
            return Err(SignatureError::Stale(window));
        }
        let mut given = [0u8; 32];
        hex::decode_to_slice(signature.trim(), &mut given).map_err(|_| SignatureError::Bad)?;
        let message = signed_bytes(ts, body);
        let mut matched = false;
        for secret in &self.secrets {
            let want = hmac_sha256(secret, &message);
            // Constant time: how far a guess got is not in the timing.
            let diff = want
                .iter()
                .zip(given.iter())
                .fold(0u8, |a, (x, y)| a | (x ^ y));
            matched |= diff == 0;
        }
        if !matched {
            return Err(SignatureError::Bad);
        }
        self.remember(given)
    }

    /// Records a verified signature; a second use is refused.
    fn remember(&self, signature: [u8; 32]) -> Result<(), SignatureError> {
        let now = Instant::now();
        // A signature can be used while its timestamp is within the
        // window, and the timestamp may be up to a window ahead of this
        // clock: two windows after it is first seen, it is stale anyway.
        let keep = self.window * 2;
        let mut seen = self.seen.lock().unwrap_or_else(|p| p.into_inner());
        while let Some((sig, at)) = seen.order.front().copied() {
            if now.saturating_duration_since(at) <= keep {
                break;
            }
            seen.order.pop_front();
            seen.set.remove(&sig);
        }
        if !seen.set.insert(signature) {
            return Err(SignatureError::Replayed);
        }
        seen.order.push_back((signature, now));
        let mut evicted = 0;
        while seen.order.len() > seen.cap {
            if let Some((sig, _)) = seen.order.pop_front() {
                seen.set.remove(&sig);
                evicted += 1;
            }
        }
        drop(seen);
        if evicted > 0 {
            if let Some(held) = self.evicted_log.pass() {
                tracing::warn!(
                    held_back = held,
                    "the cache of seen signatures is full: signatures are forgotten before their window ends"
                );
            }
        }
        Ok(())
    }
}

fn unix_now() -> i64 {
    SystemTime::now()
        .duration_since(UNIX_EPOCH)
        .map_or(0, |d| d.as_secs() as i64)
}

/// Verifies `POST /v1/messages` when signing is configured; the body is
/// read here (up to the message limit) and handed on as it came.
pub async fn verify(
    State(edge): State<std::sync::Arc<super::EdgeState>>,
    req: Request,
    next: Next,
) -> Response {
    let Some(signing) = &edge.signing else {
        return next.run(req).await;
    };
    if req.method() != Method::POST || req.uri().path() != "/v1/messages" {
        return next.run(req).await;
    }
    let (parts, body) = req.into_parts();
    let header = |name: &str| parts.headers.get(name).and_then(|v| v.to_str().ok());
    let bytes =
        match axum::body::to_bytes(body, super::MAX_BODY).await {
            Ok(b) => b,
            Err(_) => return ApiError {
                status: StatusCode::PAYLOAD_TOO_LARGE,
                code: "body_too_large",
                message:
                    "the request body is larger than this endpoint accepts (16 KiB for messages)"
                        .into(),
                retry_after: None,
            }
            .into_response(),
        };
    if let Err(e) = signing.check(
        header(TIMESTAMP_HEADER),
        header(SIGNATURE_HEADER),
        &bytes,
        unix_now(),
    ) {
        tracing::info!(reason = %e, "message signature refused");
        return ApiError::from(e).into_response();
    }
    next.run(Request::from_parts(parts, Body::from(bytes)))
        .await
}

#[cfg(test)]
mod tests {
    use super::*;

    /// RFC 4231 section 4, test cases 1 to 4 and 6 to 7 (HMAC-SHA-256
    /// rows); case 5 is a truncated output and is left out.
    #[test]
    fn hmac_sha256_matches_the_rfc_4231_test_vectors() {
        let cases: [(&str, Vec<u8>, Vec<u8>, &str); 6] = [
            (
                "RFC 4231 test case 1",
                vec![0x0b; 20],
                b"Hi There".to_vec(),
                "b0344c61d8db38535ca8afceaf0bf12b881dc200c9833da726e9376c2e32cff7",
            ),
            (
                "RFC 4231 test case 2",
                b"Jefe".to_vec(),
                b"what do ya want for nothing?".to_vec(),
                "5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843",
            ),
            (
                "RFC 4231 test case 3",
                vec![0xaa; 20],
                vec![0xdd; 50],
                "773ea91e36800e46854db8ebd09181a72959098b3ef8c122d9635514ced565fe",
            ),
            (
                "RFC 4231 test case 4",
                (0x01..=0x19).collect(),
                vec![0xcd; 50],
                "82558a389a443c0ea4cc819899f2083a85f0faa3e578f8077a2e3ff46729665b",
            ),
            (
                "RFC 4231 test case 6",
                vec![0xaa; 131],
                b"Test Using Larger Than Block-Size Key - Hash Key First".to_vec(),
                "60e431591ee0b67f0d8a26aacbf5b77f8e0bc6213728c5140546040f0ee37f54",
            ),
            (
                "RFC 4231 test case 7",
                vec![0xaa; 131],
                b"This is a test using a larger than block-size key and a larger than block-size data. The key needs to be hashed before being used by the HMAC algorithm.".to_vec(),
                "9b09ffa71b942fcb27635fbcd5b0e944bfdc63644f0713938a7f51535c3a35e2",
            ),
        ];
        for (name, key, data, want) in cases {
            assert_eq!(hex::encode(hmac_sha256(&key, &data)), want, "{name}");
        }
    }

    const NOW: i64 = 1_818_000_000;

    fn signing() -> Signing {
        Signing::new(
            vec![b"old-secret".to_vec(), b"new-secret".to_vec()],
            DEFAULT_WINDOW,
            3,
        )
    }

    #[test]
    fn a_signature_passes_once_under_either_secret() {
        let s = signing();
        let body = br#"{"user":"r1","text":"hi"}"#;
        for secret in [&b"old-secret"[..], b"new-secret"] {
            let ts = NOW.to_string();
            let sig = sign(secret, NOW, body);
            assert_eq!(s.check(Some(&ts), Some(&sig), body, NOW), Ok(()));
            assert_eq!(
                s.check(Some(&ts), Some(&sig), body, NOW),
                Err(SignatureError::Replayed)
            );
        }
    }

    #[test]
    fn bad_stale_and_missing_signatures_are_refused() {
        let s = signing();
        let body = b"{}";
        let ts = NOW.to_string();
        let sig = sign(b"new-secret", NOW, body);
        assert_eq!(
            s.check(None, Some(&sig), body, NOW),
            Err(SignatureError::Missing)
        );
        assert_eq!(
            s.check(Some("soon"), Some(&sig), body, NOW),
            Err(SignatureError::BadTimestamp)
        );
        // Another body, another secret, or not hex at all.
        assert_eq!(
            s.check(Some(&ts), Some(&sig), b"{ }", NOW),
            Err(SignatureError::Bad)
        );
        let other = sign(b"not-our-secret", NOW, body);
        assert_eq!(
            s.check(Some(&ts), Some(&other), body, NOW),
            Err(SignatureError::Bad)
        );
        assert_eq!(
            s.check(Some(&ts), Some("zz"), body, NOW),
            Err(SignatureError::Bad)
        );
        // The timestamp is part of what is signed.
        let later = (NOW + 1).to_string();
        assert_eq!(
            s.check(Some(&later), Some(&sig), body, NOW),
            Err(SignatureError::Bad)
        );
        // Five minutes either side pass; a second more does not.
        for off in [-300, 300] {
            let t = NOW + off;
            let sig = sign(b"new-secret", t, body);
            assert_eq!(s.check(Some(&t.to_string()), Some(&sig), body, NOW), Ok(()));
        }
        for off in [-301, 301] {
            let t = NOW + off;
            let sig = sign(b"new-secret", t, body);
            assert_eq!(
                s.check(Some(&t.to_string()), Some(&sig), body, NOW),
                Err(SignatureError::Stale(300))
            );
        }
    }

    #[test]
    fn the_seen_cache_stays_within_its_size() {
        let s = signing();
        for i in 0..10 {
            let body = format!("{{\"n\":{i}}}");
            let sig = sign(b"new-secret", NOW, body.as_bytes());
            assert_eq!(
                s.check(Some(&NOW.to_string()), Some(&sig), body.as_bytes(), NOW),
                Ok(())
            );
        }
        let seen = s.seen.lock().unwrap();
        assert_eq!(seen.order.len(), 3);
        assert_eq!(seen.set.len(), 3);
    }
}
