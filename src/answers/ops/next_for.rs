//! `next_for`: when a competitor is next in action.

use super::support::{contest_facts, when_value};
use super::*;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "next_for",
    summary: "when a competitor competes next",
    params: &[Param {
        name: "competitor",
        kind: EntityKind::Competitor,
        required: true,
    }],
    outcomes: &[
        answered("upcoming", &["name", "contest_name", "start", "venue"]),
        answered(
            "live",
            &[
                "name",
                "contest_name",
                "start",
                "venue",
                "after",
                "after_start",
            ],
        ),
        no_data("done", &["name"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(pi) = input.competitor("competitor") else {
        return OpOutput::Choose {
            slot: "competitor",
            options: vec![],
        };
    };
    let mut f = Facts::new().set("name", data.competitors[pi].name());
    // A contest under way counts as "next": the reader wants to watch it.
    let next = data
        .contests_of(pi)
        .iter()
        .map(|&(c, _)| c)
        .filter(|&c| data.contests[c].status != Status::Final)
        .min_by_key(|&c| data.facts[c].start.timestamp());
    match next {
        Some(ci) => {
            contest_facts(data, ci, input.now, &mut f);
            let outcome = if data.contests[ci].status == Status::Live {
                // Competing now answers "when is she on"; a reader asking
                // what is next also wants the event after this one.
                let after = data
                    .contests_of(pi)
                    .iter()
                    .map(|&(c, _)| c)
                    .filter(|&c| data.contests[c].status == Status::Scheduled)
                    .min_by_key(|&c| data.facts[c].start.timestamp());
                if let Some(a) = after {
                    f.put("after", format!("the {}", data.contest_name(a)));
                    f.put("after_start", when_value(&data.facts[a].start, input.now));
                }
                "live"
            } else {
                "upcoming"
            };
            OpOutput::done(
                outcome,
                f,
                vec![EntityRef::Competitor(pi), EntityRef::Contest(ci)],
            )
        }
        None => OpOutput::done("done", f, vec![EntityRef::Competitor(pi)]),
    }
}
