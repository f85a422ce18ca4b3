//! Slot filling: from the names found in a message to an intent's slots.
//!
//! The rule is never to guess. A name that fits several things becomes a
//! question listing them; a missing required detail becomes the intent's
//! own question. Context narrows before asking: "Kovendal in the single
//! sculls" only fits the rower.

use super::frame::Place;
use super::lexicon::{Mention, Target};
use super::Analysis;
use crate::answers::ops::{EntityKind, SlotValue, Slots};
use crate::catalog::Intent;
use crate::dataset::{Dataset, EntityRef, Status};

/// Candidates closer than this to the best are equally plausible.
pub const CLOSE: f32 = 0.05;
/// Most options listed in one clarifying question.
pub const MAX_OPTIONS: usize = 6;

/// What filling needs from the reader.
#[derive(Debug, Clone, PartialEq)]
pub enum Need {
    /// A required slot has no value.
    Missing { slot: String },
    /// A slot fits several entities.
    Choose {
        slot: String,
        options: Vec<EntityRef>,
    },
    /// The reader named an event the data does not have.
    NoMatch { slot: String, what: String },
}

/// The result of filling.
#[derive(Debug, Clone, PartialEq)]
pub struct Filled {
    pub slots: Slots,
    /// The first thing to ask, if any.
    pub need: Option<Need>,
    /// The lowest certainty among names used (1.0 when all were exact).
    pub certainty: f32,
}

fn entity_candidates(m: &Mention, want: impl Fn(&EntityRef) -> bool) -> Vec<(EntityRef, f32)> {
    m.candidates
        .iter()
        .filter_map(|(t, s)| match t {
            Target::Entity(e, _) if want(e) => Some((*e, *s)),
            _ => None,
        })
        .collect()
}

/// Keeps the candidates within [`CLOSE`] of the best.
fn top_group(mut c: Vec<(EntityRef, f32)>) -> Vec<(EntityRef, f32)> {
    c.sort_by(|a, b| b.1.partial_cmp(&a.1).unwrap_or(std::cmp::Ordering::Equal));
    // One entity once, at its best score (a name and an alias may both match).
    let mut seen = std::collections::HashSet::new();
    c.retain(|x| seen.insert(x.0));
    let best = c.first().map(|x| x.1).unwrap_or(0.0);
    c.retain(|x| x.1 >= best - CLOSE);
    c
}

