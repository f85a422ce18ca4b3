//! The results dataset: the model, loading and validating it, where its
//! values stand in the JSON texts (`locate`), live changes to it
//! (`changes`), and the handle through which every request reads one
//! consistent version of it.

pub mod changes;
pub mod load;
pub mod locate;
pub mod mark;
pub mod model;
pub mod shared;
pub mod sides;
pub mod table;

use std::collections::HashMap;

use jiff::{tz::TimeZone, Timestamp, ZonedDateTime};

pub use load::{load_dir, load_files, DataProblem, LoadError};
pub use mark::Mark;
pub use model::*;

/// A loaded, validated scenario with the indexes answers need.
///
/// This encodes the invariant that every reference in the data resolves: an
/// entry's competitor exists, a contest's discipline belongs to its sport, a
/// mark parses for its measure. Operations may index without checking.
#[derive(Debug, Clone)]
pub struct Dataset {
    pub scenario: Scenario,
    pub sports: Vec<Sport>,
    pub groups: Vec<Group>,
    pub competitors: Vec<Competitor>,
    pub contests: Vec<Contest>,
    /// Derived facts per contest, same order as `contests`.
    pub facts: Vec<ContestFacts>,
    /// The scenario's time zone.
    pub tz: TimeZone,
    /// When the newsroom last confirmed the data.
    pub as_of: Timestamp,
    /// A fixed clock for demo or replay data.
    pub clock: Option<Timestamp>,
    /// Increases with every change applied to the data.
    pub version: u64,
    /// The scenario's tables, computed from the results of this version.
    pub tables: Vec<table::Table>,
    sport_ix: HashMap<Id, usize>,
    group_ix: HashMap<Id, usize>,
    competitor_ix: HashMap<Id, usize>,
    contest_ix: HashMap<Id, usize>,
    /// (contest, entry) pairs per competitor, derived once at load because
    /// slot filling asks it for every candidate person.
    entries_of: Vec<Vec<(usize, usize)>>,
}

/// What is derived from a contest once, at load time.
#[derive(Debug, Clone)]
pub struct ContestFacts {
    /// Start in the scenario's time zone.
    pub start: ZonedDateTime,
    /// Ranking direction after the contest's override.
    pub better: Better,
    /// Parsed marks, one per entry.
    pub marks: Vec<Option<Mark>>,
    /// Last update of a live contest.
    pub updated: Option<Timestamp>,
    /// The name readers know it by: "women's long jump final".
    pub name: String,
}

/// A reference to something a reader can name.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, serde::Serialize)]
#[serde(tag = "kind", content = "index", rename_all = "snake_case")]
pub enum EntityRef {
    Competitor(usize),
    Group(usize),
    Sport(usize),
    /// Sport index and discipline index within it.
    Discipline(usize, usize),
    Contest(usize),
}

impl Dataset {
    pub fn sport(&self, id: &str) -> Option<usize> {
        self.sport_ix.get(id).copied()
    }
    pub fn group(&self, id: &str) -> Option<usize> {
        self.group_ix.get(id).copied()
    }
    pub fn competitor(&self, id: &str) -> Option<usize> {
        self.competitor_ix.get(id).copied()
    }
    pub fn contest(&self, id: &str) -> Option<usize> {
        self.contest_ix.get(id).copied()
    }

    /// Discipline index pair of a contest.
    pub fn discipline_ref(&self, contest: usize) -> (usize, usize) {
        let c = &self.contests[contest];
        let s = self.sport_ix[&c.sport];
        let d = self.sports[s]
            .disciplines
            .iter()
            .position(|d| d.id == c.discipline)
            .expect("validated: a contest's discipline belongs to its sport");
        (s, d)
    }

    /// The contest's name as a reader would say it: "women's long jump final".
    pub fn contest_name(&self, contest: usize) -> String {
        self.facts[contest].name.clone()
    }

    /// The group an entry stands for: its own group, else its competitor's.
    pub fn entry_group(&self, entry: &Entry) -> Option<usize> {
        if let Some(g) = &entry.group {
            return self.group(g);
        }
        entry
            .competitor
            .as_deref()
            .and_then(|c| self.competitor(c))
            .and_then(|c| self.group(&self.competitors[c].group))
    }

    /// A group's name as a value: plural names ("Moorland Progressives")
    /// take plural verbs.
    pub fn group_name_value(&self, g: usize) -> crate::answers::value::Value {
        let name = self.groups[g].name.clone();
        if self.groups[g].plural {
            crate::answers::value::Value::Plural(name)
        } else {
            crate::answers::value::Value::Text(name)
        }
    }

    /// The entry's name as printed: a person's full name or a group's name.
    pub fn entry_name(&self, entry: &Entry) -> String {
        if let Some(c) = entry.competitor.as_deref().and_then(|c| self.competitor(c)) {
            return self.competitors[c].name();
        }
        self.entry_group(entry)
            .map(|g| self.groups[g].name.clone())
            .unwrap_or_default()
    }

    /// The printable name of any entity.
    pub fn entity_name(&self, e: EntityRef) -> String {
        match e {
            EntityRef::Competitor(i) => self.competitors[i].name(),
            EntityRef::Group(i) => self.groups[i].name.clone(),
            EntityRef::Sport(i) => self.sports[i].name.clone(),
            EntityRef::Discipline(s, d) => self.sports[s].disciplines[d].name.clone(),
            EntityRef::Contest(i) => self.contest_name(i),
        }
    }

    /// A stable id for any entity, for the reply JSON and session state.
    pub fn entity_id(&self, e: EntityRef) -> String {
        match e {
            EntityRef::Competitor(i) => self.competitors[i].id.clone(),
            EntityRef::Group(i) => self.groups[i].id.clone(),
            EntityRef::Sport(i) => self.sports[i].id.clone(),
            EntityRef::Discipline(s, d) => {
                format!("{}/{}", self.sports[s].id, self.sports[s].disciplines[d].id)
            }
            EntityRef::Contest(i) => self.contests[i].id.clone(),
        }
    }

    /// Resolves an id produced by [`Dataset::entity_id`] for the given kind.
    pub fn entity_by_id(&self, kind: &str, id: &str) -> Option<EntityRef> {
        match kind {
            "competitor" => self.competitor(id).map(EntityRef::Competitor),
            "group" => self.group(id).map(EntityRef::Group),
            "sport" => self.sport(id).map(EntityRef::Sport),
            "contest" => self.contest(id).map(EntityRef::Contest),
            "discipline" => {
                let (s, d) = id.split_once('/')?;
                let si = self.sport(s)?;
                let di = self.sports[si].disciplines.iter().position(|x| x.id == d)?;
                Some(EntityRef::Discipline(si, di))
            }
            _ => None,
        }
    }

    /// Contests a competitor takes part in (individually or as a team
    /// member), as (contest, entry) pairs in file order.
    pub fn contests_of(&self, competitor: usize) -> &[(usize, usize)] {
        &self.entries_of[competitor]
    }

    /// Whether a contest's round gives awards: only the final does; heats
    /// place competitors without medals.
    pub fn awards_in(&self, contest: usize) -> bool {
        self.contests[contest].phase == "final"
    }

    /// The rank-ordered awards of this scenario.
    pub fn awards(&self) -> &[String] {
        &self.scenario.awards
    }
}

/// The built-in demo games, for unit tests across the crate.
#[cfg(test)]
pub(crate) fn demo() -> Dataset {
    crate::engine::load(&crate::engine::Sources::default())
        .expect("the demo loads")
        .data
}
