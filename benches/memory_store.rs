//! What one operation of the in-memory session store costs as the number of
//! readers kept grows from 1,000 to 1,000,000: a load, a save
//! (compare-and-set, keeping a reply), a new reader past the cap (the least
//! recently used one goes) and the expiry of a record that is due.
//!
//! Run with `cargo bench --bench memory_store`. For each size the store is
//! filled with that many readers (a session and one kept reply each), then
//! each operation runs in rounds of `TIDINGS_BENCH_OPS` (default 20,000) on
//! readers picked at random; the figure is the median round's time per
//! operation, printed with its ratio to the same operation at 1,000 readers
//! in this run (new readers at the cap: the mean over at least as many new
//! readers as the size, see below). `TIDINGS_BENCH_MAX_READERS` lowers the
//! largest size. Under
//! `cargo test` it runs the two smallest sizes with few operations, as a
//! smoke test.

use std::time::{Duration, Instant};

use tidings::dialogue::{KeepReply, MemoryStore, Saved, Session, SessionStore};

const SIZES: &[usize] = &[1_000, 10_000, 100_000, 1_000_000];
const ROUNDS: usize = 5;
/// Records made due at once for the expiry figure, and how many times.
const EXPIRY_BATCH: usize = 500;
const EXPIRY_ROUNDS: usize = 11;
/// Sessions live long enough never to expire during a run.
const LONG: Duration = Duration::from_secs(3600);
/// About the size of a reply kept for retries (a chat reply as JSON).
const REPLY_BYTES: usize = 600;

/// A small pseudo-random sequence (xorshift64*), so every run and every
/// size picks readers the same way without a dependency.
struct Picks(u64);

impl Picks {
    fn next(&mut self, below: usize) -> usize {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        (self.0.wrapping_mul(0x2545_f491_4f6c_dd1d) >> 33) as usize % below
    }
}

fn reader(i: usize) -> String {
    // The shape of a real key: channel and a hex digest.
    format!(
        "chat:{:064x}",
        (i as u128).wrapping_mul(0x9e37_79b9_7f4a_7c15_f39c_c060_5ced_c835)
    )
}

fn session(turn: u64) -> Session {
    let mut s = Session::new("chat", 1_800_000_000);
    s.turn = turn;
    s
}

/// Per-operation time of the median round.
fn median(mut rounds: Vec<Duration>, ops: usize) -> f64 {
    rounds.sort();
    rounds[rounds.len() / 2].as_secs_f64() * 1e9 / ops as f64
}

