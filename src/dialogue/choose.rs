//! Choosing the intent that answers the question that was asked.
//!
//! The scorer ([`crate::understand::classify`]) ranks intents by how their
//! phrasings look like the message. That alone answers nearby questions
//! with confidence: "which team is X in" looks like "how did X do", "how
//! many medals has X won in swimming" like "how many medals has X won".
//! So an intent is only chosen when it also *covers* the question's frame:
//! it answers the frame's focus (its `answers:`), and every name, day,
//! count, place, superlative and negation in the question is taken by one
//! of its slots, describes a value a slot holds (the sport of the person
//! asked about), or is a limit it declares it honours (`honours:`). When
//! the best intents all leave part of the question out, the reply says what
//! cannot be answered instead of answering less.

use crate::answers::ops::{EntityKind, SlotValue};
use crate::catalog::{Catalog, Intent};
use crate::dataset::{Dataset, EntityRef};
use crate::understand::classify::{MIN_SCORE, MIN_SCORE_TO_ASK};
use crate::understand::english;
use crate::understand::frame::{Focus, Place};
use crate::understand::lexicon::{Mention, Target};
use crate::understand::slots::{Filled, Need};
use crate::understand::Analysis;

use super::context::{fill_in_context, points_at_event, points_back_at_someone};
use super::session::Session;

/// Intents scoring below this share of the best score are not tried: a
/// weak match that happens to cover the question is still a weak match.
const TRY_SHARE: f32 = 0.5;
/// The lowest score tried when the question states its focus and the
/// intent answers it.
const FOCUS_FLOOR: f32 = 0.3;
/// How many intents are tried at most.
const TRY_MAX: usize = 6;
/// What the frame adds to the score of an intent whose first declared
/// focus is the question's and whose slots take every name in it.
const FRAME_BONUS_FIRST: f32 = 0.15;
/// The same for an intent that answers the focus but not first.
const FRAME_BONUS: f32 = 0.08;
/// What an unexplained content word costs in confidence.
const UNEXPLAINED_COST: f32 = 0.85;

/// What a question could not be answered for.
#[derive(Debug, Clone, PartialEq)]
pub enum Gap {
    /// A topic the data does not hold, as a reply names it.
    Unheld(String),
    /// No intent answers this focus.
    Focus(Focus),
    /// The best intent cannot honour these limits (as a reply names them).
    Limits(Vec<String>),
}

/// The intent chosen and its slots.
#[derive(Debug)]
pub struct Chosen<'c> {
    pub intent: &'c Intent,
    pub filled: Filled,
    pub confidence: f32,
}

/// The outcome of choosing.
#[derive(Debug)]
pub enum Choice<'c> {
    Intent(Chosen<'c>),
    /// The question is understood well enough to say what cannot be
    /// answered; `near` is the intent that came closest.
    NotCovered {
        gap: Gap,
        near: Option<&'c Intent>,
    },
    NotUnderstood,
}

