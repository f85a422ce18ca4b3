//! The frame of a question: what it asks for (its focus) and the limits it
//! sets (a day, a round, a place, "the most", "not"), read once per message
//! from its words with the names already found. Everything after reading
//! (choosing an intent, filling slots, context) works from the frame, so a
//! part of the question cannot be silently dropped: every limit must be
//! honoured by the intent chosen, or the reply says it cannot be.
//!
//! The rules are general English question forms (built in, the same for
//! every scenario); a scenario's own words come in through its vocabulary
//! ([`super::vocabulary`]).

use serde::{Deserialize, Serialize};

use super::english;
use super::lexicon::{Mention, Target};
use crate::dataset::EntityRef;

/// What a question asks for. Intents declare which they answer
/// (`answers:` in their YAML).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Focus {
    /// Which person or side: a winner, a leader, who came fifth, who beat X.
    Who,
    /// How a named person or group did.
    HowDid,
    /// A contest's results or standings.
    Results,
    /// How many.
    Count,
    /// A group's place in a table.
    Rank,
    /// A table or its top.
    Table,
    /// By how much: a margin, a gap, a lead.
    Margin,
    /// A time, distance, score or number of votes as such.
    Mark,
    /// When.
    When,
    /// Where.
    Where,
    /// What is on.
    Schedule,
    /// Whether something has started or finished, how far along it is.
    Status,
    /// A yes/no question about a result.
    Whether,
    /// Which of two finished ahead.
    Compare,
    /// Which team, delegation or party someone is in.
    GroupOf,
    /// What sport or event someone does.
    SportOf,
    /// About a person in general.
    Profile,
    /// Which contests are still open.
    Open,
    /// Greeting, thanks, help.
    Chat,
    /// Something else: an attribute the data does not hold.
    Other,
}

impl Focus {
    /// Every focus, for checks and docs.
    pub const ALL: [Focus; 20] = [
        Focus::Who,
        Focus::HowDid,
        Focus::Results,
        Focus::Count,
        Focus::Rank,
        Focus::Table,
        Focus::Margin,
        Focus::Mark,
        Focus::When,
        Focus::Where,
        Focus::Schedule,
        Focus::Status,
        Focus::Whether,
        Focus::Compare,
        Focus::GroupOf,
        Focus::SportOf,
        Focus::Profile,
        Focus::Open,
        Focus::Chat,
        Focus::Other,
    ];

    /// The name editors write.
    pub fn name(self) -> &'static str {
        match self {
            Focus::Who => "who",
            Focus::HowDid => "how_did",
            Focus::Results => "results",
            Focus::Count => "count",
            Focus::Rank => "rank",
            Focus::Table => "table",
            Focus::Margin => "margin",
            Focus::Mark => "mark",
            Focus::When => "when",
            Focus::Where => "where",
            Focus::Schedule => "schedule",
            Focus::Status => "status",
            Focus::Whether => "whether",
            Focus::Compare => "compare",
            Focus::GroupOf => "group_of",
            Focus::SportOf => "sport_of",
            Focus::Profile => "profile",
            Focus::Open => "open",
            Focus::Chat => "chat",
            Focus::Other => "other",
        }
    }

    /// Parses the name editors write.
    pub fn from_name(s: &str) -> Option<Focus> {
        Focus::ALL.into_iter().find(|f| f.name() == s)
    }
}

/// A limit a question sets on its answer. An intent honours the limits its
/// slots can take and those it declares (`honours:` in its YAML).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Limit {
    /// A place in a contest: "who came fifth", "who was last".
    Place,
    /// A superlative: "the most", "the closest", "the fastest".
    Extreme,
    /// "not", "never", "without".
    Negation,
}

impl Limit {
    /// Every limit that is declared rather than taken by a slot.
    pub const ALL: [Limit; 3] = [Limit::Place, Limit::Extreme, Limit::Negation];

    /// The name editors write.
    pub fn name(self) -> &'static str {
        match self {
            Limit::Place => "place",
            Limit::Extreme => "extreme",
            Limit::Negation => "negation",
        }
    }

    /// Parses the name editors write.
    pub fn from_name(s: &str) -> Option<Limit> {
        Limit::ALL.into_iter().find(|l| l.name() == s)
    }
}

/// A place asked about.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Place {
    /// The n-th place.
    Nth(u32),
    /// The last place.
    Last,
}

/// Something readers ask about that no scenario's data holds, with how a
/// reply names it ("{people}" stands for the people of the scenario, for
/// example "athletes").
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct Unheld {
    /// Token range of the words.
    pub start: usize,
    pub end: usize,
    /// How the reply names it: "{people}'s heights".
    pub what: String,
}

/// What was read from a question beyond its names.
#[derive(Debug, Clone, Default, PartialEq, Serialize)]
pub struct Frame {
    /// What is asked for, when the wording says it.
    pub focus: Option<Focus>,
    /// The tokens that said it.
    pub focus_words: Vec<usize>,
    /// Another reading of the focus that the conversation may pick: a bare
    /// "top 3" is the medal table in a fresh conversation, but the top of
    /// the results just given after an event.
    pub focus_in_context: Option<Focus>,
    /// Where the question proper starts; words before it are a chatty
    /// opening.
    pub onset: usize,
    /// A place asked about, with its token range.
    pub place: Option<(usize, usize, Place)>,
    /// A superlative word and its token index.
    pub extreme: Option<(usize, String)>,
    /// A negation's token index.
    pub negation: Option<usize>,
    /// "right now", "at the moment", "leading": a live contest is meant.
    pub live: bool,
    /// The question is in the past tense ("who won", "did she finish").
    pub past: bool,
    /// The question asks how a contest ended ("who won", "did she beat
    /// him", "was he elected"), not how it stands: figures so far do not
    /// answer it.
    pub settled: bool,
    /// Something the data does not hold.
    pub unheld: Option<Unheld>,
    /// Content words nothing explains (filled in by the analysis once the
    /// catalog's and the scenario's words are known).
    pub unexplained: Vec<usize>,
}

