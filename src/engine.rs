//! The engine: the current snapshot (data, catalog, understanding), the
//! session store and the clock, and the one entry point every interface
//! uses: [`Engine::handle`].

use std::path::PathBuf;
use std::sync::Arc;
use std::time::Duration;

use arc_swap::ArcSwap;
use hmac::{Hmac, Mac};
use jiff::{Timestamp, ZonedDateTime};
use serde::{Deserialize, Serialize};
use sha2::Sha256;

use crate::catalog::{self, Catalog};
use crate::dataset::changes::{self, Batch, Records};
use crate::dataset::shared::{SharedData, SharedError};
use crate::dataset::{self, DataProblem, Dataset, LoadError};
use crate::dialogue::session::SCHEMA;
use crate::dialogue::turn::{turn, Reply, TurnContext};
use crate::dialogue::{KeepReply, Saved, Session, SessionStore, StoreError, Unanswered};
use crate::understand::Understanding;
use std::sync::atomic::{AtomicU64, Ordering};

/// One consistent version of everything a turn reads. A request holds an
/// `Arc` to one snapshot from start to finish, so a swap never mixes
/// versions within an answer.
#[derive(Debug)]
pub struct Snapshot {
    pub data: Dataset,
    pub catalog: Catalog,
    pub understanding: Understanding,
}

impl Snapshot {
    /// Builds the derived indexes for a dataset and catalog.
    pub fn new(data: Dataset, catalog: Catalog) -> Snapshot {
        let understanding = Understanding::build(&data, &catalog);
        Snapshot {
            data,
            catalog,
            understanding,
        }
    }
}

/// Where the scenario comes from.
#[derive(Debug, Clone, Default)]
pub struct Sources {
    /// A scenario folder; `None` uses the demo built into the binary.
    pub data: Option<PathBuf>,
    /// An intents folder; `None` uses the demo built into the binary.
    pub intents: Option<PathBuf>,
}

/// Why the scenario could not be loaded.
#[derive(Debug, thiserror::Error)]
pub enum SetupError {
    #[error("{0}")]
    Data(#[from] dataset::LoadError),
    #[error("{0}")]
    Catalog(#[from] catalog::CatalogError),
}

/// The demo scenario, built into the binary so `tidings serve` works from
/// anywhere with no arguments.
mod demo {
    pub const DATA: [(&str, &str); 5] = [
        (
            "scenario.json",
            include_str!("../dataset-demo/games/scenario.json"),
        ),
        (
            "sports.json",
            include_str!("../dataset-demo/games/sports.json"),
        ),
        (
            "groups.json",
            include_str!("../dataset-demo/games/groups.json"),
        ),
        (
            "competitors.json",
            include_str!("../dataset-demo/games/competitors.json"),
        ),
        (
            "contests.json",
            include_str!("../dataset-demo/games/contests.json"),
        ),
    ];
    include!(concat!(env!("OUT_DIR"), "/demo_intents.rs"));
}

/// Loads the dataset and catalog from the given sources.
pub fn load(sources: &Sources) -> Result<Snapshot, SetupError> {
    let data = match &sources.data {
        Some(dir) => dataset::load_dir(dir)?,
        None => dataset::load_files(&|name: &str| {
            demo::DATA
                .iter()
                .find(|(n, _)| *n == name)
                .map(|(n, t)| (format!("dataset-demo/games/{n}"), t.to_string()))
                .ok_or_else(|| {
                    dataset::LoadError::File(format!("{name}: not in the built-in demo"))
                })
        })?,
    };
    let catalog = match &sources.intents {
        Some(dir) => catalog::load_dir(dir)?,
        None => {
            let files: Vec<(String, String)> = demo::INTENTS
                .iter()
                .map(|(n, t)| (format!("intents/games/{n}"), t.to_string()))
                .collect();
            catalog::load_texts(&files)?
        }
    };
    Ok(Snapshot::new(data, catalog))
}

/// The clock answers are computed against.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Clock {
    /// The real time.
    System,
    /// A fixed instant (`--now`), for replays and tests.
    Fixed(Timestamp),
}

/// An RFC 3339 time with its offset, as replies and the admin API show it.
pub fn rfc3339(t: &ZonedDateTime) -> String {
    t.strftime("%Y-%m-%dT%H:%M:%S%:z").to_string()
}

/// The built-in channel profiles, the fallback when a data update removes
/// a channel a reader is using.
static BUILT_IN_CHANNELS: std::sync::LazyLock<crate::answers::channel::Channels> =
    std::sync::LazyLock::new(crate::answers::channel::Channels::built_in);

/// Engine settings.
#[derive(Clone)]
pub struct Settings {
    pub clock: Clock,
    /// How long an idle session is kept.
    pub session_ttl: Duration,
    /// How long a message id is remembered, so a retry of the message gets
    /// the first reply back instead of being handled twice.
    pub retry_window: Duration,
    /// Key for hashing user ids; never logged.
    pub id_secret: Vec<u8>,
    /// The admin API's bearer token; `None` turns the admin API off.
    pub admin_token: Option<String>,
    /// The bearer token of `GET /metrics` (the admin token is taken as
    /// well); with neither set, metrics are off.
    pub metrics_token: Option<String>,
    /// After how long without an update a live contest's figures are said
    /// to be old.
    pub stale_after: Duration,
    /// Most of any kind of record (0 to 1) that a whole-dataset replacement
    /// may remove without being forced.
    pub max_removed_share: f64,
}

impl std::fmt::Debug for Settings {
    // By hand: the id secret and the admin token must never reach a log.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("Settings")
            .field("clock", &self.clock)
            .field("session_ttl", &self.session_ttl)
            .field("retry_window", &self.retry_window)
            .field("stale_after", &self.stale_after)
            .field("admin_api", &self.admin_token.is_some())
            .field("metrics", &self.metrics_token.is_some())
            .finish_non_exhaustive()
    }
}