/// Fills the intent's slots from the analysis; `carried` are slot values
/// already known (from a clarification answered earlier).
pub fn fill(data: &Dataset, intent: &Intent, a: &Analysis, carried: &Slots) -> Filled {
    let mut slots = carried.clone();
    let mut need = None;
    let mut certainty: f32 = 1.0;
    let mut used: Vec<usize> = Vec::new();

    // Contest context first: it narrows people ("Varga in the single sculls").
    let categories: Vec<String> = a
        .mentions
        .iter()
        .flat_map(|m| m.candidates.first())
        .filter_map(|(t, _)| match t {
            Target::Category(c) => Some(c.clone()),
            _ => None,
        })
        .collect();

    for def in &intent.slots {
        if slots.contains_key(&def.name) {
            continue;
        }
        let value = match def.kind {
            EntityKind::Competitor => {
                let pick = a.mentions.iter().enumerate().find(|(i, m)| {
                    !used.contains(i)
                        && m.candidates
                            .iter()
                            .any(|(t, _)| matches!(t, Target::Entity(EntityRef::Competitor(_), _)))
                });
                match pick {
                    None => None,
                    Some((i, m)) => {
                        used.push(i);
                        let mut c = entity_candidates(m, |e| matches!(e, EntityRef::Competitor(_)));
                        // "Zoe Marant": a first name and a (misspelt) family
                        // name side by side name one person together.
                        if let Some(next) = a.mentions.get(i + 1).filter(|n| n.start == m.end) {
                            let other =
                                entity_candidates(next, |e| matches!(e, EntityRef::Competitor(_)));
                            let both: Vec<(EntityRef, f32)> = c
                                .iter()
                                .filter_map(|(e, s)| {
                                    other
                                        .iter()
                                        .find(|(o, _)| o == e)
                                        .map(|(_, t)| (*e, (s + t) / 2.0 + 0.05))
                                })
                                .collect();
                            if !both.is_empty() {
                                used.push(i + 1);
                                c = both;
                            }
                        }
                        narrow_people(data, &mut c, &slots, a, &categories);
                        let g = top_group(c);
                        certainty = certainty.min(g.first().map(|x| x.1).unwrap_or(1.0));
                        match g.as_slice() {
                            [] => None,
                            [(e, _)] => Some(SlotValue::Entity { entity: *e }),
                            many => {
                                need.get_or_insert(Need::Choose {
                                    slot: def.name.clone(),
                                    options: many.iter().take(MAX_OPTIONS).map(|x| x.0).collect(),
                                });
                                None
                            }
                        }
                    }
                }
            }
            EntityKind::Group | EntityKind::Sport | EntityKind::Discipline => {
                let want = |e: &EntityRef| match def.kind {
                    EntityKind::Group => matches!(e, EntityRef::Group(_)),
                    EntityKind::Sport => matches!(e, EntityRef::Sport(_)),
                    _ => matches!(e, EntityRef::Discipline(..)),
                };
                let pick = a
                    .mentions
                    .iter()
                    .enumerate()
                    .find(|(i, m)| !used.contains(i) && !entity_candidates(m, want).is_empty());
                match pick {
                    None if def.kind == EntityKind::Sport => {
                        sport_noun(a).map(|s| SlotValue::Entity {
                            entity: EntityRef::Sport(s),
                        })
                    }
                    None => None,
                    Some((i, m)) => {
                        used.push(i);
                        let g = top_group(entity_candidates(m, want));
                        certainty = certainty.min(g.first().map(|x| x.1).unwrap_or(1.0));
                        match g.as_slice() {
                            [] => None,
                            [(e, _)] => Some(SlotValue::Entity { entity: *e }),
                            many => {
                                need.get_or_insert(Need::Choose {
                                    slot: def.name.clone(),
                                    options: many.iter().take(MAX_OPTIONS).map(|x| x.0).collect(),
                                });
                                None
                            }
                        }
                    }
                }
            }
            EntityKind::Category => categories
                .first()
                .map(|c| SlotValue::Category { value: c.clone() }),
            // "gold, silver and bronze" asks for all of them: no one award.
            EntityKind::Award => {
                let mut named: Vec<&String> = a
                    .mentions
                    .iter()
                    .flat_map(|m| m.candidates.first())
                    .filter_map(|(t, _)| match t {
                        Target::Award(x) => Some(x),
                        _ => None,
                    })
                    .collect();
                named.dedup();
                match named.as_slice() {
                    [one] => Some(SlotValue::Award {
                        value: (*one).clone(),
                    }),
                    _ => None,
                }
            }
            EntityKind::Date => a.days.first().map(|d| SlotValue::Date { value: d.date }),
            EntityKind::Count => a.count.map(|c| SlotValue::Count { value: c.2 }),
            EntityKind::Place => a.frame.place.map(|(_, _, p)| SlotValue::Place {
                value: match p {
                    Place::Nth(n) => n,
                    Place::Last => crate::answers::ops::LAST_PLACE,
                },
            }),
            EntityKind::Round => a
                .mentions
                .iter()
                .flat_map(|m| m.candidates.first())
                .find_map(|(t, _)| match t {
                    Target::Phase(p) => Some(SlotValue::Round { value: p.clone() }),
                    _ => None,
                }),
            EntityKind::Contest => match resolve_contest(data, a, &slots) {
                // Words where an event's name would be that name no event
                // of the data ("the shot put", "the women's 800 m"): the
                // data has no such event, which is said, not asked.
                Ok(None) | Err(Some(_)) if a.days.is_empty() && unknown_event(a).is_some() => {
                    let mut what = event_words(data, a);
                    for w in unknown_event(a).unwrap_or_default().split(' ') {
                        if !what.split(' ').any(|x| x == w) {
                            what = format!("{what} {w}");
                        }
                    }
                    need.get_or_insert(Need::NoMatch {
                        slot: def.name.clone(),
                        what: what.trim().to_string(),
                    });
                    None
                }
                // Only a day named: which event that day?
                Ok(None) => match day_contests(data, a).as_deref() {
                    None => None,
                    Some([]) => {
                        need.get_or_insert(Need::NoMatch {
                            slot: def.name.clone(),
                            what: String::new(),
                        });
                        None
                    }
                    Some([one]) => Some(SlotValue::Entity {
                        entity: EntityRef::Contest(*one),
                    }),
                    // Too many to list: the intent's own question.
                    Some(many) if many.len() > MAX_OPTIONS => None,
                    Some(many) => {
                        need.get_or_insert(Need::Choose {
                            slot: def.name.clone(),
                            options: many.iter().map(|c| EntityRef::Contest(*c)).collect(),
                        });
                        None
                    }
                },
                Ok(Some(ci)) => Some(SlotValue::Entity {
                    entity: EntityRef::Contest(ci),
                }),
                Err(Some(options)) => {
                    need.get_or_insert(Need::Choose {
                        slot: def.name.clone(),
                        options,
                    });
                    None
                }
                Err(None) => {
                    need.get_or_insert(Need::NoMatch {
                        slot: def.name.clone(),
                        what: event_words(data, a),
                    });
                    None
                }
            },
        };
        match value {
            Some(v) => {
                slots.insert(def.name.clone(), v);
            }
            None if def.required => {
                need.get_or_insert(Need::Missing {
                    slot: def.name.clone(),
                });
            }
            None => {}
        }
    }
    // A competitor's contest can only be checked once both are known: if
    // the contest was found first, the person was narrowed by it above.
    Filled {
        slots,
        need,
        certainty,
    }
}

