//! What the conversation so far adds to a message: the follow-up that
//! changes one detail of the last question ("and silver?", "what about the
//! women's?", "how about Sordavia?"), the pronoun that points back at
//! someone ("when does she race next?"), and the detail a new question
//! leaves out because it was just talked about ("who got bronze?").
//!
//! Context only ever comes from the reader's own live session (it expires
//! with it) and is only used where the message leaves a gap; when it points
//! at more than one thing the reader is asked, never guessed for.

use crate::answers::ops::{EntityKind, SlotValue, Slots};
use crate::catalog::{Catalog, Intent};
use crate::dataset::{Dataset, EntityRef};
use crate::understand::classify::Scored;
use crate::understand::lexicon::Target;
use crate::understand::slots::{fill, resolve_contest, Filled, Need, MAX_OPTIONS};
use crate::understand::{Analysis, Understanding};

use super::session::{load_entity, load_slots, Session};

/// Openings that mark a message as a variation of the last question.
const CUES: &[&[&str]] = &[
    &["and", "what", "about"],
    &["and", "how", "about"],
    &["what", "about"],
    &["how", "about"],
    &["what", "of"],
    &["same", "for"],
    &["and", "for"],
    &["and", "in"],
    &["and"],
];

/// Above this score a message is its own question even if it opens with
/// "and": "and when does she race next?" asks something new, and "and who
/// won the men's 200 m?" keeps nothing (not the medal) of the last one.
const OWN_QUESTION: f32 = 0.75;

/// Longest message (in words) read as a bare fragment ("silver?", "the
/// women's") when it has no cue.
const FRAGMENT: usize = 4;

/// How many words of follow-up cue the message opens with (0 for none).
pub fn cue_len(a: &Analysis) -> usize {
    CUES.iter()
        .find(|cue| {
            a.tokens.len() >= cue.len() && a.tokens.iter().zip(cue.iter()).all(|(t, c)| t == c)
        })
        .map_or(0, |cue| cue.len())
}

/// How well the message scores as a question of its own once its cue is
/// set aside: "and who won the men's 200 m?" is a whole question, "and
/// silver?" is not.
fn own_question_score(u: &Understanding, a: &Analysis) -> f32 {
    let n = cue_len(a);
    // The cue words open the message and are never names, so they are the
    // first tokens of the abstracted form too.
    let rest = a.abstracted.get(n..).unwrap_or_default();
    u.classifier.score(rest).first().map_or(0.0, |b| b.score)
}

/// The kinds of slot a message gives a value for.
fn touched(a: &Analysis) -> Vec<EntityKind> {
    let mut kinds = Vec::new();
    for m in &a.mentions {
        let Some((t, _)) = m.candidates.first() else {
            continue;
        };
        let k = match t {
            Target::Entity(EntityRef::Competitor(_), _) => EntityKind::Competitor,
            Target::Entity(EntityRef::Group(_), _) => EntityKind::Group,
            // A sport changes the event too ("how about gymnastics?").
            Target::Entity(EntityRef::Sport(_), _) | Target::SportNoun(_) => {
                if !kinds.contains(&EntityKind::Contest) {
                    kinds.push(EntityKind::Contest);
                }
                EntityKind::Sport
            }
            Target::Entity(EntityRef::Discipline(..) | EntityRef::Contest(_), _) => {
                EntityKind::Contest
            }
            // A category on its own changes the event.
            Target::Category(_) => EntityKind::Contest,
            // A round changes the round asked about, or the event's round
            // ("and in the final?" after the heats keeps men's 100 m).
            Target::Phase(_) => EntityKind::Round,
            Target::Award(_) => EntityKind::Award,
        };
        if !kinds.contains(&k) {
            kinds.push(k);
        }
    }
    if !a.days.is_empty() {
        kinds.push(EntityKind::Date);
    }
    if a.count.is_some() {
        kinds.push(EntityKind::Count);
    }
    kinds
}

