//! One turn of a conversation, as a pure function of the snapshot (data,
//! catalog, understanding), the session and the message. Storage and HTTP
//! stay outside, so the logic is tested without either.

use std::collections::{BTreeMap, HashMap};
use std::sync::LazyLock;

use jiff::ZonedDateTime;
use serde::{Deserialize, Serialize};

use super::choose::{self, Choice, Gap};
use super::context;
use super::session::{load_entity, load_slots, store_entity, store_slots, Pending, Session};
use crate::answers::channel::Profile;
use crate::answers::ops::{EntityKind, OpInput, OpOutput, OutcomeClass, SlotValue, Slots};
use crate::answers::realise::{realise, realise_text, Realised};
use crate::answers::value::{Style, Value};
use crate::catalog::{Catalog, Intent, Template};
use crate::dataset::{Dataset, EntityRef};
use crate::understand::classify::Scored;
use crate::understand::frame::Focus;
use crate::understand::lexicon::Target;
use crate::understand::slots::{fill, resolve_contest, sport_noun, Need};
use crate::understand::{Analysis, Understanding};

pub use crate::understand::classify::{MIN_SCORE, MIN_SCORE_TO_ASK};

/// What kind of reply this is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, schemars::JsonSchema)]
#[serde(rename_all = "snake_case")]
pub enum Outcome {
    /// A fact from the data.
    Answered,
    /// A question back: a missing or ambiguous detail.
    Clarify,
    /// No intent fits the message.
    NotUnderstood,
    /// The data has nothing to give yet (not decided, no such result).
    NoData,
    /// The question is understood well enough to say what it asks, and
    /// neither the data nor any intent holds that (an athlete's height, a
    /// count limited in a way no intent can limit it). The reply says what
    /// is not known instead of answering a nearby question.
    NotCovered,
}

/// A filled slot as shown in replies.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize, schemars::JsonSchema)]
pub struct SlotOut {
    pub kind: EntityKind,
    /// Stable id (entity id, ISO 8601 date, number).
    pub value: String,
    /// How it reads.
    pub text: String,
}

/// An option offered in a clarifying question.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize, schemars::JsonSchema)]
pub struct OptionOut {
    pub kind: String,
    pub id: String,
    pub text: String,
}

/// The reply to one message.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize, schemars::JsonSchema)]
pub struct Reply {
    pub text: String,
    pub intent: Option<String>,
    pub slots: BTreeMap<String, SlotOut>,
    pub outcome: Outcome,
    /// What the reply answers (`who`, `count`, `margin`...): the focus of
    /// the question as understood, which the intent declares it answers.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub focus: Option<String>,
    /// The operation's own outcome name ("scheduled", "award"...).
    pub detail: Option<String>,
    /// How sure the service is of the intent and names, from 0 to 1.
    pub confidence: f32,
    /// Options of a clarifying question.
    pub options: Vec<OptionOut>,
    /// Facts behind the answer, for checking and for richer clients.
    #[serde(serialize_with = "crate::engine::in_key_order")]
    pub facts: HashMap<String, Value>,
    /// The best intents and why.
    pub candidates: Vec<Scored>,
    /// The SSML 1.1 document, on channels that speak.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub ssml: Option<String>,
    /// The text with light emphasis (Markdown bold), on channels that show it.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub markdown: Option<String>,
    /// Follow-up questions the reader can send as they are, on channels
    /// that offer quick replies.
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub quick_replies: Vec<String>,
    /// Questions this turn leaves unanswered, as (normalised text, kind),
    /// for the editors' unanswered list; never sent to the client.
    #[serde(skip)]
    pub unanswered: Vec<(String, &'static str)>,
}

/// Everything a turn reads that is not the session.
pub struct TurnContext<'a> {
    pub data: &'a Dataset,
    pub catalog: &'a Catalog,
    pub understanding: &'a Understanding,
    pub now: &'a ZonedDateTime,
    /// The channel's profile: words, length, SSML, quick replies.
    pub channel: &'a Profile,
    /// After how long without an update live figures are said to be old.
    pub stale_after: std::time::Duration,
}

impl TurnContext<'_> {
    /// Wording realised for the channel.
    fn say(&self, t: &Template, values: &HashMap<String, Value>) -> Realised {
        realise(self.channel, t, values, None)
    }

    /// The service wording `key` for this channel.
    fn service(&self, key: &str, default: &Template, values: &HashMap<String, Value>) -> Realised {
        let t = self
            .catalog
            .service
            .for_channel(&self.channel.name, key, default);
        self.say(t, values)
    }
}