/// Narrows people by the rest of the message: a contest they are in, a
/// category, a sport noun ("the rower"), or a group ("from Sordavia").
fn narrow_people(
    data: &Dataset,
    c: &mut Vec<(EntityRef, f32)>,
    slots: &Slots,
    a: &Analysis,
    categories: &[String],
) {
    let keep_if = |c: &mut Vec<(EntityRef, f32)>, f: &dyn Fn(usize) -> bool| {
        let narrowed: Vec<(EntityRef, f32)> = c
            .iter()
            .copied()
            .filter(|(e, _)| matches!(e, EntityRef::Competitor(i) if f(*i)))
            .collect();
        if !narrowed.is_empty() {
            *c = narrowed;
        }
    };
    if let Some(SlotValue::Entity {
        entity: EntityRef::Contest(ci),
    }) = slots.get("contest")
    {
        let ci = *ci;
        keep_if(c, &|p| data.contests_of(p).iter().any(|(x, _)| *x == ci));
    } else {
        // Any contest the message may mean narrows the people in it.
        let fits = match resolve_contest(data, a, slots) {
            Ok(Some(ci)) => vec![ci],
            Err(Some(options)) => options
                .iter()
                .filter_map(|e| {
                    if let EntityRef::Contest(ci) = e {
                        Some(*ci)
                    } else {
                        None
                    }
                })
                .collect(),
            _ => vec![],
        };
        if !fits.is_empty() {
            keep_if(c, &|p| {
                data.contests_of(p).iter().any(|(x, _)| fits.contains(x))
            });
        }
    }
    if let Some(cat) = categories.first() {
        keep_if(c, &|p| {
            data.competitors[p].category.as_deref() == Some(cat.as_str())
        });
    }
    if let Some(s) = sport_noun(a).or_else(|| mentioned_sport(a)) {
        keep_if(c, &|p| data.sport(&data.competitors[p].sport) == Some(s));
    }
    for m in &a.mentions {
        if let Some((Target::Entity(EntityRef::Group(g), _), _)) = m.candidates.first() {
            let g = *g;
            keep_if(c, &|p| data.group(&data.competitors[p].group) == Some(g));
        }
    }
}

/// A sport named by its competitors' noun ("the rower").
pub fn sport_noun(a: &Analysis) -> Option<usize> {
    a.mentions
        .iter()
        .flat_map(|m| m.candidates.first())
        .find_map(|(t, _)| match t {
            Target::SportNoun(s) => Some(*s),
            _ => None,
        })
}

fn mentioned_sport(a: &Analysis) -> Option<usize> {
    a.mentions
        .iter()
        .flat_map(|m| m.candidates.first())
        .find_map(|(t, _)| match t {
            Target::Entity(EntityRef::Sport(s), _) => Some(*s),
            _ => None,
        })
}

