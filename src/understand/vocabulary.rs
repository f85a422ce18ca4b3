//! A scenario's own words: the synonyms of its trade ("gap" and "majority"
//! for a margin on election night, "declared" for called), shorter words
//! for words of its event names ("fly" for butterfly), and topics readers
//! ask about that its data does not hold ("turnout"). Editors write them in
//! `vocabulary.yaml` in the intents folder; `tidings check` checks them.
//!
//! General English (contractions, number words, filler) is built in
//! ([`super::english`]); this file is for the beat.

use std::collections::{BTreeMap, HashMap};

use serde::Deserialize;
use serde_saphyr::Spanned;

use super::normalize::normalize;

/// The scenario vocabulary, read and normalised.
#[derive(Debug, Clone, Default)]
pub struct Vocabulary {
    /// A word or phrase readers use, and the words of the phrasings it
    /// stands for, as normalised tokens; longest first.
    pub same_as: Vec<(Vec<String>, Vec<String>)>,
    /// A word of event names and the shorter words readers use for it
    /// ("butterfly" → ["fly"]).
    pub in_event_names: HashMap<String, Vec<String>>,
    /// Topics the data does not hold: their words, and how a reply names
    /// them ("turnout figures").
    pub not_in_data: Vec<(Vec<String>, String)>,
    /// Words of the beat that narrow nothing and ask nothing by themselves
    /// ("pool", "swim", "runner"): a question using them is read as if
    /// they were not there, instead of as one with an unknown word in it.
    pub plain_words: Vec<String>,
}

/// The file as editors write it.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct VocabularyFile {
    /// The word the phrasings use → the words readers may use instead.
    #[serde(default)]
    pub same_as: BTreeMap<String, Spanned<Vec<Spanned<String>>>>,
    /// A word of event names → shorter words for it.
    #[serde(default)]
    pub in_event_names: BTreeMap<String, Spanned<Vec<Spanned<String>>>>,
    /// Words of a topic the data does not hold → how a reply names it.
    #[serde(default)]
    pub not_in_data: BTreeMap<String, Spanned<String>>,
    /// Words of the beat that narrow nothing.
    #[serde(default)]
    pub plain_words: Vec<Spanned<String>>,
}

/// The name of the file in an intents folder.
pub const VOCABULARY_FILE: &str = "vocabulary.yaml";

/// A problem with a place in the file: (line, column, message).
pub type Problem = (u64, u64, String);

impl Vocabulary {
    /// Reads the file's content, checking what can be checked without the
    /// phrasings: every entry has words, no reader's word stands for two
    /// things, nothing stands for itself.
    pub fn from_file(f: VocabularyFile) -> Result<Vocabulary, Vec<Problem>> {
        let mut problems = Vec::new();
        let mut v = Vocabulary::default();
        let mut seen: HashMap<Vec<String>, String> = HashMap::new();
        let words = |s: &str| -> Vec<String> {
            normalize(s)
                .split(' ')
                .filter(|w| !w.is_empty())
                .map(String::from)
                .collect()
        };
        for (target, list) in &f.same_as {
            let to = words(target);
            if to.is_empty() {
                problems.push((
                    list.referenced.line(),
                    list.referenced.column(),
                    format!("same_as: {target:?} has no words"),
                ));
                continue;
            }
            if list.value.is_empty() {
                problems.push((
                    list.referenced.line(),
                    list.referenced.column(),
                    format!("same_as: {target:?} lists no words readers use for it"),
                ));
            }
            for s in &list.value {
                let from = words(&s.value);
                let (line, column) = (s.referenced.line(), s.referenced.column());
                if from.is_empty() {
                    problems.push((line, column, "same_as: an empty word".into()));
                } else if from == to {
                    problems.push((
                        line,
                        column,
                        format!("same_as: {:?} stands for itself", s.value),
                    ));
                } else if let Some(other) = seen.insert(from.clone(), target.clone()) {
                    problems.push((
                        line,
                        column,
                        format!("same_as: {:?} already stands for {other:?}", s.value),
                    ));
                } else {
                    v.same_as.push((from, to.clone()));
                }
            }
        }
        v.same_as
            .sort_by(|a, b| b.0.len().cmp(&a.0.len()).then(a.0.cmp(&b.0)));
        for (word, list) in &f.in_event_names {
            let w = normalize(word);
            if w.is_empty() || w.contains(' ') {
                problems.push((
                    list.referenced.line(),
                    list.referenced.column(),
                    format!("in_event_names: {word:?} must be one word"),
                ));
                continue;
            }
            let mut short = Vec::new();
            for s in &list.value {
                let n = normalize(&s.value);
                if n.is_empty() || n == w {
                    problems.push((
                        s.referenced.line(),
                        s.referenced.column(),
                        format!(
                            "in_event_names: {:?} is not a shorter word for {word:?}",
                            s.value
                        ),
                    ));
                } else {
                    short.push(n);
                }
            }
            v.in_event_names.insert(w, short);
        }
        for (topic, what) in &f.not_in_data {
            let w = words(topic);
            if w.is_empty() || what.value.trim().is_empty() {
                problems.push((
                    what.referenced.line(),
                    what.referenced.column(),
                    format!("not_in_data: {topic:?} needs words and how a reply names it"),
                ));
                continue;
            }
            v.not_in_data.push((w, what.value.trim().to_string()));
        }
        for word in &f.plain_words {
            let w = normalize(&word.value);
            if w.is_empty() || w.contains(' ') {
                problems.push((
                    word.referenced.line(),
                    word.referenced.column(),
                    format!("plain_words: {:?} must be one word", word.value),
                ));
            } else if v.not_in_data.iter().any(|(t, _)| t.len() == 1 && t[0] == w) {
                problems.push((
                    word.referenced.line(),
                    word.referenced.column(),
                    format!(
                        "plain_words: {:?} is also a topic the data does not hold",
                        word.value
                    ),
                ));
            } else {
                v.plain_words.push(w);
            }
        }
        if problems.is_empty() {
            Ok(v)
        } else {
            Err(problems)
        }
    }