/// Chooses the intent for a message that is not a follow-up of the last
/// one.
pub fn choose<'c>(data: &Dataset, catalog: &'c Catalog, s: &Session, a: &Analysis) -> Choice<'c> {
    if let Some(u) = &a.frame.unheld {
        let near = a.scores.first().and_then(|b| catalog.intent(&b.intent));
        return Choice::NotCovered {
            gap: Gap::Unheld(u.what.clone()),
            near,
        };
    }
    let ranked = rank(data, catalog, a);
    let Some(&(best_score, _)) = ranked.first().filter(|b| b.0 >= MIN_SCORE) else {
        return Choice::NotUnderstood;
    };
    // With a stated focus, a weaker intent that answers it is worth trying
    // after a stronger one that does not ("who won on Friday?" scores
    // highest on the day's schedule, which says what is on, not who won).
    let floor = if a.frame.focus.is_some() {
        FOCUS_FLOOR
    } else {
        MIN_SCORE
    };
    // "there" for the event just talked about, "they" for the party or
    // person: an intent that takes no such slot would answer about
    // everywhere or everyone ("how many votes do the Greens have there" is
    // not their seat total, "how many seats did they win" not the table).
    let there = (points_there(&a.tokens) || points_at_event(a)) && has_last_contest(s);
    let they = points_back_at_someone(data, s, a);
    let mut focus_gap: Option<&Intent> = None;
    let mut ask_later: Option<Chosen> = None;
    let mut limit_gap: Option<(&Intent, Vec<String>)> = None;
    for &(score, intent) in ranked
        .iter()
        .take(TRY_MAX)
        .filter(|x| x.0 >= floor && x.0 >= best_score * TRY_SHARE)
    {
        // The other reading holds when the conversation has an event to
        // read it against.
        let in_context = a
            .frame
            .focus_in_context
            .filter(|_| has_last_contest(s))
            .is_some_and(|f| intent.answers_focus(f));
        if let Some(f) = a.frame.focus {
            if !intent.answers_focus(f) && !in_context {
                focus_gap.get_or_insert(intent);
                continue;
            }
        }
        let takes_one_of =
            |kinds: &[EntityKind]| intent.slots.iter().any(|d| kinds.contains(&d.kind));
        if (there && !takes_one_of(&[EntityKind::Contest]))
            || (they && !takes_one_of(&[EntityKind::Group, EntityKind::Competitor]))
        {
            continue;
        }
        let filled = fill_in_context(data, s, intent, a);
        // Asking back on a weak match risks a question about nothing; a
        // stated focus the intent answers ("who was the winner?") is
        // evidence enough to ask which one.
        let focus_fits = a.frame.focus.is_some_and(|f| f != Focus::Chat);
        if matches!(filled.need, Some(Need::Missing { .. }))
            && score < MIN_SCORE_TO_ASK
            && !focus_fits
            && a.mentions.is_empty()
            && a.days.is_empty()
        {
            continue;
        }
        // A greeting that says more than a greeting ("translate hello
        // into Spanish") is a question the service does not understand.
        if intent.answers.iter().all(|f| *f == Focus::Chat) && !a.frame.unexplained.is_empty() {
            continue;
        }
        let left = leftover(data, intent, a, &filled);
        if !left.is_empty() {
            limit_gap.get_or_insert((intent, left));
            continue;
        }
        // A word nothing explains may change the question ("how many
        // world records", "medals per head of population"): answering
        // without it would answer a nearby question with confidence.
        // The reply names the longest such word: "per head of population"
        // is about population.
        if let Some(w) = stray_words(data, a, &filled)
            .into_iter()
            .max_by_key(|&w| a.tokens[w].chars().count())
        {
            return Choice::NotCovered {
                gap: Gap::Unheld(format!("anything on “{}”", a.tokens[w])),
                near: Some(intent),
            };
        }
        let unexplained = a.frame.unexplained.len() as i32;
        let confidence = score.min(1.0) * filled.certainty * UNEXPLAINED_COST.powi(unexplained);
        let chosen = Chosen {
            intent,
            filled,
            confidence,
        };
        // Asking back for a detail waits for the other intents tried: one
        // that the question fills completely answers it as asked ("who's in
        // front in the all-around and by how much" needs no athlete).
        if matches!(chosen.filled.need, Some(Need::Missing { .. })) {
            ask_later.get_or_insert(chosen);
            continue;
        }
        // Only an intent that uses what the question itself names may go
        // before asking: "who is leading?" asks which event rather than
        // answering with the medal table, and "they" after a winner and a
        // delegation asks which one is meant.
        if ask_later.is_some()
            && (chosen.filled.slots.is_empty() || (a.mentions.is_empty() && a.days.is_empty()))
        {
            break;
        }
        return Choice::Intent(chosen);
    }
    if let Some(chosen) = ask_later {
        return Choice::Intent(chosen);
    }
    if let Some((intent, limits)) = limit_gap {
        return Choice::NotCovered {
            gap: Gap::Limits(limits),
            near: Some(intent),
        };
    }
    match (a.frame.focus, focus_gap) {
        (Some(f), Some(near)) if f != Focus::Chat => Choice::NotCovered {
            gap: Gap::Focus(f),
            near: Some(near),
        },
        _ => Choice::NotUnderstood,
    }
}

