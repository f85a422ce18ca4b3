//! Where sessions live between messages, behind one trait so any replica can
//! answer the next message when the store is shared.
//!
//! The contract every store keeps (checked by one test suite run against
//! each implementation, `tests/store_contract.rs`):
//!
//! - a reader's data lives under one opaque key (`{channel}:{hmac}`), never
//!   a raw id;
//! - [`SessionStore::load`] reads the session, its version and the reply
//!   already given to a message id, in one round trip;
//! - [`SessionStore::save`] writes only if the version is still the one that
//!   was loaded (compare-and-set), so two messages handled at once never
//!   lose an update (versions start at a random number, so one never comes
//!   back after an erasure or an expiry); and it keeps the reply under the
//!   message id unless one
//!   is there already (set-if-absent), so a retried message gets the first
//!   reply back;
//! - sessions expire after an idle TTL, remembered replies after theirs;
//! - [`SessionStore::erase`] removes everything kept for a reader,
//!   including their share of the unanswered list;
//! - the unanswered list counts readers, not messages: one reader asking
//!   the same thing twice counts once, and one reader adds at most
//!   [`UNANSWERED_PER_READER`] questions, so one reader cannot fill it.

use std::collections::HashMap;
use std::future::Future;
use std::pin::Pin;
use std::sync::Mutex;
use std::time::{Duration, Instant};

use super::session::Session;

/// A boxed future, so the trait can be used as `dyn SessionStore`.
pub type BoxFuture<'a, T> = Pin<Box<dyn Future<Output = T> + Send + 'a>>;

/// Why the store could not do what was asked.
#[derive(Debug, thiserror::Error)]
pub enum StoreError {
    /// The backend could not be reached or answered with an error.
    #[error("session store unavailable: {0}")]
    Unavailable(String),
    /// Stored data could not be read back or written.
    #[error("stored session unreadable: {0}")]
    Corrupt(String),
}

/// What [`SessionStore::load`] found for a reader.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Loaded {
    /// The session, if one is kept and readable. A session that no longer
    /// parses counts as absent: the reader starts afresh instead of failing.
    pub session: Option<Session>,
    /// The version to pass back to [`SessionStore::save`]; 0 when nothing
    /// is stored.
    pub version: u64,
    /// The reply already given to the message id asked about, as stored.
    pub earlier_reply: Option<String>,
}

/// A reply to keep under a message id, for retries of that message.
#[derive(Debug, Clone, Copy)]
pub struct KeepReply<'a> {
    /// The message id, already hashed.
    pub message: &'a str,
    /// The reply as it was sent.
    pub reply: &'a str,
    /// How long retries of the message are recognised.
    pub ttl: Duration,
}

/// What [`SessionStore::save`] did.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Saved {
    /// The session (and the reply, if any) was stored.
    Stored,
    /// Someone else saved first: the version moved on. Nothing was written;
    /// load again and redo the turn.
    Conflict,
    /// The message was answered meanwhile (a retry racing its original):
    /// nothing was written and this is the reply given then.
    Answered(String),
}

/// A question readers asked that got no answer, with how many readers
/// asked it. No reader is named: only the masked, normalised text is kept.
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize)]
pub struct Unanswered {
    /// The question, normalised (case, accents and punctuation folded), so
    /// the same question asked differently is counted once.
    pub text: String,
    /// `not_understood`, or `abandoned` (a question asked back about and
    /// never answered).
    pub kind: String,
    pub count: u64,
}

/// At most this many distinct unanswered questions are kept; the least
/// asked go first.
pub const UNANSWERED_CAP: usize = 1000;

/// At most this many questions of one reader are counted on the list;
/// past it their unanswered questions are not noted.
pub const UNANSWERED_PER_READER: usize = 20;