/// The closing sentence of answers on channels that cite freshness.
static FRESHNESS: LazyLock<Template> =
    LazyLock::new(|| Template::parse("As of {as_of}.").expect("fixed wording parses"));

const RESET: &[&str] = &[
    "start over",
    "start again",
    "never mind",
    "nevermind",
    "forget it",
    "reset",
    "cancel",
];

/// Handles one message. Returns the reply and the session to store. The
/// reply lists what the turn leaves unanswered: the message itself when no
/// intent fits, and a question asked back about that the reader left.
pub fn turn(ctx: &TurnContext, session: Session, text: &str) -> (Reply, Session) {
    let before = session.pending.clone();
    let (mut reply, mut s, answered_pending) = turn_inner(ctx, session, text);
    let asked = crate::understand::normalize::normalize(&crate::privacy::mask(text));
    if let Some(p) = s.pending.as_mut().filter(|p| p.asked.is_empty()) {
        // A question asked back while answering another is still about the
        // first question.
        p.asked = match &before {
            Some(b) if answered_pending => b.asked.clone(),
            _ => asked.clone(),
        };
    }
    if let Some(b) = before.filter(|b| !answered_pending && !b.asked.is_empty()) {
        reply.unanswered.push((b.asked, "abandoned"));
    }
    if reply.outcome == Outcome::NotUnderstood && !asked.is_empty() {
        reply.unanswered.push((asked, "not_understood"));
    } else if reply.outcome == Outcome::NotCovered && !asked.is_empty() {
        reply.unanswered.push((asked, "not_covered"));
    }
    (reply, s)
}

fn turn_inner(ctx: &TurnContext, session: Session, text: &str) -> (Reply, Session, bool) {
    let mut s = session;
    s.turn += 1;
    s.updated_at = ctx.now.timestamp().as_second();
    let a = ctx.understanding.analyse(text, ctx.now.date());

    if RESET
        .iter()
        .any(|r| a.normalized == *r || a.normalized.trim_end_matches(" please") == *r)
    {
        let channel = s.channel.clone();
        let mut fresh = Session::new(&channel, s.updated_at);
        fresh.turn = s.turn;
        fresh.created_at = s.created_at;
        let said = ctx.service("reset", &ctx.catalog.service.reset, &HashMap::new());
        return (
            plain_reply(said, Outcome::Answered, None, 1.0, &a),
            fresh,
            false,
        );
    }

    if let Some(p) = s.pending.take() {
        if let Some(reply) = answer_pending(ctx, &mut s, &p, &a) {
            return (reply, s, true);
        }
    }

    let best = a.scores.first();
    // A variation of the last question ("and silver?") before anything else:
    // read on its own it would fit no intent, or the wrong one.
    let (intent, filled, confidence) = if let Some((intent, carried)) =
        context::variation(ctx.data, ctx.catalog, ctx.understanding, &s, &a, best)
    {
        let filled = fill(ctx.data, intent, &a, &carried);
        let confidence = filled.certainty;
        // A variation asks what the last question asked, unless it says
        // otherwise ("and now?").
        s.last_settled = (s.last_settled || a.frame.settled) && !a.frame.live;
        (intent, filled, confidence)
    } else {
        s.last_settled = a.frame.settled;
        match choose::choose(ctx.data, ctx.catalog, &s, &a) {
            Choice::Intent(c) => (c.intent, c.filled, c.confidence),
            Choice::NotUnderstood => return (not_understood(ctx, &a), s, false),
            Choice::NotCovered { gap, near } => {
                return (not_covered(ctx, &a, &gap, near), s, false);
            }
        }
    };
    let reply = proceed(
        ctx,
        &mut s,
        intent,
        filled.slots,
        filled.need,
        confidence,
        &a,
    );
    (reply, s, false)
}

