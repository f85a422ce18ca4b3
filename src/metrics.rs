//! What the service counts about itself, written out at `GET /metrics` in
//! the Prometheus text exposition format, version 0.0.4.
//!
//! Our own few counters rather than a metrics framework: the service needs
//! a dozen series, each a relaxed atomic add on the request path, and the
//! text format is a few lines to write.
//!
//! Every label set is bounded by what the service itself knows, never by
//! what a client sends: routes are the router's matched routes (anything
//! else is `unmatched`), statuses are the ones the service answers with,
//! intents come from the catalog in force, operations and outcomes are
//! closed sets. A family that somehow grows past [`MAX_SERIES`] label sets
//! counts the rest under one `other` series instead of growing further.

use std::collections::HashMap;
use std::fmt::Write as _;
use std::sync::atomic::{AtomicBool, AtomicU64, Ordering};
use std::sync::Arc;
use std::time::Duration;

use arc_swap::ArcSwap;

use crate::dialogue::store::BoxFuture;
use crate::dialogue::{
    KeepReply, Loaded, Outcome, Saved, Session, SessionStore, StoreError, Unanswered,
};

/// The content type of the text exposition format, version 0.0.4.
pub const CONTENT_TYPE: &str = "text/plain; version=0.0.4; charset=utf-8";

/// Most label sets one family keeps before counting the rest as `other`.
pub const MAX_SERIES: usize = 512;

/// Upper bounds of the turn latency buckets, in seconds: from a turn in
/// memory (tens of microseconds) to one held up by a slow session store
/// (seconds), roughly three buckets a decade.
const TURN_BUCKETS: [f64; 16] = [
    0.0001, 0.00025, 0.0005, 0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1.0, 2.5,
    5.0, 10.0,
];

/// Counters keyed by a label set, written as the label text itself
/// (`route="/healthz",status="200"`). Reading is lock-free (an `ArcSwap`
/// of the map); a label set seen for the first time copies the map, which
/// happens once per series for the life of the process.
struct Family {
    series: ArcSwap<HashMap<Box<str>, Arc<AtomicU64>>>,
    /// The label text counted once [`MAX_SERIES`] sets are kept.
    overflow: &'static str,
}

impl Family {
    fn new(overflow: &'static str) -> Family {
        Family {
            series: ArcSwap::from_pointee(HashMap::new()),
            overflow,
        }
    }

    fn add(&self, labels: &str, n: u64) {
        {
            let map = self.series.load();
            // A full family goes straight to `other`, without copying the
            // map on every call.
            let c = map.get(labels).or_else(|| {
                (map.len() >= MAX_SERIES)
                    .then(|| map.get(self.overflow))
                    .flatten()
            });
            if let Some(c) = c {
                c.fetch_add(n, Ordering::Relaxed);
                return;
            }
        }
        self.series.rcu(|map| {
            let mut map = HashMap::clone(map);
            let key = if map.len() < MAX_SERIES || map.contains_key(labels) {
                labels
            } else {
                self.overflow
            };
            map.entry(key.into()).or_insert_with(Default::default);
            map
        });
        let map = self.series.load();
        let c = map.get(labels).or_else(|| map.get(self.overflow));
        if let Some(c) = c {
            c.fetch_add(n, Ordering::Relaxed);
        }
    }

    /// The series in label order, so two scrapes list them alike.
    fn rows(&self) -> Vec<(Box<str>, u64)> {
        let mut rows: Vec<(Box<str>, u64)> = self
            .series
            .load()
            .iter()
            .map(|(k, v)| (k.clone(), v.load(Ordering::Relaxed)))
            .collect();
        rows.sort();
        rows
    }
}

/// A histogram with fixed buckets: a count per bucket (made cumulative
/// when written), the count and the sum in nanoseconds.
struct Histogram {
    buckets: [AtomicU64; TURN_BUCKETS.len()],
    count: AtomicU64,
    sum_ns: AtomicU64,
}

impl Histogram {
    fn new() -> Histogram {
        Histogram {
            buckets: Default::default(),
            count: AtomicU64::new(0),
            sum_ns: AtomicU64::new(0),
        }
    }

