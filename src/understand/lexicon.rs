//! The lexicon: every name a reader may use for something in the dataset,
//! built from the data itself (no hand-written lists per name), and the
//! spotter that finds those names in a message.
//!
//! Exact names and aliases are found with one Aho–Corasick automaton over
//! normalised text, kept to whole words. Words left over are looked up in a
//! fuzzy index (trigrams and sound-alike keys, re-ranked by Jaro–Winkler), so
//! "Zoey Quilon" still finds "Zoë Quillon" without scanning every name.

use std::collections::{HashMap, HashSet};

use aho_corasick::{AhoCorasick, AhoCorasickBuilder, MatchKind};

use super::english;
use super::fuzzy::{self, FuzzyHit, FuzzyIndex};
use super::normalize::normalize;
use crate::dataset::{Dataset, EntityRef};

/// What a surface form points at.
#[derive(Debug, Clone, PartialEq, Eq, Hash)]
pub enum Target {
    /// A dataset entity, and how it was named.
    Entity(EntityRef, Form),
    /// A category such as "women".
    Category(String),
    /// A contest phase such as "final" or "heat 1".
    Phase(String),
    /// One of the scenario's awards.
    Award(String),
    /// "the rower": a sport named by what its competitors are called.
    SportNoun(usize),
}

/// How an entity was named: fuller names are more certain.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Form {
    Full,
    Alias,
    Family,
    Given,
}

impl Form {
    /// How sure a match of this form is, before any fuzziness.
    pub fn weight(self) -> f32 {
        match self {
            Form::Full | Form::Alias => 1.0,
            Form::Family => 0.9,
            Form::Given => 0.85,
        }
    }
}

/// A stretch of the message that names something.
#[derive(Debug, Clone, PartialEq)]
pub struct Mention {
    /// Token range `[start, end)` in the normalised message.
    pub start: usize,
    pub end: usize,
    /// What it may mean, best first, with a score in (0, 1].
    pub candidates: Vec<(Target, f32)>,
    /// Whether the words matched a name exactly.
    pub exact: bool,
}

impl Mention {
    /// The best score among the candidates.
    pub fn best(&self) -> f32 {
        self.candidates.first().map(|c| c.1).unwrap_or(0.0)
    }
}

/// The lexicon built for one dataset and one catalog.
#[derive(Debug)]
pub struct Lexicon {
    automaton: AhoCorasick,
    /// Targets per automaton pattern.
    targets: Vec<Vec<Target>>,
    fuzzy: FuzzyIndex,
    /// Targets per fuzzy term id.
    fuzzy_targets: Vec<Vec<Target>>,
    /// Word count per fuzzy term id.
    fuzzy_words: Vec<usize>,
    /// Words of the catalog's phrasings and other common words, which are
    /// never taken for a misspelt name.
    vocabulary: HashSet<String>,
    /// The stems of those words: "finish" is explained by a question
    /// that says "finished", "leaders" by one that says "leader".
    vocab_stems: HashSet<String>,
    /// The words of the catalog's phrasings alone.
    phrasing: HashSet<String>,
    /// Every surface form, sorted, for exact lookups of a single form
    /// (a possessive "galkaces" is "galkace"'s).
    surfaces: Vec<String>,
    /// The same words, for correcting misspelt question words.
    vocab_index: FuzzyIndex,
    vocab_words: Vec<String>,
    /// How fuzzy names begin and end, by word count: the first three
    /// letters of their first word and the last three of their last. Gluing a split name
    /// back, or growing a first name into a longer one, only looks up forms
    /// that start and end like some name, which speech recognition's splits and
    /// most misspellings keep ("dun varick" → "dunvarick", like
    /// "dunvarrick"), so most questions pay for no extra lookup at all.
    name_shapes: HashSet<(usize, String, String)>,
    /// How fuzzy names sound, by word count: the sound keys of their first
    /// and last words. Speech recognition keeps the consonants of a name it
    /// splits more often than its first letters ("done varick" for
    /// Dunvarrick, "ivan hall" for Ivenhall): a glued form that sounds like
    /// some name is looked up too.
    name_sounds: HashSet<(usize, u32, u32)>,
}

/// The shape of a name, as `Lexicon` keeps it in `name_shapes`: its number
/// of words, the first three letters of its first word and the last three
/// of its last word (all of a shorter word).
fn name_shape(name: &str) -> (usize, String, String) {
    let words: Vec<&str> = name.split(' ').collect();
    let first: String = words[0].chars().take(3).collect();
    let last = words[words.len() - 1];
    let skip = last.chars().count().saturating_sub(3);
    (words.len(), first, last.chars().skip(skip).collect())
}