impl Settings {
    /// Settings for tests and tools: the given clock, a 30-minute session
    /// TTL, a 10-minute retry window.
    pub fn with_clock(clock: Clock, id_secret: Vec<u8>) -> Settings {
        Settings {
            clock,
            session_ttl: Duration::from_secs(1800),
            retry_window: Duration::from_secs(600),
            id_secret,
            admin_token: None,
            metrics_token: None,
            stale_after: Duration::from_secs(600),
            max_removed_share: 0.5,
        }
    }
}

/// How often a turn is redone when another message from the same reader
/// saved first. Each redo sees the other's update, so only a burst of this
/// many simultaneous messages from one reader can exhaust it.
const SAVE_ATTEMPTS: u32 = 16;

/// One message as it arrives.
#[derive(Debug, Clone, Copy)]
pub struct Incoming<'a> {
    /// The reader's id on the channel; hashed before use.
    pub user: &'a str,
    pub channel: &'a str,
    pub text: &'a str,
    /// The platform's id for the message; a retry carries the same one.
    pub message_id: Option<&'a str>,
}

/// Why a message could not be handled. Reader mistakes are caught before
/// this, in the HTTP layer; these are the service's own problems.
#[derive(Debug, thiserror::Error)]
pub enum EngineError {
    /// The channel names no profile; the second field lists those there are.
    #[error("unknown channel {0:?}; channels are {1}")]
    UnknownChannel(String, String),
    /// The session store is needed (erasure) and cannot be reached.
    #[error("{0}")]
    Store(#[from] StoreError),
    /// Too many messages from one reader at the same moment.
    #[error("too many simultaneous messages from this reader; send again")]
    Busy,
}

/// How an SMS reply would be sent (3GPP TS 23.038): in the GSM 7-bit
/// alphabet (`units` septets of 160) or in UCS-2 (`units` UTF-16 code units
/// of 70).
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize, schemars::JsonSchema)]
pub struct SmsFit {
    pub encoding: String,
    pub units: usize,
    pub limit: usize,
}

/// The store-outage warnings, at most one per 10 seconds.
static STORE_DOWN_LOG: std::sync::LazyLock<crate::log_gate::SharedLogGate> =
    std::sync::LazyLock::new(|| crate::log_gate::SharedLogGate::new(Duration::from_secs(10)));

/// Serialises a map in key order, so the same reply is the same bytes
/// every time: a retried message gets its stored reply back parsed and
/// written again, and a hash map's order differs between the two.
pub fn in_key_order<S: serde::Serializer, V: Serialize>(
    map: &std::collections::HashMap<String, V>,
    s: S,
) -> Result<S::Ok, S::Error> {
    let sorted: std::collections::BTreeMap<&String, &V> = map.iter().collect();
    sorted.serialize(s)
}

