//! `contest_time`: when a contest starts (or started), where, and how far
//! along it is (how much of a count is in, when the data say).

use super::support::{contest_facts, staleness, updated_value, vote_facts};
use super::*;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "contest_time",
    summary: "when and where a contest takes place, and how far along it is",
    params: &[Param {
        name: "contest",
        kind: EntityKind::Contest,
        required: true,
    }],
    outcomes: &[
        answered("upcoming", &["contest_name", "start", "venue"]),
        answered(
            "live",
            &[
                "contest_name",
                "start",
                "venue",
                "counted",
                "updated",
                "stale",
            ],
        ),
        answered("over", &["contest_name", "start", "venue", "counted"]),
    ],
    run,
};

fn run(input: &OpInput) -> OpOutput {
    let data = input.data;
    let Some(ci) = input.contest("contest") else {
        return OpOutput::Choose {
            slot: "contest",
            options: vec![],
        };
    };
    let mut f = Facts::new();
    contest_facts(data, ci, input.now, &mut f);
    let outcome = match data.contests[ci].status {
        Status::Scheduled => "upcoming",
        Status::Live => {
            if let Some(t) = updated_value(data, ci) {
                f.put("updated", t);
            }
            if let Some(s) = staleness(data, ci, input.now, input.stale_after) {
                f.put("stale", s);
            }
            "live"
        }
        Status::Final => "over",
    };
    if data.contests[ci].status != Status::Scheduled {
        vote_facts(data, ci, None, &mut f);
    }
    OpOutput::done(outcome, f, vec![EntityRef::Contest(ci)])
}