/// The sound of a name, as `Lexicon` keeps it in `name_sounds`: its number
/// of words and the sound keys of its first and last words.
fn name_sound(name: &str) -> (usize, u32, u32) {
    let words: Vec<&str> = name.split(' ').collect();
    (
        words.len(),
        fuzzy::sound_key(words[0]),
        fuzzy::sound_key(words[words.len() - 1]),
    )
}

/// What a stretch of words may name, best first, with scores.
type Candidates = Vec<(Target, f32)>;

/// What a fuzzy match's score is multiplied by, so it ranks below an exact
/// match of the same name.
const FUZZY_DISCOUNT: f32 = 0.97;

/// Words too common to be a name on their own, whatever the data says.
const COMMON: &[&str] = &[
    "a",
    "an",
    "the",
    "and",
    "or",
    "of",
    "in",
    "on",
    "at",
    "to",
    "for",
    "by",
    "with",
    "from",
    "is",
    "was",
    "were",
    "are",
    "be",
    "did",
    "do",
    "does",
    "has",
    "have",
    "had",
    "who",
    "what",
    "when",
    "where",
    "which",
    "how",
    "many",
    "much",
    "i",
    "me",
    "my",
    "you",
    "your",
    "he",
    "she",
    "they",
    "him",
    "her",
    "them",
    "his",
    "their",
    "it",
    "its",
    "this",
    "that",
    "these",
    "those",
    "one",
    "ones",
    "so",
    "far",
    "yet",
    "now",
    "about",
    "tell",
    "show",
    "give",
    "please",
    "thanks",
    "thank",
    "hi",
    "hello",
    "hey",
    "ok",
    "okay",
    "yes",
    "no",
    "not",
    "still",
    "get",
    "got",
    "won",
    "win",
    "wins",
    "winner",
    "race",
    "event",
    "results",
    "result",
    "medal",
    "medals",
    "team",
    "time",
    "next",
    "last",
    "first",
    "second",
    "third",
    "up",
    "over",
    "out",
    "all",
    "any",
    "can",
    "will",
    "would",
    "could",
    "should",
    "there",
    "here",
    "then",
    "than",
    "just",
    "only",
    "also",
    "too",
    "very",
    "more",
    "most",
    "less",
    "did",
    "done",
    "go",
    "went",
    "going",
    "compete",
    "competing",
    "start",
    "starts",
    "leading",
    "leads",
    "lead",
    "leader",
    "best",
    "top",
    "table",
    "day",
    "days",
    "today",
    "tomorrow",
    "yesterday",
    "tonight",
    "morning",
    "evening",
    "afternoon",
    "place",
];