    /// Replaces the readers' words by the words they stand for, longest
    /// first, except where the word is itself one the phrasings use
    /// (`is_known`): a word an intent already reads is read as it is.
    pub fn rewrite(&self, tokens: Vec<String>, is_known: &dyn Fn(&str) -> bool) -> Vec<String> {
        if self.same_as.is_empty() {
            return tokens;
        }
        let mut out = Vec::with_capacity(tokens.len());
        let mut i = 0;
        'next: while i < tokens.len() {
            for (from, to) in &self.same_as {
                let n = from.len();
                if i + n <= tokens.len()
                    && tokens[i..i + n] == from[..]
                    && !(n == 1 && is_known(&from[0]))
                {
                    out.extend(to.iter().cloned());
                    i += n;
                    continue 'next;
                }
            }
            out.push(tokens[i].clone());
            i += 1;
        }
        out
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn vocab(yaml: &str) -> Result<Vocabulary, Vec<Problem>> {
        Vocabulary::from_file(serde_saphyr::from_str(yaml).unwrap())
    }

    #[test]
    fn synonyms_are_read_as_the_words_they_stand_for() {
        let v =
            vocab("same_as:\n  margin: [gap, winning margin]\n  leading: [in front]\n").unwrap();
        let t = |s: &str| s.split(' ').map(String::from).collect::<Vec<_>>();
        let known = |w: &str| w == "lead";
        assert_eq!(
            v.rewrite(t("what is the winning margin"), &known),
            t("what is the margin")
        );
        assert_eq!(v.rewrite(t("who is in front"), &known), t("who is leading"));
        assert_eq!(
            v.rewrite(t("how big is the gap"), &known),
            t("how big is the margin")
        );
    }

    #[test]
    fn a_word_already_read_by_phrasings_is_kept() {
        let v = vocab("same_as:\n  margin: [majority]\n").unwrap();
        let t = |s: &str| s.split(' ').map(String::from).collect::<Vec<_>>();
        assert_eq!(
            v.rewrite(t("is there a majority"), &|w| w == "majority"),
            t("is there a majority")
        );
    }

    #[test]
    fn mistakes_are_located() {
        let e = vocab("same_as:\n  margin: [gap]\n  lead: [gap]\n").unwrap_err();
        assert_eq!(e.len(), 1);
        // Entries are read in name order: "lead" first, so "margin"'s "gap" is the second.
        assert_eq!((e[0].0, e[0].1), (2, 12));
        assert!(e[0].2.contains("already stands for"), "{e:?}");
        let e = vocab("in_event_names:\n  individual medley: [im]\n").unwrap_err();
        assert!(e[0].2.contains("one word"));
        let e = vocab("not_in_data:\n  crowd: attendance\nplain_words: [pool, crowd, swim lane]\n")
            .unwrap_err();
        assert_eq!(e.len(), 2, "{e:?}");
        assert!(e[0].2.contains("also a topic"), "{e:?}");
        assert!(e[1].2.contains("one word"), "{e:?}");
    }
}
