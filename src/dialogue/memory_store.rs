//! Sessions in this process's memory: the default when no shared store is
//! configured.
//!
//! No operation walks what the store keeps, and the list work of each
//! one, the longest single one as well as the mean, is bounded whatever
//! the number of readers kept:
//!
//! - expiry is a list per TTL, in expiry order (every record of one TTL
//!   written later expires later), so each operation drops what is due
//!   from the fronts and never walks the whole map;
//! - readers are capped ([`MemoryStore::with_cap`]): past the cap the least
//!   recently used reader goes, found at the front of a use-order list;
//! - a reader's replies and unanswered questions hang off the reader, so
//!   erasure touches only that reader's records.
//!
//! The lists are doubly linked through a slab, and every record keeps the
//! slot of its own entry: a record written again unlinks its old entry, a
//! reader used again moves its entry to the back, and a reader that goes
//! unlinks all of theirs. No entry ever outlives its record, so there is
//! nothing to skip at the fronts and nothing to compact later: a queue that
//! left dead entries behind would have to be walked once they piled up,
//! and the operation paying that walk would hold every other message back
//! for a time proportional to the readers kept.
//!
//! What one operation does to the lists is a few links per record it
//! writes or drops: a save links its session and reply and unlinks the ones
//! they replace, a new reader at the cap unlinks the evicted reader's
//! entries, and expiry unlinks each record as it comes due (each record is
//! dropped once, by whichever operation first finds it due).
//!
//! The containers do not make one operation pay for the others either as
//! far as this store decides it: slabs grow by chunks and never move their
//! slots, and the reader map is sized for twice the cap at the start (see
//! `Maps::readers`).

use std::collections::{HashMap, HashSet};
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

/// A reader key or message key, shared between the map and the lists so
/// list entries cost a pointer, not a copy of the key.
type Key = Arc<str>;

/// Sessions in memory, capped and expired with bounded work per operation.
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

/// No slot: the end of a list.
const NIL: usize = usize::MAX;

/// One list's ends and length; its entries live in a [`Slab`].
#[derive(Debug, Clone, Copy)]
struct List {
    head: usize,
    tail: usize,
    len: usize,
}

impl List {
    const EMPTY: List = List {
        head: NIL,
        tail: NIL,
        len: 0,
    };
}

#[derive(Debug)]
enum Slot<T> {
    Used { prev: usize, next: usize, value: T },
    Free { next: usize },
}

/// Slots a slab allocates at a time.
const CHUNK: usize = 4096;

/// Doubly linked lists threaded through one store of slots, so an entry
/// is unlinked or moved to the back in O(1) wherever it sits, given the
/// slot its record kept. Freed slots are reused before the slab grows, so
/// at a steady number of records it does not grow at all; when it does, it
/// adds a chunk of [`CHUNK`] slots and never moves the ones it has (one
/// vector doubling would copy every entry in a single operation).
#[derive(Debug)]
struct Slab<T> {
    chunks: Vec<Vec<Slot<T>>>,
    /// Slots made so far, used or free.
    len: usize,
    /// The first free slot; free slots are chained through `Free::next`.
    free: usize,
    /// Entries linked, unlinked or moved so far: what an operation does
    /// to the lists, counted so tests can hold it to a bound.
    steps: u64,
}

impl<T> Slab<T> {
    fn new() -> Slab<T> {
        Slab {
            chunks: Vec::new(),
            len: 0,
            free: NIL,
            steps: 0,
        }
    }

    fn slot(&self, at: usize) -> Option<&Slot<T>> {
        self.chunks.get(at / CHUNK)?.get(at % CHUNK)
    }

    fn slot_mut(&mut self, at: usize) -> Option<&mut Slot<T>> {
        self.chunks.get_mut(at / CHUNK)?.get_mut(at % CHUNK)
    }

    /// Makes a new slot at the end; returns its index.
    fn push_slot(&mut self, slot: Slot<T>) -> usize {
        match self.chunks.last_mut() {
            Some(chunk) if chunk.len() < CHUNK => chunk.push(slot),
            _ => {
                let mut chunk = Vec::with_capacity(CHUNK);
                chunk.push(slot);
                self.chunks.push(chunk);
            }
        }
        self.len += 1;
        self.len - 1
    }