/// Runs the intent, or asks for what is still needed.
fn proceed(
    ctx: &TurnContext,
    s: &mut Session,
    intent: &Intent,
    slots: Slots,
    need: Option<Need>,
    confidence: f32,
    a: &Analysis,
) -> Reply {
    match need {
        Some(Need::Missing { slot }) => {
            let def = intent
                .slot(&slot)
                .expect("fill only names the intent's slots");
            remember_asked(ctx.data, s, &slots);
            s.pending = Some(Pending {
                intent: intent.name.clone(),
                slots: store_slots(ctx.data, &slots),
                slot,
                options: vec![],
                asked: String::new(),
            });
            let mut r = plain_reply(
                realise_text(ctx.channel, &def.ask),
                Outcome::Clarify,
                Some(intent),
                confidence,
                a,
            );
            r.slots = slots_out(ctx.data, &slots);
            r
        }
        Some(Need::Choose { slot, options }) => {
            ask_choice(ctx, s, intent, slots, &slot, options, confidence, a)
        }
        Some(Need::NoMatch { what, .. }) => {
            let text = if what.is_empty() {
                "I could not find that event in the results.".to_string()
            } else {
                format!(
                    "I don't have {} {what} in the results.",
                    crate::answers::words::indefinite_article(&what)
                )
            };
            s.last_intent = Some(intent.name.clone());
            s.last_slots = store_slots(ctx.data, &slots);
            plain_reply(
                realise_text(ctx.channel, &text),
                Outcome::NoData,
                Some(intent),
                confidence,
                a,
            )
        }
        None => run(ctx, s, intent, slots, confidence, a),
    }
}

#[allow(clippy::too_many_arguments)]
fn ask_choice(
    ctx: &TurnContext,
    s: &mut Session,
    intent: &Intent,
    slots: Slots,
    slot: &str,
    options: Vec<EntityRef>,
    confidence: f32,
    a: &Analysis,
) -> Reply {
    let labels: Vec<String> = options.iter().map(|e| describe(ctx.data, *e)).collect();
    let noun = options_noun(ctx.data, &options);
    let mut values = HashMap::new();
    let spoken: Vec<Value> = options
        .iter()
        .zip(&labels)
        .map(|(e, text)| Value::Dual {
            text: text.clone(),
            spoken: describe_spoken(ctx.data, *e),
        })
        .collect();
    values.insert("options".to_string(), Value::List(spoken));
    values.insert("noun".to_string(), Value::Text(noun.to_string()));
    let said = ctx.service("choose", &ctx.catalog.service.choose, &values);
    remember_asked(ctx.data, s, &slots);
    s.pending = Some(Pending {
        intent: intent.name.clone(),
        slots: store_slots(ctx.data, &slots),
        slot: slot.to_string(),
        options: options.iter().map(|e| store_entity(ctx.data, *e)).collect(),
        asked: String::new(),
    });
    let mut r = plain_reply(said, Outcome::Clarify, Some(intent), confidence, a);
    r.slots = slots_out(ctx.data, &slots);
    r.options = options
        .iter()
        .zip(labels)
        .map(|(e, text)| {
            let st = store_entity(ctx.data, *e);
            OptionOut {
                kind: st.kind,
                id: st.id,
                text,
            }
        })
        .collect();
    r
}

/// What the reader named is worth pointing back at even while a detail is
/// still asked for ("did A beat B?" … "when does she race next?").
fn remember_asked(data: &Dataset, s: &mut Session, slots: &Slots) {
    let asked: Vec<EntityRef> = slots.values().filter_map(SlotValue::entity).collect();
    if !asked.is_empty() {
        s.remember(data, &asked, &[], &[]);
    }
}

