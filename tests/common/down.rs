//! A session store that is down for good, for tests of what an outage
//! does: every call fails as unavailable, and calls to put a question on
//! the unanswered list are counted.

use std::sync::atomic::{AtomicUsize, Ordering};
use std::time::Duration;

use tidings::dialogue::store::{BoxFuture, KeepReply, Loaded, Saved};
use tidings::dialogue::{Session, SessionStore, StoreError, Unanswered};

#[derive(Default)]
pub struct Down {
    /// How many times the service tried to note an unanswered question.
    pub noted: AtomicUsize,
}

impl Down {
    pub fn noted(&self) -> usize {
        self.noted.load(Ordering::SeqCst)
    }
}

fn down() -> StoreError {
    StoreError::Unavailable("down for the test".into())
}

impl SessionStore for Down {
    fn load<'a>(
        &'a self,
        _: &'a str,
        _: Option<&'a str>,
    ) -> BoxFuture<'a, Result<Loaded, StoreError>> {
        Box::pin(async { Err(down()) })
    }
    fn save<'a>(
        &'a self,
        _: &'a str,
        _: &'a Session,
        _: u64,
        _: Duration,
        _: Option<KeepReply<'a>>,
    ) -> BoxFuture<'a, Result<Saved, StoreError>> {
        Box::pin(async { Err(down()) })
    }
    fn erase<'a>(&'a self, _: &'a str) -> BoxFuture<'a, Result<u64, StoreError>> {
        Box::pin(async { Err(down()) })
    }
    fn note_unanswered<'a>(
        &'a self,
        _: &'a str,
        _: &'a str,
        _: &'a str,
    ) -> BoxFuture<'a, Result<(), StoreError>> {
        self.noted.fetch_add(1, Ordering::SeqCst);
        Box::pin(async { Err(down()) })
    }
    fn unanswered(&self, _: usize) -> BoxFuture<'_, Result<Vec<Unanswered>, StoreError>> {
        Box::pin(async { Err(down()) })
    }
    fn ping(&self) -> BoxFuture<'_, Result<(), StoreError>> {
        Box::pin(async { Err(down()) })
    }
    fn name(&self) -> &'static str {
        "down"
    }
}