/// The intents in the order they are tried, with the score each is tried
/// at. The scorer's similarity to the phrasings comes first; the frame
/// adds to it for an intent that answers what the question asks and can
/// take every name in it, most for the intent whose first declared focus it
/// is. Phrasings alone miss what a reader words differently ("how many
/// golds for Quessary so far?"), while the focus ("how many") and the kinds
/// of names given (a delegation, an award) say which question it is.
fn rank<'c>(data: &Dataset, catalog: &'c Catalog, a: &Analysis) -> Vec<(f32, &'c Intent)> {
    let mut out: Vec<(f32, &Intent)> = a
        .scores
        .iter()
        .filter_map(|s| {
            let intent = catalog.intent(&s.intent)?;
            Some((s.score + frame_bonus(data, intent, a), intent))
        })
        .collect();
    // Stable: equal scores keep the scorer's order.
    out.sort_by(|x, y| y.0.partial_cmp(&x.0).unwrap_or(std::cmp::Ordering::Equal));
    out
}

/// What the frame adds to an intent's score: nothing unless the question
/// states a focus the intent answers and names something, every name of
/// which one of the intent's slots can take.
fn frame_bonus(data: &Dataset, intent: &Intent, a: &Analysis) -> f32 {
    let Some(f) = a
        .frame
        .focus
        .filter(|f| !matches!(f, Focus::Chat | Focus::Other))
    else {
        return 0.0;
    };
    if !intent.answers_focus(f) || a.mentions.is_empty() || a.frame.unheld.is_some() {
        return 0.0;
    }
    let single_award = data.awards().len() == 1;
    let fits = a.mentions.iter().all(|m| {
        m.candidates.iter().any(|(t, _)| {
            (single_award && matches!(t, Target::Award(_)))
                || intent.slots.iter().any(|d| target_fits_kind(t, d.kind))
        })
    });
    if !fits {
        return 0.0;
    }
    if intent.answers.first() == Some(&f) {
        FRAME_BONUS_FIRST
    } else {
        FRAME_BONUS
    }
}

/// The question's words that nothing explains and that the intent, with
/// these slots, does not account for either: not the reader's name for an
/// event the data lacks (the reply says it has no such event), and not a
/// word next to a person's or group's name, which may be a piece of that
/// name as speech recognition heard it ("issov fusty sessy").
pub fn stray_words(data: &Dataset, a: &Analysis, filled: &Filled) -> Vec<usize> {
    let no_match = matches!(filled.need, Some(Need::NoMatch { .. }));
    // A word of a name the slots hold was read through the conversation
    // ("and north?" after Ashvenny South is Ashvenny North).
    let slot_words: Vec<String> = filled
        .slots
        .values()
        .filter_map(SlotValue::entity)
        .flat_map(|e| {
            crate::understand::normalize::normalize(&data.entity_name(e))
                .split(' ')
                .map(String::from)
                .collect::<Vec<_>>()
        })
        .collect();
    let named = |i: usize| {
        a.mentions.iter().any(|m| {
            (m.start..m.end).contains(&i)
                && m.candidates.iter().any(|(t, _)| {
                    matches!(
                        t,
                        Target::Entity(EntityRef::Competitor(_) | EntityRef::Group(_), _)
                    )
                })
        })
    };
    let un = &a.frame.unexplained;
    // Unexplained words in a run that touches a name.
    let beside_name = |i: usize| {
        let mut lo = i;
        while lo > 0 && un.contains(&(lo - 1)) {
            lo -= 1;
        }
        let mut hi = i;
        while un.contains(&(hi + 1)) {
            hi += 1;
        }
        (lo > 0 && named(lo - 1)) || named(hi + 1)
    };
    un.iter()
        .copied()
        // Beside a name, a word that is not English may be the rest of a
        // misspelt name ("dun varick"); an English word is the reader's
        // ("how many athletes has Kalvenmark sent").
        .filter(|&i| {
            !no_match
                && (!beside_name(i) || english::is_dictionary_word(&a.tokens[i]))
                && !slot_words.contains(&a.tokens[i])
                // An adverb ("altogether", "roughly") rarely changes what
                // is asked; it costs confidence, not the answer.
                && !english::is_softening_adverb(&a.tokens[i])
        })
        .collect()
}