/// Session storage keyed by an opaque reader key (already hashed).
pub trait SessionStore: Send + Sync + 'static {
    /// The reader's session and version, and the reply kept under
    /// `message` if that message was answered already.
    fn load<'a>(
        &'a self,
        reader: &'a str,
        message: Option<&'a str>,
    ) -> BoxFuture<'a, Result<Loaded, StoreError>>;

    /// Stores `session` if the stored version is still `expected`, with an
    /// idle expiry of `ttl`, and keeps `reply` under its message id if none
    /// is kept yet. Either everything is written or nothing.
    fn save<'a>(
        &'a self,
        reader: &'a str,
        session: &'a Session,
        expected: u64,
        ttl: Duration,
        reply: Option<KeepReply<'a>>,
    ) -> BoxFuture<'a, Result<Saved, StoreError>>;

    /// Removes everything kept for the reader: session, remembered replies
    /// and their counts on the unanswered list. Returns how many records
    /// were removed.
    fn erase<'a>(&'a self, reader: &'a str) -> BoxFuture<'a, Result<u64, StoreError>>;

    /// Counts `reader` as one more reader who asked `text` (of `kind`) and
    /// got no answer, unless they were counted for it already or have
    /// [`UNANSWERED_PER_READER`] questions counted.
    fn note_unanswered<'a>(
        &'a self,
        reader: &'a str,
        text: &'a str,
        kind: &'a str,
    ) -> BoxFuture<'a, Result<(), StoreError>>;

    /// The most asked unanswered questions, most frequent first.
    fn unanswered(&self, limit: usize) -> BoxFuture<'_, Result<Vec<Unanswered>, StoreError>>;

    /// Whether the store answers right now.
    fn ping(&self) -> BoxFuture<'_, Result<(), StoreError>>;

    /// A short name for logs and status.
    fn name(&self) -> &'static str;
}

/// The version a reader's first session starts at: random, not 1. After an
/// erasure or an expiry a new session starts again, and a turn that loaded
/// the old one must not find its version again (it would overwrite the new
/// session with erased context). Below 2^52, so Lua compares it exactly.
pub fn first_version() -> u64 {
    rand::random_range(1..(1u64 << 52))
}

/// Sessions in this process's memory: the default when no shared store is
/// configured. Expired records are dropped when touched and swept on save.
#[derive(Debug, Default)]
pub struct MemoryStore {
    // A std mutex: every critical section is a short map operation with no
    // await inside, so an async mutex would only add cost; holding it for
    // the whole of `save` is what makes compare-and-set atomic.
    inner: Mutex<Maps>,
}

#[derive(Debug, Default)]
struct Maps {
    /// (kind, normalised text) → readers who asked.
    unanswered: HashMap<(String, String), u64>,
    /// reader → the questions they are counted for, for erasure.
    noted: HashMap<String, std::collections::HashSet<(String, String)>>,
    sessions: HashMap<String, Kept>,
    /// (reader, message) → reply.
    replies: HashMap<(String, String), (String, Instant)>,
}

#[derive(Debug)]
struct Kept {
    session: Session,
    version: u64,
    expires: Instant,
}

impl MemoryStore {
    /// An empty store.
    pub fn new() -> MemoryStore {
        MemoryStore::default()
    }

    fn lock(&self) -> std::sync::MutexGuard<'_, Maps> {
        // A panic while holding the lock cannot leave the maps half-written
        // (every operation is a few inserts or removes that cannot panic),
        // so a poisoned lock is still safe to use.
        self.inner.lock().unwrap_or_else(|p| p.into_inner())
    }
}

impl Maps {
    fn sweep(&mut self, now: Instant) {
        self.sessions.retain(|_, k| k.expires > now);
        self.replies.retain(|_, (_, exp)| *exp > now);
    }

    fn version(&self, reader: &str, now: Instant) -> u64 {
        match self.sessions.get(reader) {
            Some(k) if k.expires > now => k.version,
            _ => 0,
        }
    }

    fn reply(&self, reader: &str, message: &str, now: Instant) -> Option<String> {
        self.replies
            .get(&(reader.to_string(), message.to_string()))
            .filter(|(_, exp)| *exp > now)
            .map(|(r, _)| r.clone())
    }
}