fn run(
    ctx: &TurnContext,
    s: &mut Session,
    intent: &Intent,
    slots: Slots,
    confidence: f32,
    a: &Analysis,
) -> Reply {
    let topics = ctx.catalog.topics();
    let input = OpInput {
        data: ctx.data,
        slots: &slots,
        now: ctx.now,
        settings: &intent.settings,
        topics: &topics,
        stale_after: ctx.stale_after,
    };
    match (intent.operation.run)(&input) {
        OpOutput::Choose { slot, options } if options.is_empty() => proceed(
            ctx,
            s,
            intent,
            slots,
            Some(Need::Missing {
                slot: slot.to_string(),
            }),
            confidence,
            a,
        ),
        OpOutput::Choose { slot, options } => {
            ask_choice(ctx, s, intent, slots, slot, options, confidence, a)
        }
        OpOutput::Done {
            outcome,
            facts,
            mentioned,
            subjects,
        } => {
            let spec = intent
                .operation
                .outcome(outcome)
                .expect("operations return declared outcomes");
            let mut values: HashMap<String, Value> = facts.clone();
            for (k, v) in &slots {
                values
                    .entry(k.clone())
                    .or_insert_with(|| Value::Text(v.display(ctx.data)));
            }
            values.insert("as_of".into(), ctx.as_of());
            let wording = intent.reply_for(&ctx.channel.name, outcome);
            // A question of when or where is answered only by wording that
            // says it: "Counting is under way" does not say when Caddenmill
            // declares, nor where it is counted.
            if let Some(f @ (Focus::When | Focus::Where)) = a.frame.focus {
                let says_it = wording.is_none_or(|t| wording_gives(t, f, &values));
                if spec.class != OutcomeClass::NoData && !says_it {
                    return not_covered(ctx, a, &Gap::Focus(f), Some(intent));
                }
            }
            let said = wording
                .map(|t| {
                    let fresh = intent.operation.from_data().then_some(&*FRESHNESS);
                    realise(ctx.channel, t, &values, fresh)
                })
                .unwrap_or_default();
            let quick_replies = quick_replies(ctx, intent, &slots);
            // Greetings, thanks and help are said between questions: the
            // next "and in Y?" still follows the last question.
            if !intent.answers_focus(Focus::Chat) {
                s.last_intent = Some(intent.name.clone());
                s.last_slots = store_slots(ctx.data, &slots);
            }
            let asked: Vec<EntityRef> = slots.values().filter_map(SlotValue::entity).collect();
            s.remember(ctx.data, &asked, &subjects, &mentioned);
            let class = match spec.class {
                OutcomeClass::Answered => Outcome::Answered,
                OutcomeClass::NoData => Outcome::NoData,
                // "Is she ahead?" is answered by the count so far; "did
                // she win?" is not, until the count ends.
                OutcomeClass::SoFar if s.last_settled => Outcome::NoData,
                OutcomeClass::SoFar => Outcome::Answered,
            };
            Reply {
                text: said.text,
                intent: Some(intent.name.clone()),
                slots: slots_out(ctx.data, &slots),
                outcome: class,
                focus: a
                    .frame
                    .focus
                    .filter(|f| intent.answers_focus(*f))
                    .or_else(|| intent.answers.first().copied())
                    .map(|f| f.name().to_string()),
                detail: Some(outcome.to_string()),
                confidence,
                options: vec![],
                facts,
                candidates: a.scores.iter().take(3).cloned().collect(),
                ssml: said.ssml,
                markdown: said.markdown,
                quick_replies,
                unanswered: vec![],
            }
        }
    }
}

/// Whether a wording, with these values, says when (a start, a day, a
/// date, or that it is on now) or where (a venue, the contests someone is
/// in) something is.
fn wording_gives(t: &Template, f: Focus, values: &HashMap<String, Value>) -> bool {
    const WHEN: &[&str] = &["start", "day", "date", "next", "after_start", "items"];
    const WHERE: &[&str] = &["venue", "contests"];
    let fields = if f == Focus::When { WHEN } else { WHERE };
    let filled = t
        .names()
        .iter()
        .any(|n| fields.contains(n) && values.contains_key(*n));
    filled
        || (f == Focus::When
            && t.source()
                .split(|c: char| !c.is_alphanumeric())
                .any(|w| w == "now"))
}

/// Tries to read the message as the answer to the pending question. `None`
/// means it is not an answer, and the message is handled as a new question
/// (the pending question is dropped).
fn answer_pending(ctx: &TurnContext, s: &mut Session, p: &Pending, a: &Analysis) -> Option<Reply> {
    let intent = ctx.catalog.intent(&p.intent)?;
    let carried = load_slots(ctx.data, &p.slots);
    // A clearly different question wins over a loose answer: it scores
    // high for another intent and says more than a name ("how many medals
    // has Bendand won?" is not the answer "Bendand").
    let new_question = a
        .scores
        .first()
        .is_some_and(|b| b.score >= 0.75 && b.intent != p.intent && own_words(a) >= 2);
    if p.options.is_empty() {
        // The service asked for a missing detail: the message answers it if
        // it fills that slot, or brings up something to ask about instead.
        if new_question {
            return None;
        }
        let filled = fill(ctx.data, intent, a, &carried);
        let answers = filled.slots.contains_key(&p.slot)
            || filled
                .need
                .as_ref()
                .is_some_and(|n| !matches!(n, Need::Missing { slot } if *slot == p.slot));
        return answers.then(|| {
            proceed(
                ctx,
                s,
                intent,
                filled.slots,
                filled.need,
                filled.certainty,
                a,
            )
        });
    }
    let options: Vec<EntityRef> = p
        .options
        .iter()
        .filter_map(|o| load_entity(ctx.data, o))
        .collect();
    if names_another(ctx.data, &options, a) {
        return None;
    }
    let value = match pick(ctx.data, &options, a) {
        Picked::One(e) if !new_question => SlotValue::Entity { entity: e },
        Picked::Some(narrowed) if !new_question => {
            return Some(ask_choice(
                ctx, s, intent, carried, &p.slot, narrowed, 1.0, a,
            ));
        }
        _ => return None,
    };
    let mut slots = carried;
    slots.insert(p.slot.clone(), value);
    // Fill anything else the intent still needs from this message.
    let filled = fill(ctx.data, intent, a, &slots);
    Some(proceed(ctx, s, intent, filled.slots, filled.need, 1.0, a))
}

