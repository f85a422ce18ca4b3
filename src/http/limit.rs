//! Rate limits: token buckets per source address, per reader, per client
//! key and for failed admin logins per source.
//!
//! A bucket holds up to `burst` tokens and refills at `per_second`; a
//! request takes one, and with none left it is answered 429 with
//! `retry-after` saying when the next token comes. Buckets live in this
//! process only: with several replicas each enforces its own share, which
//! is what protects each replica's latency.

use std::collections::HashMap;
use std::sync::Mutex;
use std::time::{Duration, Instant};

/// A rate: a sustained number per second and a burst above it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Rate {
    /// Tokens added per second.
    pub per_second: f64,
    /// Most tokens held: requests that may come at once after a pause.
    pub burst: f64,
}

impl Rate {
    /// `per_second` sustained with a burst of `burst`.
    pub const fn new(per_second: f64, burst: f64) -> Rate {
        Rate { per_second, burst }
    }
}

/// Every rate limit of the HTTP API; `None` turns one off.
#[derive(Debug, Clone)]
pub struct Rates {
    /// Requests from one source address, every route but the health checks.
    pub per_source: Option<Rate>,
    /// Messages from one reader (channel and user).
    pub per_reader: Option<Rate>,
    /// Messages sent with one client key, unless the key sets its own.
    pub per_key: Option<Rate>,
    /// Failed admin authentications from one source address. When they
    /// are used up, admin requests from there get 429 before the token is
    /// even looked at, so the token cannot be guessed at the server's speed.
    pub admin_failures: Rate,
}

impl Default for Rates {
    fn default() -> Rates {
        Rates {
            // A chat platform sends every reader's messages from a few
            // addresses, so the source limit is generous; readers are
            // limited one by one.
            per_source: Some(Rate::new(50.0, 100.0)),
            per_reader: Some(Rate::new(1.0, 8.0)),
            per_key: Some(Rate::new(100.0, 200.0)),
            admin_failures: Rate::new(0.1, 5.0),
        }
    }
}

/// Buckets above this many are swept of full ones (a full bucket is the
/// same as no bucket), so the map stays bounded by active clients.
const SWEEP_AT: usize = 10_000;

/// Token buckets by key. Keys are addresses, hashed reader keys or client
/// key ids, never raw reader ids.
#[derive(Debug)]
pub struct Buckets {
    // A std mutex: each use is one map lookup and a few float operations,
    // never held across an await.
    inner: Mutex<Inner>,
}

#[derive(Debug)]
struct Inner {
    map: HashMap<String, Bucket>,
    /// The size at which the next sweep runs: doubled when a sweep frees
    /// little, so sweeps stay amortised O(1) per request.
    sweep_at: usize,
}

#[derive(Debug, Clone, Copy)]
struct Bucket {
    tokens: f64,
    at: Instant,
}

impl Default for Buckets {
    fn default() -> Buckets {
        Buckets {
            inner: Mutex::new(Inner {
                map: HashMap::new(),
                sweep_at: SWEEP_AT,
            }),
        }
    }
}

impl Buckets {
    /// Takes a token from `key`'s bucket: `Ok` if there was one, else how
    /// long until there is.
    pub fn take(&self, key: &str, rate: Rate) -> Result<(), Duration> {
        self.take_at(key, rate, Instant::now())
    }

    /// Whether `key`'s bucket has a token, without taking it.
    pub fn check(&self, key: &str, rate: Rate) -> Result<(), Duration> {
        let now = Instant::now();
        let inner = self.lock();
        match inner.map.get(key) {
            None => Ok(()),
            Some(b) => wait_for(refilled(*b, rate, now), rate),
        }
    }

    fn lock(&self) -> std::sync::MutexGuard<'_, Inner> {
        // The map is always consistent between statements, so a panic
        // elsewhere cannot leave it half-written.
        self.inner.lock().unwrap_or_else(|p| p.into_inner())
    }

    fn take_at(&self, key: &str, rate: Rate, now: Instant) -> Result<(), Duration> {
        let mut inner = self.lock();
        if inner.map.len() >= inner.sweep_at {
            inner
                .map
                .retain(|_, b| refilled(*b, rate, now) < rate.burst);
            inner.sweep_at = (inner.map.len() * 2).max(SWEEP_AT);
        }
        let b = inner.map.entry(key.to_string()).or_insert(Bucket {
            tokens: rate.burst,
            at: now,
        });
        let tokens = refilled(*b, rate, now);
        *b = Bucket { tokens, at: now };
        if tokens >= 1.0 {
            b.tokens -= 1.0;
            Ok(())
        } else {
            wait_for(tokens, rate)
        }
    }
}

fn refilled(b: Bucket, rate: Rate, now: Instant) -> f64 {
    let dt = now.saturating_duration_since(b.at).as_secs_f64();
    (b.tokens + dt * rate.per_second).min(rate.burst)
}

fn wait_for(tokens: f64, rate: Rate) -> Result<(), Duration> {
    if tokens >= 1.0 {
        return Ok(());
    }
    if rate.per_second <= 0.0 {
        return Err(Duration::from_secs(3600));
    }
    Err(Duration::from_secs_f64((1.0 - tokens) / rate.per_second))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_burst_is_allowed_then_the_rate() {
        let b = Buckets::default();
        let rate = Rate::new(2.0, 3.0);
        let t0 = Instant::now();
        for _ in 0..3 {
            assert!(b.take_at("k", rate, t0).is_ok());
        }
        let wait = b.take_at("k", rate, t0).unwrap_err();
        assert_eq!(wait, Duration::from_millis(500));
        // Half a second later one token is back, and only one.
        let t1 = t0 + Duration::from_millis(500);
        assert!(b.take_at("k", rate, t1).is_ok());
        assert!(b.take_at("k", rate, t1).is_err());
        // Other keys have their own bucket.
        assert!(b.take_at("other", rate, t1).is_ok());
    }

    #[test]
    fn full_buckets_are_swept_so_the_map_stays_bounded() {
        let b = Buckets::default();
        let rate = Rate::new(1000.0, 1.0);
        let t0 = Instant::now();
        for i in 0..SWEEP_AT * 3 {
            // Each key is refilled a millisecond later, so it is full by
            // the next sweep.
            let now = t0 + Duration::from_millis(i as u64);
            let _ = b.take_at(&format!("k{i}"), rate, now);
        }
        assert!(b.lock().map.len() <= SWEEP_AT + 1);
    }
}