    fn observe(&self, d: Duration) {
        let secs = d.as_secs_f64();
        // Past the last bound it is counted in +Inf only, which is `count`.
        if let Some(i) = TURN_BUCKETS.iter().position(|b| secs <= *b) {
            self.buckets[i].fetch_add(1, Ordering::Relaxed);
        }
        self.count.fetch_add(1, Ordering::Relaxed);
        let ns = u64::try_from(d.as_nanos()).unwrap_or(u64::MAX);
        self.sum_ns.fetch_add(ns, Ordering::Relaxed);
    }
}

/// The session store operations counted.
#[derive(Debug, Clone, Copy)]
enum Op {
    Load,
    Save,
    Erase,
    NoteUnanswered,
    Unanswered,
    Ping,
}

impl Op {
    const ALL: [Op; 6] = [
        Op::Load,
        Op::Save,
        Op::Erase,
        Op::NoteUnanswered,
        Op::Unanswered,
        Op::Ping,
    ];

    fn name(self) -> &'static str {
        match self {
            Op::Load => "load",
            Op::Save => "save",
            Op::Erase => "erase",
            Op::NoteUnanswered => "note_unanswered",
            Op::Unanswered => "unanswered",
            Op::Ping => "ping",
        }
    }
}

/// How a change to the data ended, for the batch and replacement counters.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ChangeResult {
    Applied,
    /// Refused because it does not check out.
    Invalid,
    /// Refused because it could not be shared with the other replicas.
    NotShared,
    /// Refused because other replicas kept changing the data.
    Busy,
    /// Sent to the shared copy with no answer back.
    Unknown,
}

impl ChangeResult {
    const ALL: [ChangeResult; 5] = [
        ChangeResult::Applied,
        ChangeResult::Invalid,
        ChangeResult::NotShared,
        ChangeResult::Busy,
        ChangeResult::Unknown,
    ];

    fn name(self) -> &'static str {
        match self {
            ChangeResult::Applied => "applied",
            ChangeResult::Invalid => "invalid",
            ChangeResult::NotShared => "not_shared",
            ChangeResult::Busy => "busy",
            ChangeResult::Unknown => "unknown",
        }
    }
}

/// The name of an outcome as replies carry it.
fn outcome_name(o: Outcome) -> &'static str {
    match o {
        Outcome::Answered => "answered",
        Outcome::Clarify => "clarify",
        Outcome::NotUnderstood => "not_understood",
        Outcome::NoData => "no_data",
        Outcome::NotCovered => "not_covered",
    }
}

/// Everything counted, shared by the engine and the HTTP layer.
pub struct Metrics {
    requests: Family,
    turns: Family,
    turn_latency: Histogram,
    degraded: AtomicU64,
    store_calls: [AtomicU64; Op::ALL.len()],
    store_errors: [AtomicU64; Op::ALL.len()],
    batches: [AtomicU64; ChangeResult::ALL.len()],
    replacements: [AtomicU64; ChangeResult::ALL.len()],
    reload_errors: AtomicU64,
    reload_failing: AtomicBool,
}

impl std::fmt::Debug for Metrics {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("Metrics").finish_non_exhaustive()
    }
}

impl Default for Metrics {
    fn default() -> Metrics {
        Metrics::new()
    }
}

/// What the engine adds at scrape time: figures read from its state rather
/// than counted.
#[derive(Debug, Clone, Copy)]
pub struct Gauges {
    pub dataset_version: u64,
    /// Seconds since the data's `as_of`, on the service's clock.
    pub dataset_age_seconds: i64,
    /// The Redis store's own round-trip count, when sessions are in Redis.
    pub store_round_trips: Option<u64>,
}

impl Metrics {
    pub fn new() -> Metrics {
        Metrics {
            requests: Family::new("route=\"other\",status=\"other\""),
            turns: Family::new("intent=\"other\",outcome=\"other\""),
            turn_latency: Histogram::new(),
            degraded: AtomicU64::new(0),
            store_calls: Default::default(),
            store_errors: Default::default(),
            batches: Default::default(),
            replacements: Default::default(),
            reload_errors: AtomicU64::new(0),
            reload_failing: AtomicBool::new(false),
        }
    }

    /// One request answered on `route` (a matched route, or `None` for
    /// one that matched none) with `status`.
    pub fn request(&self, route: Option<&str>, status: u16) {
        let mut labels = String::with_capacity(48);
        labels.push_str("route=\"");
        escape_label(&mut labels, route.unwrap_or("unmatched"));
        let _ = write!(labels, "\",status=\"{status}\"");
        self.requests.add(&labels, 1);
    }

