//! The closed set of data operations. Editors name one per intent; each lives
//! in its own file with the same two steps: read its slots, compute facts
//! from one dataset version.
//!
//! An operation never phrases an answer. It returns an outcome name (which
//! reply wording to use) and named facts (what fills the wording). Each
//! operation declares its parameters, outcomes and facts up front, so the
//! catalog can reject an intent that uses something the operation cannot
//! give before the service starts.

mod about;
mod best_mark;
mod builtin;
mod contest_time;
mod day_schedule;
mod group_medals;
mod group_result;
mod head_to_head;
mod leader;
mod margin_of;
mod match_score;
mod medal_table;
mod next_for;
mod open_contests;
mod placed;
mod podium;
mod profile;
mod result;
mod round_matches;
mod standings;
pub mod support;
mod table;
mod team_form;
mod team_last;
mod team_next;
mod team_record;
pub mod team_support;

use std::collections::{BTreeMap, HashMap};

use jiff::ZonedDateTime;
use serde::Serialize;

use crate::answers::value::Value;
use crate::dataset::{Dataset, EntityRef};

/// What a slot holds.
#[derive(
    Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, serde::Deserialize, schemars::JsonSchema,
)]
#[serde(rename_all = "snake_case")]
pub enum EntityKind {
    Competitor,
    Group,
    Contest,
    Sport,
    Discipline,
    /// "women", "men"...
    Category,
    /// One of the scenario's awards.
    Award,
    /// A calendar day.
    Date,
    /// A small whole number ("top five").
    Count,
    /// A place in a contest ("fifth", "last").
    Place,
    /// A round of a contest ("heats", "final", "semifinal").
    Round,
}

impl EntityKind {
    /// Every kind, for error messages and docs.
    pub const ALL: [EntityKind; 11] = [
        EntityKind::Competitor,
        EntityKind::Group,
        EntityKind::Contest,
        EntityKind::Sport,
        EntityKind::Discipline,
        EntityKind::Category,
        EntityKind::Award,
        EntityKind::Date,
        EntityKind::Count,
        EntityKind::Place,
        EntityKind::Round,
    ];

    /// The name editors write in YAML.
    pub fn name(self) -> &'static str {
        match self {
            EntityKind::Competitor => "competitor",
            EntityKind::Group => "group",
            EntityKind::Contest => "contest",
            EntityKind::Sport => "sport",
            EntityKind::Discipline => "discipline",
            EntityKind::Category => "category",
            EntityKind::Award => "award",
            EntityKind::Date => "date",
            EntityKind::Count => "count",
            EntityKind::Place => "place",
            EntityKind::Round => "round",
        }
    }

    /// Parses the YAML name.
    pub fn from_name(s: &str) -> Option<EntityKind> {
        EntityKind::ALL.into_iter().find(|k| k.name() == s)
    }
}

/// A filled slot.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum SlotValue {
    Entity {
        entity: EntityRef,
    },
    Category {
        value: String,
    },
    Award {
        value: String,
    },
    Date {
        value: jiff::civil::Date,
    },
    Count {
        value: u32,
    },
    /// A place: 1 for first, 0 for last.
    Place {
        value: u32,
    },
    /// A round, as the data names phases ("heat", "final").
    Round {
        value: String,
    },
}

/// The place value that means "last".
pub const LAST_PLACE: u32 = 0;

impl SlotValue {
    /// The kind of value held.
    pub fn kind(&self) -> EntityKind {
        match self {
            SlotValue::Entity { entity } => match entity {
                EntityRef::Competitor(_) => EntityKind::Competitor,
                EntityRef::Group(_) => EntityKind::Group,
                EntityRef::Sport(_) => EntityKind::Sport,
                EntityRef::Discipline(..) => EntityKind::Discipline,
                EntityRef::Contest(_) => EntityKind::Contest,
            },
            SlotValue::Category { .. } => EntityKind::Category,
            SlotValue::Award { .. } => EntityKind::Award,
            SlotValue::Date { .. } => EntityKind::Date,
            SlotValue::Count { .. } => EntityKind::Count,
            SlotValue::Place { .. } => EntityKind::Place,
            SlotValue::Round { .. } => EntityKind::Round,
        }
    }

    /// The held entity, if it is one.
    pub fn entity(&self) -> Option<EntityRef> {
        match self {
            SlotValue::Entity { entity } => Some(*entity),
            _ => None,
        }
    }

    /// A stable, comparable form: entity ids, dates in ISO 8601.
    pub fn key(&self, data: &Dataset) -> String {
        match self {
            SlotValue::Entity { entity } => data.entity_id(*entity),
            SlotValue::Category { value } | SlotValue::Award { value } => value.clone(),
            SlotValue::Date { value } => value.to_string(),
            SlotValue::Count { value } => value.to_string(),
            SlotValue::Place { value: LAST_PLACE } => "last".to_string(),
            SlotValue::Place { value } => value.to_string(),
            SlotValue::Round { value } => value.clone(),
        }
    }