impl Frame {
    /// The limits the question sets that only a declaration can honour.
    pub fn limits(&self) -> Vec<Limit> {
        let mut v = Vec::new();
        if self.place.is_some() {
            v.push(Limit::Place);
        }
        if self.extreme.is_some() {
            v.push(Limit::Extreme);
        }
        if self.negation.is_some() {
            v.push(Limit::Negation);
        }
        v
    }

    /// Token indices the frame explains (focus words, place, superlative,
    /// negation, the unheld topic).
    pub fn explained(&self) -> Vec<usize> {
        let mut v = self.focus_words.clone();
        if let Some((s, e, _)) = self.place {
            v.extend(s..e);
        }
        if let Some((i, _)) = &self.extreme {
            v.push(*i);
        }
        v.extend(self.negation);
        if let Some(u) = &self.unheld {
            v.extend(u.start..u.end);
        }
        v
    }
}

/// Superlatives (common English).
pub const EXTREMES: &[&str] = &[
    "most",
    "least",
    "fewest",
    "fastest",
    "slowest",
    "quickest",
    "highest",
    "lowest",
    "biggest",
    "largest",
    "smallest",
    "closest",
    "tightest",
    "narrowest",
    "widest",
    "longest",
    "shortest",
    "furthest",
    "farthest",
    "worst",
    "best",
    "strongest",
    "weakest",
    "heaviest",
    "lightest",
    "oldest",
    "youngest",
];

/// Words that ask how a contest ended rather than how it stands.
/// A question in the past tense ("how did she do", "what place did he
/// get") asks the same, unless it says "so far" or "now".
const SETTLED: &[&str] = &[
    "won", "win", "wins", "winner", "winners", "beat", "beaten", "lost", "lose", "elected",
    "declared", "victory", "medal", "medals", "gold", "silver", "bronze", "podium", "did",
    "finished", "ended", "came",
];

/// Words that put a question in the past tense.
const PAST: &[&str] = &[
    "won",
    "did",
    "was",
    "were",
    "came",
    "finished",
    "happened",
    "got",
    "took",
    "beat",
    "ran",
    "swam",
    "jumped",
    "threw",
    "rowed",
    "lost",
    "placed",
    "ended",
    "scored",
    "went",
    "had",
    "declared",
    "called",
    "yesterday",
    "last",
];

/// Words for what a group is in a scenario, as readers write them.
/// Whether the whole message asks for someone's side with no one named:
/// "which party?", "and for which team", "what party then". After an
/// answer about a person it is that person's side.
pub fn bare_group_question<S: AsRef<str>>(tokens: &[S]) -> bool {
    let words: Vec<&str> = tokens
        .iter()
        .map(AsRef::as_ref)
        .filter(|t| {
            !matches!(
                *t,
                "and" | "for" | "so" | "ok" | "then" | "is" | "it" | "again"
            )
        })
        .collect();
    matches!(words.as_slice(), [w, g] if matches!(*w, "which" | "what") && GROUP_WORDS.contains(g))
}

const GROUP_WORDS: &[&str] = &[
    "team",
    "teams",
    "party",
    "parties",
    "delegation",
    "delegations",
    "country",
    "countries",
    "nation",
    "nations",
    "side",
    "club",
    "group",
    "squad",
];

/// Topics readers ask about that results data does not hold (general
/// English; a scenario adds its own in its vocabulary). Each: the words,
/// and how a reply names it.
const UNHELD: &[(&[&str], &str)] = &[
    (&["how", "old"], "{people}'s ages"),
    (&["age"], "{people}'s ages"),
    (&["ages"], "{people}'s ages"),
    (&["birthday"], "{people}'s birthdays"),
    (&["born"], "{people}'s birthdays and birthplaces"),
    (&["how", "tall"], "{people}'s heights"),
    (&["height"], "{people}'s heights"),
    (&["tall"], "{people}'s heights"),
    (&["weight"], "{people}'s weights"),
    (&["weigh"], "{people}'s weights"),
    (&["how", "heavy"], "{people}'s weights"),
    (&["coach"], "{people}'s coaches"),
    (&["coached"], "{people}'s coaches"),
    (&["coaches"], "{people}'s coaches"),
    (&["trainer"], "{people}'s coaches"),
    (&["injury"], "injury news"),
    (&["injured"], "injury news"),
    (&["injuries"], "injury news"),
    (&["hurt"], "injury news"),
    (&["married"], "{people}'s private lives"),
    (&["wife"], "{people}'s private lives"),
    (&["husband"], "{people}'s private lives"),
    (&["girlfriend"], "{people}'s private lives"),
    (&["boyfriend"], "{people}'s private lives"),
    (&["hometown"], "{people}'s hometowns"),
    (&["salary"], "earnings or prize money"),
    (&["earnings"], "earnings or prize money"),
    (&["earn"], "earnings or prize money"),
    (&["prize", "money"], "earnings or prize money"),
    (&["instagram"], "social media accounts"),
    (&["twitter"], "social media accounts"),
    (&["followers"], "social media accounts"),
    (&["weather"], "weather forecasts"),
    (&["forecast"], "weather forecasts"),
    (&["raining"], "weather forecasts"),
    (&["temperature"], "weather forecasts"),
    (&["tickets"], "ticket information"),
    (&["ticket"], "ticket information"),
    (&["tv"], "broadcast details"),
    (&["television"], "broadcast details"),
    (&["channel"], "broadcast details"),
    (&["broadcast"], "broadcast details"),
    (&["stream"], "broadcast details"),
    (&["streaming"], "broadcast details"),
    (&["radio"], "broadcast details"),
    (&["world", "record"], "records from outside these results"),
    (&["ceremony"], "ceremonies"),
    (&["ceremonies"], "ceremonies"),
    (&["doping"], "doping cases"),
    (&["drug", "test"], "doping cases"),
    (&["polls"], "opinion polls"),
    (&["poll"], "opinion polls"),
    (&["last", "games"], "results from earlier editions"),
    (&["previous", "games"], "results from earlier editions"),
    (&["past", "games"], "results from earlier editions"),
    (&["last", "edition"], "results from earlier editions"),
    (&["previous", "edition"], "results from earlier editions"),
    (&["last", "election"], "results from earlier editions"),
    (&["previous", "election"], "results from earlier editions"),
    (&["years", "ago"], "results from earlier editions"),
    (&["last", "year"], "results from earlier editions"),
    (
        &["earlier", "in", "the", "night"],
        "how things stood earlier",
    ),
    (
        &["earlier", "in", "the", "count"],
        "how things stood earlier",
    ),
    (&["earlier", "tonight"], "how things stood earlier"),
    (&["remind", "me"], "alerts (I answer when asked)"),
    (&["notify", "me"], "alerts (I answer when asked)"),
    (&["ping", "me"], "alerts (I answer when asked)"),
    (&["alert", "me"], "alerts (I answer when asked)"),
    (&["text", "me"], "alerts (I answer when asked)"),
    (
        &["let", "me", "know", "when"],
        "alerts (I answer when asked)",
    ),
    (&["wind"], "wind readings"),
    (&["windy"], "weather forecasts"),
    (&["parking"], "travel and parking"),
    (&["bus"], "travel and parking"),
    (&["train"], "travel and parking"),
];

