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

use std::future::Future;
use std::pin::Pin;
use std::time::Duration;

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
#[derive(Debug, Clone, PartialEq, Eq, serde::Serialize, schemars::JsonSchema)]
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

    /// How many network round trips the store has made, for a store that
    /// makes any (one in this process's memory makes none).
    fn round_trips(&self) -> Option<u64> {
        None
    }
}

/// The version a reader's first session starts at: random, not 1. After an
/// erasure or an expiry a new session starts again, and a turn that loaded
/// the old one must not find its version again (it would overwrite the new
/// session with erased context). Below 2^52, so Lua compares it exactly.
pub fn first_version() -> u64 {
    rand::random_range(1..(1u64 << 52))
}