/// One size: the four operations' costs in nanoseconds, the longest
/// single load, save and new reader, and which new reader (counted from 0)
/// was the longest.
async fn measure(size: usize, ops: usize, reply: &str) -> ([f64; 4], [Duration; 3], usize) {
    // The cap is the size: filling reaches it exactly, and every new
    // reader after that sends one away.
    let store = MemoryStore::with_cap(size);
    let s = session(1);
    for i in 0..size {
        let message = format!("m{i}");
        let keep = KeepReply {
            message: &message,
            reply,
            ttl: LONG,
        };
        let saved = store
            .save(&reader(i), &s, 0, LONG, Some(keep))
            .await
            .expect("memory never fails");
        assert_eq!(saved, Saved::Stored);
    }
    assert_eq!(store.readers(), size);
    let mut picks = Picks(0x5eed ^ size as u64);
    // The longest single load, save and new reader: one operation paying
    // for many shows here, not in the means.
    let mut longest = [Duration::ZERO; 3];

    // Loads of random readers, with a message id looked up as a turn does.
    let mut load = Vec::new();
    for _ in 0..ROUNDS {
        let keys: Vec<(String, String)> = (0..ops)
            .map(|_| {
                let i = picks.next(size);
                (reader(i), format!("m{i}"))
            })
            .collect();
        let t = Instant::now();
        for (k, m) in &keys {
            let o = Instant::now();
            let loaded = store.load(k, Some(m)).await.expect("memory never fails");
            longest[0] = longest[0].max(o.elapsed());
            std::hint::black_box(&loaded);
        }
        load.push(t.elapsed());
    }

    // Saves of random readers at the version they have, each keeping a new
    // reply. The versions are read first, outside the timing.
    let mut save = Vec::new();
    let mut round_id = 0;
    for _ in 0..ROUNDS {
        round_id += 1;
        let mut seen = std::collections::HashSet::new();
        let mut work = Vec::with_capacity(ops);
        while work.len() < ops.min(size) {
            let i = picks.next(size);
            if !seen.insert(i) {
                continue;
            }
            let k = reader(i);
            let v = store.load(&k, None).await.expect("memory").version;
            work.push((k, v, format!("r{round_id}-{i}")));
        }
        let t = Instant::now();
        for (k, v, m) in &work {
            let keep = KeepReply {
                message: m,
                reply,
                ttl: LONG,
            };
            let o = Instant::now();
            let saved = store
                .save(k, &s, *v, LONG, Some(keep))
                .await
                .expect("memory never fails");
            longest[1] = longest[1].max(o.elapsed());
            std::hint::black_box(&saved);
        }
        save.push(t.elapsed() * ops as u32 / work.len() as u32);
    }

    // New readers at the cap: each save sends the least recently used
    // reader away with everything kept for them. This runs at least as
    // many new readers as the size, as one run, and gives the mean: work
    // left behind by evictions and paid for later in one go (a walk once
    // per cycle of the store) would show in the longest single save, and
    // the whole cycle is inside the run so it cannot fall outside it.
    let mut fresh = size;
    let evictions = (ROUNDS * ops).max(size);
    let keys: Vec<String> = (fresh..fresh + evictions).map(reader).collect();
    fresh += evictions;
    // Which new reader was the longest: a spike at the same place in
    // every run is work the process does at a point of the cycle (the
    // allocator sorting the small blocks freed by evictions, measured at
    // 100,000 readers), not the machine preempting the thread.
    let mut longest_at = 0;
    let t = Instant::now();
    for (n, k) in keys.iter().enumerate() {
        let o = Instant::now();
        let saved = store
            .save(k, &s, 0, LONG, None)
            .await
            .expect("memory never fails");
        let took = o.elapsed();
        if took > longest[2] {
            longest[2] = took;
            longest_at = n;
        }
        std::hint::black_box(&saved);
    }
    let evict = t.elapsed().as_secs_f64() * 1e9 / evictions as f64;
    drop(keys);
    assert_eq!(store.readers(), size, "the cap holds");

    // Expiry: a batch of records whose time is up, dropped by the next
    // call into the store, among the readers that stay. The batch is the
    // same at every size (half the smallest), so only the size differs.
    let mut expiry = Vec::new();
    for _ in 0..EXPIRY_ROUNDS {
        for i in 0..EXPIRY_BATCH {
            let k = reader(fresh - 1 - i);
            let v = store.load(&k, None).await.expect("memory").version;
            let saved = store
                .save(&k, &s, v, Duration::from_millis(1), None)
                .await
                .expect("memory never fails");
            assert_eq!(saved, Saved::Stored);
        }
        std::thread::sleep(Duration::from_millis(5));
        let t = Instant::now();
        let left = store.readers();
        expiry.push(t.elapsed());
        assert_eq!(left, size - EXPIRY_BATCH, "the due records went");
        // Fill back up, so the next round starts at the same size.
        for _ in 0..EXPIRY_BATCH {
            store
                .save(&reader(fresh), &s, 0, LONG, None)
                .await
                .expect("memory never fails");
            fresh += 1;
        }
    }
    (
        [
            median(load, ops),
            median(save, ops),
            evict,
            median(expiry, EXPIRY_BATCH),
        ],
        longest,
        longest_at,
    )
}

#[tokio::main(flavor = "current_thread")]
async fn main() {
    let benchmarking = std::env::args().any(|a| a == "--bench");
    let reply = "x".repeat(REPLY_BYTES);
    if !benchmarking {
        // `cargo test --all-targets`: the loop works and the store holds
        // its cap, quickly.
        for size in [SIZES[0], 2 * SIZES[0]] {
            let (costs, _, _) = measure(size, 200, &reply).await;
            assert!(costs.iter().all(|c| *c > 0.0));
        }
        return;
    }
    let ops: usize = std::env::var("TIDINGS_BENCH_OPS")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(20_000);
    let max: usize = std::env::var("TIDINGS_BENCH_MAX_READERS")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(usize::MAX);
    const NAMES: [&str; 4] = [
        "load",
        "save",
        "new reader at the cap",
        "expiry of a due record",
    ];
    println!(
        "in-memory store, {ops} operations a round, median of {ROUNDS} rounds, ns per operation (ratio to 1k)"
    );
    let mut first: Option<[f64; 4]> = None;
    let mut longest_rows = Vec::new();
    for &size in SIZES.iter().filter(|s| **s <= max) {
        let (costs, longest, at) = measure(size, ops, &reply).await;
        let base = *first.get_or_insert(costs);
        let cells: Vec<String> = costs
            .iter()
            .zip(base)
            .map(|(c, b)| format!("{c:>8.0} ({:.2}×)", c / b))
            .collect();
        println!("{size:>9} readers  {}", cells.join("  "));
        longest_rows.push((size, longest, at));
    }
    println!("columns: {}", NAMES.join(", "));
    println!(
        "longest single operation, µs (load, save, new reader at the cap, and which new reader that was):"
    );
    for (size, l, at) in longest_rows {
        let cells: Vec<String> = l
            .iter()
            .map(|d| format!("{:>10.1}", d.as_secs_f64() * 1e6))
            .collect();
        println!("{size:>9} readers  {}  (#{at})", cells.join("  "));
    }
}