/// An unexplained word right next to a part of an event's name ("relay"
/// in "the men's 1500 m relay", "mixed" in "the mixed 100 m"): its token
/// index.
pub fn odd_event_word(a: &Analysis) -> Option<usize> {
    let part = |m: &Mention| {
        matches!(
            m.candidates.first(),
            Some((
                Target::Category(_)
                    | Target::Phase(_)
                    | Target::Entity(EntityRef::Discipline(..), _),
                _
            ))
        )
    };
    a.frame.unexplained.iter().copied().find(|&j| {
        a.mentions
            .iter()
            .any(|m| part(m) && (m.end == j || j + 1 == m.start))
    })
}

/// Words that read as the name of an event the data does not have: a
/// distance no discipline has ("800 m"), or unexplained words next to a
/// category, round or discipline ("women's triathlon", "100 m relay").
/// `None` when there are none.
pub fn unknown_event(a: &Analysis) -> Option<String> {
    let t = &a.tokens;
    let named = |i: usize| a.mentions.iter().any(|m| m.start <= i && i < m.end);
    for i in a.frame.onset..t.len() {
        let is_figure = !t[i].is_empty() && t[i].chars().all(|c| c.is_ascii_digit());
        if is_figure
            && !named(i)
            && matches!(t.get(i + 1).map(String::as_str), Some("m" | "km"))
            && !named(i + 1)
        {
            return Some(format!("{} {}", t[i], t[i + 1]));
        }
    }
    let unexplained = &a.frame.unexplained;
    // Not any word after "the": "and the north?" is a follow-up's business.
    let start = odd_event_word(a)?;
    let mut end = start + 1;
    while unexplained.contains(&end) {
        end += 1;
    }
    Some(t[start..end].join(" "))
}

/// Contests on the day the message names, when it names a day but no
/// event ("who won yesterday?"): finals first, as an unqualified event
/// means its final. `None` without a day.
pub fn day_contests(data: &Dataset, a: &Analysis) -> Option<Vec<usize>> {
    let d = a.days.first()?;
    let on: Vec<usize> = (0..data.contests.len())
        .filter(|&ci| data.facts[ci].start.date() == d.date)
        .collect();
    let finals: Vec<usize> = on
        .iter()
        .copied()
        .filter(|&ci| data.contests[ci].phase == "final")
        .collect();
    Some(if finals.is_empty() { on } else { finals })
}

/// How a reply names an event the data does not have, from the parts the
/// reader named, in their order, as the data write them ("women's", "1500
/// m"), with the word nothing explained ("relay") where it stood, and the
/// day named ("on Friday 13 August").
fn event_words(data: &Dataset, a: &Analysis) -> String {
    let mut words: Vec<String> = Vec::new();
    let odd = odd_event_word(a);
    for m in &a.mentions {
        let Some((t, _)) = m.candidates.first() else {
            continue;
        };
        if odd.is_some_and(|j| j + 1 == m.start) {
            words.push(a.tokens[m.start - 1].clone());
        }
        match t {
            Target::Category(c) if c == "men" || c == "women" => words.push(format!("{c}'s")),
            Target::Category(c) | Target::Phase(c) => words.push(c.clone()),
            Target::Entity(e @ (EntityRef::Discipline(..) | EntityRef::Sport(_)), _) => {
                words.push(data.entity_name(*e))
            }
            _ => continue,
        }
        if odd == Some(m.end) {
            words.push(a.tokens[m.end].clone());
        }
    }
    if let Some(d) = a.days.first() {
        words.push(format!("on {}", d.date.strftime("%A %-d %B")));
    }
    words.join(" ")
}