/// Whether the message uses "there" for a place ("who's ahead there",
/// "how did she do there now"), not to say something exists ("is there
/// swimming today", "there are two races left").
pub fn points_there(tokens: &[String]) -> bool {
    const AFTER: &[&str] = &[
        "now",
        "so",
        "yet",
        "then",
        "too",
        "tonight",
        "today",
        "currently",
        "right",
        "at",
    ];
    const BEFORE: &[&str] = &["is", "are", "was", "were", "will", "anything", "anyone"];
    tokens.iter().enumerate().any(|(i, t)| {
        t == "there"
            && (i == 0 || !BEFORE.contains(&tokens[i - 1].as_str()))
            && tokens
                .get(i + 1)
                .is_none_or(|n| AFTER.contains(&n.as_str()))
    })
}

/// Whether the last answer was about an event.
fn has_last_contest(s: &Session) -> bool {
    let last_turn = s.recent.iter().map(|r| r.turn).max();
    s.last_slots.values().any(|v| {
        matches!(v, crate::dialogue::session::StoredSlot::Entity { entity } if entity.kind == "contest")
    }) || s
        .recent
        .iter()
        .any(|r| Some(r.turn) == last_turn && r.entity.kind == "contest")
}

/// The parts of the question the intent, with these slots, leaves out, as
/// a reply names them. Empty when it covers the whole question.
pub fn leftover(data: &Dataset, intent: &Intent, a: &Analysis, filled: &Filled) -> Vec<String> {
    let values: Vec<&SlotValue> = filled.slots.values().collect();
    // A slot still to be asked for takes what would narrow it: "who won
    // yesterday?" asks which event, among yesterday's.
    let pending_kind = match &filled.need {
        Some(Need::Missing { slot } | Need::Choose { slot, .. } | Need::NoMatch { slot, .. }) => {
            intent.slot(slot).map(|d| d.kind)
        }
        None => None,
    };
    let takes = |k: EntityKind| intent.slots.iter().any(|d| d.kind == k);
    let mut out = Vec::new();
    for m in &a.mentions {
        if mention_covered(data, m, &values, pending_kind, &takes) {
            continue;
        }
        out.push(mention_words(data, a, m));
    }
    // A day on which every contest of the data falls narrows nothing: on
    // an election night "tonight" is the whole night.
    let whole = |date| data.facts.iter().all(|f| f.start.date() == date);
    for d in &a.days {
        let covered = whole(d.date)
            || takes(EntityKind::Date)
            || matches!(pending_kind, Some(EntityKind::Contest))
            || values.iter().any(|v| match v {
                SlotValue::Entity {
                    entity: EntityRef::Contest(ci),
                } => data.facts[*ci].start.date() == d.date,
                _ => false,
            });
        if !covered {
            out.push(d.date.strftime("%A %-d %B").to_string());
        }
    }
    if let Some((_, _, n)) = a.count {
        if !takes(EntityKind::Count) {
            out.push(format!("the top {n}"));
        }
    }
    if let Some((_, _, p)) = a.frame.place {
        // "first in the medal table" is its leader.
        let first = p == Place::Nth(1) && intent.answers_focus(Focus::Who);
        if !takes(EntityKind::Place) && !first {
            out.push(match p {
                Place::Nth(n) => {
                    format!("{} place", crate::answers::words::ordinal_figure(n as u64))
                }
                Place::Last => "last place".to_string(),
            });
        }
    }
    if let Some((_, w)) = &a.frame.extreme {
        if !intent.honours_extreme(w) {
            out.push(format!("the {w}"));
        }
    }
    if a.frame.negation.is_some()
        && !intent.honours_negation()
        && !intent
            .answers
            .iter()
            .any(|f| matches!(f, Focus::Whether | Focus::Status | Focus::Open))
    {
        out.push("what did not happen".to_string());
    }
    out
}

