//! Sessions in this process's memory: the default when no shared store is
//! configured.
//!
//! Every operation costs the same whatever the number of readers kept:
//!
//! - expiry is a queue per TTL, in expiry order (every record of one TTL
//!   written later expires later), so each operation drops what is due
//!   from the fronts and never walks the whole map;
//! - readers are capped ([`MemoryStore::with_cap`]): past the cap the least
//!   recently used reader goes, found at the front of a use-order queue;
//! - a reader's replies and unanswered questions hang off the reader, so
//!   erasure touches only that reader's records.
//!
//! The queues hold stamps, not references: a record written again gets a
//! new stamp, and a queue entry whose stamp no longer matches is skipped
//! when it reaches the front. Skipped entries are compacted away once they
//! outnumber live ones, so each queue stays within twice what it tracks
//! and each operation is O(1) amortised.

use std::collections::{HashMap, HashSet, VecDeque};
use std::sync::{Arc, Mutex};
use std::time::{Duration, Instant};

use super::session::Session;
use super::store::{
    first_version, BoxFuture, KeepReply, Loaded, Saved, SessionStore, StoreError, Unanswered,
    UNANSWERED_CAP, UNANSWERED_PER_READER,
};

/// Readers kept at most by default: enough for a busy night on one
/// replica, small enough that one client inventing reader ids cannot take
/// the process's memory (a reader with a session and a few kept replies is
/// a few KiB).
pub const DEFAULT_MAX_READERS: usize = 100_000;

/// A reader key or message key, shared between the map and the queues so
/// queue entries cost a pointer, not a copy of the key.
type Key = Arc<str>;

/// Sessions in memory, capped and expired in O(1) amortised per operation.
#[derive(Debug)]
pub struct MemoryStore {
    // A std mutex: every critical section is a short map operation with no
    // await inside, so an async mutex would only add cost; holding it for
    // the whole of `save` is what makes compare-and-set atomic.
    inner: Mutex<Maps>,
}

impl Default for MemoryStore {
    fn default() -> MemoryStore {
        MemoryStore::new()
    }
}

impl MemoryStore {
    /// An empty store keeping at most [`DEFAULT_MAX_READERS`] readers.
    pub fn new() -> MemoryStore {
        MemoryStore::with_cap(DEFAULT_MAX_READERS)
    }

    /// An empty store keeping at most `cap` readers (at least one): past
    /// it, the reader used least recently is forgotten with everything kept
    /// for them, as an erasure would.
    pub fn with_cap(cap: usize) -> MemoryStore {
        MemoryStore {
            inner: Mutex::new(Maps::new(cap)),
        }
    }

    /// How many readers are kept now (with a session, kept replies or
    /// counted questions).
    pub fn readers(&self) -> usize {
        let mut maps = self.lock();
        maps.expire(Instant::now());
        maps.readers.len()
    }

    fn lock(&self) -> std::sync::MutexGuard<'_, Maps> {
        // A panic while holding the lock cannot leave the maps half-written
        // (every operation is a few inserts or removes that cannot panic),
        // so a poisoned lock is still safe to use.
        self.inner.lock().unwrap_or_else(|p| p.into_inner())
    }
}

/// Everything kept for one reader.
#[derive(Debug, Default)]
struct Reader {
    session: Option<Kept>,
    /// message → reply.
    replies: HashMap<Key, KeptReply>,
    /// The questions this reader is counted for, for erasure.
    noted: HashSet<(String, String)>,
    /// The stamp of the reader's last use; the use queue's entry with this
    /// stamp is the live one.
    used: u64,
}

impl Reader {
    fn is_empty(&self) -> bool {
        self.session.is_none() && self.replies.is_empty() && self.noted.is_empty()
    }
}

#[derive(Debug)]
struct Kept {
    session: Session,
    version: u64,
    expires: Instant,
    stamp: u64,
}

#[derive(Debug)]
struct KeptReply {
    reply: String,
    expires: Instant,
    stamp: u64,
}

/// Queue entries that expire a session or a reply.
#[derive(Debug)]
struct Due {
    at: Instant,
    stamp: u64,
    reader: Key,
    /// The message, for a reply; `None` for a session.
    message: Option<Key>,
}

/// Queues in expiry order, one per TTL: within one TTL a record written
/// later expires later, so each queue is sorted by construction, and the
/// few TTLs in use (one for sessions, one for replies) keep the fronts
/// few.
#[derive(Debug, Default)]
struct Expiry {
    queues: HashMap<Duration, VecDeque<Due>>,
    /// Entries over all queues, live or not.
    len: usize,
}

