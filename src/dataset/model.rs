//! The results model: what a scenario's files describe once they are loaded.
//!
//! The model is general on purpose: a multi-sport games, an election night and
//! a league season are all *contests* between *competitors* (people) or
//! *groups* (teams, delegations, parties), each contest measured in one way.

use serde::{Deserialize, Serialize};

/// Stable identifier of a record, as written in the data files.
pub type Id = String;

/// The scenario header (`scenario.json`).
#[derive(Debug, Clone, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct Scenario {
    /// Short id, also the folder name.
    pub id: Id,
    /// Human title, used in greetings and help.
    pub title: String,
    /// IANA time zone in which the scenario's times are written and spoken.
    pub time_zone: String,
    /// When the newsroom last confirmed the data (RFC 3339 with offset).
    pub as_of: String,
    /// Awards in order of rank (for a games: gold, silver, bronze).
    #[serde(default)]
    pub awards: Vec<String>,
    /// A fixed "now" for demonstration and replay data; a live scenario
    /// leaves it out and the service uses the real clock.
    #[serde(default)]
    pub clock: Option<String>,
    /// What a group is called in this scenario ("delegation", "party").
    #[serde(default = "default_group_noun")]
    pub group_noun: String,
    /// What one contest is called ("event"; "ward" or "race" on an
    /// election night), in questions such as "Which ward do you mean?".
    #[serde(default = "default_contest_noun")]
    pub contest_noun: String,
    /// What one unit of a two-sided score is called, in the singular
    /// ("goal", "run", "set", "frame"). Default `point`.
    #[serde(default = "default_score_unit")]
    pub score_unit: String,
    /// Tables the engine computes from the results, each with its rules
    /// (`dataset::table`). None by default.
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub tables: Vec<crate::dataset::table::TableRule>,
}

fn default_score_unit() -> String {
    "point".to_string()
}

fn default_contest_noun() -> String {
    "event".to_string()
}

fn default_group_noun() -> String {
    "team".to_string()
}

/// A sport (or, on an election night, a kind of race), with its disciplines.
#[derive(Debug, Clone, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct Sport {
    pub id: Id,
    pub name: String,
    /// What one competitor of this sport is called ("rower"), so a reader can
    /// answer "which Zoë?" with "the rower".
    pub noun: String,
    #[serde(default)]
    pub aliases: Vec<String>,
    #[serde(default)]
    pub disciplines: Vec<Discipline>,
}

/// A discipline within a sport ("100 m", "long jump", "single sculls").
#[derive(Debug, Clone, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct Discipline {
    pub id: Id,
    pub name: String,
    #[serde(default)]
    pub aliases: Vec<String>,
}

/// A team, delegation or party.
#[derive(Debug, Clone, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct Group {
    pub id: Id,
    pub name: String,
    /// Short code (three capital letters for a delegation).
    #[serde(default)]
    pub code: Option<String>,
    #[serde(default)]
    pub aliases: Vec<String>,
    /// Whether the name takes a plural verb ("Moorland Progressives
    /// have", "the Civic Greens are").
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub plural: bool,
}

/// A person who competes.
#[derive(Debug, Clone, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct Competitor {
    pub id: Id,
    pub given: String,
    pub family: String,
    /// The group the person represents.
    pub group: Id,
    /// The sport the person competes in (its `noun` describes the person).
    pub sport: Id,
    /// "women" or "men" (or any category name the contests use), used for
    /// pronouns in replies and to pick the right event.
    #[serde(default)]
    pub category: Option<String>,
    #[serde(default)]
    pub aliases: Vec<String>,
}

impl Competitor {
    /// The full name as printed: given name, then family name.
    pub fn name(&self) -> String {
        format!("{} {}", self.given, self.family)
    }
}

/// How a contest is measured.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(rename_all = "snake_case")]
pub enum Measure {
    /// Elapsed time: `10.12`, `1:59.32`, `2:05:31`.
    Time,
    /// Metres: `8.21`.
    Distance,
    /// Points or goals: `87.5`, `3`.
    Points,
    /// Votes: whole numbers.
    Votes,
    /// A score between two sides, home and away, each a whole number in
    /// the scenario's `score_unit` (goals, runs, sets, frames).
    Score,
}