/// Whether a name in the message is taken by the intent: a slot holds it,
/// it describes what a slot holds (the person's team, the event's sport),
/// or a slot still to be asked for would take it.
fn mention_covered(
    data: &Dataset,
    m: &Mention,
    values: &[&SlotValue],
    pending: Option<EntityKind>,
    takes: &dyn Fn(EntityKind) -> bool,
) -> bool {
    m.candidates.iter().any(|(t, _)| {
        // The scenario's only award ("seat") narrows nothing; several
        // awards named ("gold, silver and bronze") ask for all of them,
        // which an intent that takes an award gives without one.
        if let Target::Award(_) = t {
            if data.awards().len() == 1
                || (takes(EntityKind::Award)
                    && !values.iter().any(|v| matches!(v, SlotValue::Award { .. })))
            {
                return true;
            }
        }
        if let Some(k) = pending {
            if target_fits_kind(t, k) {
                return true;
            }
        }
        // A kind the intent takes but left empty (a follow-up carried it,
        // or it narrowed a person) is not a part left out.
        if let Target::Category(_) = t {
            if takes(EntityKind::Category) {
                return true;
            }
        }
        values.iter().any(|v| implied(data, t, v))
    })
}

/// Whether a slot of kind `k` would take a name of this target.
fn target_fits_kind(t: &Target, k: EntityKind) -> bool {
    matches!(
        (t, k),
        (
            Target::Entity(EntityRef::Competitor(_), _),
            EntityKind::Competitor
        ) | (Target::Entity(EntityRef::Group(_), _), EntityKind::Group)
            | (
                Target::Entity(EntityRef::Sport(_), _) | Target::SportNoun(_),
                EntityKind::Sport
            )
            | (
                Target::Entity(EntityRef::Discipline(..), _),
                EntityKind::Discipline
            )
            | (
                Target::Entity(
                    EntityRef::Contest(_) | EntityRef::Discipline(..) | EntityRef::Sport(_),
                    _
                ) | Target::Category(_)
                    | Target::Phase(_),
                EntityKind::Contest
            )
            | (Target::Category(_), EntityKind::Category)
            | (Target::Award(_), EntityKind::Award)
            | (Target::Phase(_), EntityKind::Round)
    )
}

/// Whether naming `t` is said by the slot value `v`: the value itself, or
/// a fact of it (a person's team, sport and category; a contest's sport,
/// discipline, category and round).
fn implied(data: &Dataset, t: &Target, v: &SlotValue) -> bool {
    match (t, v) {
        (Target::Entity(e, _), SlotValue::Entity { entity }) if e == entity => true,
        (
            Target::Entity(e, _),
            SlotValue::Entity {
                entity: EntityRef::Competitor(p),
            },
        ) => {
            let c = &data.competitors[*p];
            match e {
                EntityRef::Group(g) => data.group(&c.group) == Some(*g),
                EntityRef::Sport(s) => data.sport(&c.sport) == Some(*s),
                _ => false,
            }
        }
        (
            Target::SportNoun(s),
            SlotValue::Entity {
                entity: EntityRef::Competitor(p),
            },
        ) => data.sport(&data.competitors[*p].sport) == Some(*s),
        (
            Target::Category(cat),
            SlotValue::Entity {
                entity: EntityRef::Competitor(p),
            },
        ) => data.competitors[*p].category.as_deref() == Some(cat.as_str()),
        (
            Target::Entity(e, _),
            SlotValue::Entity {
                entity: EntityRef::Contest(ci),
            },
        ) => {
            let (s, d) = data.discipline_ref(*ci);
            matches!(e, EntityRef::Sport(x) if *x == s)
                || matches!(e, EntityRef::Discipline(x, y) if (*x, *y) == (s, d))
        }
        (
            Target::SportNoun(sn),
            SlotValue::Entity {
                entity: EntityRef::Contest(ci),
            },
        ) => data.discipline_ref(*ci).0 == *sn,
        (
            Target::Category(cat),
            SlotValue::Entity {
                entity: EntityRef::Contest(ci),
            },
        ) => data.contests[*ci].category.as_deref() == Some(cat.as_str()),
        (
            Target::Phase(p),
            SlotValue::Entity {
                entity: EntityRef::Contest(ci),
            },
        ) => {
            let phase = &data.contests[*ci].phase;
            phase == p || phase.starts_with(&format!("{p} "))
        }
        (
            Target::Entity(EntityRef::Sport(s), _),
            SlotValue::Entity {
                entity: EntityRef::Discipline(x, _),
            },
        ) => s == x,
        (
            Target::SportNoun(s),
            SlotValue::Entity {
                entity: EntityRef::Sport(x),
            },
        ) => s == x,
        (Target::Category(c), SlotValue::Category { value }) => c == value,
        (Target::Award(x), SlotValue::Award { value }) => x == value,
        (Target::Phase(p), SlotValue::Round { value }) => p == value,
        _ => false,
    }
}