impl Expiry {
    fn push(&mut self, ttl: Duration, due: Due) {
        self.queues.entry(ttl).or_default().push_back(due);
        self.len += 1;
    }

    /// Takes every entry due at `now`.
    fn take_due(&mut self, now: Instant, out: &mut Vec<Due>) {
        let before = out.len();
        for q in self.queues.values_mut() {
            while q.front().is_some_and(|d| d.at <= now) {
                out.extend(q.pop_front());
            }
        }
        self.len -= out.len() - before;
        self.queues.retain(|_, q| !q.is_empty());
    }

    /// Drops the entries `live` rejects, once they are most of the queue.
    fn compact(&mut self, live_count: usize, live: impl Fn(&Due) -> bool) {
        if self.len <= 2 * live_count + 64 {
            return;
        }
        for q in self.queues.values_mut() {
            q.retain(&live);
        }
        self.queues.retain(|_, q| !q.is_empty());
        self.len = self.queues.values().map(VecDeque::len).sum();
    }
}

#[derive(Debug)]
struct Maps {
    readers: HashMap<Key, Reader>,
    /// Readers in order of use, least recent first; an entry is live when
    /// its stamp is its reader's `used`.
    uses: VecDeque<(u64, Key)>,
    sessions: Expiry,
    replies: Expiry,
    /// Live sessions and replies, to know when the queues need compacting.
    live_sessions: usize,
    live_replies: usize,
    /// (kind, normalised text) → readers who asked.
    unanswered: HashMap<(String, String), u64>,
    cap: usize,
    /// The last stamp given out; stamps only grow.
    stamp: u64,
}

impl Maps {
    fn new(cap: usize) -> Maps {
        Maps {
            readers: HashMap::new(),
            uses: VecDeque::new(),
            sessions: Expiry::default(),
            replies: Expiry::default(),
            live_sessions: 0,
            live_replies: 0,
            unanswered: HashMap::new(),
            cap: cap.max(1),
            stamp: 0,
        }
    }

    fn next_stamp(&mut self) -> u64 {
        self.stamp += 1;
        self.stamp
    }

    /// Drops the sessions and replies due at `now`: only queue fronts are
    /// looked at.
    fn expire(&mut self, now: Instant) {
        let mut due = Vec::new();
        self.sessions.take_due(now, &mut due);
        self.replies.take_due(now, &mut due);
        for d in due {
            let Some(r) = self.readers.get_mut(&d.reader) else {
                continue;
            };
            match &d.message {
                None => {
                    if r.session.as_ref().is_some_and(|k| k.stamp == d.stamp) {
                        r.session = None;
                        self.live_sessions -= 1;
                    }
                }
                Some(m) => {
                    if r.replies.get(m).is_some_and(|k| k.stamp == d.stamp) {
                        r.replies.remove(m);
                        self.live_replies -= 1;
                    }
                }
            }
            if r.is_empty() {
                self.readers.remove(&d.reader);
            }
        }
    }

    /// Marks the reader as just used (moves them to the back of the use
    /// queue).
    fn touch(&mut self, key: &Key) {
        let Some(r) = self.readers.get(key) else {
            return;
        };
        // Already the most recent (a save right after its load): nothing
        // to move.
        if self.uses.back().is_some_and(|(s, _)| *s == r.used) {
            return;
        }
        let stamp = self.next_stamp();
        if let Some(r) = self.readers.get_mut(key) {
            r.used = stamp;
        }
        self.uses.push_back((stamp, Arc::clone(key)));
        self.compact_uses();
    }

    fn compact_uses(&mut self) {
        if self.uses.len() <= 2 * self.readers.len() + 64 {
            return;
        }
        let readers = &self.readers;
        self.uses
            .retain(|(s, k)| readers.get(k).is_some_and(|r| r.used == *s));
    }

    /// The reader's record, made if new; a new reader past the cap sends
    /// the least recently used one away.
    fn reader_entry(&mut self, reader: &str) -> Key {
        if let Some((k, _)) = self.readers.get_key_value(reader) {
            return Arc::clone(k);
        }
        let key: Key = Arc::from(reader);
        while self.readers.len() >= self.cap {
            let Some((stamp, oldest)) = self.uses.pop_front() else {
                break;
            };
            if self.readers.get(&oldest).is_some_and(|r| r.used == stamp) {
                self.remove_reader(&oldest);
            }
        }
        self.readers.insert(Arc::clone(&key), Reader::default());
        self.touch(&key);
        key
    }

