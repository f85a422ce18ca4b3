//! What is kept about one reader's conversation between messages.
//!
//! Only what the dialogue needs: the last question and its slots, a pending
//! clarification, recently mentioned entities and counters. No message text
//! and no raw user id are stored here.

use std::collections::BTreeMap;

use serde::{Deserialize, Serialize};

use crate::answers::ops::{SlotValue, Slots};
use crate::dataset::{Dataset, EntityRef};

/// Bumped whenever the stored shape changes, so older sessions are dropped
/// instead of misread.
pub const SCHEMA: u32 = 3;

/// An entity by kind and id: ids survive dataset updates, indexes do not.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
pub struct StoredEntity {
    pub kind: String,
    pub id: String,
}

/// A slot value as stored.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum StoredSlot {
    Entity { entity: StoredEntity },
    Category { value: String },
    Award { value: String },
    Date { value: String },
    Count { value: u32 },
    Place { value: u32 },
    Round { value: String },
}

/// A question the service asked and is waiting on.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
pub struct Pending {
    pub intent: String,
    /// Slots already filled.
    pub slots: BTreeMap<String, StoredSlot>,
    /// The slot being asked for.
    pub slot: String,
    /// The options offered, when the question was "which one?".
    #[serde(default)]
    pub options: Vec<StoredEntity>,
    /// The reader's question that was asked back about, normalised: if the
    /// reader leaves it unanswered it goes on the unanswered list (with no
    /// reader id). Kept only as long as the session.
    #[serde(default)]
    pub asked: String,
}

/// One reader's conversation state.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
pub struct Session {
    pub schema: u32,
    /// Messages handled so far.
    pub turn: u64,
    pub channel: String,
    pub last_intent: Option<String>,
    #[serde(default)]
    pub last_slots: BTreeMap<String, StoredSlot>,
    pub pending: Option<Pending>,
    /// Whether the last question asked how a contest ended ("who won the
    /// marathon?") rather than how it stands, so that "and the men's?"
    /// asks the same.
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub last_settled: bool,
    /// Entities the last answers were about, most recent first: what "she",
    /// "they" and "that race" can refer to.
    #[serde(default)]
    pub recent: Vec<Recent>,
    /// Unix seconds.
    pub created_at: i64,
    pub updated_at: i64,
}

/// How many recent entities are kept.
pub const RECENT: usize = 8;

/// How prominent a recent entity was in its turn, most prominent first:
/// "she" means the person the reader asked about, else the answer's subject
/// (the winner, the leader), and only then someone else the answer named.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Salience {
    /// Named by the reader (a filled slot).
    Asked,
    /// The first of its kind the answer named.
    Subject,
    /// Named further on in the answer.
    Mentioned,
}

/// An entity a recent turn was about.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
pub struct Recent {
    #[serde(flatten)]
    pub entity: StoredEntity,
    /// The turn it came up in.
    pub turn: u64,
    pub salience: Salience,
}

impl Session {
    /// A fresh session.
    pub fn new(channel: &str, now: i64) -> Session {
        Session {
            schema: SCHEMA,
            turn: 0,
            channel: channel.to_string(),
            last_intent: None,
            last_slots: BTreeMap::new(),
            pending: None,
            last_settled: false,
            recent: Vec::new(),
            created_at: now,
            updated_at: now,
        }
    }

    /// Puts this turn's entities at the front of the recent list: those
    /// the reader `asked` about, the answer's `subjects`, then the rest it
    /// `mentioned`.
    pub fn remember(
        &mut self,
        data: &Dataset,
        asked: &[EntityRef],
        subjects: &[EntityRef],
        mentioned: &[EntityRef],
    ) {
        let mut fresh: Vec<Recent> = Vec::new();
        let tagged = asked
            .iter()
            .map(|e| (*e, Salience::Asked))
            .chain(subjects.iter().map(|e| (*e, Salience::Subject)))
            .chain(mentioned.iter().map(|e| (*e, Salience::Mentioned)));
        for (e, salience) in tagged {
            let entity = store_entity(data, e);
            if fresh.iter().any(|r| r.entity == entity) {
                continue;
            }
            fresh.push(Recent {
                entity,
                turn: self.turn,
                salience,
            });
        }
        let rest: Vec<Recent> = std::mem::take(&mut self.recent)
            .into_iter()
            .filter(|r| !fresh.iter().any(|f| f.entity == r.entity))
            .collect();
        fresh.extend(rest);
        fresh.truncate(RECENT);
        self.recent = fresh;
    }
}

/// The stored name of an entity's kind.
pub fn kind_name(e: EntityRef) -> &'static str {
    match e {
        EntityRef::Competitor(_) => "competitor",
        EntityRef::Group(_) => "group",
        EntityRef::Sport(_) => "sport",
        EntityRef::Discipline(..) => "discipline",
        EntityRef::Contest(_) => "contest",
    }
}

/// An entity in its stored form.
pub fn store_entity(data: &Dataset, e: EntityRef) -> StoredEntity {
    StoredEntity {
        kind: kind_name(e).to_string(),
        id: data.entity_id(e),
    }
}

/// Back from the stored form; `None` if the data no longer has it.
pub fn load_entity(data: &Dataset, e: &StoredEntity) -> Option<EntityRef> {
    data.entity_by_id(&e.kind, &e.id)
}

/// Slots in their stored form.
pub fn store_slots(data: &Dataset, slots: &Slots) -> BTreeMap<String, StoredSlot> {
    slots
        .iter()
        .map(|(k, v)| {
            let s = match v {
                SlotValue::Entity { entity } => StoredSlot::Entity {
                    entity: store_entity(data, *entity),
                },
                SlotValue::Category { value } => StoredSlot::Category {
                    value: value.clone(),
                },
                SlotValue::Award { value } => StoredSlot::Award {
                    value: value.clone(),
                },
                SlotValue::Date { value } => StoredSlot::Date {
                    value: value.to_string(),
                },
                SlotValue::Count { value } => StoredSlot::Count { value: *value },
                SlotValue::Place { value } => StoredSlot::Place { value: *value },
                SlotValue::Round { value } => StoredSlot::Round {
                    value: value.clone(),
                },
            };
            (k.clone(), s)
        })
        .collect()
}

/// Slots back from the stored form, dropping any the data no longer has.
pub fn load_slots(data: &Dataset, stored: &BTreeMap<String, StoredSlot>) -> Slots {
    stored
        .iter()
        .filter_map(|(k, v)| {
            let s = match v {
                StoredSlot::Entity { entity } => SlotValue::Entity {
                    entity: load_entity(data, entity)?,
                },
                StoredSlot::Category { value } => SlotValue::Category {
                    value: value.clone(),
                },
                StoredSlot::Award { value } => SlotValue::Award {
                    value: value.clone(),
                },
                StoredSlot::Date { value } => SlotValue::Date {
                    value: value.parse().ok()?,
                },
                StoredSlot::Count { value } => SlotValue::Count { value: *value },
                StoredSlot::Place { value } => SlotValue::Place { value: *value },
                StoredSlot::Round { value } => SlotValue::Round {
                    value: value.clone(),
                },
            };
            Some((k.clone(), s))
        })
        .collect()
}