/// Whether a word is one of the built-in topics the data does not hold,
/// or a word of one: such a word is never "corrected" into a question word
/// ("tall" is not "tally").
pub fn is_unheld_word(w: &str) -> bool {
    UNHELD.iter().any(|(words, _)| words.contains(&w))
}

/// The thing a question asks for when nothing explains it: "what lane was
/// she in", "which apparatus are they on", "what's the population of X",
/// "how windy was it". Such a word names an attribute neither the data nor
/// any intent knows, so the honest reply is that it is not held, not the
/// answer to the rest of the question.
pub fn asked_attribute(tokens: &[&str], onset: usize, unexplained: &[usize]) -> Option<Unheld> {
    let t0 = at(tokens, onset);
    let mut k = onset + 1;
    match t0 {
        "what" | "which" => {
            if matches!(at(tokens, k), "is" | "was" | "are" | "were") {
                k += 1;
            }
            if matches!(
                at(tokens, k),
                "the" | "his" | "her" | "their" | "its" | "a" | "an"
            ) {
                k += 1;
            }
        }
        "how" => {}
        _ => return None,
    }
    if !unexplained.contains(&k) {
        return None;
    }
    Some(Unheld {
        start: k,
        end: k + 1,
        what: format!("anything on “{}”", tokens[k]),
    })
}

/// "winning time", "gold medal time", "her score", "Tharvane's jump",
/// "the best throw", "what did he score": a mark named as such.
fn mark_noun(tokens: &[&str], person: &dyn Fn(usize) -> bool) -> bool {
    let noun = |w: &str| matches!(w, "time" | "score" | "mark" | "distance" | "throw" | "jump");
    tokens.windows(2).enumerate().any(|(i, w)| {
        noun(w[1])
            && (matches!(
                w[0],
                "winning"
                    | "medal"
                    | "gold"
                    | "his"
                    | "her"
                    | "their"
                    | "fastest"
                    | "quickest"
                    | "best"
                    | "top"
            ) || person(i))
    }) || tokens.windows(3).enumerate().any(|(i, w)| {
        w[0] == "did"
            && matches!(w[2], "score" | "throw" | "jump" | "clock")
            && (matches!(w[1], "he" | "she" | "they") || person(i + 1))
    })
}

fn at<'a>(tokens: &[&'a str], i: usize) -> &'a str {
    tokens.get(i).copied().unwrap_or("")
}

/// Whether `words` occur in `tokens` from `i`.
fn seq(tokens: &[&str], i: usize, words: &[&str]) -> bool {
    words
        .iter()
        .enumerate()
        .all(|(k, w)| at(tokens, i + k) == *w)
}

/// The first index at or after `from` where `words` occur.
fn find(tokens: &[&str], from: usize, words: &[&str]) -> Option<usize> {
    (from..tokens.len()).find(|&i| seq(tokens, i, words))
}

/// Reads the frame of a message from its tokens (normalised, expanded) and
/// the names found in it. `extra_unheld` are the scenario's own topics the
/// data does not hold.
pub fn read(
    tokens: &[&str],
    mentions: &[Mention],
    extra_unheld: &[(Vec<String>, String)],
) -> Frame {
    let named = |i: usize| mentions.iter().any(|m| m.start <= i && i < m.end);
    let onset = english::onset(tokens);
    let mut f = Frame {
        onset,
        ..Frame::default()
    };
    f.past = tokens.iter().any(|t| PAST.contains(t));
    f.settled = tokens.iter().any(|t| SETTLED.contains(t))
        && find(tokens, 0, &["so", "far"]).is_none()
        && !f.live;
    f.live = find(tokens, 0, &["right", "now"]).is_some()
        || find(tokens, 0, &["at", "the", "moment"]).is_some()
        || tokens.iter().any(|t| {
            matches!(
                *t,
                "currently"
                    | "live"
                    | "leading"
                    | "leader"
                    | "leads"
                    | "winning"
                    | "ahead"
                    | "front"
                    | "now"
                    | "ongoing"
            )
        });
    f.place = place(tokens, &named);
    f.extreme = tokens
        .iter()
        .enumerate()
        .find(|(i, t)| !named(*i) && EXTREMES.contains(t))
        .map(|(i, t)| (i, t.to_string()));
    f.negation = tokens
        .iter()
        .enumerate()
        .skip(onset)
        .find(|(i, t)| !named(*i) && matches!(**t, "not" | "never" | "without" | "nobody" | "none"))
        .map(|(i, _)| i);
    f.unheld = unheld(tokens, &named, extra_unheld);
    let (focus, mut words) = focus(tokens, onset, mentions, &f);
    // "who was first" asks for the winner or the leader: no place to look
    // up beyond the top.
    if let (Some(Focus::Who), Some((s, e, Place::Nth(1)))) = (focus, f.place) {
        words.extend(s..e);
        f.place = None;
    }
    if focus == Some(Focus::Table) && !words.is_empty() && words.iter().all(|&i| tokens[i] == "top")
    {
        f.focus_in_context = Some(Focus::Results);
    }
    f.focus = focus;
    f.focus_words = words;
    if f.focus.is_none() && f.unheld.is_some() {
        f.focus = Some(Focus::Other);
    }
    f
}