    /// Removes everything kept for a reader; returns how many records went
    /// (the session, each reply, and the counted questions as one).
    fn remove_reader(&mut self, reader: &str) -> u64 {
        let Some(r) = self.readers.remove(reader) else {
            return 0;
        };
        let mut removed = 0;
        if r.session.is_some() {
            self.live_sessions -= 1;
            removed += 1;
        }
        self.live_replies -= r.replies.len();
        removed += r.replies.len() as u64;
        if !r.noted.is_empty() {
            removed += 1;
            for k in r.noted {
                if let Some(c) = self.unanswered.get_mut(&k) {
                    *c = c.saturating_sub(1);
                    if *c == 0 {
                        self.unanswered.remove(&k);
                    }
                }
            }
        }
        removed
    }

    fn load(&mut self, reader: &str, message: Option<&str>, now: Instant) -> Loaded {
        self.expire(now);
        let Some((key, r)) = self.readers.get_key_value(reader) else {
            return Loaded::default();
        };
        let key = Arc::clone(key);
        // Expiry is exact: a record past its time but not yet dropped (a
        // front of another TTL's queue) is not read.
        let kept = r.session.as_ref().filter(|k| k.expires > now);
        let loaded = Loaded {
            session: kept.map(|k| k.session.clone()),
            version: kept.map_or(0, |k| k.version),
            earlier_reply: message.and_then(|m| reply_of(r, m, now)),
        };
        self.touch(&key);
        loaded
    }

    fn save(
        &mut self,
        reader: &str,
        session: &Session,
        expected: u64,
        ttl: Duration,
        reply: Option<KeepReply<'_>>,
        now: Instant,
    ) -> Saved {
        self.expire(now);
        if let Some(r) = self.readers.get(reader) {
            if let Some(earlier) = reply.and_then(|k| reply_of(r, k.message, now)) {
                return Saved::Answered(earlier);
            }
            let current = r
                .session
                .as_ref()
                .filter(|k| k.expires > now)
                .map_or(0, |k| k.version);
            if current != expected {
                return Saved::Conflict;
            }
        } else if expected != 0 {
            return Saved::Conflict;
        }
        let version = if expected == 0 {
            first_version()
        } else {
            expected + 1
        };
        let key = self.reader_entry(reader);
        let stamp = self.next_stamp();
        let r = self.readers.get_mut(&key).expect("just made");
        let had = r
            .session
            .replace(Kept {
                session: session.clone(),
                version,
                expires: now + ttl,
                stamp,
            })
            .is_some();
        self.live_sessions += usize::from(!had);
        self.sessions.push(
            ttl,
            Due {
                at: now + ttl,
                stamp,
                reader: Arc::clone(&key),
                message: None,
            },
        );
        if let Some(k) = reply {
            let stamp = self.next_stamp();
            let message: Key = Arc::from(k.message);
            let r = self.readers.get_mut(&key).expect("just made");
            let had = r
                .replies
                .insert(
                    Arc::clone(&message),
                    KeptReply {
                        reply: k.reply.to_string(),
                        expires: now + k.ttl,
                        stamp,
                    },
                )
                .is_some();
            self.live_replies += usize::from(!had);
            self.replies.push(
                k.ttl,
                Due {
                    at: now + k.ttl,
                    stamp,
                    reader: Arc::clone(&key),
                    message: Some(message),
                },
            );
        }
        self.touch(&key);
        self.compact_expiry();
        Saved::Stored
    }

    fn compact_expiry(&mut self) {
        let readers = &self.readers;
        self.sessions.compact(self.live_sessions, |d| {
            readers
                .get(&d.reader)
                .and_then(|r| r.session.as_ref())
                .is_some_and(|k| k.stamp == d.stamp)
        });
        self.replies.compact(self.live_replies, |d| {
            let Some(m) = &d.message else { return false };
            readers
                .get(&d.reader)
                .and_then(|r| r.replies.get(m))
                .is_some_and(|k| k.stamp == d.stamp)
        });
    }

