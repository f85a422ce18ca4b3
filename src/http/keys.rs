//! Client keys: one per integration (a chat platform, an SMS gateway, the
//! newsroom's desk), each with a name and a rate limit of its own.
//!
//! A key is kept only as its SHA-256 digest, and a presented key is hashed
//! and compared with every digest in constant time, so neither a memory
//! dump nor response timing gives a key away. Several keys may share a
//! name: that is how a key is rotated (add the new one, move the client
//! over, remove the old one) without a moment where neither works, and the
//! two share the name's rate limit. Logs name a key by its name, never by
//! its value.
//!
//! With keys configured, `POST /v1/messages` and `DELETE /v1/users/...`
//! need one (`Authorization: Bearer <key>`, or HTTP Basic with the key as
//! the password); the desk page needs a key marked `desk` or the admin
//! token. Basic is there for the desk: a browser asks for it by itself and
//! sends it again with the page's own requests, so the desk's messages
//! carry the editor's key without the page ever holding it.

use std::sync::Arc;

use axum::extract::{Request, State};
use axum::http::{header, HeaderMap, StatusCode};
use axum::middleware::Next;
use axum::response::{IntoResponse, Response};
use base64::Engine as _;
use sha2::{Digest, Sha256};
use tracing::Instrument;

use super::limit::Rate;
use super::{ApiError, EdgeState};
use crate::engine::Engine;

/// Shortest key accepted: a key is a random value, not a password.
pub const MIN_KEY_LEN: usize = 16;

/// One configured key.
#[derive(Clone, PartialEq)]
pub struct ClientKey {
    /// How logs and rate limits name it.
    pub name: String,
    digest: [u8; 32],
    /// Its own rate limit, else the default per-key one.
    pub rate: Option<Rate>,
    /// Whether it opens the desk page.
    pub desk: bool,
}

// By hand, so a digest never reaches a log through `{:?}`.
impl std::fmt::Debug for ClientKey {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("ClientKey")
            .field("name", &self.name)
            .field("rate", &self.rate)
            .field("desk", &self.desk)
            .finish()
    }
}

/// A key line that cannot be used.
#[derive(Debug, thiserror::Error, PartialEq)]
pub enum KeyError {
    #[error("a key line is `NAME KEY [rate=N] [burst=N] [desk]`; this one has no key")]
    Incomplete,
    #[error("key name {0:?} must be 1 to 64 letters, digits, '.', '_' or '-'")]
    BadName(String),
    #[error(
        "the key of {0:?} must be at least {MIN_KEY_LEN} characters, or sha256: and 64 hex digits"
    )]
    ShortKey(String),
    #[error("the key of {0:?} starts with sha256: but is not 64 hex digits after it")]
    BadDigest(String),
    #[error("{0:?} is not a setting of a key: use rate=N, burst=N or desk")]
    UnknownSetting(String),
    #[error("{0:?} needs a number above zero")]
    BadNumber(String),
    #[error("{0:?} sets a burst without a rate: give rate=N as well")]
    BurstWithoutRate(String),
    #[error("the key of {0:?} is given twice")]
    Duplicate(String),
    #[error(
        "the lines of {0:?} disagree on its rate or desk setting: keys of one name share them"
    )]
    Mismatch(String),
}