    fn front(&self, list: &List) -> Option<(usize, &T)> {
        match self.slot(list.head) {
            Some(Slot::Used { value, .. }) => Some((list.head, value)),
            _ => None,
        }
    }

    fn ends(&self, at: usize) -> Option<(usize, usize)> {
        match self.slot(at) {
            Some(Slot::Used { prev, next, .. }) => Some((*prev, *next)),
            _ => None,
        }
    }

    fn set_prev(&mut self, at: usize, to: usize) {
        if let Some(Slot::Used { prev, .. }) = self.slot_mut(at) {
            *prev = to;
        }
    }

    fn set_next(&mut self, at: usize, to: usize) {
        if let Some(Slot::Used { next, .. }) = self.slot_mut(at) {
            *next = to;
        }
    }

    /// Joins the neighbours of an entry that leaves `list`.
    fn detach(&mut self, list: &mut List, prev: usize, next: usize) {
        if prev == NIL {
            list.head = next;
        } else {
            self.set_next(prev, next);
        }
        if next == NIL {
            list.tail = prev;
        } else {
            self.set_prev(next, prev);
        }
        list.len -= 1;
    }

    /// Links a used slot `at` whose own links are already set at the back.
    fn attach_back(&mut self, list: &mut List, at: usize) {
        if list.tail == NIL {
            list.head = at;
        } else {
            self.set_next(list.tail, at);
        }
        list.tail = at;
        list.len += 1;
    }

    /// Adds `value` at the back of `list`; returns its slot.
    fn push_back(&mut self, list: &mut List, value: T) -> usize {
        self.steps += 1;
        let slot = Slot::Used {
            prev: list.tail,
            next: NIL,
            value,
        };
        let at = match self.slot_mut(self.free) {
            Some(free @ Slot::Free { .. }) => {
                let Slot::Free { next } = std::mem::replace(free, slot) else {
                    unreachable!("matched as free just above")
                };
                let at = self.free;
                self.free = next;
                at
            }
            _ => self.push_slot(slot),
        };
        self.attach_back(list, at);
        at
    }

    /// Takes the entry at `at` out of `list`; `None` if the slot is free.
    fn remove(&mut self, list: &mut List, at: usize) -> Option<T> {
        let (prev, next) = self.ends(at)?;
        self.steps += 1;
        self.detach(list, prev, next);
        let freed = Slot::Free { next: self.free };
        let slot = std::mem::replace(self.slot_mut(at)?, freed);
        self.free = at;
        match slot {
            Slot::Used { value, .. } => Some(value),
            Slot::Free { .. } => None,
        }
    }

    /// Moves the entry at `at` to the back of `list`.
    fn move_to_back(&mut self, list: &mut List, at: usize) {
        if list.tail == at {
            return;
        }
        let Some((prev, next)) = self.ends(at) else {
            return;
        };
        self.steps += 1;
        self.detach(list, prev, next);
        if let Some(Slot::Used { prev, next, .. }) = self.slot_mut(at) {
            *prev = list.tail;
            *next = NIL;
        }
        self.attach_back(list, at);
    }
}

/// Everything kept for one reader.
#[derive(Debug)]
struct Reader {
    session: Option<Kept>,
    /// message → reply.
    replies: HashMap<Key, KeptReply>,
    /// The questions this reader is counted for, for erasure.
    noted: HashSet<(String, String)>,
    /// The reader's slot in the use-order list.
    used: usize,
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
    /// Which expiry list holds the entry, and its slot there.
    ttl: Duration,
    slot: usize,
}

#[derive(Debug)]
struct KeptReply {
    reply: String,
    expires: Instant,
    ttl: Duration,
    slot: usize,
}

/// List entries that expire a session or a reply.
#[derive(Debug)]
struct Due {
    at: Instant,
    reader: Key,
    /// The message, for a reply; `None` for a session.
    message: Option<Key>,
}

/// Lists in expiry order, one per TTL: within one TTL a record written
/// later expires later, so each list is sorted by construction, and the
/// few TTLs in use (one for sessions, one for replies) keep the fronts
/// few.
#[derive(Debug)]
struct Expiry {
    slab: Slab<Due>,
    lists: HashMap<Duration, List>,
    /// Entries over all lists: the records tracked, exactly.
    len: usize,
}