impl Lexicon {
    /// Builds the lexicon from the data and the phrasing vocabulary.
    pub fn build(
        data: &Dataset,
        phrasing_words: impl IntoIterator<Item = String>,
        vocab: &crate::understand::vocabulary::Vocabulary,
    ) -> Lexicon {
        let phrasing: HashSet<String> = phrasing_words.into_iter().collect();
        let mut vocabulary: HashSet<String> = COMMON.iter().map(|s| s.to_string()).collect();
        vocabulary.extend(phrasing.iter().cloned());
        vocabulary.extend(vocab.plain_words.iter().cloned());

        let mut forms: HashMap<String, Vec<Target>> = HashMap::new();
        let mut add = |surface: &str, t: Target| {
            let n = normalize(surface);
            if n.is_empty() {
                return;
            }
            let v = forms.entry(n).or_default();
            if !v.contains(&t) {
                v.push(t);
            }
        };
        for (i, c) in data.competitors.iter().enumerate() {
            let e = EntityRef::Competitor(i);
            add(&c.name(), Target::Entity(e, Form::Full));
            add(
                &format!("{} {}", c.family, c.given),
                Target::Entity(e, Form::Full),
            );
            for a in &c.aliases {
                add(a, Target::Entity(e, Form::Alias));
            }
            add(&c.family, Target::Entity(e, Form::Family));
            add(&c.given, Target::Entity(e, Form::Given));
        }
        for (i, g) in data.groups.iter().enumerate() {
            let e = EntityRef::Group(i);
            add(&g.name, Target::Entity(e, Form::Full));
            if let Some(code) = &g.code {
                add(code, Target::Entity(e, Form::Alias));
            }
            for a in &g.aliases {
                add(a, Target::Entity(e, Form::Alias));
            }
        }
        for (si, s) in data.sports.iter().enumerate() {
            let e = EntityRef::Sport(si);
            add(&s.name, Target::Entity(e, Form::Full));
            for a in &s.aliases {
                add(a, Target::Entity(e, Form::Alias));
            }
            add(&s.noun, Target::SportNoun(si));
            add(
                &crate::answers::words::plural(&s.noun),
                Target::SportNoun(si),
            );
            for (di, d) in s.disciplines.iter().enumerate() {
                let e = EntityRef::Discipline(si, di);
                add(&d.name, Target::Entity(e, Form::Full));
                for a in &d.aliases {
                    add(a, Target::Entity(e, Form::Alias));
                }
                for v in short_forms(&normalize(&d.name)) {
                    add(&v, Target::Entity(e, Form::Alias));
                }
                // The scenario's shorter words for words of event names:
                // "100 m butterfly" is also "100 m fly" and "100 fly".
                for name in std::iter::once(&d.name).chain(&d.aliases) {
                    for v in shortened(&normalize(name), &vocab.in_event_names) {
                        for w in short_forms(&v) {
                            add(&w, Target::Entity(e, Form::Alias));
                        }
                        add(&v, Target::Entity(e, Form::Alias));
                    }
                }
            }
        }
        for (ci, c) in data.contests.iter().enumerate() {
            for a in &c.aliases {
                add(a, Target::Entity(EntityRef::Contest(ci), Form::Alias));
            }
            // A match is named by its two sides ("Ambervale v Kestrel Bay").
            for n in data.match_names(ci) {
                add(&n, Target::Entity(EntityRef::Contest(ci), Form::Full));
            }
            add(&c.phase, Target::Phase(c.phase.clone()));
            // A round of a season or tournament ("matchday 5") is asked
            // about like a phase.
            if let Some(r) = &c.round {
                add(r, Target::Phase(r.clone()));
            }
            if let Some(cat) = &c.category {
                add(cat, Target::Category(cat.clone()));
                for syn in category_synonyms(cat) {
                    add(syn, Target::Category(cat.clone()));
                }
            }
        }
        add("heats", Target::Phase("heat".into()));
        add("heat", Target::Phase("heat".into()));
        add("semis", Target::Phase("semifinal".into()));
        add("semi final", Target::Phase("semifinal".into()));
        // With one award only ("seat"), naming it narrows nothing: the word
        // stays a word of the question, as phrasings use it.
        let awards = if data.awards().len() > 1 {
            data.awards()
        } else {
            &[]
        };
        for a in awards {
            add(a, Target::Award(a.clone()));
            add(&crate::answers::words::plural(a), Target::Award(a.clone()));
            add(&format!("{a} medal"), Target::Award(a.clone()));
            add(&format!("{a} medals"), Target::Award(a.clone()));
        }

        // A first or family name that is also an everyday word of the
        // catalog would turn questions into name lookups: keep only full
        // names for those.
        for (surface, ts) in forms.iter_mut() {
            if vocabulary.contains(surface) {
                ts.retain(|t| !matches!(t, Target::Entity(_, Form::Given | Form::Family)));
            }
        }
        forms.retain(|_, ts| !ts.is_empty());

        let mut surfaces: Vec<String> = forms.keys().cloned().collect();
        surfaces.sort();
        let targets: Vec<Vec<Target>> = surfaces.iter().map(|s| forms[s].clone()).collect();
        let automaton = AhoCorasickBuilder::new()
            .match_kind(MatchKind::Standard)
            .build(&surfaces)
            .expect("the lexicon's patterns are plain strings of bounded size");

        // Fuzzy terms: names of people, groups, sports and disciplines. Not
        // codes or categories: those are short and better matched exactly.
        let mut fuzzy_terms = Vec::new();
        let mut fuzzy_targets: Vec<Vec<Target>> = Vec::new();
        let mut fuzzy_words = Vec::new();
        let mut name_shapes = HashSet::new();
        let mut name_sounds = HashSet::new();
        for (surface, ts) in surfaces.iter().zip(&targets) {
            // Rounds and categories only when long enough that a close
            // spelling is not another word ("finall", "womans").
            let keep: Vec<Target> = ts
                .iter()
                .filter(|t| match t {
                    Target::Entity(..) | Target::SportNoun(_) | Target::Award(_) => true,
                    Target::Phase(_) | Target::Category(_) => surface.len() >= 5,
                })
                .cloned()
                .collect();
            if keep.is_empty() || surface.len() < 3 {
                continue;
            }
            fuzzy_terms.push((surface.clone(), fuzzy_targets.len() as u32));
            fuzzy_targets.push(keep);
            fuzzy_words.push(surface.split(' ').count());
            name_shapes.insert(name_shape(surface));
            name_sounds.insert(name_sound(surface));
        }
        let fuzzy = FuzzyIndex::new(fuzzy_terms);
        let mut vocab_words: Vec<String> = vocabulary
            .iter()
            .filter(|w| w.len() >= 4)
            .cloned()
            .collect();
        vocab_words.sort();
        let vocab_index = FuzzyIndex::new(
            vocab_words
                .iter()
                .enumerate()
                .map(|(i, w)| (w.clone(), i as u32)),
        );
        Lexicon {
            automaton,
            targets,
            phrasing,
            surfaces,
            fuzzy,
            fuzzy_targets,
            fuzzy_words,
            vocab_stems: vocabulary
                .iter()
                .map(|w| super::classify::stem(w))
                .collect(),
            vocabulary,
            vocab_index,
            vocab_words,
            name_shapes,
            name_sounds,
        }
    }