impl ClientKey {
    /// Parses `NAME KEY [rate=N] [burst=N] [desk]`. `KEY` is the key itself
    /// or `sha256:<64 hex digits>`, its digest, so a key file need not hold
    /// the key.
    pub fn parse(line: &str) -> Result<ClientKey, KeyError> {
        let mut words = line.split_whitespace();
        let name = words.next().ok_or(KeyError::Incomplete)?;
        let valid_name = name.len() <= 64
            && name
                .chars()
                .all(|c| c.is_ascii_alphanumeric() || matches!(c, '.' | '_' | '-'));
        if !valid_name {
            return Err(KeyError::BadName(name.to_string()));
        }
        let key = words.next().ok_or(KeyError::Incomplete)?;
        let digest = match key.strip_prefix("sha256:") {
            Some(hexed) => {
                let mut d = [0u8; 32];
                hex::decode_to_slice(hexed, &mut d)
                    .map_err(|_| KeyError::BadDigest(name.to_string()))?;
                d
            }
            None if key.chars().count() < MIN_KEY_LEN => {
                return Err(KeyError::ShortKey(name.to_string()))
            }
            None => digest(key),
        };
        let (mut per_second, mut burst, mut desk) = (None, None, false);
        for w in words {
            let number = |v: &str| {
                v.parse::<f64>()
                    .ok()
                    .filter(|n| n.is_finite() && *n > 0.0)
                    .ok_or_else(|| KeyError::BadNumber(w.to_string()))
            };
            match w.split_once('=') {
                Some(("rate", v)) => per_second = Some(number(v)?),
                Some(("burst", v)) => burst = Some(number(v)?),
                None if w == "desk" => desk = true,
                _ => return Err(KeyError::UnknownSetting(w.to_string())),
            }
        }
        // A rate alone gets a burst of two seconds' worth; a burst alone
        // would leave the sustained rate a guess, so it is refused.
        let rate = match (per_second, burst) {
            (None, None) => None,
            (Some(r), b) => Some(Rate::new(r, b.unwrap_or(r * 2.0).max(1.0))),
            (None, Some(_)) => return Err(KeyError::BurstWithoutRate(name.to_string())),
        };
        Ok(ClientKey {
            name: name.to_string(),
            digest,
            rate,
            desk,
        })
    }
}

/// The SHA-256 digest of a key.
pub fn digest(key: &str) -> [u8; 32] {
    Sha256::digest(key.as_bytes()).into()
}

/// Every configured key; none means the message API is open.
#[derive(Debug, Clone, Default)]
pub struct ClientKeys {
    keys: Vec<ClientKey>,
}

impl ClientKeys {
    /// Keys from lines of `NAME KEY [settings]`; blank lines and lines
    /// starting with `#` are skipped. A problem names its line (1-based,
    /// counted in `lines`).
    pub fn parse<'a>(
        lines: impl IntoIterator<Item = &'a str>,
    ) -> Result<ClientKeys, (usize, KeyError)> {
        let mut keys = ClientKeys::default();
        for (i, line) in lines.into_iter().enumerate() {
            let line = line.trim();
            if line.is_empty() || line.starts_with('#') {
                continue;
            }
            let key = ClientKey::parse(line).map_err(|e| (i + 1, e))?;
            keys.add(key).map_err(|e| (i + 1, e))?;
        }
        Ok(keys)
    }

    /// Adds a key; the same key twice, or two lines of one name with
    /// different settings, are refused.
    pub fn add(&mut self, key: ClientKey) -> Result<(), KeyError> {
        if self.keys.iter().any(|k| k.digest == key.digest) {
            return Err(KeyError::Duplicate(key.name));
        }
        if self
            .keys
            .iter()
            .any(|k| k.name == key.name && (k.rate != key.rate || k.desk != key.desk))
        {
            return Err(KeyError::Mismatch(key.name));
        }
        self.keys.push(key);
        Ok(())
    }

    /// Whether any key is configured.
    pub fn is_empty(&self) -> bool {
        self.keys.is_empty()
    }

    /// The names of the keys, once each, in order.
    pub fn names(&self) -> Vec<&str> {
        let mut names: Vec<&str> = Vec::new();
        for k in &self.keys {
            if !names.contains(&k.name.as_str()) {
                names.push(&k.name);
            }
        }
        names
    }

    /// The key `presented` is, if any. Every digest is compared, in
    /// constant time each, so the time taken says nothing about which
    /// key came close.
    pub fn find(&self, presented: &str) -> Option<&ClientKey> {
        let d = digest(presented);
        let mut found = None;
        for k in &self.keys {
            let diff = k
                .digest
                .iter()
                .zip(d.iter())
                .fold(0u8, |a, (x, y)| a | (x ^ y));
            if diff == 0 {
                found = Some(k);
            }
        }
        found
    }

    /// Logs, once at start-up, whether the message API is open or which
    /// keys guard it (by name).
    pub fn announce(&self) {
        if self.is_empty() {
            tracing::warn!(
                "no client keys configured: POST /v1/messages and DELETE /v1/users are open to anyone who can reach the service"
            );
        } else {
            tracing::info!(keys = %self.names().join(","), "client keys required");
        }
    }
}