/// What `GET /v1/admin/status` reports. Fields in name order, as the
/// reply has always had them.
#[derive(Debug, Clone, Serialize, schemars::JsonSchema)]
pub struct ServiceStatus {
    /// Seconds since the data's `as_of`.
    pub age_seconds: i64,
    /// RFC 3339, in the scenario's time zone.
    pub as_of: String,
    pub channels: Vec<String>,
    pub dataset_version: u64,
    pub intents: Vec<String>,
    /// The last reload's problem, while the last good version is served.
    pub reload_error: Option<String>,
    pub scenario: String,
    pub sessions: StoreState,
}

/// The session store and whether it answers.
#[derive(Debug, Clone, Serialize, schemars::JsonSchema)]
pub struct StoreState {
    /// `ok`, or why the store cannot be used.
    pub status: String,
    /// `memory` or `redis`.
    pub store: String,
}

/// A handled message with the version facts answers can cite.
#[derive(Debug, Clone, Serialize, Deserialize, schemars::JsonSchema)]
pub struct Answer {
    #[serde(flatten)]
    pub reply: Reply,
    /// The channel the reply was shaped for.
    pub channel: String,
    /// For a channel that must fit one SMS: how the text would be sent.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub sms: Option<SmsFit>,
    pub dataset_version: u64,
    /// RFC 3339, in the scenario's time zone.
    pub as_of: String,
    /// Set when the session store could not be used: the reply was made
    /// without conversation context.
    pub degraded: bool,
    /// Set when this is the stored reply to a message handled before (a
    /// retry); not part of the reply body.
    #[serde(skip)]
    pub repeated: bool,
}

/// The shared engine handle.
#[derive(Clone)]
pub struct Engine {
    // ArcSwap: readers take the current snapshot without locking, and a
    // later update swaps in a whole new one atomically.
    snapshot: Arc<ArcSwap<Snapshot>>,
    store: Arc<dyn SessionStore>,
    settings: Arc<Settings>,
    // An async mutex: changes to the data are read-modify-swap, and two
    // batches applied at once must not both start from the same version
    // (the second would drop the first's changes). Readers never take it.
    writes: Arc<tokio::sync::Mutex<()>>,
    /// The dataset shared with other replicas, when there are any.
    shared: Option<Arc<SharedData>>,
    // The shared version last seen, read and written under `writes`; an
    // atomic only so the handle stays cheap to clone.
    shared_seen: Arc<AtomicU64>,
    // The last reload problem, for the admin status. A std mutex: it is set
    // and read in one short step, never across an await.
    reload_error: Arc<std::sync::Mutex<Option<String>>>,
    /// What `GET /metrics` reports.
    metrics: Arc<crate::metrics::Metrics>,
}

/// Why a change to the data was not applied.
#[derive(Debug, thiserror::Error)]
pub enum ChangeError {
    /// The change does not check out; nothing changed.
    #[error("{} problem(s): {}", .0.len(), .0.iter().map(|p| p.to_string()).collect::<Vec<_>>().join("; "))]
    Invalid(Vec<DataProblem>),
    /// The change could not be shared with the other replicas, so it was
    /// not applied here either (replicas must not drift apart).
    #[error("{0}")]
    Shared(#[from] SharedError),
    /// Other replicas kept changing the data meanwhile.
    #[error("the data kept changing on other replicas; send the change again")]
    Busy,
    /// The change was sent to the shared copy but no answer came back, and
    /// the shared copy cannot be read to tell whether it landed.
    #[error("the change may or may not have been shared ({0}); check /v1/admin/status before sending it again")]
    Unknown(SharedError),
}

impl std::fmt::Debug for Engine {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("Engine")
            .field("store", &self.store.name())
            .finish_non_exhaustive()
    }
}

impl Engine {
    /// An engine over a loaded snapshot.
    pub fn new(snapshot: Snapshot, store: Arc<dyn SessionStore>, settings: Settings) -> Engine {
        let metrics = Arc::new(crate::metrics::Metrics::new());
        // Every call to the store is counted on its way through, whichever
        // part of the engine makes it.
        let store = Arc::new(crate::metrics::CountedStore::new(
            store,
            Arc::clone(&metrics),
        ));
        Engine {
            snapshot: Arc::new(ArcSwap::from_pointee(snapshot)),
            store,
            settings: Arc::new(settings),
            writes: Arc::new(tokio::sync::Mutex::new(())),
            shared: None,
            shared_seen: Arc::new(AtomicU64::new(0)),
            reload_error: Arc::new(std::sync::Mutex::new(None)),
            metrics,
        }
    }

    /// The counters behind `GET /metrics`.
    pub fn metrics(&self) -> &crate::metrics::Metrics {
        &self.metrics
    }

