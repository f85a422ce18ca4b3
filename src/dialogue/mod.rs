//! Dialogue: one reader's conversation, turn by turn.
//!
//! - [`session`]: what is kept between messages;
//! - [`store`]: where it is kept (the [`store::SessionStore`] trait);
//! - [`memory_store`]: the store in this process's memory, capped;
//! - [`redis_store`]: the store shared by replicas, in Redis;
//! - [`context`]: what the conversation adds to a message (follow-ups,
//!   pronouns, details carried over);
//! - [`choose`]: which intent answers the question that was asked, or
//!   what about it cannot be answered;
//! - [`turn`]: one message in, one reply out, given the session.

pub mod choose;
pub mod context;
pub mod memory_store;
pub mod redis_store;
pub mod session;
pub mod store;
pub mod turn;

pub use memory_store::MemoryStore;
pub use redis_store::RedisStore;
pub use session::Session;
pub use store::{KeepReply, Loaded, Saved, SessionStore, StoreError, Unanswered};
pub use turn::{Outcome, Reply};