/// Words of the message other than names and filler: what makes it a
/// question of its own rather than a pick.
fn own_words(a: &Analysis) -> usize {
    const FILLER: [&str; 9] = [
        "the", "a", "an", "one", "i", "mean", "please", "that", "from",
    ];
    a.abstracted
        .iter()
        .filter(|t| !t.starts_with('<') && !FILLER.contains(&t.as_str()))
        .count()
}

/// Whether the message names something of the options' kind that is not
/// among them: then it asks about that instead ("who was first in the
/// men's 400 m?" while asked which 200 m was meant).
fn names_another(data: &Dataset, options: &[EntityRef], a: &Analysis) -> bool {
    let contests = options.iter().all(|e| matches!(e, EntityRef::Contest(_)));
    if contests {
        if let Ok(Some(ci)) = resolve_contest(data, a, &Slots::new()) {
            return !options.contains(&EntityRef::Contest(ci));
        }
        return false;
    }
    a.mentions.iter().any(|m| {
        m.exact
            && match m.candidates.first() {
                Some((Target::Entity(e, _), _)) => {
                    std::mem::discriminant(e) == std::mem::discriminant(&options[0])
                        && !m
                            .candidates
                            .iter()
                            .any(|(t, _)| matches!(t, Target::Entity(x, _) if options.contains(x)))
                }
                _ => false,
            }
    })
}

enum Picked {
    One(EntityRef),
    Some(Vec<EntityRef>),
    None,
}

const ORDINALS: [(&str, usize); 8] = [
    ("first", 0),
    ("second", 1),
    ("third", 2),
    ("fourth", 3),
    ("fifth", 4),
    ("sixth", 5),
    ("1st", 0),
    ("2nd", 1),
];