    /// One turn that took `took`, with the intent it was understood as
    /// (`None`: none) and its outcome.
    pub fn turn(&self, intent: Option<&str>, outcome: Outcome, degraded: bool, took: Duration) {
        let mut labels = String::with_capacity(48);
        labels.push_str("intent=\"");
        escape_label(&mut labels, intent.unwrap_or("none"));
        let _ = write!(labels, "\",outcome=\"{}\"", outcome_name(outcome));
        self.turns.add(&labels, 1);
        self.turn_latency.observe(took);
        if degraded {
            self.degraded.fetch_add(1, Ordering::Relaxed);
        }
    }

    /// How a batch of changes ended.
    pub fn batch(&self, result: ChangeResult) {
        self.batches[result as usize].fetch_add(1, Ordering::Relaxed);
    }

    /// How a whole-dataset replacement ended.
    pub fn replacement(&self, result: ChangeResult) {
        self.replacements[result as usize].fetch_add(1, Ordering::Relaxed);
    }

    /// A reload from files that failed (`true`) or loaded (`false`).
    pub fn reload(&self, failed: bool) {
        if failed {
            self.reload_errors.fetch_add(1, Ordering::Relaxed);
        }
        self.reload_failing.store(failed, Ordering::Relaxed);
    }

    fn store_call(&self, op: Op, ok: bool) {
        self.store_calls[op as usize].fetch_add(1, Ordering::Relaxed);
        if !ok {
            self.store_errors[op as usize].fetch_add(1, Ordering::Relaxed);
        }
    }

    /// The text exposition format (version 0.0.4) of everything counted
    /// and of `gauges`.
    pub fn render(&self, gauges: &Gauges) -> String {
        let mut out = String::with_capacity(4096);
        header(
            &mut out,
            "tidings_http_requests_total",
            "counter",
            "HTTP requests answered, by matched route and status.",
        );
        for (labels, n) in self.requests.rows() {
            let _ = writeln!(out, "tidings_http_requests_total{{{labels}}} {n}");
        }
        header(
            &mut out,
            "tidings_turns_total",
            "counter",
            "Readers' messages answered, by intent (none when not understood) and outcome.",
        );
        for (labels, n) in self.turns.rows() {
            let _ = writeln!(out, "tidings_turns_total{{{labels}}} {n}");
        }
        self.render_latency(&mut out);
        counter(
            &mut out,
            "tidings_degraded_replies_total",
            "Replies made without the session store (no conversation context, or not remembered).",
            self.degraded.load(Ordering::Relaxed),
        );
        header(
            &mut out,
            "tidings_session_store_calls_total",
            "counter",
            "Calls to the session store, by operation.",
        );
        for op in Op::ALL {
            let n = self.store_calls[op as usize].load(Ordering::Relaxed);
            let _ = writeln!(
                out,
                "tidings_session_store_calls_total{{operation=\"{}\"}} {n}",
                op.name()
            );
        }
        header(
            &mut out,
            "tidings_session_store_errors_total",
            "counter",
            "Session store calls that failed, by operation.",
        );
        for op in Op::ALL {
            let n = self.store_errors[op as usize].load(Ordering::Relaxed);
            let _ = writeln!(
                out,
                "tidings_session_store_errors_total{{operation=\"{}\"}} {n}",
                op.name()
            );
        }
        if let Some(trips) = gauges.store_round_trips {
            counter(
                &mut out,
                "tidings_session_store_round_trips_total",
                "Round trips to Redis (one pipeline or script call each).",
                trips,
            );
        }
        for (name, help, counts) in [
            (
                "tidings_batches_total",
                "Batches of result changes posted, by result (applied, or why refused).",
                &self.batches,
            ),
            (
                "tidings_dataset_replacements_total",
                "Whole-dataset replacements posted, by result (applied, or why refused).",
                &self.replacements,
            ),
        ] {
            header(&mut out, name, "counter", help);
            for r in ChangeResult::ALL {
                let n = counts[r as usize].load(Ordering::Relaxed);
                let _ = writeln!(out, "{name}{{result=\"{}\"}} {n}", r.name());
            }
        }
        counter(
            &mut out,
            "tidings_reload_errors_total",
            "Reloads from changed files (--watch) that failed; the last good version kept serving.",
            self.reload_errors.load(Ordering::Relaxed),
        );
        gauge(
            &mut out,
            "tidings_reload_failing",
            "1 while the last reload from files failed, else 0.",
            i64::from(self.reload_failing.load(Ordering::Relaxed)),
        );
        gauge(
            &mut out,
            "tidings_dataset_version",
            "Version of the results data being served.",
            i64::try_from(gauges.dataset_version).unwrap_or(i64::MAX),
        );
        gauge(
            &mut out,
            "tidings_dataset_age_seconds",
            "Seconds since the newsroom last confirmed the data (its as_of), on the service's clock.",
            gauges.dataset_age_seconds,
        );
        header(
            &mut out,
            "tidings_build_info",
            "gauge",
            "The running version, as a label; always 1.",
        );
        let _ = writeln!(
            out,
            "tidings_build_info{{version=\"{}\"}} 1",
            env!("CARGO_PKG_VERSION")
        );
        out
    }