    /// How the value reads in a reply.
    pub fn display(&self, data: &Dataset) -> String {
        match self {
            SlotValue::Entity { entity } => data.entity_name(*entity),
            SlotValue::Category { value } | SlotValue::Award { value } => value.clone(),
            SlotValue::Date { value } => value.strftime("%A %-d %B").to_string(),
            SlotValue::Count { value } => value.to_string(),
            SlotValue::Place { value: LAST_PLACE } => "last".to_string(),
            SlotValue::Place { value } => crate::answers::words::ordinal_figure(*value as u64),
            SlotValue::Round { value } => value.clone(),
        }
    }
}

/// Filled slots by name.
pub type Slots = BTreeMap<String, SlotValue>;

/// One parameter of an operation.
#[derive(Debug, Clone, Copy)]
pub struct Param {
    pub name: &'static str,
    pub kind: EntityKind,
    pub required: bool,
}

/// What an outcome means for the reader.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum OutcomeClass {
    /// A fact was given.
    Answered,
    /// Honestly nothing to give yet, or no such result.
    NoData,
    /// Figures of a contest still under way: an answer to how it stands
    /// ("is she ahead?", "how many votes has he got so far?"), and nothing
    /// yet for how it ended ("did she win?"). The turn decides which from
    /// the question.
    SoFar,
}

/// One outcome an operation may return.
#[derive(Debug, Clone, Copy)]
pub struct OutcomeSpec {
    pub name: &'static str,
    pub class: OutcomeClass,
    /// The facts this outcome fills, beyond the slots.
    pub facts: &'static [&'static str],
}

/// An operation's declaration and its code.
pub struct OpSpec {
    pub name: &'static str,
    pub summary: &'static str,
    pub params: &'static [Param],
    pub outcomes: &'static [OutcomeSpec],
    pub run: fn(&OpInput) -> OpOutput,
}

impl std::fmt::Debug for OpSpec {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("OpSpec").field("name", &self.name).finish()
    }
}

impl OpSpec {
    /// Whether answers of this operation come from the results data (and
    /// so may cite how fresh the data are); greetings, thanks and help do
    /// not.
    pub fn from_data(&self) -> bool {
        ![
            builtin::GREETING.name,
            builtin::THANKS.name,
            builtin::HELP.name,
        ]
        .contains(&self.name)
    }

    /// The declared outcome by name.
    pub fn outcome(&self, name: &str) -> Option<&OutcomeSpec> {
        self.outcomes.iter().find(|o| o.name == name)
    }
    /// The declared parameter by name.
    pub fn param(&self, name: &str) -> Option<&Param> {
        self.params.iter().find(|p| p.name == name)
    }
}

/// What an operation reads.
pub struct OpInput<'a> {
    pub data: &'a Dataset,
    pub slots: &'a Slots,
    /// The current time in the scenario's time zone.
    pub now: &'a ZonedDateTime,
    /// Intent-level settings, such as the default size of a table.
    pub settings: &'a BTreeMap<String, String>,
    /// One line per question the service can answer, for help replies.
    pub topics: &'a [String],
    /// After how long without an update a live contest's figures are said
    /// to be old ("last updated 38 minutes ago").
    pub stale_after: std::time::Duration,
}

impl OpInput<'_> {
    pub fn entity(&self, name: &str) -> Option<EntityRef> {
        self.slots.get(name).and_then(SlotValue::entity)
    }
    pub fn contest(&self, name: &str) -> Option<usize> {
        match self.entity(name) {
            Some(EntityRef::Contest(i)) => Some(i),
            _ => None,
        }
    }
    pub fn competitor(&self, name: &str) -> Option<usize> {
        match self.entity(name) {
            Some(EntityRef::Competitor(i)) => Some(i),
            _ => None,
        }
    }
    /// How many rows of a table to list: the reader's `count`, else the
    /// intent's `rows` setting, else `default`; always between 1 and 20.
    pub fn rows(&self, default: usize) -> usize {
        let n = match self.slots.get("count") {
            Some(SlotValue::Count { value }) => *value as usize,
            _ => self
                .settings
                .get("rows")
                .and_then(|s| s.parse().ok())
                .unwrap_or(default),
        };
        n.clamp(1, 20)
    }
    pub fn text(&self, name: &str) -> Option<&str> {
        match self.slots.get(name) {
            Some(SlotValue::Category { value }) | Some(SlotValue::Award { value }) => Some(value),
            _ => None,
        }
    }
}

