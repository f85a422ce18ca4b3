//! Dialogue: one reader's conversation, turn by turn.
//!
//! - [`session`]: what is kept between messages;
//! - [`store`]: where it is kept (the [`store::SessionStore`] trait);
//! - [`turn`]: one message in, one reply out, given the session.

pub mod session;
pub mod store;
pub mod turn;

pub use session::Session;
pub use store::{MemoryStore, SessionStore, StoreError};
pub use turn::{Outcome, Reply};