/// "who came fifth", "in 4th place", "who was last", "bottom of the table".
fn place(tokens: &[&str], named: &dyn Fn(usize) -> bool) -> Option<(usize, usize, Place)> {
    const BEFORE: &[&str] = &[
        "came",
        "come",
        "comes",
        "coming",
        "finished",
        "finish",
        "finishes",
        "finishing",
        "placed",
        "ended",
        "end",
        "was",
        "is",
        "were",
        "are",
        "in",
        "got",
        "get",
        "be",
    ];
    const AFTER: &[&str] = &["place", "position", "spot", "placed"];
    const ROUNDS: &[&str] = &[
        "heat",
        "heats",
        "round",
        "semi",
        "semifinal",
        "semis",
        "final",
        "race",
        "event",
        "day",
        "leg",
        "attempt",
        "try",
        "time",
        "game",
        "match",
        "half",
        "quarter",
        "set",
        "period",
    ];
    for i in 0..tokens.len() {
        if named(i) {
            continue;
        }
        let t = tokens[i];
        // "the runner-up" is second (common practice).
        if t == "runnerup" || (t == "runner" && at(tokens, i + 1) == "up") {
            let end = if t == "runner" { i + 2 } else { i + 1 };
            return Some((i, end, Place::Nth(2)));
        }
        if t == "last" || t == "bottom" {
            let before = i.checked_sub(1).map(|p| tokens[p]).unwrap_or("");
            let after = at(tokens, i + 1);
            let is_place = (BEFORE.contains(&before)
                && !ROUNDS.contains(&after)
                && after != "night"
                && after != "year"
                && after != "week")
                || AFTER.contains(&after)
                || (t == "bottom" && (after == "of" || before == "the" || before == "at"));
            if is_place {
                let end = if AFTER.contains(&after) { i + 2 } else { i + 1 };
                return Some((i, end, Place::Last));
            }
            continue;
        }
        let Some((n, len)) = english::ordinal_at(tokens, i) else {
            continue;
        };
        let before = i.checked_sub(1).map(|p| tokens[p]).unwrap_or("");
        let after = at(tokens, i + len);
        // "the 15th of August", "on the 18th": a day, not a place.
        let is_day = after == "of"
            || matches!(
                after,
                "january"
                    | "february"
                    | "march"
                    | "april"
                    | "may"
                    | "june"
                    | "july"
                    | "august"
                    | "september"
                    | "october"
                    | "november"
                    | "december"
            )
            || (before == "the" && i >= 2 && tokens[i - 2] == "on");
        if is_day || ROUNDS.contains(&after) {
            continue;
        }
        if AFTER.contains(&after) {
            return Some((i, i + len + 1, Place::Nth(n)));
        }
        if BEFORE.contains(&before) {
            return Some((i, i + len, Place::Nth(n)));
        }
    }
    None
}

/// The first topic the data does not hold, unless its words are a name.
fn unheld(
    tokens: &[&str],
    named: &dyn Fn(usize) -> bool,
    extra: &[(Vec<String>, String)],
) -> Option<Unheld> {
    for i in 0..tokens.len() {
        if named(i) {
            continue;
        }
        for (words, what) in extra {
            let w: Vec<&str> = words.iter().map(String::as_str).collect();
            if seq(tokens, i, &w) && (i..i + w.len()).all(|k| !named(k)) {
                return Some(Unheld {
                    start: i,
                    end: i + w.len(),
                    what: what.clone(),
                });
            }
        }
        for (words, what) in UNHELD {
            if seq(tokens, i, words) && (i..i + words.len()).all(|k| !named(k)) {
                return Some(Unheld {
                    start: i,
                    end: i + words.len(),
                    what: what.to_string(),
                });
            }
        }
    }
    None
}

fn is_person(m: &Mention) -> bool {
    matches!(
        m.candidates.first(),
        Some((Target::Entity(EntityRef::Competitor(_), _), _))
    )
}

fn is_contest(m: &Mention) -> bool {
    matches!(
        m.candidates.first(),
        Some((
            Target::Entity(EntityRef::Contest(_) | EntityRef::Discipline(..), _)
                | Target::Category(_)
                | Target::Phase(_),
            _
        ))
    )
}