    /// Whether a word is an ordinary word of the catalog's questions.
    pub fn is_vocabulary(&self, word: &str) -> bool {
        self.vocabulary.contains(word)
    }

    /// Whether a word is an ordinary word of the catalog's questions or
    /// another form of one ("finish" for "finished", "times" for "time").
    pub fn explains(&self, word: &str) -> bool {
        self.vocabulary.contains(word) || self.vocab_stems.contains(&super::classify::stem(word))
    }

    /// Whether a word is used by some intent's phrasings.
    pub fn is_phrasing_word(&self, word: &str) -> bool {
        self.phrasing.contains(word)
    }

    /// The question word a misspelt word most likely is ("tomorow" →
    /// "tomorrow"), if one is close enough.
    pub fn correct(&self, word: &str) -> Option<&str> {
        if word.len() < 4 || self.vocabulary.contains(word) {
            return None;
        }
        if let Some(hit) = self.vocab_index.lookup(word, 0.88, 1).into_iter().next() {
            return self.vocab_words.get(hit.id as usize).map(String::as_str);
        }
        // A short word typed with one letter doubled ("wonn", "whoo") is
        // too short for the similarity index: undouble it and look it up.
        let b = word.as_bytes();
        (1..b.len())
            .filter(|&i| b[i] == b[i - 1] && word.is_char_boundary(i))
            .find_map(|i| {
                let w = format!("{}{}", &word[..i], &word[i + 1..]);
                self.vocabulary.get(&w).map(String::as_str)
            })
    }

    /// Finds names in normalised text split into tokens.
    pub fn spot(&self, text: &str, tokens: &[&str]) -> Vec<Mention> {
        // Byte offset of each token start and end, to map matches to tokens.
        let mut starts = Vec::with_capacity(tokens.len());
        let mut ends = Vec::with_capacity(tokens.len());
        let mut pos = 0;
        for t in tokens {
            let at = text[pos..].find(t).map(|o| pos + o).unwrap_or(pos);
            starts.push(at);
            ends.push(at + t.len());
            pos = at + t.len();
        }
        // Every whole-word match, then leftmost-longest among them: filtering
        // before choosing keeps a longer non-word match ("100 m free" inside
        // "100 m freestyle") from hiding a shorter whole-word one.
        let mut found: Vec<(usize, usize, usize)> = Vec::new();
        for m in self.automaton.find_overlapping_iter(text) {
            let (Some(s), Some(e)) = (
                starts.iter().position(|&b| b == m.start()),
                ends.iter().position(|&b| b == m.end()),
            ) else {
                continue;
            };
            found.push((s, e + 1, m.pattern().as_usize()));
        }
        found.sort_by(|a, b| a.0.cmp(&b.0).then((b.1 - b.0).cmp(&(a.1 - a.0))));
        let mut mentions = Vec::new();
        let mut covered = vec![false; tokens.len()];
        for (s, e, p) in found {
            if covered[s..e].iter().any(|&c| c) {
                continue;
            }
            covered[s..e].iter_mut().for_each(|c| *c = true);
            let mut candidates: Vec<(Target, f32)> = self.targets[p]
                .iter()
                .map(|t| {
                    let w = match t {
                        Target::Entity(_, f) => f.weight(),
                        _ => 1.0,
                    };
                    (t.clone(), w)
                })
                .collect();
            sort_candidates(&mut candidates);
            mentions.push(Mention {
                start: s,
                end: e,
                candidates,
                exact: true,
            });
        }
        self.spot_possessive(tokens, &mut covered, &mut mentions);
        self.extend_events(tokens, &mut covered, &mut mentions);
        self.extend_first_names(tokens, &mut covered, &mut mentions);
        self.spot_glued(tokens, &mut covered, &mut mentions);
        self.spot_fuzzy(tokens, &mut covered, &mut mentions);
        mentions.sort_by_key(|m| m.start);
        mentions
    }

