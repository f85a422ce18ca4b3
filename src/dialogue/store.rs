//! Where sessions live between messages, behind one trait so any replica can
//! answer the next message when the store is shared.

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
    /// Stored data could not be read back.
    #[error("stored session unreadable: {0}")]
    Corrupt(String),
}

/// Session storage keyed by an opaque key (already hashed, never a raw id).
pub trait SessionStore: Send + Sync + 'static {
    /// The session under `key`, if present and not expired.
    fn load<'a>(&'a self, key: &'a str) -> BoxFuture<'a, Result<Option<Session>, StoreError>>;
    /// Stores `session` under `key`, expiring after `ttl` without use.
    fn save<'a>(
        &'a self,
        key: &'a str,
        session: &'a Session,
        ttl: Duration,
    ) -> BoxFuture<'a, Result<(), StoreError>>;
    /// Removes the session under `key`.
    fn delete<'a>(&'a self, key: &'a str) -> BoxFuture<'a, Result<(), StoreError>>;
    /// A short name for logs and status.
    fn name(&self) -> &'static str;
}

/// Sessions in this process's memory: the default when no shared store is
/// configured. Expired sessions are dropped when touched and swept on save.
#[derive(Debug, Default)]
pub struct MemoryStore {
    // A std mutex: every critical section is a short map operation with no
    // await inside, so an async mutex would only add cost.
    inner: Mutex<HashMap<String, (Session, Instant)>>,
}

impl MemoryStore {
    pub fn new() -> MemoryStore {
        MemoryStore::default()
    }

    fn lock(&self) -> std::sync::MutexGuard<'_, HashMap<String, (Session, Instant)>> {
        // A panic while holding the lock cannot leave the map half-written
        // (every operation is a single insert or remove), so a poisoned
        // lock is still safe to use.
        self.inner.lock().unwrap_or_else(|p| p.into_inner())
    }
}

impl SessionStore for MemoryStore {
    fn load<'a>(&'a self, key: &'a str) -> BoxFuture<'a, Result<Option<Session>, StoreError>> {
        Box::pin(async move {
            let mut map = self.lock();
            match map.get(key) {
                Some((s, expires)) if *expires > Instant::now() => Ok(Some(s.clone())),
                Some(_) => {
                    map.remove(key);
                    Ok(None)
                }
                None => Ok(None),
            }
        })
    }

    fn save<'a>(
        &'a self,
        key: &'a str,
        session: &'a Session,
        ttl: Duration,
    ) -> BoxFuture<'a, Result<(), StoreError>> {
        Box::pin(async move {
            let now = Instant::now();
            let mut map = self.lock();
            map.retain(|_, (_, exp)| *exp > now);
            map.insert(key.to_string(), (session.clone(), now + ttl));
            Ok(())
        })
    }

    fn delete<'a>(&'a self, key: &'a str) -> BoxFuture<'a, Result<(), StoreError>> {
        Box::pin(async move {
            self.lock().remove(key);
            Ok(())
        })
    }

    fn name(&self) -> &'static str {
        "memory"
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[tokio::test]
    async fn sessions_expire_after_their_ttl() {
        let store = MemoryStore::new();
        let s = Session::new("chat", 0);
        store.save("k", &s, Duration::from_millis(0)).await.unwrap();
        assert_eq!(store.load("k").await.unwrap(), None);
        store.save("k", &s, Duration::from_secs(60)).await.unwrap();
        assert_eq!(store.load("k").await.unwrap(), Some(s));
        store.delete("k").await.unwrap();
        assert_eq!(store.load("k").await.unwrap(), None);
    }
}