    /// `GET /metrics` as text: the counters and the dataset's version and
    /// age on the engine's clock.
    pub fn metrics_text(&self) -> String {
        let snap = self.snapshot();
        let now = self.now(&snap.data);
        self.metrics.render(&crate::metrics::Gauges {
            dataset_version: snap.data.version,
            dataset_age_seconds: now.timestamp().as_second() - snap.data.as_of.as_second(),
            store_round_trips: self.store.round_trips(),
        })
    }

    /// Whether `token` may read `GET /metrics`: the metrics token or the
    /// admin token; `None` when neither is set (metrics are off).
    pub fn metrics_allows(&self, token: &str) -> Option<bool> {
        let own = self
            .settings
            .metrics_token
            .as_deref()
            .map(|want| same_secret(want, token));
        match (own, self.admin_allows(token)) {
            (None, None) => None,
            (a, b) => Some(a == Some(true) || b == Some(true)),
        }
    }

    /// The same engine sharing its dataset with other replicas through
    /// `shared`.
    pub fn with_shared(mut self, shared: SharedData) -> Engine {
        self.shared = Some(Arc::new(shared));
        self
    }

    /// Adopts the shared dataset if it is newer than this replica's.
    pub async fn catch_up(&self) -> Result<(), SharedError> {
        let _one_at_a_time = self.writes.lock().await;
        self.catch_up_locked().await
    }

    /// Keeps this replica's data in step with the shared dataset, checking
    /// every `every`, until the process ends.
    pub async fn follow_shared(&self, every: Duration) {
        let mut failing = false;
        loop {
            tokio::time::sleep(every).await;
            match self.catch_up().await {
                Ok(()) => failing = false,
                Err(e) if !failing => {
                    tracing::warn!(error = %e, "cannot check the shared dataset; serving the last version");
                    failing = true;
                }
                Err(_) => {}
            }
        }
    }

    async fn catch_up_locked(&self) -> Result<(), SharedError> {
        let Some(shared) = &self.shared else {
            return Ok(());
        };
        let v = shared.version().await?;
        let seen = self.shared_seen.load(Ordering::Relaxed);
        let snap = self.snapshot();
        if v == 0 && seen > 0 {
            // The shared copy is gone (Redis restarted empty, or evicted
            // it): put this replica's data back, so the others find it.
            if shared
                .publish(0, snap.data.version, &Records::of(&snap.data))
                .await?
            {
                tracing::warn!(
                    version = snap.data.version,
                    "the shared dataset was gone; restored it from this replica"
                );
                self.shared_seen.store(snap.data.version, Ordering::Relaxed);
            }
            return Ok(());
        }
        // Adopt the shared copy when it is newer than this replica's data,
        // or when it changed since this replica last saw it even with a
        // lower version (it was lost and restored by another replica):
        // replicas agreeing matters more than the number going up.
        if v > snap.data.version || (v != seen && v != snap.data.version && seen != 0) {
            match shared.fetch().await {
                Ok(Some((v, records))) => match records.build(v) {
                    Ok(data) => {
                        if v < snap.data.version {
                            tracing::warn!(
                                from = snap.data.version,
                                to = v,
                                "the shared dataset went back a version; following it"
                            );
                        }
                        self.install(data, &snap);
                    }
                    Err(e) => {
                        // Unreadable: keep serving, and let the next change
                        // (a whole dataset, say) replace it.
                        tracing::error!(error = %e, "the shared dataset does not load; serving the last good one");
                    }
                },
                Ok(None) => {}
                Err(SharedError::Corrupt(e)) => {
                    tracing::error!(error = %e, "the shared dataset is unreadable; serving the last good one");
                }
                Err(e) => return Err(e),
            }
        }
        self.shared_seen.store(v, Ordering::Relaxed);
        Ok(())
    }

    /// The current snapshot.
    pub fn snapshot(&self) -> Arc<Snapshot> {
        self.snapshot.load_full()
    }

    /// Serves a new catalog (intents, wording, channels) with the current
    /// data; questions under way finish on the old one.
    pub async fn replace_catalog(&self, catalog: Catalog) {
        let _one_at_a_time = self.writes.lock().await;
        let snap = self.snapshot();
        self.swap(Snapshot::new(snap.data.clone(), catalog));
        tracing::info!(
            intents = self.snapshot().catalog.intents.len(),
            "intents reloaded"
        );
    }

    /// Records the outcome of a reload from files: `Some(problem)` keeps
    /// the last good version serving and shows the problem in the status.
    pub fn set_reload_error(&self, problem: Option<String>) {
        self.metrics.reload(problem.is_some());
        *self.reload_error.lock().unwrap_or_else(|p| p.into_inner()) = problem;
    }