    /// A name written possessive, which loses its apostrophe in the
    /// normal form: "galkaces time", "zoe quillons result". The form
    /// without the final "s" must be a name exactly, and the word with it
    /// must not be one.
    fn spot_possessive(&self, tokens: &[&str], covered: &mut [bool], mentions: &mut Vec<Mention>) {
        for i in 0..tokens.len() {
            let t = tokens[i];
            if covered[i] || t.len() < 4 || !t.ends_with('s') || self.vocabulary.contains(t) {
                continue;
            }
            let stem = &t[..t.len() - 1];
            // A full name: the words before, with the stem last.
            for width in [3usize, 2, 1] {
                if width > i + 1 || (i + 1 - width..i).any(|k| covered[k]) {
                    continue;
                }
                let mut words: Vec<&str> = tokens[i + 1 - width..i].to_vec();
                words.push(stem);
                let query = words.join(" ");
                let Ok(p) = self.surfaces.binary_search(&query) else {
                    continue;
                };
                let mut candidates: Vec<(Target, f32)> = self.targets[p]
                    .iter()
                    .map(|t| {
                        let w = match t {
                            Target::Entity(_, f) => f.weight(),
                            _ => 1.0,
                        };
                        (t.clone(), w)
                    })
                    .collect();
                sort_candidates(&mut candidates);
                covered[i + 1 - width..=i]
                    .iter_mut()
                    .for_each(|c| *c = true);
                mentions.push(Mention {
                    start: i + 1 - width,
                    end: i + 1,
                    candidates,
                    exact: true,
                });
                break;
            }
        }
    }

    /// Event names are often half right: "200 m frestyle" matches "200 m"
    /// exactly and leaves a misspelt word; "women's hi jump" has a category
    /// and then words that are everyday words on their own. Both are tried
    /// against discipline names as a whole before anything else.
    fn extend_events(&self, tokens: &[&str], covered: &mut [bool], mentions: &mut Vec<Mention>) {
        let mut events = Vec::new();
        let is_discipline = |t: &Target| matches!(t, Target::Entity(EntityRef::Discipline(..), _));
        for m in mentions.iter_mut() {
            let Some((top, _)) = m.candidates.first() else {
                continue;
            };
            let after_category = matches!(top, Target::Category(_));
            let extend_discipline = is_discipline(top);
            if !after_category && !extend_discipline {
                continue;
            }
            // The width whose best discipline scores highest wins, so
            // "individual time trail" is not cut short at "individual time".
            let mut best: Option<(usize, Vec<(Target, f32)>)> = None;
            for width in [3usize, 2, 1] {
                let end = m.end + width;
                if end > tokens.len() || covered[m.end..end].iter().any(|&c| c) {
                    continue;
                }
                if extend_discipline && self.vocabulary.contains(tokens[end - 1]) {
                    continue;
                }
                let from = if extend_discipline { m.start } else { m.end };
                let query = tokens[from..end].join(" ");
                let hits = self.fuzzy.lookup(&query, 0.86, 4);
                let mut found = self.fuzzy_candidates(&hits);
                found.retain(|(t, _)| is_discipline(t));
                if found.is_empty() {
                    continue;
                }
                if best.as_ref().is_none_or(|(_, b)| found[0].1 > b[0].1) {
                    best = Some((end, found));
                }
            }
            let Some((end, found)) = best else { continue };
            covered[m.end..end].iter_mut().for_each(|c| *c = true);
            if extend_discipline {
                m.end = end;
                m.candidates = found;
                m.exact = false;
            } else {
                // Keep the category; the words after it become the event.
                events.push(Mention {
                    start: m.end,
                    end,
                    candidates: found,
                    exact: false,
                });
            }
        }
        mentions.extend(events);
    }

    /// A lone first or family name next to a word that, with it, spells a
    /// longer name closely is that longer name: "Fenwick Green" is the ward
    /// Fennick Green misspelt, not the candidate Fenwick plus a word, and
    /// "Zoe Quilon" is Zoë Quillon rather than any Zoë. Only a close match
    /// (0.9) of exactly as many words takes the place of the exact one.
    fn extend_first_names(&self, tokens: &[&str], covered: &mut [bool], mentions: &mut [Mention]) {
        const MIN: f64 = 0.9;
        for m in mentions.iter_mut() {
            let lone_name = m.exact
                && m.end - m.start == 1
                && !m.candidates.is_empty()
                && m.candidates
                    .iter()
                    .all(|(t, _)| matches!(t, Target::Entity(_, Form::Given | Form::Family)));
            if !lone_name {
                continue;
            }
            // The best window so far: its token range and its candidates.
            let mut best: Option<(std::ops::Range<usize>, Candidates)> = None;
            let windows = [(m.start, m.end + 1), (m.start.saturating_sub(1), m.end)];
            for (from, to) in windows {
                if to > tokens.len() || to - from != 2 {
                    continue;
                }
                let other = if from < m.start { from } else { to - 1 };
                if covered[other] || tokens[other].len() < 3 {
                    continue;
                }
                let query = tokens[from..to].join(" ");
                if !self.name_shapes.contains(&name_shape(&query)) {
                    continue;
                }
                let hits: Vec<_> = self
                    .fuzzy
                    .lookup(&query, MIN, 4)
                    .into_iter()
                    .filter(|h| self.fuzzy_term_words(h.id) == 2)
                    .collect();
                if hits.is_empty() {
                    continue;
                }
                let found = self.fuzzy_candidates(&hits);
                if best.as_ref().is_none_or(|(_, b)| found[0].1 > b[0].1) {
                    best = Some((from..to, found));
                }
            }
            if let Some((range, found)) = best {
                covered[range.clone()].iter_mut().for_each(|c| *c = true);
                m.start = range.start;
                m.end = range.end;
                m.candidates = found;
                m.exact = false;
            }
        }
    }