/// Reads the focus from the question's wording. Returns the focus and the
/// tokens that say it.
fn focus(
    tokens: &[&str],
    onset: usize,
    mentions: &[Mention],
    frame: &Frame,
) -> (Option<Focus>, Vec<usize>) {
    let n = tokens.len();
    let named = |i: usize| mentions.iter().any(|m| m.start <= i && i < m.end);
    let person = |i: usize| {
        mentions
            .iter()
            .any(|m| m.start <= i && i < m.end && is_person(m))
    };
    // "she", "him" stand for a person named before.
    let pronouns = tokens
        .iter()
        .filter(|t| matches!(**t, "he" | "she" | "him" | "her" | "his" | "they" | "them"))
        .count()
        // "which party is that?", "and which party?": whoever was just
        // talked about.
        + usize::from(
            n >= 2 && matches!(tokens[n - 1], "that" | "this") && matches!(tokens[n - 2], "is" | "was" | "s"),
        );
    let people = mentions.iter().filter(|m| is_person(m)).count() + pronouns;
    let contest_named = mentions.iter().any(is_contest);
    let has = |w: &str| tokens.iter().enumerate().any(|(i, t)| *t == w && !named(i));
    let pos = |w: &str| {
        tokens
            .iter()
            .enumerate()
            .position(|(i, t)| *t == w && !named(i))
    };
    let words = |ws: &[&str]| -> Vec<usize> { ws.iter().filter_map(|w| pos(w)).collect() };
    let t0 = at(tokens, onset);
    let t1 = at(tokens, onset + 1);
    let some = |f: Focus, ws: &[&str]| (Some(f), words(ws));
    if mentions.is_empty() && bare_group_question(tokens) {
        return some(Focus::GroupOf, &["which", "what"]);
    }

    // By how much: a margin, a gap, a lead.
    if find(tokens, 0, &["by", "how", "much"]).is_some()
        || find(tokens, 0, &["by", "how", "many"]).is_some()
        || ((t0 == "how" && matches!(t1, "much" | "many")) && tokens.last() == Some(&"by"))
        || (t0 == "how"
            && t1 == "far"
            && tokens
                .iter()
                .any(|t| matches!(*t, "ahead" | "behind" | "clear" | "front" | "off")))
        || (t0 == "how"
            && matches!(t1, "big" | "large" | "wide" | "narrow" | "small")
            && tokens
                .iter()
                .any(|t| matches!(*t, "lead" | "gap" | "margin" | "majority")))
    {
        return some(
            Focus::Margin,
            &[
                "how", "much", "many", "far", "by", "big", "lead", "gap", "margin",
            ],
        );
    }
    if (OPENERS_YES_NO.contains(&t0) || t0 == "how")
        && tokens
            .iter()
            .any(|t| matches!(*t, "close" | "tight" | "closer" | "tighter"))
    {
        return some(
            Focus::Margin,
            &["how", "close", "tight", "closer", "tighter"],
        );
    }
    if has("margin")
        || has("gap")
        || has("difference")
        || (has("lead") && (has("the") || has("his") || has("her") || has("their")) && !has("who"))
    {
        return some(
            Focus::Margin,
            &["margin", "gap", "difference", "lead", "what", "how", "big"],
        );
    }
    // How much is counted, is it over.
    // "in" says arrived only at the end ("how many are in (yet)"); inside
    // the question it is a limit ("how many medals in athletics").
    let ends_in = matches!(
        tokens
            .iter()
            .rev()
            .find(|t| !matches!(**t, "yet" | "now" | "already" | "so" | "far")),
        Some(&"in")
    );
    if (t0 == "how"
        && matches!(t1, "much" | "many" | "far")
        && (ends_in
            || tokens.iter().any(|t| {
                matches!(
                    *t,
                    "counted" | "count" | "declared" | "reported" | "through" | "along" | "done"
                )
            }))
        && !(t1 == "many"
            && tokens
                .iter()
                .any(|t| matches!(*t, "medals" | "medal" | "golds"))))
        || has("progress")
        || has("status")
        // "are the results in (yet)", "is it all in": arrived, declared.
        || (matches!(t0, "is" | "are" | "has" | "have")
            && matches!(
                tokens.get(onset..).unwrap_or(&[]).iter().rev().find(|t| !matches!(**t, "yet" | "now" | "already")),
                Some(&"in")
            ))
        || (t0 == "how"
            && tokens.iter().any(|t| matches!(*t, "count" | "counting"))
            && !has("votes"))
    {
        return some(
            Focus::Status,
            &[
                "how", "much", "many", "far", "counted", "count", "progress", "status",
            ],
        );
    }
    // Which team someone is in.
    let group_word = tokens
        .iter()
        .enumerate()
        .find(|(i, t)| !named(*i) && GROUP_WORDS.contains(t))
        .map(|(i, _)| i);
    if people > 0 {
        let asks_group = matches!(t0, "which" | "what")
            && group_word == Some(onset + 1)
            && matches!(
                at(tokens, onset + 2),
                "is" | "does" | "did" | "was" | "are" | "do"
            )
            || (t0 == "where"
                && matches!(t1, "is" | "does" | "was" | "are")
                && tokens.last() == Some(&"from"))
            || (t0 == "who"
                && matches!(t1, "does" | "did" | "is")
                && tokens
                    .iter()
                    .any(|t| matches!(*t, "represent" | "representing" | "for"))
                && !has("won")
                && !has("win"))
            // "who's Madoc Quaddle with": the side someone is on.
            || (t0 == "who"
                && matches!(t1, "is" | "was")
                && tokens.last() == Some(&"with"));
        if asks_group {
            return some(
                Focus::GroupOf,
                &[
                    "which",
                    "what",
                    "where",
                    "from",
                    "who",
                    "represent",
                    "representing",
                ],
            );
        }
        let sport_word = tokens
            .iter()
            .enumerate()
            .find(|(i, t)| {
                !named(*i)
                    && matches!(
                        **t,
                        "sport" | "sports" | "discipline" | "disciplines" | "events" | "event"
                    )
            })
            .map(|(i, _)| i);
        let asks_sport = (matches!(t0, "which" | "what")
            && sport_word == Some(onset + 1)
            && matches!(
                at(tokens, onset + 2),
                "is" | "does" | "did" | "was" | "are" | "do"
            ))
            || (t0 == "what"
                && matches!(t1, "does" | "did")
                && matches!(tokens.last(), Some(&"do")));
        if asks_sport {
            return some(
                Focus::SportOf,
                &[
                    "which",
                    "what",
                    "sport",
                    "sports",
                    "discipline",
                    "events",
                    "event",
                    "do",
                ],
            );
        }
    }
    // Two people compared.
    if people >= 2 {
        let cmp = tokens.iter().any(|t| {
            matches!(
                *t,
                "beat"
                    | "beaten"
                    | "ahead"
                    | "faster"
                    | "better"
                    | "quicker"
                    | "slower"
                    | "behind"
                    | "higher"
                    | "further"
                    | "versus"
                    | "or"
                    | "against"
                    | "front"
            )
        });
        if cmp {
            if OPENERS_YES_NO.contains(&t0) {
                return some(
                    Focus::Whether,
                    &["beat", "ahead", "faster", "better", "behind"],
                );
            }
            return some(
                Focus::Compare,
                &[
                    "who", "which", "beat", "ahead", "faster", "better", "or", "versus", "against",
                ],
            );
        }
    }
    // Who is X (nothing else): a profile.
    if t0 == "who" && matches!(t1, "is" | "was") && people == 1 && person(onset + 2) {
        let m = mentions.iter().find(|m| m.start == onset + 2);
        if m.is_some_and(|m| m.end == n) {
            return some(Focus::Profile, &["who"]);
        }
    }
    if (find(tokens, 0, &["tell", "me", "about"]).is_some() || (has("about") && has("know")))
        && people == 1
    {
        return some(Focus::Profile, &["tell", "about", "know"]);
    }
    // Which contests are still open.
    let contest_words = |t: &str| {
        matches!(
            t,
            "races" | "wards" | "events" | "contests" | "seats" | "results" | "finals" | "counts"
        )
    };
    if (matches!(t0, "which" | "what" | "any" | "how") && tokens.iter().any(|t| contest_words(t)))
        && tokens.iter().any(|t| {
            matches!(
                *t,
                "open"
                    | "undecided"
                    | "outstanding"
                    | "remaining"
                    | "left"
                    | "undeclared"
                    | "uncalled"
                    | "pending"
                    | "waiting"
                    | "still"
                    | "yet"
                    | "not"
            )
        })
    {
        return some(
            Focus::Open,
            &[
                "which",
                "what",
                "open",
                "undecided",
                "outstanding",
                "remaining",
                "left",
                "still",
                "yet",
            ],
        );
    }
    // What is on.
    if find(tokens, 0, &["what", "is", "on"]).is_some()
        || find(tokens, 0, &["anything", "on"]).is_some()
        || has("schedule")
        || has("programme")
        || has("program")
        || has("fixtures")
        || has("lineup")
        || (matches!(t0, "what" | "which")
            && tokens
                .iter()
                .any(|t| matches!(*t, "happening" | "coming" | "scheduled")))
    {
        return some(
            Focus::Schedule,
            &[
                "what",
                "on",
                "schedule",
                "programme",
                "program",
                "happening",
                "coming",
                "scheduled",
            ],
        );
    }
    // When.
    if t0 == "when"
        || (t0 == "what" && matches!(t1, "time" | "day" | "date"))
        || (t0 == "which" && matches!(t1, "day" | "date"))
        || (t0 == "how"
            && t1 == "long"
            && tokens
                .iter()
                .any(|t| matches!(*t, "until" | "till" | "before" | "ago" | "to")))
        || has("kick")
    {
        // "what time did she run" asks for her time, not a time of day.
        let mark = t0 == "what"
            && t1 == "time"
            && tokens.iter().any(|t| {
                matches!(
                    *t,
                    "run" | "swim" | "clock" | "record" | "post" | "set" | "do"
                )
            });
        if mark {
            return some(Focus::Mark, &["what", "time"]);
        }
        return some(
            Focus::When,
            &[
                "when", "what", "which", "time", "day", "date", "how", "long", "until", "till",
                "ago",
            ],
        );
    }
    // Where.
    if t0 == "where" || has("venue") || has("location") {
        if tokens.iter().any(|t| {
            matches!(
                *t,
                "finish"
                    | "finished"
                    | "come"
                    | "came"
                    | "place"
                    | "placed"
                    | "rank"
                    | "ranked"
                    | "stand"
                    | "standing"
                    | "table"
                    | "league"
                    | "end"
            )
        }) {
            if people > 0 {
                return some(
                    Focus::HowDid,
                    &[
                        "where", "finish", "finished", "come", "came", "place", "placed",
                    ],
                );
            }
            if contest_named {
                return some(
                    Focus::Results,
                    &[
                        "where", "finish", "finished", "come", "came", "place", "placed",
                    ],
                );
            }
            return some(
                Focus::Rank,
                &[
                    "where", "rank", "ranked", "stand", "table", "league", "place",
                ],
            );
        }
        return some(Focus::Where, &["where", "venue", "location"]);
    }
    // How many.
    if (t0 == "how" && t1 == "many")
        || find(tokens, 0, &["number", "of"]).is_some()
        || has("tally")
        || has("total")
    {
        // "How many votes did she get" asks for her mark, as "what time did
        // she run" does; "how many medals" counts things won.
        if t0 == "how" && t1 == "many" && matches!(tokens.get(2).copied(), Some("votes" | "points"))
        {
            return some(Focus::Mark, &["how", "many", "votes", "points"]);
        }
        return some(Focus::Count, &["how", "many", "number", "tally", "total"]);
    }
    // A group's place in a table.
    if has("rank")
        || has("ranked")
        || has("ranking")
        || has("position")
        || (matches!(t0, "what" | "which") && t1 == "place")
    {
        if people > 0 {
            return some(
                Focus::HowDid,
                &[
                    "rank", "ranked", "ranking", "position", "what", "which", "place",
                ],
            );
        }
        return some(
            Focus::Rank,
            &[
                "rank", "ranked", "ranking", "position", "what", "which", "place",
            ],
        );
    }
    // A time or a mark as such.
    if (t0 == "what"
        && matches!(t1, "is" | "was")
        && tokens.iter().any(|t| {
            matches!(
                *t,
                "time" | "mark" | "score" | "distance" | "points" | "record"
            )
        }))
        || (t0 == "how" && matches!(t1, "fast" | "far" | "high" | "quick"))
        || has("record")
        || (t0 != "who" && mark_noun(tokens, &person))
        || find(tokens, 0, &["best", "time"]).is_some()
        || find(tokens, 0, &["best", "mark"]).is_some()
        // "what was her share", "Zellick's percentage": a share of the
        // vote is a figure of one's own, not a gap (a share of the count
        // is its progress, read above).
        || (people > 0
            && tokens
                .iter()
                .any(|t| matches!(*t, "share" | "percentage" | "percent"))
            && !tokens
                .iter()
                .any(|t| matches!(*t, "counted" | "count" | "in")))
    {
        return some(
            Focus::Mark,
            &[
                "what",
                "how",
                "fast",
                "far",
                "high",
                "time",
                "mark",
                "score",
                "record",
                "best",
                "share",
                "percentage",
                "percent",
            ],
        );
    }
    // Who.
    if t0 == "who"
        || t0 == "whom"
        || t0 == "whose"
        || has("winner")
        || has("winners")
        || has("medallists")
        || has("medalists")
    {
        return some(
            Focus::Who,
            &[
                "who",
                "whom",
                "whose",
                "winner",
                "winners",
                "medallists",
                "medalists",
            ],
        );
    }
    if matches!(t0, "which" | "what")
        && tokens.iter().skip(onset + 1).take(3).any(|t| {
            matches!(
                *t,
                "won"
                    | "win"
                    | "wins"
                    | "leads"
                    | "leading"
                    | "ahead"
                    | "winning"
                    | "topped"
                    | "tops"
                    | "top"
                    | "came"
                    | "finished"
                    | "got"
                    | "took"
            )
        })
    {
        return some(
            Focus::Who,
            &[
                "which", "what", "won", "win", "leads", "leading", "ahead", "winning",
            ],
        );
    }
    // A table, or a contest's results.
    if has("table") || has("standings") || has("leaderboard") || has("totals") {
        return if contest_named {
            some(Focus::Results, &["table", "standings", "leaderboard"])
        } else {
            some(
                Focus::Table,
                &["table", "standings", "leaderboard", "totals"],
            )
        };
    }
    if has("results")
        || has("result")
        || has("classification")
        || has("order")
        || has("podium")
        || has("placings")
        || (has("top") && frame.place.is_none())
    {
        if people > 0 {
            return some(Focus::HowDid, &["results", "result"]);
        }
        if !contest_named && has("top") {
            return some(Focus::Table, &["top"]);
        }
        return some(
            Focus::Results,
            &[
                "results",
                "result",
                "classification",
                "order",
                "podium",
                "placings",
                "top",
            ],
        );
    }
    // How did X do.
    if t0 == "how"
        && matches!(
            t1,
            "did" | "is" | "was" | "are" | "were" | "has" | "have" | "does" | "do"
        )
        && tokens.iter().any(|t| {
            matches!(
                *t,
                "do" | "doing"
                    | "done"
                    | "did"
                    | "go"
                    | "going"
                    | "gone"
                    | "get"
                    | "getting"
                    | "perform"
                    | "performing"
                    | "fare"
                    | "faring"
                    | "finish"
                    | "finished"
                    | "place"
                    | "vote"
                    | "voted"
            )
        })
    {
        let group_named = mentions.iter().any(|m| {
            matches!(
                m.candidates.first(),
                Some((Target::Entity(EntityRef::Group(_), _), _))
            )
        });
        if people == 0 && !group_named && contest_named {
            return some(
                Focus::Results,
                &[
                    "how", "do", "did", "go", "going", "finish", "finished", "vote", "voted",
                ],
            );
        }
        return some(
            Focus::HowDid,
            &[
                "how", "do", "doing", "done", "go", "going", "get", "perform", "fare", "finish",
            ],
        );
    }
    if find(tokens, 0, &["what", "happened"]).is_some() {
        return some(Focus::HowDid, &["what", "happened"]);
    }
    // A yes/no question.
    if OPENERS_YES_NO.contains(&t0) && !matches!(t1, "you" | "i") {
        let status = tokens.iter().any(|t| {
            matches!(
                *t,
                "over"
                    | "finished"
                    | "done"
                    | "complete"
                    | "completed"
                    | "started"
                    | "begun"
                    | "ended"
                    | "happened"
                    | "underway"
                    | "declared"
                    | "called"
                    | "counted"
                    | "counting"
            )
        });
        let won = tokens.iter().any(|t| {
            matches!(
                *t,
                "won"
                    | "win"
                    | "winning"
                    | "leading"
                    | "ahead"
                    | "beat"
                    | "lost"
                    | "elected"
                    | "medal"
                    | "medals"
                    | "gold"
                    | "silver"
                    | "bronze"
                    | "seat"
                    | "qualified"
                    | "through"
            )
        });
        if status && !won {
            return some(
                Focus::Status,
                &[
                    "over", "finished", "done", "complete", "started", "begun", "ended",
                    "happened", "declared", "called",
                ],
            );
        }
        return some(Focus::Whether, &[t0]);
    }
    (None, Vec::new())
}

