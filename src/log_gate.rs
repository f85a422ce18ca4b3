//! Rate-limited logging: a fault that repeats on every request (the
//! session store down, the connection cap reached) writes one line per
//! interval with a count of what it left out, not one line per request.

use std::time::{Duration, Instant};

/// Lets one log line through per interval and counts the rest.
///
/// Not shared by itself: a caller that needs it across tasks keeps it
/// behind a lock (see [`SharedLogGate`]).
#[derive(Debug)]
pub struct LogGate {
    every: Duration,
    last: Option<Instant>,
    suppressed: u64,
}

impl LogGate {
    /// A gate that lets a line through at most once per `every`.
    pub fn new(every: Duration) -> LogGate {
        LogGate {
            every,
            last: None,
            suppressed: 0,
        }
    }

    /// `Some(n)` when a line may be written now, `n` being how many were
    /// held back since the last one; `None` when this one is held back.
    pub fn pass(&mut self) -> Option<u64> {
        self.pass_at(Instant::now())
    }

    fn pass_at(&mut self, now: Instant) -> Option<u64> {
        match self.last {
            Some(t) if now.duration_since(t) < self.every => {
                self.suppressed += 1;
                None
            }
            _ => {
                self.last = Some(now);
                Some(std::mem::take(&mut self.suppressed))
            }
        }
    }
}

/// A [`LogGate`] for many tasks at once.
#[derive(Debug)]
pub struct SharedLogGate(
    // A std mutex: held for a few instructions, never across an await.
    std::sync::Mutex<LogGate>,
);

impl SharedLogGate {
    /// A shared gate that lets a line through at most once per `every`.
    pub fn new(every: Duration) -> SharedLogGate {
        SharedLogGate(std::sync::Mutex::new(LogGate::new(every)))
    }

    /// As [`LogGate::pass`].
    pub fn pass(&self) -> Option<u64> {
        self.0.lock().unwrap_or_else(|p| p.into_inner()).pass()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn one_line_per_interval_with_the_count_held_back() {
        let mut g = LogGate::new(Duration::from_secs(10));
        let t0 = Instant::now();
        assert_eq!(g.pass_at(t0), Some(0));
        assert_eq!(g.pass_at(t0 + Duration::from_secs(1)), None);
        assert_eq!(g.pass_at(t0 + Duration::from_secs(9)), None);
        assert_eq!(g.pass_at(t0 + Duration::from_secs(10)), Some(2));
        assert_eq!(g.pass_at(t0 + Duration::from_secs(11)), None);
    }
}
