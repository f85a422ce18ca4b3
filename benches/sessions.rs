//! What keeping conversations costs: whole turns through `Engine::handle_message`
//! (load the session, understand, answer, save with compare-and-set, keep the
//! reply under its message id) with sessions in memory and in Redis.
//!
//! Run with `cargo bench --bench sessions`. Redis is the one at
//! `TIDINGS_REDIS_URL` (default `redis://127.0.0.1:6379/`), on loopback.
//! Prints the median and 99th percentile per turn for each store, the
//! difference, and Redis round trips per turn. Under `cargo test` it runs a
//! few turns in memory only, as a smoke test.

use std::sync::Arc;
use std::time::{Duration, Instant};

use tidings::dialogue::{MemoryStore, RedisStore, SessionStore};
use tidings::engine::{self, Clock, Engine, Incoming, Settings, Sources};

/// A reader's conversation, repeated: questions, follow-ups, a pronoun.
const CONVERSATION: &[&str] = &[
    "who won the men's 400 m?",
    "and silver?",
    "what about the women's?",
    "where is she from?",
    "how many medals does Quessary have",
    "how about Sordavia?",
    "when does Zoe compete next",
    "the swimmer",
];

fn engine(store: Arc<dyn SessionStore>) -> Engine {
    let snap = engine::load(&Sources::default()).expect("the demo loads");
    let clock = Clock::Fixed("2027-08-14T21:10:00+01:00".parse().unwrap());
    Engine::new(snap, store, Settings::with_clock(clock, b"bench".to_vec()))
}

/// Runs `turns` turns spread over readers, one at a time; returns each
/// turn's time.
async fn run(engine: &Engine, turns: usize, tag: &str) -> Vec<Duration> {
    let mut times = Vec::with_capacity(turns);
    for i in 0..turns {
        let reader = format!("bench-{tag}-{}", i / CONVERSATION.len());
        let text = CONVERSATION[i % CONVERSATION.len()];
        let id = format!("{tag}-{i}");
        let t = Instant::now();
        let a = engine
            .handle_message(Incoming {
                user: &reader,
                channel: "chat",
                text,
                message_id: Some(&id),
            })
            .await
            .expect("a turn is handled");
        times.push(t.elapsed());
        assert!(!a.degraded, "the store must answer during the benchmark");
    }
    times
}

fn percentile(sorted: &[Duration], p: f64) -> Duration {
    let i = ((sorted.len() as f64 - 1.0) * p).round() as usize;
    sorted[i]
}

fn report(name: &str, mut times: Vec<Duration>) -> (Duration, Duration) {
    times.sort();
    let (m, p99) = (percentile(&times, 0.5), percentile(&times, 0.99));
    println!(
        "{name:<8} turns {:>6}  median {:>8.1} µs  p99 {:>8.1} µs",
        times.len(),
        m.as_secs_f64() * 1e6,
        p99.as_secs_f64() * 1e6
    );
    (m, p99)
}

#[tokio::main(flavor = "current_thread")]
async fn main() {
    let benchmarking = std::env::args().any(|a| a == "--bench");
    if !benchmarking {
        // `cargo test --all-targets`: check the loop works, quickly.
        let e = engine(Arc::new(MemoryStore::new()));
        let times = run(&e, CONVERSATION.len() * 2, "smoke").await;
        assert_eq!(times.len(), CONVERSATION.len() * 2);
        return;
    }
    let turns: usize = std::env::var("TIDINGS_BENCH_TURNS")
        .ok()
        .and_then(|s| s.parse().ok())
        .unwrap_or(10_000);
    let url =
        std::env::var("TIDINGS_REDIS_URL").unwrap_or_else(|_| "redis://127.0.0.1:6379/".into());
    let prefix = format!("tidings-bench:{:08x}:", rand::random::<u32>());

    let memory = engine(Arc::new(MemoryStore::new()));
    let redis_store = Arc::new(RedisStore::new(&url, &prefix).expect("the Redis URL parses"));
    let redis = engine(redis_store.clone());
    // Warm up both (connections, caches, the Lua script).
    run(&memory, 200, "warm-m").await;
    run(&redis, 200, "warm-r").await;

    let (mm, mp) = report("memory", run(&memory, turns, "m").await);
    let trips_before = redis_store.round_trips();
    let (rm, rp) = report("redis", run(&redis, turns, "r").await);
    let trips = redis_store.round_trips() - trips_before;
    println!(
        "added by Redis: median {:.1} µs, p99 {:.1} µs",
        (rm.as_secs_f64() - mm.as_secs_f64()) * 1e6,
        (rp.as_secs_f64() - mp.as_secs_f64()) * 1e6
    );
    println!(
        "Redis round trips: {trips} for {turns} turns = {:.2} per turn",
        trips as f64 / turns as f64
    );
    // Leave nothing behind in the Redis used.
    for i in 0..=(turns + 200) / CONVERSATION.len() {
        for tag in ["r", "warm-r"] {
            let reader = redis.user_key("chat", &format!("bench-{tag}-{i}"));
            let _ = redis_store.erase(&reader).await;
        }
    }
}