    /// Names that speech recognition split into pieces: "dun varick" is Dunvarrick,
    /// "wren low sands" is Wrenlow Sands. Neighbouring uncovered words are
    /// glued in every way and looked up against names of as many words;
    /// only a close match (0.9) counts, so two everyday words never turn
    /// into a name.
    fn spot_glued(&self, tokens: &[&str], covered: &mut [bool], mentions: &mut Vec<Mention>) {
        const MIN: f64 = 0.9;
        // A short code matched exactly ("lan", the Lantern Party's) may be
        // the first piece of a split name ("lan mouth", Lanmouth): such a
        // word may still be glued, and the glued name then wins.
        let short_code: Vec<bool> = (0..tokens.len())
            .map(|i| {
                tokens[i].len() <= 3
                    && mentions
                        .iter()
                        .any(|m| m.exact && m.start == i && m.end == i + 1)
            })
            .collect();
        let usable = |covered: &[bool], i: usize| {
            (!covered[i] || short_code[i])
                && tokens[i].len() >= 2
                && !tokens[i].chars().all(|c| c.is_ascii_digit())
        };
        for width in [3usize, 2] {
            if tokens.len() < width {
                continue;
            }
            let mut i = 0;
            while i + width <= tokens.len() {
                let window = &tokens[i..i + width];
                // All pieces but one at most must be words the questions do
                // not use: "who won" never becomes "whowon", and "kal ven
                // mark" is still tried. A pair may hold one such word when
                // the other is a long unknown one: speech recognition hears
                // a name's first syllable as a word ("done varick"); the
                // glued form must then still start and end, or sound, like
                // a name.
                let unknown = window
                    .iter()
                    .filter(|t| !self.vocabulary.contains(**t))
                    .count();
                let long_unknown = window
                    .iter()
                    .any(|t| t.len() >= 5 && !self.vocabulary.contains(*t));
                let needed = match width {
                    2 if long_unknown => 1,
                    2 => 2,
                    _ => width - 1,
                };
                let ok = (i..i + width).all(|k| usable(covered, k)) && unknown >= needed;
                if !ok {
                    i += 1;
                    continue;
                }
                let mut best: Option<Vec<(Target, f32)>> = None;
                // Each gap between pieces is glued or kept; at least one is
                // glued (all kept is the ordinary fuzzy lookup).
                for mask in 1u32..(1 << (width - 1)) {
                    let mut query = window[0].to_string();
                    for (g, piece) in window[1..].iter().enumerate() {
                        if mask & (1 << g) == 0 {
                            query.push(' ');
                        }
                        query.push_str(piece);
                    }
                    let words = query.split(' ').count();
                    if query.len() < 6
                        || !(self.name_shapes.contains(&name_shape(&query))
                            || self.name_sounds.contains(&name_sound(&query)))
                    {
                        continue;
                    }
                    let hits: Vec<_> = self
                        .fuzzy
                        .lookup(&query, MIN, 4)
                        .into_iter()
                        .filter(|h| self.fuzzy_term_words(h.id) == words)
                        .collect();
                    if hits.is_empty() {
                        continue;
                    }
                    let found = self.fuzzy_candidates(&hits);
                    if best.as_ref().is_none_or(|b| found[0].1 > b[0].1) {
                        best = Some(found);
                    }
                }
                let Some(candidates) = best else {
                    i += 1;
                    continue;
                };
                covered[i..i + width].iter_mut().for_each(|c| *c = true);
                mentions.retain(|m| m.end <= i || m.start >= i + width);
                mentions.push(Mention {
                    start: i,
                    end: i + width,
                    candidates,
                    exact: false,
                });
                i += width;
            }
        }
    }

