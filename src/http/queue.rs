//! One reader's turns, one at a time: a message waits for the turn of the
//! same reader already in progress on this replica instead of racing it.
//!
//! Two turns of one reader at once would both load the same session
//! version; one loses the compare-and-set, redoes the whole turn and costs
//! the store another read and write, and a burst of them can run out of
//! attempts. Waiting in line costs nothing of the store, and the line is
//! short and bounded: past [`Queueing::per_reader`] waiting messages, or
//! after [`Queueing::wait`] in line, the message is answered `429` with
//! `retry-after`, which a client can act on.
//!
//! Lines are keyed by the hashed reader key, never a raw id, and a line
//! goes as soon as its last message is done, so idle readers cost nothing.

use std::collections::HashMap;
use std::sync::{Arc, Mutex};
use std::time::Duration;

use axum::http::StatusCode;

use super::ApiError;
use crate::log_gate::SharedLogGate;

/// How long a client is told to wait before sending again.
const RETRY_AFTER: Duration = Duration::from_secs(1);

/// How readers' messages wait for each other.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Queueing {
    /// Messages of one reader that may wait behind the one in progress;
    /// 0 lets a reader have one message in progress and none waiting.
    pub per_reader: usize,
    /// Longest a message waits in line; well inside the request timeout,
    /// so a stuck turn ahead gives a 429 to retry, not a 503.
    pub wait: Duration,
}

impl Default for Queueing {
    /// As many waiting messages as the default per-reader burst, so a
    /// reader within their rate limit is never turned away by the line.
    fn default() -> Queueing {
        Queueing {
            per_reader: 8,
            wait: Duration::from_secs(5),
        }
    }
}

/// The lines of every reader with a message in progress.
#[derive(Debug)]
pub struct ReaderTurns {
    limits: Queueing,
    // A std mutex: held only to look up or count a line, never across an
    // await (the wait itself is on the line's own async mutex).
    lines: Mutex<HashMap<String, Line>>,
    /// One log line per interval when readers are turned away.
    refused_log: SharedLogGate,
}

#[derive(Debug)]
struct Line {
    /// Held by the message in progress; tokio's mutex is fair, so
    /// messages go in the order they arrived.
    turn: Arc<tokio::sync::Mutex<()>>,
    /// Messages in progress or waiting.
    messages: usize,
}

/// A message's place: its turn while held, and its place in line until
/// dropped (also when the request is dropped while waiting).
#[derive(Debug)]
pub struct Turn<'a> {
    turns: &'a ReaderTurns,
    reader: String,
    held: Option<tokio::sync::OwnedMutexGuard<()>>,
}

impl ReaderTurns {
    pub fn new(limits: Queueing) -> ReaderTurns {
        ReaderTurns {
            limits,
            lines: Mutex::new(HashMap::new()),
            refused_log: SharedLogGate::new(Duration::from_secs(10)),
        }
    }

    fn lines(&self) -> std::sync::MutexGuard<'_, HashMap<String, Line>> {
        // Every critical section is a lookup and a count that cannot
        // panic half-way, so a poisoned lock is still consistent.
        self.lines.lock().unwrap_or_else(|p| p.into_inner())
    }

    /// Waits for the reader's turn (`reader` is the hashed key); a 429
    /// when their line is full or the wait runs out.
    pub async fn enter(&self, reader: &str) -> Result<Turn<'_>, ApiError> {
        let turn = {
            let mut lines = self.lines();
            let line = lines.entry(reader.to_string()).or_insert_with(|| Line {
                turn: Arc::new(tokio::sync::Mutex::new(())),
                messages: 0,
            });
            if line.messages > self.limits.per_reader {
                let waiting = line.messages - 1;
                drop(lines);
                if let Some(held) = self.refused_log.pass() {
                    tracing::info!(
                        waiting,
                        held_back = held,
                        "a reader's line of messages is full"
                    );
                }
                return Err(busy(format!(
                    "this reader has {waiting} messages waiting already; send again after the retry-after header's seconds"
                )));
            }
            line.messages += 1;
            Arc::clone(&line.turn)
        };
        // From here the place is counted, and given back on drop whatever
        // happens to the wait.
        let mut place = Turn {
            turns: self,
            reader: reader.to_string(),
            held: None,
        };
        match tokio::time::timeout(self.limits.wait, turn.lock_owned()).await {
            Ok(held) => {
                place.held = Some(held);
                Ok(place)
            }
            Err(_) => {
                if let Some(held) = self.refused_log.pass() {
                    tracing::warn!(
                        waited_ms = self.limits.wait.as_millis() as u64,
                        held_back = held,
                        "a reader's message waited too long for the one before it"
                    );
                }
                Err(busy(
                    "this reader's earlier messages are still being answered; send again after the retry-after header's seconds".into(),
                ))
            }
        }
    }

    /// Readers with a message in progress or waiting.
    pub fn readers(&self) -> usize {
        self.lines().len()
    }
}