/// Whether the kinds a message touches change the event: a new event, or
/// only its round ("and in the final?").
fn changes_event(kinds: &[EntityKind]) -> bool {
    kinds
        .iter()
        .any(|k| matches!(k, EntityKind::Contest | EntityKind::Round))
}

/// Whether an intent has a slot that takes values of `kind`. A category or
/// sport can also go into an event slot ("what about the women's?").
fn takes(intent: &Intent, kind: EntityKind) -> bool {
    intent.slots.iter().any(|d| {
        d.kind == kind
            || (kind == EntityKind::Contest && d.kind == EntityKind::Category)
            || (kind == EntityKind::Sport && d.kind == EntityKind::Contest)
            || (kind == EntityKind::Round && d.kind == EntityKind::Contest)
    })
}

/// A variation of the last question: its intent and its slots, with the
/// ones the message changes taken out (or, for the event, already
/// replaced), so filling from the message completes them. `None` when the
/// message is not read as a variation.
pub fn variation<'c>(
    data: &Dataset,
    catalog: &'c Catalog,
    understanding: &Understanding,
    s: &Session,
    a: &Analysis,
    best: Option<&Scored>,
) -> Option<(&'c Intent, Slots)> {
    let last = catalog.intent(s.last_intent.as_deref()?)?;
    let kinds = touched(a);
    let last_contest = s.last_slots.iter().find_map(|(name, v)| match v {
        super::session::StoredSlot::Entity { entity } if entity.kind == "contest" => {
            match load_entity(data, entity)? {
                EntityRef::Contest(ci) => Some((name.clone(), ci)),
                _ => None,
            }
        }
        _ => None,
    });
    // Nothing named, but a word that turns the last contest into another:
    // "and the north?" after Ashvenny South.
    let sibling = match (&last_contest, kinds.is_empty()) {
        (Some((_, old)), true) => sibling_contest(data, *old, a),
        _ => None,
    };
    if (kinds.is_empty() && sibling.is_none()) || !kinds.iter().all(|k| takes(last, *k)) {
        return None;
    }
    let best_score = best.map(|b| b.score).unwrap_or(0.0);
    let cue = cue_len(a) > 0;
    let fragment =
        a.tokens.len() <= FRAGMENT && best_score < crate::understand::classify::MIN_SCORE;
    let follows = if cue {
        own_question_score(understanding, a) < OWN_QUESTION
    } else {
        fragment
    };
    if !follows {
        return None;
    }
    let mut slots = load_slots(data, &s.last_slots);
    if let (Some(ci), Some((name, _))) = (sibling, &last_contest) {
        slots.insert(
            name.clone(),
            SlotValue::Entity {
                entity: EntityRef::Contest(ci),
            },
        );
        return Some((last, slots));
    }
    for def in &last.slots {
        let changed = kinds.contains(&def.kind)
            || (def.kind == EntityKind::Category && kinds.contains(&EntityKind::Contest));
        if changed {
            slots.remove(&def.name);
        }
    }
    if changes_event(&kinds) {
        let old = s.last_slots.iter().find_map(|(name, v)| match v {
            super::session::StoredSlot::Entity { entity } if entity.kind == "contest" => {
                Some((name.clone(), load_entity(data, entity)?))
            }
            _ => None,
        });
        if let Some((name, EntityRef::Contest(old))) = old {
            match varied_contest(data, old, a) {
                Some(ci) => {
                    slots.insert(
                        name,
                        SlotValue::Entity {
                            entity: EntityRef::Contest(ci),
                        },
                    );
                }
                // No such round of that event: the old one is not what
                // was asked, so the message (or a question back) fills it.
                None => {
                    slots.remove(&name);
                }
            }
        }
    }
    Some((last, slots))
}