    /// Looks up uncovered, unfamiliar words: pairs first (a full name), then
    /// single words.
    fn spot_fuzzy(&self, tokens: &[&str], covered: &mut [bool], mentions: &mut Vec<Mention>) {
        let unfamiliar = |covered: &[bool], i: usize| {
            !covered[i]
                && tokens[i].len() >= 3
                && !self.vocabulary.contains(tokens[i])
                && !tokens[i].chars().all(|c| c.is_ascii_digit())
        };
        for width in [3usize, 2, 1] {
            if tokens.len() < width {
                continue;
            }
            let mut i = 0;
            while i + width <= tokens.len() {
                // A window may include one familiar word only when it is a
                // multi-word window anchored by unfamiliar words at both ends.
                let ok = (i..i + width).all(|k| !covered[k])
                    && unfamiliar(covered, i)
                    && unfamiliar(covered, i + width - 1)
                    && (width < 3
                        || (i..i + width).filter(|&k| unfamiliar(covered, k)).count() >= 2);
                if !ok {
                    i += 1;
                    continue;
                }
                // One everyday word alone is the reader's word, not a
                // misspelt name of a person, group, sport or contest ("how
                // many world records" is not about Worel Windoss, "how many
                // athletes" not about athletics); it may still be a
                // misspelt word of the trade ("sliver" for silver).
                let everyday = width == 1
                    && (english::is_dictionary_word(tokens[i]) || english::is_filler(tokens[i]));
                let query = tokens[i..i + width].join(" ");
                let min = if width == 1 { 0.88 } else { 0.84 };
                let hits = self.fuzzy.lookup(&query, min, 8);
                // A single word must look like a single-word name, and a pair
                // like a pair; otherwise "long jupm" would match a person.
                let hits: Vec<_> = hits
                    .into_iter()
                    .filter(|h| self.fuzzy_term_words(h.id) == width)
                    .collect();
                if hits.is_empty() {
                    i += 1;
                    continue;
                }
                let mut candidates = self.fuzzy_candidates(&hits);
                if everyday {
                    candidates.retain(|(t, _)| !matches!(t, Target::Entity(..)));
                    if candidates.is_empty() {
                        i += 1;
                        continue;
                    }
                }
                covered[i..i + width].iter_mut().for_each(|c| *c = true);
                mentions.push(Mention {
                    start: i,
                    end: i + width,
                    candidates,
                    exact: false,
                });
                i += width;
            }
        }
    }

    /// The targets of fuzzy hits, best first. A fuzzy match is never as
    /// certain as an exact one; how close the spelling is decides between
    /// kinds (a family name against a discipline, say).
    fn fuzzy_candidates(&self, hits: &[FuzzyHit]) -> Vec<(Target, f32)> {
        let mut out: Vec<(Target, f32)> = hits
            .iter()
            .flat_map(|h| {
                self.fuzzy_targets[h.id as usize]
                    .iter()
                    .map(move |t| (t.clone(), h.score as f32 * FUZZY_DISCOUNT))
            })
            .collect();
        sort_candidates(&mut out);
        out
    }

    fn fuzzy_term_words(&self, id: u32) -> usize {
        self.fuzzy_words.get(id as usize).copied().unwrap_or(0)
    }
}

/// Shorter ways readers name a distance event: "100 m freestyle" is also
/// "100 freestyle" and "freestyle"; "1500 m" is also "1500". Forms shared by
/// several disciplines stay ambiguous and are asked about.
fn short_forms(name: &str) -> Vec<String> {
    let words: Vec<&str> = name.split(' ').collect();
    let mut out = Vec::new();
    if words.len() >= 2
        && words[0].chars().all(|c| c.is_ascii_digit())
        && (words[1] == "m" || words[1] == "km")
    {
        let rest = words[2..].join(" ");
        if rest.is_empty() {
            out.push(words[0].to_string());
        } else {
            out.push(format!("{} {rest}", words[0]));
            if rest.len() >= 5 {
                out.push(rest);
            }
        }
    }
    out
}

/// An event name with each of its words that has shorter forms replaced
/// by them, one word at a time ("100 m butterfly" → "100 m fly").
fn shortened(name: &str, short: &HashMap<String, Vec<String>>) -> Vec<String> {
    if short.is_empty() {
        return Vec::new();
    }
    let words: Vec<&str> = name.split(' ').collect();
    let mut out = Vec::new();
    for (i, w) in words.iter().enumerate() {
        if let Some(forms) = short.get(*w) {
            for f in forms {
                let mut v: Vec<&str> = words.clone();
                v[i] = f;
                out.push(v.join(" "));
            }
        }
    }
    out
}

