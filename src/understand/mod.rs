//! Understanding: from a reader's text to what they asked.
//!
//! - [`normalize`]: one canonical form for text and names (Unicode NFKC,
//!   case and diacritics folded, number words and units);
//! - [`fuzzy`]: string similarity and the fuzzy name index;
//! - [`lexicon`]: names from the dataset, found exactly or fuzzily;
//! - [`when`]: days and counts;
//! - [`classify`]: intent scoring against example phrasings.
//!
//! [`Understanding`] ties them together for one dataset and catalog.

pub mod classify;
pub mod english;
pub mod frame;
pub mod fuzzy;
pub mod lexicon;
pub mod normalize;
pub mod slots;
pub mod vocabulary;
pub mod when;

use jiff::civil::Date;

use crate::answers::ops::EntityKind;
use crate::catalog::Catalog;
use crate::dataset::{Dataset, EntityRef};
use classify::{Classifier, Scored};
use lexicon::{Lexicon, Mention, Target};

/// Everything derived from one dataset and one catalog for reading messages.
#[derive(Debug)]
pub struct Understanding {
    pub lexicon: Lexicon,
    pub classifier: Classifier,
    /// The scenario's own words.
    pub vocabulary: vocabulary::Vocabulary,
}

/// What was read from one message.
#[derive(Debug, Clone)]
pub struct Analysis {
    pub normalized: String,
    /// The words read: normalised, contractions and number words expanded,
    /// the scenario's synonyms replaced, misspelt question words corrected.
    pub tokens: Vec<String>,
    /// What is asked and the limits set ([`frame`]).
    pub frame: frame::Frame,
    pub mentions: Vec<Mention>,
    pub days: Vec<when::DayMention>,
    pub count: Option<(usize, usize, u32)>,
    /// Tokens with names replaced by their kind, as the scorer sees them.
    pub abstracted: Vec<String>,
    /// Intents, best first.
    pub scores: Vec<Scored>,
}

/// The placeholder token for a slot kind in phrasings and messages.
pub fn placeholder(kind: EntityKind) -> &'static str {
    match kind {
        EntityKind::Competitor => "<competitor>",
        EntityKind::Group => "<group>",
        // A reader names a contest by its discipline, category and phase;
        // all of it reads as one event.
        EntityKind::Contest | EntityKind::Discipline => "<event>",
        EntityKind::Sport => "<sport>",
        EntityKind::Category => "<category>",
        EntityKind::Award => "<award>",
        EntityKind::Date => "<date>",
        EntityKind::Count => "<count>",
        EntityKind::Place => "<place>",
        EntityKind::Round => "<phase>",
    }
}

fn target_placeholder(t: &Target) -> &'static str {
    match t {
        Target::Entity(EntityRef::Competitor(_), _) => "<competitor>",
        Target::Entity(EntityRef::Group(_), _) => "<group>",
        Target::Entity(EntityRef::Sport(_), _) | Target::SportNoun(_) => "<sport>",
        Target::Entity(EntityRef::Discipline(..) | EntityRef::Contest(_), _) => "<event>",
        Target::Category(_) => "<category>",
        Target::Phase(_) => "<phase>",
        Target::Award(_) => "<award>",
    }
}

/// Normalises text and reads it as general English: contractions and chat
/// short forms expanded, number words as figures. Questions and phrasings
/// are read alike, so "who's" in one meets "who is" in the other.
pub fn read_words(text: &str) -> Vec<String> {
    let n = normalize::normalize(text);
    let toks = normalize::tokens(&n);
    english::numbers(english::expand(&toks))
}

/// Splits a phrasing into normalised words, with `{slot}` placeholders
/// replaced by the token of the slot's kind.
pub fn phrasing_tokens(
    phrasing: &str,
    kind_of: &dyn Fn(&str) -> Option<EntityKind>,
) -> Vec<String> {
    let mut out = Vec::new();
    let mut rest = phrasing;
    loop {
        let (lit, after) = match rest.find('{') {
            Some(i) => (&rest[..i], Some(&rest[i + 1..])),
            None => (rest, None),
        };
        out.extend(read_words(lit));
        let Some(after) = after else { break };
        let close = after.find('}').unwrap_or(after.len());
        let name = after[..close].trim();
        out.push(
            kind_of(name)
                .map(placeholder)
                .unwrap_or("<unknown>")
                .to_string(),
        );
        rest = after.get(close + 1..).unwrap_or("");
    }
    merge_events(out)
}

