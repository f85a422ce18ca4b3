//! Intent scoring: which question is this? Each intent's example phrasings
//! are compared with the message after names have been replaced by their
//! kind (`<competitor>`, `<event>`...), so "who won the women's long jump"
//! and "who won the men's 100 m" look alike to the scorer.
//!
//! The score is a cosine between weighted word sets (unigrams and bigrams),
//! each word weighted by how few intents use it. It is cheap, needs no
//! training step, and it can be explained: the reply can show the best
//! example and the words it shared.

use std::collections::HashMap;

use serde::{Deserialize, Serialize};

/// A word or placeholder id in the scorer's vocabulary.
type Tok = u32;

/// One example phrasing, ready for scoring.
#[derive(Debug)]
struct Example {
    intent: usize,
    text: String,
    /// Sorted feature ids with weights.
    features: Vec<(Tok, f32)>,
    norm: f32,
}

/// The scorer for one catalog.
#[derive(Debug)]
pub struct Classifier {
    vocab: HashMap<String, Tok>,
    words: Vec<String>,
    idf: Vec<f32>,
    examples: Vec<Example>,
    intents: Vec<String>,
    /// Placeholders each intent's slots can take, by intent index.
    accepts: Vec<Vec<&'static str>>,
}

/// One intent's score and why.
#[derive(Debug, Clone, Serialize, Deserialize, PartialEq)]
pub struct Scored {
    pub intent: String,
    pub score: f32,
    /// The example phrasing that matched best.
    pub example: String,
    /// Words and placeholders the message shared with it.
    pub shared: Vec<String>,
}

/// Below this score no intent is taken to be meant.
pub const MIN_SCORE: f32 = 0.45;
/// Asking for a missing detail needs more certainty than answering: a
/// question back to an off-topic message would only confuse.
pub const MIN_SCORE_TO_ASK: f32 = 0.55;

/// Weight of a word the catalog never uses: it still counts against the
/// match, so a long unrelated message scores low.
const UNKNOWN_WEIGHT: f32 = 2.0;
/// How much an intent loses for each kind of name in the message that none
/// of its slots can take ("can you tell me who won the 400 m" is not help).
const MISFIT_PENALTY: f32 = 0.2;
/// Kinds of name that count against an intent that cannot take them.
const NAMED_KINDS: [&str; 4] = ["<competitor>", "<group>", "<event>", "<sport>"];
/// How many of the best intents are explained with their shared words.
const EXPLAINED: usize = 3;
/// Bigrams carry word order at a lower weight than the words themselves.
const BIGRAM_FACTOR: f32 = 0.5;

impl Classifier {
    /// Builds the scorer from the intent names, the examples as `(intent
    /// index, phrasing, abstracted tokens)`, and per intent the placeholders
    /// its slots can take.
    pub fn new(
        intents: &[String],
        examples: &[(usize, String, Vec<String>)],
        accepts: Vec<Vec<&'static str>>,
    ) -> Classifier {
        let mut vocab: HashMap<String, Tok> = HashMap::new();
        let mut words = Vec::new();
        let mut df: Vec<Vec<usize>> = Vec::new();
        let mut ex_feats: Vec<Vec<Tok>> = Vec::new();
        for (intent, _, toks) in examples {
            let mut feats = Vec::new();
            for f in features(toks) {
                let id = *vocab.entry(f.clone()).or_insert_with(|| {
                    words.push(f.clone());
                    df.push(Vec::new());
                    (words.len() - 1) as Tok
                });
                if !df[id as usize].contains(intent) {
                    df[id as usize].push(*intent);
                }
                feats.push(id);
            }
            feats.sort_unstable();
            feats.dedup();
            ex_feats.push(feats);
        }
        let n = intents.len().max(1) as f32;
        let idf: Vec<f32> = df
            .iter()
            .enumerate()
            .map(|(i, d)| {
                let base = (1.0 + n / d.len() as f32).ln();
                if words[i].contains(' ') {
                    base * BIGRAM_FACTOR
                } else {
                    base
                }
            })
            .collect();
        let examples = examples
            .iter()
            .zip(ex_feats)
            .map(|((intent, text, _), feats)| {
                let features: Vec<(Tok, f32)> =
                    feats.iter().map(|&t| (t, idf[t as usize])).collect();
                let norm = features.iter().map(|(_, w)| w * w).sum::<f32>().sqrt();
                Example {
                    intent: *intent,
                    text: text.clone(),
                    features,
                    norm,
                }
            })
            .collect();
        Classifier {
            vocab,
            words,
            idf,
            examples,
            intents: intents.to_vec(),
            accepts,
        }
    }