/// How a reply names a part of the question left out: the name as the
/// data writes it, else the reader's words.
fn mention_words(data: &Dataset, a: &Analysis, m: &Mention) -> String {
    match m.candidates.first() {
        Some((Target::Entity(e, _), _)) => data.entity_name(*e),
        Some((Target::Category(c), _)) => c.clone(),
        Some((Target::Phase(p), _)) => p.clone(),
        Some((Target::Award(x), _)) => x.clone(),
        Some((Target::SportNoun(s), _)) => data.sports[*s].name.clone(),
        None => a.tokens[m.start..m.end].join(" "),
    }
}

#[cfg(test)]
mod tests {
    #[test]
    fn there_as_a_place_and_as_existence() {
        let t = |s: &str| super::points_there(&s.split(' ').map(String::from).collect::<Vec<_>>());
        assert!(t("how many votes do the greens have there"));
        assert!(t("whos ahead there now"));
        assert!(!t("is there swimming today"));
        assert!(!t("there are two races left"));
        assert!(!t("are there any results"));
    }

    use super::*;
    use crate::engine::{load, Sources};

    fn choice_for(text: &str) -> (String, Option<String>) {
        let snap = load(&Sources::default()).unwrap();
        let a = snap
            .understanding
            .analyse(text, jiff::civil::date(2027, 8, 14));
        let s = Session::new("chat", 0);
        match choose(&snap.data, &snap.catalog, &s, &a) {
            Choice::Intent(c) => (c.intent.name.clone(), None),
            Choice::NotCovered { gap, .. } => ("not covered".into(), Some(format!("{gap:?}"))),
            Choice::NotUnderstood => ("not understood".into(), None),
        }
    }

    #[test]
    fn a_word_nothing_explains_is_said_not_dropped() {
        let (got, gap) = choice_for("how many medals has Kalvenmark won relative to population");
        assert_eq!(got, "not covered");
        assert!(gap.unwrap().contains("population"));
        // Without "world" read as a name, nothing in it is about the data
        // at all: not a medal count, whichever honest reply it gets.
        let (got, _) = choice_for("how many world records have fallen at these games");
        assert!(got == "not covered" || got == "not understood", "{got}");
        // The same question without the extra words is answered.
        assert_eq!(
            choice_for("how many medals has Kalvenmark won").0,
            "delegation_medals"
        );
    }

    #[test]
    fn words_of_the_beat_and_pieces_of_names_are_not_stray() {
        // "swim" is one of the games' plain words.
        assert_eq!(
            choice_for("when does Issov Fustisessi swim next").0,
            "competitor_next"
        );
        // "fusty sessy" is how a voice channel heard the rest of a name.
        assert_eq!(
            choice_for("how did issov fusty sessy do in the two hundred freestyle").0,
            "competitor_result"
        );
    }
}