/// Verbs that open a yes/no question.
const OPENERS_YES_NO: &[&str] = &[
    "is", "are", "was", "were", "has", "have", "had", "did", "does", "do", "will", "can", "could",
];

#[cfg(test)]
mod tests {
    use super::*;

    fn frame(s: &str) -> Frame {
        let t: Vec<&str> = s.split(' ').collect();
        read(&t, &[], &[])
    }

    #[test]
    fn focus_words_of_common_questions() {
        let f = |s: &str| frame(s).focus;
        assert_eq!(f("who won the 100 m"), Some(Focus::Who));
        assert_eq!(f("by how much did she win"), Some(Focus::Margin));
        assert_eq!(f("how much did she win by"), Some(Focus::Margin));
        assert_eq!(f("how far ahead is he"), Some(Focus::Margin));
        assert_eq!(f("what is the margin"), Some(Focus::Margin));
        assert_eq!(f("how many medals"), Some(Focus::Count));
        assert_eq!(f("how many votes did she get"), Some(Focus::Mark));
        assert_eq!(f("what was her share"), Some(Focus::Mark));
        assert_eq!(f("and his percentage"), Some(Focus::Mark));
        assert_eq!(f("how much is counted"), Some(Focus::Status));
        assert_eq!(f("how many are in so far"), Some(Focus::Status));
        assert_eq!(
            f("how many bronze medals has corvanthe won in athletics"),
            Some(Focus::Count)
        );
        assert_eq!(f("when is the final"), Some(Focus::When));
        assert_eq!(f("what time is the final"), Some(Focus::When));
        assert_eq!(f("how long until the final"), Some(Focus::When));
        assert_eq!(f("where is the final"), Some(Focus::Where));
        assert_eq!(f("what is on today"), Some(Focus::Schedule));
        assert_eq!(f("is it over"), Some(Focus::Status));
        assert_eq!(f("are all the results in yet"), Some(Focus::Status));
        assert_eq!(f("is the result in"), Some(Focus::Status));
        assert_eq!(f("has it happened"), Some(Focus::Status));
        assert_eq!(f("has she won"), Some(Focus::Whether));
        assert_eq!(f("which wards are still open"), Some(Focus::Open));
        assert_eq!(f("medal table"), Some(Focus::Table));
        assert_eq!(f("how tall is she"), Some(Focus::Other));
        assert_eq!(f("gold medal time in the 1500"), Some(Focus::Mark));
        assert_eq!(f("winning score in the final"), Some(Focus::Mark));
        assert_eq!(f("who had the fastest time"), Some(Focus::Who));
        assert_eq!(f("hello"), None);
    }