    /// Replaces the snapshot; requests under way finish on the old one.
    pub fn swap(&self, next: Snapshot) {
        self.snapshot.store(Arc::new(next));
    }

    /// The current time in the scenario's zone: `--now`, else the
    /// scenario's own demo clock, else the real time. A demo clock never
    /// runs behind the data: when a replayed batch moves `as_of` past it,
    /// "now" moves with it, so a result is never reported as coming from
    /// the future.
    pub fn now(&self, data: &Dataset) -> ZonedDateTime {
        let t = match self.settings.clock {
            Clock::Fixed(t) => t,
            Clock::System => data
                .clock
                .map(|c| c.max(data.as_of))
                .unwrap_or_else(Timestamp::now),
        };
        t.to_zoned_datetime(data.tz.clone())
    }

    /// The opaque session key for a reader on a channel: a keyed hash, so
    /// the store and logs never see the raw id (a phone number on SMS).
    pub fn user_key(&self, channel: &str, user: &str) -> String {
        let mut mac = Hmac::<Sha256>::new_from_slice(&self.settings.id_secret)
            .expect("HMAC takes keys of any length");
        mac.update(channel.as_bytes());
        mac.update(b"\0");
        mac.update(user.as_bytes());
        let digest = mac.finalize().into_bytes();
        format!("{channel}:{}", hex::encode(&digest[..16]))
    }

    /// The opaque key for a message id, scoped to the reader's key.
    fn message_key(&self, id: &str) -> String {
        let mut mac = Hmac::<Sha256>::new_from_slice(&self.settings.id_secret)
            .expect("HMAC takes keys of any length");
        mac.update(b"message\0");
        mac.update(id.as_bytes());
        hex::encode(&mac.finalize().into_bytes()[..12])
    }

    /// Handles one message with no message id (tools, tests).
    pub async fn handle(
        &self,
        user: &str,
        channel: &str,
        text: &str,
    ) -> Result<Answer, EngineError> {
        self.handle_message(Incoming {
            user,
            channel,
            text,
            message_id: None,
        })
        .await
    }

    /// Handles one message from a reader: loads the session, runs the turn
    /// and saves the session with compare-and-set, redoing the turn if
    /// another message from the same reader saved first. A message id seen
    /// before gets its first reply back and changes nothing. When the store
    /// cannot be reached the message is answered on its own, marked
    /// `degraded`.
    pub async fn handle_message(&self, m: Incoming<'_>) -> Result<Answer, EngineError> {
        let started = std::time::Instant::now();
        let result = self.handle_counted(m).await;
        // A retry is answered from the first reply: not a turn of its own.
        if let Some(a) = result.as_ref().ok().filter(|a| !a.repeated) {
            self.metrics.turn(
                a.reply.intent.as_deref(),
                a.reply.outcome,
                a.degraded,
                started.elapsed(),
            );
        }
        result
    }

    async fn handle_counted(&self, m: Incoming<'_>) -> Result<Answer, EngineError> {
        let ch = self.channel(m.channel)?;
        let key = self.user_key(ch, m.user);
        let message = m.message_id.map(|id| self.message_key(id));
        for attempt in 0..SAVE_ATTEMPTS {
            let loaded = match self.store.load(&key, message.as_deref()).await {
                Ok(l) => l,
                Err(e) => {
                    // One line per interval: an outage would otherwise
                    // write one for every message.
                    if let Some(held) = STORE_DOWN_LOG.pass() {
                        tracing::warn!(error = %e, held_back = held, "session store unavailable; answering without context");
                    }
                    let (answer, _) = self.answer(ch, None, m.text, &key);
                    // Not noted as unanswered: without its context a
                    // follow-up looks like a question not understood.
                    return Ok(Answer {
                        degraded: true,
                        ..answer
                    });
                }
            };
            if let Some(earlier) = loaded.earlier_reply {
                if let Some(a) = repeated(&earlier) {
                    return Ok(a);
                }
            }
            let (answer, session) = self.answer(ch, loaded.session, m.text, &key);
            let body = message.as_ref().map(|_| serde_json::to_string(&answer));
            let keep = match (&message, &body) {
                (Some(message), Some(Ok(reply))) => Some(KeepReply {
                    message,
                    reply,
                    ttl: self.settings.retry_window,
                }),
                _ => None,
            };
            let save = || {
                self.store.save(
                    &key,
                    &session,
                    loaded.version,
                    self.settings.session_ttl,
                    keep,
                )
            };
            // One more try on a store error: a connection that just dropped
            // has usually reconnected by then, and a turn not remembered
            // makes the next follow-up lose its context.
            let saved = match save().await {
                Err(e) => {
                    tracing::debug!(error = %e, "saving the session again");
                    save().await
                }
                done => done,
            };
            match saved {
                Ok(Saved::Stored) => {
                    self.note_unanswered(&answer.reply, &key).await;
                    return Ok(answer);
                }
                Ok(Saved::Answered(earlier)) => {
                    if let Some(a) = repeated(&earlier) {
                        return Ok(a);
                    }
                    return Ok(answer);
                }
                Ok(Saved::Conflict) => {
                    tracing::debug!(attempt, "session changed meanwhile; redoing the turn");
                    // A short random pause spreads out readers' bursts.
                    let pause = rand::random_range(0..=(attempt as u64 + 1) * 2);
                    tokio::time::sleep(Duration::from_millis(pause)).await;
                }
                Err(e) => {
                    // The answer used the context, but this turn is not
                    // remembered; it is marked like any degraded reply,
                    // since the next follow-up may lack its context.
                    if let Some(held) = STORE_DOWN_LOG.pass() {
                        tracing::warn!(error = %e, held_back = held, "session not saved");
                    }
                    return Ok(Answer {
                        degraded: true,
                        ..answer
                    });
                }
            }
        }
        Err(EngineError::Busy)
    }