/// The one contest named like the last one but for a single word, which
/// the message says: "and the north?" after Ashvenny South is Ashvenny
/// North. `None` when no contest, or several, fit.
fn sibling_contest(data: &Dataset, old: usize, a: &Analysis) -> Option<usize> {
    let words = |ci: usize| -> Vec<String> {
        crate::understand::normalize::normalize(&data.contest_name(ci))
            .split(' ')
            .map(str::to_string)
            .collect()
    };
    let before = words(old);
    let fits: Vec<usize> = (0..data.contests.len())
        .filter(|&ci| ci != old)
        .filter(|&ci| {
            let after = words(ci);
            if after.len() != before.len() {
                return false;
            }
            let differ: Vec<usize> = (0..after.len())
                .filter(|&k| after[k] != before[k])
                .collect();
            // A word, not a number: "top 2" after heat 1 is a count, never
            // heat 2.
            matches!(differ.as_slice(), [k] if after[*k].len() >= 3
                && after[*k].chars().all(char::is_alphabetic)
                && a.tokens.iter().any(|t| *t == after[*k]))
        })
        .collect();
    match fits.as_slice() {
        [one] => Some(*one),
        _ => None,
    }
}

/// The event a follow-up means, given the last one: a new event named in
/// full, or the last one with its category or phase changed ("the women's",
/// "in the final"). `None` leaves it to slot filling, which asks when
/// several fit and says so when none does.
fn varied_contest(data: &Dataset, old: usize, a: &Analysis) -> Option<usize> {
    let oc = &data.contests[old];
    let pick_like_old = |options: &[usize]| -> Option<usize> {
        // Several events fit the new words: keep those like the last one.
        let same_cat: Vec<usize> = options
            .iter()
            .copied()
            .filter(|&ci| data.contests[ci].category == oc.category)
            .collect();
        match same_cat.as_slice() {
            [one] => Some(*one),
            _ => None,
        }
    };
    match resolve_contest(data, a, &Slots::new()) {
        Ok(Some(ci)) => return Some(ci),
        Err(Some(options)) => {
            let cis: Vec<usize> = options
                .iter()
                .filter_map(|e| match e {
                    EntityRef::Contest(ci) => Some(*ci),
                    _ => None,
                })
                .collect();
            return pick_like_old(&cis);
        }
        Err(None) => return None,
        Ok(None) => {}
    }
    // Only a category or a phase was named: the same discipline with that
    // changed, everything else as before.
    let mut category = oc.category.clone();
    let mut phase: Option<String> = None;
    for m in &a.mentions {
        match m.candidates.first() {
            Some((Target::Category(c), _)) => category = Some(c.clone()),
            Some((Target::Phase(p), _)) => phase = Some(p.clone()),
            _ => {}
        }
    }
    let disc = data.discipline_ref(old);
    let fits: Vec<usize> = (0..data.contests.len())
        .filter(|&ci| {
            let c = &data.contests[ci];
            data.discipline_ref(ci) == disc
                && c.category == category
                && match &phase {
                    Some(p) => c.phase == *p || c.phase.starts_with(&format!("{p} ")),
                    None => c.phase == oc.phase,
                }
        })
        .collect();
    match fits.as_slice() {
        [one] => Some(*one),
        _ => None,
    }
}

/// What a word in the message points back at.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Pointer {
    /// "she", "her": a woman competitor.
    She,
    /// "he", "him": a man competitor.
    He,
    /// "they", "them": a group, or a competitor of any category.
    They,
    /// "that race", "it": an event.
    That,
    /// "that" or "this" ending a question ("which party is that?", "who's
    /// that?"): whoever or whatever the last answer was about.
    Whatever,
}

/// Whether the message ends by pointing with "that" or "this" after a
/// verb: "which party is that", "who was this".
pub fn ends_pointing(tokens: &[String]) -> bool {
    let n = tokens.len();
    n >= 2
        && matches!(tokens[n - 1].as_str(), "that" | "this")
        && matches!(tokens[n - 2].as_str(), "is" | "was" | "s")
}