    #[test]
    fn earlier_editions_and_alerts_are_not_held() {
        let u = |s: &str| frame(s).unheld.map(|u| u.what);
        assert_eq!(
            u("who won the 100 m at the last games").as_deref(),
            Some("results from earlier editions")
        );
        assert_eq!(
            u("how did harbour do four years ago").as_deref(),
            Some("results from earlier editions")
        );
        assert!(
            u("can you ping me when the final is done").is_some_and(|w| w.starts_with("alerts"))
        );
        assert!(u("let me know when marrowby declares").is_some_and(|w| w.starts_with("alerts")));
        assert_eq!(
            u("was pellagan ahead earlier in the night").as_deref(),
            Some("how things stood earlier")
        );
        // "last" alone is a place or the latest, not an earlier edition.
        assert_eq!(u("who came last in the 400 m"), None);
        assert_eq!(u("what was the last race"), None);
    }

    #[test]
    fn an_attribute_nothing_explains_is_not_held() {
        let toks = ["what", "lane", "was", "she", "in"];
        let u = asked_attribute(&toks, 0, &[1]).expect("lane is asked for");
        assert_eq!((u.start, u.end), (1, 2));
        assert!(u.what.contains("lane"));
        let toks = ["what", "is", "the", "population", "of", "x"];
        assert_eq!(asked_attribute(&toks, 0, &[3]).map(|u| u.start), Some(3));
        // Explained words ("time") are questions the service reads.
        let toks = ["what", "time", "is", "the", "final"];
        assert!(asked_attribute(&toks, 0, &[]).is_none());
        // Not at the head of the question: only a cost in confidence.
        let toks = ["who", "won", "the", "lane", "race"];
        assert!(asked_attribute(&toks, 0, &[3]).is_none());
    }