    /// Scores every intent for the abstracted message tokens, best first.
    pub fn score(&self, tokens: &[String]) -> Vec<Scored> {
        let mut known: Vec<(Tok, f32)> = Vec::new();
        let mut unknown_mass = 0.0f32;
        for f in features(tokens) {
            match self.vocab.get(&f) {
                Some(&t) => known.push((t, self.idf[t as usize])),
                None => {
                    let w = if f.contains(' ') { 0.0 } else { UNKNOWN_WEIGHT };
                    unknown_mass += w * w;
                }
            }
        }
        known.sort_unstable_by_key(|k| k.0);
        known.dedup_by_key(|k| k.0);
        let msg_norm = (known.iter().map(|(_, w)| w * w).sum::<f32>() + unknown_mass).sqrt();
        let mut best: Vec<(f32, usize)> = vec![(0.0, usize::MAX); self.intents.len()];
        if msg_norm > 0.0 {
            for (ei, ex) in self.examples.iter().enumerate() {
                let dot = dot(&known, &ex.features);
                let s = if ex.norm > 0.0 {
                    dot / (msg_norm * ex.norm)
                } else {
                    0.0
                };
                if s > best[ex.intent].0 || best[ex.intent].1 == usize::MAX {
                    best[ex.intent] = (s, ei);
                }
            }
        }
        for (intent, (score, _)) in best.iter_mut().enumerate() {
            let accepts = self.accepts.get(intent).map(Vec::as_slice).unwrap_or(&[]);
            let misfits = NAMED_KINDS
                .iter()
                .filter(|p| tokens.iter().any(|t| t == *p) && !accepts.contains(p))
                .count();
            *score = (*score - MISFIT_PENALTY * misfits as f32).max(0.0);
        }
        let mut order: Vec<usize> = (0..best.len())
            .filter(|&i| best[i].1 != usize::MAX)
            .collect();
        order.sort_by(|&a, &b| {
            best[b]
                .0
                .partial_cmp(&best[a].0)
                .unwrap_or(std::cmp::Ordering::Equal)
                .then(self.intents[a].cmp(&self.intents[b]))
        });
        order
            .iter()
            .enumerate()
            .map(|(rank, &i)| {
                let (score, ei) = best[i];
                let ex = &self.examples[ei];
                // Only the best few are shown to clients; naming shared words
                // for every intent would cost allocations on every message.
                let shared = if rank < EXPLAINED {
                    ex.features
                        .iter()
                        .filter(|(t, _)| known.binary_search_by_key(t, |k| k.0).is_ok())
                        .map(|(t, _)| self.words[*t as usize].clone())
                        .filter(|w| !w.contains(' '))
                        .collect()
                } else {
                    Vec::new()
                };
                Scored {
                    intent: self.intents[i].clone(),
                    score,
                    example: ex.text.clone(),
                    shared,
                }
            })
            .collect()
    }
}

/// The Snowball (Porter2) English stemmer, so "leads", "leading" and
/// "lead" are one word to the scorer; placeholders stay as they are.
static STEMMER: std::sync::LazyLock<rust_stemmers::Stemmer> =
    std::sync::LazyLock::new(|| rust_stemmers::Stemmer::create(rust_stemmers::Algorithm::English));

/// A word's stem for scoring.
pub fn stem(word: &str) -> String {
    if word.starts_with('<') {
        word.to_string()
    } else {
        STEMMER.stem(word).into_owned()
    }
}

fn features(tokens: &[String]) -> Vec<String> {
    let tokens: Vec<String> = tokens.iter().map(|t| stem(t)).collect();
    let mut out: Vec<String> = tokens.clone();
    for w in tokens.windows(2) {
        out.push(format!("{} {}", w[0], w[1]));
    }
    out
}

fn dot(a: &[(Tok, f32)], b: &[(Tok, f32)]) -> f32 {
    let (mut i, mut j, mut s) = (0, 0, 0.0);
    while i < a.len() && j < b.len() {
        match a[i].0.cmp(&b[j].0) {
            std::cmp::Ordering::Less => i += 1,
            std::cmp::Ordering::Greater => j += 1,
            std::cmp::Ordering::Equal => {
                s += a[i].1 * b[j].1;
                i += 1;
                j += 1;
            }
        }
    }
    s
}

#[cfg(test)]
mod tests {
    use super::*;

    fn toks(s: &str) -> Vec<String> {
        s.split(' ').map(String::from).collect()
    }

    #[test]
    fn the_closest_phrasing_wins_and_explains_itself() {
        let intents = vec!["podium".to_string(), "schedule".to_string()];
        let ex = vec![
            (
                0,
                "who won the {contest}".to_string(),
                toks("who won the <event>"),
            ),
            (
                1,
                "when is the {contest}".to_string(),
                toks("when is the <event>"),
            ),
        ];
        let c = Classifier::new(&intents, &ex, vec![vec!["<event>"]; intents.len()]);
        let s = c.score(&toks("who won the <event>"));
        assert_eq!(s[0].intent, "podium");
        assert!((s[0].score - 1.0).abs() < 1e-5);
        assert!(s[0].shared.contains(&"won".to_string()));
        let s = c.score(&toks("when does the <event> start"));
        assert_eq!(s[0].intent, "schedule");
    }

    #[test]
    fn unrelated_text_scores_low() {
        let intents = vec!["podium".to_string()];
        let ex = vec![(
            0,
            "who won the {contest}".to_string(),
            toks("who won the <event>"),
        )];
        let c = Classifier::new(&intents, &ex, vec![vec!["<event>"]; intents.len()]);
        let s = c.score(&toks("bake me a lemon cake"));
        assert!(s[0].score < 0.2);
    }
}
