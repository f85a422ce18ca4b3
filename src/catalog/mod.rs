//! The catalog: the questions (intents) editors define in YAML, with their
//! example phrasings, slots, the operation each runs and its reply wording.
//!
//! Loading checks every intent against the operation it names, so a typo in
//! YAML stops start-up with `file:line:column` instead of surfacing as a
//! wrong answer later.

mod load;
pub mod template;

use std::collections::{BTreeMap, HashMap};

pub use load::{load_dir, load_texts, yaml_problem, CatalogError, CatalogProblem};
pub use template::Template;

use crate::answers::ops::{EntityKind, OpSpec};
pub use crate::understand::frame::Focus;

/// A limit of a question an intent declares it honours.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Honoured {
    /// A superlative word ("most", "best", "fastest"): the intent's answer
    /// is that extreme.
    Extreme(String),
    /// "not", "never", "without": the answer covers both ways.
    Negation,
}

impl Intent {
    /// Whether the intent answers questions with this focus.
    pub fn answers_focus(&self, f: Focus) -> bool {
        self.answers.contains(&f)
    }

    /// Whether the intent honours this superlative.
    pub fn honours_extreme(&self, word: &str) -> bool {
        self.honours
            .iter()
            .any(|h| matches!(h, Honoured::Extreme(w) if w == word))
    }

    /// Whether the intent honours a negation.
    pub fn honours_negation(&self) -> bool {
        self.honours.contains(&Honoured::Negation)
    }
}

/// Every intent of a scenario, plus the service-wide wording.
#[derive(Debug, Clone)]
pub struct Catalog {
    pub intents: Vec<Intent>,
    pub service: ServiceWording,
    /// Channel profiles: the built-in ones and the folder's own.
    pub channels: crate::answers::channel::Channels,
    /// The scenario's own words (`vocabulary.yaml`).
    pub vocabulary: crate::understand::vocabulary::Vocabulary,
}

impl Catalog {
    /// The intent with this name.
    pub fn intent(&self, name: &str) -> Option<&Intent> {
        self.intents.iter().find(|i| i.name == name)
    }

    /// One line per intent that has a summary, for help replies.
    pub fn topics(&self) -> Vec<String> {
        self.intents
            .iter()
            .filter_map(|i| i.summary.clone())
            .collect()
    }
}

/// One question editors defined.
#[derive(Debug, Clone)]
pub struct Intent {
    pub name: String,
    /// What the intent answers, listed by help replies.
    pub summary: Option<String>,
    pub operation: &'static OpSpec,
    /// What the intent answers: the focus of the questions it takes
    /// (`answers:`). A question asking for something else never gets this
    /// intent's answer.
    pub answers: Vec<Focus>,
    /// Limits of a question the intent honours beyond its slots
    /// (`honours:`): superlatives ("most", "best") and negation.
    pub honours: Vec<Honoured>,
    /// Example phrasings with `{slot}` placeholders.
    pub phrasings: Vec<String>,
    pub slots: Vec<SlotDef>,
    /// Wording per outcome of the operation.
    pub replies: HashMap<String, Template>,
    /// Wording for one channel (by channel name, then outcome) that
    /// replaces `replies` there; other channels derive theirs.
    pub channel_replies: HashMap<String, HashMap<String, Template>>,
    /// Operation settings (for example `rows: 5`).
    pub settings: BTreeMap<String, String>,
    /// Follow-up questions to offer after an answer, with slot placeholders.
    pub suggestions: Vec<Template>,
    /// Where the intent was defined, for messages.
    pub file: String,
}

impl Intent {
    /// The slot with this name.
    pub fn slot(&self, name: &str) -> Option<&SlotDef> {
        self.slots.iter().find(|s| s.name == name)
    }
}

/// One slot of an intent.
#[derive(Debug, Clone)]
pub struct SlotDef {
    pub name: String,
    pub kind: EntityKind,
    pub required: bool,
    /// The question asked when the slot is missing.
    pub ask: String,
}

/// Wording that belongs to no single intent (`service.yaml`).
#[derive(Debug, Clone)]
pub struct ServiceWording {
    /// When no intent fits: `{examples}` lists questions the service can answer.
    pub not_understood: Template,
    /// When a name fits several things: `{options}` lists them.
    pub choose: Template,
    /// After "start over".
    pub reset: Template,
    /// When the question asks about something the data does not hold:
    /// `{what}` names it ("athletes' heights").
    pub not_covered: Template,
    /// When the question sets a limit no intent can honour: `{limits}`
    /// names it ("swimming", "Friday 13 August").
    pub cannot_limit: Template,
    /// When no intent answers what the question asks for: `{what}` names
    /// it ("margins").
    pub cannot_answer: Template,
    /// Example questions offered when a message is not understood.
    pub examples: Vec<String>,
    /// Wording for one channel (by channel name, then key) over the above.
    pub by_channel: HashMap<String, HashMap<String, Template>>,
}

impl ServiceWording {
    /// The wording for `key` on `channel`: the channel's own, else the
    /// default.
    pub fn for_channel<'a>(
        &'a self,
        channel: &str,
        key: &str,
        default: &'a Template,
    ) -> &'a Template {
        self.by_channel
            .get(channel)
            .and_then(|m| m.get(key))
            .unwrap_or(default)
    }
}

impl Intent {
    /// The wording of an outcome on a channel: the channel's own, else the
    /// default.
    pub fn reply_for(&self, channel: &str, outcome: &str) -> Option<&Template> {
        self.channel_replies
            .get(channel)
            .and_then(|m| m.get(outcome))
            .or_else(|| self.replies.get(outcome))
    }
}