/// Which of the offered options the message picks: by position ("the second
/// one"), by name or part of it, by sport noun ("the rower"), by group ("the
/// one from X"), or by an event detail ("the women's").
fn pick(data: &Dataset, options: &[EntityRef], a: &Analysis) -> Picked {
    let toks: Vec<&str> = a.tokens.iter().map(String::as_str).collect();
    let short = toks.len() <= 5;
    if short {
        for (w, i) in ORDINALS {
            if toks.contains(&w) && i < options.len() {
                return Picked::One(options[i]);
            }
        }
        if toks.contains(&"last") {
            if let Some(e) = options.last() {
                return Picked::One(*e);
            }
        }
        if let [n] = toks.as_slice() {
            if let Ok(k) = n.parse::<usize>() {
                if (1..=options.len()).contains(&k) {
                    return Picked::One(options[k - 1]);
                }
            }
        }
    }
    let mut keep: Vec<EntityRef> = options.to_vec();
    let mut narrowed = false;
    // Names mentioned in the message.
    let named: Vec<EntityRef> = a
        .mentions
        .iter()
        .flat_map(|m| m.candidates.iter())
        .filter_map(|(t, _)| match t {
            Target::Entity(e, _) => Some(*e),
            _ => None,
        })
        .collect();
    narrowed |= narrow(&mut keep, &|e| named.contains(e));
    if let Some(sport) = sport_noun(a) {
        narrowed |= narrow(&mut keep, &|e| sport_of(data, *e) == Some(sport));
    }
    for m in &a.mentions {
        match m.candidates.first() {
            Some((Target::Entity(EntityRef::Group(g), _), _)) => {
                let g = *g;
                narrowed |= narrow(&mut keep, &|e| group_of(data, *e) == Some(g));
            }
            Some((Target::Entity(EntityRef::Sport(sp), _), _)) => {
                let sp = *sp;
                narrowed |= narrow(&mut keep, &|e| sport_of(data, *e) == Some(sp));
            }
            // "the one in Pellin Heath", "the one in the 100 m": the person
            // entered in that contest, or in a contest of that discipline.
            Some((Target::Entity(EntityRef::Contest(ci), _), _)) => {
                let ci = *ci;
                narrowed |= narrow(&mut keep, &|e| enters(data, *e, &|c| c == ci));
            }
            Some((Target::Entity(EntityRef::Discipline(s, d), _), _)) => {
                let d = (*s, *d);
                narrowed |= narrow(&mut keep, &|e| {
                    enters(data, *e, &|c| data.discipline_ref(c) == d)
                });
            }
            _ => {}
        }
    }
    // Event details narrow contest options.
    if options.iter().all(|e| matches!(e, EntityRef::Contest(_))) {
        if let Ok(Some(ci)) = resolve_contest(data, a, &Slots::new()) {
            narrowed |= narrow(&mut keep, &|e| *e == EntityRef::Contest(ci));
        }
        for m in &a.mentions {
            match m.candidates.first() {
                Some((Target::Category(c), _)) => {
                    let c = c.clone();
                    narrowed |= narrow(
                        &mut keep,
                        &|e| matches!(e, EntityRef::Contest(i) if data.contests[*i].category.as_deref() == Some(c.as_str())),
                    );
                }
                Some((Target::Phase(p), _)) => {
                    let p = p.clone();
                    narrowed |= narrow(
                        &mut keep,
                        &|e| matches!(e, EntityRef::Contest(i) if data.contests[*i].phase.starts_with(p.as_str())),
                    );
                }
                _ => {}
            }
        }
    }
    // Words of the option's own label ("the 400 m one", "Quillon"), when
    // nothing else told the options apart.
    if !narrowed {
        let label_hit = |e: &EntityRef| {
            let label = crate::understand::normalize::normalize(&describe(data, *e));
            toks.iter().any(|t| {
                t.len() >= 3 && !matches!(*t, "the" | "one") && label.split(' ').any(|w| w == *t)
            })
        };
        narrowed |= narrow(&mut keep, &label_hit);
    }
    match keep.as_slice() {
        [one] if narrowed => Picked::One(*one),
        _ if narrowed => Picked::Some(keep),
        _ => Picked::None,
    }
}

/// Keeps the options that pass `f`, unless that would rule out all of them
/// or none; returns whether the list got shorter.
fn narrow(keep: &mut Vec<EntityRef>, f: &dyn Fn(&EntityRef) -> bool) -> bool {
    let next: Vec<EntityRef> = keep.iter().copied().filter(|e| f(e)).collect();
    if !next.is_empty() && next.len() < keep.len() {
        *keep = next;
        true
    } else {
        false
    }
}

/// Whether a competitor option is entered in a contest that passes `f`.
fn enters(data: &Dataset, e: EntityRef, f: &dyn Fn(usize) -> bool) -> bool {
    match e {
        EntityRef::Competitor(i) => data.contests_of(i).iter().any(|(c, _)| f(*c)),
        _ => false,
    }
}

fn sport_of(data: &Dataset, e: EntityRef) -> Option<usize> {
    match e {
        EntityRef::Competitor(i) => data.sport(&data.competitors[i].sport),
        EntityRef::Contest(i) => data.sport(&data.contests[i].sport),
        EntityRef::Discipline(s, _) | EntityRef::Sport(s) => Some(s),
        EntityRef::Group(_) => None,
    }
}

fn group_of(data: &Dataset, e: EntityRef) -> Option<usize> {
    match e {
        EntityRef::Competitor(i) => data.group(&data.competitors[i].group),
        EntityRef::Group(g) => Some(g),
        _ => None,
    }
}

/// A label that tells options apart: "Zoë Quillon, swimmer, Quessary".
pub fn describe(data: &Dataset, e: EntityRef) -> String {
    match e {
        EntityRef::Competitor(i) => {
            let c = &data.competitors[i];
            let noun = data
                .sport(&c.sport)
                .map(|s| data.sports[s].noun.as_str())
                .unwrap_or("");
            let group = data
                .group(&c.group)
                .map(|g| data.groups[g].name.as_str())
                .unwrap_or("");
            format!("{} ({noun}, {group})", c.name())
        }
        // "the men's 100 m final", but a contest named like a place is a
        // proper name: "Ashvenny North".
        EntityRef::Contest(i) => {
            let name = data.contest_name(i);
            if name.starts_with(char::is_uppercase) {
                name
            } else {
                format!("the {name}")
            }
        }
        other => data.entity_name(other),
    }
}

