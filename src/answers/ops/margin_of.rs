//! `margin_of`: by how much a competitor won or was beaten in a contest,
//! and who finished ahead ("by how much did she win?", "who beat him?",
//! "how far behind is she?").

use super::support::{
    entry_entity, labels, margin_points, margin_value, mark_value, named_entry, placed, rank_value,
    status_phrase, vote_facts, when_value,
};
use super::*;
use crate::dataset::{EntryStatus, Status};

pub static SPEC: OpSpec = OpSpec {
    name: "margin_of",
    summary: "a competitor's margin of victory or defeat, and who finished ahead",
    params: &[
        Param {
            name: "competitor",
            kind: EntityKind::Competitor,
            required: true,
        },
        Param {
            name: "contest",
            kind: EntityKind::Contest,
            required: false,
        },
    ],
    outcomes: &[
        answered(
            "won",
            &[
                "name",
                "contest_name",
                "margin",
                "margin_points",
                "runner_up",
                "mark",
                "share",
                "counted",
            ],
        ),
        answered(
            "beaten",
            &[
                "name",
                "contest_name",
                "place_nth",
                "behind",
                "behind_points",
                "winner",
                "ahead",
                "ahead_count",
                "mark",
                "share",
                "counted",
            ],
        ),
        answered("tied", &["name", "contest_name", "place_nth", "with"]),
        so_far(
            "leading",
            &[
                "name",
                "contest_name",
                "margin",
                "margin_points",
                "runner_up",
                "counted",
                "stale",
            ],
        ),
        so_far(
            "trailing",
            &[
                "name",
                "contest_name",
                "place_nth",
                "behind",
                "behind_points",
                "leader",
                "counted",
                "stale",
            ],
        ),
        answered("did_not_finish", &["name", "contest_name", "status"]),
        no_data("scheduled", &["name", "contest_name", "start"]),
        no_data("not_entered", &["name", "contest_name"]),
        no_data("no_result", &["name", "contest_name"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(pi) = input.competitor("competitor") else {
        return OpOutput::done("no_result", Facts::new(), vec![]);
    };
    let who = EntityRef::Competitor(pi);
    let name = data.competitors[pi].name();
    let theirs = data.contests_of(pi);
    let (ci, ei) = match named_entry(input, pi) {
        Err(not_entered) => return not_entered,
        Ok(Some(pair)) => pair,
        Ok(None) => {
            // Only contests with a result have a margin; a final says more
            // than a heat, so with several the finals are offered first.
            let with_result: Vec<(usize, usize)> = theirs
                .iter()
                .copied()
                .filter(|&(c, e)| {
                    data.contests[c].status != Status::Scheduled
                        && data.contests[c].entries[e].place.is_some()
                })
                .collect();
            let finals: Vec<(usize, usize)> = with_result
                .iter()
                .copied()
                .filter(|&(c, _)| data.contests[c].phase == "final")
                .collect();
            let pool = if finals.is_empty() {
                &with_result
            } else {
                &finals
            };
            match pool.as_slice() {
                [] => match theirs {
                    [only] => *only,
                    _ => {
                        return OpOutput::done(
                            "no_result",
                            Facts::new().set("name", name),
                            vec![who],
                        )
                    }
                },
                [only] => *only,
                many => {
                    return OpOutput::Choose {
                        slot: "contest",
                        options: many.iter().map(|(c, _)| EntityRef::Contest(*c)).collect(),
                    }
                }
            }
        }
    };
    let c = &data.contests[ci];
    let e = &c.entries[ei];
    let mut mentioned = vec![who, EntityRef::Contest(ci)];
    let mut f = Facts::new()
        .set("name", name)
        .set("contest_name", data.contest_name(ci));
    if c.status == Status::Scheduled {
        f.put("start", when_value(&data.facts[ci].start, input.now));
        return OpOutput::done("scheduled", f, mentioned);
    }
    if e.status != EntryStatus::Ok {
        f.put("status", status_phrase(e.status));
        return OpOutput::done("did_not_finish", f, mentioned);
    }
    let (Some(place), false) = (e.place, super::support::no_votes_yet(data, ci)) else {
        return OpOutput::done("no_result", f, mentioned);
    };
    let order = placed(c);
    let live = c.status == Status::Live;
    if let Some(m) = mark_value(data, ci, ei) {
        f.put("mark", m);
    }
    vote_facts(data, ci, Some(ei), &mut f);
    if live {
        if let Some(s) = super::support::staleness(data, ci, input.now, input.stale_after) {
            f.put("stale", s);
        }
    }
    let same: Vec<usize> = order
        .iter()
        .copied()
        .filter(|&i| i != ei && c.entries[i].place == Some(place))
        .collect();
    f.put("place_nth", rank_value(place, !same.is_empty()));
    if place == 1 {
        if !same.is_empty() {
            f.put("with", labels(data, c, &same));
            mentioned.extend(
                same.iter()
                    .filter_map(|&i| entry_entity(data, &c.entries[i])),
            );
            return OpOutput::done("tied", f, mentioned).about(vec![who]);
        }
        // The runner-up: the best placed after this entry.
        if let Some(&next) = order.iter().find(|&&i| i != ei) {
            let seconds: Vec<usize> = order
                .iter()
                .copied()
                .filter(|&i| c.entries[i].place == c.entries[next].place)
                .collect();
            f.put("runner_up", labels(data, c, &seconds));
            if let Some(m) = margin_value(data, ci, ei, next) {
                f.put("margin", m);
            }
            if let Some(p) = margin_points(data, ci, ei, next) {
                f.put("margin_points", p);
            }
            mentioned.extend(
                seconds
                    .iter()
                    .filter_map(|&i| entry_entity(data, &c.entries[i])),
            );
        }
        return OpOutput::done(if live { "leading" } else { "won" }, f, mentioned).about(vec![who]);
    }
    let first = order[0];
    let winners: Vec<usize> = order
        .iter()
        .copied()
        .filter(|&i| c.entries[i].place == c.entries[first].place)
        .collect();
    let ahead: Vec<usize> = order
        .iter()
        .copied()
        .filter(|&i| c.entries[i].place.is_some_and(|p| p < place))
        .collect();
    f.put(
        if live { "leader" } else { "winner" },
        labels(data, c, &winners),
    );
    f.put("ahead", labels(data, c, &ahead));
    f.put("ahead_count", Value::Int(ahead.len() as i64));
    if let Some(m) = margin_value(data, ci, first, ei) {
        f.put("behind", m);
    }
    if let Some(p) = margin_points(data, ci, first, ei) {
        f.put("behind_points", p);
    }
    mentioned.extend(
        ahead
            .iter()
            .filter_map(|&i| entry_entity(data, &c.entries[i])),
    );
    OpOutput::done(if live { "trailing" } else { "beaten" }, f, mentioned).about(vec![who])
}