/// Folds runs such as `<category> <event> <phase>` into one `<event>`.
fn merge_events(tokens: Vec<String>) -> Vec<String> {
    let part = |t: &str| matches!(t, "<event>" | "<category>" | "<phase>" | "<sport>");
    let mut out: Vec<String> = Vec::with_capacity(tokens.len());
    let mut i = 0;
    while i < tokens.len() {
        if part(&tokens[i]) {
            let mut j = i;
            while j < tokens.len() && part(&tokens[j]) {
                j += 1;
            }
            let run = &tokens[i..j];
            if run.len() > 1 && run.iter().any(|t| t == "<event>" || t == "<sport>") {
                out.push("<event>".into());
            } else {
                out.extend(run.iter().cloned());
            }
            i = j;
        } else {
            out.push(tokens[i].clone());
            i += 1;
        }
    }
    out
}

/// A word that points back at someone or something ("she", "that race"),
/// scored as the kind of name it stands for: "when does she race next" is
/// asked like "when does <competitor> race next". Which one it means is the
/// dialogue's business. Returns the placeholder and how many tokens it spans.
fn pointer_at(toks: &[&str], i: usize) -> Option<(&'static str, usize)> {
    match toks[i] {
        "she" | "he" | "her" | "him" | "his" | "hers" => Some(("<competitor>", 1)),
        "it" => Some(("<event>", 1)),
        "that" | "this" => match toks.get(i + 1) {
            Some(&("race" | "event" | "final" | "contest" | "heat")) => Some(("<event>", 2)),
            _ => None,
        },
        _ => None,
    }
}

impl Understanding {
    /// Builds the lexicon and scorer for a dataset and catalog.
    pub fn build(data: &Dataset, catalog: &Catalog) -> Understanding {
        let mut names = Vec::new();
        let mut examples = Vec::new();
        let mut words = Vec::new();
        for (i, intent) in catalog.intents.iter().enumerate() {
            names.push(intent.name.clone());
            let kind_of = |s: &str| intent.slot(s).map(|d| d.kind);
            for p in &intent.phrasings {
                let toks = phrasing_tokens(p, &kind_of);
                words.extend(toks.iter().filter(|t| !t.starts_with('<')).cloned());
                examples.push((i, p.clone(), toks));
            }
        }
        let lexicon = Lexicon::build(data, words, &catalog.vocabulary);
        let accepts = catalog
            .intents
            .iter()
            .map(|i| {
                let mut v: Vec<&'static str> =
                    i.slots.iter().map(|s| placeholder(s.kind)).collect();
                // An event may be named through its sport, category or phase.
                if v.contains(&"<event>") {
                    v.extend(["<sport>", "<category>", "<phase>"]);
                }
                if v.contains(&"<sport>") {
                    v.push("<event>");
                }
                v
            })
            .collect();
        let classifier = Classifier::new(&names, &examples, accepts);
        Understanding {
            lexicon,
            classifier,
            vocabulary: catalog.vocabulary.clone(),
        }
    }

