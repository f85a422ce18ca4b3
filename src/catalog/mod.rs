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

/// Every intent of a scenario, plus the service-wide wording.
#[derive(Debug, Clone)]
pub struct Catalog {
    pub intents: Vec<Intent>,
    pub service: ServiceWording,
    /// Channel profiles: the built-in ones and the folder's own.
    pub channels: crate::answers::channel::Channels,
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