/// The same label as it is said: "Zoë Quillon, the swimmer from Quessary".
fn describe_spoken(data: &Dataset, e: EntityRef) -> String {
    match e {
        EntityRef::Competitor(i) => {
            let c = &data.competitors[i];
            let noun = data.sport(&c.sport).map(|s| data.sports[s].noun.as_str());
            let group = data.group(&c.group).map(|g| data.groups[g].name.as_str());
            match (noun, group) {
                (Some(n), Some(g)) => format!("{}, the {n} from {g}", c.name()),
                (Some(n), None) => format!("{}, the {n}", c.name()),
                (None, Some(g)) => format!("{} from {g}", c.name()),
                (None, None) => c.name(),
            }
        }
        other => describe(data, other),
    }
}

/// What the options of a "which one?" question are called: people of one
/// sport by its noun ("Which candidate", "Which swimmer"), others in the
/// scenario's own words ("delegation", "party", "ward").
fn options_noun<'d>(data: &'d Dataset, options: &[EntityRef]) -> &'d str {
    let sports: Vec<Option<usize>> = options
        .iter()
        .map(|e| match e {
            EntityRef::Competitor(i) => data.sport(&data.competitors[*i].sport),
            _ => None,
        })
        .collect();
    if let Some(Some(s)) = sports.first() {
        if sports.iter().all(|x| *x == Some(*s)) {
            return &data.sports[*s].noun;
        }
    }
    options.first().map(|e| noun_for(data, *e)).unwrap_or("one")
}

/// What one option of a "which one?" question is called.
fn noun_for(data: &Dataset, e: EntityRef) -> &str {
    match e {
        EntityRef::Competitor(_) => "person",
        EntityRef::Group(_) => &data.scenario.group_noun,
        EntityRef::Sport(_) => "sport",
        EntityRef::Discipline(..) | EntityRef::Contest(_) => &data.scenario.contest_noun,
    }
}

fn slots_out(data: &Dataset, slots: &Slots) -> BTreeMap<String, SlotOut> {
    slots
        .iter()
        .map(|(k, v)| {
            (
                k.clone(),
                SlotOut {
                    kind: v.kind(),
                    value: v.key(data),
                    text: v.display(data),
                },
            )
        })
        .collect()
}

fn plain_reply(
    said: Realised,
    outcome: Outcome,
    intent: Option<&Intent>,
    confidence: f32,
    a: &Analysis,
) -> Reply {
    Reply {
        text: said.text,
        intent: intent.map(|i| i.name.clone()),
        slots: BTreeMap::new(),
        outcome,
        focus: None,
        detail: None,
        confidence,
        options: vec![],
        facts: HashMap::new(),
        candidates: a.scores.iter().take(3).cloned().collect(),
        ssml: said.ssml,
        markdown: said.markdown,
        quick_replies: vec![],
        unanswered: vec![],
    }
}

impl TurnContext<'_> {
    /// When the data were last confirmed, as a time of day.
    fn as_of(&self) -> Value {
        let z = self.data.as_of.to_zoned_datetime(self.data.tz.clone());
        crate::answers::ops::support::clock_value(z.hour() as u64, z.minute() as u64)
    }
}

/// The intent's suggestions as quick replies: those whose slots all have a
/// value, with the values filled in, as many as the channel offers.
fn quick_replies(ctx: &TurnContext, intent: &Intent, slots: &Slots) -> Vec<String> {
    if ctx.channel.quick_replies == 0 {
        return vec![];
    }
    let values: HashMap<String, Value> = slots
        .iter()
        .map(|(k, v)| (k.clone(), Value::Text(v.display(ctx.data))))
        .collect();
    intent
        .suggestions
        .iter()
        .filter(|t| t.names().iter().all(|n| values.contains_key(*n)))
        .map(|t| t.render(&values, Style::Text))
        .take(ctx.channel.quick_replies)
        .collect()
}