/// The pronouns in a message, in order, each as often as it occurs: "did
/// she beat her?" points at two people.
fn pointers(a: &Analysis) -> Vec<Pointer> {
    pointers_at(a).into_iter().map(|(_, p)| p).collect()
}

/// The same, each with the token it is at.
fn pointers_at(a: &Analysis) -> Vec<(usize, Pointer)> {
    let mut out = Vec::new();
    for (i, t) in a.tokens.iter().enumerate() {
        let p = match t.as_str() {
            "she" | "her" | "hers" | "herself" => Some(Pointer::She),
            "he" | "him" | "his" | "himself" => Some(Pointer::He),
            "they" | "them" | "their" | "theirs" | "themselves" => Some(Pointer::They),
            "it" | "its" => Some(Pointer::That),
            "that" | "this" if i + 1 == a.tokens.len() && ends_pointing(&a.tokens) => {
                Some(Pointer::Whatever)
            }
            "that" | "this" | "same" => a
                .tokens
                .get(i + 1)
                .filter(|n| {
                    matches!(
                        n.as_str(),
                        "race"
                            | "event"
                            | "final"
                            | "contest"
                            | "heat"
                            | "match"
                            | "game"
                            | "ward"
                            | "seat"
                            | "constituency"
                            | "fixture"
                    )
                })
                .map(|_| Pointer::That),
            _ => None,
        };
        out.extend(p.map(|p| (i, p)));
    }
    // "and which party?" points at whoever the last answer was about.
    if out.is_empty()
        && a.mentions.is_empty()
        && crate::understand::frame::bare_group_question(&a.tokens)
    {
        out.push((a.tokens.len(), Pointer::Whatever));
    }
    out
}

/// Whether the message points at an event with "that ward", "this race":
/// an intent that takes no event would answer about every event.
pub fn points_at_event(a: &Analysis) -> bool {
    pointers_at(a).iter().any(|(i, p)| {
        *p == Pointer::That && matches!(a.tokens[*i].as_str(), "that" | "this" | "same")
    })
}

/// Whether the message points with "they" or "them" at someone the last
/// question was about: "how many seats did they win" after a party is that
/// party's seats, not the whole table.
pub fn points_back_at_someone(data: &Dataset, s: &Session, a: &Analysis) -> bool {
    pointers(a).contains(&Pointer::They)
        && load_slots(data, &s.last_slots).values().any(|v| {
            matches!(
                v.entity(),
                Some(EntityRef::Group(_) | EntityRef::Competitor(_))
            )
        })
}

/// The pronouns that can stand for a slot of this kind.
fn pointers_for(kind: EntityKind) -> &'static [Pointer] {
    match kind {
        EntityKind::Competitor => &[Pointer::She, Pointer::He, Pointer::They, Pointer::Whatever],
        EntityKind::Group => &[Pointer::They, Pointer::Whatever],
        EntityKind::Contest => &[Pointer::That, Pointer::Whatever],
        _ => &[],
    }
}

/// Whether the message has a pronoun that could stand for this kind: then
/// the slot is the pronoun's business, and nothing else is carried into it.
pub fn points_at(a: &Analysis, kind: EntityKind) -> bool {
    let wanted = pointers_for(kind);
    pointers(a).iter().any(|p| wanted.contains(p))
}