    #[test]
    fn places_are_read_but_days_and_rounds_are_not() {
        let p = |s: &str| frame(s).place.map(|x| x.2);
        assert_eq!(p("who came fifth"), Some(Place::Nth(5)));
        assert_eq!(p("who finished 4th"), Some(Place::Nth(4)));
        assert_eq!(p("who was in 8th place"), Some(Place::Nth(8)));
        assert_eq!(p("who was last"), Some(Place::Last));
        assert_eq!(p("who is bottom of the table"), Some(Place::Last));
        assert_eq!(p("who came twenty first"), Some(Place::Nth(21)));
        assert_eq!(p("what is on on the 15th"), None);
        assert_eq!(p("the 15th of august"), None);
        assert_eq!(p("who won the second heat"), None);
        assert_eq!(p("who was runner up"), Some(Place::Nth(2)));
        assert_eq!(p("who won last night"), None);
        assert_eq!(p("who won the last race"), None);
    }

    #[test]
    fn a_side_asked_for_with_no_one_named() {
        let t = |s: &str| bare_group_question(&s.split(' ').collect::<Vec<_>>());
        assert!(t("which party"));
        assert!(t("and for which party"));
        assert!(t("what team is it then"));
        assert!(!t("which party has the most seats"));
        assert!(!t("which party is leading"));
        assert_eq!(frame("and which party").focus, Some(Focus::GroupOf));
    }

    #[test]
    fn a_question_about_how_it_ended_is_told_from_one_about_how_it_stands() {
        assert!(frame("did she win").settled);
        assert!(frame("who won caddenmill").settled);
        assert!(frame("did pim beat elric").settled);
        assert!(!frame("is she ahead of lowen").settled);
        assert!(!frame("how many votes has she got so far").settled);
        assert!(!frame("how far behind is he").settled);
        assert!(frame("how did she do in the marathon").settled);
        assert!(!frame("how did she do so far").settled);
        assert!(!frame("who is winning right now").settled);
    }

    #[test]
    fn superlatives_negations_and_live_cues() {
        assert_eq!(
            frame("which ward was the closest").extreme.map(|e| e.1),
            Some("closest".into())
        );
        assert!(frame("who has not won").negation.is_some());
        assert!(frame("who is leading right now").live);
        assert!(!frame("who won").live);
        assert!(frame("who won on friday").past);
    }
}