impl Measure {
    /// Whether a lower mark is better unless the contest says otherwise.
    pub fn default_better(self) -> Better {
        match self {
            Measure::Time => Better::Lower,
            _ => Better::Higher,
        }
    }
}

/// Which way marks are ranked.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(rename_all = "snake_case")]
pub enum Better {
    Lower,
    Higher,
}

/// Where a contest stands.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(rename_all = "snake_case")]
pub enum Status {
    Scheduled,
    Live,
    Final,
    /// Put off before it started; it may have a new date later.
    Postponed,
    /// Stopped and not finished; its result does not count.
    Abandoned,
    /// Stopped for now; it may resume.
    Suspended,
}

impl Status {
    /// The status as written in the data and in replies ("postponed").
    pub fn name(self) -> &'static str {
        match self {
            Status::Scheduled => "scheduled",
            Status::Live => "live",
            Status::Final => "final",
            Status::Postponed => "postponed",
            Status::Abandoned => "abandoned",
            Status::Suspended => "suspended",
        }
    }

    /// Whether the contest is off: put off, or stopped for good or for now.
    pub fn is_off(self) -> bool {
        matches!(
            self,
            Status::Postponed | Status::Abandoned | Status::Suspended
        )
    }
}

/// A single contest: one race, one match, one ward.
#[derive(Debug, Clone, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct Contest {
    pub id: Id,
    pub sport: Id,
    pub discipline: Id,
    /// "women", "men", "mixed", or absent when not split.
    #[serde(default)]
    pub category: Option<String>,
    /// "heat 1", "semifinal", "final"... Awards are given in the final.
    pub phase: String,
    /// The round of a season or tournament the contest belongs to
    /// ("matchday 5", "round of 16", "group A", "semi-final").
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub round: Option<String>,
    /// Local start time in the scenario's time zone (`2027-08-14T19:40`).
    pub start: String,
    pub status: Status,
    pub measure: Measure,
    /// Overrides the measure's default direction.
    #[serde(default)]
    pub better: Option<Better>,
    /// Where the contest takes place.
    #[serde(default)]
    pub venue: Option<String>,
    /// Extra names readers use for this contest.
    #[serde(default)]
    pub aliases: Vec<String>,
    /// When these results were last updated (RFC 3339), for live contests.
    #[serde(default)]
    pub updated: Option<String>,
    /// Share of the expected count that is in, from 0 to 1 (election night).
    #[serde(default)]
    pub counted: Option<f64>,
    #[serde(default)]
    pub entries: Vec<Entry>,
}

/// How an entry finished, when it did not simply finish.
#[derive(
    Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, Default, schemars::JsonSchema,
)]
#[serde(rename_all = "snake_case")]
pub enum EntryStatus {
    #[default]
    Ok,
    /// Did not finish.
    Dnf,
    /// Did not start.
    Dns,
    /// Disqualified.
    Dsq,
}

/// One competitor's (or group's) line in a contest.
#[derive(Debug, Clone, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(deny_unknown_fields)]
pub struct Entry {
    /// The person, for individual contests.
    #[serde(default)]
    pub competitor: Option<Id>,
    /// The group, for team contests (and for individuals, the group is taken
    /// from the competitor).
    #[serde(default)]
    pub group: Option<Id>,
    /// Team members, for team contests.
    #[serde(default)]
    pub members: Vec<Id>,
    /// Place by standard competition ranking (ties share a place: 1, 2, 2, 4).
    #[serde(default)]
    pub place: Option<u32>,
    /// The mark as written for the contest's measure.
    #[serde(default)]
    pub mark: Option<String>,
    #[serde(default)]
    pub status: EntryStatus,
    /// The award won, one of the scenario's awards.
    #[serde(default)]
    pub award: Option<String>,
    /// Which side of a two-sided contest (measure `score`) the entry is.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub side: Option<Side>,
}

/// The two sides of a contest measured by a score.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(rename_all = "snake_case")]
pub enum Side {
    Home,
    Away,
}