/// What recent entity a pointer of the right kind means: among those of
/// the latest turn that named anything, the most salient (asked about, else
/// the answer's subjects, else the rest), leaving out entities already
/// used in this message. An older turn is never reached back to: after
/// "who won the women's 400 m?" and a question about an event in progress,
/// "she" does not mean the 400 m winner. Several means the reader must say
/// which.
fn referents(
    data: &Dataset,
    s: &Session,
    kind: EntityKind,
    p: Pointer,
    used: &[EntityRef],
) -> Vec<EntityRef> {
    let fits = |e: EntityRef| match (kind, e, p) {
        (EntityKind::Competitor, EntityRef::Competitor(i), Pointer::She) => {
            data.competitors[i].category.as_deref() != Some("men")
        }
        (EntityKind::Competitor, EntityRef::Competitor(i), Pointer::He) => {
            data.competitors[i].category.as_deref() != Some("women")
        }
        (EntityKind::Competitor, EntityRef::Competitor(_), Pointer::They) => true,
        (EntityKind::Group, EntityRef::Group(_), Pointer::They) => true,
        (EntityKind::Contest, EntityRef::Contest(_), Pointer::That) => true,
        (EntityKind::Competitor, EntityRef::Competitor(_), Pointer::Whatever)
        | (EntityKind::Group, EntityRef::Group(_), Pointer::Whatever)
        | (EntityKind::Contest, EntityRef::Contest(_), Pointer::Whatever) => true,
        _ => false,
    };
    let Some(turn) = s.recent.iter().map(|r| r.turn).max() else {
        return vec![];
    };
    let found: Vec<(EntityRef, u64, super::session::Salience)> = s
        .recent
        .iter()
        .filter(|r| r.turn == turn)
        .filter_map(|r| {
            let e = load_entity(data, &r.entity)?;
            (fits(e) && !used.contains(&e)).then_some((e, r.turn, r.salience))
        })
        .collect();
    let Some(top) = found.iter().filter(|f| f.1 == turn).map(|f| f.2).min() else {
        return vec![];
    };
    found
        .iter()
        .filter(|f| f.1 == turn && f.2 == top)
        .map(|f| f.0)
        .take(MAX_OPTIONS)
        .collect()
}

/// Fills the intent's open slots that a pronoun in the message points at.
/// Returns a question when a pronoun fits several recent entities.
pub fn resolve_pointers(
    data: &Dataset,
    s: &Session,
    intent: &Intent,
    a: &Analysis,
    slots: &mut Slots,
) -> Option<Need> {
    let mut ps = pointers_at(a);
    if ps.is_empty() {
        return None;
    }
    // Where the message first names each kind, to keep the order of two
    // slots of one kind: "is she ahead of Rhosyn Dretholm" asks about her.
    let first_named = |kind: EntityKind| {
        a.mentions
            .iter()
            .filter(|m| {
                m.candidates.first().is_some_and(|(t, _)| match (t, kind) {
                    (Target::Entity(EntityRef::Competitor(_), _), EntityKind::Competitor)
                    | (Target::Entity(EntityRef::Group(_), _), EntityKind::Group) => true,
                    _ => false,
                })
            })
            .map(|m| m.start)
            .min()
    };
    // Names in the message fill their slots first (a person named in full
    // is never also "she"); each pronoun then stands for one slot, and two
    // slots never get the same entity ("did she beat her?").
    let named = touched(a);
    let mut used: Vec<EntityRef> = slots.values().filter_map(SlotValue::entity).collect();
    for m in &a.mentions {
        if let Some((Target::Entity(e, _), _)) = m.candidates.first() {
            used.push(*e);
        }
    }
    let mut named_left: Vec<EntityKind> = named;
    for def in &intent.slots {
        if slots.contains_key(&def.name) {
            continue;
        }
        let wanted = pointers_for(def.kind);
        if let Some(i) = named_left.iter().position(|k| *k == def.kind) {
            // The message names one of this kind: it fills this slot,
            // unless a pronoun comes before the name and another slot of
            // this kind is left for the name.
            let open = intent
                .slots
                .iter()
                .filter(|d| d.kind == def.kind && !slots.contains_key(&d.name))
                .count();
            let named_of_kind = named_left.iter().filter(|k| **k == def.kind).count();
            let before = first_named(def.kind)
                .is_some_and(|at| ps.iter().any(|(p_at, p)| *p_at < at && wanted.contains(p)));
            if !(before && open > named_of_kind) {
                named_left.remove(i);
                continue;
            }
        }
        let Some(i) = ps.iter().position(|(_, p)| wanted.contains(p)) else {
            continue;
        };
        let (_, p) = ps.remove(i);
        match referents(data, s, def.kind, p, &used).as_slice() {
            [] => {}
            [one] => {
                used.push(*one);
                slots.insert(def.name.clone(), SlotValue::Entity { entity: *one });
            }
            many => {
                return Some(Need::Choose {
                    slot: def.name.clone(),
                    options: many.to_vec(),
                })
            }
        }
    }
    None
}