/// The credential of a request: a Bearer token, or the password of HTTP
/// Basic (the user name is not looked at). The scheme names are
/// case-insensitive (RFC 7235 §2.1).
pub fn presented(headers: &HeaderMap) -> Option<String> {
    let v = headers.get(header::AUTHORIZATION)?.to_str().ok()?;
    let (scheme, rest) = v.split_once(' ')?;
    let rest = rest.trim();
    if scheme.eq_ignore_ascii_case("bearer") {
        return Some(rest.to_string());
    }
    if scheme.eq_ignore_ascii_case("basic") {
        let raw = base64::engine::general_purpose::STANDARD
            .decode(rest)
            .ok()?;
        let text = String::from_utf8(raw).ok()?;
        return text
            .split_once(':')
            .map(|(_, password)| password.to_string());
    }
    None
}

/// Which guard a path is behind.
enum Guarded {
    /// A reader-facing route: a client key.
    Reader,
    /// The desk page and its files: a desk key or the admin token.
    Desk,
}

fn guarded(path: &str) -> Option<Guarded> {
    if path == "/v1/messages" || path.starts_with("/v1/users/") {
        Some(Guarded::Reader)
    } else if path == "/desk" || path.starts_with("/desk/") {
        Some(Guarded::Desk)
    } else {
        None
    }
}

fn unauthorized(code: &'static str, message: &str) -> ApiError {
    ApiError {
        status: StatusCode::UNAUTHORIZED,
        code,
        message: message.into(),
        retry_after: None,
    }
}

/// The guard of the reader-facing routes and the desk. A request that
/// passes with a key runs inside a `client` span naming the key, so every
/// line it logs says which integration sent it.
pub async fn guard(
    State((edge, engine)): State<(Arc<EdgeState>, Engine)>,
    req: Request,
    next: Next,
) -> Response {
    let keys = &edge.keys;
    let credential = presented(req.headers());
    match guarded(req.uri().path()) {
        None => next.run(req).await,
        Some(Guarded::Reader) if keys.is_empty() => next.run(req).await,
        Some(Guarded::Reader) => {
            let Some(credential) = credential else {
                return unauthorized(
                    "missing_key",
                    "send the client key as Authorization: Bearer <key>",
                )
                .into_response();
            };
            let key = match keys.find(&credential) {
                Some(k) => k,
                // The admin token opens the desk, so the desk's own
                // messages, sent with it, are let through as well.
                None if engine.admin_allows(&credential) == Some(true) => {
                    return run_as(&edge, "admin", None, req, next).await;
                }
                None => {
                    return unauthorized("bad_key", "the client key is not valid").into_response()
                }
            };
            run_as(&edge, &key.name, key.rate, req, next).await
        }
        Some(Guarded::Desk) => {
            let needed = !keys.is_empty() || engine.admin_allows("").is_some();
            if !needed {
                return next.run(req).await;
            }
            let allowed = credential.as_deref().is_some_and(|c| {
                keys.find(c).is_some_and(|k| k.desk) || engine.admin_allows(c) == Some(true)
            });
            if allowed {
                return next.run(req).await;
            }
            // A browser shows its own sign-in box on this challenge.
            (
                [(
                    header::WWW_AUTHENTICATE,
                    "Basic realm=\"tidings desk\", charset=\"UTF-8\"",
                )],
                unauthorized(
                    "desk_locked",
                    "the desk needs a desk key or the admin token, as the password of HTTP Basic",
                ),
            )
                .into_response()
        }
    }
}

/// Runs the request as the key `name`, after its rate limit.
async fn run_as(
    edge: &EdgeState,
    name: &str,
    rate: Option<Rate>,
    req: Request,
    next: Next,
) -> Response {
    if let Err(e) = edge.take(
        &edge.key_buckets,
        name,
        rate.or(edge.rates.per_key),
        "this client key",
    ) {
        tracing::info!(key = %name, "client key over its rate limit");
        return e.into_response();
    }
    next.run(req)
        .instrument(tracing::info_span!("client", key = %name))
        .await
}

