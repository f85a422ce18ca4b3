//! `leader`: who leads a live contest and by how much.

use super::support::{
    labels, margin_points, margin_value, mark_value, placed, vote_facts, when_value,
};
use super::*;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "leader",
    summary: "the current leader of a live contest and the margin",
    params: &[Param {
        name: "contest",
        kind: EntityKind::Contest,
        required: true,
    }],
    outcomes: &[
        answered(
            "live",
            &[
                "contest_name",
                "leader",
                "mark",
                "second",
                "margin",
                "updated",
                "stale",
                "share",
                "margin_points",
                "counted",
            ],
        ),
        answered(
            "tied",
            &["contest_name", "leader", "mark", "share", "counted"],
        ),
        answered(
            "final",
            &[
                "contest_name",
                "winner",
                "mark",
                "second",
                "margin",
                "share",
                "margin_points",
                "counted",
            ],
        ),
        no_data("scheduled", &["contest_name", "start"]),
        no_data("no_result", &["contest_name"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(ci) = input.contest("contest") else {
        return OpOutput::done("no_result", Facts::new(), vec![]);
    };
    let c = &data.contests[ci];
    let me = EntityRef::Contest(ci);
    let mut f = Facts::new().set("contest_name", data.contest_name(ci));
    if c.status == Status::Scheduled {
        f.put("start", when_value(&data.facts[ci].start, input.now));
        return OpOutput::done("scheduled", f, vec![me]);
    }
    let order = placed(c);
    let Some(&first) = order.first() else {
        return OpOutput::done("no_result", f, vec![me]);
    };
    if super::support::no_votes_yet(data, ci) {
        return OpOutput::done("no_result", f, vec![me]);
    }
    let top_place = c.entries[first].place;
    let leaders: Vec<usize> = order
        .iter()
        .copied()
        .filter(|&i| c.entries[i].place == top_place)
        .collect();
    if let Some(m) = mark_value(data, ci, first) {
        f.put("mark", m);
    }
    vote_facts(data, ci, Some(first), &mut f);
    let mut mentioned = vec![me];
    let subjects: Vec<EntityRef> = leaders
        .iter()
        .filter_map(|&i| super::support::entry_entity(data, &c.entries[i]))
        .collect();
    mentioned.extend(subjects.iter().copied());
    if leaders.len() > 1 {
        f.put("leader", labels(data, c, &leaders));
        return OpOutput::done("tied", f, mentioned).about(subjects);
    }
    let key = if c.status == Status::Final {
        "winner"
    } else {
        "leader"
    };
    f.put(key, labels(data, c, &leaders));
    if let Some(&second) = order.get(1) {
        let seconds: Vec<usize> = order
            .iter()
            .copied()
            .filter(|&i| c.entries[i].place == c.entries[second].place)
            .collect();
        f.put("second", labels(data, c, &seconds));
        if let Some(m) = margin_value(data, ci, first, second) {
            f.put("margin", m);
        }
        if let Some(p) = margin_points(data, ci, first, second) {
            f.put("margin_points", p);
        }
    }
    if c.status == Status::Final {
        return OpOutput::done("final", f, mentioned).about(subjects);
    }
    if let Some(s) = super::support::staleness(data, ci, input.now, input.stale_after) {
        f.put("stale", s);
    }
    if let Some(t) = super::support::updated_value(data, ci) {
        f.put("updated", t);
    }
    OpOutput::done("live", f, mentioned).about(subjects)
}