    fn render_latency(&self, out: &mut String) {
        let name = "tidings_turn_duration_seconds";
        header(
            out,
            name,
            "histogram",
            "Time to answer one reader's message, session store included.",
        );
        let h = &self.turn_latency;
        let mut cumulative = 0;
        for (i, bound) in TURN_BUCKETS.iter().enumerate() {
            cumulative += h.buckets[i].load(Ordering::Relaxed);
            let _ = writeln!(out, "{name}_bucket{{le=\"{bound}\"}} {cumulative}");
        }
        // Read after the buckets: a turn counted meanwhile only makes +Inf
        // larger, never smaller than a finite bucket.
        let count = h.count.load(Ordering::Relaxed).max(cumulative);
        let _ = writeln!(out, "{name}_bucket{{le=\"+Inf\"}} {count}");
        let sum = h.sum_ns.load(Ordering::Relaxed) as f64 / 1e9;
        let _ = writeln!(out, "{name}_sum {sum}");
        let _ = writeln!(out, "{name}_count {count}");
    }
}

fn header(out: &mut String, name: &str, kind: &str, help: &str) {
    // HELP text escapes backslash and newline (format 0.0.4); ours has
    // neither, which the unit test below holds.
    let _ = writeln!(out, "# HELP {name} {help}");
    let _ = writeln!(out, "# TYPE {name} {kind}");
}

fn counter(out: &mut String, name: &str, help: &str, n: u64) {
    header(out, name, "counter", help);
    let _ = writeln!(out, "{name} {n}");
}

fn gauge(out: &mut String, name: &str, help: &str, n: i64) {
    header(out, name, "gauge", help);
    let _ = writeln!(out, "{name} {n}");
}

/// A label value as format 0.0.4 writes it: backslash, double quote and
/// line feed escaped.
fn escape_label(out: &mut String, value: &str) {
    for c in value.chars() {
        match c {
            '\\' => out.push_str("\\\\"),
            '"' => out.push_str("\\\""),
            '\n' => out.push_str("\\n"),
            c => out.push(c),
        }
    }
}

/// A session store that counts each call and each failure by operation,
/// around the store that does the work.
pub struct CountedStore {
    inner: Arc<dyn SessionStore>,
    metrics: Arc<Metrics>,
}

impl CountedStore {
    pub fn new(inner: Arc<dyn SessionStore>, metrics: Arc<Metrics>) -> CountedStore {
        CountedStore { inner, metrics }
    }

    fn counted<'a, T: Send + 'a>(
        &'a self,
        op: Op,
        call: BoxFuture<'a, Result<T, StoreError>>,
    ) -> BoxFuture<'a, Result<T, StoreError>> {
        Box::pin(async move {
            let r = call.await;
            self.metrics.store_call(op, r.is_ok());
            r
        })
    }
}