impl Expiry {
    fn new() -> Expiry {
        Expiry {
            slab: Slab::new(),
            lists: HashMap::new(),
            len: 0,
        }
    }

    /// Adds a record's entry; returns the slot the record keeps.
    fn push(&mut self, ttl: Duration, due: Due) -> usize {
        let list = self.lists.entry(ttl).or_insert(List::EMPTY);
        self.len += 1;
        self.slab.push_back(list, due)
    }

    /// Unlinks the entry of a record replaced or removed.
    fn remove(&mut self, ttl: Duration, slot: usize) {
        let Some(list) = self.lists.get_mut(&ttl) else {
            return;
        };
        if self.slab.remove(list, slot).is_some() {
            self.len -= 1;
        }
        if list.len == 0 {
            self.lists.remove(&ttl);
        }
    }

    /// Takes every entry due at `now`, with the slot each was in.
    fn take_due(&mut self, now: Instant, out: &mut Vec<(usize, Due)>) {
        for list in self.lists.values_mut() {
            while let Some(slot) = self
                .slab
                .front(list)
                .and_then(|(slot, d)| (d.at <= now).then_some(slot))
            {
                let Some(due) = self.slab.remove(list, slot) else {
                    break;
                };
                self.len -= 1;
                out.push((slot, due));
            }
        }
        self.lists.retain(|_, list| list.len > 0);
    }
}

/// Readers past which the map is not sized up front: beyond it the map
/// grows as readers come, and rehashes as it does.
const PRESIZED_READERS: usize = 2_000_000;

#[derive(Debug)]
struct Maps {
    /// Sized at the start for twice the cap, so at most half full: it
    /// never grows below the cap, and at that load deleting an entry
    /// almost always frees its slot outright instead of leaving a marker,
    /// so the markers that would make one insert rehash the whole table
    /// do not pile up. Readers are boxed so the slots sized for readers
    /// not yet there cost a key and a pointer each.
    readers: HashMap<Key, Box<Reader>>,
    /// Readers in order of use, least recent first: one entry per reader.
    uses: Slab<Key>,
    use_order: List,
    sessions: Expiry,
    replies: Expiry,
    /// (kind, normalised text) → readers who asked.
    unanswered: HashMap<(String, String), u64>,
    cap: usize,
}

impl Maps {
    fn new(cap: usize) -> Maps {
        let cap = cap.max(1);
        Maps {
            readers: HashMap::with_capacity(2 * cap.min(PRESIZED_READERS)),
            uses: Slab::new(),
            use_order: List::EMPTY,
            sessions: Expiry::new(),
            replies: Expiry::new(),
            unanswered: HashMap::new(),
            cap,
        }
    }

    /// Drops the sessions and replies due at `now`: only list fronts are
    /// looked at, and every entry taken is a record that goes.
    fn expire(&mut self, now: Instant) {
        let mut due = Vec::new();
        self.sessions.take_due(now, &mut due);
        self.replies.take_due(now, &mut due);
        for (slot, d) in due {
            let Some(r) = self.readers.get_mut(&d.reader) else {
                continue;
            };
            // A session entry has no message and a reply entry has one, so
            // the slot is matched in the slab it came from.
            match &d.message {
                None => {
                    if r.session.as_ref().is_some_and(|k| k.slot == slot) {
                        r.session = None;
                    }
                }
                Some(m) => {
                    if r.replies.get(m).is_some_and(|k| k.slot == slot) {
                        r.replies.remove(m);
                    }
                }
            }
            if r.is_empty() {
                self.remove_reader(&d.reader);
            }
        }
    }

    /// Marks the reader as just used (moves them to the back of the use
    /// list).
    fn touch(&mut self, key: &str) {
        if let Some(r) = self.readers.get(key) {
            self.uses.move_to_back(&mut self.use_order, r.used);
        }
    }