#[cfg(test)]
mod tests {
    use super::*;

    const KEY: &str = "k-0123456789abcdef";

    #[test]
    fn a_key_line_is_parsed_and_only_its_digest_kept() {
        let k = ClientKey::parse(&format!("chat-app {KEY} rate=5 burst=20 desk")).unwrap();
        assert_eq!(k.name, "chat-app");
        assert_eq!(k.rate, Some(Rate::new(5.0, 20.0)));
        assert!(k.desk);
        assert_eq!(k.digest, digest(KEY));
        assert!(!format!("{k:?}").contains(KEY));
        // The same key given by its digest.
        let by_digest =
            ClientKey::parse(&format!("chat-app sha256:{}", hex::encode(digest(KEY)))).unwrap();
        assert_eq!(by_digest.digest, k.digest);
        assert_eq!(by_digest.rate, None);
    }

    #[test]
    fn bad_lines_say_what_is_wrong() {
        assert_eq!(ClientKey::parse("lonely"), Err(KeyError::Incomplete));
        assert_eq!(
            ClientKey::parse("a/b 0123456789abcdefgh"),
            Err(KeyError::BadName("a/b".into()))
        );
        assert_eq!(
            ClientKey::parse("short tooshort"),
            Err(KeyError::ShortKey("short".into()))
        );
        assert_eq!(
            ClientKey::parse("d sha256:abcd"),
            Err(KeyError::BadDigest("d".into()))
        );
        assert_eq!(
            ClientKey::parse(&format!("x {KEY} speed=3")),
            Err(KeyError::UnknownSetting("speed=3".into()))
        );
        assert_eq!(
            ClientKey::parse(&format!("x {KEY} rate=-1")),
            Err(KeyError::BadNumber("rate=-1".into()))
        );
    }

    #[test]
    fn keys_of_one_name_rotate_and_duplicates_are_refused() {
        let keys = ClientKeys::parse([
            "# rotation of the chat app's key",
            "chat-app old-key-0123456789ab",
            "",
            "chat-app new-key-0123456789ab",
            "sms sms-key-0123456789abcd rate=2",
        ])
        .unwrap();
        assert_eq!(keys.names(), ["chat-app", "sms"]);
        assert_eq!(keys.find("old-key-0123456789ab").unwrap().name, "chat-app");
        assert_eq!(keys.find("new-key-0123456789ab").unwrap().name, "chat-app");
        assert_eq!(keys.find("sms-key-0123456789abcd").unwrap().name, "sms");
        assert!(keys.find("old-key-0123456789aX").is_none());
        assert!(keys.find("").is_none());
        let twice = ClientKeys::parse(["a same-key-0123456789ab", "b same-key-0123456789ab"]);
        assert_eq!(twice.unwrap_err(), (2, KeyError::Duplicate("b".into())));
        let mismatch = ClientKeys::parse(["a key-one-0123456789ab", "a key-two-0123456789ab desk"]);
        assert_eq!(mismatch.unwrap_err(), (2, KeyError::Mismatch("a".into())));
    }

    #[test]
    fn bearer_and_basic_credentials_are_read() {
        let with = |v: &str| {
            let mut h = HeaderMap::new();
            h.insert(header::AUTHORIZATION, v.parse().unwrap());
            presented(&h)
        };
        assert_eq!(with("Bearer abc").as_deref(), Some("abc"));
        assert_eq!(with("bearer abc").as_deref(), Some("abc"));
        // "editor:s3cret:with:colons" (RFC 7617: the password may hold colons).
        let basic = base64::engine::general_purpose::STANDARD.encode("editor:s3cret:with:colons");
        assert_eq!(
            with(&format!("Basic {basic}")).as_deref(),
            Some("s3cret:with:colons")
        );
        assert_eq!(with("Basic !!!"), None);
        assert_eq!(with("Token abc"), None);
        assert_eq!(presented(&HeaderMap::new()), None);
    }
}
