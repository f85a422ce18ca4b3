//! Tidings answers readers' questions about a newsroom's results data, in
//! their own words, with follow-ups, phrased for the channel they use.
//!
//! # Module map
//!
//! - [`dataset`]: the results model (contests, competitors, groups,
//!   results), loading and validating a scenario's files, live batches of
//!   changes and the copy replicas share.
//! - [`catalog`]: the intents editors write in YAML and their reply wording
//!   ([`catalog::template`]).
//! - [`understand`]: normalising text, finding names (exact and fuzzy),
//!   scoring intents, filling slots.
//! - [`answers`]: the closed set of data operations ([`answers::ops`]), the
//!   values and words they are phrased with, and the channels (chat, SMS,
//!   voice, plain) replies are shaped for.
//! - [`dialogue`]: sessions, their stores and one turn of a conversation.
//! - [`engine`]: the current snapshot, the store and the clock behind one
//!   entry point, [`engine::Engine::handle`].
//! - [`http`]: the HTTP API, including the admin API and the editors' desk
//!   page (`/desk`). [`cli`]: the command line. [`eval`]: measuring
//!   quality on a labelled question set.
//!   [`scripts`]: editors' conversation scripts (`tidings test`).
//!   [`watch`]: reloading changed files while serving. [`check`]:
//!   checking editors' files (`tidings check PATHS`). [`replay`]: feeding
//!   a night's change batches to a running server (`tidings replay`).
//!   [`log_gate`]: one log line per interval for faults that repeat.
//!   [`metrics`]: what the service counts about itself (`GET /metrics`).
//!   [`privacy`]: masking personal data in readers' words before any is kept.
//!
//! # Quick example
//!
//! ```
//! # tokio::runtime::Runtime::new().unwrap().block_on(async {
//! use std::sync::Arc;
//! use tidings::engine::{self, Clock, Engine, Settings, Sources};
//! use tidings::dialogue::MemoryStore;
//!
//! let snap = engine::load(&Sources::default()).unwrap();
//! let settings = Settings::with_clock(Clock::System, b"example".to_vec());
//! let engine = Engine::new(snap, Arc::new(MemoryStore::new()), settings);
//! let answer = engine.handle("reader-1", "chat", "hello").await.unwrap();
//! assert!(!answer.reply.text.is_empty());
//! # });
//! ```

#![forbid(unsafe_code)]

pub mod answers;
pub mod catalog;
pub mod check;
pub mod cli;
pub mod dataset;
pub mod dialogue;
pub mod engine;
pub mod eval;
pub mod http;
pub mod log_gate;
pub mod metrics;
pub mod privacy;
pub mod replay;
pub mod scripts;
pub mod understand;
pub mod watch;