    fn note_unanswered(&mut self, reader: &str, text: &str, kind: &str, now: Instant) {
        self.expire(now);
        let key = (kind.to_string(), text.to_string());
        if let Some(r) = self.readers.get(reader) {
            if r.noted.contains(&key) || r.noted.len() >= UNANSWERED_PER_READER {
                return;
            }
        }
        let reader = self.reader_entry(reader);
        self.readers
            .get_mut(&reader)
            .expect("just made")
            .noted
            .insert(key.clone());
        *self.unanswered.entry(key.clone()).or_insert(0) += 1;
        if self.unanswered.len() > UNANSWERED_CAP {
            // Drop the least asked, never the one just counted: a new
            // question must get the chance to be asked again. The list is
            // capped, so this walk is bounded whatever the readers kept.
            if let Some(k) = self
                .unanswered
                .iter()
                .filter(|(k, _)| **k != key)
                .min_by(|a, b| a.1.cmp(b.1).then_with(|| a.0.cmp(b.0)))
                .map(|(k, _)| k.clone())
            {
                self.unanswered.remove(&k);
            }
        }
    }

    fn unanswered(&self, limit: usize) -> Vec<Unanswered> {
        let mut all: Vec<Unanswered> = self
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
        all
    }
}

fn reply_of(r: &Reader, message: &str, now: Instant) -> Option<String> {
    r.replies
        .get(message)
        .filter(|k| k.expires > now)
        .map(|k| k.reply.clone())
}