    /// Adds what a turn left unanswered to the editors' list. The list is
    /// a help, not a record: a failure is logged and the reply goes out.
    async fn note_unanswered(&self, reply: &Reply, key: &str) {
        if reply.unanswered.is_empty() {
            return;
        }
        // In the background: the reply does not wait for the list (a slow
        // store would delay it for nothing).
        let store = Arc::clone(&self.store);
        let notes = reply.unanswered.clone();
        let key = key.to_string();
        // In the request's span, so its lines still name the request.
        let span = tracing::Span::current();
        tokio::spawn(tracing::Instrument::instrument(
            async move {
                for (text, kind) in notes {
                    if let Err(e) = store.note_unanswered(&key, &text, kind).await {
                        tracing::debug!(error = %e, "unanswered question not noted");
                    }
                }
            },
            span,
        ));
    }

    /// The most asked questions that got no answer, most frequent first.
    pub async fn unanswered(&self, limit: usize) -> Result<Vec<Unanswered>, StoreError> {
        self.store.unanswered(limit).await
    }

    /// Runs one turn against the current snapshot. A stored session from
    /// another schema, or idle past the TTL, is not used.
    fn answer(
        &self,
        ch: &str,
        stored: Option<Session>,
        text: &str,
        key: &str,
    ) -> (Answer, Session) {
        let snap = self.snapshot();
        let now = self.now(&snap.data);
        let now_s = now.timestamp().as_second();
        let ttl = i64::try_from(self.settings.session_ttl.as_secs()).unwrap_or(i64::MAX);
        let session = stored
            .filter(|s| s.schema == SCHEMA && s.updated_at.saturating_add(ttl) >= now_s)
            .unwrap_or_else(|| Session::new(ch, now_s));
        // The channel was checked on arrival; if an update since removed
        // its profile, the built-in one of that name (or plain) serves.
        let profile = snap
            .catalog
            .channels
            .get(ch)
            .or_else(|| BUILT_IN_CHANNELS.get(ch))
            .or_else(|| BUILT_IN_CHANNELS.get("plain"))
            .expect("the built-in profiles include plain (checked by a unit test)");
        let ctx = TurnContext {
            data: &snap.data,
            catalog: &snap.catalog,
            understanding: &snap.understanding,
            now: &now,
            channel: profile,
            stale_after: self.settings.stale_after,
        };
        let (mut reply, session) = turn(&ctx, session, text);
        // Measured on the final text, whatever wording or service reply it
        // came from: an SMS reply always goes out as one segment.
        // Plain-text fields stay plain text whatever the data's names hold.
        reply.text = crate::answers::channel::plain_text(&reply.text);
        for q in &mut reply.quick_replies {
            *q = crate::answers::channel::plain_text(q);
        }
        if profile.one_sms_segment {
            reply.text = crate::answers::sms::fit_one_segment(&reply.text);
        }
        let reply_text = reply.text.clone();
        tracing::debug!(user = %key, intent = ?reply.intent, outcome = ?reply.outcome, "turn");
        let answer = Answer {
            reply,
            channel: ch.to_string(),
            sms: profile.one_sms_segment.then(|| {
                let m = crate::answers::sms::measure(&reply_text);
                SmsFit {
                    encoding: match m.encoding {
                        crate::answers::sms::Encoding::Gsm7 => "gsm7".into(),
                        crate::answers::sms::Encoding::Ucs2 => "ucs2".into(),
                    },
                    units: m.units,
                    limit: m.limit,
                }
            }),
            dataset_version: snap.data.version,
            as_of: rfc3339(&snap.data.as_of.to_zoned_datetime(snap.data.tz.clone())),
            degraded: false,
            repeated: false,
        };
        (answer, session)
    }