/// A value for a required slot the message left out, from the last
/// question's slots of the same kind: "who got bronze?" right after the
/// 400 m means the 400 m. Only one value of that kind may fit.
///
/// An event carried over takes the category or round the message names:
/// "who is leading the men's?" right after the women's high jump means the
/// men's high jump, never the women's.
pub fn carried_over(
    data: &Dataset,
    s: &Session,
    intent: &Intent,
    slot: &str,
    a: &Analysis,
) -> Option<SlotValue> {
    let def = intent.slot(slot)?;
    let last = load_slots(data, &s.last_slots);
    let mut same_kind = last.values().filter(|v| v.kind() == def.kind);
    let Some(v) = same_kind.next() else {
        return there_in_last_answer(data, s, def.kind, a);
    };
    if same_kind.next().is_some() {
        return None;
    }
    match v {
        SlotValue::Entity {
            entity: EntityRef::Contest(old),
        } if changes_event(&touched(a)) => {
            varied_contest(data, *old, a).map(|ci| SlotValue::Entity {
                entity: EntityRef::Contest(ci),
            })
        }
        // "who is leading in the north?" right after Ashvenny South means
        // Ashvenny North, never the South again.
        SlotValue::Entity {
            entity: EntityRef::Contest(old),
        } => Some(SlotValue::Entity {
            entity: EntityRef::Contest(sibling_contest(data, *old, a).unwrap_or(*old)),
        }),
        other => Some(other.clone()),
    }
}

/// The one event the last answer named, for "there" after a question that
/// named none: "what party is she?" is answered "… in Fennick Green", and
/// "how did the Lanterns do there?" means Fennick Green.
fn there_in_last_answer(
    data: &Dataset,
    s: &Session,
    kind: EntityKind,
    a: &Analysis,
) -> Option<SlotValue> {
    if kind != EntityKind::Contest || !super::choose::points_there(&a.tokens) {
        return None;
    }
    let turn = s.recent.iter().map(|r| r.turn).max()?;
    let mut contests = s
        .recent
        .iter()
        .filter(|r| r.turn == turn)
        .filter_map(|r| load_entity(data, &r.entity))
        .filter(|e| matches!(e, EntityRef::Contest(_)));
    let one = contests.next()?;
    contests
        .next()
        .is_none()
        .then_some(SlotValue::Entity { entity: one })
}

/// Fills the intent's slots from the message, then from the conversation:
/// pronouns first ("she"), then details the last question had and this one
/// leaves out.
pub fn fill_in_context(data: &Dataset, s: &Session, intent: &Intent, a: &Analysis) -> Filled {
    let mut carried = Slots::new();
    let pointed = resolve_pointers(data, s, intent, a, &mut carried);
    let mut filled = fill(data, intent, a, &carried);
    if pointed.is_some() {
        filled.need = pointed;
        return filled;
    }
    // Each round fills one missing slot; an intent has only a few.
    for _ in 0..intent.slots.len() {
        let Some(Need::Missing { slot }) = &filled.need else {
            break;
        };
        // "she" that fits nobody is asked about, never replaced by whoever
        // the last question was about.
        if intent.slot(slot).is_some_and(|d| points_at(a, d.kind)) {
            break;
        }
        let Some(v) = carried_over(data, s, intent, slot, a) else {
            break;
        };
        carried.insert(slot.clone(), v);
        filled = fill(data, intent, a, &carried);
    }
    filled
}