impl SessionStore for MemoryStore {
    fn load<'a>(
        &'a self,
        reader: &'a str,
        message: Option<&'a str>,
    ) -> BoxFuture<'a, Result<Loaded, StoreError>> {
        Box::pin(async move {
            let mut maps = self.lock();
            // The time is read under the lock, so records reach their
            // expiry queues in time order.
            Ok(maps.load(reader, message, Instant::now()))
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
            let mut maps = self.lock();
            Ok(maps.save(reader, session, expected, ttl, reply, Instant::now()))
        })
    }

    fn erase<'a>(&'a self, reader: &'a str) -> BoxFuture<'a, Result<u64, StoreError>> {
        Box::pin(async move {
            let mut maps = self.lock();
            maps.expire(Instant::now());
            Ok(maps.remove_reader(reader))
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
            maps.note_unanswered(reader, text, kind, Instant::now());
            Ok(())
        })
    }

    fn unanswered(&self, limit: usize) -> BoxFuture<'_, Result<Vec<Unanswered>, StoreError>> {
        Box::pin(async move { Ok(self.lock().unanswered(limit)) })
    }

    fn ping(&self) -> BoxFuture<'_, Result<(), StoreError>> {
        Box::pin(async { Ok(()) })
    }

    fn name(&self) -> &'static str {
        "memory"
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    const TTL: Duration = Duration::from_secs(60);

    fn session(turn: u64) -> Session {
        let mut s = Session::new("chat", 1_800_000_000);
        s.turn = turn;
        s
    }

    /// Saves a first session for each reader, one after the other.
    fn fill(maps: &mut Maps, readers: &[&str], now: Instant) {
        for r in readers {
            assert_eq!(maps.save(r, &session(1), 0, TTL, None, now), Saved::Stored);
        }
    }

    fn kept(maps: &Maps, reader: &str, now: Instant) -> bool {
        maps.readers
            .get(reader)
            .and_then(|r| r.session.as_ref())
            .is_some_and(|k| k.expires > now)
    }

    #[test]
    fn past_the_cap_the_least_recently_used_reader_goes() {
        let now = Instant::now();
        let mut maps = Maps::new(3);
        fill(&mut maps, &["a", "b", "c"], now);
        // A load counts as a use: "a" is now the most recent.
        assert!(maps.load("a", None, now).session.is_some());
        fill(&mut maps, &["d"], now);
        assert_eq!(maps.readers.len(), 3);
        assert!(!kept(&maps, "b", now), "b was the least recently used");
        for r in ["a", "c", "d"] {
            assert!(kept(&maps, r, now), "{r} should still be kept");
        }
        // Saving counts as a use as well: "c" moves behind "a" and "d".
        let v = maps.load("c", None, now).version;
        assert_eq!(
            maps.save("c", &session(2), v, TTL, None, now),
            Saved::Stored
        );
        fill(&mut maps, &["e", "f"], now);
        let mut left: Vec<&str> = maps.readers.keys().map(|k| &**k).collect();
        left.sort();
        assert_eq!(left, ["c", "e", "f"]);
    }

    #[test]
    fn an_evicted_reader_leaves_nothing_behind_and_starts_afresh() {
        let now = Instant::now();
        let mut maps = Maps::new(1);
        let keep = Some(KeepReply {
            message: "m1",
            reply: "kept",
            ttl: TTL,
        });
        assert_eq!(
            maps.save("a", &session(1), 0, TTL, keep, now),
            Saved::Stored
        );
        maps.note_unanswered("a", "why", "not_understood", now);
        assert_eq!(maps.unanswered(10).len(), 1);
        fill(&mut maps, &["b"], now);
        assert_eq!(maps.load("a", Some("m1"), now), Loaded::default());
        // Its questions went with it, as with an erasure.
        assert!(maps.unanswered(10).is_empty());
        assert_eq!((maps.live_sessions, maps.live_replies), (1, 0));
        // A turn that loaded it before the eviction cannot write it back.
        assert_eq!(
            maps.save("a", &session(2), 12345, TTL, None, now),
            Saved::Conflict
        );
    }

    #[test]
    fn expired_records_are_dropped_from_the_fronts_without_a_sweep() {
        let t0 = Instant::now();
        let mut maps = Maps::new(100);
        let short = Duration::from_secs(10);
        for (i, r) in ["a", "b", "c"].iter().enumerate() {
            let at = t0 + Duration::from_secs(i as u64);
            let keep = Some(KeepReply {
                message: "m",
                reply: "r",
                ttl: Duration::from_secs(5),
            });
            assert_eq!(maps.save(r, &session(1), 0, short, keep, at), Saved::Stored);
        }
        // Another TTL, in a queue of its own.
        fill(&mut maps, &["long"], t0);
        assert_eq!(maps.readers.len(), 4);
        // Replies of a and b due (5 s, 6 s), no session yet.
        maps.expire(t0 + Duration::from_millis(6_500));
        assert_eq!((maps.live_sessions, maps.live_replies), (4, 1));
        // Sessions of a and b due (10 s, 11 s): they go with their records.
        maps.expire(t0 + Duration::from_millis(11_500));
        let mut left: Vec<&str> = maps.readers.keys().map(|k| &**k).collect();
        left.sort();
        assert_eq!(left, ["c", "long"]);
        assert_eq!(maps.sessions.len, 2);
        // At 60 s all is gone, queues included.
        maps.expire(t0 + TTL);
        assert!(maps.readers.is_empty());
        assert_eq!((maps.sessions.len, maps.replies.len), (0, 0));
        assert_eq!((maps.live_sessions, maps.live_replies), (0, 0));
    }

    #[test]
    fn queues_stay_within_twice_what_they_track_however_often_one_reader_writes() {
        let now = Instant::now();
        let mut maps = Maps::new(10);
        let mut v = 0;
        for i in 0..10_000u64 {
            let message = format!("m{}", i % 4);
            let keep = Some(KeepReply {
                message: &message,
                reply: "r",
                ttl: TTL,
            });
            assert_eq!(
                maps.save("a", &session(i), v, TTL, keep, now),
                match i {
                    0..4 => Saved::Stored,
                    _ => Saved::Answered("r".into()),
                }
            );
            if i < 4 {
                v = maps.load("a", None, now).version;
            }
        }
        for i in 0..10_000u64 {
            let v = maps.load("a", None, now).version;
            assert_eq!(
                maps.save("a", &session(i), v, TTL, None, now),
                Saved::Stored
            );
        }
        assert!(maps.sessions.len <= 2 * maps.live_sessions + 64);
        assert!(maps.replies.len <= 2 * maps.live_replies + 64);
        assert!(maps.uses.len() <= 2 * maps.readers.len() + 64);
    }

    #[test]
    fn erasing_finds_the_readers_replies_without_looking_at_others() {
        let now = Instant::now();
        let mut maps = Maps::new(100);
        for r in ["a", "b"] {
            for m in ["m1", "m2", "m3"] {
                let v = maps.load(r, None, now).version;
                let keep = Some(KeepReply {
                    message: m,
                    reply: "r",
                    ttl: TTL,
                });
                assert_eq!(maps.save(r, &session(1), v, TTL, keep, now), Saved::Stored);
            }
        }
        assert_eq!(maps.remove_reader("a"), 4);
        assert_eq!(maps.live_replies, 3);
        assert_eq!(
            maps.load("b", Some("m2"), now).earlier_reply.as_deref(),
            Some("r")
        );
    }
}