    /// The reader's record, made if new; a new reader past the cap sends
    /// the least recently used one away.
    fn reader_entry(&mut self, reader: &str) -> Key {
        if let Some((k, _)) = self.readers.get_key_value(reader) {
            return Arc::clone(k);
        }
        // The store never holds more than the cap, so this evicts one
        // reader at most.
        while self.readers.len() >= self.cap {
            let Some((slot, oldest)) = self.uses.front(&self.use_order) else {
                break;
            };
            let oldest = Arc::clone(oldest);
            if self.readers.contains_key(&oldest) {
                self.remove_reader(&oldest);
            } else {
                // Every reader kept has exactly one entry and it goes with
                // them, so this cannot happen; unlinking the entry still
                // makes progress rather than looping.
                self.uses.remove(&mut self.use_order, slot);
            }
        }
        let key: Key = Arc::from(reader);
        let used = self.uses.push_back(&mut self.use_order, Arc::clone(&key));
        self.readers.insert(
            Arc::clone(&key),
            Box::new(Reader {
                session: None,
                replies: HashMap::new(),
                noted: HashSet::new(),
                used,
            }),
        );
        key
    }

    /// Removes everything kept for a reader; returns how many records went
    /// (the session, each reply, and the counted questions as one).
    fn remove_reader(&mut self, reader: &str) -> u64 {
        let Some(r) = self.readers.remove(reader) else {
            return 0;
        };
        self.uses.remove(&mut self.use_order, r.used);
        let mut removed = 0;
        if let Some(k) = &r.session {
            self.sessions.remove(k.ttl, k.slot);
            removed += 1;
        }
        for k in r.replies.values() {
            self.replies.remove(k.ttl, k.slot);
        }
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
        let Some(r) = self.readers.get(reader) else {
            return Loaded::default();
        };
        // Expiry is exact: a record past its time but not yet dropped (a
        // front of another TTL's list) is not read.
        let kept = r.session.as_ref().filter(|k| k.expires > now);
        let loaded = Loaded {
            session: kept.map(|k| k.session.clone()),
            version: kept.map_or(0, |k| k.version),
            earlier_reply: message.and_then(|m| reply_of(r, m, now)),
        };
        self.touch(reader);
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
        let slot = self.sessions.push(
            ttl,
            Due {
                at: now + ttl,
                reader: Arc::clone(&key),
                message: None,
            },
        );
        let Some(r) = self.readers.get_mut(&key) else {
            // Just made; unlink the entry rather than leave it without a
            // record.
            self.sessions.remove(ttl, slot);
            return Saved::Conflict;
        };
        let replaced = r.session.replace(Kept {
            session: session.clone(),
            version,
            expires: now + ttl,
            ttl,
            slot,
        });
        if let Some(old) = replaced {
            self.sessions.remove(old.ttl, old.slot);
        }
        if let Some(k) = reply {
            let message: Key = Arc::from(k.message);
            let slot = self.replies.push(
                k.ttl,
                Due {
                    at: now + k.ttl,
                    reader: Arc::clone(&key),
                    message: Some(Arc::clone(&message)),
                },
            );
            let kept = KeptReply {
                reply: k.reply.to_string(),
                expires: now + k.ttl,
                ttl: k.ttl,
                slot,
            };
            // A reply past its time but not yet dropped is replaced here.
            if let Some(old) = r.replies.insert(message, kept) {
                self.replies.remove(old.ttl, old.slot);
            }
        }
        self.touch(&key);
        Saved::Stored
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
        let Some(r) = self.readers.get_mut(&reader) else {
            return;
        };
        r.noted.insert(key.clone());
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

    fn keep<'a>(message: &'a str, ttl: Duration) -> Option<KeepReply<'a>> {
        Some(KeepReply {
            message,
            reply: "r",
            ttl,
        })
    }

    /// List work done so far, over every list.
    fn steps(maps: &Maps) -> u64 {
        maps.uses.steps + maps.sessions.slab.steps + maps.replies.slab.steps
    }

    /// The readers in use order, least recent first, read off the list.
    fn use_order(maps: &Maps) -> Vec<String> {
        let mut out = Vec::new();
        let mut at = maps.use_order.head;
        while let Some(Slot::Used { next, value, .. }) = maps.uses.slot(at) {
            out.push(value.to_string());
            at = *next;
        }
        out
    }

    /// Every list entry belongs to a record and every record has one: the
    /// lists hold exactly what they track.
    fn assert_lists_match_records(maps: &Maps) {
        let sessions = maps
            .readers
            .values()
            .filter(|r| r.session.is_some())
            .count();
        let replies: usize = maps.readers.values().map(|r| r.replies.len()).sum();
        assert_eq!(maps.sessions.len, sessions);
        assert_eq!(maps.replies.len, replies);
        assert_eq!(maps.use_order.len, maps.readers.len());
        let listed: usize = maps.sessions.lists.values().map(|l| l.len).sum();
        assert_eq!(listed, sessions);
        let listed: usize = maps.replies.lists.values().map(|l| l.len).sum();
        assert_eq!(listed, replies);
        for (key, r) in &maps.readers {
            assert!(
                matches!(maps.uses.slot(r.used), Some(Slot::Used { value, .. }) if value == key)
            );
            if let Some(k) = &r.session {
                assert!(matches!(
                    maps.sessions.slab.slot(k.slot),
                    Some(Slot::Used { value, .. }) if value.reader == *key && value.message.is_none()
                ));
            }
            for (m, k) in &r.replies {
                assert!(matches!(
                    maps.replies.slab.slot(k.slot),
                    Some(Slot::Used { value, .. })
                        if value.reader == *key && value.message.as_ref() == Some(m)
                ));
            }
        }
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
        assert_lists_match_records(&maps);
    }

    #[test]
    fn eviction_follows_the_use_order_exactly_after_many_uses() {
        let now = Instant::now();
        let mut maps = Maps::new(6);
        let names = ["a", "b", "c", "d", "e", "f"];
        fill(&mut maps, &names, now);
        // Thousands of uses in a fixed scramble, with one reader rewritten
        // over and over in between: the last use of each decides.
        let mut last = Vec::new();
        for i in 0..6_000usize {
            let r = names[(i * 7 + i / 6) % 6];
            if i % 3 == 0 {
                let v = maps.load(r, None, now).version;
                assert_eq!(maps.save(r, &session(1), v, TTL, None, now), Saved::Stored);
            } else {
                maps.load(r, None, now);
            }
            last.retain(|x| *x != r);
            last.push(r);
        }
        assert_eq!(use_order(&maps), last);
        // New readers now send the others away in exactly that order.
        for (i, gone) in last.iter().enumerate() {
            let fresh = format!("new{i}");
            fill(&mut maps, &[&fresh], now);
            assert!(!maps.readers.contains_key(*gone), "{gone} should go now");
            for stays in &last[i + 1..] {
                assert!(maps.readers.contains_key(*stays), "{stays} went too early");
            }
            assert_eq!(maps.readers.len(), 6);
            assert_lists_match_records(&maps);
        }
    }

    #[test]
    fn an_evicted_reader_leaves_nothing_behind_and_starts_afresh() {
        let now = Instant::now();
        let mut maps = Maps::new(1);
        assert_eq!(
            maps.save("a", &session(1), 0, TTL, keep("m1", TTL), now),
            Saved::Stored
        );
        maps.note_unanswered("a", "why", "not_understood", now);
        assert_eq!(maps.unanswered(10).len(), 1);
        fill(&mut maps, &["b"], now);
        assert_eq!(maps.load("a", Some("m1"), now), Loaded::default());
        // Its questions went with it, as with an erasure.
        assert!(maps.unanswered(10).is_empty());
        assert_eq!((maps.sessions.len, maps.replies.len), (1, 0));
        assert_eq!(maps.use_order.len, 1);
        assert_lists_match_records(&maps);
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
            let keep = keep("m", Duration::from_secs(5));
            assert_eq!(maps.save(r, &session(1), 0, short, keep, at), Saved::Stored);
        }
        // Another TTL, in a list of its own.
        fill(&mut maps, &["long"], t0 + Duration::from_secs(2));
        assert_eq!(maps.readers.len(), 4);
        // Replies of a and b due (5 s, 6 s), no session yet.
        maps.expire(t0 + Duration::from_millis(6_500));
        assert_eq!((maps.sessions.len, maps.replies.len), (4, 1));
        // Sessions of a and b due (10 s, 11 s): they go with their records.
        maps.expire(t0 + Duration::from_millis(11_500));
        let mut left: Vec<&str> = maps.readers.keys().map(|k| &**k).collect();
        left.sort();
        assert_eq!(left, ["c", "long"]);
        assert_eq!(maps.sessions.len, 2);
        assert_lists_match_records(&maps);
        // At 62 s all is gone, lists included.
        maps.expire(t0 + Duration::from_secs(62));
        assert!(maps.readers.is_empty());
        assert_eq!((maps.sessions.len, maps.replies.len), (0, 0));
        assert!(maps.sessions.lists.is_empty() && maps.replies.lists.is_empty());
        assert_eq!(maps.use_order.len, 0);
    }

    #[test]
    fn a_rewritten_record_expires_at_its_new_time_and_in_order_with_the_rest() {
        let t0 = Instant::now();
        let s = |n: u64| t0 + Duration::from_secs(n);
        let mut maps = Maps::new(100);
        let ttl = Duration::from_secs(10);
        // a at 0, b at 1, c at 2; then a rewritten at 3 and again at 5,
        // b rewritten at 4: expiry order is now c (12), b (14), a (15).
        for (r, at) in [("a", 0), ("b", 1), ("c", 2)] {
            assert_eq!(
                maps.save(r, &session(1), 0, ttl, None, s(at)),
                Saved::Stored
            );
        }
        for (r, at) in [("a", 3), ("b", 4), ("a", 5)] {
            let v = maps.load(r, None, s(at)).version;
            assert_eq!(
                maps.save(r, &session(2), v, ttl, None, s(at)),
                Saved::Stored
            );
        }
        assert_eq!(maps.sessions.len, 3, "one entry per session, not per write");
        let left = |maps: &mut Maps, at: Instant| {
            maps.expire(at);
            let mut left: Vec<String> = maps.readers.keys().map(|k| k.to_string()).collect();
            left.sort();
            left
        };
        // The first writes' times (10, 11) drop nothing.
        assert_eq!(left(&mut maps, s(11)), ["a", "b", "c"]);
        assert_eq!(left(&mut maps, s(12)), ["a", "b"]);
        assert_eq!(left(&mut maps, s(13)), ["a", "b"]);
        assert_eq!(left(&mut maps, s(14)), ["a"]);
        assert_lists_match_records(&maps);
        assert_eq!(left(&mut maps, s(15)), Vec::<String>::new());
        // A reader loaded just before its time reads nothing at it.
        assert_eq!(
            maps.save("d", &session(1), 0, ttl, None, s(20)),
            Saved::Stored
        );
        assert!(maps.load("d", None, s(29)).session.is_some());
        assert!(maps.load("d", None, s(30)).session.is_none());
    }

    #[test]
    fn many_rewrites_of_one_reader_keep_one_entry_per_record() {
        let now = Instant::now();
        let mut maps = Maps::new(10);
        fill(&mut maps, &["b", "c"], now);
        let mut v = 0;
        for i in 0..10_000u64 {
            let message = format!("m{}", i % 4);
            let saved = maps.save("a", &session(i), v, TTL, keep(&message, TTL), now);
            let expected = match i {
                0..4 => Saved::Stored,
                _ => Saved::Answered("r".into()),
            };
            assert_eq!(saved, expected);
            if i < 4 {
                v = maps.load("a", None, now).version;
            }
        }
        for i in 0..10_000u64 {
            let at = now + Duration::from_millis(i);
            let v = maps.load("a", None, at).version;
            let message = format!("n{i}");
            // Replies kept for a short while only, so they turn over.
            let reply_ttl = Duration::from_millis(5);
            assert_eq!(
                maps.save("a", &session(i), v, TTL, keep(&message, reply_ttl), at),
                Saved::Stored
            );
        }
        assert_lists_match_records(&maps);
        assert_eq!(maps.sessions.len, 3);
        // The replies of the last 5 ms and the four first ones.
        assert_eq!(maps.replies.len, 4 + 5);
        // Slots are reused: the slabs hold about what is kept, not what
        // was ever written.
        assert!(maps.sessions.slab.len <= 4);
        assert!(maps.replies.slab.len <= 4 + 7);
        assert!(maps.uses.len <= 3);
        assert_eq!(use_order(&maps), ["b", "c", "a"]);
    }

    #[test]
    fn no_single_operation_does_more_list_work_with_more_readers() {
        // The same mix of operations at two sizes a hundred times apart;
        // the most list work any one of them does is the same small bound
        // at both. Before the lists were linked, dead entries piled up and
        // one operation in a cycle walked a whole queue.
        let mut most = Vec::new();
        for size in [100usize, 10_000] {
            let now = Instant::now();
            let mut maps = Maps::new(size);
            for i in 0..size {
                let r = format!("r{i}");
                let saved = maps.save(&r, &session(1), 0, TTL, keep("m", TTL), now);
                assert_eq!(saved, Saved::Stored);
            }
            let mut worst = 0;
            let mut fresh = size;
            for i in 0..4 * size {
                let before = steps(&maps);
                match i % 4 {
                    // A new reader at the cap: the least recently used goes.
                    0 => {
                        let r = format!("r{fresh}");
                        fresh += 1;
                        maps.save(&r, &session(1), 0, TTL, keep("m", TTL), now);
                    }
                    // The same reader rewritten again and again.
                    1 => {
                        let r = format!("r{}", fresh - 1);
                        let v = maps.load(&r, None, now).version;
                        let m = format!("x{i}");
                        maps.save(&r, &session(2), v, TTL, keep(&m, TTL), now);
                    }
                    // A load of an older reader, moving them to the back.
                    2 => {
                        let r = format!("r{}", fresh - 1 - (i % size) / 2);
                        maps.load(&r, Some("m"), now);
                    }
                    // An erasure.
                    _ => {
                        let r = format!("r{}", fresh - 2);
                        maps.remove_reader(&r);
                    }
                }
                worst = worst.max(steps(&maps) - before);
            }
            assert!(maps.readers.len() <= size);
            assert_lists_match_records(&maps);
            most.push(worst);
        }
        // A new reader at the cap: unlink the evicted reader's use entry,
        // session and reply (3), link the new ones (3).
        assert!(
            most.iter().all(|w| *w <= 6),
            "list work per operation {most:?}"
        );
        assert_eq!(most[0], most[1], "the bound does not grow with the size");
    }

    #[test]
    fn expiry_work_is_the_records_due_and_nothing_else() {
        let t0 = Instant::now();
        let mut maps = Maps::new(100_000);
        // Longer than the 20 s of writes, so nothing is due before the
        // loop below.
        let ttl = Duration::from_secs(30);
        // 20,000 readers, one a millisecond, each rewritten once; then each
        // operation a millisecond later finds exactly one reader due.
        for i in 0..20_000u64 {
            let r = format!("r{i}");
            let at = t0 + Duration::from_millis(i);
            assert_eq!(maps.save(&r, &session(1), 0, ttl, None, at), Saved::Stored);
            let v = maps.load(&r, None, at).version;
            assert_eq!(maps.save(&r, &session(2), v, ttl, None, at), Saved::Stored);
        }
        let mut worst = 0;
        for i in 0..20_000u64 {
            let at = t0 + ttl + Duration::from_millis(i);
            let before = steps(&maps);
            let left = maps.readers.len();
            maps.load("nobody", None, at);
            assert_eq!(maps.readers.len(), left - 1, "one reader due at {i} ms");
            worst = worst.max(steps(&maps) - before);
        }
        // The due session and the reader's use entry.
        assert_eq!(worst, 2);
        assert!(maps.readers.is_empty());
    }

    #[test]
    fn store_matches_a_plain_model_under_random_operations() {
        // A model that keeps everything in plain maps and decides eviction
        // and expiry by scanning them all: the store must keep exactly the
        // same readers, sessions and replies after every operation.
        type ModelReader = (Option<Instant>, HashMap<String, Instant>, u64);
        #[derive(Default)]
        struct Model {
            /// reader → (session expiry, message → reply expiry, last use).
            readers: HashMap<String, ModelReader>,
            clock: u64,
        }
        impl Model {
            fn expire(&mut self, now: Instant) {
                for (s, replies, _) in self.readers.values_mut() {
                    if s.is_some_and(|e| e <= now) {
                        *s = None;
                    }
                    replies.retain(|_, e| *e > now);
                }
                self.readers
                    .retain(|_, (s, r, _)| s.is_some() || !r.is_empty());
            }
            fn touch(&mut self, reader: &str) {
                self.clock += 1;
                if let Some(r) = self.readers.get_mut(reader) {
                    r.2 = self.clock;
                }
            }
        }
        let cap = 8;
        let mut maps = Maps::new(cap);
        let mut model = Model::default();
        let mut now = Instant::now();
        let mut seed = 0x2545_f491_4f6c_dd1du64;
        let mut next = |below: u64| {
            seed ^= seed << 13;
            seed ^= seed >> 7;
            seed ^= seed << 17;
            seed % below
        };
        let ttls = [Duration::from_secs(5), Duration::from_secs(9)];
        for step in 0..50_000 {
            now += Duration::from_millis(next(700));
            let reader = format!("r{}", next(20));
            let message = format!("m{}", next(6));
            let ttl = ttls[next(2) as usize];
            let reply_ttl = Duration::from_secs(4);
            model.expire(now);
            match next(4) {
                0 => {
                    let loaded = maps.load(&reader, Some(&message), now);
                    let m = model.readers.get(&reader);
                    assert_eq!(loaded.session.is_some(), m.is_some_and(|m| m.0.is_some()));
                    let reply = m.is_some_and(|m| m.1.contains_key(&message));
                    assert_eq!(loaded.earlier_reply.is_some(), reply, "step {step}");
                    model.touch(&reader);
                }
                op => {
                    // A turn: load, then save at that version, sometimes
                    // keeping a reply.
                    let v = maps.load(&reader, None, now).version;
                    model.touch(&reader);
                    let with_reply = op == 1;
                    let keep = with_reply.then(|| KeepReply {
                        message: &message,
                        reply: "r",
                        ttl: reply_ttl,
                    });
                    let saved = maps.save(&reader, &session(1), v, ttl, keep, now);
                    let answered = with_reply
                        && model
                            .readers
                            .get(&reader)
                            .is_some_and(|m| m.1.contains_key(&message));
                    if answered {
                        assert_eq!(saved, Saved::Answered("r".into()), "step {step}");
                    } else {
                        assert_eq!(saved, Saved::Stored, "step {step}");
                        if !model.readers.contains_key(&reader) && model.readers.len() >= cap {
                            let lru = model
                                .readers
                                .iter()
                                .min_by_key(|(_, m)| m.2)
                                .map(|(k, _)| k.clone())
                                .expect("at the cap");
                            model.readers.remove(&lru);
                        }
                        let m = model.readers.entry(reader.clone()).or_default();
                        m.0 = Some(now + ttl);
                        if with_reply {
                            m.1.insert(message.clone(), now + reply_ttl);
                        }
                        model.touch(&reader);
                    }
                }
            }
            // Compare what each kept reader holds, live records only.
            maps.expire(now);
            let mut kept: Vec<&str> = maps.readers.keys().map(|k| &**k).collect();
            kept.sort();
            let mut want: Vec<&str> = model.readers.keys().map(String::as_str).collect();
            want.sort();
            assert_eq!(kept, want, "readers kept at step {step}");
            for (k, m) in &model.readers {
                let r = &maps.readers[k.as_str()];
                assert_eq!(r.session.as_ref().map(|k| k.expires), m.0, "step {step}");
                let mut replies: Vec<(&str, Instant)> =
                    r.replies.iter().map(|(m, k)| (&**m, k.expires)).collect();
                replies.sort();
                let mut want: Vec<(&str, Instant)> =
                    m.1.iter().map(|(m, e)| (m.as_str(), *e)).collect();
                want.sort();
                assert_eq!(replies, want, "step {step}");
            }
            if step % 1_000 == 0 {
                assert_lists_match_records(&maps);
            }
        }
        assert_lists_match_records(&maps);
    }

    #[test]
    fn erasing_finds_the_readers_replies_without_looking_at_others() {
        let now = Instant::now();
        let mut maps = Maps::new(100);
        for r in ["a", "b"] {
            for m in ["m1", "m2", "m3"] {
                let v = maps.load(r, None, now).version;
                assert_eq!(
                    maps.save(r, &session(1), v, TTL, keep(m, TTL), now),
                    Saved::Stored
                );
            }
        }
        let before = steps(&maps);
        assert_eq!(maps.remove_reader("a"), 4);
        // Its use entry, session and three replies.
        assert_eq!(steps(&maps) - before, 5);
        assert_eq!(maps.replies.len, 3);
        assert_lists_match_records(&maps);
        assert_eq!(
            maps.load("b", Some("m2"), now).earlier_reply.as_deref(),
            Some("r")
        );
    }
}