    /// Applies a batch of changes all or nothing: the new dataset version,
    /// or every problem found (and nothing changed). Questions under way
    /// finish on the version they started with.
    pub async fn apply_batch(&self, batch: &Batch) -> Result<u64, ChangeError> {
        // On the real clock a date far ahead is a typo; a demo or fixed
        // clock replays whatever night it was given.
        if self.settings.clock == Clock::System && self.snapshot().data.clock.is_none() {
            changes::check_not_ahead(batch, Timestamp::now()).map_err(ChangeError::Invalid)?;
        }
        let result = self
            .change(|data, now| changes::apply(data, batch, now))
            .await;
        self.metrics.batch(change_result(&result));
        result
    }

    /// Replaces the whole dataset with checked records; the version moves
    /// on from the current one.
    /// [`Engine::replace_records`] for the admin API: refused, with a
    /// problem per kind of record, when it removes more than
    /// `max_removed_share` of any kind, unless `force`.
    pub async fn replace_records_checked(
        &self,
        records: Records,
        force: bool,
    ) -> Result<u64, ChangeError> {
        let result = if force {
            self.replace_records(records).await
        } else {
            let current = Records::of(&self.snapshot().data);
            let problems =
                changes::removes_too_much(&current, &records, self.settings.max_removed_share);
            if problems.is_empty() {
                self.replace_records(records).await
            } else {
                Err(ChangeError::Invalid(problems))
            }
        };
        self.metrics.replacement(change_result(&result));
        result
    }

    pub async fn replace_records(&self, records: Records) -> Result<u64, ChangeError> {
        self.change(|data, _| {
            records
                .clone()
                .build(data.version + 1)
                .map_err(|e| match e {
                    LoadError::Invalid(p) => p,
                    LoadError::File(m) => {
                        vec![DataProblem::new("dataset", "", "", String::new(), m)]
                    }
                })
        })
        .await
    }

    /// One change to the data: made on the latest version, shared with the
    /// other replicas first (compare-and-set on the shared version, redone
    /// on the newer data if another replica changed it meanwhile), then
    /// swapped in here.
    async fn change(
        &self,
        make: impl Fn(&Dataset, &str) -> Result<Dataset, Vec<DataProblem>>,
    ) -> Result<u64, ChangeError> {
        let _one_at_a_time = self.writes.lock().await;
        for _ in 0..5 {
            self.catch_up_locked().await?;
            let snap = self.snapshot();
            let now = rfc3339(&self.now(&snap.data));
            let data = make(&snap.data, &now).map_err(ChangeError::Invalid)?;
            if let Some(shared) = &self.shared {
                let expected = self.shared_seen.load(Ordering::Relaxed);
                let version = (expected + 1).max(data.version);
                let data = if version == data.version {
                    data
                } else {
                    Records::of(&data)
                        .build(version)
                        .map_err(|e| ChangeError::Shared(SharedError::Corrupt(e.to_string())))?
                };
                match shared.publish(expected, version, &Records::of(&data)).await {
                    Ok(true) => {}
                    Ok(false) => {
                        // Another replica changed the data first: redo the
                        // change on its version, after a short pause.
                        let pause = rand::random_range(5..=50);
                        tokio::time::sleep(Duration::from_millis(pause)).await;
                        continue;
                    }
                    Err(e) => {
                        // The script may have run although no answer came
                        // back: the shared version tells.
                        match shared.version().await {
                            Ok(v) if v == version => {}
                            Ok(_) => return Err(ChangeError::Shared(e)),
                            Err(_) => return Err(ChangeError::Unknown(e)),
                        }
                    }
                }
                self.shared_seen.store(version, Ordering::Relaxed);
                return Ok(self.install(data, &snap));
            }
            return Ok(self.install(data, &snap));
        }
        Err(ChangeError::Busy)
    }