impl Drop for Turn<'_> {
    fn drop(&mut self) {
        // The next message may start as soon as the line is counted down.
        self.held.take();
        let mut lines = self.turns.lines();
        if let Some(line) = lines.get_mut(&self.reader) {
            line.messages -= 1;
            if line.messages == 0 {
                lines.remove(&self.reader);
            }
        }
    }
}

/// The 429 of a reader whose messages are in each other's way.
pub fn busy(message: String) -> ApiError {
    ApiError {
        status: StatusCode::TOO_MANY_REQUESTS,
        code: "reader_busy",
        message,
        retry_after: Some(RETRY_AFTER),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn turns(per_reader: usize) -> ReaderTurns {
        ReaderTurns::new(Queueing {
            per_reader,
            wait: Duration::from_secs(60),
        })
    }

    #[tokio::test]
    async fn a_readers_second_message_waits_for_the_first_and_others_do_not() {
        let t = turns(4);
        let first = t.enter("chat:a").await.unwrap();
        // Another reader goes straight in.
        let other = t.enter("chat:b").await.unwrap();
        let mut second = Box::pin(t.enter("chat:a"));
        assert!(
            futures_poll(&mut second).is_none(),
            "the second message must wait"
        );
        drop(first);
        let second = second.await.unwrap();
        drop((second, other));
        assert_eq!(t.readers(), 0, "idle lines are removed");
    }

    #[tokio::test]
    async fn a_full_line_answers_429_with_retry_after_and_frees_up_again() {
        let t = turns(2);
        let first = t.enter("chat:a").await.unwrap();
        let mut waiting: Vec<_> = (0..2).map(|_| Box::pin(t.enter("chat:a"))).collect();
        for w in &mut waiting {
            assert!(futures_poll(w).is_none());
        }
        let refused = t.enter("chat:a").await.unwrap_err();
        assert_eq!(refused.status, StatusCode::TOO_MANY_REQUESTS);
        assert_eq!(refused.code, "reader_busy");
        assert_eq!(refused.retry_after, Some(RETRY_AFTER));
        // A message given up while waiting gives its place back.
        waiting.pop();
        let again = Box::pin(t.enter("chat:a"));
        waiting.push(again);
        assert!(futures_poll(waiting.last_mut().unwrap()).is_none());
        drop(first);
        for w in waiting {
            drop(w.await.unwrap());
        }
        assert_eq!(t.readers(), 0);
    }

    #[tokio::test]
    async fn a_message_that_waits_too_long_gets_429() {
        let t = ReaderTurns::new(Queueing {
            per_reader: 4,
            wait: Duration::from_millis(20),
        });
        let _first = t.enter("chat:a").await.unwrap();
        let late = t.enter("chat:a").await.unwrap_err();
        assert_eq!(late.code, "reader_busy");
        assert_eq!(t.lines().get("chat:a").map(|l| l.messages), Some(1));
    }

    /// Polls a future once: `None` if it is still pending.
    fn futures_poll<F: std::future::Future + Unpin>(f: &mut F) -> Option<F::Output> {
        let waker = std::task::Waker::noop();
        let mut cx = std::task::Context::from_waker(waker);
        match std::pin::Pin::new(f).poll(&mut cx) {
            std::task::Poll::Ready(v) => Some(v),
            std::task::Poll::Pending => None,
        }
    }
}