/// What an operation found.
#[derive(Debug, Clone, PartialEq)]
pub enum OpOutput {
    /// An outcome and the facts that fill its wording. `mentioned` lists the
    /// entities the answer names, for follow-up questions; `subjects` the
    /// ones it is about (the winner; several when tied), which "she" or
    /// "they" in the next message most likely mean.
    Done {
        outcome: &'static str,
        facts: HashMap<String, Value>,
        mentioned: Vec<EntityRef>,
        subjects: Vec<EntityRef>,
    },
    /// The operation cannot answer without one more detail, and the data
    /// narrow it to these options (never guessed).
    Choose {
        slot: &'static str,
        options: Vec<EntityRef>,
    },
}

impl OpOutput {
    /// A finished outcome.
    pub fn done(outcome: &'static str, facts: Facts, mentioned: Vec<EntityRef>) -> OpOutput {
        OpOutput::Done {
            outcome,
            facts: facts.0,
            mentioned,
            subjects: Vec::new(),
        }
    }

    /// The same outcome, naming the answer's subjects. With none named,
    /// every person the answer mentions is an equal candidate for a
    /// pronoun, and the reader is asked which one.
    pub fn about(self, who: Vec<EntityRef>) -> OpOutput {
        match self {
            OpOutput::Done {
                outcome,
                facts,
                mentioned,
                ..
            } => OpOutput::Done {
                outcome,
                facts,
                mentioned,
                subjects: who,
            },
            other => other,
        }
    }
}

/// A small builder for facts.
#[derive(Debug, Default)]
pub struct Facts(pub HashMap<String, Value>);

impl Facts {
    pub fn new() -> Facts {
        Facts(HashMap::new())
    }
    pub fn set(mut self, name: &str, v: impl Into<Value>) -> Facts {
        self.0.insert(name.to_string(), v.into());
        self
    }
    pub fn put(&mut self, name: &str, v: impl Into<Value>) {
        self.0.insert(name.to_string(), v.into());
    }
}

/// The registry: every operation the service can run.
pub static OPERATIONS: &[&OpSpec] = &[
    &podium::SPEC,
    &result::SPEC,
    &profile::SPEC,
    &group_medals::SPEC,
    &medal_table::SPEC,
    &contest_time::SPEC,
    &next_for::SPEC,
    &day_schedule::SPEC,
    &leader::SPEC,
    &head_to_head::SPEC,
    &best_mark::SPEC,
    &standings::SPEC,
    &open_contests::SPEC,
    &group_result::SPEC,
    &placed::SPEC,
    &margin_of::SPEC,
    &about::SPEC,
    &table::SPEC,
    &match_score::SPEC,
    &team_next::SPEC,
    &team_last::SPEC,
    &team_form::SPEC,
    &team_record::SPEC,
    &round_matches::SPEC,
    &builtin::GREETING,
    &builtin::THANKS,
    &builtin::HELP,
];

/// Finds an operation by the name editors use.
pub fn find(name: &str) -> Option<&'static OpSpec> {
    OPERATIONS.iter().copied().find(|o| o.name == name)
}

/// The names of every operation, for error messages.
pub fn names() -> Vec<&'static str> {
    OPERATIONS.iter().map(|o| o.name).collect()
}

/// Shorthand for outcome declarations.
pub(crate) const fn answered(name: &'static str, facts: &'static [&'static str]) -> OutcomeSpec {
    OutcomeSpec {
        name,
        class: OutcomeClass::Answered,
        facts,
    }
}

/// Shorthand for outcome declarations.
pub(crate) const fn no_data(name: &'static str, facts: &'static [&'static str]) -> OutcomeSpec {
    OutcomeSpec {
        name,
        class: OutcomeClass::NoData,
        facts,
    }
}

/// Shorthand for outcome declarations.
pub(crate) const fn so_far(name: &'static str, facts: &'static [&'static str]) -> OutcomeSpec {
    OutcomeSpec {
        name,
        class: OutcomeClass::SoFar,
        facts,
    }
}

/// Running one operation in unit tests, as the engine would.
#[cfg(test)]
pub(crate) mod testing {
    use super::*;

    /// Runs `run` on `data` with `slots`, at the data's own demo clock,
    /// with no intent settings and the default staleness.
    pub fn run_with(run: fn(&OpInput) -> OpOutput, data: &Dataset, slots: &Slots) -> OpOutput {
        let now = data
            .clock
            .expect("test data have a demo clock")
            .to_zoned_datetime(data.tz.clone());
        run(&OpInput {
            data,
            slots,
            now: &now,
            settings: &BTreeMap::new(),
            topics: &[],
            stale_after: std::time::Duration::from_secs(600),
        })
    }

    /// A slot holding an entity.
    pub fn entity(e: EntityRef) -> SlotValue {
        SlotValue::Entity { entity: e }
    }
}