    /// Reads one message: normalise, read as English, replace the
    /// scenario's synonyms, spot names, correct misspelt words, find days
    /// and counts, read the frame, and score the intents.
    pub fn analyse(&self, text: &str, today: Date) -> Analysis {
        /// Above this score a phrasing explains the question well enough
        /// for an unknown word at its head to be only a cost in confidence.
        const ATTRIBUTE_MAX_SCORE: f32 = 0.6;
        let normalized = normalize::normalize(text);
        let words = english::numbers(english::expand(&normalize::tokens(&normalized)));
        let words = self
            .vocabulary
            .rewrite(words, &|w| self.lexicon.is_vocabulary(w));
        let read = words.join(" ");
        let toks: Vec<&str> = normalize::tokens(&read);
        let mentions = self.lexicon.spot(&read, &toks);
        // Misspelt question words ("tomorow", "tabel") are corrected once
        // names have had their chance: a name is never "corrected".
        let mut covered = vec![false; toks.len()];
        for m in &mentions {
            covered[m.start..m.end].iter_mut().for_each(|c| *c = true);
        }
        let toks: Vec<&str> = toks
            .iter()
            .enumerate()
            .map(|(i, t)| {
                // Words of general English and topics the data does not
                // hold are words already, not misspellings: "wind reading"
                // is not "wind leading".
                if covered[i]
                    || english::is_filler(t)
                    || english::is_dictionary_word(t)
                    || frame::is_unheld_word(t)
                    || self
                        .vocabulary
                        .not_in_data
                        .iter()
                        .any(|(w, _)| w.iter().any(|x| x == t))
                {
                    *t
                } else {
                    self.lexicon.correct(t).unwrap_or(t)
                }
            })
            .collect();
        let mut frame = frame::read(&toks, &mentions, &self.vocabulary.not_in_data);
        // A topic an intent's phrasings name is one the editors answer.
        if frame
            .unheld
            .as_ref()
            .is_some_and(|u| (u.start..u.end).all(|k| self.lexicon.is_phrasing_word(toks[k])))
        {
            frame.unheld = None;
            if frame.focus == Some(frame::Focus::Other) {
                frame.focus = None;
            }
        }
        let days = when::find_days(&toks, today, frame.past);
        let count = when::find_count(&toks);
        for d in &days {
            covered[d.start..d.end].iter_mut().for_each(|c| *c = true);
        }
        if let Some((s, e, _)) = count {
            covered[s..e].iter_mut().for_each(|c| *c = true);
        }
        for i in frame.explained() {
            if let Some(c) = covered.get_mut(i) {
                *c = true;
            }
        }
        // Content words nothing explains: not a name, a day, a count, a word
        // of the frame, of a phrasing or of general English, and not in a
        // chatty opening before the question starts.
        frame.unexplained = (frame.onset..toks.len())
            .filter(|&i| {
                let t = toks[i];
                !covered[i]
                    && t.len() > 1
                    && !t
                        .chars()
                        .all(|c| c.is_ascii_digit() || c == '.' || c == ':')
                    && !english::is_filler(t)
                    && !self.lexicon.explains(t)
                    && pointer_at(&toks, i).is_none()
            })
            .collect();
        let mut abstracted: Vec<String> = Vec::with_capacity(toks.len());
        // A chatty opening with no name in it is not part of the question
        // the intents are scored on.
        let mut i = if mentions.iter().any(|m| m.start < frame.onset) {
            0
        } else {
            frame.onset
        };
        while i < toks.len() {
            if let Some(m) = mentions.iter().find(|m| m.start == i) {
                abstracted.push(
                    m.candidates
                        .first()
                        .map(|c| target_placeholder(&c.0))
                        .unwrap_or("<unknown>")
                        .to_string(),
                );
                i = m.end;
            } else if let Some(d) = days.iter().find(|d| d.start == i) {
                abstracted.push("<date>".into());
                i = d.end;
            } else if let Some((_, e, _)) = count.filter(|c| c.0 == i) {
                abstracted.push("<count>".into());
                i = e;
            } else if let Some((_, e, _)) = frame.place.filter(|p| p.0 == i) {
                abstracted.push("<place>".into());
                i = e;
            } else if let Some((kind, len)) = pointer_at(&toks, i) {
                abstracted.push(kind.into());
                i += len;
            } else {
                abstracted.push(toks[i].to_string());
                i += 1;
            }
        }
        let abstracted = merge_events(abstracted);
        let scores = self.classifier.score(&abstracted);
        // An attribute nothing explains at the head of the question, when
        // neither its wording nor a phrasing says what it asks ("what
        // percentage is counted" is close to a phrasing about the count).
        if frame.unheld.is_none()
            && frame.focus.is_none()
            && scores.first().is_none_or(|b| b.score < ATTRIBUTE_MAX_SCORE)
        {
            if let Some(u) = frame::asked_attribute(&toks, frame.onset, &frame.unexplained) {
                frame.unheld = Some(u);
                frame.focus = Some(frame::Focus::Other);
            }
        }
        Analysis {
            tokens: toks.iter().map(|s| s.to_string()).collect(),
            frame,
            normalized,
            mentions,
            days,
            count,
            abstracted,
            scores,
        }
    }
}