/// Words readers use for the usual categories.
fn category_synonyms(cat: &str) -> &'static [&'static str] {
    match cat {
        "women" => &["womens", "woman", "womans", "ladies", "female"],
        "men" => &["mens", "man", "mans", "male"],
        _ => &[],
    }
}

/// Best first; equal scores keep a stable order; one target once.
fn sort_candidates(c: &mut Vec<(Target, f32)>) {
    c.sort_by(|a, b| b.1.partial_cmp(&a.1).unwrap_or(std::cmp::Ordering::Equal));
    let mut seen = HashSet::new();
    c.retain(|(t, _)| seen.insert(t.clone()));
}

#[cfg(test)]
mod tests {
    use super::*;

    fn election() -> Dataset {
        let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/election");
        crate::dataset::load_dir(&dir).unwrap()
    }

    /// The names found in a message: (first token, end token, best target).
    fn spotted(lex: &Lexicon, data: &Dataset, text: &str) -> Vec<(usize, usize, String)> {
        let n = normalize(text);
        let tokens: Vec<&str> = n.split(' ').collect();
        lex.spot(&n, &tokens)
            .into_iter()
            .map(|m| {
                let name = match &m.candidates[0].0 {
                    Target::Entity(e, _) => data.entity_id(*e),
                    other => format!("{other:?}"),
                };
                (m.start, m.end, name)
            })
            .collect()
    }

    #[test]
    fn an_everyday_word_alone_is_not_a_misspelt_name() {
        let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("dataset-demo/games");
        let d = crate::dataset::load_dir(&dir).unwrap();
        let lex = Lexicon::build(
            &d,
            ["how", "many", "who", "got", "in", "the"].map(String::from),
            &Default::default(),
        );
        // "world" is close to Worel (Windoss), "mate" to Mårten: both are
        // the reader's own words.
        assert_eq!(spotted(&lex, &d, "how many world records"), vec![]);
        assert_eq!(spotted(&lex, &d, "cheers mate"), vec![]);
        // "athletes" is close to athletics, but a reader counting athletes
        // is not asking about the sport: it is read as the sport's people
        // (its noun), never fuzzily as the sport itself.
        let got = spotted(&lex, &d, "how many athletes");
        assert!(got.iter().all(|h| h.2.starts_with("SportNoun")), "{got:?}");
        // A misspelling that is not a word is still a name ...
        assert_eq!(
            spotted(&lex, &d, "how many worell windoss"),
            vec![(
                2,
                4,
                d.entity_id(EntityRef::Competitor(d.competitor("p237").unwrap()))
            )]
        );
        // ... and an everyday word may still be a misspelt word of the
        // trade: "sliver" is silver.
        let got = spotted(&lex, &d, "who got sliver");
        assert_eq!(got.len(), 1, "{got:?}");
        assert!(got[0].2.contains("silver"), "{got:?}");
    }

    #[test]
    fn a_name_split_into_pieces_is_glued_back() {
        let d = election();
        let lex = Lexicon::build(
            &d,
            ["who", "won", "is", "winning", "in"].map(String::from),
            &Default::default(),
        );
        assert_eq!(
            spotted(&lex, &d, "who won dun varick"),
            vec![(2, 4, "council/dunvarrick".to_string())]
        );
        assert_eq!(
            spotted(&lex, &d, "who is winning in wren low sands"),
            vec![(4, 7, "council/wrenlow-sands".to_string())]
        );
        // "lan" alone is the Lantern Party's code; "lan mouth" is Lanmouth.
        assert_eq!(
            spotted(&lex, &d, "who won lan mouth"),
            vec![(2, 4, "council/lanmouth".to_string())]
        );
        // Everyday words are never glued into a name.
        assert_eq!(spotted(&lex, &d, "who won in"), vec![]);
        // Pieces that sound like the name though their first letters differ
        // (speech recognition keeps the consonants).
        assert_eq!(
            spotted(&lex, &d, "who won done varick"),
            vec![(2, 4, "council/dunvarrick".to_string())]
        );
    }

    #[test]
    fn a_first_name_that_starts_a_misspelt_longer_name_gives_way() {
        let d = election();
        let lex = Lexicon::build(&d, ["who", "won"].map(String::from), &Default::default());
        // "Fenwick" alone is a candidate's first name; with "Green" it is the
        // ward Fennick Green, misspelt.
        assert_eq!(
            spotted(&lex, &d, "who won Fenwick Green"),
            vec![(2, 4, "council/fennick-green".to_string())]
        );
        // Followed by nothing like a name, the first name stays.
        let alone = spotted(&lex, &d, "who won Fenwick");
        assert_eq!(alone.len(), 1);
        assert_eq!((alone[0].0, alone[0].1), (2, 3));
        assert!(alone[0].2.starts_with('c'), "{alone:?}");
    }
}