impl SessionStore for CountedStore {
    fn load<'a>(
        &'a self,
        reader: &'a str,
        message: Option<&'a str>,
    ) -> BoxFuture<'a, Result<Loaded, StoreError>> {
        self.counted(Op::Load, self.inner.load(reader, message))
    }

    fn save<'a>(
        &'a self,
        reader: &'a str,
        session: &'a Session,
        expected: u64,
        ttl: Duration,
        reply: Option<KeepReply<'a>>,
    ) -> BoxFuture<'a, Result<Saved, StoreError>> {
        self.counted(
            Op::Save,
            self.inner.save(reader, session, expected, ttl, reply),
        )
    }

    fn erase<'a>(&'a self, reader: &'a str) -> BoxFuture<'a, Result<u64, StoreError>> {
        self.counted(Op::Erase, self.inner.erase(reader))
    }

    fn note_unanswered<'a>(
        &'a self,
        reader: &'a str,
        text: &'a str,
        kind: &'a str,
    ) -> BoxFuture<'a, Result<(), StoreError>> {
        self.counted(
            Op::NoteUnanswered,
            self.inner.note_unanswered(reader, text, kind),
        )
    }

    fn unanswered(&self, limit: usize) -> BoxFuture<'_, Result<Vec<Unanswered>, StoreError>> {
        self.counted(Op::Unanswered, self.inner.unanswered(limit))
    }

    fn ping(&self) -> BoxFuture<'_, Result<(), StoreError>> {
        self.counted(Op::Ping, self.inner.ping())
    }

    fn name(&self) -> &'static str {
        self.inner.name()
    }

    fn round_trips(&self) -> Option<u64> {
        self.inner.round_trips()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn gauges() -> Gauges {
        Gauges {
            dataset_version: 3,
            dataset_age_seconds: 360,
            store_round_trips: None,
        }
    }

    #[test]
    fn a_family_stops_growing_at_its_cap_and_counts_the_rest_as_other() {
        let m = Metrics::new();
        for i in 0..MAX_SERIES + 10 {
            m.request(Some(&format!("/r{i}")), 200);
        }
        m.request(Some("/r0"), 200);
        let rows = m.requests.rows();
        assert_eq!(rows.len(), MAX_SERIES + 1);
        let other = rows
            .iter()
            .find(|(k, _)| &**k == "route=\"other\",status=\"other\"")
            .map(|(_, n)| *n);
        assert_eq!(other, Some(10));
        let first = rows
            .iter()
            .find(|(k, _)| &**k == "route=\"/r0\",status=\"200\"")
            .map(|(_, n)| *n);
        assert_eq!(first, Some(2));
    }

    #[test]
    fn label_values_are_escaped() {
        let mut s = String::new();
        escape_label(&mut s, "a\"b\\c\nd");
        assert_eq!(s, "a\\\"b\\\\c\\nd");
    }

    #[test]
    fn the_histogram_is_cumulative_and_ends_with_inf_sum_and_count() {
        let m = Metrics::new();
        m.turn(
            Some("podium"),
            Outcome::Answered,
            false,
            Duration::from_micros(80),
        );
        m.turn(None, Outcome::NotUnderstood, true, Duration::from_millis(3));
        m.turn(None, Outcome::NotUnderstood, false, Duration::from_secs(20));
        let text = m.render(&gauges());
        assert!(text.contains("tidings_turn_duration_seconds_bucket{le=\"0.0001\"} 1\n"));
        assert!(text.contains("tidings_turn_duration_seconds_bucket{le=\"0.005\"} 2\n"));
        assert!(text.contains("tidings_turn_duration_seconds_bucket{le=\"10\"} 2\n"));
        assert!(text.contains("tidings_turn_duration_seconds_bucket{le=\"+Inf\"} 3\n"));
        assert!(text.contains("tidings_turn_duration_seconds_count 3\n"));
        assert!(
            text.contains("tidings_turns_total{intent=\"none\",outcome=\"not_understood\"} 2\n")
        );
        assert!(text.contains("tidings_degraded_replies_total 1\n"));
    }

    #[test]
    fn help_texts_need_no_escaping_and_every_family_has_a_type() {
        let text = Metrics::new().render(&gauges());
        for line in text.lines().filter(|l| l.starts_with("# HELP ")) {
            assert!(!line.contains('\\'), "{line}");
        }
        let helps = text.lines().filter(|l| l.starts_with("# HELP ")).count();
        let types = text.lines().filter(|l| l.starts_with("# TYPE ")).count();
        assert_eq!(helps, types);
        assert!(text.ends_with('\n'));
    }
}
