//! `best_mark`: the best mark so far in a discipline, across every contest
//! of it (heats and finals alike), optionally for one category.

use super::support::{entry_value, mark_value};
use super::*;
use crate::dataset::{mark, Better, EntryStatus, Status};

pub static SPEC: OpSpec = OpSpec {
    name: "best_mark",
    summary: "the best mark so far in a discipline",
    params: &[
        Param {
            name: "discipline",
            kind: EntityKind::Discipline,
            required: true,
        },
        Param {
            name: "category",
            kind: EntityKind::Category,
            required: false,
        },
        // One round only ("the fastest time in the heats").
        Param {
            name: "round",
            kind: EntityKind::Round,
            required: false,
        },
    ],
    outcomes: &[
        answered(
            "answered",
            &["discipline_name", "mark", "holder", "contest_name"],
        ),
        no_data("none_yet", &["discipline_name"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(EntityRef::Discipline(s, d)) = input.entity("discipline") else {
        return OpOutput::done("none_yet", Facts::new(), vec![]);
    };
    let category = input.text("category");
    let mut name = data.sports[s].disciplines[d].name.clone();
    if let Some(cat) = category {
        name = format!(
            "{}{} {name}",
            cat,
            if cat == "women" || cat == "men" {
                "'s"
            } else {
                ""
            }
        );
    }
    let round = match input.slots.get("round") {
        Some(SlotValue::Round { value }) => Some(value.as_str()),
        _ => None,
    };
    if let Some(r) = round {
        name = format!("{name} {}", super::support::round_plural(r));
    }
    let f = Facts::new().set("discipline_name", name);
    let mut best: Option<(usize, usize)> = None;
    // Everyone who shares the best mark: a tie is reported, not broken.
    let mut tied: Vec<(usize, usize)> = Vec::new();
    for (ci, c) in data.contests.iter().enumerate() {
        if data.discipline_ref(ci) != (s, d) || c.status == Status::Scheduled {
            continue;
        }
        if category.is_some_and(|cat| c.category.as_deref() != Some(cat)) {
            continue;
        }
        if round.is_some_and(|r| c.phase != r && !c.phase.starts_with(&format!("{r} "))) {
            continue;
        }
        for (ei, e) in c.entries.iter().enumerate() {
            // A disqualified mark does not stand.
            if e.status != EntryStatus::Ok {
                continue;
            }
            let Some(m) = &data.facts[ci].marks[ei] else {
                continue;
            };
            let ord = match best {
                None => std::cmp::Ordering::Less,
                Some((bc, be)) => {
                    let cur = data.facts[bc].marks[be].as_ref().expect("best has a mark");
                    mark::compare(data.facts[ci].better == Better::Lower, m, cur)
                }
            };
            match ord {
                std::cmp::Ordering::Less => {
                    best = Some((ci, ei));
                    tied = vec![(ci, ei)];
                }
                std::cmp::Ordering::Equal => tied.push((ci, ei)),
                std::cmp::Ordering::Greater => {}
            }
        }
    }
    let Some((ci, ei)) = best else {
        return OpOutput::done("none_yet", f, vec![EntityRef::Discipline(s, d)]);
    };
    let holders: Vec<Value> = tied
        .iter()
        .map(|&(c, e)| entry_value(data, &data.contests[c].entries[e]))
        .collect();
    let mut contests: Vec<String> = tied.iter().map(|&(c, _)| data.contest_name(c)).collect();
    contests.dedup();
    let mut f = f
        .set("holder", Value::List(holders))
        .set("contest_name", Value::from(contests));
    if let Some(m) = mark_value(data, ci, ei) {
        f.put("mark", m);
    }
    let mut mentioned = vec![EntityRef::Discipline(s, d), EntityRef::Contest(ci)];
    let holders: Vec<EntityRef> = tied
        .iter()
        .filter_map(|&(c, e)| super::support::entry_entity(data, &data.contests[c].entries[e]))
        .collect();
    mentioned.extend(holders.iter().copied());
    OpOutput::done("answered", f, mentioned).about(holders)
}