/// Finds the contest a message names. `Ok(None)`: no event named;
/// `Err(Some(options))`: several fit; `Err(None)`: none fits.
pub fn resolve_contest(
    data: &Dataset,
    a: &Analysis,
    slots: &Slots,
) -> Result<Option<usize>, Option<Vec<EntityRef>>> {
    let mut disciplines: Vec<(usize, usize)> = Vec::new();
    let mut sport = None;
    let mut category = None;
    let mut phase: Option<String> = None;
    for m in &a.mentions {
        let Some((top, _)) = m.candidates.first() else {
            continue;
        };
        match top {
            Target::Entity(EntityRef::Contest(ci), _) => return Ok(Some(*ci)),
            Target::Entity(EntityRef::Discipline(..), _) => {
                let best = m.best();
                disciplines.extend(
                    m.candidates
                        .iter()
                        .filter(|(_, s)| *s >= best - CLOSE)
                        .filter_map(|(t, _)| match t {
                            Target::Entity(EntityRef::Discipline(s, d), _) => Some((*s, *d)),
                            _ => None,
                        }),
                );
            }
            Target::Entity(EntityRef::Sport(s), _) => sport = Some(*s),
            Target::Category(c) => category = Some(c.clone()),
            Target::Phase(p) => phase = Some(p.clone()),
            _ => {}
        }
    }
    if disciplines.is_empty() && sport.is_none() {
        return Ok(None);
    }
    // A word next to the event's name that nothing explains ("the men's
    // 1500 m relay") names an event the data does not have: never the
    // event without it.
    if odd_event_word(a).is_some() {
        return Err(None);
    }
    let person = match slots.get("competitor") {
        Some(SlotValue::Entity {
            entity: EntityRef::Competitor(p),
        }) => Some(*p),
        _ => None,
    };
    let mut fits: Vec<usize> = (0..data.contests.len())
        .filter(|&ci| {
            let c = &data.contests[ci];
            let (s, d) = data.discipline_ref(ci);
            (disciplines.is_empty() || disciplines.contains(&(s, d)))
                && sport.is_none_or(|x| x == s)
                && category
                    .as_ref()
                    .is_none_or(|cat| c.category.as_ref() == Some(cat))
                && phase
                    .as_ref()
                    .is_none_or(|p| c.phase == *p || c.phase.starts_with(&format!("{p} ")))
        })
        .collect();
    if let Some(p) = person {
        let theirs: Vec<usize> = fits
            .iter()
            .copied()
            .filter(|&ci| data.contests_of(p).iter().any(|(x, _)| *x == ci))
            .collect();
        if !theirs.is_empty() {
            fits = theirs;
        }
    }
    // A day narrows to the contests on it; none on it is no match.
    if let Some(d) = a.days.first() {
        fits.retain(|&ci| data.facts[ci].start.date() == d.date);
        if fits.is_empty() {
            return Err(None);
        }
    }
    // A team or party named narrows to the contests it is in.
    let groups: Vec<usize> = a
        .mentions
        .iter()
        .filter_map(|m| match m.candidates.first() {
            Some((Target::Entity(EntityRef::Group(g), _), _)) => Some(*g),
            _ => None,
        })
        .collect();
    if fits.len() > 1 && !groups.is_empty() {
        let theirs: Vec<usize> = fits
            .iter()
            .copied()
            .filter(|&ci| {
                data.contests[ci]
                    .entries
                    .iter()
                    .any(|e| data.entry_group(e).is_some_and(|g| groups.contains(&g)))
            })
            .collect();
        if !theirs.is_empty() {
            fits = theirs;
        }
    }
    // "right now": the contest that is live. "Leading" or "ahead" only
    // rules out contests not yet started: a finished one has a leader too,
    // so the reader is asked which they mean.
    if a.frame.live && fits.len() > 1 {
        let now = a.tokens.iter().any(|t| {
            matches!(
                t.as_str(),
                "now" | "currently" | "live" | "ongoing" | "moment"
            )
        });
        let live: Vec<usize> = fits
            .iter()
            .copied()
            .filter(|&ci| match data.contests[ci].status {
                Status::Live | Status::Suspended => true,
                Status::Final => !now,
                Status::Scheduled | Status::Postponed | Status::Abandoned => false,
            })
            .collect();
        if live
            .iter()
            .any(|&ci| data.contests[ci].status == Status::Live)
        {
            fits = live;
        }
    }
    if phase.is_none() && fits.len() > 1 {
        // Unqualified, an event means its final (common practice: "the men's
        // 100 m" is the race that gives the medals).
        let finals: Vec<usize> = fits
            .iter()
            .copied()
            .filter(|&ci| data.contests[ci].phase == "final")
            .collect();
        if !finals.is_empty() {
            fits = finals;
        }
    }
    match fits.as_slice() {
        [] => Err(None),
        [one] => Ok(Some(*one)),
        many => {
            let mut v: Vec<usize> = many.to_vec();
            // Sooner and more current contests first.
            v.sort_by_key(|&ci| {
                (
                    data.contests[ci].status == Status::Final,
                    data.facts[ci].start.timestamp(),
                )
            });
            Err(Some(
                v.into_iter()
                    .take(MAX_OPTIONS)
                    .map(EntityRef::Contest)
                    .collect(),
            ))
        }
    }
}