    /// Builds the understanding for new data with the current catalog and
    /// swaps it in.
    fn install(&self, data: Dataset, current: &Snapshot) -> u64 {
        let version = data.version;
        self.swap(Snapshot::new(data, current.catalog.clone()));
        tracing::info!(version, "dataset updated");
        version
    }

    /// What the admin status reports.
    pub async fn status(&self) -> ServiceStatus {
        let snap = self.snapshot();
        let now = self.now(&snap.data);
        let age = now.timestamp().as_second() - snap.data.as_of.as_second();
        let (store, sessions) = self.store_status().await;
        ServiceStatus {
            age_seconds: age,
            as_of: rfc3339(&snap.data.as_of.to_zoned_datetime(snap.data.tz.clone())),
            channels: snap
                .catalog
                .channels
                .names()
                .into_iter()
                .map(str::to_string)
                .collect(),
            dataset_version: snap.data.version,
            intents: snap
                .catalog
                .intents
                .iter()
                .map(|i| i.name.clone())
                .collect(),
            reload_error: self
                .reload_error
                .lock()
                .unwrap_or_else(|p| p.into_inner())
                .clone(),
            scenario: snap.data.scenario.title.clone(),
            sessions: StoreState {
                status: match sessions {
                    Ok(()) => "ok".to_string(),
                    Err(e) => e.to_string(),
                },
                store: store.to_string(),
            },
        }
    }

    /// Whether `token` is the admin token (compared as [`same_secret`]
    /// does, in constant time); `None` when the admin API is off.
    pub fn admin_allows(&self, token: &str) -> Option<bool> {
        let want = self.settings.admin_token.as_deref()?;
        Some(same_secret(want, token))
    }

    /// The channel's name, checked against the profiles in force.
    fn channel<'a>(&self, name: &'a str) -> Result<&'a str, EngineError> {
        let snap = self.snapshot();
        match snap.catalog.channels.get(name) {
            Some(_) => Ok(name),
            None => Err(EngineError::UnknownChannel(
                name.to_string(),
                snap.catalog.channels.names().join(", "),
            )),
        }
    }

    /// Removes everything kept for a reader on a channel.
    pub async fn erase(&self, channel: &str, user: &str) -> Result<u64, EngineError> {
        let ch = self.channel(channel)?;
        let key = self.user_key(ch, user);
        let removed = self.store.erase(&key).await?;
        // Erasures are worth an info line; which reader only at debug.
        tracing::info!(removed, "reader's data erased");
        tracing::debug!(user = %key, "erased reader");
        Ok(removed)
    }

    /// The session store's name ("memory", "redis").
    pub fn store_name(&self) -> &'static str {
        self.store.name()
    }

    /// Whether the session store answers, and its name.
    pub async fn store_status(&self) -> (&'static str, Result<(), StoreError>) {
        (self.store.name(), self.store.ping().await)
    }
}

/// Whether `token` is `want`. Both are hashed first and the digests
/// compared in constant time, so neither the secret's content nor its
/// length shows in how long a wrong guess takes.
fn same_secret(want: &str, token: &str) -> bool {
    let digest = |s: &str| {
        let mut mac = Hmac::<Sha256>::new_from_slice(b"tidings admin token")
            .expect("HMAC takes keys of any length");
        mac.update(s.as_bytes());
        mac.finalize().into_bytes()
    };
    let (a, b) = (digest(want), digest(token));
    a.iter()
        .zip(b.iter())
        .fold(0u8, |acc, (x, y)| acc | (x ^ y))
        == 0
}

/// How a change to the data ended, as the metrics count it.
fn change_result<T>(r: &Result<T, ChangeError>) -> crate::metrics::ChangeResult {
    use crate::metrics::ChangeResult as C;
    match r {
        Ok(_) => C::Applied,
        Err(ChangeError::Invalid(_)) => C::Invalid,
        Err(ChangeError::Shared(_)) => C::NotShared,
        Err(ChangeError::Busy) => C::Busy,
        Err(ChangeError::Unknown(_)) => C::Unknown,
    }
}

/// A stored reply read back for a retried message. `None` if it no longer
/// parses (written by an older version): the message is then handled anew.
fn repeated(stored: &str) -> Option<Answer> {
    match serde_json::from_str::<Answer>(stored) {
        Ok(a) => Some(Answer {
            repeated: true,
            ..a
        }),
        Err(e) => {
            tracing::warn!(error = %e, "stored reply unreadable; handling the message again");
            None
        }
    }
}
