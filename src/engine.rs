//! The engine: the current snapshot (data, catalog, understanding), the
//! session store and the clock, and the one entry point every interface
//! uses: [`Engine::handle`].

use std::path::PathBuf;
use std::sync::Arc;
use std::time::Duration;

use arc_swap::ArcSwap;
use hmac::{Hmac, Mac};
use jiff::{Timestamp, ZonedDateTime};
use serde::Serialize;
use sha2::Sha256;

use crate::answers::value::Style;
use crate::catalog::{self, Catalog};
use crate::dataset::{self, Dataset};
use crate::dialogue::turn::{turn, Reply, TurnContext};
use crate::dialogue::{Session, SessionStore};
use crate::understand::Understanding;

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

/// How replies are shaped for a channel.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Channel {
    /// Chat bubbles: text.
    Chat,
    /// Text with no markup, for any other integration.
    Plain,
}

impl Channel {
    /// Parses a channel name.
    pub fn parse(s: &str) -> Option<Channel> {
        match s {
            "chat" => Some(Channel::Chat),
            "plain" => Some(Channel::Plain),
            _ => None,
        }
    }
    /// The channel's name.
    pub fn name(self) -> &'static str {
        match self {
            Channel::Chat => "chat",
            Channel::Plain => "plain",
        }
    }
    fn style(self) -> Style {
        Style::Text
    }
}

/// Engine settings.
#[derive(Debug, Clone)]
pub struct Settings {
    pub clock: Clock,
    /// How long an idle session is kept.
    pub session_ttl: Duration,
    /// Key for hashing user ids; never logged.
    pub id_secret: Vec<u8>,
}

/// Why a message could not be handled. Reader mistakes are caught before
/// this, in the HTTP layer; these are the service's own problems.
#[derive(Debug, thiserror::Error)]
pub enum EngineError {
    #[error("unknown channel {0:?}; channels are chat and plain")]
    UnknownChannel(String),
}

/// A handled message with the version facts answers can cite.
#[derive(Debug, Clone, Serialize)]
pub struct Answer {
    #[serde(flatten)]
    pub reply: Reply,
    pub channel: Channel,
    pub dataset_version: u64,
    /// RFC 3339, in the scenario's time zone.
    pub as_of: String,
    /// Set when the session store could not be used: the reply was made
    /// without conversation context.
    pub degraded: bool,
}

/// The shared engine handle.
#[derive(Clone)]
pub struct Engine {
    // ArcSwap: readers take the current snapshot without locking, and a
    // later update swaps in a whole new one atomically.
    snapshot: Arc<ArcSwap<Snapshot>>,
    store: Arc<dyn SessionStore>,
    settings: Arc<Settings>,
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
        Engine {
            snapshot: Arc::new(ArcSwap::from_pointee(snapshot)),
            store,
            settings: Arc::new(settings),
        }
    }

    /// The current snapshot.
    pub fn snapshot(&self) -> Arc<Snapshot> {
        self.snapshot.load_full()
    }

    /// Replaces the snapshot; requests under way finish on the old one.
    pub fn swap(&self, next: Snapshot) {
        self.snapshot.store(Arc::new(next));
    }

    /// The current time in the scenario's zone: `--now`, else the
    /// scenario's own demo clock, else the real time.
    pub fn now(&self, data: &Dataset) -> ZonedDateTime {
        let t = match self.settings.clock {
            Clock::Fixed(t) => t,
            Clock::System => data.clock.unwrap_or_else(Timestamp::now),
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

    /// Handles one message from a reader.
    pub async fn handle(
        &self,
        user: &str,
        channel: &str,
        text: &str,
    ) -> Result<Answer, EngineError> {
        let ch = Channel::parse(channel)
            .ok_or_else(|| EngineError::UnknownChannel(channel.to_string()))?;
        let snap = self.snapshot();
        let now = self.now(&snap.data);
        let key = self.user_key(ch.name(), user);
        let mut degraded = false;
        let session = match self.store.load(&key).await {
            Ok(Some(s)) if s.schema == crate::dialogue::session::SCHEMA => s,
            Ok(_) => Session::new(ch.name(), now.timestamp().as_second()),
            Err(e) => {
                tracing::warn!(error = %e, "session store unavailable; answering without context");
                degraded = true;
                Session::new(ch.name(), now.timestamp().as_second())
            }
        };
        let ctx = TurnContext {
            data: &snap.data,
            catalog: &snap.catalog,
            understanding: &snap.understanding,
            now: &now,
            style: ch.style(),
        };
        let (reply, session) = turn(&ctx, session, text);
        tracing::debug!(user = %key, intent = ?reply.intent, outcome = ?reply.outcome, "turn");
        if !degraded {
            if let Err(e) = self
                .store
                .save(&key, &session, self.settings.session_ttl)
                .await
            {
                tracing::warn!(error = %e, "session not saved");
                degraded = true;
            }
        }
        Ok(Answer {
            reply,
            channel: ch,
            dataset_version: snap.data.version,
            as_of: snap
                .data
                .as_of
                .to_zoned_datetime(snap.data.tz.clone())
                .strftime("%Y-%m-%dT%H:%M:%S%:z")
                .to_string(),
            degraded,
        })
    }
}