impl SessionStore for MemoryStore {
    fn load<'a>(
        &'a self,
        reader: &'a str,
        message: Option<&'a str>,
    ) -> BoxFuture<'a, Result<Loaded, StoreError>> {
        Box::pin(async move {
            let now = Instant::now();
            let maps = self.lock();
            let session = maps
                .sessions
                .get(reader)
                .filter(|k| k.expires > now)
                .map(|k| k.session.clone());
            Ok(Loaded {
                session,
                version: maps.version(reader, now),
                earlier_reply: message.and_then(|m| maps.reply(reader, m, now)),
            })
        })
    }

    fn save<'a>(
        &'a self,
        reader: &'a str,
        session: &'a Session,
        expected: u64,
        ttl: Duration,
        reply: Option<KeepReply<'a>>,
    ) -> BoxFuture<'a, Result<Saved, StoreError>> {
        Box::pin(async move {
            let now = Instant::now();
            let mut maps = self.lock();
            maps.sweep(now);
            if let Some(r) = reply {
                if let Some(earlier) = maps.reply(reader, r.message, now) {
                    return Ok(Saved::Answered(earlier));
                }
            }
            if maps.version(reader, now) != expected {
                return Ok(Saved::Conflict);
            }
            let version = if expected == 0 {
                first_version()
            } else {
                expected + 1
            };
            maps.sessions.insert(
                reader.to_string(),
                Kept {
                    session: session.clone(),
                    version,
                    expires: now + ttl,
                },
            );
            if let Some(r) = reply {
                maps.replies.insert(
                    (reader.to_string(), r.message.to_string()),
                    (r.reply.to_string(), now + r.ttl),
                );
            }
            Ok(Saved::Stored)
        })
    }

    fn erase<'a>(&'a self, reader: &'a str) -> BoxFuture<'a, Result<u64, StoreError>> {
        Box::pin(async move {
            let mut maps = self.lock();
            let mut removed = u64::from(maps.sessions.remove(reader).is_some());
            let before = maps.replies.len();
            maps.replies.retain(|(r, _), _| r != reader);
            removed += (before - maps.replies.len()) as u64;
            if let Some(noted) = maps.noted.remove(reader) {
                removed += 1;
                for k in noted {
                    if let Some(c) = maps.unanswered.get_mut(&k) {
                        *c = c.saturating_sub(1);
                        if *c == 0 {
                            maps.unanswered.remove(&k);
                        }
                    }
                }
            }
            Ok(removed)
        })
    }

    fn note_unanswered<'a>(
        &'a self,
        reader: &'a str,
        text: &'a str,
        kind: &'a str,
    ) -> BoxFuture<'a, Result<(), StoreError>> {
        Box::pin(async move {
            let mut maps = self.lock();
            let key = (kind.to_string(), text.to_string());
            let mine = maps.noted.entry(reader.to_string()).or_default();
            if mine.contains(&key) || mine.len() >= UNANSWERED_PER_READER {
                return Ok(());
            }
            mine.insert(key);
            *maps
                .unanswered
                .entry((kind.to_string(), text.to_string()))
                .or_insert(0) += 1;
            if maps.unanswered.len() > UNANSWERED_CAP {
                // Drop the least asked, never the one just counted: a new
                // question must get the chance to be asked again.
                let just = (kind.to_string(), text.to_string());
                if let Some(k) = maps
                    .unanswered
                    .iter()
                    .filter(|(k, _)| **k != just)
                    .min_by(|a, b| a.1.cmp(b.1).then_with(|| a.0.cmp(b.0)))
                    .map(|(k, _)| k.clone())
                {
                    maps.unanswered.remove(&k);
                }
            }
            Ok(())
        })
    }

    fn unanswered(&self, limit: usize) -> BoxFuture<'_, Result<Vec<Unanswered>, StoreError>> {
        Box::pin(async move {
            let maps = self.lock();
            let mut all: Vec<Unanswered> = maps
                .unanswered
                .iter()
                .map(|((kind, text), count)| Unanswered {
                    text: text.clone(),
                    kind: kind.clone(),
                    count: *count,
                })
                .collect();
            all.sort_by(|a, b| b.count.cmp(&a.count).then_with(|| a.text.cmp(&b.text)));
            all.truncate(limit);
            Ok(all)
        })
    }

    fn ping(&self) -> BoxFuture<'_, Result<(), StoreError>> {
        Box::pin(async { Ok(()) })
    }

    fn name(&self) -> &'static str {
        "memory"
    }
}