/// The honest reply to a question understood well enough to say what
/// cannot be answered: a topic the data does not hold, a limit no intent
/// honours, or a focus no intent answers. It goes on the unanswered list.
fn not_covered(ctx: &TurnContext, a: &Analysis, gap: &Gap, near: Option<&Intent>) -> Reply {
    let mut values = HashMap::new();
    let (key, default) = match gap {
        Gap::Unheld(what) => {
            values.insert("what".to_string(), Value::Text(people_words(ctx, a, what)));
            ("not_covered", &ctx.catalog.service.not_covered)
        }
        Gap::Limits(limits) => {
            values.insert(
                "limits".to_string(),
                Value::List(limits.iter().map(|l| Value::Text(l.clone())).collect()),
            );
            ("cannot_limit", &ctx.catalog.service.cannot_limit)
        }
        Gap::Focus(f) => {
            values.insert("what".to_string(), Value::Text(focus_words(ctx.data, *f)));
            ("cannot_answer", &ctx.catalog.service.cannot_answer)
        }
    };
    let said = ctx.service(key, default, &values);
    let confidence = a
        .scores
        .first()
        .map(|s| s.score)
        .unwrap_or(0.0)
        .clamp(0.0, 1.0);
    let mut r = plain_reply(said, Outcome::NotCovered, None, confidence, a);
    r.focus = a.frame.focus.map(|f| f.name().to_string());
    if let Some(i) = near {
        r.detail = Some(format!("closest intent: {}", i.name));
    }
    r
}

/// A topic's name with "{people}" replaced by what the people asked about
/// are called: the named person's sport noun ("athletes'", "candidates'"),
/// else the scenario's most common one.
fn people_words(ctx: &TurnContext, a: &Analysis, what: &str) -> String {
    if !what.contains("{people}") {
        return what.to_string();
    }
    let person = a.mentions.iter().find_map(|m| match m.candidates.first() {
        Some((Target::Entity(EntityRef::Competitor(p), _), _)) => Some(*p),
        _ => None,
    });
    let sport = person
        .and_then(|p| ctx.data.sport(&ctx.data.competitors[p].sport))
        .or_else(|| {
            // The sport most people are in.
            let mut counts = vec![0usize; ctx.data.sports.len()];
            for c in &ctx.data.competitors {
                if let Some(s) = ctx.data.sport(&c.sport) {
                    counts[s] += 1;
                }
            }
            (0..counts.len()).max_by_key(|&i| counts[i])
        });
    let noun = sport
        .map(|s| crate::answers::words::plural(&ctx.data.sports[s].noun))
        .unwrap_or_else(|| "people".to_string());
    what.replace("{people}'s", &format!("{noun}'"))
        .replace("{people}", &noun)
}

/// How a reply names what a question of this focus asks for.
fn focus_words(data: &Dataset, f: Focus) -> String {
    match f {
        Focus::Who => "who that was".into(),
        Focus::HowDid => "how that went".into(),
        Focus::Results => "those results".into(),
        Focus::Count => "that count".into(),
        Focus::Rank => "that ranking".into(),
        Focus::Table => "that table".into(),
        Focus::Margin => "that margin".into(),
        Focus::Mark => "that mark".into(),
        Focus::When => "when that is".into(),
        Focus::Where => "where that is".into(),
        Focus::Schedule => "that schedule".into(),
        Focus::Status => "how far along that is".into(),
        Focus::Whether => "that".into(),
        Focus::Compare => "how they compare".into(),
        Focus::GroupOf => format!("which {} someone is in", data.scenario.group_noun),
        Focus::SportOf => "what someone competes in".into(),
        Focus::Profile => "more about them".into(),
        Focus::Open => "what is still open".into(),
        Focus::Chat | Focus::Other => "that".into(),
    }
}

fn not_understood(ctx: &TurnContext, a: &Analysis) -> Reply {
    let mut values = HashMap::new();
    values.insert(
        "examples".to_string(),
        Value::List(
            ctx.catalog
                .service
                .examples
                .iter()
                .map(|e| Value::Text(format!("\u{201c}{e}\u{201d}")))
                .collect(),
        ),
    );
    let said = ctx.service(
        "not_understood",
        &ctx.catalog.service.not_understood,
        &values,
    );
    // Confidence that no intent fits: the complement of the best score.
    let best = a.scores.first().map(|s| s.score).unwrap_or(0.0);
    plain_reply(
        said,
        Outcome::NotUnderstood,
        None,
        (1.0 - best).clamp(0.0, 1.0),
        a,
    )
}
