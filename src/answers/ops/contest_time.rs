//! `contest_time`: when a contest starts (or started), and where.

use super::support::contest_facts;
use super::*;
use crate::dataset::Status;

pub static SPEC: OpSpec = OpSpec {
    name: "contest_time",
    summary: "when and where a contest takes place",
    params: &[Param {
        name: "contest",
        kind: EntityKind::Contest,
        required: true,
    }],
    outcomes: &[
        answered("upcoming", &["contest_name", "start", "venue"]),
        answered("live", &["contest_name", "start", "venue"]),
        answered("over", &["contest_name", "start", "venue"]),
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
        Status::Live => "live",
        Status::Final => "over",
    };
    OpOutput::done(outcome, f, vec![EntityRef::Contest(ci)])
}
